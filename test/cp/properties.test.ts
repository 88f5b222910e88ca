// Property-based: for random valid coefficient sets of every model, the antiderivatives differentiate
// back to the model's Cp: d(intCp)/dT = Cp and d(intCpOverT)/dT = Cp/T.
//
// The derivative is a Richardson-extrapolated central difference with step h = 1e-3·T: truncation
// error ~(h/T)⁴ and rounding ~1e-16·T/h relative to the size of the terms, both far below the
// tolerance of 1e-7 × (Σ |terms of Cp|). The tolerance is relative to the sum of the absolute values
// of the terms, not to Cp itself, because random coefficients can cancel to a Cp near zero.

import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { buildSegment, R_J_PER_MOL_K as R } from '../../pipeline/cp/index.js';
import type { CpSegment, CpSpec } from '../../pipeline/types.js';

const loc = { file: 'properties.test.ts', line: 1 };
const REL = 1e-7;

function derivative(F: (T: number) => number, T: number, h = 1e-3 * T): number {
  const d = (k: number): number => (F(T + k) - F(T - k)) / (2 * k);
  return (4 * d(h / 2) - d(h)) / 3;
}

/**
 * |F'(T) − f(T)| within REL × scale, plus what the difference quotient cannot resolve: the rounding
 * of F, ~eps·|F|/h (generously 64 eps), which matters when F carries a large constant. `fSize` is the
 * size of F's terms when they can cancel (two poly terms with nearly equal exponents carry constants
 * of 10^10 that cancel to a tenth of that); by default |F| itself.
 */
function close(F: (T: number) => number, f: number, T: number, scale: number, h = 1e-3 * T, fSize = 0): boolean {
  const size = Math.max(fSize, Math.abs(F(T - h)), Math.abs(F(T + h)));
  const rounding = (64 * Number.EPSILON * size) / h;
  return Math.abs(derivative(F, T, h) - f) <= REL * scale + rounding;
}

/** true when both antiderivatives differentiate back to Cp at T */
function differentiatesBack(seg: CpSegment, T: number, scale: number, h = 1e-3 * T, sizes: [number, number] = [0, 0]): boolean {
  const cp = seg.cp(T);
  return close(seg.intCp, cp, T, scale, h, sizes[0]) && close(seg.intCpOverT, cp / T, T, scale / T, h, sizes[1]);
}

/** A bound on |(T^q − 1)/q| (poly's antiderivative terms; ln T as q → 0). */
function powIntSize(T: number, q: number): number {
  const lnT = Math.abs(Math.log(T));
  return Math.abs(q) * lnT < 1e-5 ? 2 * lnT : (Math.pow(T, q) + 1) / Math.abs(q);
}

// Subnormal coefficients carry too few bits for a relative check; they are flushed to zero.
const dbl = (max: number) => fc.double({ min: -max, max, noNaN: true, noDefaultInfinity: true }).map((x) => (Math.abs(x) < 1e-200 ? 0 : x));
const temperature = (min: number, max: number) => fc.double({ min, max, noNaN: true });

function spec(model: CpSpec['model'], coeffs: number[], extra: Partial<CpSpec> = {}): CpSpec {
  return { model, coeffs, unit: '', unitFactor: 1, Tmin: 300, Tmax: 3000, location: loc, ...extra };
}

describe('antiderivatives differentiate back to Cp', () => {
  test('poly: any real exponents, including −1 and 0, in J, cal or R units', () => {
    const exponent = fc.oneof(fc.constantFrom(-2, -1, 0, 1, 2, 3, 4), fc.double({ min: -3, max: 4, noNaN: true }));
    const term = fc.tuple(exponent, dbl(100));
    fc.assert(
      fc.property(fc.array(term, { minLength: 1, maxLength: 6 }), fc.constantFrom(1, 4.184, R), temperature(50, 5000), (terms, f, T) => {
        // scale each coefficient so its term is up to ~100 J/(mol K) at 1000 K
        const exponents = terms.map(([e]) => e);
        const coeffs = terms.map(([e, u]) => u * Math.pow(1000, -e));
        const seg = buildSegment(spec('poly', coeffs, { exponents, unitFactor: f }));
        const scale = coeffs.reduce((s, c, k) => s + Math.abs(c * f * Math.pow(T, exponents[k])), 0);
        const sizeOf = (shift: number) => coeffs.reduce((s, c, k) => s + Math.abs(c * f) * powIntSize(T, exponents[k]! + shift), 0);
        return differentiatesBack(seg, T, scale, 1e-3 * T, [sizeOf(1), sizeOf(0)]);
      }),
      { numRuns: 500, examples: [[[[-2.9665639812659887, -89.5119096130169], [-2.9678387164612134, 92.64865580422581]], R, 2840.1707084623067]] },
    );
  });

  test('shomate (7 and 8 coefficients)', () => {
    const coeffs = fc.tuple(dbl(100), dbl(100), dbl(100), dbl(30), dbl(30), dbl(500), dbl(500), dbl(500));
    fc.assert(
      fc.property(coeffs, fc.boolean(), temperature(100, 6000), (c, withH, T) => {
        const seg = buildSegment(spec('shomate', withH ? c : c.slice(0, 7)));
        const t = T / 1000;
        const scale = Math.abs(c[0]) + Math.abs(c[1] * t) + Math.abs(c[2] * t * t) + Math.abs(c[3] * t ** 3) + Math.abs(c[4] / (t * t));
        return differentiatesBack(seg, T, scale);
      }),
      { numRuns: 500 },
    );
  });

  test('nasa7', () => {
    const coeffs = fc.tuple(dbl(10), dbl(1e-2), dbl(1e-5), dbl(1e-8), dbl(1e-12), dbl(1e5), dbl(50));
    fc.assert(
      fc.property(coeffs, temperature(200, 6000), (a, T) => {
        const seg = buildSegment(spec('nasa7', a));
        const scale = R * a.slice(0, 5).reduce((s, ak, k) => s + Math.abs(ak * T ** k), 0);
        // embedded H and S are the antiderivatives plus constants: they differentiate back too
        const emb = seg.embedded!;
        const okEmb = close(emb.H, seg.cp(T), T, scale) && close(emb.S, seg.cp(T) / T, T, scale / T);
        return differentiatesBack(seg, T, scale) && okEmb;
      }),
      { numRuns: 500 },
    );
  });

  test('nasa9', () => {
    const coeffs = fc.tuple(dbl(1e6), dbl(1e4), dbl(20), dbl(1e-2), dbl(1e-5), dbl(1e-8), dbl(1e-12), dbl(1e5), dbl(100));
    fc.assert(
      fc.property(coeffs, temperature(200, 6000), (a, T) => {
        const seg = buildSegment(spec('nasa9', a));
        const powers = [-2, -1, 0, 1, 2, 3, 4];
        const scale = R * powers.reduce((s, p, k) => s + Math.abs(a[k] * T ** p), 0);
        const emb = seg.embedded!;
        const okEmb = close(emb.H, seg.cp(T), T, scale) && close(emb.S, seg.cp(T) / T, T, scale / T);
        return differentiatesBack(seg, T, scale) && okEmb;
      }),
      { numRuns: 500 },
    );
  });

  test('table: inside the listed points and on the linear extensions', () => {
    // The interpolant is C¹, its second derivative jumps at the nodes: the difference step stays
    // inside one piece (h ≤ 1/20 of it) or one extension, where the integrand is smooth.
    const data = fc.array(fc.tuple(fc.double({ min: 1, max: 400, noNaN: true }), fc.double({ min: 0, max: 200, noNaN: true }).map((x) => (x < 1e-200 ? 0 : x))), { minLength: 2, maxLength: 15 });
    fc.assert(
      fc.property(data, fc.nat(), fc.double({ min: 0.1, max: 0.9, noNaN: true }), fc.constantFrom(1, 4.184, R), (pairs, pick, frac, f) => {
        const temps: number[] = [];
        let t = 20;
        for (const [dt] of pairs) temps.push((t += dt));
        const values = pairs.map(([, v]) => v);
        const seg = buildSegment(spec('table', values, { temps, unitFactor: f, Tmin: temps[0], Tmax: temps[temps.length - 1] }));
        const n = temps.length;
        // pieces 0..n−2, then the two extensions [x0/2, x0] and [x_last, 1.5 x_last]
        const which = pick % (n + 1);
        const [lo, hi] = which < n - 1 ? [temps[which], temps[which + 1]] : which === n - 1 ? [temps[0] / 2, temps[0]] : [temps[n - 1], 1.5 * temps[n - 1]];
        const T = lo + frac * (hi - lo);
        const h = Math.min(1e-3 * T, (hi - lo) / 20);
        const scale = f * Math.max(...values) + Math.abs(seg.cp(T));
        return differentiatesBack(seg, T, scale, h);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('poly: the exponents −1 and 0 integrate to logarithms', () => {
  test('Cp = c/T gives ∫Cp dT = c ln(T2/T1); Cp = c gives ∫Cp/T dT = c ln(T2/T1)', () => {
    fc.assert(
      fc.property(dbl(1e4), temperature(10, 6000), temperature(10, 6000), (c, T1, T2) => {
        const inv = buildSegment(spec('poly', [c], { exponents: [-1] }));
        const cst = buildSegment(spec('poly', [c], { exponents: [0] }));
        const ln = c * Math.log(T2 / T1);
        const tol = 1e-12 * (Math.abs(c) * (Math.abs(Math.log(T2)) + Math.abs(Math.log(T1))) + 1e-300);
        return Math.abs(inv.intCp(T2) - inv.intCp(T1) - ln) <= tol && Math.abs(cst.intCpOverT(T2) - cst.intCpOverT(T1) - ln) <= tol;
      }),
      { numRuns: 300 },
    );
  });

  test('an exponent a hair from −1 (or 0) integrates smoothly into the logarithm, without cancellation', () => {
    for (const delta of [1e-6, 1e-9, 1e-13, -1e-9, 5e-324]) {
      const near = buildSegment(spec('poly', [50], { exponents: [-1 + delta] }));
      const exact = buildSegment(spec('poly', [50], { exponents: [-1] }));
      const d1 = near.intCp(2000) - near.intCp(300);
      const d0 = exact.intCp(2000) - exact.intCp(300);
      // ∫300..2000 50 T^(−1+δ) dT = 50 (2000^δ − 300^δ)/δ → 50 ln(2000/300), first-order change ~ δ·ln²
      expect(Math.abs(d1 - d0)).toBeLessThan(50 * Math.abs(delta) * 40 + 1e-9);
      const nearZero = buildSegment(spec('poly', [50], { exponents: [delta] }));
      const zero = buildSegment(spec('poly', [50], { exponents: [0] }));
      expect(Math.abs(nearZero.intCpOverT(2000) - nearZero.intCpOverT(300) - (zero.intCpOverT(2000) - zero.intCpOverT(300)))).toBeLessThan(
        50 * Math.abs(delta) * 40 + 1e-9,
      );
    }
  });
});

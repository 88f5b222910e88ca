// The tabulated-Cp model: monotone cubic Hermite (Fritsch–Carlson), exact integrals, linear ends.

import fc from 'fast-check';
import { describe, expect, test } from 'vitest';
import { buildCurve, buildSegment } from '../../pipeline/cp/index.js';
import type { CpSegment } from '../../pipeline/types.js';
import { JANAF, SPECIES } from './published-data.js';
import { integrateGL } from './quadrature.js';

const loc = { file: 'table.test.ts', line: 1 };

function table(temps: number[], values: number[], unitFactor = 1): CpSegment {
  return buildSegment({ model: 'table', coeffs: values, temps, unit: 'J/(mol K)', unitFactor, Tmin: temps[0], Tmax: temps[temps.length - 1], location: loc });
}

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

/** Dense samples of the interpolant on every interval, with the interval's two data values. */
function denseByInterval(seg: CpSegment, temps: number[], perInterval = 200): { lo: number; hi: number; v: number[] }[] {
  const out: { lo: number; hi: number; v: number[] }[] = [];
  for (let i = 0; i + 1 < temps.length; i++) {
    const v: number[] = [];
    for (let k = 0; k <= perInterval; k++) v.push(seg.cp(temps[i] + ((temps[i + 1] - temps[i]) * k) / perInterval));
    out.push({ lo: temps[i], hi: temps[i + 1], v });
  }
  return out;
}

describe('no overshoot', () => {
  test('a step in monotone data (a λ-like rise) stays monotone and inside each interval', () => {
    // invented data shaped like a sharp rise, where an unconstrained cubic spline overshoots
    const temps = [300, 400, 500, 550, 600, 700, 800];
    const values = [20, 20.5, 21, 40, 40.5, 41, 41.2];
    const seg = table(temps, values);
    for (const [i, iv] of denseByInterval(seg, temps).entries()) {
      const lo = Math.min(values[i], values[i + 1]);
      const hi = Math.max(values[i], values[i + 1]);
      for (let k = 1; k < iv.v.length; k++) expect(iv.v[k]).toBeGreaterThanOrEqual(iv.v[k - 1] - 1e-12);
      for (const v of iv.v) {
        expect(v).toBeGreaterThanOrEqual(lo - 1e-12);
        expect(v).toBeLessThanOrEqual(hi + 1e-12);
      }
    }
  });

  test('flat stretches stay flat', () => {
    const temps = [300, 400, 500, 600, 700];
    const values = [30, 30, 30, 35, 35];
    const seg = table(temps, values);
    for (const T of [310, 350, 399, 410, 480, 650, 690]) {
      const expected = T <= 500 ? 30 : T >= 600 ? 35 : undefined;
      if (expected !== undefined) expect(seg.cp(T)).toBe(expected);
    }
  });

  test('property: random data — every interval stays between its two data values, monotone data gives a monotone curve', () => {
    const data = fc
      .array(fc.tuple(fc.double({ min: 1, max: 300, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true })), { minLength: 2, maxLength: 12 })
      .map((pairs) => {
        const temps: number[] = [];
        let t = 50;
        for (const [dt] of pairs) temps.push((t += dt));
        return { temps, steps: pairs.map(([, dy]) => dy) };
      });
    fc.assert(
      fc.property(data, fc.boolean(), ({ temps, steps }, monotone) => {
        const values: number[] = [];
        let y = 30;
        for (const dy of steps) values.push((y += monotone ? Math.abs(dy) : dy));
        const seg = table(temps, values);
        for (const [i, iv] of denseByInterval(seg, temps, 50).entries()) {
          const lo = Math.min(values[i], values[i + 1]);
          const hi = Math.max(values[i], values[i + 1]);
          const slack = 1e-9 * (Math.abs(hi) + Math.abs(lo) + 1);
          for (let k = 0; k < iv.v.length; k++) {
            if (iv.v[k] < lo - slack || iv.v[k] > hi + slack) return false;
            if (monotone && k > 0 && iv.v[k] < iv.v[k - 1] - slack) return false;
          }
        }
        return true;
      }),
      { numRuns: 300 },
    );
  });
});

describe('exact integrals of the interpolant', () => {
  // Quadrature split at the nodes, where the interpolant's third derivative jumps; within a piece the
  // integrand is a cubic (∫Cp) or a cubic over T (∫Cp/T), which 20-point Gauss–Legendre on 16
  // sub-intervals integrates to rounding.
  const sets: { name: string; temps: number[]; values: number[] }[] = [
    { name: 'CO2-like, 100 K steps', temps: [300, 400, 500, 600, 800, 1000, 1200], values: [37.2, 41.3, 44.6, 47.3, 51.4, 54.3, 56.3] },
    { name: 'short pieces far from 0 K (series branch)', temps: [1000, 1000.5, 1001, 1003, 1010], values: [50, 50.2, 50.1, 50.6, 51] },
    { name: 'long pieces near 0 K (closed-form branch)', temps: [10, 50, 120, 300], values: [0.4, 8, 20, 25] },
    { name: 'two points (linear)', temps: [400, 900], values: [30, 36] },
  ];
  test.each(sets)('$name: ∫Cp dT and ∫Cp/T dT to 1e-9 relative, inside and beyond the ends', ({ temps, values }) => {
    const seg = table(temps, values);
    const a = temps[0];
    const z = temps[temps.length - 1];
    const targets = [a + (z - a) * 0.013, a + (z - a) * 0.5, z, z + 0.25 * (z - a)];
    for (const b of targets) {
      const qH = integrateGL(seg.cp, a, b, 16, temps);
      const qS = integrateGL((t) => seg.cp(t) / t, a, b, 16, temps);
      expect(relErr(seg.intCp(b) - seg.intCp(a), qH), `∫Cp to ${b}`).toBeLessThan(1e-9);
      expect(relErr(seg.intCpOverT(b) - seg.intCpOverT(a), qS), `∫Cp/T to ${b}`).toBeLessThan(1e-9);
    }
    // below the first point
    const below = a * 0.6;
    expect(relErr(seg.intCp(a) - seg.intCp(below), integrateGL(seg.cp, below, a))).toBeLessThan(1e-9);
    expect(relErr(seg.intCpOverT(a) - seg.intCpOverT(below), integrateGL((t) => seg.cp(t) / t, below, a))).toBeLessThan(1e-9);
  });
});

describe('ends and units', () => {
  test('outside the listed points Cp is the straight line with the end slope (C¹ at the ends)', () => {
    const temps = [300, 400, 500, 600];
    const values = [29, 30, 31.5, 32];
    const seg = table(temps, values);
    const h = 1e-4;
    const slopeLow = (seg.cp(300 + h) - seg.cp(300)) / h;
    const slopeHigh = (seg.cp(600) - seg.cp(600 - h)) / h;
    for (const T of [100, 200, 299]) expect(seg.cp(T)).toBeCloseTo(29 + slopeLow * (T - 300), 5);
    for (const T of [601, 800, 1500]) expect(seg.cp(T)).toBeCloseTo(32 + slopeHigh * (T - 600), 4);
  });

  test('two points interpolate linearly', () => {
    const seg = table([400, 900], [30, 36]);
    expect(seg.cp(650)).toBeCloseTo(33, 12);
    expect(seg.cp(1400)).toBeCloseTo(42, 12);
  });

  test('values declared in cal/(mol K) are scaled by the unit factor (4.184 J per thermochemical cal)', () => {
    const a = table([300, 500, 700], [7, 8, 8.5], 4.184);
    const b = table([300, 500, 700], [7 * 4.184, 8 * 4.184, 8.5 * 4.184]);
    for (const T of [350, 600, 900]) {
      expect(a.cp(T)).toBeCloseTo(b.cp(T), 12);
      expect(a.intCp(T)).toBeCloseTo(b.intCp(T), 9);
      expect(a.intCpOverT(T)).toBeCloseTo(b.intCpOverT(T), 12);
    }
  });
});

describe('reproduces a smooth Cp(T) sampled every 100 K', () => {
  // The smooth curve: the CO2(g) Shomate fit, 298–1200 K (NIST WebBook, from memory; published-data.ts).
  const co2 = SPECIES.find((s) => s.species === 'CO2(g)')!;
  const r = co2.shomate[0];
  const shomate = buildSegment({ model: 'shomate', coeffs: r.slice(2), unit: '', unitFactor: 1, Tmin: 298, Tmax: 1200, location: loc });
  const temps: number[] = [];
  for (let T = 300; T <= 1200; T += 100) temps.push(T);
  const seg = table(temps, temps.map((T) => shomate.cp(T)));

  test('Cp between the samples within 0.1 % everywhere and 0.01 J/(mol K) in the interior intervals', () => {
    // Tolerance: a shape-preserving cubic through samples h = 100 K apart errs by O(h³ Cp''') with the
    // three-point slopes used here. Measured on this curve: ≤ 0.0085 J/(mol K) in the interior intervals
    // and 0.031 J/(mol K) in the 300–400 K end interval, where the slope is one-sided and CO2's Cp bends
    // most. The bounds: 0.1 % of Cp everywhere (about what a published table is good to) and
    // 0.01 J/(mol K) in the interior.
    for (let T = 300; T <= 1200; T += 5) {
      const err = Math.abs(seg.cp(T) - shomate.cp(T));
      expect(err / shomate.cp(T), `relative at ${T} K`).toBeLessThan(0.001);
      if (T >= 400 && T <= 1100) expect(err, `interior at ${T} K`).toBeLessThan(0.01);
    }
  });

  test(`H − H298 and S at 500 and 1000 K within the Shomate tolerances of ${JANAF}`, () => {
    const curve = buildCurve([seg]);
    for (const p of co2.points.filter((q) => q.T <= 1000)) {
      expect(Math.abs(curve.dH(p.T) / 1000 - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(0.02);
      expect(Math.abs(co2.S298 + curve.dS(p.T) - p.S!), `S at ${p.T} K`).toBeLessThan(0.05);
    }
  });
});

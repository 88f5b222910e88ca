// Joining Cp ranges into one curve: which segment speaks where, exact integration through joins,
// extrapolation and the distance outside the ranges.

import { describe, expect, test } from 'vitest';
import { buildCurve, buildSegment, CpSpecError } from '../../pipeline/cp/index.js';
import type { CpCurve, CpSegment } from '../../pipeline/types.js';
import { SPECIES } from './published-data.js';
import { integrateGL } from './quadrature.js';

const loc = { file: 'piecewise.test.ts', line: 1 };

/** Cp = a + b T on [Tmin, Tmax] (a poly segment) — simple enough to integrate by hand. */
function lin(a: number, b: number, Tmin: number, Tmax: number): CpSegment {
  return buildSegment({ model: 'poly', coeffs: [a, b], exponents: [0, 1], unit: 'J/(mol K)', unitFactor: 1, Tmin, Tmax, location: loc });
}

describe('constant Cp ranges, integrated by hand', () => {
  // Cp = 30 on [200, 1000] and 40 on [1000, 3000]: a deliberate 10 J/(mol K) step at the join.
  const curve = buildCurve([lin(40, 0, 1000, 3000), lin(30, 0, 200, 1000)]); // given out of order

  test('segments come back sorted by Tmin, with the overall range', () => {
    expect(curve.segments.map((s) => s.Tmin)).toEqual([200, 1000]);
    expect(curve.Tmin).toBe(200);
    expect(curve.Tmax).toBe(3000);
  });

  test('dH and dS are zero at 298.15 K', () => {
    expect(curve.dH(298.15)).toBe(0);
    expect(curve.dS(298.15)).toBe(0);
  });

  test('at the join the upper segment speaks; dH and dS sum the pieces exactly', () => {
    expect(curve.cp(999.999)).toBe(30);
    expect(curve.cp(1000)).toBe(40);
    expect(curve.dH(1500)).toBeCloseTo(30 * (1000 - 298.15) + 40 * 500, 8);
    expect(curve.dS(1500)).toBeCloseTo(30 * Math.log(1000 / 298.15) + 40 * Math.log(1500 / 1000), 12);
    expect(curve.dH(250)).toBeCloseTo(30 * (250 - 298.15), 9);
  });

  test('dH and dS are continuous through the join although Cp steps', () => {
    const eps = 1e-6;
    expect(Math.abs(curve.dH(1000 + eps) - curve.dH(1000 - eps))).toBeLessThan(40 * 2 * eps * 1.01);
    expect(Math.abs(curve.dS(1000 + eps) - curve.dS(1000 - eps))).toBeLessThan((40 * 2 * eps) / 999);
  });

  test('outside every segment the end segment\'s own formula is used, and outside() says how far', () => {
    expect(curve.cp(5000)).toBe(40);
    expect(curve.dH(5000) - curve.dH(3000)).toBeCloseTo(40 * 2000, 8);
    expect(curve.cp(100)).toBe(30);
    expect(curve.dH(100)).toBeCloseTo(30 * (100 - 298.15), 9);
    expect(curve.outside(5000)).toBe(2000);
    expect(curve.outside(100)).toBe(100);
    expect(curve.outside(200)).toBe(0);
    expect(curve.outside(1000)).toBe(0);
    expect(curve.outside(3000)).toBe(0);
    expect(curve.outside(650)).toBe(0);
  });
});

describe('gaps and overlaps', () => {
  test('in a gap the nearer segment speaks (the upper one at the middle); outside() is the distance to it', () => {
    // [300, 600] Cp = 20 + 0.01 T; gap 600–800; [800, 1500] Cp = 50
    const lower = lin(20, 0.01, 300, 600);
    const upper = lin(50, 0, 800, 1500);
    const curve = buildCurve([lower, upper]);
    expect(curve.cp(650)).toBe(lower.cp(650));
    expect(curve.cp(699)).toBe(lower.cp(699));
    expect(curve.cp(700)).toBe(50);
    expect(curve.cp(750)).toBe(50);
    expect(curve.outside(650)).toBe(50);
    expect(curve.outside(760)).toBe(40);
    expect(curve.outside(700)).toBe(100);
    // dH across the gap: lower's formula up to 700 K, upper's from 700 K
    const byHand = (20 * (700 - 298.15) + (0.01 / 2) * (700 ** 2 - 298.15 ** 2)) + 50 * (1000 - 700);
    expect(curve.dH(1000)).toBeCloseTo(byHand, 8);
  });

  test('where segments overlap, the one with the higher Tmin speaks', () => {
    const wide = lin(30, 0, 300, 2000);
    const narrow = lin(35, 0, 800, 1200);
    const curve = buildCurve([wide, narrow]);
    expect(curve.cp(700)).toBe(30);
    expect(curve.cp(800)).toBe(35);
    expect(curve.cp(1000)).toBe(35);
    expect(curve.cp(1500)).toBe(30);
    expect(curve.dH(1500)).toBeCloseTo(30 * (800 - 298.15) + 35 * 400 + 30 * 300, 8);
  });

  test('298.15 K in a gap, below every segment, or exactly on a join still gives dH = dS = 0 there', () => {
    const curves = [
      buildCurve([lin(25, 0, 100, 250), lin(30, 0, 350, 900)]),
      buildCurve([lin(30, 0.01, 400, 900)]),
      buildCurve([lin(28, 0, 100, 298.15), lin(31, 0, 298.15, 1000)]),
    ];
    for (const c of curves) {
      expect(c.dH(298.15)).toBe(0);
      expect(c.dS(298.15)).toBe(0);
      // and ∫cp from 298.15 is what dH reports, on both sides
      for (const T of [150, 600, 1200]) {
        expect(c.dH(T)).toBeCloseTo(integrateGL(c.cp, 298.15, T, 16, [250, 298.15, 300, 350, 400, 900, 1000]), 6);
      }
    }
    expect(buildCurve([lin(28, 0, 100, 298.15), lin(31, 0, 298.15, 1000)]).cp(298.15)).toBe(31);
  });
});

describe('published NASA-7 pair (H2O(g), GRI-Mech 3.0, from memory)', () => {
  const rows = SPECIES.find((s) => s.species === 'H2O(g)')!.nasa7;
  const segs = rows.map((r) => buildSegment({ model: 'nasa7', coeffs: r.slice(2), unit: '', unitFactor: 1, Tmin: r[0], Tmax: r[1], location: loc }));
  const curve = buildCurve(segs);

  test('extrapolation above 3500 K is the high range\'s own formula', () => {
    const high = segs[1];
    expect(curve.cp(5000)).toBe(high.cp(5000));
    expect(curve.dH(5000) - curve.dH(3500)).toBeCloseTo(high.intCp(5000) - high.intCp(3500), 6);
    expect(curve.dS(5000) - curve.dS(3500)).toBeCloseTo(high.intCpOverT(5000) - high.intCpOverT(3500), 10);
    expect(curve.outside(5000)).toBe(1500);
    expect(curve.outside(150)).toBe(50);
  });

  test('dH(T) is continuous at the 1000 K join and equals the embedded enthalpy difference', () => {
    const eps = 1e-7;
    expect(Math.abs(curve.dH(1000 + eps) - curve.dH(1000 - eps))).toBeLessThan(1e-3);
    // the two embedded constants a6 agree at 1000 K to the fit's join accuracy (a few J/mol)
    const Hlow = segs[0].embedded!.H(1000);
    const Hhigh = segs[1].embedded!.H(1000);
    expect(Math.abs(curve.dH(1000) - (Hhigh - segs[0].embedded!.H(298.15)))).toBeLessThan(Math.abs(Hhigh - Hlow) + 1e-6);
  });
});

test('performance: dH and dS at 50 temperatures for 1000 species take milliseconds', () => {
  const rowsOf = SPECIES.flatMap((s) => [s.nasa7]);
  const curves: CpCurve[] = [];
  for (let i = 0; i < 1000; i++) {
    const rows = rowsOf[i % rowsOf.length];
    const scale = 1 + (i % 97) * 1e-4; // vary the species a little
    const segs = rows.map((r) => buildSegment({ model: 'nasa7', coeffs: r.slice(2).map((c) => c * scale), unit: '', unitFactor: 1, Tmin: r[0], Tmax: r[1], location: loc }));
    if (i % 10 === 0) {
      const temps = [300, 400, 600, 800, 1000, 1500, 2000];
      segs.push(buildSegment({ model: 'table', coeffs: temps.map((T) => 30 + T / 100), temps, unit: 'J/(mol K)', unitFactor: 1, Tmin: 3500, Tmax: 3600, location: loc }));
    }
    curves.push(buildCurve(segs));
  }
  const temps = Array.from({ length: 50 }, (_, k) => 300 + k * 50);
  let sink = 0;
  // 100 000 evaluations; their speed is measured by `npm run bench`, never asserted in a unit test
  for (const c of curves) for (const T of temps) sink += c.dH(T) + c.dS(T);
  expect(Number.isFinite(sink)).toBe(true);
});

test('an empty segment list is a CpSpecError', () => {
  expect(() => buildCurve([])).toThrow(CpSpecError);
  try {
    buildCurve([]);
  } catch (e) {
    expect((e as CpSpecError).code).toBe('cp-no-segments');
  }
});

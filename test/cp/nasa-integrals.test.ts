// NASA-7 and NASA-9: the analytic H and S (with their embedded constants) must be exactly the
// integrals of the analytic Cp. Checked against quadrature written in the test (quadrature.ts):
// 20-point Gauss–Legendre on 16 sub-intervals, cross-checked by adaptive Simpson. The coefficient sets
// are the published ones in published-data.ts (GRI-Mech 3.0, Burcat, McBride et al. 2002; from memory);
// this identity holds for any coefficients, so their exact digits do not matter here.

import { describe, expect, test } from 'vitest';
import { buildCurve, buildSegment } from '../../pipeline/cp/index.js';
import type { CpModelName } from '../../pipeline/types.js';
import { SPECIES } from './published-data.js';
import { adaptiveSimpson, integrateGL } from './quadrature.js';

const loc = { file: 'published-data.ts', line: 1 };
const REL = 1e-9; // the brief's bound; double-precision quadrature of a smooth integrand reaches ~1e-13

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);
}

const cases: { name: string; model: CpModelName; rows: number[][] }[] = [];
for (const sp of SPECIES) {
  cases.push({ name: `${sp.species} nasa7`, model: 'nasa7', rows: sp.nasa7 });
  if (sp.nasa9) cases.push({ name: `${sp.species} nasa9`, model: 'nasa9', rows: sp.nasa9 });
}

describe.each(cases)('$name', ({ model, rows }) => {
  const segs = rows.map((r) => buildSegment({ model, coeffs: r.slice(2), unit: '', unitFactor: 1, Tmin: r[0], Tmax: r[1], location: loc }));

  test('embedded H(T2) − H(T1) = ∫Cp dT and S(T2) − S(T1) = ∫Cp/T dT on each range', () => {
    for (const seg of segs) {
      const a = seg.Tmin;
      for (const b of [a + 1, a + 0.37 * (seg.Tmax - a), seg.Tmax]) {
        const qH = integrateGL(seg.cp, a, b);
        const qS = integrateGL((t) => seg.cp(t) / t, a, b);
        expect(relErr(seg.embedded!.H(b) - seg.embedded!.H(a), qH)).toBeLessThan(REL);
        expect(relErr(seg.embedded!.S(b) - seg.embedded!.S(a), qS)).toBeLessThan(REL);
        expect(relErr(seg.intCp(b) - seg.intCp(a), qH)).toBeLessThan(REL);
        expect(relErr(seg.intCpOverT(b) - seg.intCpOverT(a), qS)).toBeLessThan(REL);
        // an independent quadrature agrees too
        expect(relErr(adaptiveSimpson(seg.cp, a, b, 1e-10), qH)).toBeLessThan(REL);
      }
    }
  });

  test('the curve integrates from 298.15 K through the 1000 K join exactly', () => {
    const curve = buildCurve(segs);
    for (const T of [250, 700, 1000, 1500, 2500]) {
      const qH = integrateGL(curve.cp, 298.15, T, 16, [1000]);
      const qS = integrateGL((t) => curve.cp(t) / t, 298.15, T, 16, [1000]);
      expect(relErr(curve.dH(T), qH)).toBeLessThan(REL);
      expect(relErr(curve.dS(T), qS)).toBeLessThan(REL);
    }
  });
});

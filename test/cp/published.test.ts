// Every Cp model against published thermochemical tables (sources beside the data in published-data.ts).

import { describe, expect, test } from 'vitest';
import { buildCurve, buildSegment, R_J_PER_MOL_K } from '../../pipeline/cp/index.js';
import type { CpModelName, CpSegment } from '../../pipeline/types.js';
import { JANAF, SPECIES } from './published-data.js';

const loc = { file: 'published-data.ts', line: 1 };

function segmentsOf(model: CpModelName, rows: number[][]): CpSegment[] {
  return rows.map((r) => buildSegment({ model, coeffs: r.slice(2), unit: '', unitFactor: 1, Tmin: r[0], Tmax: r[1], location: loc }));
}

/** The segment a user would pick at T: the one containing it, the upper one at a join. */
function segmentAt(segs: CpSegment[], T: number): CpSegment {
  return [...segs].reverse().find((s) => s.Tmin <= T && T <= s.Tmax) ?? segs[segs.length - 1];
}

/** Shomate coefficients (J/(mol K), t = T/1000) rewritten as a power series in T. */
function shomateAsPoly(r: number[]): { coeffs: number[]; exponents: number[] } {
  const [A, B, C, D, E] = r.slice(2);
  return { coeffs: [A, B / 1e3, C / 1e6, D / 1e9, E * 1e6], exponents: [0, 1, 2, 3, -2] };
}

// Tolerances and why:
//  - Shomate: the WebBook fits were made to Chase 1998 itself and reproduce it to about 0.1 % in Cp;
//    allow 0.2 % in Cp, 0.02 kJ/mol in H − H298 and 0.05 J/(mol K) in S.
//  - NASA-7 and NASA-9: two-range fits joined at 1000 K, made to their own primary compilations
//    (Gurvich et al. 1989 for several species), which differ from JANAF by a few tenths of a percent in
//    Cp near 1500 K; allow 0.6 % in Cp, 0.1 kJ/mol in H − H298 and 0.1 J/(mol K) in S.
//  - Absolute S(T) below = S°298 (CODATA Key Values, as the pipeline would take it from the row) +
//    the model's dS; CODATA and JANAF S°298 differ by ≤ 0.01 J/(mol K) for these species.
//  - Embedded constants: ΔfH°298 within 0.05 kJ/mol (CODATA and JANAF ΔfH° differ by up to 0.012 kJ/mol
//    here and the fits carry rounded constants) and S°298 within 0.05 J/(mol K).
const TOL = {
  shomate: { cpRel: 0.002, dH_kJ: 0.02, S: 0.05 },
  nasa: { cpRel: 0.006, dH_kJ: 0.1, S: 0.1 },
  embedded: { H_kJ: 0.05, S: 0.05 },
};

for (const sp of SPECIES) {
  describe(`${sp.species} against ${JANAF}, ${sp.table}`, () => {
    test('shomate: Cp, H − H298 and S at 500, 1000, 1500 K through the piecewise curve', () => {
      const segs = segmentsOf('shomate', sp.shomate);
      const curve = buildCurve(segs);
      for (const p of sp.points) {
        expect(Math.abs(curve.cp(p.T) / p.cp - 1), `Cp at ${p.T} K`).toBeLessThan(TOL.shomate.cpRel);
        expect(Math.abs(curve.dH(p.T) / 1000 - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(TOL.shomate.dH_kJ);
        if (p.S !== undefined) expect(Math.abs(sp.S298 + curve.dS(p.T) - p.S), `S at ${p.T} K`).toBeLessThan(TOL.shomate.S);
      }
    });

    test('shomate: embedded H and S (F, G, H) reproduce ΔfH°298, S°298 and the table', () => {
      const segs = segmentsOf('shomate', sp.shomate);
      const first = segs[0];
      expect(Math.abs(first.embedded!.H(298.15) / 1000 - sp.dHf298_kJ)).toBeLessThan(TOL.embedded.H_kJ);
      expect(Math.abs(first.embedded!.S(298.15) - sp.S298)).toBeLessThan(TOL.embedded.S);
      for (const p of sp.points) {
        const seg = segmentAt(segs, p.T);
        // H − H298 from the embedded constants: (…+F)·1000 − H·1000, the published Shomate H° − H°298.15
        const H_coef = sp.shomate[segs.indexOf(seg)][9];
        expect(Math.abs((seg.embedded!.H(p.T) / 1000 - H_coef) - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(TOL.shomate.dH_kJ);
        if (p.S !== undefined) expect(Math.abs(seg.embedded!.S(p.T) - p.S), `S at ${p.T} K`).toBeLessThan(TOL.shomate.S);
      }
    });

    test('poly: the Shomate fit rewritten as a + bT + cT² + dT³ + eT⁻² in cal/(mol K) gives the same table', () => {
      const segs = sp.shomate.map((r) => {
        const { coeffs, exponents } = shomateAsPoly(r);
        // declared in thermochemical calories, 4.184 J exactly: the unit factor brings it back to J
        return buildSegment({ model: 'poly', coeffs: coeffs.map((c) => c / 4.184), exponents, unit: 'cal/(mol K)', unitFactor: 4.184, Tmin: r[0], Tmax: r[1], location: loc });
      });
      const curve = buildCurve(segs);
      for (const p of sp.points) {
        expect(Math.abs(curve.cp(p.T) / p.cp - 1), `Cp at ${p.T} K`).toBeLessThan(TOL.shomate.cpRel);
        expect(Math.abs(curve.dH(p.T) / 1000 - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(TOL.shomate.dH_kJ);
        if (p.S !== undefined) expect(Math.abs(sp.S298 + curve.dS(p.T) - p.S), `S at ${p.T} K`).toBeLessThan(TOL.shomate.S);
      }
    });

    test(`nasa7 (${sp.nasa7Source}): Cp, H − H298 and S`, () => {
      const segs = segmentsOf('nasa7', sp.nasa7);
      const curve = buildCurve(segs);
      if (sp.nasa7Against) {
        // checked against the compilation the fit was made to (source in published-data.ts)
        for (const p of sp.nasa7Against.points) {
          expect(Math.abs(curve.cp(p.T) / p.cp - 1), `Cp at ${p.T} K vs ${sp.nasa7Against.source}`).toBeLessThan(TOL.nasa.cpRel);
        }
        return;
      }
      for (const p of sp.points) {
        expect(Math.abs(curve.cp(p.T) / p.cp - 1), `Cp at ${p.T} K`).toBeLessThan(TOL.nasa.cpRel);
        expect(Math.abs(curve.dH(p.T) / 1000 - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(TOL.nasa.dH_kJ);
        if (p.S !== undefined) expect(Math.abs(sp.S298 + curve.dS(p.T) - p.S), `S at ${p.T} K`).toBeLessThan(TOL.nasa.S);
      }
      // a6, a7: H(298.15) on the ΔfH scale and S°298
      const low = segs[0];
      expect(Math.abs(low.embedded!.H(298.15) / 1000 - sp.dHf298_kJ)).toBeLessThan(TOL.embedded.H_kJ);
      expect(Math.abs(low.embedded!.S(298.15) - sp.S298)).toBeLessThan(TOL.embedded.S);
      for (const p of sp.points) {
        const seg = segmentAt(segs, p.T);
        expect(Math.abs((seg.embedded!.H(p.T) - low.embedded!.H(298.15)) / 1000 - p.dH)).toBeLessThan(TOL.nasa.dH_kJ);
        if (p.S !== undefined) expect(Math.abs(seg.embedded!.S(p.T) - p.S)).toBeLessThan(TOL.nasa.S);
      }
    });

    test('poly: the low NASA-7 range declared as Cp/R with exponents 0 1 2 3 4 equals the nasa7 model', () => {
      const r = sp.nasa7[0];
      const n7 = segmentsOf('nasa7', [r])[0];
      const poly = buildSegment({ model: 'poly', coeffs: r.slice(2, 7), exponents: [0, 1, 2, 3, 4], unit: 'R', unitFactor: R_J_PER_MOL_K, Tmin: r[0], Tmax: r[1], location: loc });
      for (const T of [300, 500, 800]) {
        expect(poly.cp(T)).toBeCloseTo(n7.cp(T), 10);
        // antiderivatives differ by a constant only
        expect(poly.intCp(T) - poly.intCp(298.15)).toBeCloseTo(n7.intCp(T) - n7.intCp(298.15), 6);
        expect(poly.intCpOverT(T) - poly.intCpOverT(298.15)).toBeCloseTo(n7.intCpOverT(T) - n7.intCpOverT(298.15), 9);
      }
    });

    if (sp.nasa9) {
      const rows = sp.nasa9;
      test('nasa9 (McBride, Zehe and Gordon 2002, from memory): Cp, H − H298, S and b1, b2', () => {
        const segs = segmentsOf('nasa9', rows);
        const curve = buildCurve(segs);
        for (const p of sp.points) {
          expect(Math.abs(curve.cp(p.T) / p.cp - 1), `Cp at ${p.T} K`).toBeLessThan(TOL.nasa.cpRel);
          expect(Math.abs(curve.dH(p.T) / 1000 - p.dH), `H − H298 at ${p.T} K`).toBeLessThan(TOL.nasa.dH_kJ);
          if (p.S !== undefined) expect(Math.abs(sp.S298 + curve.dS(p.T) - p.S), `S at ${p.T} K`).toBeLessThan(TOL.nasa.S);
        }
        const low = segs[0];
        expect(Math.abs(low.embedded!.H(298.15) / 1000 - sp.dHf298_kJ)).toBeLessThan(TOL.embedded.H_kJ);
        expect(Math.abs(low.embedded!.S(298.15) - sp.S298)).toBeLessThan(TOL.embedded.S);
        for (const p of sp.points) {
          const seg = segmentAt(segs, p.T);
          if (p.S !== undefined) expect(Math.abs(seg.embedded!.S(p.T) - p.S)).toBeLessThan(TOL.nasa.S);
        }
      });
    }
  });
}

test('shomate with seven coefficients (A…G) has no embedded enthalpy but the same Cp and integrals', () => {
  const r = SPECIES.find((s) => s.species === 'CO2(g)')!.shomate[0];
  const eight = segmentsOf('shomate', [r])[0];
  const seven = buildSegment({ model: 'shomate', coeffs: r.slice(2, 9), unit: '', unitFactor: 1, Tmin: r[0], Tmax: r[1], location: loc });
  expect(eight.embedded).toBeDefined();
  expect(seven.embedded).toBeUndefined();
  expect(seven.cp(700)).toBe(eight.cp(700));
  expect(seven.intCp(700)).toBe(eight.intCp(700));
  expect(seven.intCpOverT(700)).toBe(eight.intCpOverT(700));
});

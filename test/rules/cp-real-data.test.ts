// Real correlations in all five forms, run through the whole check: no Cp rule may raise an error.
// The only findings allowed are the ones the data really deserve, listed here with their reason.
import { describe, expect, it } from 'vitest';
import { buildSegment } from '../../pipeline/cp/index.js';
import type { CpSpec } from '../../pipeline/types.js';
import { allValid, cpFindings, POLY, renamed, runRows, TABLE, type CpRow } from './cp-fixtures.js';

const loc = { file: 'cp-real-data.test.ts', line: 1 };

function segOf(r: CpRow) {
  const spec: CpSpec = {
    model: r.model,
    coeffs: r.coeffs,
    exponents: r.exponents,
    temps: r.temps,
    unit: r.unit ?? '',
    unitFactor: r.unit === 'cal/(mol K)' ? 4.184 : r.unit === 'R' ? 8.314462618 : 1,
    Tmin: r.Tmin ?? r.temps![0],
    Tmax: r.Tmax ?? r.temps![r.temps!.length - 1],
    location: loc,
  };
  return buildSegment(spec);
}

describe('the recalled poly and table data reproduce JANAF Cp', () => {
  // NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), from memory; Cp at 298.15 K of H2O also in
  // reference-values.json. Tolerance 1.5 %: the cubic fits of Reid, Prausnitz and Poling are stated
  // good to about 1 % in their range; Maier–Kelley fits (1960) differ from JANAF 1998 by up to ~2 %.
  const janaf: [CpRow[], number, number, number][] = [
    [POLY.N2, 298.15, 29.124, 0.015],
    [POLY.N2, 1000, 32.697, 0.015],
    [POLY.CO2, 298.15, 37.135, 0.015],
    [POLY.CO2, 1000, 54.308, 0.015],
    [POLY.CH4, 298.15, 35.695, 0.015],
    [POLY.CH4, 1000, 71.795, 0.015],
    [POLY.H2O, 298.15, 33.59, 0.015],
    [POLY.H2O, 1000, 41.268, 0.015],
    [POLY.COoverR, 298.15, 29.142, 0.005], // JANAF C-093, from memory; NASA-7 fits are good to ~0.1 %
    [POLY.COoverR, 1000, 33.183, 0.005],
    [POLY.Al2O3, 298.15, 79.033, 0.02], // JANAF Al2O3 (cr), from memory
    [POLY.Al2O3, 1000, 124.771, 0.02],
    [POLY.CaCO3, 298.15, 83.47, 0.025], // CODATA/NBS calcite Cp°, from memory
    [POLY.C, 298.15, 8.517, 0.025], // JANAF C (ref, graphite), from memory
    [TABLE.H2O, 1500, 47.073, 1e-9], // a node of the table
  ];
  for (const [rows, T, cp, tol] of janaf) {
    it(`${rows[0].species} (${rows[0].model}) at ${T} K`, () => {
      expect(Math.abs(segOf(rows[0]).cp(T) / cp - 1)).toBeLessThan(tol);
    });
  }
});

describe('real species in all five forms give no error from any Cp rule', () => {
  const sets = allValid();
  const rows: CpRow[] = [];
  const lineOf = new Map<string, number>();
  for (const s of sets) {
    const name = s.label.replace(/\s+/g, '-');
    lineOf.set(s.label, rows.length + 2);
    rows.push(...renamed(s.rows, name));
  }

  it('one table with every form: zero Cp errors, and only the findings the data deserve', async () => {
    // use window inside every fitted range except the Shomate H2O fit, which starts at 500 K
    const report = await runRows(rows, { Tmin: 300, Tmax: 1000 });
    expect(report.summary.rejected).toBe(0);
    const cp = cpFindings(report);
    expect(cp.filter((f) => f.severity === 'error')).toEqual([]);
    // NIST's Shomate fit of H2O(g) starts at 500 K: 298.15 K and the window's 300 K are extrapolations
    const h2o = lineOf.get('shomate H2O')!;
    const rest = cp.filter((f) => f.location.line !== h2o);
    expect(rest.map((f) => `${f.rule} ${f.species} ${f.message}`)).toEqual([]);
    expect(cp.map((f) => f.rule).sort()).toEqual(['cp-coverage', 'cp-coverage']);
    expect(cp.every((f) => f.severity === 'warning')).toBe(true);
  });

  it('with a use window to 3500 K, only the extrapolations that turn non-physical are errors: the cubic gas fits fitted to 1000 K', async () => {
    const report = await runRows(rows, { Tmin: 500, Tmax: 3500 });
    const errors = cpFindings(report).filter((f) => f.severity === 'error');
    // the Reid–Prausnitz–Poling cubics and the Cp/R quartic, fitted to 1000 K, go negative, below 5R/2
    // or above the classical limit by 3500 K; every other set reaches 3500 K in range or extrapolates
    // physically (the tables and Maier–Kelley solids linearly)
    expect(errors.map((f) => f.species).sort()).toEqual(['poly-CH4', 'poly-CO2', 'poly-COoverR', 'poly-H2O', 'poly-N2']);
    expect(errors.every((f) => f.rule === 'cp-coverage' && f.messageId === 'windowUnphysical')).toBe(true);
  });
});

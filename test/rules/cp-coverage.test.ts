// cp-coverage: 298.15 K inside a range, the use window inside the ranges; extrapolations reported.
import { describe, expect, it } from 'vitest';
import { NASA7, NASA9, on, POLY, renamed, runRows, SHOMATE, TABLE, type CpRow } from './cp-fixtures.js';

const edit = (rows: CpRow[], i: number, change: Partial<CpRow>): CpRow[] => rows.map((r, k) => (k === i ? { ...r, ...change } : r));

describe('298.15 K', () => {
  it('not covered: a warning on the nearest range, with how far and the extrapolated Cp', async () => {
    const late = edit(renamed(NASA7.CO, 'CO-late'), 0, { Tmin: 400 }); // GRI-Mech CO low range cut to 400–1000 K
    const report = await runRows([...renamed(NASA9.N2, 'N2-ok'), ...late]);
    const f = on(report, 'cp-coverage', 4);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'warning', messageId: 'ref', location: { field: 'cp_Tmin' } });
    expect(f[0].params.outsideK).toBeCloseTo(101.85, 6);
    // CO Cp(298.15 K) = 29.142 J/(mol K), NIST-JANAF 1998 C-093 (from memory); the fit extrapolates well
    expect(Math.abs((f[0].params.cp as number) / 29.142 - 1)).toBeLessThan(0.005);
    expect(report.findings.filter((x) => x.rule === 'cp-coverage' && x.location.line !== 4)).toEqual([]);
  });

  it('an extrapolation of 1.85 K (ranges from 300 K, as in older NASA-7 files) is info only', async () => {
    const rows = edit(renamed(NASA7.CO, 'CO-300'), 0, { Tmin: 300 });
    const report = await runRows(rows);
    expect(on(report, 'cp-coverage', 2)[0].severity).toBe('info');
  });

  it('non-physical at 298.15 K: an error', async () => {
    // JANAF N2 table from 500 K only, its first slope pushed so the linear extension goes negative
    const t = TABLE.N2[0];
    const rows: CpRow[] = [{ ...t, species: 'N2-table', formula: 'N2', temps: [500, 600, 1000], coeffs: [29.58, 45, 46] }];
    const report = await runRows(rows);
    const f = on(report, 'cp-coverage', 2)[0];
    expect(f).toMatchObject({ severity: 'error', messageId: 'refUnphysical' });
  });
});

describe('the use window', () => {
  it('covered: no finding', async () => {
    const report = await runRows(renamed(NASA9.CO2, 'CO2-ok'), { Tmin: 300, Tmax: 6000 });
    expect(report.findings.filter((f) => f.rule === 'cp-coverage')).toEqual([]);
  });

  it('mild extrapolation beyond Tmax: a warning with how far and Cp there', async () => {
    const report = await runRows([...renamed(NASA9.CO2, 'CO2-ok'), ...renamed(SHOMATE.CO2, 'CO2-shomate').map((r, i) => (i === 1 ? { ...r, Tmax: 2500 } : r))], {
      Tmin: 300,
      Tmax: 3000,
    });
    const f = on(report, 'cp-coverage', 5);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'warning', messageId: 'window', location: { field: 'cp_Tmax' }, params: { T: 3000, outsideK: 500 } });
    // CO2 Cp(3000 K) = 62.229 J/(mol K), NIST-JANAF 1998 C-095 (from memory); Shomate extrapolates to within 1 %
    expect(Math.abs((f[0].params.cp as number) / 62.229 - 1)).toBeLessThan(0.01);
    expect(report.findings.filter((x) => x.rule === 'cp-coverage' && x.location.line !== 5)).toEqual([]);
  });

  it('listed temperatures: the farthest one per side is reported', async () => {
    const report = await runRows(renamed(NASA7.CH4, 'CH4-gri'), { temperatures: [150, 500, 3600, 4000] });
    const f = report.findings.filter((x) => x.rule === 'cp-coverage');
    expect(f.map((x) => [x.location.line, x.params.T])).toEqual([
      [2, 150],
      [3, 4000],
    ]);
  });

  it('extrapolation into non-physical Cp: an error naming the worst value', async () => {
    // the Reid–Prausnitz–Poling CH4 cubic (fitted to 1000 K here) used to 3500 K: its −dT³ term wins
    const report = await runRows([...renamed(NASA7.CH4, 'CH4-gri'), ...renamed(POLY.CH4, 'CH4-cubic')], { Tmin: 300, Tmax: 3500 });
    const f = on(report, 'cp-coverage', 4)[0];
    expect(f).toMatchObject({ severity: 'error', messageId: 'windowUnphysical', params: { why: 'zero or negative' } });
    expect(f.params.cp).toBeLessThan(0);
    expect(report.findings.filter((x) => x.rule === 'cp-coverage' && x.location.line !== 4)).toEqual([]);
  });
});

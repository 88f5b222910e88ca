// cp-joins: gaps, overlaps and continuity of Cp, H and S where consecutive ranges meet.
import { describe, expect, it } from 'vitest';
import { allValid, NASA7, on, POLY, renamed, runRows, SHOMATE, type CpRow } from './cp-fixtures.js';

const edit = (rows: CpRow[], i: number, change: Partial<CpRow> | ((r: CpRow) => CpRow)): CpRow[] =>
  rows.map((r, k) => (k === i ? (typeof change === 'function' ? change(r) : { ...r, ...change }) : r));

describe('cp-joins on tables', () => {
  it('no finding on the real multi-range correlations (Shomate joins step < 0.3 % in Cp, < 15 J/mol in H)', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-joins')).toEqual([]);
  });

  it('a discontinuous join is reported on both rows, with the H and S steps from the constants', async () => {
    // GRI-Mech CO high range with a1 + 0.3: Cp steps by 0.3R (7.5 %), H by 0.3R·1000 K ≈ 2.5 kJ/mol
    const bad = edit(renamed(NASA7.CO, 'CO-step'), 1, (r) => ({ ...r, coeffs: r.coeffs.map((c, k) => (k === 0 ? c + 0.3 : c)) }));
    const report = await runRows([...renamed(NASA7.H2, 'H2-ok'), ...bad]);
    for (const line of [4, 5]) {
      const f = on(report, 'cp-joins', line);
      expect(f, `line ${line}`).toHaveLength(1);
      expect(f[0]).toMatchObject({ severity: 'error', messageId: 'constantsStep' });
      expect(f[0].params.cpRel).toBeCloseTo(7.5, 0);
      expect(f[0].params.dH).toBeCloseTo((0.3 * 8.314462618 * 1000) / 1000, 1); // R·ΔT·Δa1 at 1000 K
    }
    expect(report.findings.filter((f) => f.rule === 'cp-joins' && ![4, 5].includes(f.location.line))).toEqual([]);
  });

  it('a poly join with a Cp step is reported as a Cp step (no constants to compare)', async () => {
    const lower = { ...POLY.N2[0], species: 'N2-poly', formula: 'N2' };
    const upper = { ...POLY.N2[0], species: 'N2-poly', formula: 'N2', coeffs: [40, 0, 0, 0], Tmin: 1000, Tmax: 2000 }; // injected: 40 vs 32.7 at 1000 K
    const report = await runRows([lower, upper]);
    const f = on(report, 'cp-joins', 3)[0];
    expect(f).toMatchObject({ severity: 'error', messageId: 'cpStep' });
    expect(on(report, 'cp-joins', 2)).toHaveLength(1);
  });

  it('finds a gap between ranges on both rows', async () => {
    const gap = edit(renamed(SHOMATE.H2, 'H2-gap'), 1, { Tmin: 1100 }); // 1000–1100 K uncovered
    const report = await runRows(gap);
    const upper = on(report, 'cp-joins', 3);
    expect(upper).toHaveLength(1);
    expect(upper[0]).toMatchObject({ severity: 'error', messageId: 'gap', params: { from: 1000, to: 1100 }, location: { field: 'cp_Tmin' } });
    expect(on(report, 'cp-joins', 2)[0]).toMatchObject({ messageId: 'gap', location: { field: 'cp_Tmax' } });
    expect(on(report, 'cp-joins', 4)).toEqual([]);
  });

  it('finds an overlap on both rows', async () => {
    const overlap = edit(renamed(SHOMATE.N2, 'N2-overlap'), 1, { Tmin: 400 }); // 400–500 K covered twice
    const report = await runRows(overlap);
    const f = on(report, 'cp-joins', 3).find((x) => x.messageId === 'overlap');
    expect(f).toMatchObject({ severity: 'warning', params: { from: 400, to: 500 } });
    expect(on(report, 'cp-joins', 2).some((x) => x.messageId === 'overlap')).toBe(true);
  });

  it('a step between the polymorph ranges of a crystal is only a warning', async () => {
    const lower: CpRow = { ...SHOMATE.Al2O3[0], species: 'Al2O3-two', formula: 'Al2O3', Tmax: 1200 };
    const upper: CpRow = { ...SHOMATE.Al2O3[0], species: 'Al2O3-two', formula: 'Al2O3', Tmin: 1200, coeffs: SHOMATE.Al2O3[0].coeffs.map((c, k) => (k === 0 ? c + 10 : c)) };
    const report = await runRows([lower, upper]);
    const f = on(report, 'cp-joins', 3)[0];
    expect(f.severity).toBe('warning');
  });
});

// cp-embedded-constants: Shomate F/G/H, NASA-7 a6/a7 and NASA-9 b1/b2 against the row's dHf and S.
import { describe, expect, it } from 'vitest';
import { R_J_PER_MOL_K as R } from '../../pipeline/cp/constants.js';
import { allValid, NASA7, NASA9, on, renamed, runRows, SHOMATE, type CpRow } from './cp-fixtures.js';

const mapCoeff = (rows: CpRow[], which: number | 'all', k: number, f: (c: number) => number): CpRow[] =>
  rows.map((r, i) => (which === 'all' || i === which ? { ...r, coeffs: r.coeffs.map((c, j) => (j === k ? f(c) : c)) } : r));

// CO: ΔfG° −137.163 kJ/mol (NIST-JANAF 1998, via reference-values.json), so the row's own
// Gibbs–Helmholtz balance can be judged
const withG = (rows: CpRow[], dGf: number): CpRow[] => rows.map((r) => ({ ...r, dGf }));

describe('cp-embedded-constants', () => {
  it('no finding on the real correlations (GRI CH4 a6 sits 0.27 kJ/mol from JANAF ΔfH°: below the 0.5 kJ/mol warning)', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-embedded-constants')).toEqual([]);
  });

  it('Shomate H in kcal/mol: diagnosed on every range, corrected to ΔfH°', async () => {
    const kcal = mapCoeff(renamed(SHOMATE.CO2, 'CO2-kcal'), 'all', 7, (h) => h / 4.184);
    const report = await runRows([...renamed(SHOMATE.CO, 'CO-ok'), ...kcal]);
    for (const line of [4, 5]) {
      const f = on(report, 'cp-embedded-constants', line);
      expect(f, `line ${line}`).toHaveLength(1);
      expect(f[0]).toMatchObject({ severity: 'error', messageId: 'shomateHDiagnosed', location: { field: 'cp_coeffs' } });
      expect(f[0].diagnosis).toMatchObject({ cause: 'cal-read-as-J', field: 'cp_coeffs', unit: 'kJ/mol' });
      expect(f[0].diagnosis!.corrected).toBeCloseTo(-393.5224, 3); // the WebBook H coefficient, from memory
    }
    expect(report.findings.filter((f) => f.rule === 'cp-embedded-constants' && ![4, 5].includes(f.location.line))).toEqual([]);
  });

  it('Shomate F off by 10 kJ/mol: H° − H°298 ≠ 0 at 298.15 K and the implied ΔfH° is off', async () => {
    const bad = mapCoeff(renamed(SHOMATE.CH4, 'CH4-F'), 0, 5, (F) => F + 10);
    const report = await runRows(bad);
    const f = on(report, 'cp-embedded-constants', 2);
    expect(f.map((x) => x.messageId).sort()).toEqual(['enthalpy', 'shomateOffset']);
    expect(f.find((x) => x.messageId === 'enthalpy')!.params.diff).toBeCloseTo(10, 1);
    expect(f.every((x) => x.severity === 'error')).toBe(true);
  });

  it('NASA-9 b2 off by 10/R: S° off by 10 J/(mol K), on the line of the range holding 298.15 K', async () => {
    const bad = mapCoeff(renamed(NASA9.H2O, 'H2O-b2'), 0, 8, (b2) => b2 + 10 / R);
    const report = await runRows([...renamed(NASA9.N2, 'N2-ok'), ...bad]);
    const f = on(report, 'cp-embedded-constants', 4);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'error', messageId: 'entropy' });
    expect(f[0].params.diff).toBeCloseTo(10, 1); // the published set itself sits 0.007 J/(mol K) below CODATA
    expect(report.findings.filter((x) => x.rule === 'cp-embedded-constants' && x.location.line !== 4)).toEqual([]);
  });

  it('the row is blamed when its own ΔfG° = ΔfH° − TΔfS° fails and the slip-corrected row matches', async () => {
    // CO with dHf entered in kcal/mol under a kJ/mol header; the GRI-Mech constants are right
    const rows = withG(renamed(NASA7.CO, 'CO-row'), -137.163).map((r, i) => (i === 0 ? { ...r, dHf: -110.53 / 4.184 } : r));
    const report = await runRows(rows);
    const f = on(report, 'cp-embedded-constants', 2)[0];
    expect(f.messageId).toBe('enthalpyDiagnosed');
    expect(f.diagnosis).toMatchObject({ cause: 'cal-read-as-J', field: 'dHf', unit: 'kJ/mol' });
    expect(f.diagnosis!.corrected).toBeCloseTo(-110.53, 1); // CODATA ΔfH°(CO, g), via reference-values.json
    expect(f.location.field).toBe('dHf');
  });

  it('a Shomate H coefficient is not blamed when the row is: ΔfH° with its sign flipped', async () => {
    // CO from the NIST WebBook Shomate fit (H = −110.5271 kJ/mol, from memory); the row's ΔfH° typed as +110.53
    const rows = withG(renamed(SHOMATE.CO, 'CO-sign'), -137.163).map((r) => ({ ...r, dHf: 110.53 }));
    const report = await runRows(rows);
    const mine = report.findings.filter((f) => f.rule === 'cp-embedded-constants');
    expect(mine.filter((f) => f.location.field === 'cp_coeffs')).toEqual([]);
    expect(mine.map((f) => [f.messageId, f.diagnosis?.cause, f.diagnosis?.field])).toEqual([['enthalpyDiagnosed', 'sign', 'dHf']]);
    const gh = report.findings.find((f) => f.rule === 'gibbs-helmholtz')!;
    expect(gh.diagnosis).toMatchObject({ cause: 'sign', field: 'dHf' });
  });

  it('the constants are blamed when the row closes: a6 computed from ΔfH° in kcal/mol', async () => {
    // a6 shifted so that the implied ΔfH° is −110.53/4.184 kJ/mol instead of −110.53
    const shift = (-110.53 / 4.184 + 110.53) * 1000 / R;
    const rows = mapCoeff(withG(renamed(NASA7.CO, 'CO-a6'), -137.163), 0, 5, (a6) => a6 + shift);
    const report = await runRows(rows);
    const f = on(report, 'cp-embedded-constants', 2)[0];
    expect(f.diagnosis).toMatchObject({ cause: 'cal-read-as-J', field: 'cp_coeffs' });
    expect(f.location.field).toBe('cp_coeffs');
  });

  it('when 298.15 K is outside every range the severity is capped at warning', async () => {
    // NIST's H2O Shomate starts at 500 K: F raised by 10 kJ/mol
    const bad = mapCoeff(renamed(SHOMATE.H2O, 'H2O-F'), 0, 5, (F) => F + 10);
    const report = await runRows(bad);
    const f = on(report, 'cp-embedded-constants', 2);
    expect(f.length).toBeGreaterThan(0);
    expect(f.every((x) => x.severity === 'warning')).toBe(true);
  });
});

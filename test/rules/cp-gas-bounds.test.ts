// cp-gas-bounds: 5R/2 ≤ Cp ≤ classical limit + allowance for ideal gases; unit slips diagnosed.
import { describe, expect, it } from 'vitest';
import { R_J_PER_MOL_K as R } from '../../pipeline/cp/constants.js';
import { gasLimits } from '../../pipeline/rules/cp-gas-bounds.js';
import { allValid, NASA7, NASA9, on, POLY, renamed, runRows, SHOMATE, type CpRow } from './cp-fixtures.js';

describe('the bounds', () => {
  it('5R/2 for an atom; (3N − 3/2)R with max(15 %, 2R) above it for molecules', () => {
    expect(gasLimits(1).classical).toBeCloseTo(2.5 * R, 12);
    expect(gasLimits(1).upper).toBeCloseTo(4.5 * R, 12);
    expect(gasLimits(2).classical).toBeCloseTo(4.5 * R, 12);
    expect(gasLimits(2).upper).toBeCloseTo(6.5 * R, 12); // 2R > 15 % of 4.5R
    expect(gasLimits(20).upper).toBeCloseTo(58.5 * R * 1.15, 10); // 15 % > 2R
  });

  it('real high-temperature Cp sits below the upper bound: JANAF CO2, H2O at 3000 K, O2 at 6000 K', () => {
    // NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), from memory
    expect(62.229).toBeLessThan(gasLimits(3).upper); // CO2(g), 3000 K
    expect(55.748).toBeLessThan(gasLimits(3).upper); // H2O(g), 3000 K
    expect(42.7).toBeLessThan(gasLimits(2).upper); // O2(g), 6000 K, electronic terms included
    expect(25.68).toBeLessThan(gasLimits(1).upper); // Fe(g), 298.15 K, low-lying electronic levels
    // and the monatomic gas sits on 5R/2 = 20.786 J/(mol K) (JANAF Ar, from memory) inside the tolerance
    expect(20.786).toBeGreaterThan(gasLimits(1).lower);
  });
});

describe('cp-gas-bounds on tables', () => {
  it('no finding on the real gas correlations', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-gas-bounds')).toEqual([]);
  });

  it('diagnoses Cp/R read as J/(mol K) on a poly, with the corrected Cp(298.15 K)', async () => {
    const slip = renamed(POLY.COoverR, 'CO-slip').map((r) => ({ ...r, unit: 'J/(mol K)' })); // Cp/R coefficients declared J/(mol K)
    const report = await runRows([...renamed(POLY.N2, 'N2-ok'), ...slip]);
    const f = on(report, 'cp-gas-bounds', 3);
    expect(f).toHaveLength(1);
    expect(f[0].severity).toBe('error');
    expect(f[0].messageId).toBe('belowDiagnosed');
    expect(f[0].diagnosis).toMatchObject({ cause: 'cp-over-R-as-J', field: 'cp_unit', unit: 'J/(mol K)', residualAfter: 0 });
    // Cp(298.15 K) of CO: 29.142 J/(mol K), NIST-JANAF 1998 C-093 (from memory); NASA-7 fit within 0.2 %
    expect(f[0].diagnosis!.corrected).toBeCloseTo(29.142, 1);
    expect(f[0].location.field).toBe('cp_unit');
    expect(report.findings.filter((x) => x.rule === 'cp-gas-bounds' && x.location.line !== 3)).toEqual([]);
  });

  it('diagnoses cal/(mol K) values declared as J/(mol K) when Cp/R does not fit', async () => {
    // the RPP cubic for N2 converted to cal/(mol K), declared J: Cp ≈ 7 "J/(mol K)"; ×R = 58 would exceed
    // 6.5R for a diatomic, ×4.184 fits
    const cal = renamed(POLY.N2, 'N2-cal').map((r) => ({ ...r, coeffs: r.coeffs.map((c) => c / 4.184) }));
    const report = await runRows(cal);
    const f = on(report, 'cp-gas-bounds', 2)[0];
    expect(f.diagnosis).toMatchObject({ cause: 'cal-read-as-J', field: 'cp_unit' });
    expect(f.diagnosis!.corrected).toBeCloseTo(29.18, 1); // the cubic at 298.15 K, in J/(mol K)
  });

  it('flags a gas far above the classical limit, on the line of the range', async () => {
    // GRI-Mech CO2 with a1 of the high range raised by 5 (Cp + 5R): 104 J/(mol K) at 3500 K > 79 for N = 3
    const hot = renamed(NASA7.CO2, 'CO2-hot').map((r, i) => (i === 1 ? { ...r, coeffs: r.coeffs.map((c, k) => (k === 0 ? c + 5 : c)) } : r));
    const report = await runRows([...renamed(NASA9.CO2, 'CO2-ok'), ...hot]);
    const f = on(report, 'cp-gas-bounds', 5);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'error', messageId: 'above' });
    expect(f[0].params.atoms).toBe(3);
    expect(report.findings.filter((x) => x.rule === 'cp-gas-bounds' && x.location.line !== 5)).toEqual([]);
  });

  it('a NASA-7 set that is ten times too small (no unit to blame) is flagged without a diagnosis', async () => {
    const small = renamed(SHOMATE.CO, 'CO-small').map((r) => ({ ...r, coeffs: r.coeffs.map((c, k) => (k < 5 ? c / 10 : c)) }));
    const report = await runRows(small);
    const f = on(report, 'cp-gas-bounds', 2)[0];
    expect(f.messageId).toBe('below');
    expect(f.diagnosis).toBeUndefined();
  });

  it('diagnoses a range whose ends are °C values read as K, on cp_Tmin', async () => {
    // NIST WebBook Shomate fit for CO(g), 298–1300 K (from memory), its range typed as 24.85–1026.85
    // (the same ends in °C) under a K header: near 25 K the E/t² term drives Cp far above 6.5R
    const degC = renamed(SHOMATE.CO.slice(0, 1), 'CO-degC').map((r) => ({ ...r, Tmin: r.Tmin! - 273.15, Tmax: r.Tmax! - 273.15 }));
    const report = await runRows([...renamed(SHOMATE.CO, 'CO-ok'), ...degC]);
    const f = report.findings.filter((x) => x.rule === 'cp-gas-bounds');
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'error', messageId: 'aboveDegC', location: { line: 4, field: 'cp_Tmin' } });
    expect(f[0].diagnosis).toMatchObject({ cause: 'degC-read-as-K', field: 'cp_Tmin', unit: 'K', residualAfter: 0 });
    expect(f[0].diagnosis!.corrected).toBeCloseTo(SHOMATE.CO[0].Tmin!, 6);
  });

  it('a range starting above 100 K is not taken for °C read as K', async () => {
    // the NIST WebBook Shomate fit for CO2(g), 298–1200 K (from memory), declared from 101 K: its E/t²
    // term pulls Cp below 5R/2 near 100 K, yet 101 °C is no usual start of a fitted range
    const early = renamed(SHOMATE.CO2.slice(0, 1), 'CO2-early').map((r) => ({ ...r, Tmin: 101 }));
    const report = await runRows(early);
    const f = report.findings.filter((x) => x.rule === 'cp-gas-bounds');
    expect(f.map((x) => [x.messageId, x.diagnosis])).toEqual([['below', undefined]]);
  });

  it('does not judge condensed phases', async () => {
    const rows: CpRow[] = renamed(POLY.COoverR, 'CO-liquid').map((r) => ({ ...r, phase: 'l', unit: 'J/(mol K)' }));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-gas-bounds')).toEqual([]);
  });
});

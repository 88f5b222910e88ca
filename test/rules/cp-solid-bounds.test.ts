// cp-solid-bounds: crystalline Cp near or below 3R per atom; flagged above 1.25·3NR + 2 J/(mol K).
import { describe, expect, it } from 'vitest';
import { R_J_PER_MOL_K as R } from '../../pipeline/cp/constants.js';
import { solidLimit } from '../../pipeline/rules/cp-solid-bounds.js';
import { allValid, on, POLY, renamed, runRows, SHOMATE, TABLE } from './cp-fixtures.js';

describe('the bound', () => {
  it('is 1.25 × 3NR + 2 J/(mol K)', () => {
    expect(solidLimit(1).dulongPetit).toBeCloseTo(3 * R, 12);
    expect(solidLimit(5).limit).toBeCloseTo(1.25 * 15 * R + 2, 12);
  });
  it('sits above real high-temperature solids: JANAF Al2O3 at 2300 K, graphite at 3000 K', () => {
    // NIST-JANAF 1998, from memory: Al2O3 (cr) ~139 J/(mol K) at 2300 K; graphite ~25.6 J/(mol K) at 3000 K
    expect(139).toBeLessThan(solidLimit(5).limit);
    expect(25.6).toBeLessThan(solidLimit(1).limit);
  });
});

describe('cp-solid-bounds on tables', () => {
  it('no finding on the real solid correlations (Shomate, Maier–Kelley, JANAF table)', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-solid-bounds')).toEqual([]);
  });

  it('flags a solid far above Dulong–Petit as a warning, on its line', async () => {
    // Al2O3 Shomate with B four times too large: ~400 J/(mol K) at 2327 K against 3NR = 125
    const hot = renamed(SHOMATE.Al2O3, 'Al2O3-hot').map((r) => ({ ...r, coeffs: r.coeffs.map((c, k) => (k === 1 ? 4 * c : c)) }));
    const report = await runRows([...renamed(TABLE.Al2O3, 'Al2O3-ok'), ...hot]);
    const f = on(report, 'cp-solid-bounds', 3);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'warning', messageId: 'above', location: { field: 'cp_coeffs' } });
    expect(f[0].params.ratio).toBeGreaterThan(3);
    expect(report.findings.filter((x) => x.rule === 'cp-solid-bounds' && x.location.line !== 3)).toEqual([]);
  });

  it('diagnoses J/(mol K) coefficients declared as cal/(mol K)', async () => {
    // Kelley's calcite fit in J/(mol K) (104.52 + 21.92e-3 T − 25.94e5/T², from memory) declared cal
    const slip = renamed(POLY.CaCO3, 'CaCO3-slip').map((r) => ({ ...r, coeffs: [104.52, 21.92e-3, -25.94e5] }));
    const report = await runRows(slip);
    const f = on(report, 'cp-solid-bounds', 2)[0];
    expect(f.messageId).toBe('aboveDiagnosed');
    expect(f.diagnosis).toMatchObject({ cause: 'J-read-as-cal', field: 'cp_unit' });
    // calcite Cp°(298.15 K) = 83.47 J/(mol K) (NBS 1982, from memory); Maier–Kelley within 2.5 %
    expect(Math.abs(f.diagnosis!.corrected / 83.47 - 1)).toBeLessThan(0.025);
  });

  it('does not judge gases or liquids', async () => {
    const gas = renamed(SHOMATE.CH4, 'CH4-ok');
    const report = await runRows(gas);
    expect(report.findings.filter((f) => f.rule === 'cp-solid-bounds')).toEqual([]);
  });
});

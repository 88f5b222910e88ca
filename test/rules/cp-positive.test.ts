// cp-positive: Cp > 0 inside every declared range, minimum found by bracketing search between samples.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sampleGrid, scanFunction } from '../../pipeline/cp/curve-cache.js';
import { allValid, on, POLY, renamed, runRows, SHOMATE, TABLE, type CpRow } from './cp-fixtures.js';

describe('the minimum is found between sample points', () => {
  it('a dip 0.6 K wide that no sample point sees is found by golden-section search', () => {
    // Cp = 1e-3 (T − 617.3)² − 1e-4: negative only for |T − 617.3| < 0.316 K
    const f = (T: number) => 1e-3 * (T - 617.3) ** 2 - 1e-4;
    const scan = scanFunction(f, 200, 1000);
    expect(sampleGrid(200, 1000).every((T) => f(T) > 0)).toBe(true); // the grid alone would pass it
    expect(scan.min.cp).toBeLessThan(0);
    expect(scan.min.T).toBeCloseTo(617.3, 3);
  });

  it('property: for any parabola with its vertex inside the range, the scan minimum is the vertex', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 500, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.double({ min: 1e-6, max: 1, noNaN: true }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        (a, frac, k, c) => {
          const b = a + 2000;
          const v = a + frac * (b - a);
          const scan = scanFunction((T) => k * (T - v) ** 2 + c, a, b);
          // golden-section converges to 1e-9 relative in T; the value error is k·ΔT², far below 1e-6
          return Math.abs(scan.min.cp - c) <= 1e-6 * Math.max(1, Math.abs(c)) && Math.abs(scan.min.T - v) < 1e-3;
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('cp-positive on tables', () => {
  it('no finding on any real correlation', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-positive')).toEqual([]);
  });

  it('finds negative Cp inside the range, on its line, for poly, table and shomate', async () => {
    const dip: CpRow = {
      // injected: the parabola above as a poly in J/(mol K) on 200–1000 K
      species: 'N2-dip', formula: 'N2', phase: 'g', dHf: 0, S: 191.609, model: 'poly', unit: 'J/(mol K)',
      exponents: [0, 1, 2], coeffs: [1e-3 * 617.3 ** 2 - 1e-4, -2e-3 * 617.3, 1e-3], Tmin: 200, Tmax: 1000, source: 'injected defect',
    };
    const table = renamed(TABLE.N2, 'N2-table').map((r) => ({ ...r, coeffs: r.coeffs.map((c, i) => (i === 4 ? -5 : c)) })); // JANAF N2 with Cp(700 K) = −5
    const shomate = renamed(SHOMATE.CH4, 'CH4-B').map((r, i) => (i === 0 ? { ...r, coeffs: r.coeffs.map((c, k) => (k === 1 ? -c : c)) } : r)); // B sign slip
    const rows = [...renamed(POLY.N2, 'N2-ok'), dip, ...table, ...shomate];
    const report = await runRows(rows);
    const hits = report.findings.filter((f) => f.rule === 'cp-positive');
    expect(hits.map((f) => f.location.line).sort()).toEqual([3, 4, 5]);
    const d = on(report, 'cp-positive', 3)[0];
    expect(d.severity).toBe('error');
    expect(d.params.T).toBeCloseTo(617.3, 0);
    expect(d.location.field).toBe('cp_coeffs');
    expect(on(report, 'cp-positive', 4)[0].params.cp).toBeLessThan(0);
  });

  it('aqueous species are exempt: a negative partial molar Cp° is real', async () => {
    // Cl−(aq): Cp° = −136.4 J/(mol K) at 298.15 K (NBS tables, Wagman et al. 1982, from memory)
    const cl: CpRow = { species: 'Cl-', phase: 'aq', dHf: -167.159, S: 56.5, model: 'poly', unit: 'J/(mol K)', exponents: [0], coeffs: [-136.4], Tmin: 273.15, Tmax: 373.15, source: 'NBS 1982 (from memory)' };
    const report = await runRows([cl]);
    expect(report.findings.filter((f) => f.rule === 'cp-positive')).toEqual([]);
  });
});

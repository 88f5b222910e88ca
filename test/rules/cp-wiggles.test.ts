// cp-wiggles: at most one significant interior extremum of Cp per range.
import { describe, expect, it } from 'vitest';
import { significantExtrema } from '../../pipeline/rules/cp-wiggles.js';
import { allValid, NASA7, on, renamed, runRows } from './cp-fixtures.js';

const pts = (f: (T: number) => number, a = 200, b = 1000, n = 400) =>
  Array.from({ length: n + 1 }, (_, i) => {
    const T = a + ((b - a) * i) / n;
    return { T, cp: f(T) };
  });

describe('significant extrema', () => {
  it('counts the two turning points of a cubic, none of a monotone curve, one of a parabola', () => {
    expect(significantExtrema(pts((T) => (T - 300) * (T - 600) * (T - 900) * 1e-6), 0.05)).toHaveLength(2);
    expect(significantExtrema(pts((T) => 30 + 0.01 * T), 0.05)).toHaveLength(0);
    expect(significantExtrema(pts((T) => 30 + 1e-4 * (T - 500) ** 2), 0.05)).toHaveLength(1);
  });
  it('ignores a ripple below the threshold and extrema that only touch an end', () => {
    // 0.01 J/(mol K) ripple on a rising line
    expect(significantExtrema(pts((T) => 30 + 0.01 * T + 0.01 * Math.sin(T / 20)), 0.05)).toHaveLength(0);
    // a minimum 0.02 J/(mol K) deep right at the low end, then a rise
    expect(significantExtrema(pts((T) => 30 + 2e-5 * (T - 210) ** 2), 0.05)).toHaveLength(0);
  });
});

describe('cp-wiggles on tables', () => {
  it('no finding on the real correlations (the GRI-Mech H2 low range ripples by 0.06 J/(mol K): below threshold)', async () => {
    const rows = allValid().flatMap((s) => renamed(s.rows, s.label.replace(/\s+/g, '-')));
    const report = await runRows(rows);
    expect(report.findings.filter((f) => f.rule === 'cp-wiggles')).toEqual([]);
  });

  it('flags an oscillating polynomial on its line', async () => {
    // GRI-Mech H2O low range plus k(T − 300)(T − 600)(T − 900) in Cp/R, k = 2.9e-8: a ±0.3 R ripple
    const k = 2.9e-8;
    const add = [-1.62e8 * k, 990000 * k, -1800 * k, k, 0];
    const wavy = renamed(NASA7.H2O, 'H2O-wavy').map((r, i) => (i === 0 ? { ...r, coeffs: r.coeffs.map((c, j) => c + (add[j] ?? 0)) } : r));
    const report = await runRows([...renamed(NASA7.CO, 'CO-ok'), ...wavy]);
    const f = on(report, 'cp-wiggles', 4);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ severity: 'warning', messageId: 'oscillation', params: { count: 2 } });
    expect(report.findings.filter((x) => x.rule === 'cp-wiggles' && x.location.line !== 4)).toEqual([]);
  });
});

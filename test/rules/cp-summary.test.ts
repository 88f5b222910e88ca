// cpSummary: what the report shows of a species' Cp correlation.
import { describe, expect, it } from 'vitest';
import { cpSummary, SUMMARY_SAMPLES } from '../../pipeline/cp/summary.js';
import { parseFormula } from '../../pipeline/chemistry/formula.js';
import type { CpSpec, Species } from '../../pipeline/types.js';
import { NASA7, SHOMATE } from './cp-fixtures.js';

function species(rows: typeof NASA7.CO, name: string): Species {
  const cp: CpSpec[] = rows.map((r, i) => ({ model: r.model, coeffs: r.coeffs, unit: '', unitFactor: 1, Tmin: r.Tmin!, Tmax: r.Tmax!, location: { file: 'cp.csv', line: 2 + i } }));
  return {
    key: `${name}|g`, name, formulaText: name, formula: parseFormula(name), phase: 'g', u: {}, P_ref: 1, values: [], cp,
    location: { file: 'cp.csv', line: 2 }, columns: {}, units: {},
  };
}

describe('cpSummary', () => {
  it('models, ranges with file and line, Cp at 298.15 K and at the window with kelvin outside', () => {
    const s = cpSummary(species(NASA7.CO, 'CO'), { Tmin: 300, Tmax: 4000, temperatures: [1000] }, false)!;
    expect(s.models).toEqual(['nasa7']);
    expect(s.ranges).toEqual([
      { model: 'nasa7', Tmin: 200, Tmax: 1000, file: 'cp.csv', line: 2 },
      { model: 'nasa7', Tmin: 1000, Tmax: 3500, file: 'cp.csv', line: 3 },
    ]);
    // CO Cp(298.15 K) = 29.142 J/(mol K), NIST-JANAF 1998 C-093 (from memory); NASA-7 fit within 0.2 %
    expect(Math.abs(s.cp298! / 29.142 - 1)).toBeLessThan(0.002);
    expect(s.atWindow.map((p) => [p.T, p.outsideK])).toEqual([
      [300, 0],
      [1000, 0],
      [4000, 500],
    ]);
    // CO Cp(1000 K) = 33.183 J/(mol K), NIST-JANAF 1998 C-093 (from memory)
    expect(Math.abs(s.atWindow[1].cp / 33.183 - 1)).toBeLessThan(0.002);
    expect(s.samples).toBeUndefined();
  });

  it('samples span 298.15 K, the fitted ranges and the use window, with every range end among them', () => {
    const s = cpSummary(species(SHOMATE.H2O, 'H2O'), { Tmin: 400, Tmax: 1500 }, true)!;
    const Ts = s.samples!.map((p) => p.T);
    expect(Ts.length).toBeGreaterThanOrEqual(SUMMARY_SAMPLES);
    // NIST's fit starts at 500 K; H and S are integrated from 298.15 K through the extrapolated stretch,
    // so the chart starts there even though the use window starts at 400 K
    expect(s.samples![0]).toMatchObject({ T: 298.15, outsideK: 201.85 });
    expect(Ts[Ts.length - 1]).toBe(6000);
    for (const r of s.ranges) expect(Ts).toContain(r.Tmin);
    expect(Ts).toContain(1700);
    expect(s.samples!.find((p) => p.T === 500)!.outsideK).toBe(0);
    expect(Ts.every((T, i) => i === 0 || T > Ts[i - 1]!)).toBe(true);
    expect(s.samples!.filter((p) => p.outsideK > 0).every((p) => p.T < 500)).toBe(true);
  });

  it('undefined without a Cp correlation', () => {
    expect(cpSummary({ ...species(NASA7.CO, 'CO'), cp: [] }, {}, true)).toBeUndefined();
  });
});

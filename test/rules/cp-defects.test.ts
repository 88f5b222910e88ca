// One table, as a reviewer would receive it: real species in all five forms and, beside them, one
// injected Cp defect per species. Each defect must be found on its line by the right rule, and the
// real species must draw no error.
import { describe, expect, it } from 'vitest';
import { R_J_PER_MOL_K as R } from '../../pipeline/cp/constants.js';
import { parseFormula } from '../../pipeline/chemistry/formula.js';
import { loadReference } from '../../pipeline/chemistry/reference.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { SPECIES_RULES } from '../../pipeline/rules/index.js';
import type { CpSpec, Species } from '../../pipeline/types.js';
import { allValid, cpFindings, NASA7, NASA9, POLY, renamed, runRows, SHOMATE, TABLE, type CpRow } from './cp-fixtures.js';

const coeff = (rows: CpRow[], i: number, k: number, f: (c: number) => number): CpRow[] =>
  rows.map((r, j) => (j === i ? { ...r, coeffs: r.coeffs.map((c, m) => (m === k ? f(c) : c)) } : r));
const range = (rows: CpRow[], i: number, change: Partial<CpRow>): CpRow[] => rows.map((r, j) => (j === i ? { ...r, ...change } : r));

interface Defect {
  name: string;
  rows: CpRow[];
  /** index, within rows, of the row the defect is on */
  at: number;
  rule: string;
}

const k = 2.9e-8; // cubic ripple for the oscillation, in Cp/R
const ripple = [-1.62e8 * k, 990000 * k, -1800 * k, k, 0];

const DEFECTS: Defect[] = [
  { name: 'negative-cp', rule: 'cp-positive', at: 0, rows: coeff(renamed(SHOMATE.CH4, 'CH4-neg'), 0, 1, (b) => -b) },
  { name: 'cp-over-R-as-J', rule: 'cp-gas-bounds', at: 0, rows: renamed(POLY.COoverR, 'CO-unit').map((r) => ({ ...r, unit: 'J/(mol K)' })) },
  { name: 'above-classical', rule: 'cp-gas-bounds', at: 1, rows: coeff(renamed(NASA7.CO2, 'CO2-hot'), 1, 0, (a) => a + 5) },
  { name: 'above-dulong-petit', rule: 'cp-solid-bounds', at: 0, rows: coeff(renamed(SHOMATE.Al2O3, 'Al2O3-hot'), 0, 1, (b) => 4 * b) },
  { name: 'oscillation', rule: 'cp-wiggles', at: 0, rows: renamed(NASA7.H2O, 'H2O-wavy').map((r, i) => (i === 0 ? { ...r, coeffs: r.coeffs.map((c, j) => c + (ripple[j] ?? 0)) } : r)) },
  { name: 'discontinuous-join', rule: 'cp-joins', at: 1, rows: coeff(renamed(NASA7.CO, 'CO-step'), 1, 0, (a) => a + 0.3) },
  { name: 'gap', rule: 'cp-joins', at: 1, rows: range(renamed(SHOMATE.H2, 'H2-gap'), 1, { Tmin: 1100 }) },
  { name: 'overlap', rule: 'cp-joins', at: 1, rows: range(renamed(SHOMATE.N2, 'N2-overlap'), 1, { Tmin: 400 }) },
  { name: '298-not-covered', rule: 'cp-coverage', at: 0, rows: range(renamed(NASA9.CO2, 'CO2-late'), 0, { Tmin: 450 }) },
  { name: 'window-extrapolation', rule: 'cp-coverage', at: 0, rows: range(renamed(TABLE.N2, 'N2-short'), 0, { temps: TABLE.N2[0].temps!.slice(0, 6), coeffs: TABLE.N2[0].coeffs.slice(0, 6) }) },
  { name: 'shomate-H-in-kcal', rule: 'cp-embedded-constants', at: 0, rows: coeff(renamed(SHOMATE.CO, 'CO-kcal'), 0, 7, (h) => h / 4.184) },
  { name: 'nasa9-entropy', rule: 'cp-embedded-constants', at: 0, rows: coeff(renamed(NASA9.N2, 'N2-b2'), 0, 8, (b2) => b2 + 10 / R) },
];

describe('every injected defect on its line, with the right rule; no error on the real species', () => {
  it('one mixed table', async () => {
    const rows: CpRow[] = [];
    const valid = allValid();
    const validLines = new Set<number>();
    for (const s of valid) {
      for (const r of renamed(s.rows, s.label.replace(/\s+/g, '-'))) {
        validLines.add(rows.length + 2);
        rows.push(r);
      }
    }
    const lineOf = new Map<string, number>();
    for (const d of DEFECTS) {
      lineOf.set(d.name, rows.length + 2 + d.at);
      rows.push(...d.rows);
    }
    // the use window: 300–1500 K; the N2 table cut at 800 K is the one the window extrapolates
    const report = await runRows(rows, { Tmin: 300, Tmax: 1500 });
    const cp = cpFindings(report);
    for (const d of DEFECTS) {
      const line = lineOf.get(d.name)!;
      expect(cp.filter((f) => f.rule === d.rule && f.location.line === line), `${d.name} on line ${line}`).not.toHaveLength(0);
    }
    // the valid species: no error; warnings only for the Shomate H2O fit, which starts at 500 K, and
    // for the correlations the 1500 K window end extrapolates (the cubics and quartic fitted to 1000 K,
    // the Al2O3 JANAF table to 1000 K)
    const onValid = cp.filter((f) => validLines.has(f.location.line));
    expect(onValid.filter((f) => f.severity === 'error').map((f) => `${f.species}: ${f.message}`)).toEqual([]);
    expect(new Set(onValid.map((f) => f.rule))).toEqual(new Set(['cp-coverage']));
  });
});

describe('volume', () => {
  // 2·10^4 two-range species through every species rule (the Cp rules share one curve and one scan per
  // range). Speed is timed by npm run bench, not asserted here; this checks the functional result at volume.
  it('2·10^4 two-range species through every species rule: nothing from the Cp rules', () => {
    const reference = loadReference();
    const options = normalizeOptions({ tables: ['x.csv'] });
    const ctx = { options: { ...options, useWindow: { Tmin: 300, Tmax: 1500 } }, reference };
    const formula = parseFormula('CO');
    const list: Species[] = [];
    for (let i = 0; i < 20_000; i++) {
      const cp: CpSpec[] = NASA7.CO.map((r, j) => ({ model: 'nasa7', coeffs: r.coeffs.map((c) => c * (1 + 1e-9 * i)), unit: 'R', unitFactor: 1, Tmin: r.Tmin!, Tmax: r.Tmax!, location: { file: 'big.csv', line: 2 * i + 2 + j } }));
      list.push({ key: `CO${i}|g`, name: `CO${i}`, formulaText: 'CO', formula, phase: 'g', dHf: -110530, S: 197.66, u: {}, P_ref: 1, values: [], cp, location: cp[0].location, columns: {}, units: {} });
    }
    let n = 0;
    for (const sp of list) for (const rule of SPECIES_RULES) n += rule.check!(sp, ctx).length;
    expect(n).toBe(20_000); // one incomplete-species info each (no ΔfG°), nothing from the Cp rules
  }, 120_000);
});

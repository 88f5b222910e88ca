// The columnar species store must fold any sequence of accepted rows exactly as the plain object store
// it replaced did (records-oracle.ts): the same findings row by row (duplicates, conflicting values and
// formulas, refused Cp ranges), and the same species at the end. Rows are drawn from small pools so
// that repeats, twins, conflicts, interleaved species, other phases of a name and species with more
// than 16 rows (the per-species index) all occur. The numbers are arbitrary test inputs, not data.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../pipeline/chemistry/formula.js';
import { SpeciesStore } from '../../pipeline/records.js';
import type { CpSpec, Phase, RowValues, SpeciesRow } from '../../pipeline/types.js';
import { ObjectStore } from './records-oracle.js';

const NAMES = ['CO2', 'H2O', 'n-butane', 'Δ-phase', '\ud83d\ude00 x', '\ud800'];
const FORMULAS = ['CO2', 'H2O', 'C4H10', 'CO'];
const PHASES: Phase[] = ['g', 'l', 'cr'];
const SOURCES = ['', 'A', 'B'];
const FILES = ['a.csv', 'b.csv'];
const VALUES = [undefined, -393522, -241826, 0, 213.795];
const UNCERTAINTIES = [undefined, undefined, 100, 500];
const PRESSURES = [1, 1, 1.01325];
const COLUMNS = [
  { table: { species: 1, formula: 2, dHf: 3, dGf: 4, S: 5, cp_Tmin: 6 }, units: { dHf: 'kJ/mol', dGf: 'kJ/mol', S: 'J/(mol K)' } },
  { table: { species: 2, formula: 1, dHf: 5, dGf: 4, S: 3, cp_Tmin: 9 }, units: { dHf: 'kcal/mol', dGf: 'kcal/mol', S: 'cal/(mol K)' } },
];

const cpSpec = (k: number, file: string, line: number): CpSpec => {
  const location = { file, line };
  const model = (['shomate', 'poly', 'table', 'nasa7'] as const)[k % 4]!;
  const Tmin = 298.15 + 50 * (k % 20);
  const Tmax = Tmin + [200, 700][k % 2]!;
  if (model === 'poly') return { model, coeffs: [30, 0.01 * (k % 2)], exponents: [0, 1], unit: 'cal/(mol K)', unitFactor: 4.184, Tmin, Tmax, location };
  if (model === 'table') return { model, coeffs: [30, 31, 32], temps: [Tmin, (Tmin + Tmax) / 2, Tmax], unit: 'J/(mol K)', unitFactor: 1, Tmin, Tmax, location };
  if (model === 'nasa7') return { model, coeffs: [3.5, 0, 0, 0, 0, -1000, k % 2], unit: 'R', unitFactor: 1, Tmin, Tmax, location };
  return { model, coeffs: [25, 6, 4, -2.7, 0.13, -118, 227, -110 - (k % 2)], unit: 'J/(mol K), t = T/1000', unitFactor: 1, Tmin, Tmax, location };
};

const rowArb = fc.record({
  name: fc.nat(NAMES.length - 1),
  formula: fc.nat(FORMULAS.length - 1),
  formulaIsName: fc.boolean(),
  phase: fc.nat(PHASES.length - 1),
  state: fc.option(fc.constantFrom('graphite', 'rhombic'), { freq: 8 }),
  dHf: fc.nat(VALUES.length - 1),
  dGf: fc.nat(VALUES.length - 1),
  S: fc.nat(VALUES.length - 1),
  u: fc.nat(UNCERTAINTIES.length - 1),
  P: fc.nat(PRESSURES.length - 1),
  source: fc.nat(SOURCES.length - 1),
  file: fc.nat(FILES.length - 1),
  table: fc.nat(COLUMNS.length - 1),
  cp: fc.option(fc.nat(39), { freq: 2 }), // 40 distinct ranges: more than 16 on one species
});

type Draw = typeof rowArb extends fc.Arbitrary<infer T> ? T : never;

function makeRows(draws: Draw[]): SpeciesRow[] {
  return draws.map((d, i) => {
    const file = FILES[d.file]!;
    const line = i + 2;
    const values: RowValues = { P_ref: PRESSURES[d.P]!, source: SOURCES[d.source]!, location: { file, line } };
    for (const [f, k] of [['dHf', d.dHf], ['dGf', d.dGf], ['S', d.S]] as const) if (VALUES[k] !== undefined) values[f] = VALUES[k]!;
    if (UNCERTAINTIES[d.u] !== undefined) values[(['u_dHf', 'u_dGf', 'u_S'] as const)[d.u % 3]!] = UNCERTAINTIES[d.u]!;
    const name = NAMES[d.name]!;
    const formulaText = d.formulaIsName ? name : FORMULAS[d.formula]!;
    const cols = COLUMNS[d.table]!;
    const row: SpeciesRow = { species: name, formulaText, formula: parseFormula(FORMULAS[d.formula]!), phase: PHASES[d.phase]!, values, columns: cols.table, units: cols.units };
    if (d.state !== null) row.state = d.state;
    if (d.cp !== null) row.cp = cpSpec(d.cp, file, line);
    // a row must give a value or a Cp range to be accepted at all
    if (values.dHf === undefined && values.dGf === undefined && values.S === undefined && !row.cp) values.S = 100;
    return row;
  });
}

describe('the columnar species store folds rows exactly as the object store did', () => {
  it('for any sequence of rows: the same findings row by row and the same species', () => {
    fc.assert(
      fc.property(fc.array(rowArb, { minLength: 1, maxLength: 150, size: 'max' }), fc.boolean(), (draws, fewNames) => {
        // with few names, many rows land on one species and pass the 16-row index threshold
        const rows = makeRows(fewNames ? draws.map((d) => ({ ...d, name: d.name % 2, phase: 0 })) : draws);
        const store = new SpeciesStore();
        const oracle = new ObjectStore();
        for (const row of rows) expect(store.add(row)).toEqual(oracle.add(row));
        expect(store.list()).toEqual(oracle.list());
        const view = store.view();
        const species = oracle.list();
        expect(Array.from({ length: view.length }, (_, i) => [view.name(i), view.phase(i), view.formula(i), view.S(i), view.cpCount(i)])).toEqual(
          species.map((s) => [s.name, s.phase, s.formula, s.S, s.cp.length]),
        );
      }),
      { numRuns: 300 },
    );
  });
});

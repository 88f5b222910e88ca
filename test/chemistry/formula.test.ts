import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  FormulaError,
  atomCount,
  formatFormula,
  parseFormula,
  splitPhaseSuffix,
  type FormulaErrorCode,
} from '../../pipeline/chemistry/formula.js';
import { ELEMENT_SYMBOLS, isElement } from '../../pipeline/chemistry/elements.js';

// Expected compositions below are facts of chemical nomenclature (the formula says what it contains);
// none is a measured value.

describe('elements', () => {
  it('knows all 118 element symbols and nothing else', () => {
    expect(ELEMENT_SYMBOLS.size).toBe(118);
    for (const s of ['H', 'He', 'C', 'Co', 'Fe', 'Hg', 'U', 'Og', 'Ts', 'Nh', 'Mc', 'Lv', 'Fl', 'Cn']) expect(isElement(s)).toBe(true);
    for (const s of ['CO', 'co', 'Xx', 'Q', 'J', 'D', 'T', 'Uue', 'h', '']) expect(isElement(s)).toBe(false);
  });
});

const cases: [string, Record<string, number>, number][] = [
  ['H2O', { H: 2, O: 1 }, 0],
  ['CO2', { C: 1, O: 2 }, 0],
  ['Co', { Co: 1 }, 0],
  ['CO', { C: 1, O: 1 }, 0],
  ['NaCl', { Na: 1, Cl: 1 }, 0],
  ['CH3COOH', { C: 2, H: 4, O: 2 }, 0],
  // parentheses and brackets, nested
  ['Ca(OH)2', { Ca: 1, O: 2, H: 2 }, 0],
  ['Fe4[Fe(CN)6]3', { Fe: 7, C: 18, N: 18 }, 0],
  ['Ca3(PO4)2', { Ca: 3, P: 2, O: 8 }, 0],
  ['[Co(NH3)6]Cl3', { Co: 1, N: 6, H: 18, Cl: 3 }, 0],
  ['K4[Fe(CN)6]', { K: 4, Fe: 1, C: 6, N: 6 }, 0],
  ['Mg((OH)2)3', { Mg: 1, O: 6, H: 6 }, 0],
  // hydrates with the three separators, and a multiplier before a hydrate part
  ['CuSO4·5H2O', { Cu: 1, S: 1, O: 9, H: 10 }, 0],
  ['CuSO4.5H2O', { Cu: 1, S: 1, O: 9, H: 10 }, 0],
  ['CuSO4*5H2O', { Cu: 1, S: 1, O: 9, H: 10 }, 0],
  ['CuSO4 · 5H2O', { Cu: 1, S: 1, O: 9, H: 10 }, 0],
  ['Na2CO3·10H2O', { Na: 2, C: 1, O: 13, H: 20 }, 0],
  ['Na2CO3.10H2O', { Na: 2, C: 1, O: 13, H: 20 }, 0],
  ['CaSO4·0.5H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }, 0],
  ['CaSO4.0.5H2O', { Ca: 1, S: 1, O: 4.5, H: 1 }, 0],
  ['NaCl.2H2O', { Na: 1, Cl: 1, H: 4, O: 2 }, 0],
  ['CaCl2.H2O', { Ca: 1, Cl: 2, H: 2, O: 1 }, 0],
  ['Fe(NO3)3·9H2O', { Fe: 1, N: 3, O: 18, H: 18 }, 0],
  ['3CaO·Al2O3', { Ca: 3, O: 6, Al: 2 }, 0],
  ['KAl(SO4)2·12H2O', { K: 1, Al: 1, S: 2, O: 20, H: 24 }, 0],
  // fractional subscripts
  ['Fe0.947O', { Fe: 0.947, O: 1 }, 0],
  ['Mg1.5O', { Mg: 1.5, O: 1 }, 0],
  ['TiO1.5', { Ti: 1, O: 1.5 }, 0],
  ['(Mg0.9Fe0.1)2SiO4', { Mg: 1.8, Fe: 0.2, Si: 1, O: 4 }, 0],
  ['(Fe0.1)3O', { Fe: 0.3, O: 1 }, 0],
  ['(Fe2.95)O4', { Fe: 2.95, O: 4 }, 0],
  ['Fe2.95', { Fe: 2.95 }, 0],
  ['Al2O3·2SiO2·2H2O', { Al: 2, Si: 2, O: 9, H: 4 }, 0],
  ['Al2O3.2SiO2.2H2O'.replace(/\./g, '*'), { Al: 2, Si: 2, O: 9, H: 4 }, 0],
  ['CaCl2.2NH3', { Ca: 1, Cl: 2, N: 2, H: 6 }, 0],
  // unicode subscripts
  ['H₂O', { H: 2, O: 1 }, 0],
  // charges
  ['NH4+', { N: 1, H: 4 }, 1],
  ['H3O+', { H: 3, O: 1 }, 1],
  ['H+', { H: 1 }, 1],
  ['OH-', { O: 1, H: 1 }, -1],
  ['SO4-2', { S: 1, O: 4 }, -2],
  ['SO4^2-', { S: 1, O: 4 }, -2],
  ['SO4^-2', { S: 1, O: 4 }, -2],
  ['SO4^{2-}', { S: 1, O: 4 }, -2],
  ['SO4--', { S: 1, O: 4 }, -2],
  ['SO4-- ', { S: 1, O: 4 }, -2],
  ['SO4−2', { S: 1, O: 4 }, -2], // U+2212 minus sign
  ['SO₄²⁻', { S: 1, O: 4 }, -2],
  ['PO4---', { P: 1, O: 4 }, -3],
  ['Fe+3', { Fe: 1 }, 3],
  ['Fe3+', { Fe: 1 }, 3],
  ['Fe+++', { Fe: 1 }, 3],
  ['Fe^3+', { Fe: 1 }, 3],
  ['Fe(3+)', { Fe: 1 }, 3],
  ['Fe³⁺', { Fe: 1 }, 3],
  ['Ca2+', { Ca: 1 }, 2],
  ['Al3+', { Al: 1 }, 3],
  ['Hg2+', { Hg: 1 }, 2],
  ['Hg2^2+', { Hg: 2 }, 2],
  ['Hg2+2', { Hg: 2 }, 2],
  ['Na+', { Na: 1 }, 1],
  ['Cl-', { Cl: 1 }, -1],
  ['I3-', { I: 3 }, -1],
  ['H2+', { H: 2 }, 1],
  ['O2^-', { O: 2 }, -1],
  ['O^2-', { O: 1 }, -2],
  ['O-2', { O: 1 }, -2],
  ['Fe₃+', { Fe: 3 }, 1],
  ['Cr2O7-2', { Cr: 2, O: 7 }, -2],
  ['Cr2O7^2-', { Cr: 2, O: 7 }, -2],
  ['C10H20+', { C: 10, H: 20 }, 1],
  // a square-bracketed complex ion: the digits after the bracket are its charge (IUPAC coordination notation)
  ['[Fe(H2O)6]3+', { Fe: 1, H: 12, O: 6 }, 3],
  ['[Fe(CN)6]4-', { Fe: 1, C: 6, N: 6 }, -4],
  ['[Cu(NH3)4]2+', { Cu: 1, N: 4, H: 12 }, 2],
  ['[Ag(NH3)2]+', { Ag: 1, N: 2, H: 6 }, 1],
  ['Fe(OH)2+', { Fe: 1, O: 2, H: 2 }, 1], // a round bracket keeps its count: Fe(OH)2⁺
  ['e-', {}, -1],
  ['e−', {}, -1],
  // phase suffixes are stripped
  ['H2O(g)', { H: 2, O: 1 }, 0],
  ['H2O(l)', { H: 2, O: 1 }, 0],
  ['H2O (l)', { H: 2, O: 1 }, 0],
  ['C(cr)', { C: 1 }, 0],
  ['C(graphite)', { C: 1 }, 0],
  ['C(cr,diamond)', { C: 1 }, 0],
  ['NaCl(aq)', { Na: 1, Cl: 1 }, 0],
  ['CO2(g)', { C: 1, O: 2 }, 0],
  ['Na+(aq)', { Na: 1 }, 1],
  ['SO4^2-(aq)', { S: 1, O: 4 }, -2],
  ['Fe(OH)3(cr)', { Fe: 1, O: 3, H: 3 }, 0],
  ['CaCO3(cr)(calcite)', { Ca: 1, C: 1, O: 3 }, 0],
  ['e-(g)', {}, -1],
];

describe('parseFormula: valid formulas', () => {
  it.each(cases)('%s', (text, elements, charge) => {
    const f = parseFormula(text);
    expect(f.charge).toBe(charge);
    expect(Object.keys(f.elements).sort()).toEqual(Object.keys(elements).sort());
    for (const [el, n] of Object.entries(elements)) expect(f.elements[el]).toBeCloseTo(n, 12);
  });

  it('returns the same frozen object for the same text (cached)', () => {
    const a = parseFormula('Ca(OH)2');
    const b = parseFormula('Ca(OH)2');
    expect(a).toBe(b);
    expect(Object.isFrozen(a)).toBe(true);
    expect(Object.isFrozen(a.elements)).toBe(true);
  });

  it('removes floating-point noise from summed fractional counts', () => {
    expect(parseFormula('(Fe0.1)3O').elements.Fe).toBe(0.3);
  });
});

const errors: [string, FormulaErrorCode, number][] = [
  ['', 'empty', 0],
  ['   ', 'empty', 3],
  ['(g)', 'empty', 0],
  ['+', 'empty', 0],
  ['Xx', 'unknown-element', 0],
  ['Q', 'unknown-element', 0],
  ['H2Xx', 'unknown-element', 2],
  ['NACL', 'unknown-element', 1],
  ['co2', 'lowercase-symbol', 0],
  ['Ca(OH2', 'unbalanced-parenthesis', 2],
  ['CaOH)2', 'unbalanced-parenthesis', 4],
  ['Fe4[Fe(CN)6)3', 'mismatched-parenthesis', 11],
  ['Ca()2', 'empty-group', 2],
  ['H0', 'zero-count', 1],
  ['(OH)0', 'zero-count', 4],
  ['CuSO4·0H2O', 'zero-count', 6],
  ['CuSO4·', 'empty-part', 6],
  ['·5H2O', 'empty-part', 0],
  ['CuSO4··5H2O', 'empty-part', 6],
  ['CuSO4·5', 'misplaced-number', 6],
  ['2H2O', 'leading-coefficient', 0],
  ['(CuSO4·5H2O)2', 'hydrate-in-group', 6],
  ['Fe^0+', 'bad-charge', 2],
  ['Fe+0', 'bad-charge', 2],
  ['SO4+-', 'bad-charge', 3],
  ['SO4^', 'bad-charge', 3],
  ['SO4^2--', 'bad-charge', 3],
  ['O2-', 'ambiguous-charge', 1],
  ['S2-', 'ambiguous-charge', 1],
  ['N3-', 'ambiguous-charge', 1],
  ['N2+', 'ambiguous-charge', 1],
  ['SO42-', 'ambiguous-charge', 2],
  ['Fe-3O', 'misplaced-charge', 2],
  ['e', 'bad-electron', 0],
  ['e+', 'bad-electron', 0],
  ['H2O(g,l)', 'phase-conflict', 3],
  ['H2O(g)(l)', 'phase-conflict', 3],
  ['Fe2.95O4', 'ambiguous-dot', 3],
  ['C2.5H6', 'ambiguous-dot', 2],
  ['Al2O3.2SiO2', 'ambiguous-dot', 5],
  ['H2O$', 'unexpected-character', 3],
  ['H2 O', 'unexpected-character', 2],
  ['C6H6 (benzene)', 'unexpected-character', 4],
];

describe('parseFormula: errors', () => {
  it.each(errors)('%j -> %s at %i', (text, code, index) => {
    let caught: unknown;
    try {
      parseFormula(text);
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(FormulaError);
    const e = caught as FormulaError;
    expect(e.code).toBe(code);
    expect(e.index).toBe(index);
    expect(e.text).toBe(text);
    expect(e.message.length).toBeGreaterThan(20);
  });

  it('gives distinct codes to distinct kinds of mistake', () => {
    const byKind = new Set(errors.map(([, code]) => code));
    expect(byKind.size).toBeGreaterThanOrEqual(15);
  });

  it('rethrows a cached error for a repeated bad formula', () => {
    expect(() => parseFormula('Xx')).toThrow(/not an element symbol/);
    expect(() => parseFormula('Xx')).toThrow(FormulaError);
  });
});

describe('splitPhaseSuffix', () => {
  it.each([
    ['H2O(g)', { formula: 'H2O', phase: 'g' }],
    ['H2O(l)', { formula: 'H2O', phase: 'l' }],
    ['C(cr)', { formula: 'C', phase: 'cr' }],
    ['C(graphite)', { formula: 'C', phase: 'cr', state: 'graphite' }],
    ['C(cr,diamond)', { formula: 'C', phase: 'cr', state: 'diamond' }],
    ['C(cr, graphite)', { formula: 'C', phase: 'cr', state: 'graphite' }],
    ['S(rhombic)', { formula: 'S', phase: 'cr', state: 'rhombic' }],
    ['NaCl(aq)', { formula: 'NaCl', phase: 'aq' }],
    ['CO2(g)', { formula: 'CO2', phase: 'g' }],
    ['P(cr,white)', { formula: 'P', phase: 'cr', state: 'white' }],
    ['SiO2(quartz)', { formula: 'SiO2', phase: 'cr', state: 'quartz' }],
    ['Al2O3(corundum)', { formula: 'Al2O3', phase: 'cr', state: 'corundum' }],
    ['Fe2O3(cr,hematite)', { formula: 'Fe2O3', phase: 'cr', state: 'hematite' }],
    ['CaCO3(cr)(calcite)', { formula: 'CaCO3', phase: 'cr', state: 'calcite' }],
    ['Fe(α)', { formula: 'Fe', phase: 'cr', state: 'alpha' }],
    ['Fe(cr,alpha)', { formula: 'Fe', phase: 'cr', state: 'alpha' }],
    ['SiO2(amorphous)', { formula: 'SiO2', state: 'amorphous' }],
    ['  H2O  ', { formula: 'H2O' }],
    ['Ca(OH)2', { formula: 'Ca(OH)2' }],
    ['Fe(OH)3', { formula: 'Fe(OH)3' }],
    ['Fe(3+)', { formula: 'Fe(3+)' }],
    ['Cr(Cr)', { formula: 'Cr(Cr)' }],
    ['H2O(toString)', { formula: 'H2O(toString)' }],
    ['H2O(constructor)', { formula: 'H2O(constructor)' }],
    ['H2O(g,l)', { formula: 'H2O(g,l)' }],
    ['H2O(g)(l)', { formula: 'H2O(g)', phase: 'l' }],
  ])('%s', (text, expected) => {
    expect(splitPhaseSuffix(text)).toEqual(expected);
  });
});

describe('formatFormula and atomCount', () => {
  it.each([
    ['CH4', 'CH4'],
    ['CH3COOH', 'C2H4O2'],
    ['H2O', 'H2O'],
    ['NaCl', 'ClNa'],
    ['CuSO4·5H2O', 'CuH10O9S'],
    ['CCl4', 'CCl4'],
    ['NH4+', 'H4N+'],
    ['SO4^2-', 'O4S^2-'],
    ['Fe+3', 'Fe^3+'],
    ['e-', 'e-'],
    ['Fe0.947O', 'Fe0.947O'],
    ['CO2', 'CO2'],
    ['(C2.5)H6', 'C2.5H6'.replace('C2.5', '(C2.5)')],
    ['(Mg0.9Fe0.1)2SiO4', '(Fe0.2)(Mg1.8)O4Si'.replace('(Fe0.2)', 'Fe0.2')],
    ['O2^-', 'O2^-'],
    ['C2H3O2-', 'C2H3O2^-'],
  ])('%s is written %s in Hill order, and parses back', (text, hill) => {
    const f = parseFormula(text);
    expect(formatFormula(f)).toBe(hill);
    expect(parseFormula(hill)).toEqual(f);
  });

  it('round-trips any formula through formatFormula and parseFormula (property test)', () => {
    const symbols = ['H', 'C', 'N', 'O', 'S', 'Cl', 'Fe', 'Na', 'Ca', 'Si', 'Al', 'Cu', 'I', 'Hg'];
    const count = fc.oneof(fc.integer({ min: 1, max: 40 }), fc.constantFrom(0.5, 0.947, 1.5, 2.5, 12.25));
    const formula = fc.record({
      elements: fc.dictionary(fc.constantFrom(...symbols), count, { minKeys: 1, maxKeys: 6 }),
      charge: fc.integer({ min: -4, max: 4 }),
    });
    fc.assert(
      fc.property(formula, (f) => {
        expect(parseFormula(formatFormula(f))).toEqual(f);
      }),
      { numRuns: 2000 },
    );
  });

  it('counts atoms per formula unit', () => {
    expect(atomCount(parseFormula('H2O'))).toBe(3);
    expect(atomCount(parseFormula('CuSO4·5H2O'))).toBe(21);
    expect(atomCount(parseFormula('Fe0.947O'))).toBe(1.947);
    expect(atomCount(parseFormula('e-'))).toBe(0);
    expect(atomCount(parseFormula('Fe4[Fe(CN)6]3'))).toBe(43);
  });
});

describe('parseFormula: cache', () => {
  // speed is measured by `npm run bench`, never asserted in a unit test; here: the cache returns the same result
  it('parses 10^5 distinct formulas and serves repeats from its cache', () => {
    for (let i = 1; i <= 100_000; i++) expect(parseFormula(`C${i}H${2 * i + 2}O${(i % 7) + 1}`).elements.C).toBe(i);
    expect(parseFormula('CuSO4·5H2O')).toBe(parseFormula('CuSO4·5H2O'));
  });
});

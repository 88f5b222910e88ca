// Reactions file, species resolution, element and charge balance.
import { describe, expect, test } from 'vitest';
import { InputError } from '../../pipeline/errors.js';
import { runEquilibrium } from '../../pipeline/equilibrium/index.js';
import { loadReactions, reactionFromEquation, resolveReactions } from '../../pipeline/equilibrium/reactions.js';
import { species, tempFile } from './helpers.js';
import { publishedSpecies, REFERENCE } from './published-data.js';

const where = { file: 'r.csv', line: 7 };
const one = (eq: string) => reactionFromEquation('r', eq, where, { temps: [298.15] });

describe('loadReactions', () => {
  test('id, equation, T (space-separated) with file and line; comments and blank lines skipped', () => {
    const path = tempFile('# shift and synthesis\nid,equation,T\n\nwgs,CO(g) + H2O(g) = CO2(g) + H2(g),298.15 500 1000\nnh3,"N2 + 3H2 = 2NH3",700\n');
    const { reactions, findings } = loadReactions(path);
    expect(findings).toEqual([]);
    expect(reactions.map((r) => [r.id, r.line, r.temps])).toEqual([
      ['wgs', 4, [298.15, 500, 1000]],
      ['nh3', 5, [700]],
    ]);
    expect(reactions[0]!.file).toBe(path);
  });

  test('id, equation, Tmin, Tmax, with a unit in the header', () => {
    const { reactions } = loadReactions(tempFile('ID,Equation,Tmin [degC],Tmax [degC]\nwgs,CO + H2O = CO2 + H2,200,400\n'));
    expect(reactions[0]).toMatchObject({ Tmin: 473.15, Tmax: 673.15 });
  });

  test('malformed rows become findings at their line; the others are kept', () => {
    const text = [
      'id,equation,Tmin,Tmax',
      ',CO + H2O = CO2 + H2,300,900', // 2: no id
      'a,,300,900', // 3: no equation
      'b,CO + H2O = CO2 + H2,900,300', // 4: window upside down
      'c,CO + H2O = CO2 + H2,abc,900', // 5: not a number
      'd,CO + H2O = CO2 + H2,300,', // 6: half a window
      'e,CO + H2O CO2 + H2,300,900', // 7: no arrow
      'f,CO + H2O = CO2 + H2,300,900', // 8: fine
      'f,CO + H2O = CO2 + H2,300,900', // 9: duplicate id
      'g,CO + H2O = CO2 + 2H2,300,900', // 10: unbalanced as written
    ].join('\n');
    const { reactions, findings } = loadReactions(tempFile(text));
    expect(findings.map((f) => [f.location.line, f.rule, f.messageId])).toEqual([
      [2, 'reaction-row', 'missing-id'],
      [3, 'reaction-row', 'missing-equation'],
      [4, 'reaction-row', 'bad-window'],
      [5, 'reaction-row', 'bad-temperature'],
      [6, 'reaction-row', 'half-window'],
      [7, 'reaction-row', 'syntax'],
      [9, 'reaction-row', 'duplicate-id'],
      [10, 'reaction-unbalanced', 'elements'],
    ]);
    expect(reactions.map((r) => r.id)).toEqual(['f', 'g']);
    expect(reactions[1]!.balancedAsWritten).toBe(false);
  });

  test('a quoted equation spanning two lines keeps the next row on its physical line', () => {
    const { reactions } = loadReactions(tempFile('id,equation,T\na,"CO + H2O =\nCO2 + H2",500\nb,N2 + 3H2 = 2NH3,500\n'));
    expect(reactions.map((r) => [r.id, r.line])).toEqual([
      ['a', 2],
      ['b', 4],
    ]);
  });

  test.each([
    ['a header without equation', 'id,reaction_text,T\na,x,1\n', 'reactions-header'],
    ['an unknown temperature unit', 'id,equation,T [furlongs]\na,A = A,1\n', 'unknown-unit'],
  ])('%s is an unusable file (InputError)', (_what, text, code) => {
    expect(() => loadReactions(tempFile(text))).toThrow(InputError);
    try {
      loadReactions(tempFile(text));
    } catch (e) {
      expect((e as InputError).code).toBe(code);
    }
  });

  test('a missing file is an InputError', () => {
    expect(() => loadReactions('/nonexistent/reactions.csv')).toThrow(InputError);
  });
});

describe('species resolution', () => {
  const table = [
    ...publishedSpecies(),
    species({ name: 'H2O', phase: 'l', dHf_kJ: -285.83, S: 69.95 }), // CODATA 1989
    species({ name: 'ethanol', formula: 'C2H6O', phase: 'g', dHf_kJ: -235.1, S: 282.7 }), // NBS 1982, from memory
    species({ name: 'dimethyl ether', formula: 'C2H6O', phase: 'g', dHf_kJ: -184.1, S: 266.4 }), // NBS 1982, from memory
    species({ name: 'O2', phase: 'g', dHf_kJ: 0, S: 205.152 }), // CODATA 1989
    species({ name: 'C(graphite)', formula: 'C', phase: 'cr', state: 'graphite', dHf_kJ: 0, S: 5.74 }), // CODATA 1989
    species({ name: 'C(diamond)', formula: 'C', phase: 'cr', state: 'diamond', dHf_kJ: 1.895, S: 2.377 }), // NBS 1982, from memory
  ];

  test('by formula and phase, by name, and by the state word', () => {
    const out = resolveReactions([one('C(graphite) + 1/2 O2(g) = CO(g)'), one('ethanol(g) + 3 O2 = 2 CO2 + 3 H2O(g)')], table, REFERENCE);
    expect(out.findings).toEqual([]);
    expect(out.resolved.map((r) => r.terms.map((t) => [t.coeff, t.thermo.species.key]))).toEqual([
      [
        [-1, 'C(graphite)|cr'],
        [-0.5, 'O2|g'],
        [1, 'CO|g'],
      ],
      [
        [-1, 'ethanol|g'],
        [-3, 'O2|g'],
        [2, 'CO2|g'],
        [3, 'H2O|g'],
      ],
    ]);
  });

  test('a formula two species share is ambiguous, and the finding names both', () => {
    const out = resolveReactions([one('C2H6O(g) + 3 O2 = 2 CO2 + 3 H2O(g)')], table, REFERENCE);
    expect(out.resolved).toEqual([]);
    expect(out.findings).toHaveLength(1);
    expect(out.findings[0]).toMatchObject({ rule: 'reaction-species', messageId: 'ambiguous', location: { file: 'r.csv', line: 7 } });
    expect(out.findings[0]!.params.candidates).toMatch(/dimethyl ether.*ethanol/);
  });

  test('water without a phase is ambiguous between gas and liquid; C(cr) between graphite and diamond', () => {
    const out = resolveReactions([one('H2 + 1/2 O2 = H2O'), one('C(cr) + O2 = CO2')], table, REFERENCE);
    expect(out.findings.map((f) => [f.messageId, f.params.count])).toEqual([
      ['ambiguous', 2],
      ['ambiguous', 2],
    ]);
  });

  test('an unknown species is an error finding; another phase of it is named as a hint', () => {
    const out = resolveReactions([one('CO(g) + H2O(g) = CO2(g) + H2(cr)')], table, REFERENCE);
    expect(out.findings[0]).toMatchObject({ rule: 'reaction-species', messageId: 'unknown', params: { term: 'H2(cr)' } });
    expect(out.findings[0]!.message).toMatch(/H2 \(g\)/);
    expect(out.results[0]!.points).toEqual([]);
  });

  test('a species on both sides is merged into its net coefficient', () => {
    const out = resolveReactions([one('CO + H2O(g) + H2 = CO2 + 2 H2')], table, REFERENCE);
    expect(out.resolved[0]!.terms.map((t) => [t.coeff, t.thermo.species.name])).toEqual([
      [-1, 'CO'],
      [-1, 'H2O'],
      [1, 'H2'],
      [1, 'CO2'],
    ]);
  });
});

describe('balance', () => {
  const ions = [
    species({ name: 'H+', phase: 'aq', dHf_kJ: 0, dGf_kJ: 0, S: 0 }), // convention
    species({ name: 'OH-', phase: 'aq', dHf_kJ: -230.015, S: -10.9 }), // CODATA 1989
    species({ name: 'H2O', phase: 'l', dHf_kJ: -285.83, S: 69.95 }), // CODATA 1989
    species({ name: 'Fe^3+', phase: 'aq', dHf_kJ: -48.5, S: -315.9 }), // NBS 1982, from memory
    species({ name: 'Fe^2+', phase: 'aq', dHf_kJ: -89.1, S: -137.7 }), // NBS 1982, from memory
  ];

  test('fractional coefficients balance (1/2, 0.5, 1/3 in floating point)', () => {
    const out = resolveReactions([one('H2(g) + 1/2 O2(g) = H2O(l)'), one('1/3 N2 + H2 = 2/3 NH3')], [...publishedSpecies(), ...ions, species({ name: 'O2', phase: 'g', dHf_kJ: 0, S: 205.152 })], REFERENCE);
    expect(out.findings).toEqual([]);
    expect(out.results.map((r) => r.balanced)).toEqual([true, true]);
  });

  test('0.333 for 1/3 does not balance', () => {
    const r = runEquilibrium([one('0.333 N2 + H2 = 0.667 NH3')], publishedSpecies(), REFERENCE);
    expect(r.findings.map((f) => [f.rule, f.messageId])).toEqual([['reaction-unbalanced', 'elements']]);
  });

  test('charges balance: H+ + OH- = H2O(l)', () => {
    const out = resolveReactions([one('H+(aq) + OH-(aq) = H2O(l)')], ions, REFERENCE);
    expect(out.findings).toEqual([]);
    expect(out.resolved).toHaveLength(1);
  });

  test('a charge that does not balance is refused: Fe^3+ = Fe^2+ without the electron', () => {
    const r = runEquilibrium([one('Fe^3+(aq) = Fe^2+(aq)')], ions, REFERENCE);
    expect(r.findings.map((f) => [f.rule, f.messageId, f.params.charge])).toEqual([['reaction-unbalanced', 'charge', '-1']]);
    expect(r.results[0]).toMatchObject({ balanced: false, points: [] });
  });

  test('an unbalanced reaction is refused with its file and line and gets no ln K', () => {
    const r = runEquilibrium([one('N2(g) + H2(g) = 2 NH3(g)')], publishedSpecies(), REFERENCE);
    expect(r.findings).toHaveLength(1);
    expect(r.findings[0]).toMatchObject({ rule: 'reaction-unbalanced', severity: 'error', location: { file: 'r.csv', line: 7 } });
    expect(r.findings[0]!.params.residual).toBe('H +4');
    expect(r.results[0]).toMatchObject({ id: 'r', balanced: false, points: [] });
    expect(r.resolved).toEqual([]);
  });

  test('species written by name are balanced with the table formulas after resolution', () => {
    const table = [
      species({ name: 'methane', formula: 'CH4', phase: 'g', dHf_kJ: -74.873, S: 186.251 }), // JANAF 1998 (checked)
      species({ name: 'steam', formula: 'H2O', phase: 'g', dHf_kJ: -241.826, S: 188.835 }), // CODATA 1989
      ...publishedSpecies().filter((s) => s.name !== 'H2O'),
    ];
    const r = runEquilibrium([one('methane + steam = CO + H2')], table, REFERENCE);
    expect(r.findings.map((f) => [f.rule, f.params.residual])).toEqual([['reaction-unbalanced', 'H -4']]);
  });
});

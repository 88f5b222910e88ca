// Reading equations: arrows, coefficients (integer, decimal, fraction), charges next to '+' signs.
import { describe, expect, test } from 'vitest';
import { EquationError, parseEquation, splitTerms } from '../../pipeline/equilibrium/equation.js';

const coeffs = (eq: string) => parseEquation(eq).terms.map((t) => [t.coeff, t.text]);

describe('sides and arrows', () => {
  test.each(['=', '<=>', '->', '⇌', '→', '=>', '<->'])('"%s" separates the sides', (arrow) => {
    expect(coeffs(`CO(g) + H2O(g) ${arrow} CO2(g) + H2(g)`)).toEqual([
      [-1, 'CO(g)'],
      [-1, 'H2O(g)'],
      [1, 'CO2(g)'],
      [1, 'H2(g)'],
    ]);
  });

  test.each([
    ['CO + H2O', 'no-arrow'],
    ['A = B = C', 'two-arrows'],
    [' = H2O', 'empty-side'],
    ['H2 + = H2', 'empty-term'],
    ['0 H2 = H2', 'bad-coefficient'],
    ['1/0 H2 = H2', 'bad-coefficient'],
    ['2 = H2', 'empty-term'],
  ])('%s is refused (%s)', (eq, code) => {
    expect(() => parseEquation(eq)).toThrow(EquationError);
    try {
      parseEquation(eq);
    } catch (e) {
      expect((e as EquationError).code).toBe(code);
    }
  });
});

describe('coefficients', () => {
  test.each([
    ['H2 + 0.5 O2 = H2O', 0.5],
    ['H2 + 1/2 O2 = H2O', 0.5],
    ['H2 + ½O2 = H2O', 0.5],
    ['H2 + .5O2 = H2O', 0.5],
    ['H2 + 0.5O2 = H2O', 0.5],
  ])('%s: O2 takes %d', (eq, c) => {
    expect(parseEquation(eq).terms[1]).toMatchObject({ coeff: -c, bare: 'O2' });
  });

  test('integer coefficients with and without a space', () => {
    expect(coeffs('N2 + 3H2 = 2 NH3')).toEqual([
      [-1, 'N2'],
      [-3, 'H2'],
      [2, 'NH3'],
    ]);
  });

  test('3/2 and 1½ read as 1.5', () => {
    expect(parseEquation('2 Al(cr) + 3/2 O2(g) = Al2O3(cr)').terms[1]!.coeff).toBe(-1.5);
    expect(parseEquation('2 Al(cr) + 1½ O2(g) = Al2O3(cr)').terms[1]!.coeff).toBe(-1.5);
  });

  test('a name that starts with a digit is a name, not a coefficient', () => {
    expect(parseEquation('2-butene(g) = 1-butene(g)').terms.map((t) => [t.coeff, t.bare, t.phase])).toEqual([
      [-1, '2-butene', 'g'],
      [1, '1-butene', 'g'],
    ]);
  });
});

describe('charges beside plus signs', () => {
  test.each([
    ['NH4+ + Cl-', ['NH4+', 'Cl-']],
    ['NH4++Cl-', ['NH4+', 'Cl-']],
    ['H+ + OH-', ['H+', 'OH-']],
    ['Fe+3 + e-', ['Fe+3', 'e-']],
    ['Fe^3+ + e-', ['Fe^3+', 'e-']],
    ['Fe^3+(aq) + e-', ['Fe^3+(aq)', 'e-']],
    ['CO+H2O', ['CO', 'H2O']],
    ['CO+3H2', ['CO', '3H2']],
    ['Ca^2+ + 2 Cl-', ['Ca^2+', '2 Cl-']],
  ])('%s splits into %j', (side, terms) => {
    expect(splitTerms(side)).toEqual(terms);
  });

  test('ion formulas and phases come through', () => {
    const t = parseEquation('Fe^3+(aq) + e- = Fe^2+(aq)').terms;
    expect(t.map((x) => [x.coeff, x.formula?.charge, x.phase])).toEqual([
      [-1, 3, 'aq'],
      [-1, -1, undefined],
      [1, 2, 'aq'],
    ]);
  });
});

test('phase and state words come off the formula', () => {
  const [c, o2, co] = parseEquation('C(graphite) + 1/2 O2(g) = CO(g)').terms;
  expect(c).toMatchObject({ bare: 'C', phase: 'cr', state: 'graphite', formula: { elements: { C: 1 }, charge: 0 } });
  expect(o2).toMatchObject({ bare: 'O2', phase: 'g' });
  expect(co).toMatchObject({ bare: 'CO', phase: 'g' });
});

test('a species name that is not a formula is kept as a name', () => {
  const [m] = parseEquation('methane(g) + 2 O2(g) = CO2(g) + 2 H2O(g)').terms;
  expect(m).toMatchObject({ coeff: -1, bare: 'methane', phase: 'g' });
  expect(m!.formula).toBeUndefined();
});

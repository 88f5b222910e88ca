import { describe, expect, it } from 'vitest';
import { balance } from '../../pipeline/chemistry/balance.js';
import { parseFormula } from '../../pipeline/chemistry/formula.js';

// The reactions are stoichiometric facts (conservation of atoms and charge), not measured values.
const r = (...terms: [number, string][]) => terms.map(([coeff, text]) => ({ coeff, formula: parseFormula(text) }));

describe('balance', () => {
  it('accepts balanced reactions with integer coefficients', () => {
    expect(balance(r([-1, 'CO(g)'], [-1, 'H2O(g)'], [1, 'CO2(g)'], [1, 'H2(g)']))).toEqual({ ok: true, residual: {}, chargeResidual: 0 });
    expect(balance(r([-1, 'N2'], [-3, 'H2'], [2, 'NH3'])).ok).toBe(true);
    expect(balance(r([-1, 'CH4'], [-1, 'H2O'], [1, 'CO'], [3, 'H2'])).ok).toBe(true);
    expect(balance(r([-1, 'CaCO3(cr)'], [1, 'CaO(cr)'], [1, 'CO2(g)'])).ok).toBe(true);
  });

  it('accepts fractional coefficients', () => {
    expect(balance(r([-1, 'H2'], [-0.5, 'O2'], [1, 'H2O'])).ok).toBe(true);
    expect(balance(r([-0.5, 'N2'], [-1.5, 'H2'], [1, 'NH3'])).ok).toBe(true);
    // 1/3 is not exact in binary floating point: 3 × (1/3) must still balance
    expect(balance(r([-1 / 3, 'O3'], [0.5, 'O2'])).ok).toBe(true);
    expect(balance(r([-1, 'CO'], [-1 / 2, 'O2'], [1, 'CO2'])).ok).toBe(true);
    expect(balance(r([-2 / 3, 'Al'], [-1 / 2, 'O2'], [1 / 3, 'Al2O3'])).ok).toBe(true);
  });

  it('rejects a fractional coefficient that is only close (0.333 for 1/3)', () => {
    const res = balance(r([-0.333, 'O3'], [0.5, 'O2']));
    expect(res.ok).toBe(false);
    expect(res.residual.O).toBeCloseTo(0.001, 12);
  });

  it('reports the residual per element, products minus reactants', () => {
    const res = balance(r([-1, 'CH4'], [-1, 'O2'], [1, 'CO2'], [2, 'H2O']));
    expect(res.ok).toBe(false);
    expect(res).toEqual({ ok: false, residual: { O: 2 }, chargeResidual: 0 });
    const res2 = balance(r([-1, 'N2'], [-1, 'H2'], [2, 'NH3']));
    expect(res2.residual).toEqual({ H: 4 });
  });

  it('checks the charge', () => {
    // Zn(cr) + 2 H+(aq) = Zn2+(aq) + H2(g)
    expect(balance(r([-1, 'Zn(cr)'], [-2, 'H+(aq)'], [1, 'Zn2+(aq)'], [1, 'H2(g)']))).toEqual({ ok: true, residual: {}, chargeResidual: 0 });
    // Fe3+ + e- = Fe2+
    expect(balance(r([-1, 'Fe+3'], [-1, 'e-'], [1, 'Fe+2'])).ok).toBe(true);
    // HSO4- = H+ + SO4^2-
    expect(balance(r([-1, 'HSO4-'], [1, 'H+'], [1, 'SO4^2-'])).ok).toBe(true);
    // Fe3+ + 1/2 H2 = Fe2+ + H+ , fractional with charge
    expect(balance(r([-1, 'Fe3+'], [-0.5, 'H2'], [1, 'Fe2+'], [1, 'H+'])).ok).toBe(true);
    // charge missing an electron: Fe3+ = Fe2+
    const res = balance(r([-1, 'Fe3+'], [1, 'Fe2+']));
    expect(res.ok).toBe(false);
    expect(res.residual).toEqual({});
    expect(res.chargeResidual).toBe(-1);
    // H2O = H+ + OH-
    expect(balance(r([-1, 'H2O(l)'], [1, 'H+(aq)'], [1, 'OH-(aq)'])).ok).toBe(true);
  });

  it('refuses a coefficient that is not a number', () => {
    expect(() => balance(r([Number.NaN, 'H2'], [1, 'H2']))).toThrow(RangeError);
  });

  it('treats an empty reaction as balanced', () => {
    expect(balance([])).toEqual({ ok: true, residual: {}, chargeResidual: 0 });
  });
});

// Element and charge balance of a reaction written as signed stoichiometric coefficients.

import type { Formula } from '../types.js';

/** Absolute tolerance per unit of stoichiometric magnitude; allows fractional coefficients such as 1/3. */
export const BALANCE_TOLERANCE = 1e-9;

export interface BalanceTerm {
  /** signed: negative for reactants, positive for products */
  coeff: number;
  formula: Formula;
}

export interface BalanceResult {
  ok: boolean;
  /** Σ coeff·count for each element that does not balance (products minus reactants); empty when ok */
  residual: Record<string, number>;
  /** Σ coeff·charge (products minus reactants); 0 when the charge balances */
  chargeResidual: number;
}

/**
 * Checks that every element and the charge balance: Σ ν_i·n_el,i = 0 and Σ ν_i·z_i = 0.
 * A sum counts as zero when |sum| ≤ 1e-9 · max(1, Σ|ν_i·n_el,i|), so fractional coefficients
 * (½O2, ⅓ written as 1/3 in floating point) balance, while 0.333 for ⅓ does not.
 * Residuals are reported products minus reactants, in element symbol order.
 */
export function balance(sides: readonly BalanceTerm[]): BalanceResult {
  const sum = new Map<string, number>();
  const scale = new Map<string, number>();
  let charge = 0;
  let chargeScale = 0;
  for (const { coeff, formula } of sides) {
    if (!Number.isFinite(coeff)) throw new RangeError(`balance: stoichiometric coefficient ${String(coeff)} is not a finite number`);
    for (const el in formula.elements) {
      const term = coeff * formula.elements[el];
      sum.set(el, (sum.get(el) ?? 0) + term);
      scale.set(el, (scale.get(el) ?? 0) + Math.abs(term));
    }
    charge += coeff * formula.charge;
    chargeScale += Math.abs(coeff * formula.charge);
  }
  const residual: Record<string, number> = {};
  for (const el of [...sum.keys()].sort()) {
    const r = sum.get(el) ?? 0;
    if (Math.abs(r) > BALANCE_TOLERANCE * Math.max(1, scale.get(el) ?? 0)) residual[el] = r;
  }
  const chargeResidual = Math.abs(charge) > BALANCE_TOLERANCE * Math.max(1, chargeScale) ? charge : 0;
  return { ok: Object.keys(residual).length === 0 && chargeResidual === 0, residual, chargeResidual };
}

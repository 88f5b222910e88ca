// The Cp models: one builder per published form, dispatched by the row's cp_model.

import type { CpModelName, CpSegment, CpSpec } from '../types.js';
import { CpSpecError } from './errors.js';
import { buildNasa7 } from './nasa7.js';
import { buildNasa9 } from './nasa9.js';
import { buildPoly } from './poly.js';
import { buildShomate } from './shomate.js';
import { buildTable } from './table.js';

export { CpSpecError } from './errors.js';
export type { CpSpecErrorCode } from './errors.js';
export { R_J_PER_MOL_K, T_REF_K } from './constants.js';
export { buildCurve } from './piecewise.js';
export { buildPoly, buildShomate, buildNasa7, buildNasa9, buildTable };

const EXPECTED: Record<CpModelName, string> = {
  poly: 'one coefficient per exponent, at least one',
  shomate: '7 (A…G) or 8 (A…H)',
  nasa7: '7 (a1…a7)',
  nasa9: '9 (a1…a7, b1, b2)',
  table: 'one Cp value per listed temperature, at least two',
};

/** How many coefficients a model takes, as text for messages (e.g. '7 (A…G) or 8 (A…H)' for shomate). */
export function expectedCoeffCount(model: CpModelName): string {
  return EXPECTED[model] ?? `unknown model '${String(model)}'`;
}

/**
 * Builds the analytic segment of one Cp correlation row, in SI units.
 * Throws CpSpecError (with a stable `code`) when the coefficients, exponents or temperatures do not
 * fit the model: poly needs exponents.length === coeffs.length ≥ 1, shomate 7 or 8 coefficients,
 * nasa7 exactly 7, nasa9 exactly 9, table temps.length === coeffs.length ≥ 2, strictly ascending, > 0 K.
 */
export function buildSegment(spec: CpSpec): CpSegment {
  switch (spec.model) {
    case 'poly':
      return buildPoly(spec);
    case 'shomate':
      return buildShomate(spec);
    case 'nasa7':
      return buildNasa7(spec);
    case 'nasa9':
      return buildNasa9(spec);
    case 'table':
      return buildTable(spec);
    default:
      throw new CpSpecError(
        'cp-unknown-model',
        `unknown Cp model '${String((spec as { model: unknown }).model)}' (known: poly, shomate, nasa7, nasa9, table)`,
        spec.location,
      );
  }
}

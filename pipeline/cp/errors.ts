import type { Location } from '../types.js';

/** Stable codes for a Cp specification that cannot be turned into a segment. */
export type CpSpecErrorCode =
  | 'cp-unknown-model'
  | 'cp-coeff-count'
  | 'cp-exponent-count'
  | 'cp-temp-count'
  | 'cp-temps-not-ascending'
  | 'cp-temps-not-positive'
  | 'cp-not-finite'
  | 'cp-no-segments';

/**
 * A Cp specification whose shape does not fit its model (wrong number of coefficients, exponents
 * or temperatures, non-finite numbers). Carries a stable `code` and, when known, the row's location,
 * so the caller can turn it into a finding or a rejected row instead of a stack trace.
 */
export class CpSpecError extends Error {
  readonly code: CpSpecErrorCode;
  readonly location?: Location;

  constructor(code: CpSpecErrorCode, message: string, location?: Location) {
    super(message);
    this.name = 'CpSpecError';
    this.code = code;
    this.location = location;
  }
}

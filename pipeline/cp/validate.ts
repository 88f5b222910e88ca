import type { CpSpec } from '../types.js';
import { CpSpecError } from './errors.js';

/** Throws unless every number in `values` is finite. */
export function requireFinite(spec: CpSpec, what: string, values: readonly number[]): void {
  const bad = values.findIndex((v) => typeof v !== 'number' || !Number.isFinite(v));
  if (bad >= 0) {
    throw new CpSpecError(
      'cp-not-finite',
      `${spec.model}: ${what} #${bad + 1} is not a finite number (${String(values[bad])})`,
      spec.location,
    );
  }
}

/** Throws unless the model's coefficient count is one of `allowed`. */
export function requireCoeffCount(spec: CpSpec, allowed: readonly number[]): void {
  if (!allowed.includes(spec.coeffs.length)) {
    throw new CpSpecError(
      'cp-coeff-count',
      `${spec.model} takes ${allowed.join(' or ')} coefficients, got ${spec.coeffs.length}`,
      spec.location,
    );
  }
  requireFinite(spec, 'coefficient', spec.coeffs);
}

/** The factor that turns a declared poly/table coefficient into J/(mol K). */
export function unitFactorOf(spec: CpSpec): number {
  const f = spec.unitFactor;
  if (typeof f !== 'number' || !Number.isFinite(f)) {
    throw new CpSpecError('cp-not-finite', `${spec.model}: unit factor is not a finite number (${String(f)})`, spec.location);
  }
  return f;
}

// poly: Cp = Σ c_k · f · T^e_k over declared exponents e_k (any real numbers), f = spec.unitFactor.
// Covers the cubic a + bT + cT² + dT³, a + bT + cT² + dT⁻², Maier–Kelley a + bT + cT⁻² and any other
// power series in T.

import type { CpSegment, CpSpec } from '../types.js';
import { CpSpecError } from './errors.js';
import { requireFinite, unitFactorOf } from './validate.js';

/**
 * ∫ T^p dT / ... written so that it is exact and smooth in p:
 *   powInt(T, q) = (T^q − 1)/q  for q ≠ 0,   ln T  for q = 0.
 * (T^q − 1)/q is an antiderivative of T^(q−1) for every q ≠ 0 and tends to ln T as q → 0, so an
 * exponent a hair away from −1 (for intCp) or 0 (for intCpOverT) loses no digits to cancellation.
 */
function powInt(T: number, q: number, lnT: number): number {
  if (q === 0) return lnT;
  const x = q * lnT;
  // For a vanishing q·ln T (down to subnormal q, where expm1(x)/q is no longer exact) the series
  // ln T (1 + x/2 + x²/6) is exact to rounding.
  if (Math.abs(x) < 1e-5) return lnT * (1 + x * (0.5 + x / 6));
  // expm1 keeps the digits when T^q is near 1; elsewhere pow is the more accurate of the two.
  return Math.abs(x) < 0.5 ? Math.expm1(x) / q : (Math.pow(T, q) - 1) / q;
}

export function buildPoly(spec: CpSpec): CpSegment {
  const exps = spec.exponents ?? [];
  if (spec.coeffs.length < 1 || exps.length !== spec.coeffs.length) {
    throw new CpSpecError(
      'cp-exponent-count',
      `poly needs one exponent per coefficient (at least one): got ${spec.coeffs.length} coefficient(s) and ${exps.length} exponent(s)`,
      spec.location,
    );
  }
  requireFinite(spec, 'coefficient', spec.coeffs);
  requireFinite(spec, 'exponent', exps);
  const f = unitFactorOf(spec);
  const c = spec.coeffs.map((x) => x * f); // J/(mol K) per T^e
  const e = exps.slice();
  const n = c.length;

  return {
    model: 'poly',
    Tmin: spec.Tmin,
    Tmax: spec.Tmax,
    location: spec.location,
    cp(T) {
      let s = 0;
      for (let k = 0; k < n; k++) s += c[k] * Math.pow(T, e[k]);
      return s;
    },
    intCp(T) {
      // ∫ c T^e dT = c (T^(e+1) − 1)/(e+1), and c ln T for e = −1
      const lnT = Math.log(T);
      let s = 0;
      for (let k = 0; k < n; k++) s += c[k] * powInt(T, e[k] + 1, lnT);
      return s;
    },
    intCpOverT(T) {
      // ∫ c T^(e−1) dT = c (T^e − 1)/e, and c ln T for e = 0
      const lnT = Math.log(T);
      let s = 0;
      for (let k = 0; k < n; k++) s += c[k] * powInt(T, e[k], lnT);
      return s;
    },
  };
}

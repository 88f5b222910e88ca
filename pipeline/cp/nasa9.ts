// nasa9 (McBride, Zehe and Gordon 2002, NASA TP-2002-211556), coefficients a1…a7, b1, b2:
//   Cp/R    = a1 T⁻² + a2 T⁻¹ + a3 + a4 T + a5 T² + a6 T³ + a7 T⁴
//   H/(RT)  = −a1 T⁻² + a2 ln(T)/T + a3 + a4 T/2 + a5 T²/3 + a6 T³/4 + a7 T⁴/5 + b1/T
//   S/R     = −a1 T⁻²/2 − a2 T⁻¹ + a3 ln T + a4 T + a5 T²/2 + a6 T³/3 + a7 T⁴/4 + b2
// H is on the scale where H(298.15 K) = ΔfH°298; b1 and b2 are the embedded constants.
// spec.unitFactor is not used: the form is dimensionless in Cp/R by definition.

import type { CpSegment, CpSpec } from '../types.js';
import { R_J_PER_MOL_K as R } from './constants.js';
import { requireCoeffCount } from './validate.js';

export function buildNasa9(spec: CpSpec): CpSegment {
  requireCoeffCount(spec, [9]);
  const [a1, a2, a3, a4, a5, a6, a7, b1, b2] = spec.coeffs;

  // ∫Cp/R dT without b1, and ∫Cp/(RT) dT without b2.
  const hPoly = (T: number): number =>
    -a1 / T + a2 * Math.log(T) + T * (a3 + T * (a4 / 2 + T * (a5 / 3 + T * (a6 / 4 + T * (a7 / 5)))));
  const sPoly = (T: number): number =>
    -a1 / (2 * T * T) - a2 / T + a3 * Math.log(T) + T * (a4 + T * (a5 / 2 + T * (a6 / 3 + T * (a7 / 4))));

  return {
    model: 'nasa9',
    Tmin: spec.Tmin,
    Tmax: spec.Tmax,
    location: spec.location,
    cp: (T) => R * ((a1 / T + a2) / T + a3 + T * (a4 + T * (a5 + T * (a6 + T * a7)))),
    intCp: (T) => R * hPoly(T),
    intCpOverT: (T) => R * sPoly(T),
    embedded: {
      H: (T) => R * (hPoly(T) + b1),
      S: (T) => R * (sPoly(T) + b2),
    },
  };
}

// nasa7 (McBride, Gordon and Reno 1993, NASA TM-4513), coefficients a1…a7:
//   Cp/R    = a1 + a2 T + a3 T² + a4 T³ + a5 T⁴
//   H/(RT)  = a1 + a2 T/2 + a3 T²/3 + a4 T³/4 + a5 T⁴/5 + a6/T
//   S/R     = a1 ln T + a2 T + a3 T²/2 + a4 T³/3 + a5 T⁴/4 + a7
// H is on the scale where H(298.15 K) = ΔfH°298, so a6 and a7 are the embedded constants.
// spec.unitFactor is not used: the form is dimensionless in Cp/R by definition.

import type { CpSegment, CpSpec } from '../types.js';
import { R_J_PER_MOL_K as R } from './constants.js';
import { requireCoeffCount } from './validate.js';

export function buildNasa7(spec: CpSpec): CpSegment {
  requireCoeffCount(spec, [7]);
  const [a1, a2, a3, a4, a5, a6, a7] = spec.coeffs;

  // ∫Cp/R dT without a6, and ∫Cp/(RT) dT without a7 (Horner forms).
  const hPoly = (T: number): number => T * (a1 + T * (a2 / 2 + T * (a3 / 3 + T * (a4 / 4 + T * (a5 / 5)))));
  const sPoly = (T: number): number => a1 * Math.log(T) + T * (a2 + T * (a3 / 2 + T * (a4 / 3 + T * (a5 / 4))));

  return {
    model: 'nasa7',
    Tmin: spec.Tmin,
    Tmax: spec.Tmax,
    location: spec.location,
    cp: (T) => R * (a1 + T * (a2 + T * (a3 + T * (a4 + T * a5)))),
    intCp: (T) => R * hPoly(T),
    intCpOverT: (T) => R * sPoly(T),
    embedded: {
      H: (T) => R * (hPoly(T) + a6),
      S: (T) => R * (sPoly(T) + a7),
    },
  };
}

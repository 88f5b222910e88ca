// shomate: t = T/1000;
//   Cp  = A + B t + C t² + D t³ + E/t²                                   J/(mol K)
//   H° − H°298.15 = A t + B t²/2 + C t³/3 + D t⁴/4 − E/t + F − H         kJ/mol
//   S°  = A ln t + B t + C t²/2 + D t³/3 − E/(2t²) + G                   J/(mol K)
// Coefficients A…H in that order (the H coefficient is ΔfH°298 in kJ/mol). Seven coefficients
// (A…G) are accepted; without H the enthalpy constant F cannot be told apart from F − H, so no
// embedded enthalpy is offered and the segment carries no `embedded` at all (the type wants both).
// spec.unitFactor is not used: Shomate coefficients are in J, kJ, mol and K by definition.

import type { CpSegment, CpSpec } from '../types.js';
import { requireCoeffCount } from './validate.js';

export function buildShomate(spec: CpSpec): CpSegment {
  requireCoeffCount(spec, [7, 8]);
  const [A, B, C, D, E, F, G] = spec.coeffs;
  const hasH = spec.coeffs.length === 8;

  // The polynomial part of H(T) in kJ/mol, without F.
  const hPoly = (t: number): number => t * (A + t * (B / 2 + t * (C / 3 + t * (D / 4)))) - E / t;
  // The S formula without G, J/(mol K).
  const sPoly = (t: number): number => A * Math.log(t) + t * (B + t * (C / 2 + t * (D / 3))) - E / (2 * t * t);

  const segment: CpSegment = {
    model: 'shomate',
    Tmin: spec.Tmin,
    Tmax: spec.Tmax,
    location: spec.location,
    cp(T) {
      const t = T / 1000;
      return A + t * (B + t * (C + t * D)) + E / (t * t);
    },
    intCp(T) {
      // dT = 1000 dt, so ∫Cp dT (J/mol) = 1000 ∫Cp dt
      return 1000 * hPoly(T / 1000);
    },
    intCpOverT(T) {
      // Cp/T dT = Cp/t dt
      return sPoly(T / 1000);
    },
  };
  if (hasH) {
    segment.embedded = {
      H: (T) => 1000 * (hPoly(T / 1000) + F), // absolute, on the ΔfH scale: H(298.15) ≈ H coefficient × 1000
      S: (T) => sPoly(T / 1000) + G,
    };
  }
  return segment;
}

// First-order propagation of the stated standard uncertainties into u(ln K).
//
// ln K(T) = −ΔrG°(T)/(RT), ΔrG°(T) = Σν_i [ΔfH°_i + ΔH_i(T) − T (S°_i + ΔS_i(T))]. The Cp integrals
// carry no stated uncertainty, so only the 298.15 K values enter, through whichever two values the
// species' route uses (see thermo.ts):
//   'HS': ∂lnK/∂ΔfH° = −ν/(RT)                     ∂lnK/∂S° = ν/R
//   'HG': S° = ΣS°el + (ΔfH° − ΔfG°)/T0  ->  ∂lnK/∂ΔfH° = −ν/(RT) + ν/(R T0),   ∂lnK/∂ΔfG° = −ν/(R T0)
//   'GS': ΔfH° = ΔfG° + T0 (S° − ΣS°el)  ->  ∂lnK/∂ΔfG° = −ν/(RT),   ∂lnK/∂S° = ν/R − ν T0/(RT)
// u(ln K)² = Σ_i Σ_x (∂lnK/∂x_i · u(x_i))², inputs taken as uncorrelated. An uncertainty the table
// does not state counts as zero, so u(ln K) is a lower bound when some are missing; it is reported
// only when at least one species of the reaction states one that the route uses.
import { R_J_PER_MOL_K, T_REF_K } from '../cp/constants.js';
import type { ResolvedReaction } from './reactions.js';
import type { SpeciesThermo } from './thermo.js';

export type Field = 'dHf' | 'dGf' | 'S';

/** ∂ln K/∂x for each value x the species' route uses, per unit SI (J/mol or J/(mol K)), at T, for coefficient ν. */
export function lnKSensitivity(th: SpeciesThermo, nu: number, T: number): Partial<Record<Field, number>> {
  const R = R_J_PER_MOL_K;
  switch (th.route) {
    case 'HS':
      return { dHf: -nu / (R * T), S: nu / R };
    case 'HG':
      return { dHf: -nu / (R * T) + nu / (R * T_REF_K), dGf: -nu / (R * T_REF_K) };
    case 'GS':
      return { dGf: -nu / (R * T), S: nu / R - (nu * T_REF_K) / (R * T) };
  }
}

/** Which formation values a species' route reads (the others do not move its ln K). */
export function fieldsUsed(th: SpeciesThermo): Field[] {
  return th.route === 'HS' ? ['dHf', 'S'] : th.route === 'HG' ? ['dHf', 'dGf'] : ['dGf', 'S'];
}

export interface UncertaintyAtT {
  u: number;
  /** variance contributed by each species (its label), same order as the reaction's terms */
  variance: { species: string; variance: number }[];
}

/** u(ln K) at T and each species' share of the variance; undefined when no used uncertainty is stated. */
export function uncertaintyAt(r: ResolvedReaction, T: number): UncertaintyAtT | undefined {
  let any = false;
  let total = 0;
  const variance: UncertaintyAtT['variance'] = [];
  for (const { coeff, thermo } of r.terms) {
    const sens = lnKSensitivity(thermo, coeff, T);
    let v = 0;
    for (const f of Object.keys(sens) as Field[]) {
      const u = thermo.species.u[f];
      if (u === undefined) continue;
      any = true;
      v += (sens[f]! * u) ** 2;
    }
    variance.push({ species: thermo.label, variance: v });
    total += v;
  }
  return any ? { u: Math.sqrt(total), variance } : undefined;
}

/**
 * Species ranked by their share of u(ln K)² at the temperature where u(ln K) is largest (shares sum
 * to 1; ties keep equation order). Undefined when no uncertainty is stated.
 */
export function uncertaintyRanking(r: ResolvedReaction, temps: readonly number[]): { species: string; share: number }[] | undefined {
  let worst: UncertaintyAtT | undefined;
  for (const T of temps) {
    const u = uncertaintyAt(r, T);
    if (u && (!worst || u.u > worst.u)) worst = u;
  }
  if (!worst || worst.u === 0) return undefined;
  const total = worst.u ** 2;
  return worst.variance
    .map((v, i) => ({ species: v.species, share: v.variance / total, i }))
    .sort((a, b) => b.share - a.share || a.i - b.i)
    .map(({ species, share }) => ({ species, share }));
}

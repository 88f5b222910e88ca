// What the equilibrium stage needs of one species, computed once: ΔfH° and S° at 298.15 K (the third
// of ΔfH°, ΔfG°, S° derived when only two are given), and its Cp curve.
//
// Which two values the route uses:
//   ΔfH° and S° given        -> used as given ('HS'); ΔfG° is not used (its consistency is the
//                               Gibbs–Helmholtz rule's business)
//   ΔfH° and ΔfG°, no S°     -> S° = Σν·S°(elements) + (ΔfH° − ΔfG°)/298.15 ('HG')
//   ΔfG° and S°, no ΔfH°     -> ΔfH° = ΔfG° + 298.15·(S° − Σν·S°(elements)) ('GS')
// An element in its reference state with ΔfH° (or ΔfG°) left blank takes 0, its value by definition.
import { elementEntropySum, isReferenceState } from '../chemistry/reference.js';
import { speciesCp } from '../cp/curve-cache.js';
import { T_REF_K } from '../cp/constants.js';
import type { CpCurve, ReferenceData, Species } from '../types.js';

export type ValueRoute = 'HS' | 'HG' | 'GS';

export interface SpeciesThermo {
  species: Species;
  /** label for tables and points: the name, with the phase added unless the name already carries it */
  label: string;
  route: ValueRoute;
  dHf: number; // J/mol, as used
  S: number; // J/(mol K), as used
  /** ΔfG° used by the 'HG' and 'GS' routes, J/mol */
  dGf?: number;
  /** Σν·S°(elements), J/(mol K), when the route needed it */
  elementS?: number;
  /** undefined when the species has no usable Cp correlation */
  curve?: CpCurve;
}

export type ThermoProblem = { problem: 'incomplete'; have: string } | { problem: 'no-element-entropy' };

/** Formation values that replace the species' own (SI units), for what-if computations. */
export interface ValueOverride {
  dHf?: number;
  dGf?: number;
  S?: number;
}

export function speciesLabel(sp: Species): string {
  const m = /\(([^()]*)\)\s*$/.exec(sp.name);
  return m && m[1]!.split(/[,\s]+/).includes(sp.phase) ? sp.name : `${sp.name}(${sp.phase})`;
}

/**
 * The species' Cp ranges joined into one curve, or undefined if it has none usable. Shared with the Cp
 * rules through pipeline/cp/curve-cache.ts, so each species' curve is built once per run.
 */
export function curveOf(sp: Species): CpCurve | undefined {
  return speciesCp(sp)?.curve;
}

/** Builds the thermo record, or says why it cannot be (which values are missing). */
export function thermoOf(sp: Species, ref: ReferenceData, override: ValueOverride = {}): SpeciesThermo | ThermoProblem {
  let dHf = override.dHf ?? sp.dHf;
  let dGf = override.dGf ?? sp.dGf;
  let S = override.S ?? sp.S;
  if ((dHf === undefined || dGf === undefined) && isReferenceState(sp.formula, sp.phase, sp.state, ref)) {
    dHf ??= 0;
    dGf ??= 0;
  }
  const base = { species: sp, label: speciesLabel(sp), curve: curveOf(sp) };
  if (dHf !== undefined && S !== undefined) return { ...base, route: 'HS', dHf, S };
  const have = [dHf !== undefined ? 'ΔfH°' : '', dGf !== undefined ? 'ΔfG°' : '', S !== undefined ? 'S°' : ''].filter(Boolean);
  if (dGf === undefined || (dHf === undefined && S === undefined)) {
    return { problem: 'incomplete', have: have.length ? `only ${have.join(' and ')}` : 'none of them' };
  }
  const elementS = elementEntropySum(sp.formula, ref, sp.phase);
  if (elementS === undefined) return { problem: 'no-element-entropy' };
  if (dHf !== undefined) return { ...base, route: 'HG', dHf, dGf, S: elementS + (dHf - dGf) / T_REF_K, elementS };
  return { ...base, route: 'GS', dHf: dGf + T_REF_K * (S! - elementS), dGf, S: S!, elementS };
}

export function isThermo(t: SpeciesThermo | ThermoProblem): t is SpeciesThermo {
  return (t as ThermoProblem).problem === undefined;
}

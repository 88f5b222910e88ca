// ln K(T) of a balanced reaction, by the rigorous route and by the constant-ΔrH° shortcut.
//
// Rigorous: for each species, H(T) = ΔfH°298 + [H(T) − H(298.15)] and S(T) = S°298 + [S(T) − S(298.15)],
// the brackets integrated exactly from its Cp curve (pipeline/cp); ΔrH° = Σν H, ΔrS° = Σν S,
// ΔrG° = ΔrH° − T ΔrS°, ln K = −ΔrG°/(RT). The element terms of the formation enthalpies cancel in a
// balanced reaction, so Σν ΔfH° + Σν [H(T) − H(298.15)] is ΔrH°(T) without element Cp data.
// Shortcut: ln K(T) = ln K(298.15) − (ΔrH°298/R)(1/T − 1/298.15), i.e. ΔrCp = 0.
//
// A species without any usable Cp correlation leaves ΔrCp unknown. Setting that species' Cp to zero
// would bias ΔrCp by its whole heat capacity (for 2 NH3 in ammonia synthesis, about 90 J/(mol K)),
// which is worse than neglecting ΔrCp altogether, since the products' and reactants' Cp largely
// cancel. So such a reaction is computed with ΔrCp = 0 throughout: ln K equals the shortcut, ΔrH° and
// ΔrS° are their 298.15 K values, and each point lists the species in `cpMissing`.
import { R_J_PER_MOL_K, T_REF_K } from '../cp/constants.js';
import { excerpt } from '../errors.js';
import { makeFinding } from '../rules/finding.js';
import type { Finding, ReactionPoint, ReactionResult } from '../types.js';
import type { ResolvedReaction } from './reactions.js';
import { reactionData, reactionExtrapolation } from './rules.js';
import { fieldsUsed, uncertaintyAt, uncertaintyRanking } from './uncertainty.js';

/** A ReactionPoint plus the species whose missing Cp forced ΔrCp = 0 (absent when the route is rigorous). */
export interface EquilibriumPoint extends ReactionPoint {
  cpMissing?: string[];
}

/** ΔrH°298 (J/mol) and ΔrS°298 (J/(mol K)). */
export function reactionAt298(r: ResolvedReaction): { dH: number; dS: number } {
  let dH = 0;
  let dS = 0;
  for (const { coeff, thermo } of r.terms) {
    dH += coeff * thermo.dHf;
    dS += coeff * thermo.S;
  }
  return { dH, dS };
}

/** ln K by the constant-ΔrH° route from 298.15 K. */
export function lnKShortcut(dH298: number, dS298: number, T: number): number {
  const R = R_J_PER_MOL_K;
  const lnK298 = -(dH298 - T_REF_K * dS298) / (R * T_REF_K);
  return lnK298 - (dH298 / R) * (1 / T - 1 / T_REF_K);
}

/** The species of a reaction that have no usable Cp correlation (labels). */
export function cpMissing(r: ResolvedReaction): string[] {
  return r.terms.filter((t) => !t.thermo.curve).map((t) => t.thermo.label);
}

/**
 * ΔrH°(T) [kJ/mol], ΔrS°(T) [J/(mol K)], ΔrG°(T) [kJ/mol], ln K by both routes, u(ln K) from the
 * stated uncertainties, and the species whose Cp is extrapolated at each T (kelvin outside every
 * fitted range, and the Cp the correlation gives there).
 */
export function computeReaction(r: ResolvedReaction, temps: readonly number[] = r.temps, opts: { cpMissingOnPoints?: boolean } = { cpMissingOnPoints: true }): EquilibriumPoint[] {
  const R = R_J_PER_MOL_K;
  const at298 = reactionAt298(r);
  const missing = cpMissing(r);
  const stated = r.terms.some((t) => fieldsUsed(t.thermo).some((f) => t.thermo.species.u[f] !== undefined));
  const points: EquilibriumPoint[] = [];
  for (const T of temps) {
    let dH = at298.dH;
    let dS = at298.dS;
    const extrapolated: ReactionPoint['extrapolated'] = [];
    if (missing.length === 0) {
      for (const { coeff, thermo } of r.terms) {
        const c = thermo.curve!;
        dH += coeff * c.dH(T);
        dS += coeff * c.dS(T);
        const out = c.outside(T);
        if (out > 0) extrapolated.push({ species: thermo.label, outsideK: out, cp: c.cp(T) });
      }
    } else {
      for (const { thermo } of r.terms) {
        const c = thermo.curve;
        const out = c ? c.outside(T) : 0;
        if (c && out > 0) extrapolated.push({ species: thermo.label, outsideK: out, cp: c.cp(T) });
      }
    }
    const dG = dH - T * dS;
    const p: EquilibriumPoint = {
      T,
      lnK: -dG / (R * T),
      lnKShortcut: lnKShortcut(at298.dH, at298.dS, T),
      dG: dG / 1000,
      dH: dH / 1000,
      dS,
      extrapolated,
    };
    const u = stated ? uncertaintyAt(r, T) : undefined;
    if (u) p.u_lnK = u.u;
    if (missing.length && opts.cpMissingOnPoints) p.cpMissing = missing;
    points.push(p);
  }
  return points;
}

/**
 * The report entry of a computed reaction: its points and the uncertainty ranking. `cpMissing` is put
 * on the points only when asked (the report schema's points do not carry it yet; the reaction-data
 * cp-missing finding says the same at the reaction's line).
 */
export function reactionResult(r: ResolvedReaction, opts: { cpMissingOnPoints?: boolean } = {}): ReactionResult {
  const result: ReactionResult = { id: r.id, equation: r.equation, file: r.file, line: r.line, balanced: true, points: computeReaction(r, r.temps, opts) };
  const ranking = uncertaintyRanking(r, r.temps);
  if (ranking) result.uncertaintyRanking = ranking;
  return result;
}

const fmtT = (T: number): string => String(Number(T.toPrecision(6)));

/**
 * Findings about how a computed reaction's species data are used: a Cp extrapolated at some of its
 * temperatures (warning, one per species, naming those temperatures), a species with no Cp at all
 * (warning: the reaction fell back to ΔrCp = 0). Located at the reaction's line; they name the species.
 */
export function reactionDataFindings(r: ResolvedReaction): Finding[] {
  const out: Finding[] = [];
  const where = { file: r.file, line: r.line, field: 'equation' };
  const id = excerpt(r.id);
  for (const { thermo } of r.terms) {
    const ids = { species: thermo.species.name, phase: thermo.species.phase };
    const c = thermo.curve;
    if (!c) {
      out.push(makeFinding(reactionData, 'cp-missing', { id, species: thermo.label }, where, { ...ids, severity: 'warning' }));
      continue;
    }
    const refOut = c.outside(T_REF_K);
    if (refOut > 0 && r.temps.some((T) => T !== T_REF_K)) {
      out.push(makeFinding(reactionExtrapolation, 'reference-outside', { id, species: thermo.label, Tmin: c.Tmin, Tmax: c.Tmax, outsideK: Number(refOut.toPrecision(6)) }, where, ids));
    }
    const outside = r.temps.filter((T) => c.outside(T) > 0);
    if (outside.length === 0) continue;
    let worst = outside[0]!;
    for (const T of outside) if (c.outside(T) > c.outside(worst)) worst = T;
    const shown = outside.length > 6 ? [...outside.slice(0, 3).map(fmtT), '…', ...outside.slice(-2).map(fmtT)] : outside.map(fmtT);
    out.push(
      makeFinding(
        reactionExtrapolation,
        'outside',
        { id, species: thermo.label, Tmin: c.Tmin, Tmax: c.Tmax, temps: shown.join(', '), outsideK: Number(c.outside(worst).toPrecision(6)), cp: Number(c.cp(worst).toPrecision(5)), T_K: worst },
        where,
        ids,
      ),
    );
  }
  return out;
}

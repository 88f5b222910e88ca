// The equilibrium stage: reactions in, ln K tables and findings out; then the cost of each finding.
//
//   const { reactions: specs, findings } = loadReactions(path);           // or reactionFromEquation(...)
//   const eq = runEquilibrium(specs, species, reference, useWindow);      // results for the report
//   impactOfFindings(allFindings, eq.resolved);                           // sets finding.impact
import type { Finding, ReactionResult, ReferenceData, Species, UseWindow } from '../types.js';
import type { SpeciesList } from '../species-list.js';
import { reactionDataFindings, reactionResult } from './lnk.js';
import { resolveReactions, type ReactionSpec, type ResolvedReaction, type SpeciesIndex } from './reactions.js';

export { parseEquation, EquationError, type EquationTerm, type ParsedEquation } from './equation.js';
export { loadReactions, reactionFromEquation, resolveReactions, matchTerm, SpeciesIndex, type ReactionSpec, type ResolvedReaction, type ResolvedTerm, type ResolveOutcome } from './reactions.js';
export { computeReaction, reactionResult, reactionAt298, lnKShortcut, reactionDataFindings, type EquilibriumPoint } from './lnk.js';
export { uncertaintyAt, uncertaintyRanking, lnKSensitivity } from './uncertainty.js';
export { impactOfFindings, DEFAULT_UNCERTAINTY, frozenDH, frozenDS } from './impact.js';
export { reactionTemperatures, windowGrid } from './temperatures.js';
export { thermoOf, curveOf, speciesLabel, type SpeciesThermo } from './thermo.js';
export { EQUILIBRIUM_RULES } from './rules.js';

export interface EquilibriumOutcome {
  /** one per reaction spec, input order; reactions that could not be computed have balanced/points telling why */
  results: ReactionResult[];
  /** the computed reactions, for impactOfFindings */
  resolved: ResolvedReaction[];
  /** resolution, balance, data and extrapolation findings, each at its reaction's file and line */
  findings: Finding[];
}

/**
 * Resolves, balances and computes every reaction at its temperatures (its own, else the use window's).
 * opts.cpMissingOnPoints: list, on each point, the species without Cp that forced ΔrCp = 0 (off by
 * default: schemas/report.schema.json does not allow it on points; schemas/reactions.schema.json does).
 */
export function runEquilibrium(
  specs: readonly ReactionSpec[],
  species: readonly Species[] | SpeciesList | SpeciesIndex,
  reference: ReferenceData,
  window: UseWindow = {},
  opts: { cpMissingOnPoints?: boolean } = {},
): EquilibriumOutcome {
  const { resolved, results, findings } = resolveReactions(specs, species, reference, window);
  const byId = new Map(resolved.map((r) => [r.id, r]));
  for (let i = 0; i < results.length; i++) {
    const r = byId.get(results[i]!.id);
    if (!r || r.line !== results[i]!.line || r.file !== results[i]!.file) continue;
    results[i] = reactionResult(r, opts);
    findings.push(...reactionDataFindings(r));
  }
  return { results, resolved, findings };
}

// The species of a run as the rules and the report read them: in a stable order (name, then phase),
// with the few fields a whole-table pass needs readable by index, and each full Species built on
// request. A million-row table folds into ~6·10^5 species; the store (records.ts) keeps them in
// columns and `at(i)` builds one Species object at a time, so a pass over the table must not keep the
// objects it is handed: keep indices (or the numbers you need) and call `at` again later.
import type { Formula, Phase, Species } from './types.js';

export interface SpeciesList {
  readonly length: number;
  /** species i, built afresh on every call: read it and let it go */
  at(i: number): Species;
  name(i: number): string;
  phase(i: number): Phase;
  formula(i: number): Formula;
  /** S° in J/(mol K), as the species record takes it (its first row giving one) */
  S(i: number): number | undefined;
  /** number of Cp ranges */
  cpCount(i: number): number;
}

/** A list over Species objects already in memory (small tables, tests). */
export function arrayList(species: readonly Species[]): SpeciesList {
  return {
    length: species.length,
    at: (i) => species[i]!,
    name: (i) => species[i]!.name,
    phase: (i) => species[i]!.phase,
    formula: (i) => species[i]!.formula,
    S: (i) => species[i]!.S,
    cpCount: (i) => species[i]!.cp.length,
  };
}

export function asSpeciesList(species: readonly Species[] | SpeciesList): SpeciesList {
  return Array.isArray(species) ? arrayList(species) : (species as SpeciesList);
}

/** `${name}|${phase}`, the key findings, charts and reactions use for a species. */
export function speciesKey(list: SpeciesList, i: number): string {
  return `${list.name(i)}|${list.phase(i)}`;
}

// Rules that judge species against each other need the whole species list, not one species at a time.
// The shared Rule type (types.ts) has only the per-species `check`; these rules add `checkAll`.
import type { CheckContext, Finding, Rule, Species } from '../types.js';
import type { SpeciesList } from '../species-list.js';

export interface DatasetRule extends Rule {
  /** all species of the run, in list order -> findings; keeps indices, not the Species objects `at` builds */
  checkAll(species: SpeciesList, ctx: CheckContext): Finding[];
}

export function isDatasetRule(r: Rule): r is DatasetRule {
  return typeof (r as Partial<DatasetRule>).checkAll === 'function';
}

/** The row a species takes its value of `field` from (records.ts keeps the first row that gives it). */
export function rowGiving(sp: Species, field: 'dHf' | 'dGf' | 'S') {
  return sp.values.find((v) => v[field] !== undefined);
}

// The registry: every rule thermovet runs, in the order a reader meets them.
// Row rules are raised while a table is read; species rules run over each folded species.
import type { Rule } from '../types.js';
import { isDatasetRule, type DatasetRule } from './dataset.js';
import { rule as unreadableRow } from './unreadable-row.js';
import { rule as missingField } from './missing-field.js';
import { rule as badNumber } from './bad-number.js';
import { rule as badPhase } from './bad-phase.js';
import { rule as badFormula } from './bad-formula.js';
import { rule as badCpSpec } from './bad-cp-spec.js';
import { rule as unknownColumn } from './unknown-column.js';
import { rule as duplicateRow } from './duplicate-row.js';
import { rule as conflictingValues } from './conflicting-values.js';
import { rule as incompleteSpecies } from './incomplete-species.js';
import { rule as referenceElements } from './reference-elements.js';
import { rule as gibbsHelmholtz } from './gibbs-helmholtz.js';
import { rule as crossSource } from './cross-source.js';
import { rule as familyTrend } from './family-trend.js';
import { rule as entropyAtoms } from './entropy-atoms.js';
import { rule as cpPositive } from './cp-positive.js';
import { rule as cpGasBounds } from './cp-gas-bounds.js';
import { rule as cpSolidBounds } from './cp-solid-bounds.js';
import { rule as cpWiggles } from './cp-wiggles.js';
import { rule as cpJoins } from './cp-joins.js';
import { rule as cpCoverage } from './cp-coverage.js';
import { rule as cpEmbeddedConstants } from './cp-embedded-constants.js';
import { rule as standardPressure } from './standard-pressure.js';
import { rule as waiverExpired } from './waiver-expired.js';
import { rule as waiverUnmatched } from './waiver-unmatched.js';
import { EQUILIBRIUM_RULES } from '../equilibrium/rules.js';

export const RULES: readonly Rule[] = [
  unreadableRow,
  missingField,
  badNumber,
  badPhase,
  badFormula,
  badCpSpec,
  unknownColumn,
  duplicateRow,
  conflictingValues,
  incompleteSpecies,
  referenceElements,
  gibbsHelmholtz,
  crossSource,
  // dataset rules: judged over the whole species list (checkAll), see DATASET_RULES
  familyTrend,
  entropyAtoms,
  standardPressure,
  cpPositive,
  cpGasBounds,
  cpSolidBounds,
  cpWiggles,
  cpJoins,
  cpCoverage,
  cpEmbeddedConstants,
  // raised while reactions are read, resolved and computed (pipeline/equilibrium)
  ...EQUILIBRIUM_RULES,
  // raised when a waivers file is applied to the finished findings (pipeline/waivers.ts)
  waiverExpired,
  waiverUnmatched,
];

export const SPECIES_RULES: readonly Rule[] = RULES.filter((r) => r.check !== undefined);

/** Rules that compare species with each other; check() runs them once over the whole species list. */
export const DATASET_RULES: readonly DatasetRule[] = RULES.filter(isDatasetRule);

export function ruleById(id: string): Rule | undefined {
  return RULES.find((r) => r.id === id);
}

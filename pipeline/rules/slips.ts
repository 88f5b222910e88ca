// Known slips that turn a good value into a bad one, and the search for the one that explains a residual.
// The factors come from the unit table, not from magic numbers.
import { ATM_BAR, CAL_J, R_J_PER_MOL_K } from '../units/table.js';
import type { Phase } from '../types.js';

export interface Slip {
  cause: string;
  /** words for messages: "{field} looks like …", in the field's own kind of unit */
  words(field: 'dHf' | 'dGf' | 'S'): string;
  /** the value it should have been, from the value as given (SI) */
  correct(valueSI: number, phase: Phase): number;
  fields: readonly ('dHf' | 'dGf' | 'S')[];
}

const ALL = ['dHf', 'dGf', 'S'] as const;

/** "kcal/mol" for an energy, "cal/(mol K)" for an entropy. */
function e(field: 'dHf' | 'dGf' | 'S', energyPrefix: string, entropyPrefix = energyPrefix.replace(/^k/, '')): string {
  return field === 'S' ? `${entropyPrefix}/(mol K)` : `${energyPrefix}/mol`;
}

export const SLIPS: readonly Slip[] = [
  { cause: 'J-read-as-kJ', words: (f) => `${e(f, 'J')} entered where ${e(f, 'kJ')} was declared (1000× too large)`, correct: (v) => v / 1000, fields: ALL },
  { cause: 'kJ-read-as-J', words: (f) => `${e(f, 'kJ')} entered where ${e(f, 'J')} was declared (1000× too small)`, correct: (v) => v * 1000, fields: ALL },
  { cause: 'cal-read-as-J', words: (f) => `${e(f, 'kcal', 'cal')} read as ${e(f, 'kJ', 'J')} (4.184× too small)`, correct: (v) => v * CAL_J, fields: ALL },
  { cause: 'J-read-as-cal', words: (f) => `${e(f, 'kJ', 'J')} read as ${e(f, 'kcal', 'cal')} (4.184× too large)`, correct: (v) => v / CAL_J, fields: ALL },
  { cause: 'sign', words: () => 'a sign slip', correct: (v) => -v, fields: ALL },
  {
    // a gas entropy on the old 1 atm standard state is lower by R ln(1.01325/1) than on the 1 bar state
    cause: 'atm-vs-bar',
    words: () => 'an entropy on the 1 atm standard state rather than 1 bar',
    correct: (v, phase) => (phase === 'g' ? v + R_J_PER_MOL_K * Math.log(ATM_BAR) : v),
    fields: ['S'],
  },
];

export interface SlipFit {
  slip: Slip;
  field: 'dHf' | 'dGf' | 'S';
  correctedSI: number;
  residualAfterJ: number;
}

/**
 * Tries every slip on every field; returns the one whose correction brings |residual| lowest,
 * provided it gets below `explainedJ`. `residualOf` recomputes the residual with one field replaced.
 */
export function explainResidual(
  values: { dHf: number; dGf: number; S: number },
  phase: Phase,
  residualOf: (v: { dHf: number; dGf: number; S: number }) => number,
  explainedJ: number,
): SlipFit | undefined {
  let best: SlipFit | undefined;
  for (const slip of SLIPS) {
    for (const field of slip.fields) {
      const correctedSI = slip.correct(values[field], phase);
      if (correctedSI === values[field]) continue;
      const residualAfterJ = residualOf({ ...values, [field]: correctedSI });
      if (Math.abs(residualAfterJ) <= explainedJ && (!best || Math.abs(residualAfterJ) < Math.abs(best.residualAfterJ))) {
        best = { slip, field, correctedSI, residualAfterJ };
      }
    }
  }
  return best;
}

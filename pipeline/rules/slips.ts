// Known slips that turn a good value into a bad one, and the search for the one that explains a residual.
// The factors come from the unit table, not from magic numbers.
import { ATM_BAR, CAL_J, R_J_PER_MOL_K } from '../units/table.js';
import type { Phase } from '../types.js';

export interface Slip {
  cause: string;
  /** words for messages: "{field} looks like …", in terms of the unit declared for the field */
  words(field: 'dHf' | 'dGf' | 'S', declared?: string): string;
  /** the value it should have been, from the value as given (SI) */
  correct(valueSI: number, phase: Phase): number;
  fields: readonly ('dHf' | 'dGf' | 'S')[];
}

const ALL = ['dHf', 'dGf', 'S'] as const;

/** The declared unit, or the column's default when the table declares none. */
const unitOf = (field: 'dHf' | 'dGf' | 'S', declared?: string): string => declared || (field === 'S' ? 'J/(mol K)' : 'kJ/mol');

/** The unit 1000× smaller (kJ/mol -> J/mol, kcal/mol -> cal/mol, J/(mol K) -> mJ/(mol K)). */
const thousandth = (u: string): string => (u.startsWith('k') ? u.slice(1) : `m${u}`);
/** The unit 1000× larger (J/mol -> kJ/mol, cal/(mol K) -> kcal/(mol K), kJ/mol -> MJ/mol). */
const thousandfold = (u: string): string => (u.startsWith('k') ? `M${u.slice(1)}` : `k${u}`);

export const SLIPS: readonly Slip[] = [
  {
    cause: 'J-read-as-kJ',
    words: (f, d) => `${thousandth(unitOf(f, d))} entered where ${unitOf(f, d)} was declared (1000× too large)`,
    correct: (v) => v / 1000,
    fields: ALL,
  },
  {
    cause: 'kJ-read-as-J',
    words: (f, d) => `${thousandfold(unitOf(f, d))} entered where ${unitOf(f, d)} was declared (1000× too small)`,
    correct: (v) => v * 1000,
    fields: ALL,
  },
  {
    cause: 'cal-read-as-J',
    words: (f, d) => {
      const u = unitOf(f, d);
      return u.includes('cal') ? `a value 4.184× too small for ${u}` : `${u.replace('J', 'cal')} read as ${u} (4.184× too small)`;
    },
    correct: (v) => v * CAL_J,
    fields: ALL,
  },
  {
    cause: 'J-read-as-cal',
    words: (f, d) => {
      const u = unitOf(f, d);
      return u.includes('cal') ? `${u.replace('cal', 'J')} read as ${u} (4.184× too large)` : `a value 4.184× too large for ${u}`;
    },
    correct: (v) => v / CAL_J,
    fields: ALL,
  },
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
  // When zero leaves the residual as small (a value the convention sets to 0, such as S° of H+(aq)),
  // a correction that only shrinks the value towards zero cannot be told from "this should be 0".
  const zeroFits = { dHf: false, dGf: false, S: false };
  for (const field of ['dHf', 'dGf', 'S'] as const) zeroFits[field] = Math.abs(residualOf({ ...values, [field]: 0 })) <= explainedJ;
  for (const slip of SLIPS) {
    for (const field of slip.fields) {
      const correctedSI = slip.correct(values[field], phase);
      if (correctedSI === values[field]) continue;
      if (zeroFits[field] && Math.abs(correctedSI) < Math.abs(values[field])) continue;
      const residualAfterJ = residualOf({ ...values, [field]: correctedSI });
      if (Math.abs(residualAfterJ) <= explainedJ && (!best || Math.abs(residualAfterJ) < Math.abs(best.residualAfterJ))) {
        best = { slip, field, correctedSI, residualAfterJ };
      }
    }
  }
  return best;
}

// Rows of the same species and phase from the same source give different formation values or formulas.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'conflicting-values',
  severity: 'error',
  docs: 'docs/rules/conflicting-values.md',
  description: 'Rows of the same species and phase from the same source give different formation values or formulas.',
  messages: {
    value: '{field} = {value} {unit} differs from {first} {unit} given for the same species on line {firstLine} (same source)',
    formula: 'formula {formula} differs from {first} given for the same species on line {firstLine}',
  },
};

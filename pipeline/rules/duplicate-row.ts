// A row that repeats an earlier row of the same species and phase exactly (same values, same Cp range).
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'duplicate-row',
  severity: 'warning',
  docs: 'docs/rules/duplicate-row.md',
  description: 'A row that repeats an earlier row of the same species and phase exactly (same values, same Cp range).',
  messages: {
    repeat: 'row repeats line {firstLine} of {firstFile} ({species}, {phase})',
  },
};

// A waiver that matches no finding: the defect was fixed, or the waiver names the wrong rule, species or line.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'waiver-unmatched',
  severity: 'warning',
  docs: 'docs/rules/waiver-unmatched.md',
  description: 'A waiver that matches no finding of this run: remove it, or correct its rule, species, file or line.',
  messages: {
    unmatched: 'waiver for {rule} on {target} matches no finding; remove it or correct it',
  },
};

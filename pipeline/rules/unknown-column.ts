// A header that is not a thermovet column; its values are ignored.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'unknown-column',
  severity: 'info',
  docs: 'docs/rules/unknown-column.md',
  description: 'A header that is not a thermovet column; its values are ignored.',
  messages: {
    ignored: 'column "{header}" is not a thermovet column and is ignored',
  },
};

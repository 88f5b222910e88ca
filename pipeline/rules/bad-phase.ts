// The phase is not one of g, l, cr, aq.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'bad-phase',
  severity: 'error',
  docs: 'docs/rules/bad-phase.md',
  description: 'The phase is not one of g, l, cr, aq.',
  messages: {
    unknown: 'phase "{text}" is not one of g, l, cr, aq',
  },
};

// The chemical formula cannot be parsed: unknown element symbols, unbalanced parentheses, stray characters.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'bad-formula',
  severity: 'error',
  docs: 'docs/rules/bad-formula.md',
  description: 'The chemical formula cannot be parsed: unknown element symbols, unbalanced parentheses, stray characters.',
  messages: {
    parse: 'formula "{text}" cannot be read: {detail}',
    mismatch: 'formula "{text}" has elements {formulaElements}, but the species name "{name}" reads as {nameElements}',
  },
};

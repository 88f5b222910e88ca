// A numeric field that is not a plain finite decimal number (empty, hexadecimal, trailing text, thousands separators, NaN, Infinity, overflow).
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'bad-number',
  severity: 'error',
  docs: 'docs/rules/bad-number.md',
  description: 'A numeric field that is not a plain finite decimal number (empty, hexadecimal, trailing text, thousands separators, NaN, Infinity, overflow).',
  messages: {
    notNumber: 'field {field} is not a number: "{text}"',
    notFinite: 'field {field} is not a finite number: "{text}"',
    negative: 'field {field} must not be negative: {text}',
    nonPositiveT: 'field {field} is an absolute temperature of {value} K; it must be above 0 K',
  },
};

// A field the row needs is empty or absent.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'missing-field',
  severity: 'error',
  docs: 'docs/rules/missing-field.md',
  description: 'A field the row needs is empty or absent.',
  messages: {
    missing: 'required field {field} is empty',
    cpModel: 'Cp coefficients are given but cp_model is empty',
    cpRange: 'Cp model {model} needs cp_Tmin and cp_Tmax',
    nothing: 'row carries neither formation values (dHf, dGf, S) nor a Cp correlation',
  },
};

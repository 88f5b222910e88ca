// A Cp correlation that does not fit its model: unknown model, wrong number of coefficients or exponents, validity range with Tmin >= Tmax.
import type { Rule } from '../types.js';

export const rule: Rule = {
  id: 'bad-cp-spec',
  severity: 'error',
  docs: 'docs/rules/bad-cp-spec.md',
  description: 'A Cp correlation that does not fit its model: unknown model, wrong number of coefficients or exponents, validity range with Tmin >= Tmax.',
  messages: {
    unknownModel: 'cp_model "{text}" is not one of poly, shomate, nasa7, nasa9, table',
    invalid: 'cp_model {model}: {detail}',
    exponents: 'poly has {coeffs} coefficients but {exponents} exponents',
    tableTemps: 'table has {coeffs} Cp values but {temps} temperatures (need at least 2, ascending)',
    range: 'validity range cp_Tmin = {Tmin} K is not below cp_Tmax = {Tmax} K',
    tooMany: '{species} already has {max} Cp ranges; this range is not used (no published correlation needs that many)',
    unit: 'cp_unit "{text}" is not one of J/(mol K), cal/(mol K), R',
  },
};

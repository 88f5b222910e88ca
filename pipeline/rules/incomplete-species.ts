// A species whose formation values are incomplete: with ΔfH° and S° (or ΔfG°) it can enter ln K, but
// Gibbs–Helmholtz can only be checked when all three are given.
import type { Finding, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';

export const rule: Rule = {
  id: 'incomplete-species',
  severity: 'warning',
  docs: 'docs/rules/incomplete-species.md',
  description: 'A species without ΔfH°, ΔfG° and S° all given: what cannot be checked or computed.',
  messages: {
    unusable: '{species} has no {missing}: it cannot enter an equilibrium constant',
    unchecked: '{species} has no {missing}: Gibbs–Helmholtz consistency is not checked',
  },
};

rule.check = (sp: Species): Finding[] => {
  const missing = (['dHf', 'dGf', 'S'] as const).filter((f) => sp[f] === undefined);
  if (missing.length === 0) return [];
  const ids = { species: sp.name, phase: sp.phase };
  const usable = sp.dHf !== undefined && (sp.S !== undefined || sp.dGf !== undefined);
  const params = { species: sp.name, missing: missing.join(', ') };
  // the first missing field, and its column when the table has one, so an empty cell is found at once
  const field = missing[0]!;
  const at = sp.columns[field] === undefined ? { ...sp.location, field } : { ...sp.location, column: sp.columns[field], field };
  return [usable ? makeFinding(rule, 'unchecked', params, at, { ...ids, severity: 'info' }) : makeFinding(rule, 'unusable', params, at, ids)];
};

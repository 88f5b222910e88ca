// Elements in their reference state have ΔfH° = ΔfG° = 0 by definition; the same element in any other
// state (O(g), O3(g), C(cr, diamond)) does not. The reference S° is compared with the shipped value.
import { elementOf, isReferenceState } from '../chemistry/reference.js';
import { toDeclared } from '../units/convert.js';
import type { CheckContext, Finding, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';

/** |ΔfH°| or |ΔfG°| above this (J/mol) is not zero: table values are rounded to 0.001 kJ/mol at best. */
const ZERO_J = 1;
/** S° of a reference element more than this far (J/(mol K)) from the shipped value is flagged; wider than
 *  the 0.109 J/(mol K) shift between the 1 atm and 1 bar standard states, so old tables are not flagged. */
const S_TOLERANCE = 0.5;

export const rule: Rule = {
  id: 'reference-elements',
  severity: 'error',
  docs: 'docs/rules/reference-elements.md',
  description: 'An element in its reference state must have ΔfH° = ΔfG° = 0; the element in any other state must not.',
  messages: {
    notZero: '{species} is {element} in its reference state ({state}), so {field} must be 0; it is {value} {unit}',
    zero: '{species} is {element} but not in its reference state ({state}), so {field} = 0 is wrong',
    entropy: 'S° = {value} J/(mol K) for {species}, the reference state of {element}; {source} gives {expected} J/(mol K)',
  },
};

rule.check = (sp: Species, ctx: CheckContext): Finding[] => {
  const element = elementOf(sp.formula);
  if (element === undefined || sp.formula.charge !== 0) return [];
  const ref = ctx.reference.elements[element];
  if (!ref) return [];
  const findings: Finding[] = [];
  const ids = { species: sp.name, phase: sp.phase };
  const at = (field: string) => ({ ...sp.location, column: sp.columns[field], field });
  const stateText = `${ref.state}, ${ref.phase}`;
  if (isReferenceState(sp.formula, sp.phase, sp.state, ctx.reference)) {
    for (const field of ['dHf', 'dGf'] as const) {
      const v = sp[field];
      if (v !== undefined && Math.abs(v) > ZERO_J) {
        const unit = sp.units[field] ?? 'kJ/mol';
        findings.push(makeFinding(rule, 'notZero', { species: sp.name, element, state: stateText, field, value: toDeclared(v, field, unit), unit }, at(field), ids));
      }
    }
    if (sp.S !== undefined && Math.abs(sp.S - ref.S) > S_TOLERANCE) {
      findings.push(
        makeFinding(rule, 'entropy', { species: sp.name, element, value: sp.S, expected: ref.S, source: ref.source }, at('S'), { ...ids, severity: 'warning' }),
      );
    }
    return findings;
  }
  for (const field of ['dHf', 'dGf'] as const) {
    const v = sp[field];
    if (v !== undefined && v === 0) {
      findings.push(makeFinding(rule, 'zero', { species: sp.name, element, state: `the reference is ${ref.species}`, field }, at(field), ids));
    }
  }
  return findings;
};

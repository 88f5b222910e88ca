// Crystalline solids: Cp near or below 3R per atom (Dulong–Petit, common practice). Flagged, as a
// warning, when Cp exceeds 1.25 × 3NR + 2 J/(mol K) somewhere in a range: real solids only get there
// close to a phase transition (λ-peaks, premelting) or from large electronic and vacancy terms in
// metals near melting, which a reviewer should confirm.
import { atomCount } from '../chemistry/formula.js';
import { R_J_PER_MOL_K as R } from '../cp/constants.js';
import { cpLocation, scanOf, speciesCp } from '../cp/curve-cache.js';
import type { Finding, Rule, Species } from '../types.js';
import { diagnoseUnitSlip } from './cp-gas-bounds.js';
import { makeFinding } from './finding.js';

/** Relative margin above 3NR: anharmonicity and Cp − Cv add some 5–15 % at high temperature. */
export const SOLID_RELATIVE_MARGIN = 0.25;
/** Absolute allowance, J/(mol K): the electronic γT term of a metal (γ ≈ 1–5 mJ/(mol K²)) at ~1000 K. */
export const SOLID_ABSOLUTE_ALLOWANCE = 2;

/** A rescaled Cp this small a fraction of 3NR somewhere in the range is not accepted as the explanation. */
const SLIP_FLOOR = 0.05;

/** 3NR and the value above which a solid's Cp is flagged, J/(mol K). */
export function solidLimit(atoms: number): { dulongPetit: number; limit: number } {
  const dulongPetit = 3 * R * atoms;
  return { dulongPetit, limit: dulongPetit * (1 + SOLID_RELATIVE_MARGIN) + SOLID_ABSOLUTE_ALLOWANCE };
}

export const rule: Rule = {
  id: 'cp-solid-bounds',
  severity: 'warning',
  docs: 'docs/rules/cp-solid-bounds.md',
  description: 'Crystalline-solid Cp should stay near or below 3R per atom (Dulong–Petit) except near phase transitions.',
  messages: {
    above:
      'solid Cp reaches {cp} J/(mol K) at {T} K, {ratio} × the Dulong–Petit value 3NR = {dulongPetit} J/(mol K) for {atoms} atom(s) (flagged above {limit}); only plausible near a phase transition',
    aboveDiagnosed:
      'solid Cp reaches {cp} J/(mol K) at {T} K, {ratio} × the Dulong–Petit value 3NR = {dulongPetit} J/(mol K); the coefficients look like {words}: with cp_unit = {unitFix}, Cp({atT} K) = {corrected} J/(mol K)',
  },
};

const r4 = (x: number): number => Number(x.toPrecision(4));

rule.check = (sp: Species): Finding[] => {
  if (sp.phase !== 'cr') return [];
  const atoms = atomCount(sp.formula);
  if (!(atoms > 0)) return [];
  const cp = speciesCp(sp);
  if (!cp) return [];
  const { dulongPetit, limit } = solidLimit(atoms);
  const ids = { species: sp.name, phase: sp.phase };
  const findings: Finding[] = [];
  for (const spec of cp.specs) {
    const { max } = scanOf(spec);
    if (max.cp <= limit) continue;
    const base = { cp: r4(max.cp), T: r4(max.T), ratio: r4(max.cp / dulongPetit), dulongPetit: r4(dulongPetit), limit: r4(limit), atoms };
    // a unit slip that brings the whole range below the limit, and not absurdly low, explains it
    const fix = diagnoseUnitSlip(spec, SLIP_FLOOR * dulongPetit, limit);
    if (fix) {
      const params = { ...base, words: fix.slip.words, unitFix: fix.slip.unitFix, atT: r4(fix.T), corrected: fix.diagnosis.corrected };
      const field = sp.columns.cp_unit !== undefined ? 'cp_unit' : 'cp_coeffs';
      findings.push(makeFinding(rule, 'aboveDiagnosed', params, cpLocation(sp, spec, field), { ...ids, diagnosis: fix.diagnosis }));
    } else {
      findings.push(makeFinding(rule, 'above', base, cpLocation(sp, spec, 'cp_coeffs'), ids));
    }
  }
  return findings;
};

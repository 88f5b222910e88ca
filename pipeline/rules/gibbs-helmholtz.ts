// Gibbs–Helmholtz at 298.15 K: ΔfG° must equal ΔfH° − T·ΔfS°, with ΔfS° = S° − Σν S°(elements in their
// reference states) (+ z/2 · S°(H2, g) for an aqueous ion of charge z, the H+(aq) convention).
import { elementEntropySum, isReferenceState } from '../chemistry/reference.js';
import { toDeclared } from '../units/convert.js';
import type { CheckContext, Finding, RowValues, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';
import { explainResidual } from './slips.js';

export const T_REF = 298.15;

export const rule: Rule = {
  id: 'gibbs-helmholtz',
  severity: 'error',
  docs: 'docs/rules/gibbs-helmholtz.md',
  description: 'ΔfG°, ΔfH° and S° at 298.15 K must satisfy ΔfG° = ΔfH° − T·ΔfS°.',
  messages: {
    residual: 'ΔfG° differs from ΔfH° − T·ΔfS° by {residual} kJ/mol (tolerance {tolerance} kJ/mol)',
    diagnosed:
      'ΔfG° differs from ΔfH° − T·ΔfS° by {residual} kJ/mol (tolerance {tolerance} kJ/mol); {field} looks like {words}: {field} = {corrected} {unit} leaves {residualAfter} kJ/mol',
  },
};

/** J/mol -> kJ/mol rounded to 0.001 kJ/mol, the resolution of published tables, for messages. */
const kJ3 = (J: number): number => Math.round(J) / 1000;

/** Residual ΔfG° − (ΔfH° − T·ΔfS°) in J/mol. */
export function gibbsResidual(v: { dHf: number; dGf: number; S: number }, elementS: number): number {
  return v.dGf - (v.dHf - T_REF * (v.S - elementS));
}

/** The complete (dHf, dGf, S) triples a species offers: each row that has all three, else the merged values. */
function triples(sp: Species): { v: { dHf: number; dGf: number; S: number }; row: RowValues; u: RowValues | Species['u'] }[] {
  const out = [];
  for (const row of sp.values) {
    if (row.dHf !== undefined && row.dGf !== undefined && row.S !== undefined) {
      out.push({ v: { dHf: row.dHf, dGf: row.dGf, S: row.S }, row, u: { dHf: row.u_dHf, dGf: row.u_dGf, S: row.u_S } });
    }
  }
  if (out.length === 0 && sp.dHf !== undefined && sp.dGf !== undefined && sp.S !== undefined) {
    out.push({ v: { dHf: sp.dHf, dGf: sp.dGf, S: sp.S }, row: sp.values[0] ?? { P_ref: sp.P_ref, source: '', location: sp.location }, u: sp.u });
  }
  return out;
}

rule.check = (sp: Species, ctx: CheckContext): Finding[] => {
  if (isReferenceState(sp.formula, sp.phase, sp.state, ctx.reference)) return []; // see reference-elements
  const elementS = elementEntropySum(sp.formula, ctx.reference, sp.phase);
  if (elementS === undefined) return [];
  const { gibbsErrorKJ, gibbsWarningKJ } = ctx.options.tolerances;
  const findings: Finding[] = [];
  for (const { v, row, u } of triples(sp)) {
    const r = gibbsResidual(v, elementS);
    // stated uncertainties widen the tolerance: u(r)² = u(ΔfG)² + u(ΔfH)² + (T·u(S))²
    const uR = Math.hypot(u.dGf ?? 0, u.dHf ?? 0, T_REF * (u.S ?? 0));
    const errorJ = Math.max(gibbsErrorKJ * 1000, 2 * uR);
    const warnJ = Math.max(gibbsWarningKJ * 1000, uR);
    const a = Math.abs(r);
    if (a <= warnJ) continue;
    const severity = a > errorJ ? 'error' : 'warning';
    const ids = { species: sp.name, phase: sp.phase, severity } as const;
    const base = { residual: kJ3(r), tolerance: kJ3(severity === 'error' ? errorJ : warnJ) };
    const fit = explainResidual(v, sp.phase, (x) => gibbsResidual(x, elementS), warnJ);
    if (!fit) {
      findings.push(makeFinding(rule, 'residual', base, { ...row.location, column: sp.columns.dGf, field: 'dGf' }, ids));
      continue;
    }
    const unit = sp.units[fit.field] ?? '';
    const corrected = toDeclared(fit.correctedSI, fit.field, unit);
    const params = { ...base, field: fit.field, words: fit.slip.words(fit.field, unit), corrected: Number(corrected.toPrecision(6)), unit, residualAfter: kJ3(fit.residualAfterJ) };
    findings.push(
      makeFinding(rule, 'diagnosed', params, { ...row.location, column: sp.columns[fit.field], field: fit.field }, {
        ...ids,
        diagnosis: { cause: fit.slip.cause, field: fit.field, corrected, unit, residualAfter: fit.residualAfterJ / 1000 },
      }),
    );
  }
  return findings;
};

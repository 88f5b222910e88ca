// Standard-state pressure: thermovet works on the 1 bar standard state (IUPAC since 1982). Values on the
// older 1 atm state differ for gases: S°(1 bar) = S°(1 atm) + R ln(1.01325) = S° + 0.109 J/(mol K).
import { R_J_PER_MOL_K } from '../cp/constants.js';
import { toDeclared } from '../units/convert.js';
import type { Finding, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';

export const rule: Rule = {
  id: 'standard-pressure',
  severity: 'warning',
  docs: 'docs/rules/standard-pressure.md',
  description: 'Values whose standard-state pressure is not 1 bar; for a gas, the S° on the 1 bar basis is given.',
  messages: {
    gas: 'values refer to P° = {P} bar, not 1 bar; on the 1 bar standard state S° = {corrected} J/(mol K) (+R ln(P°/1 bar))',
    condensed: 'values refer to P° = {P} bar, not 1 bar; for a {phase} phase the difference is negligible',
  },
};

rule.check = (sp: Species): Finding[] => {
  const findings: Finding[] = [];
  for (const v of sp.values) {
    if (Math.abs(v.P_ref - 1) < 1e-9) continue;
    const ids = { species: sp.name, phase: sp.phase };
    const at = { ...v.location, column: sp.columns.P_ref, field: 'P_ref' };
    if (sp.phase !== 'g' || v.S === undefined) {
      findings.push(makeFinding(rule, 'condensed', { P: v.P_ref, phase: sp.phase }, at, { ...ids, severity: 'info' }));
      continue;
    }
    const correctedSI = v.S + R_J_PER_MOL_K * Math.log(v.P_ref);
    const unit = sp.units.S ?? 'J/(mol K)';
    const corrected = Number(toDeclared(correctedSI, 'S', unit).toPrecision(7));
    findings.push(
      makeFinding(rule, 'gas', { P: v.P_ref, corrected: Number(correctedSI.toFixed(3)) }, at, {
        ...ids,
        diagnosis: { cause: 'atm-vs-bar', field: 'S', corrected, unit, residualAfter: 0 },
      }),
    );
  }
  return findings;
};

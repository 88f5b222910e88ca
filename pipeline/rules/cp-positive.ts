// Cp > 0 everywhere inside each declared range. The minimum is found by a dense scan refined by
// golden-section search (pipeline/cp/curve-cache.ts), not only at sample points.
// Aqueous species are exempt: the standard partial molar heat capacity of a solute is not a heat
// capacity of a substance and is often negative (most simple ions).
// Diagnosis: a range that starts at 100 K or below and whose Cp stays positive over the range moved up
// by 273.15 K looks like °C values read as K (see cp-gas-bounds); the finding then points at cp_Tmin.
import { cpLocation, scanOf, speciesCp } from '../cp/curve-cache.js';
import type { Finding, Rule, Species } from '../types.js';
import { DEGC_OFFSET_K, diagnoseDegCAsK } from './cp-gas-bounds.js';
import { makeFinding } from './finding.js';

export const rule: Rule = {
  id: 'cp-positive',
  severity: 'error',
  docs: 'docs/rules/cp-positive.md',
  description: 'Cp must be positive everywhere inside each declared validity range.',
  messages: {
    notPositive: 'Cp falls to {cp} J/(mol K) at {T} K inside the range {Tmin}–{Tmax} K ({model}); a heat capacity must be positive',
    notPositiveDegC:
      'Cp falls to {cp} J/(mol K) at {T} K inside the range {Tmin}–{Tmax} K ({model}); the range looks like °C values read as K: over {TminK}–{TmaxK} K Cp stays positive',
  },
};

const r5 = (x: number): number => Number(x.toPrecision(5));

rule.check = (sp: Species): Finding[] => {
  if (sp.phase === 'aq') return [];
  const cp = speciesCp(sp);
  if (!cp) return [];
  const findings: Finding[] = [];
  for (const spec of cp.specs) {
    const { min } = scanOf(spec);
    if (min.cp > 0) continue;
    const params = { cp: r5(min.cp), T: r5(min.T), Tmin: spec.Tmin, Tmax: spec.Tmax, model: spec.model };
    const ids = { species: sp.name, phase: sp.phase };
    const degC = diagnoseDegCAsK(sp, spec, Number.MIN_VALUE, Infinity);
    if (degC) {
      const p = { ...params, TminK: r5(spec.Tmin + DEGC_OFFSET_K), TmaxK: r5(spec.Tmax + DEGC_OFFSET_K) };
      findings.push(makeFinding(rule, 'notPositiveDegC', p, cpLocation(sp, spec, 'cp_Tmin'), { ...ids, diagnosis: degC }));
    } else {
      findings.push(makeFinding(rule, 'notPositive', params, cpLocation(sp, spec, 'cp_coeffs'), ids));
    }
  }
  return findings;
};

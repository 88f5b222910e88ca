// Per-species summaries for the report: the values as read (in kJ/mol and J/(mol K)) and the
// Gibbs–Helmholtz residual and the Cp summary, so every view shows the same numbers without computing them again.
import { elementEntropySum } from './chemistry/reference.js';
import { formatFormula } from './chemistry/formula.js';
import { gibbsResidual } from './rules/gibbs-helmholtz.js';
import { cpSummary } from './cp/summary.js';
import type { ReferenceData, Species, SpeciesSummary, UseWindow } from './types.js';

export function speciesSummary(sp: Species, reference: ReferenceData, useWindow: UseWindow, withSamples: boolean): SpeciesSummary {
  const s: SpeciesSummary = { key: sp.key, name: sp.name, phase: sp.phase, formula: formatFormula(sp.formula), location: sp.location };
  if (sp.dHf !== undefined) s.dHf = sp.dHf / 1000;
  if (sp.dGf !== undefined) s.dGf = sp.dGf / 1000;
  if (sp.S !== undefined) s.S = sp.S;
  if (sp.dHf !== undefined && sp.dGf !== undefined && sp.S !== undefined) {
    const elS = elementEntropySum(sp.formula, reference, sp.phase);
    if (elS !== undefined) s.gibbsResidual = Math.round(gibbsResidual({ dHf: sp.dHf, dGf: sp.dGf, S: sp.S }, elS)) / 1000;
  }
  const cp = cpSummary(sp, useWindow, withSamples);
  if (cp) s.cp = cp;
  return s;
}

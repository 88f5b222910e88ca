// Correlations that carry their own integration constants imply ΔfH°(298.15) and S°(298.15):
// Shomate F and G (H(T) = 1000·(poly(t) + F) on the formation scale, S = … + G) and the H coefficient,
// which is ΔfH°298 itself; NASA-7 a6/a7 and NASA-9 b1/b2 (H/(RT) and S/R on the formation scale, so an
// element in its reference state has H(298.15) = 0). They are read from the range that contains
// 298.15 K (the nearest range, extrapolated, when none does) and compared with the row's dHf and S.
// For Shomate with eight coefficients two more checks: every range's H coefficient against the row's
// dHf, and H° − H°298 = 0 at 298.15 K (poly(0.29815) + F − H = 0).
//
// Tolerances: warning above 0.5 kJ/mol and 0.5 J/(mol K); error above 4 kJ/mol and 4 J/(mol K);
// both widened to 2u when the row states uncertainties. When 298.15 K is more than 2 K outside every
// range, the implied values are extrapolated and the severity is capped at warning.
//
// Diagnosis: the slips of slips.ts (×1000, ×4.184, sign) are tried on the implied value and on the
// row's value. Which side is blamed: the row when its own ΔfG° = ΔfH° − TΔfS° does not close while
// the slip-corrected row does match; otherwise the constants (the row is checked by gibbs-helmholtz).
import { elementEntropySum, isReferenceState } from '../chemistry/reference.js';
import { T_REF_K } from '../cp/constants.js';
import { cpLocation, segmentOf, speciesCp } from '../cp/curve-cache.js';
import { toDeclared } from '../units/convert.js';
import type { CheckContext, CpSpec, Diagnosis, Finding, Location, RowValues, Rule, Severity, Species } from '../types.js';
import { makeFinding } from './finding.js';
import { gibbsResidual } from './gibbs-helmholtz.js';
import { SLIPS } from './slips.js';

export const EMBEDDED_H_WARNING = 500; // J/mol
export const EMBEDDED_H_ERROR = 4000; // J/mol
export const EMBEDDED_S_WARNING = 0.5; // J/(mol K)
export const EMBEDDED_S_ERROR = 4; // J/(mol K)
/** 298.15 K this far outside every range makes the implied values extrapolations (K). */
export const EMBEDDED_EXTRAPOLATION_K = 2;

export const rule: Rule = {
  id: 'cp-embedded-constants',
  severity: 'error',
  docs: 'docs/rules/cp-embedded-constants.md',
  description: "The integration constants of Shomate, NASA-7 and NASA-9 correlations must reproduce the row's ΔfH° and S° at 298.15 K.",
  messages: {
    enthalpy: 'the {model} constants imply ΔfH°(298.15 K) = {implied} kJ/mol; the row gives dHf = {row} kJ/mol (difference {diff} kJ/mol, tolerance {tol} kJ/mol){extrapolated}',
    entropy: 'the {model} constants imply S°(298.15 K) = {implied} J/(mol K); the row gives S = {row} J/(mol K) (difference {diff} J/(mol K), tolerance {tol} J/(mol K)){extrapolated}',
    enthalpyDiagnosed:
      'the {model} constants imply ΔfH°(298.15 K) = {implied} kJ/mol; the row gives dHf = {row} kJ/mol (difference {diff} kJ/mol); it looks like {words} in {blamed}: corrected {corrected} {unit} leaves {residualAfter} kJ/mol{extrapolated}',
    entropyDiagnosed:
      'the {model} constants imply S°(298.15 K) = {implied} J/(mol K); the row gives S = {row} J/(mol K) (difference {diff} J/(mol K)); it looks like {words} in {blamed}: corrected {corrected} {unit} leaves {residualAfter} J/(mol K){extrapolated}',
    shomateH: 'the Shomate H coefficient ({value} kJ/mol) is ΔfH°298 by definition; the row gives dHf = {row} kJ/mol (difference {diff} kJ/mol, tolerance {tol} kJ/mol)',
    shomateHDiagnosed:
      'the Shomate H coefficient ({value} kJ/mol) is ΔfH°298 by definition; the row gives dHf = {row} kJ/mol; the coefficient looks like {words}: {corrected} kJ/mol leaves {residualAfter} kJ/mol',
    shomateOffset:
      'Shomate F and H disagree: H° − H°298 at 298.15 K = poly(0.29815) + F − H = {offset} kJ/mol, not 0 (tolerance {tol} kJ/mol)',
    shomateOffsetDiagnosed:
      'Shomate F and H disagree: H° − H°298 at 298.15 K = {offset} kJ/mol, not 0; the H coefficient {value} looks like {words}: {corrected} kJ/mol leaves {residualAfter} kJ/mol',
  },
};

const r = (x: number, p = 6): number => Number(x.toPrecision(p));

/** The row whose Cp spec this is (same file and line), else the species' first row. */
function rowOf(sp: Species, spec: CpSpec): RowValues | undefined {
  return sp.values.find((v) => v.location.file === spec.location.file && v.location.line === spec.location.line) ?? sp.values[0];
}

/** Does the row's own ΔfG° = ΔfH° − TΔfS° close? undefined when it cannot be computed. */
function rowCloses(sp: Species, row: RowValues | undefined, ctx: CheckContext | undefined, replace?: { field: 'dHf' | 'S'; value: number }): boolean | undefined {
  if (!row || !ctx?.reference) return undefined;
  const v = { dHf: row.dHf, dGf: row.dGf, S: row.S };
  if (replace) v[replace.field] = replace.value;
  if (v.dHf === undefined || v.dGf === undefined || v.S === undefined) return undefined;
  if (isReferenceState(sp.formula, sp.phase, sp.state, ctx.reference)) return undefined;
  const elS = elementEntropySum(sp.formula, ctx.reference, sp.phase);
  if (elS === undefined) return undefined;
  const tol = (ctx.options?.tolerances?.gibbsErrorKJ ?? 0.5) * 1000;
  return Math.abs(gibbsResidual({ dHf: v.dHf, dGf: v.dGf, S: v.S }, elS)) <= tol;
}

/** The Shomate polynomial part of H° − H°298 at 298.15 K, kJ/mol, without F − H. */
function shomatePoly298(c: number[]): number {
  const [A, B, C, D, E] = c;
  const t = T_REF_K / 1000;
  return t * (A + t * (B / 2 + t * (C / 3 + t * (D / 4)))) - E / t;
}

interface Compare {
  field: 'dHf' | 'S';
  implied: number; // SI
  row: number; // SI
  warn: number;
  error: number;
}

rule.check = (sp: Species, ctx): Finding[] => {
  const cp = speciesCp(sp);
  if (!cp) return [];
  const ids = { species: sp.name, phase: sp.phase };
  const findings: Finding[] = [];

  // the range holding 298.15 K: the one the joined curve uses there
  let spec: CpSpec | undefined;
  for (const s of cp.specs) if (s.Tmin <= T_REF_K && T_REF_K <= s.Tmax && (!spec || s.Tmin >= spec.Tmin)) spec = s;
  let extrapolated = false;
  if (!spec) {
    let dist = Infinity;
    for (const s of cp.specs) {
      const d = Math.max(s.Tmin - T_REF_K, T_REF_K - s.Tmax);
      if (d < dist) {
        dist = d;
        spec = s;
      }
    }
    extrapolated = dist > EMBEDDED_EXTRAPOLATION_K;
  }
  const cap = (s: Severity): Severity => (extrapolated && s === 'error' ? 'warning' : s);
  const extraText = extrapolated ? ` (298.15 K is outside every range: the implied values are extrapolated)` : '';

  // Shomate H coefficient of every eight-coefficient range, against the row's dHf
  const flagged = new Set<CpSpec>();
  for (const s of cp.specs) {
    if (s.model !== 'shomate' || s.coeffs.length !== 8) continue;
    const row = rowOf(sp, s);
    const dHf = row?.dHf ?? sp.dHf;
    if (dHf === undefined) continue;
    const H = s.coeffs[7] * 1000;
    const u = row?.u_dHf ?? sp.u.dHf ?? 0;
    const warn = Math.max(EMBEDDED_H_WARNING, 2 * u);
    const diff = H - dHf;
    if (Math.abs(diff) <= warn) continue;
    // the row's own ΔfH° fails Gibbs–Helmholtz and a slip that turns it into H closes it: the row is at
    // fault, not the coefficient, and gibbs-helmholtz (with the 298.15 K comparison below) says so
    const rowSlip = bestSlip(dHf, (x) => H - x, warn, 'dHf', sp.units.dHf);
    if (rowSlip && rowCloses(sp, row, ctx) === false && rowCloses(sp, row, ctx, { field: 'dHf', value: rowSlip.corrected }) !== false) continue;
    flagged.add(s);
    const severity: Severity = Math.abs(diff) > Math.max(EMBEDDED_H_ERROR, 2 * u) ? 'error' : 'warning';
    const base = { value: s.coeffs[7], row: r(dHf / 1000), diff: r(diff / 1000, 4), tol: r((severity === 'error' ? Math.max(EMBEDDED_H_ERROR, 2 * u) : warn) / 1000, 3) };
    const slip = bestSlip(H, (x) => x - dHf, warn);
    const loc = cpLocation(sp, s, 'cp_coeffs');
    if (slip) {
      const diagnosis: Diagnosis = { cause: slip.cause, field: 'cp_coeffs', corrected: r(slip.corrected / 1000), unit: 'kJ/mol', residualAfter: r(slip.after / 1000, 4) };
      findings.push(makeFinding(rule, 'shomateHDiagnosed', { ...base, words: slip.words, corrected: diagnosis.corrected, residualAfter: diagnosis.residualAfter }, loc, { ...ids, severity, diagnosis }));
    } else {
      findings.push(makeFinding(rule, 'shomateH', base, loc, { ...ids, severity }));
    }
  }

  if (!spec) return findings;
  const model = spec.model;
  const loc = cpLocation(sp, spec, 'cp_coeffs');

  // Shomate: H° − H°298 must vanish at 298.15 K
  if (model === 'shomate' && spec.coeffs.length === 8 && !flagged.has(spec)) {
    const Hc = spec.coeffs[7];
    const offsetJ = (shomatePoly298(spec.coeffs) + spec.coeffs[5] - Hc) * 1000;
    if (Math.abs(offsetJ) > EMBEDDED_H_WARNING) {
      const severity = cap(Math.abs(offsetJ) > EMBEDDED_H_ERROR ? 'error' : 'warning');
      const tol = (severity === 'error' ? EMBEDDED_H_ERROR : EMBEDDED_H_WARNING) / 1000;
      const polyF = (shomatePoly298(spec.coeffs) + spec.coeffs[5]) * 1000;
      const slip = bestSlip(Hc * 1000, (x) => polyF - x, EMBEDDED_H_WARNING);
      if (slip) {
        const diagnosis: Diagnosis = { cause: slip.cause, field: 'cp_coeffs', corrected: r(slip.corrected / 1000), unit: 'kJ/mol', residualAfter: r(slip.after / 1000, 4) };
        findings.push(makeFinding(rule, 'shomateOffsetDiagnosed', { offset: r(offsetJ / 1000, 4), value: Hc, words: slip.words, corrected: diagnosis.corrected, residualAfter: diagnosis.residualAfter }, loc, { ...ids, severity, diagnosis }));
      } else {
        findings.push(makeFinding(rule, 'shomateOffset', { offset: r(offsetJ / 1000, 4), tol }, loc, { ...ids, severity }));
      }
    }
  }

  // the implied ΔfH° and S° against the row
  const seg = segmentOf(spec);
  const impliedH = seg.embedded?.H;
  const impliedS = seg.embedded?.S ?? (model === 'shomate' ? shomateS(spec).S : undefined);
  const row = rowOf(sp, spec);
  const compares: Compare[] = [];
  const dHf = row?.dHf ?? sp.dHf;
  const S = row?.S ?? sp.S;
  if (dHf !== undefined && impliedH) {
    const u = row?.u_dHf ?? sp.u.dHf ?? 0;
    compares.push({ field: 'dHf', implied: impliedH(T_REF_K), row: dHf, warn: Math.max(EMBEDDED_H_WARNING, 2 * u), error: Math.max(EMBEDDED_H_ERROR, 2 * u) });
  }
  if (S !== undefined && impliedS) {
    const u = row?.u_S ?? sp.u.S ?? 0;
    compares.push({ field: 'S', implied: impliedS(T_REF_K), row: S, warn: Math.max(EMBEDDED_S_WARNING, 2 * u), error: Math.max(EMBEDDED_S_ERROR, 2 * u) });
  }
  for (const c of compares) {
    const diff = c.implied - c.row;
    if (Math.abs(diff) <= c.warn) continue;
    const severity = cap(Math.abs(diff) > c.error ? 'error' : 'warning');
    const kJ = c.field === 'dHf';
    const show = (x: number): number => (kJ ? r(x / 1000) : r(x));
    const base = { model, implied: show(c.implied), row: show(c.row), diff: kJ ? r(diff / 1000, 4) : r(diff, 4), tol: show(severity === 'error' ? c.error : c.warn), extrapolated: extraText };
    const constSlip = bestSlip(c.implied, (x) => x - c.row, c.warn, c.field);
    const rowSlip = bestSlip(c.row, (x) => c.implied - x, c.warn, c.field, sp.units[c.field]);
    const rowBad = rowCloses(sp, row, ctx) === false;
    const rowFixed = rowSlip ? rowCloses(sp, row, ctx, { field: c.field, value: rowSlip.corrected }) : undefined;
    const blameRow = rowSlip && rowBad && rowFixed !== false ? rowSlip : undefined;
    const messageId = kJ ? 'enthalpyDiagnosed' : 'entropyDiagnosed';
    if (blameRow) {
      const unit = sp.units[c.field] ?? (kJ ? 'kJ/mol' : 'J/(mol K)');
      const corrected = r(toDeclared(blameRow.corrected, c.field, unit));
      const diagnosis: Diagnosis = { cause: blameRow.cause, field: c.field, corrected, unit, residualAfter: show(blameRow.after) };
      const at: Location = { ...(row?.location ?? sp.location), field: c.field };
      if (sp.columns[c.field] !== undefined) at.column = sp.columns[c.field];
      findings.push(makeFinding(rule, messageId, { ...base, blamed: `the row's ${c.field}`, words: blameRow.words, corrected, unit, residualAfter: diagnosis.residualAfter }, at, { ...ids, severity, diagnosis }));
    } else if (constSlip) {
      const unit = kJ ? 'kJ/mol' : 'J/(mol K)';
      const corrected = show(constSlip.corrected);
      const diagnosis: Diagnosis = { cause: constSlip.cause, field: 'cp_coeffs', corrected, unit, residualAfter: show(constSlip.after) };
      findings.push(makeFinding(rule, messageId, { ...base, blamed: 'the constants', words: constSlip.words, corrected, unit, residualAfter: diagnosis.residualAfter }, loc, { ...ids, severity, diagnosis }));
    } else {
      findings.push(makeFinding(rule, kJ ? 'enthalpy' : 'entropy', base, loc, { ...ids, severity }));
    }
  }
  return findings;
};

/** A seven-coefficient Shomate range still carries G, so S° is implied (its H scale is not). */
function shomateS(spec: CpSpec): { S: (T: number) => number } {
  const [A, B, C, D, E, , G] = spec.coeffs;
  return {
    S: (T) => {
      const t = T / 1000;
      return A * Math.log(t) + t * (B + t * (C / 2 + t * (D / 3))) - E / (2 * t * t) + G;
    },
  };
}

/**
 * The slip (slips.ts) that, applied to `value`, brings |residual(corrected)| lowest and within
 * `within`, described in terms of `declared` (the row's unit for the field; the canonical unit when absent).
 */
function bestSlip(
  value: number,
  residual: (corrected: number) => number,
  within: number,
  field: 'dHf' | 'S' = 'dHf',
  declared?: string,
): { cause: string; words: string; corrected: number; after: number } | undefined {
  let best: { cause: string; words: string; corrected: number; after: number } | undefined;
  for (const slip of SLIPS) {
    if (slip.cause === 'atm-vs-bar') continue; // 0.109 J/(mol K): below every tolerance here
    if (!slip.fields.includes(field)) continue;
    const corrected = slip.correct(value, 'g');
    if (corrected === value) continue;
    const after = residual(corrected);
    if (Math.abs(after) <= within && (!best || Math.abs(after) < Math.abs(best.after))) {
      best = { cause: slip.cause, words: slip.words(field, declared), corrected, after };
    }
  }
  return best;
}

// Ideal gas: Cp ≥ 5R/2 (translation alone gives it, every other contribution adds to it) and Cp not
// far above the classical limit (3N − 3/2)R (5R/2 for an atom). Below 5R/2 the usual cause is a
// unit slip in a poly or table correlation, Cp/R read as J/(mol K) above all; when rescaling the
// coefficients by a slip's factor puts the whole range inside the bounds, that slip is diagnosed.
// Otherwise, when the range starts at 100 K or below and the same correlation stays inside the bounds
// over the range moved up by 273.15 K, its ends look like °C values read as K (a Shomate fit declared
// 25–1027 "K" instead of 298–1300 K reaches absurd Cp near 25 K through its E/t² term).
import { atomCount } from '../chemistry/formula.js';
import { R_J_PER_MOL_K as R, T_REF_K } from '../cp/constants.js';
import { cpLocation, scanFunction, scanOf, segmentOf, speciesCp } from '../cp/curve-cache.js';
import { CAL_J } from '../units/table.js';
import type { CpSpec, Diagnosis, Finding, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';

/** Allowed dip below 5R/2, relative: ten times the ~0.1 % to which published fits reproduce Cp. */
export const GAS_LOWER_TOLERANCE = 0.01;
/** Allowance above the classical limit, relative (anharmonicity, grows with the number of modes) … */
export const GAS_UPPER_RELATIVE = 0.15;
/** … or absolute, in units of R (electronic excitation of atoms and small radicals), whichever is larger. */
export const GAS_UPPER_ABSOLUTE_R = 2;

export interface GasLimits {
  atoms: number;
  translational: number; // 5R/2, J/(mol K)
  lower: number; // 5R/2 less the tolerance
  classical: number; // (3N − 3/2)R, or 5R/2 for N ≤ 1
  upper: number; // classical plus the allowance
}

/** The Cp bounds of an ideal gas of N atoms, J/(mol K). */
export function gasLimits(atoms: number): GasLimits {
  const translational = 2.5 * R;
  const classical = atoms <= 1 ? translational : (3 * atoms - 1.5) * R;
  return {
    atoms,
    translational,
    lower: translational * (1 - GAS_LOWER_TOLERANCE),
    classical,
    upper: classical + Math.max(GAS_UPPER_RELATIVE * classical, GAS_UPPER_ABSOLUTE_R * R),
  };
}

/** A unit slip in a poly or table correlation: multiplying its Cp by `factor` undoes it. */
export interface CpUnitSlip {
  cause: string;
  words: string;
  factor: number;
  /** the cp_unit the coefficients should have been declared in */
  unitFix: string;
}

/** The slips a declared cp_unit invites, most common first; none for the models with a fixed unit. */
export function cpUnitSlips(spec: CpSpec): CpUnitSlip[] {
  if (spec.model !== 'poly' && spec.model !== 'table') return [];
  const f = spec.unitFactor;
  const near = (x: number): boolean => Math.abs(f / x - 1) < 1e-9;
  if (near(1)) {
    return [
      { cause: 'cp-over-R-as-J', words: 'Cp/R values declared as J/(mol K)', factor: R, unitFix: 'R' },
      { cause: 'cal-read-as-J', words: 'cal/(mol K) values declared as J/(mol K)', factor: CAL_J, unitFix: 'cal/(mol K)' },
    ];
  }
  if (near(CAL_J)) {
    return [
      { cause: 'cp-over-R-as-cal', words: 'Cp/R values declared as cal/(mol K)', factor: R / CAL_J, unitFix: 'R' },
      { cause: 'J-read-as-cal', words: 'J/(mol K) values declared as cal/(mol K)', factor: 1 / CAL_J, unitFix: 'J/(mol K)' },
    ];
  }
  if (near(R)) {
    return [
      { cause: 'J-read-as-cp-over-R', words: 'J/(mol K) values declared as Cp/R', factor: 1 / R, unitFix: 'J/(mol K)' },
      { cause: 'cal-read-as-cp-over-R', words: 'cal/(mol K) values declared as Cp/R', factor: CAL_J / R, unitFix: 'cal/(mol K)' },
    ];
  }
  return [];
}

/**
 * The first slip whose rescaled Cp lies inside [lo, hi] over the whole range, as a Diagnosis:
 * `corrected` is the rescaled Cp at 298.15 K (or at the nearer end of the range when 298.15 K is
 * outside it) in J/(mol K); `residualAfter` is what the rescaled Cp still lies outside [lo, hi],
 * J/(mol K) — 0 by construction, since only a slip that leaves nothing outside is offered.
 */
export function diagnoseUnitSlip(spec: CpSpec, lo: number, hi: number): { slip: CpUnitSlip; diagnosis: Diagnosis; T: number } | undefined {
  const scan = scanOf(spec);
  const seg = segmentOf(spec);
  const T = Math.min(Math.max(T_REF_K, spec.Tmin), spec.Tmax);
  for (const slip of cpUnitSlips(spec)) {
    const min = scan.min.cp * slip.factor;
    const max = scan.max.cp * slip.factor;
    if (min >= lo && max <= hi) {
      const corrected = Number((seg.cp(T) * slip.factor).toPrecision(6));
      return { slip, T, diagnosis: { cause: slip.cause, field: 'cp_unit', corrected, unit: 'J/(mol K)', residualAfter: 0 } };
    }
  }
  return undefined;
}

/** °C to K: the offset a range read in the wrong scale is off by. */
export const DEGC_OFFSET_K = 273.15;
/** A declared Tmin at most this is a plausible °C start of a range (0, 25, 100 °C); K. */
export const DEGC_TMIN_MAX_K = 100;

/**
 * °C read as K: a range declared in K that starts at DEGC_TMIN_MAX_K or below, whose correlation
 * breaks the bounds [lo, hi] over the declared range but stays inside them over the range moved up by
 * 273.15 K. `corrected` is Tmin + 273.15 K. Not for `table` (its listed temperatures would move with
 * the ends, leaving the same Cp values) nor for ranges whose ends were declared in °C.
 */
export function diagnoseDegCAsK(sp: Species, spec: CpSpec, lo: number, hi: number): Diagnosis | undefined {
  if (spec.model === 'table' || spec.Tmin > DEGC_TMIN_MAX_K) return undefined;
  if ((sp.units.cp_Tmin ?? 'K') !== 'K' || (sp.units.cp_Tmax ?? 'K') !== 'K') return undefined;
  const seg = segmentOf(spec);
  const scan = scanFunction((T) => seg.cp(T), spec.Tmin + DEGC_OFFSET_K, spec.Tmax + DEGC_OFFSET_K);
  if (!(scan.min.cp >= lo && scan.max.cp <= hi)) return undefined;
  return { cause: 'degC-read-as-K', field: 'cp_Tmin', corrected: Number((spec.Tmin + DEGC_OFFSET_K).toPrecision(8)), unit: 'K', residualAfter: 0 };
}

export const rule: Rule = {
  id: 'cp-gas-bounds',
  severity: 'error',
  docs: 'docs/rules/cp-gas-bounds.md',
  description: 'Ideal-gas Cp must stay between 5R/2 and the classical limit (3N − 3/2)R plus an allowance for anharmonic and electronic terms.',
  messages: {
    below: 'ideal-gas Cp falls to {cp} J/(mol K) at {T} K, below 5R/2 = {limit} J/(mol K), the translational part alone',
    belowDiagnosed:
      'ideal-gas Cp falls to {cp} J/(mol K) at {T} K, below 5R/2 = {limit} J/(mol K); the coefficients look like {words}: with cp_unit = {unitFix}, Cp({atT} K) = {corrected} J/(mol K), inside the bounds',
    above:
      'ideal-gas Cp reaches {cp} J/(mol K) at {T} K, above the classical limit {classical} J/(mol K) for {atoms} atom(s) plus its allowance (flagged above {limit} J/(mol K))',
    aboveDiagnosed:
      'ideal-gas Cp reaches {cp} J/(mol K) at {T} K, above {limit} J/(mol K) (classical limit {classical} for {atoms} atom(s) plus allowance); the coefficients look like {words}: with cp_unit = {unitFix}, Cp({atT} K) = {corrected} J/(mol K), inside the bounds',
    belowDegC:
      'ideal-gas Cp falls to {cp} J/(mol K) at {T} K, below 5R/2 = {limit} J/(mol K); the range {Tmin}–{Tmax} K looks like °C values read as K: over {TminK}–{TmaxK} K the correlation stays inside the bounds',
    aboveDegC:
      'ideal-gas Cp reaches {cp} J/(mol K) at {T} K, above {limit} J/(mol K) (classical limit {classical} for {atoms} atom(s) plus allowance); the range {Tmin}–{Tmax} K looks like °C values read as K: over {TminK}–{TmaxK} K the correlation stays inside the bounds',
  },
};

const r4 = (x: number): number => Number(x.toPrecision(5));

rule.check = (sp: Species): Finding[] => {
  if (sp.phase !== 'g') return [];
  const cp = speciesCp(sp);
  if (!cp) return [];
  const lim = gasLimits(atomCount(sp.formula));
  const ids = { species: sp.name, phase: sp.phase };
  const findings: Finding[] = [];
  for (const spec of cp.specs) {
    const scan = scanOf(spec);
    const low = scan.min.cp < lim.lower && scan.min.cp > 0; // Cp ≤ 0 is cp-positive's finding
    const high = scan.max.cp > lim.upper;
    if (!low && !high) continue;
    const params = (which: 'low' | 'high') => {
      const at = which === 'low' ? scan.min : scan.max;
      return { cp: r4(at.cp), T: r4(at.T), limit: r4(which === 'low' ? lim.translational : lim.upper), classical: r4(lim.classical), atoms: lim.atoms };
    };
    const fix = diagnoseUnitSlip(spec, lim.lower, lim.upper);
    if (fix) {
      // one slip explains the whole range: one finding, on the unit
      const p = { ...params(low ? 'low' : 'high'), words: fix.slip.words, unitFix: fix.slip.unitFix, atT: r4(fix.T), corrected: fix.diagnosis.corrected };
      const field = sp.columns.cp_unit !== undefined ? 'cp_unit' : 'cp_coeffs';
      findings.push(makeFinding(rule, low ? 'belowDiagnosed' : 'aboveDiagnosed', p, cpLocation(sp, spec, field), { ...ids, diagnosis: fix.diagnosis }));
      continue;
    }
    const degC = diagnoseDegCAsK(sp, spec, lim.lower, lim.upper);
    if (degC) {
      // the range's ends explain the whole range: one finding, on cp_Tmin
      const p = { ...params(low ? 'low' : 'high'), Tmin: spec.Tmin, Tmax: spec.Tmax, TminK: r4(spec.Tmin + DEGC_OFFSET_K), TmaxK: r4(spec.Tmax + DEGC_OFFSET_K) };
      findings.push(makeFinding(rule, low ? 'belowDegC' : 'aboveDegC', p, cpLocation(sp, spec, 'cp_Tmin'), { ...ids, diagnosis: degC }));
      continue;
    }
    if (low) findings.push(makeFinding(rule, 'below', params('low'), cpLocation(sp, spec, 'cp_coeffs'), ids));
    if (high) findings.push(makeFinding(rule, 'above', params('high'), cpLocation(sp, spec, 'cp_coeffs'), ids));
  }
  return findings;
};

// What each finding costs in ln K, for every computed reaction that uses the finding's species.
//
// ln K is linear in each species' g_i(T) = H_i(T) − T·S_i(T): changing one species' data by δg_i(T)
// moves ln K by −ν_i·δg_i(T)/(RT). So no reaction is recomputed: each finding needs δg_i at the
// reaction's temperatures only, and the largest |Δln K| over those temperatures (with the temperature
// where it occurs) is recorded in finding.impact, one entry per reaction, largest first.
//
// δg_i by kind of finding:
//   1. A diagnosis (a known slip with its corrected value, in the declared unit): the data as given
//      against the corrected value (converted to SI with the column's declared unit). "As given" is
//      the value on the finding's own row: an odd source on a later row is not the value ln K uses,
//      so its impact is what using it instead of the correction would move. A corrected value in a
//      field the route does not read (ΔfG° when ΔfH° and S° are given) moves ln K by 0.
//      A unit slip in a Cp correlation (diagnosis.field 'cp_unit', from cp-gas-bounds or
//      cp-solid-bounds): the curve as given against the curve with that range's Cp rescaled by the
//      slip's factor, both integrated from 298.15 K through the joins; a range whose ends were °C
//      read as K (cause 'degC-read-as-K', a column slip): against the curve with every range of the
//      species from that file moved up by 273.15 K.
//   2. A Cp extrapolation (rule ids containing 'extrapolat' or 'coverage'): the rigorous route
//      against the same curve with Cp frozen at its value at the nearest end of the fitted range
//      outside it. The spread is how much the answer hangs on the extrapolated polynomial.
//   2b. Two sources that disagree, or a spread with no odd one out (cross-source, no diagnosis): the
//      field moved by the spread between the sources.
//   3. A Gibbs–Helmholtz residual without a diagnosis: one of the three values is off by the residual
//      r, but which is unknown, so each value the route reads is moved in turn (ΔfH° or ΔfG° by r,
//      S° by r/298.15 K) and the largest shift is kept.
//   4. Any other finding on a formation field (the finding's field): that field moved by its stated
//      standard uncertainty, else by the screening default (1 kJ/mol for ΔfH° and ΔfG°, 1 J/(mol K)
//      for S°; our choice, not a published value).
//   5. A finding on the species with no field: the species' own share of u(ln K), from its stated
//      uncertainties or the same defaults, root-sum-square over the values the route reads.
//   6. A finding that questions no value (an exact repeat of an earlier row): no impact.
import { R_J_PER_MOL_K, T_REF_K } from '../cp/constants.js';
import { buildCurve, buildSegment } from '../cp/index.js';
import { cpUnitSlips, DEGC_OFFSET_K } from '../rules/cp-gas-bounds.js';
import { fromDeclared } from '../units/convert.js';
import type { CpCurve, CpSpec, Finding, RowValues } from '../types.js';
import type { ResolvedReaction } from './reactions.js';
import type { SpeciesThermo } from './thermo.js';
import { fieldsUsed, lnKSensitivity, type Field } from './uncertainty.js';

/** Screening defaults for a value whose uncertainty the table does not state (SI units). */
export const DEFAULT_UNCERTAINTY: Readonly<Record<Field, number>> = { dHf: 1000, dGf: 1000, S: 1 };

const FIELDS: readonly Field[] = ['dHf', 'dGf', 'S'];
/** Rules whose findings leave every value as it is: removing the repeat changes no ln K. */
const QUESTION_NO_VALUE = new Set(['duplicate-row']);
const isField = (f: unknown): f is Field => typeof f === 'string' && (FIELDS as readonly string[]).includes(f);

/** ΔfH° and S° the route would use with some values replaced (SI). */
export function valuesWith(th: SpeciesThermo, o: Partial<Record<Field, number>>): { dHf: number; S: number } {
  switch (th.route) {
    case 'HS':
      return { dHf: o.dHf ?? th.dHf, S: o.S ?? th.S };
    case 'HG': {
      const dHf = o.dHf ?? th.dHf;
      return { dHf, S: th.elementS! + (dHf - (o.dGf ?? th.dGf!)) / T_REF_K };
    }
    case 'GS': {
      const S = o.S ?? th.S;
      return { dHf: (o.dGf ?? th.dGf!) + T_REF_K * (S - th.elementS!), S };
    }
  }
}

/** H(T) − H(298.15) with Cp frozen at the range ends outside the fitted range, J/mol. */
export function frozenDH(c: CpCurve, T: number): number {
  const lo = c.Tmin;
  const hi = c.Tmax;
  const clamp = (x: number): number => Math.min(hi, Math.max(lo, x));
  return c.dH(clamp(T)) - c.dH(clamp(T_REF_K)) + c.cp(lo) * (Math.min(T, lo) - Math.min(T_REF_K, lo)) + c.cp(hi) * (Math.max(T, hi) - Math.max(T_REF_K, hi));
}

/** S(T) − S(298.15) with Cp frozen at the range ends outside the fitted range, J/(mol K). */
export function frozenDS(c: CpCurve, T: number): number {
  const lo = c.Tmin;
  const hi = c.Tmax;
  const clamp = (x: number): number => Math.min(hi, Math.max(lo, x));
  return (
    c.dS(clamp(T)) -
    c.dS(clamp(T_REF_K)) +
    c.cp(lo) * (Math.log(Math.min(T, lo)) - Math.log(Math.min(T_REF_K, lo))) +
    c.cp(hi) * (Math.log(Math.max(T, hi)) - Math.log(Math.max(T_REF_K, hi)))
  );
}

/**
 * |Δln K| per unit |ν| at T for one finding on one species, or undefined when it has no consequence
 * to compute. Every kind is linear in the stoichiometric coefficient, so one evaluation per
 * temperature serves every reaction that uses the species at those temperatures.
 */
type Effect = (T: number) => number;

/**
 * The species' Cp curve corrected as diagnosed: the finding's range with its Cp rescaled by a unit
 * slip's factor (diagnosis field cp_unit), or, for °C read as K (field cp_Tmin, a column slip), every
 * range from the finding's file moved up by 273.15 K. Undefined when the finding's row holds no Cp
 * range or the cause is neither.
 */
export function curveWithCpFix(th: SpeciesThermo, f: Finding): CpCurve | undefined {
  const cause = f.diagnosis?.cause;
  const specs = th.species.cp.slice().sort((a, b) => a.Tmin - b.Tmin || a.Tmax - b.Tmax);
  const at = (s: CpSpec): boolean => s.location.file === f.location.file && s.location.line === f.location.line;
  const target = specs.find(at);
  if (!target) return undefined;
  let fix: ((s: CpSpec) => CpSpec) | undefined;
  if (cause === 'degC-read-as-K') {
    // a column slip: every range of the species from the same file moves with the flagged one
    fix = (s) => (s.location.file === target.location.file ? { ...s, Tmin: s.Tmin + DEGC_OFFSET_K, Tmax: s.Tmax + DEGC_OFFSET_K } : s);
  } else {
    const slip = cpUnitSlips(target).find((x) => x.cause === cause);
    if (slip) fix = (s) => (s === target ? { ...s, unitFactor: s.unitFactor * slip.factor } : s);
  }
  if (!fix) return undefined;
  try {
    return buildCurve(specs.map((s) => buildSegment(fix(s))));
  } catch {
    return undefined;
  }
}

/** The species row the finding points at (same file and line), if it is one of the species' value rows. */
function rowOf(th: SpeciesThermo, f: Finding): RowValues | undefined {
  return th.species.values.find((v) => v.location.line === f.location.line && v.location.file === f.location.file);
}

function effectOf(f: Finding, th: SpeciesThermo): Effect | undefined {
  const R = R_J_PER_MOL_K;
  /** |Δln K| per unit ν between the route's values with overrides a and with overrides b */
  const between = (a: Partial<Record<Field, number>>, b: Partial<Record<Field, number>>): Effect => {
    const va = valuesWith(th, a);
    const vb = valuesWith(th, b);
    const dH = vb.dHf - va.dHf;
    const dS = vb.S - va.S;
    return (T) => Math.abs((dH - T * dS) / (R * T));
  };
  const shift = (o: Partial<Record<Field, number>>): Effect => between({}, o);
  if (f.rule === 'reaction-data') return undefined; // no Cp at all: nothing to compare against
  if (QUESTION_NO_VALUE.has(f.rule)) return undefined;
  const d = f.diagnosis;
  if ((d?.field === 'cp_unit' || d?.cause === 'degC-read-as-K') && th.curve) {
    const given = th.curve;
    const fixed = curveWithCpFix(th, f);
    if (fixed) return (T) => Math.abs((fixed.dH(T) - given.dH(T) - T * (fixed.dS(T) - given.dS(T))) / (R * T));
  }
  if (d && isField(d.field)) {
    // from the value on the finding's own row (another source's row is not the one ln K uses) to the correction
    const corrected = fromDeclared(d.corrected, d.field, th.species.units[d.field]);
    const given = rowOf(th, f)?.[d.field];
    return given === undefined ? shift({ [d.field]: corrected }) : between({ [d.field]: given }, { [d.field]: corrected });
  }
  if (f.rule === 'cross-source' && isField(f.params.field) && typeof f.params.spread === 'number') {
    // two sources, or a spread with no odd one out: the disagreement itself, in the field (display kJ/mol or J/(mol K))
    const x = f.params.field;
    const value = x === 'dHf' ? th.dHf : x === 'S' ? th.S : th.dGf!;
    return between({}, { [x]: value + f.params.spread * (x === 'S' ? 1 : 1000) });
  }
  if (/extrapolat|coverage/.test(f.rule)) {
    const c = th.curve;
    if (!c) return undefined;
    return (T) => Math.abs((frozenDH(c, T) - c.dH(T) - T * (frozenDS(c, T) - c.dS(T))) / (R * T));
  }
  const used = fieldsUsed(th);
  if (f.rule === 'gibbs-helmholtz' && typeof f.params.residual === 'number') {
    const r = Math.abs(f.params.residual) * 1000;
    const effects = used.map((x) => shift({ [x]: (x === 'dHf' ? th.dHf : x === 'S' ? th.S : th.dGf!) + (x === 'S' ? r / T_REF_K : r) }));
    return (T) => Math.max(...effects.map((e) => e(T)));
  }
  const u = (x: Field): number => th.species.u[x] ?? DEFAULT_UNCERTAINTY[x];
  const field = isField(f.location.field) ? f.location.field : isField(f.params.field) ? f.params.field : undefined;
  if (field) {
    if (!used.includes(field)) return () => 0;
    return (T) => Math.abs(lnKSensitivity(th, 1, T)[field]! * u(field));
  }
  return (T) => {
    const s = lnKSensitivity(th, 1, T);
    return Math.hypot(...used.map((x) => s[x]! * u(x)));
  };
}

interface Use {
  r: ResolvedReaction;
  nu: number;
  th: SpeciesThermo;
  /** the reaction's temperatures as a key, so reactions sharing them share the evaluation */
  tKey: string;
}

/**
 * Sets `impact` on every finding about a species (finding.species + finding.phase) that takes part
 * in one of the computed reactions: per reaction, the largest |Δln K| over its temperatures and the
 * temperature where it occurs, largest first. A reaction-level finding (rule id 'reaction-…')
 * speaks for its own reaction only. Findings on other species are left as they are.
 * Cost: per finding, one evaluation per distinct temperature list of the reactions using its species
 * (the species' curve was built once, at resolution), then one multiplication per reaction.
 */
export function impactOfFindings(findings: Finding[], reactions: readonly ResolvedReaction[]): void {
  const uses = new Map<string, Use[]>();
  const keyOf = new Map<readonly number[], string>();
  for (const r of reactions) {
    let tKey = keyOf.get(r.temps);
    if (tKey === undefined) keyOf.set(r.temps, (tKey = r.temps.join(' ')));
    for (const t of r.terms) {
      const key = t.thermo.species.key;
      const entry = { r, nu: t.coeff, th: t.thermo, tKey };
      const list = uses.get(key);
      if (list) list.push(entry);
      else uses.set(key, [entry]);
    }
  }
  for (const f of findings) {
    if (f.species === undefined || f.phase === undefined) continue;
    const list = uses.get(`${f.species}|${f.phase}`);
    if (!list) continue;
    const own = f.rule.startsWith('reaction-') ? list.filter((u) => u.r.file === f.location.file && u.r.line === f.location.line) : list;
    if (own.length === 0) continue;
    const effect = effectOf(f, own[0]!.th); // one species, one thermo record
    if (!effect) continue;
    const best = new Map<string, { max: number; T: number }>();
    const impact: NonNullable<Finding['impact']> = [];
    for (const { r, nu, tKey } of own) {
      let b = best.get(tKey);
      if (!b) {
        b = { max: 0, T: r.temps[0]! };
        for (const T of r.temps) {
          const e = effect(T);
          if (e > b.max) b = { max: e, T };
        }
        best.set(tKey, b);
      }
      impact.push({ reaction: r.id, maxAbsDeltaLnK: Math.abs(nu) * b.max, T_K: b.T });
    }
    f.impact = impact.sort((a, b) => b.maxAbsDeltaLnK - a.maxAbsDeltaLnK || (a.reaction < b.reaction ? -1 : a.reaction > b.reaction ? 1 : 0));
  }
}

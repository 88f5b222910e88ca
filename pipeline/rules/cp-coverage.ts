// Coverage: 298.15 K must lie inside a Cp range (H(T) − H(298.15) and S(T) − S(298.15) are integrated
// from there), and the manifest's use window — its ends and any listed temperatures — should lie
// inside the fitted ranges. Outside them the correlation is extrapolated: the finding says how many
// kelvin, what Cp the correlation gives there, and whether the extrapolated Cp, anywhere between the
// end of the range and that temperature, becomes non-physical.
//
// Severity: info when the extrapolation is at most 2 K (a range that starts at 300 K, common in
// older NASA-7 files); warning for a physical extrapolation; error when the extrapolated Cp is
// non-physical — zero or negative (not for aqueous species, whose Cp° may be negative), or for an
// ideal gas below 5R/2 or above the classical limit with its allowance (cp-gas-bounds).
import { atomCount } from '../chemistry/formula.js';
import { T_REF_K } from '../cp/constants.js';
import { cpLocation, scanFunction, segmentOf, speciesCp } from '../cp/curve-cache.js';
import type { CpSpec, Finding, Rule, Severity, Species } from '../types.js';
import { gasLimits } from './cp-gas-bounds.js';
import { makeFinding } from './finding.js';

/** An extrapolation of at most this many kelvin is reported as info only. */
export const COVERAGE_NEGLIGIBLE_K = 2;

export const rule: Rule = {
  id: 'cp-coverage',
  severity: 'warning',
  docs: 'docs/rules/cp-coverage.md',
  description: '298.15 K and the use window must lie inside the fitted Cp ranges; extrapolation is reported with the Cp it gives.',
  messages: {
    ref: '298.15 K lies {outsideK} K {side} the Cp range {Tmin}–{Tmax} K (line {line}), where H and S are integrated from; the correlation gives Cp(298.15 K) = {cp} J/(mol K)',
    refUnphysical:
      '298.15 K lies {outsideK} K {side} the Cp range {Tmin}–{Tmax} K (line {line}); extrapolated, the correlation gives Cp(298.15 K) = {cp} J/(mol K) and reaches {worstCp} J/(mol K) at {worstT} K, {why}',
    window: 'the use window reaches {T} K, {outsideK} K {side} the Cp range {Tmin}–{Tmax} K (line {line}); the correlation is extrapolated and gives Cp = {cp} J/(mol K) there',
    windowUnphysical:
      'the use window reaches {T} K, {outsideK} K {side} the Cp range {Tmin}–{Tmax} K (line {line}); extrapolated, the correlation gives Cp = {cp} J/(mol K) there and reaches {worstCp} J/(mol K) at {worstT} K, {why}',
  },
};

const r = (x: number, p = 5): number => Number(x.toPrecision(p));

interface Extrapolation {
  spec: CpSpec;
  T: number;
  outsideK: number;
  side: 'below' | 'above';
  cp: number;
  unphysical?: { T: number; cp: number; why: string };
}

/** Judges the extrapolated stretch between the end of `spec`'s range and T. */
function extrapolate(sp: Species, spec: CpSpec, T: number): Extrapolation {
  const seg = segmentOf(spec);
  const side = T < spec.Tmin ? 'below' : 'above';
  const [a, b] = side === 'below' ? [T, spec.Tmin] : [spec.Tmax, T];
  const out: Extrapolation = { spec, T, outsideK: side === 'below' ? spec.Tmin - T : T - spec.Tmax, side, cp: seg.cp(T) };
  if (!(b > a) || !(a > 0)) return out;
  const scan = scanFunction((x) => seg.cp(x), a, b);
  if (sp.phase !== 'aq' && scan.min.cp <= 0) {
    out.unphysical = { ...scan.min, why: 'zero or negative' };
  } else if (sp.phase === 'g') {
    const lim = gasLimits(atomCount(sp.formula));
    if (scan.min.cp < lim.lower) out.unphysical = { ...scan.min, why: `below 5R/2 = ${r(lim.translational, 4)} J/(mol K)` };
    else if (scan.max.cp > lim.upper) out.unphysical = { ...scan.max, why: `above the classical limit with its allowance, ${r(lim.upper, 4)} J/(mol K)` };
  }
  return out;
}

/** The range that speaks at T when T is outside every range: the nearest one (the upper one on a tie). */
function nearest(specs: readonly CpSpec[], T: number): CpSpec {
  let best = specs[0];
  let dist = Infinity;
  for (const s of specs) {
    const d = Math.max(s.Tmin - T, T - s.Tmax, 0);
    if (d < dist || (d === dist && s.Tmin >= best.Tmin)) {
      best = s;
      dist = d;
    }
  }
  return best;
}

function severityOf(e: Extrapolation): Severity {
  if (e.unphysical) return 'error';
  return e.outsideK <= COVERAGE_NEGLIGIBLE_K ? 'info' : 'warning';
}

rule.check = (sp: Species, ctx): Finding[] => {
  const cp = speciesCp(sp);
  if (!cp) return [];
  const ids = { species: sp.name, phase: sp.phase };
  const findings: Finding[] = [];
  const report = (e: Extrapolation, kind: 'ref' | 'window') => {
    const params: Record<string, number | string> = {
      T: r(e.T),
      outsideK: r(e.outsideK),
      side: e.side,
      Tmin: e.spec.Tmin,
      Tmax: e.spec.Tmax,
      line: e.spec.location.line,
      cp: r(e.cp),
    };
    let messageId: string = kind;
    if (e.unphysical) {
      Object.assign(params, { worstCp: r(e.unphysical.cp), worstT: r(e.unphysical.T), why: e.unphysical.why });
      messageId = `${kind}Unphysical`;
    }
    const field = e.side === 'below' ? 'cp_Tmin' : 'cp_Tmax';
    findings.push(makeFinding(rule, messageId, params, cpLocation(sp, e.spec, field), { ...ids, severity: severityOf(e) }));
  };

  if (cp.curve.outside(T_REF_K) > 0) report(extrapolate(sp, nearest(cp.specs, T_REF_K), T_REF_K), 'ref');

  // the use window: its ends and listed temperatures; per range and side, the farthest one
  const w = ctx?.options?.useWindow ?? {};
  const temps = [w.Tmin, w.Tmax, ...(w.temperatures ?? [])].filter((t): t is number => typeof t === 'number' && Number.isFinite(t) && t > 0);
  const worst = new Map<string, Extrapolation>();
  for (const T of temps) {
    if (cp.curve.outside(T) <= 0) continue;
    const spec = nearest(cp.specs, T);
    const e = extrapolate(sp, spec, T);
    const key = `${cp.specs.indexOf(spec)}|${e.side}`;
    const had = worst.get(key);
    if (!had || e.outsideK > had.outsideK) worst.set(key, e);
  }
  for (const e of [...worst.values()].sort((a, b) => a.T - b.T)) report(e, 'window');
  return findings;
};

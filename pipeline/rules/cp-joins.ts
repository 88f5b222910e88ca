// Where consecutive Cp ranges of one species meet: gaps (the next range starts above the end of the
// previous one), overlaps (it starts below it), and continuity at the temperature where the joined
// curve switches from one range to the next — Cp always; H and S as well when both ranges carry
// integration constants (Shomate F/G, NASA-7 a6/a7, NASA-9 b1/b2), since a jump in those constants
// shifts G(T), and hence ln K, for every temperature above the join.
//
// A defect at a join involves two rows and either may be the one that is wrong, so each finding is
// reported on both: the row of the upper range and the row of the lower range.
//
// Crystalline phases: a table for "cr" often carries several polymorphs (JANAF style), with a real
// step in Cp, H and S at a transition temperature that is also a range boundary. There a
// discontinuity is a warning, not an error.
import { cpLocation, segmentOf, speciesCp } from '../cp/curve-cache.js';
import type { CpSegment, CpSpec, Finding, Rule, Severity, Species } from '../types.js';
import { makeFinding } from './finding.js';

/** Boundaries closer than this (K) meet. */
export const JOIN_T_TOLERANCE = 0.01;
/** Cp step at a join, relative to the lower side: warning above, error above (published fits: < 0.3 %). */
export const JOIN_CP_WARNING = 0.005;
export const JOIN_CP_ERROR = 0.02;
/** Steps in H, and in T·S, at a join, J/mol: warning above, error above (published fits: < 15 J/mol). */
export const JOIN_G_WARNING = 100;
export const JOIN_G_ERROR = 500;

export const rule: Rule = {
  id: 'cp-joins',
  severity: 'error',
  docs: 'docs/rules/cp-joins.md',
  description: 'Consecutive Cp ranges must meet without gap or overlap, with Cp, H and S continuous at the join.',
  messages: {
    gap: 'no Cp range covers {from}–{to} K: the range on line {lowerLine} ends at {from} K and the next, on line {upperLine}, starts at {to} K ({width} K gap)',
    overlap: 'Cp ranges overlap over {from}–{to} K (lines {lowerLine} and {upperLine}, {width} K); the upper range is used from {from} K',
    cpStep: 'Cp steps from {cpLow} to {cpHigh} J/(mol K) ({cpRel} %) at the {T} K join of lines {lowerLine} and {upperLine} (tolerance {tolRel} %)',
    constantsStep:
      'discontinuous at the {T} K join of lines {lowerLine} and {upperLine}: Cp {cpLow} → {cpHigh} J/(mol K) ({cpRel} %), H steps {dH} kJ/mol, S steps {dS} J/(mol K) (tolerances {tolRel} %, {tolH} kJ/mol, {tolS} J/(mol K) at this T)',
  },
};

const r = (x: number, p = 5): number => Number(x.toPrecision(p));

/** H and S from a range's own integration constants, with the scale its H is on. */
function constants(spec: CpSpec, seg: CpSegment): { H: (T: number) => number; S: (T: number) => number; hScale: string } | undefined {
  if (spec.model === 'shomate') {
    // F and G are present with 7 or 8 coefficients; H(T) = 1000 (poly(t) + F) is on one scale for
    // every Shomate range of a species (the H coefficient is not used)
    const [A, B, C, D, E, F, G] = spec.coeffs;
    return {
      H: (T) => {
        const t = T / 1000;
        return 1000 * (t * (A + t * (B / 2 + t * (C / 3 + t * (D / 4)))) - E / t + F);
      },
      S: (T) => {
        const t = T / 1000;
        return A * Math.log(t) + t * (B + t * (C / 2 + t * (D / 3))) - E / (2 * t * t) + G;
      },
      hScale: 'shomate',
    };
  }
  // named, not spread: a spread copy here, made for every joined range, was measured to reach the old
  // generation (~50 MB of garbage over 10^6 rows) where a plain object literal does not
  if (seg.embedded) return { H: seg.embedded.H, S: seg.embedded.S, hScale: 'formation' };
  return undefined;
}

rule.check = (sp: Species): Finding[] => {
  const cp = speciesCp(sp);
  if (!cp || cp.specs.length < 2) return [];
  const ids = { species: sp.name, phase: sp.phase };
  const soft = sp.phase === 'cr';
  const findings: Finding[] = [];
  const both = (messageId: string, params: Record<string, number | string>, lower: CpSpec, upper: CpSpec, fields: [string, string], severity: Severity) => {
    findings.push(makeFinding(rule, messageId, params, cpLocation(sp, upper, fields[1]), { ...ids, severity }));
    findings.push(makeFinding(rule, messageId, params, cpLocation(sp, lower, fields[0]), { ...ids, severity }));
  };

  // walk the ranges in Tmin order; `prev` is the range reaching highest so far
  let prev = cp.specs[0];
  for (let i = 1; i < cp.specs.length; i++) {
    const next = cp.specs[i];
    const lines = { lowerLine: prev.location.line, upperLine: next.location.line };
    if (next.Tmin > prev.Tmax + JOIN_T_TOLERANCE) {
      both('gap', { from: prev.Tmax, to: next.Tmin, width: r(next.Tmin - prev.Tmax), ...lines }, prev, next, ['cp_Tmax', 'cp_Tmin'], soft ? 'warning' : 'error');
      prev = next.Tmax > prev.Tmax ? next : prev;
      continue;
    }
    if (next.Tmin < prev.Tmax - JOIN_T_TOLERANCE) {
      const to = Math.min(prev.Tmax, next.Tmax);
      both('overlap', { from: next.Tmin, to, width: r(to - next.Tmin), ...lines }, prev, next, ['cp_Tmax', 'cp_Tmin'], 'warning');
    }
    // continuity where the curve switches: at the upper range's Tmin
    const T = next.Tmin;
    const a = segmentOf(prev);
    const b = segmentOf(next);
    const cpLow = a.cp(T);
    const cpHigh = b.cp(T);
    const rel = Math.abs(cpHigh - cpLow) / Math.max(Math.abs(cpLow), Number.MIN_VALUE);
    const ca = constants(prev, a);
    const cb = constants(next, b);
    const dS = ca && cb ? cb.S(T) - ca.S(T) : undefined;
    const dH = ca && cb && ca.hScale === cb.hScale ? cb.H(T) - ca.H(T) : undefined;
    const gStep = Math.max(Math.abs(dH ?? 0), Math.abs((dS ?? 0) * T));
    const level = (rel > JOIN_CP_ERROR || gStep > JOIN_G_ERROR ? 2 : rel > JOIN_CP_WARNING || gStep > JOIN_G_WARNING ? 1 : 0) as 0 | 1 | 2;
    if (level > 0) {
      const severity: Severity = level === 2 && !soft ? 'error' : 'warning';
      const base = { T: r(T), cpLow: r(cpLow), cpHigh: r(cpHigh), cpRel: r(100 * (cpHigh - cpLow) / cpLow, 3), tolRel: 100 * (severity === 'error' ? JOIN_CP_ERROR : JOIN_CP_WARNING), ...lines };
      if (dS !== undefined) {
        const tolG = severity === 'error' ? JOIN_G_ERROR : JOIN_G_WARNING;
        const params = { ...base, dH: dH === undefined ? 'n/a' : r(dH / 1000, 4), dS: r(dS, 4), tolH: tolG / 1000, tolS: r(tolG / T, 3) };
        both('constantsStep', params, prev, next, ['cp_coeffs', 'cp_coeffs'], severity);
      } else {
        both('cpStep', base, prev, next, ['cp_coeffs', 'cp_coeffs'], severity);
      }
    }
    prev = next.Tmax > prev.Tmax ? next : prev;
  }
  return findings;
};

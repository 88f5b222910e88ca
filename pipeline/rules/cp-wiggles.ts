// Spurious wiggles: interior extrema of Cp inside one fitted range. Real substances show at most one
// smooth extremum in a range (a shallow minimum at low temperature, one maximum from an electronic
// or order–disorder contribution); two or more is the oscillation of an over-fitted or damaged
// polynomial.
//
// Extrema are the sign changes of dCp/dT on the dense scan of the range (the scan's turning points),
// kept only when they are significant: the turning points are simplified by persistence, repeatedly
// dropping the smallest swing (between neighbouring turning points, or a turning point and an end of
// the range) while it is below max(0.5 % of the largest |Cp| in the range, 0.05 J/(mol K)). A
// published fit's ripple of a few hundredths of a J/(mol K) is therefore not counted; an oscillation
// is.
import { cpLocation, scanOf, speciesCp, type CpPoint } from '../cp/curve-cache.js';
import type { Finding, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';

export const WIGGLE_RELATIVE = 0.005;
export const WIGGLE_ABSOLUTE = 0.05; // J/(mol K)
/** Interior extrema tolerated in one range. */
export const WIGGLE_ALLOWED = 1;

/** The significant interior extrema of a sampled curve (ends excluded), ascending in T. */
export function significantExtrema(samples: readonly CpPoint[], threshold: number): CpPoint[] {
  if (samples.length < 3) return [];
  // turning points of the sampled sequence, with both ends
  const pts: CpPoint[] = [samples[0]];
  let dir = 0;
  for (let i = 1; i < samples.length; i++) {
    const d = Math.sign(samples[i].cp - samples[i - 1].cp);
    if (d === 0) continue;
    if (dir !== 0 && d !== dir) pts.push(samples[i - 1]);
    dir = d;
  }
  pts.push(samples[samples.length - 1]);
  // persistence simplification
  for (;;) {
    if (pts.length <= 2) break;
    let k = -1;
    let smallest = Infinity;
    for (let i = 0; i < pts.length - 1; i++) {
      const swing = Math.abs(pts[i + 1].cp - pts[i].cp);
      if (swing < smallest) {
        smallest = swing;
        k = i;
      }
    }
    if (smallest >= threshold) break;
    if (k === 0) pts.splice(1, 1); // a swing touching the low end: drop the interior point
    else if (k === pts.length - 2) pts.splice(k, 1); // touching the high end
    else pts.splice(k, 2); // an interior pair: a small bump, drop both
    // two neighbours that now run the same way are not a turning point any more
    for (let i = 1; i < pts.length - 1; i++) {
      if ((pts[i].cp - pts[i - 1].cp) * (pts[i + 1].cp - pts[i].cp) >= 0) {
        pts.splice(i, 1);
        i--;
      }
    }
  }
  return pts.slice(1, -1);
}

export const rule: Rule = {
  id: 'cp-wiggles',
  severity: 'warning',
  docs: 'docs/rules/cp-wiggles.md',
  description: 'Cp should show at most one smooth extremum inside a fitted range; more is an oscillating fit.',
  messages: {
    oscillation: 'Cp has {count} interior extrema between {Tmin} and {Tmax} K (at {temperatures} K, swing {swing} J/(mol K)); a real substance shows at most one smooth maximum or minimum in a range',
  },
};

const r4 = (x: number): number => Number(x.toPrecision(4));

rule.check = (sp: Species): Finding[] => {
  const cp = speciesCp(sp);
  if (!cp) return [];
  const findings: Finding[] = [];
  for (const spec of cp.specs) {
    const scan = scanOf(spec);
    const scale = Math.max(Math.abs(scan.max.cp), Math.abs(scan.min.cp));
    const ext = significantExtrema(scan.turns, Math.max(WIGGLE_RELATIVE * scale, WIGGLE_ABSOLUTE));
    if (ext.length <= WIGGLE_ALLOWED) continue;
    let swing = 0;
    for (let i = 1; i < ext.length; i++) swing = Math.max(swing, Math.abs(ext[i].cp - ext[i - 1].cp));
    const params = {
      count: ext.length,
      Tmin: spec.Tmin,
      Tmax: spec.Tmax,
      temperatures: ext.map((e) => String(Math.round(e.T))).join(', '),
      swing: r4(swing),
    };
    findings.push(makeFinding(rule, 'oscillation', params, cpLocation(sp, spec, 'cp_coeffs'), { species: sp.name, phase: sp.phase }));
  }
  return findings;
};

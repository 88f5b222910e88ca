// A weak screen: within one phase, S° grows with the number of atoms per formula unit. On a log–log
// scale the multiplicative slips that hurt most (cal read as J: ×4.184, J read as kJ: ×1000) are
// constant offsets, so the screen fits ln S° against ln N and flags only values far off that line.
// Warnings only: mass, symmetry and bonding move S° a lot at the same atom count.
import { atomCount } from '../chemistry/formula.js';
import { median } from 'simple-statistics';
import { toDeclared } from '../units/convert.js';
import type { Finding, Location, Phase, Species } from '../types.js';
import { rowGiving, type DatasetRule } from './dataset.js';
import { asSpeciesList, type SpeciesList } from '../species-list.js';
import { makeFinding } from './finding.js';
import { robustScale } from './robust.js';

/** Phases screened: aqueous entropies are relative to H+(aq) and may be negative, so they are left out. */
export const SCREENED: readonly Phase[] = ['g', 'l', 'cr'];
/** Species a phase needs before it is screened, and distinct atom counts among them. */
export const MIN_SPECIES = 10;
export const MIN_ATOM_COUNTS = 3;
/** Smallest scale of ln S° residuals: 0.1 (about ±10 %), so the cut-off is at least a factor e^0.6 ≈ 1.8. */
export const LOG_SCALE_FLOOR = 0.1;
/** |residual| / scale above which S° is flagged. */
export const ATOMS_Z = 6;

export const rule: DatasetRule = {
  id: 'entropy-atoms',
  severity: 'warning',
  docs: 'docs/rules/entropy-atoms.md',
  description: 'A weak screen: S° far off the trend of S° against atoms per formula unit within one phase, or not positive.',
  messages: {
    off:
      'S° = {value} {unit} is far from what species of phase {phase} with {atoms} atoms have in this table (about {expected} {unit}, ' +
      'a factor {factor} off; screened over {count} species); check the unit and the digits',
    nonpositive: 'S° = {value} {unit} is not positive; the third law makes S° of a {phase} substance positive at 298.15 K',
  },
  checkAll: (species) => entropyAtomFindings(species),
};

const round = (x: number): number => Number(x.toPrecision(4));

function where(sp: Species): Location {
  const row = rowGiving(sp, 'S');
  const loc: Location = { ...(row?.location ?? sp.location), field: 'S' };
  if (loc.file === sp.location.file && sp.columns.S !== undefined) loc.column = sp.columns.S;
  return loc;
}

/** Theil–Sen line: slope the median of pairwise slopes, intercept the median of y − slope·x. */
export function theilSen(points: readonly { x: number; y: number }[]): { slope: number; intercept: number } {
  const slopes: number[] = [];
  for (let i = 0; i < points.length; i++) {
    for (let j = i + 1; j < points.length; j++) {
      const dx = points[j]!.x - points[i]!.x;
      if (dx !== 0) slopes.push((points[j]!.y - points[i]!.y) / dx);
    }
  }
  const slope = slopes.length ? median(slopes) : 0;
  return { slope, intercept: median(points.map((p) => p.y - slope * p.x)) };
}

export function entropyAtomFindings(input: readonly Species[] | SpeciesList): Finding[] {
  const list = asSpeciesList(input);
  const findings: Finding[] = [];
  // indices, S° and atom counts only, in typed arrays shared by the phases: a table of 10^6 rows has
  // ~10^5 species per phase, and number arrays that large would go straight to the old generation
  const perPhase = new Map<Phase, number>();
  for (let i = 0; i < list.length; i++) {
    const p = list.phase(i);
    perPhase.set(p, (perPhase.get(p) ?? 0) + 1);
  }
  const size = Math.max(0, ...SCREENED.map((p) => perPhase.get(p) ?? 0));
  const idx = new Int32Array(size);
  const Ss = new Float64Array(size);
  const Ns = new Float64Array(size);
  for (const phase of SCREENED) {
    let n = 0;
    for (let i = 0; i < list.length; i++) {
      if (list.phase(i) !== phase) continue;
      const S = list.S(i);
      if (S === undefined) continue;
      const N = atomCount(list.formula(i));
      if (N <= 0) continue;
      if (S > 0) {
        idx[n] = i;
        Ss[n] = S;
        Ns[n] = N;
        n++;
        continue;
      }
      const sp = list.at(i);
      const unit = sp.units.S ?? 'J/(mol K)';
      findings.push(makeFinding(rule, 'nonpositive', { value: round(toDeclared(S, 'S', unit)), unit, phase }, where(sp), { species: sp.name, phase }));
    }
    // one point per atom count (the median of ln S°), so a crowd of similar species does not outvote the rest
    const byN = new Map<number, number[]>();
    for (let k = 0; k < n; k++) {
      const ys = byN.get(Ns[k]!);
      if (ys) ys.push(Math.log(Ss[k]!));
      else byN.set(Ns[k]!, [Math.log(Ss[k]!)]);
    }
    if (n < MIN_SPECIES || byN.size < MIN_ATOM_COUNTS) continue;
    const line = theilSen([...byN].map(([N, ys]) => ({ x: Math.log(N), y: median(ys) })));
    const predict = (N: number): number => line.intercept + line.slope * Math.log(N);
    const resid = new Float64Array(n);
    for (let k = 0; k < n; k++) resid[k] = Math.log(Ss[k]!) - predict(Ns[k]!);
    const scale = robustScale(resid, LOG_SCALE_FLOOR);
    for (let k = 0; k < n; k++) {
      if (Math.abs(resid[k]!) <= ATOMS_Z * scale) continue;
      const sp = list.at(idx[k]!);
      const unit = sp.units.S ?? 'J/(mol K)';
      const params = {
        value: round(toDeclared(Ss[k]!, 'S', unit)),
        unit,
        phase,
        atoms: Ns[k]!,
        expected: round(toDeclared(Math.exp(predict(Ns[k]!)), 'S', unit)),
        factor: round(Math.exp(Math.abs(resid[k]!))),
        count: n,
      };
      findings.push(makeFinding(rule, 'off', params, where(sp), { species: sp.name, phase }));
    }
  }
  return findings;
}

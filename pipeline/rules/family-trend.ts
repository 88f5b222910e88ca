// Homologous series: species of one phase whose formulas differ by whole CH2 units and share the rest
// (CnH2n+2, CnH2n, CnH2n+1OH, …). Along a series ΔfH° and S° grow by a near-constant increment per CH2,
// so a member far off the straight line against carbon count is suspect.
//
// Method, per series and field (ΔfH°, S°):
//   - the lowest member is neither fitted nor flagged: first members (CH4, CH3OH, C2H4) lack the
//     neighbour interactions every later member has and sit well off the line in real data;
//   - at least MIN_FITTED further members are needed; a member is judged against the least-squares line
//     through the OTHER members (a deleted residual), scaled by a robust scale of those members'
//     residuals (1.4826·MAD, with a floor) widened for extrapolation and by the member's own stated
//     uncertainty;
//   - the worst member beyond TREND_Z is flagged and left out, and the search repeats, so one planted
//     outlier does not drag its neighbours off the line with it.
import { formatFormula } from '../chemistry/formula.js';
import { toDeclared } from '../units/convert.js';
import type { Finding, Location, Phase, Rule, Species } from '../types.js';
import { rowGiving, type DatasetRule } from './dataset.js';
import { asSpeciesList, type SpeciesList } from '../species-list.js';
import { makeFinding } from './finding.js';
import { fitLine, lineAt, robustScale } from './robust.js';

export type TrendField = 'dHf' | 'S';
const FIELDS: readonly TrendField[] = ['dHf', 'S'];

/** Fitted members a series needs (after its first member is set aside): with three, any one of them could be the odd one. */
export const MIN_FITTED = 4;
/** |deleted residual| / scale above which a member is off the trend. */
export const TREND_Z = 4;
/**
 * Smallest residual scale, SI. Increments per CH2 in well-measured series scatter by about 1 kJ/mol in
 * ΔfH° and 1 J/(mol K) in S° (common practice); 1.5 keeps the cut-off at 6 kJ/mol and 6 J/(mol K) at least.
 */
export const SCALE_FLOOR: Readonly<Record<TrendField, number>> = { dHf: 1500, S: 1.5 };

const DISPLAY: Readonly<Record<TrendField, { unit: string; per: number }>> = {
  dHf: { unit: 'kJ/mol', per: 1000 },
  S: { unit: 'J/(mol K)', per: 1 },
};

export const rule: DatasetRule = {
  id: 'family-trend',
  severity: 'warning',
  docs: 'docs/rules/family-trend.md',
  description: 'Members of a homologous series (formulas differing by CH2) far off the straight line of ΔfH° or S° against carbon count.',
  messages: {
    off:
      '{field} = {value} {unit} is off the trend of its CH2 series {series} ({members} members, C{nMin}–C{nMax}): ' +
      'the line through the other members gives {expected} {unit} at C{n} ({increment} {incrementUnit} per CH2); ' +
      'off by {offBy} {incrementUnit}, {z} times the scale {scale} {incrementUnit}',
  },
  checkAll: (species) => familyTrendFindings(species),
};

export interface SeriesMember {
  n: number; // carbon count
  /** index into the species list */
  index: number;
  name: string;
}

export interface Series {
  phase: Phase;
  /** readable label: the general formula, e.g. CnH2n+2 or CnH2n+1OH-like `CnH2n+2O` */
  label: string;
  members: SeriesMember[]; // ascending n, one species per n
}

/** Names that mark a straight chain (n-butane, 1-butene, normal-hexane). */
const STRAIGHT = /^(n-|n |1-|normal[- ])/i;
/** Names that mark a branched or cyclic isomer. */
const BRANCHED = /iso|neo|tert|sec-|cyclo|methyl|ethyl[a-z]|\b[2-9]-|,/i;

/** One species per carbon count: the only one, else the one named as a straight chain; undefined when it cannot be told. */
function pickIsomer<T extends { name: string }>(cands: T[]): T | undefined {
  if (cands.length === 1) return cands[0];
  const straight = cands.filter((s) => STRAIGHT.test(s.name));
  if (straight.length === 1) return straight[0];
  const plain = cands.filter((s) => !BRANCHED.test(s.name));
  return plain.length === 1 ? plain[0] : undefined;
}

function generalFormula(h: number, rest: string): string {
  const hPart = h === 0 ? 'H2n' : h > 0 ? `H2n+${h}` : `H2n-${-h}`;
  return `Cn${hPart}${rest}`;
}

/**
 * Groups species into CH2 series: same phase, same charge, same elements other than C and H, same
 * H − 2·C. Carbon counts must be whole; where several isomers share a carbon count and the names do
 * not say which is the straight chain, that count is left out of the series.
 */
export function findSeries(input: readonly Species[] | SpeciesList): Series[] {
  const list = asSpeciesList(input);
  const groups = new Map<string, { phase: Phase; label: string; byN: Map<number, number[]> }>(); // species indices per carbon count
  for (let i = 0; i < list.length; i++) {
    const formula = list.formula(i);
    const C = formula.elements.C;
    const H = formula.elements.H;
    if (C === undefined || H === undefined || !Number.isInteger(C) || !Number.isInteger(H) || C < 1) continue;
    const restEls: Record<string, number> = {};
    for (const [el, k] of Object.entries(formula.elements)) if (el !== 'C' && el !== 'H') restEls[el] = k;
    const rest = formatFormula({ elements: restEls, charge: formula.charge });
    const h = H - 2 * C;
    const phase = list.phase(i);
    const key = `${phase}|${h}|${rest}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { phase, label: generalFormula(h, rest), byN: new Map() }));
    const at = g.byN.get(C);
    if (at) at.push(i);
    else g.byN.set(C, [i]);
  }
  const out: Series[] = [];
  for (const g of groups.values()) {
    const members: SeriesMember[] = [];
    if (g.byN.size < MIN_FITTED + 1) continue;
    for (const [n, indices] of g.byN) {
      const sp = pickIsomer(indices.map((index) => ({ index, name: list.name(index) })));
      if (sp) members.push({ n, index: sp.index, name: sp.name });
    }
    if (members.length < MIN_FITTED + 1) continue;
    members.sort((a, b) => a.n - b.n);
    out.push({ phase: g.phase, label: g.label, members });
  }
  return out.sort((a, b) => (a.label < b.label ? -1 : a.label > b.label ? 1 : a.phase < b.phase ? -1 : 1));
}

export interface TrendPoint {
  x: number;
  y: number; // SI
  u: number; // stated standard uncertainty, SI (0 when none)
}

export interface OffTrend {
  index: number;
  expected: number; // SI
  residual: number; // SI
  scale: number; // SI
  z: number;
  slope: number; // SI per CH2
}

/** The members off the line (see the file comment), by index into `points`. */
export function offTrend(points: readonly TrendPoint[], floor: number): OffTrend[] {
  const active = points.map((_, i) => i);
  const flagged: OffTrend[] = [];
  while (active.length >= MIN_FITTED && flagged.length + 1 < points.length / 2) {
    let worst: OffTrend | undefined;
    for (const i of active) {
      const others = active.filter((j) => j !== i);
      const line = fitLine(others.map((j) => [points[j]!.x, points[j]!.y] as const));
      const resid = others.map((j) => points[j]!.y - lineAt(line, points[j]!.x));
      // prediction at x from a line fitted on m points: variance factor 1 + 1/m + (x − x̄)²/Sxx
      const xs = others.map((j) => points[j]!.x);
      const xbar = xs.reduce((a, b) => a + b, 0) / xs.length;
      const sxx = xs.reduce((a, x) => a + (x - xbar) ** 2, 0);
      const lever = Math.sqrt(1 + 1 / xs.length + (points[i]!.x - xbar) ** 2 / sxx);
      const scale = Math.hypot(robustScale(resid, floor) * lever, points[i]!.u);
      const expected = lineAt(line, points[i]!.x);
      const residual = points[i]!.y - expected;
      const z = residual / scale;
      if (!worst || Math.abs(z) > Math.abs(worst.z)) worst = { index: i, expected, residual, scale, z, slope: line.slope };
    }
    if (!worst || Math.abs(worst.z) <= TREND_Z) break;
    flagged.push(worst);
    active.splice(active.indexOf(worst.index), 1);
  }
  return flagged;
}

const round = (x: number): number => Number(x.toPrecision(6));

function where(sp: Species, field: TrendField): Location {
  const row = rowGiving(sp, field);
  const loc: Location = { ...(row?.location ?? sp.location), field };
  if (loc.file === sp.location.file && sp.columns[field] !== undefined) loc.column = sp.columns[field];
  return loc;
}

export function familyTrendFindings(input: readonly Species[] | SpeciesList): Finding[] {
  const list = asSpeciesList(input);
  const findings: Finding[] = [];
  for (const series of findSeries(list)) {
    // the first member is set aside (file comment); each member's values and stated uncertainties, read once
    const fitted = series.members.slice(1).map((m) => {
      const sp = list.at(m.index);
      const u = (field: TrendField) => rowGiving(sp, field)?.[field === 'dHf' ? 'u_dHf' : 'u_S'] ?? 0;
      return { m, dHf: sp.dHf, S: sp.S, u: { dHf: u('dHf'), S: u('S') } };
    });
    for (const field of FIELDS) {
      const have = fitted.filter((f) => f[field] !== undefined);
      if (have.length < MIN_FITTED) continue;
      const points = have.map((f) => ({ x: f.m.n, y: f[field]!, u: f.u[field] }));
      for (const o of offTrend(points, SCALE_FLOOR[field])) {
        const m = have[o.index]!.m;
        const sp = list.at(m.index);
        const unit = sp.units[field] ?? DISPLAY[field].unit;
        const per = DISPLAY[field].per;
        const params = {
          field,
          value: round(toDeclared(sp[field]!, field, unit)),
          unit,
          series: series.label,
          members: series.members.length,
          nMin: series.members[0]!.n,
          nMax: series.members[series.members.length - 1]!.n,
          n: m.n,
          expected: round(toDeclared(o.expected, field, unit)),
          increment: round(o.slope / per),
          incrementUnit: DISPLAY[field].unit,
          offBy: round(o.residual / per),
          z: round(Math.abs(o.z)),
          scale: round(o.scale / per),
        };
        findings.push(makeFinding(rule, 'off', params, where(sp, field), { species: sp.name, phase: sp.phase }));
      }
    }
  }
  return findings;
}

// The same species and phase given by several sources: values that disagree beyond their stated
// uncertainties. With three or more sources a robust z (median and MAD) names the odd one out; with two,
// the rule can only say that they disagree. Rows of one source that disagree are conflicting-values'.
import { R_J_PER_MOL_K } from '../cp/constants.js';
import { excerpt } from '../errors.js';
import { toDeclared } from '../units/convert.js';
import type { Finding, Location, RowValues, Rule, Species } from '../types.js';
import { makeFinding } from './finding.js';
import { medianOf, robustScale } from './robust.js';

export type CrossField = 'dHf' | 'dGf' | 'S';
const FIELDS: readonly CrossField[] = ['dHf', 'dGf', 'S'];

/**
 * Standard uncertainty assumed for a source that states none, SI units. Major compilations agree on
 * ΔfH° and ΔfG° of well-studied species to about 1 kJ/mol and on S° to about 1 J/(mol K) (common
 * practice for a "good" value; stated uncertainties, when given, replace these).
 */
export const DEFAULT_U: Readonly<Record<CrossField, number>> = { dHf: 1000, dGf: 1000, S: 1 };
/** Coverage factor for "beyond the combined uncertainty": k = 2, about 95 % for normal errors (GUM practice). */
export const COVERAGE_K = 2;
/** |robust z| above which a source is the odd one out (the modified-z cut-off of Iglewicz and Hoaglin 1993, 3.5). */
export const ODD_Z = 3.5;

/** Display units of the spread and tolerance params: kJ/mol for energies, J/(mol K) for S°. */
const DISPLAY: Readonly<Record<CrossField, { unit: string; per: number }>> = {
  dHf: { unit: 'kJ/mol', per: 1000 },
  dGf: { unit: 'kJ/mol', per: 1000 },
  S: { unit: 'J/(mol K)', per: 1 },
};

export const rule: Rule = {
  id: 'cross-source',
  severity: 'error',
  docs: 'docs/rules/cross-source.md',
  description: 'The same species and phase from several sources: values that disagree beyond their uncertainties, and the odd source when three or more agree otherwise.',
  messages: {
    odd:
      '{field} = {value} {unit} from "{source}" is the odd one out of {sources} sources: their median is {median} {unit}, ' +
      'this value is {offBy} {spreadUnit} off (robust z {z}), beyond the {tolerance} {spreadUnit} its uncertainty and theirs allow',
    two:
      '{field} = {value} {unit} from "{source}" and {other} {unit} from "{otherSource}" (line {otherLine}) differ by {spread} {spreadUnit}, ' +
      'beyond the {tolerance} {spreadUnit} their uncertainties allow; two sources cannot tell which is right',
    spread:
      '{field} from {sources} sources spreads over {spread} {spreadUnit} (median {median} {unit}), beyond the {tolerance} {spreadUnit} ' +
      'their uncertainties allow, and no single source stands out; this row is the farthest from the median',
  },
};

/** One source's value of one field. */
export interface SourceValue {
  source: string;
  /** SI, gas entropies brought to the 1 bar standard state */
  value: number;
  /** standard uncertainty, SI: the stated one, else DEFAULT_U */
  u: number;
  uStated: boolean;
  row: RowValues;
}

/** A row's source: its `source` text; a row without one stands for its file (tables merged from several files). */
export function sourceOf(row: RowValues): string {
  return row.source !== '' ? row.source : `(no source: ${row.location.file})`;
}

/** One value per distinct source (the first row of that source that gives the field), in input order. */
export function sourceValues(sp: Species, field: CrossField): SourceValue[] {
  const seen = new Set<string>();
  const out: SourceValue[] = [];
  for (const row of sp.values) {
    let v = row[field];
    const source = sourceOf(row);
    if (v === undefined || seen.has(source)) continue;
    seen.add(source);
    // S°(1 bar) = S°(P_ref) + R ln(P_ref / 1 bar) for an ideal gas; formation energies barely move (ignored)
    if (field === 'S' && sp.phase === 'g' && row.P_ref !== 1) v += R_J_PER_MOL_K * Math.log(row.P_ref);
    const stated = row[`u_${field}`];
    out.push({ source, value: v, u: stated ?? DEFAULT_U[field], uStated: stated !== undefined, row });
  }
  return out;
}

export type CrossVerdict =
  | { kind: 'agree' }
  | { kind: 'odd'; median: number; scale: number; odd: { index: number; z: number; tolerance: number; medianOthers: number }[] }
  | { kind: 'two'; tolerance: number }
  | { kind: 'spread'; median: number; farthest: number; tolerance: number };

const combined = (a: number, b: number): number => COVERAGE_K * Math.hypot(a, b);
/** max − min without spreading a huge array into arguments */
function rangeOf(xs: readonly number[]): number {
  let lo = Infinity;
  let hi = -Infinity;
  for (const x of xs) {
    if (x < lo) lo = x;
    if (x > hi) hi = x;
  }
  return hi - lo;
}

/** up to this many sources every pair is compared; beyond it the spread is judged in one pass */
const PAIRWISE_MAX = 64;

/**
 * The statistics, apart from any species: `values` one per source (SI), `floor` the smallest scale
 * (SI, the default uncertainty of the field).
 */
export function judgeSources(values: readonly { value: number; u: number }[], floor: number): CrossVerdict {
  const n = values.length;
  if (n < 2) return { kind: 'agree' };
  if (n === 2) {
    const [a, b] = values as [{ value: number; u: number }, { value: number; u: number }];
    const tol = combined(a.u, b.u);
    return Math.abs(a.value - b.value) > tol ? { kind: 'two', tolerance: tol } : { kind: 'agree' };
  }
  const xs = values.map((v) => v.value);
  const median = medianOf(xs);
  let uMed: number | undefined;
  const uMedian = (): number => (uMed ??= medianOf(values.map((v) => v.u)));
  const scale = robustScale(xs, floor);
  const odd: { index: number; z: number; tolerance: number; medianOthers: number }[] = [];
  values.forEach((v, index) => {
    const z = (v.value - median) / scale;
    if (Math.abs(z) <= ODD_Z) return;
    // with many sources, leaving one out does not move the medians: use the whole set's, O(1) per value
    const others = n <= PAIRWISE_MAX ? values.filter((_, j) => j !== index) : undefined;
    const medianOthers = others ? medianOf(others.map((o) => o.value)) : median;
    const tolerance = combined(v.u, others ? medianOf(others.map((o) => o.u)) : uMedian());
    if (Math.abs(v.value - medianOthers) > tolerance) odd.push({ index, z, tolerance, medianOthers });
  });
  // an odd one out needs a majority that agrees: otherwise the sources simply scatter
  if (odd.length > 0 && odd.length < n / 2) return { kind: 'odd', median, scale, odd };
  let worst = 0;
  let tolerance = 0;
  if (n <= PAIRWISE_MAX) {
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const tol = combined(values[i]!.u, values[j]!.u);
        const excess = Math.abs(values[i]!.value - values[j]!.value) / tol;
        if (excess > worst) {
          worst = excess;
          tolerance = tol;
        }
      }
    }
  } else {
    // many sources (a generated or hostile table): the full spread against the median uncertainty, O(n)
    tolerance = combined(uMedian(), uMedian());
    worst = rangeOf(xs) / tolerance;
  }
  if (worst <= 1) return { kind: 'agree' };
  let farthest = 0;
  values.forEach((v, i) => {
    if (Math.abs(v.value - median) > Math.abs(values[farthest]!.value - median)) farthest = i;
  });
  return { kind: 'spread', median, farthest, tolerance };
}

const round = (x: number): number => Number(x.toPrecision(6));

function where(sp: Species, row: RowValues, field: CrossField): Location {
  const loc: Location = { ...row.location, field };
  // columns are known for the species' first file only (Species.columns)
  if (row.location.file === sp.location.file && sp.columns[field] !== undefined) loc.column = sp.columns[field];
  return loc;
}

/** Whether the species record takes its value of `field` from this row (records.ts: the first row that gives it). */
function inUse(sp: Species, row: RowValues, field: CrossField): boolean {
  return sp.values.find((v) => v[field] !== undefined) === row;
}

rule.check = (sp: Species): Finding[] => {
  const findings: Finding[] = [];
  for (const field of FIELDS) {
    const vals = sourceValues(sp, field);
    if (vals.length < 2) continue;
    const verdict = judgeSources(vals, DEFAULT_U[field]);
    if (verdict.kind === 'agree') continue;
    const unit = sp.units[field] ?? (field === 'S' ? 'J/(mol K)' : 'kJ/mol');
    const disp = DISPLAY[field];
    const declared = (si: number): number => round(toDeclared(si, field, unit));
    const shown = (si: number): number => round(si / disp.per);
    const xs = vals.map((v) => v.value);
    const spread = shown(rangeOf(xs));
    const ids = { species: sp.name, phase: sp.phase };
    const common = { field, unit, spreadUnit: disp.unit, spread, sources: vals.length };
    if (verdict.kind === 'two') {
      const [a, b] = vals as [SourceValue, SourceValue];
      const params = {
        ...common,
        value: declared(b.value),
        source: excerpt(b.source),
        other: declared(a.value),
        otherSource: excerpt(a.source),
        otherLine: a.row.location.line,
        tolerance: shown(verdict.tolerance),
      };
      findings.push(makeFinding(rule, 'two', params, where(sp, b.row, field), { ...ids, severity: 'warning' }));
    } else if (verdict.kind === 'spread') {
      const far = vals[verdict.farthest]!;
      const params = { ...common, median: declared(verdict.median), tolerance: shown(verdict.tolerance) };
      findings.push(makeFinding(rule, 'spread', params, where(sp, far.row, field), { ...ids, severity: 'warning' }));
    } else {
      for (const o of verdict.odd) {
        const v = vals[o.index]!;
        const params = {
          ...common,
          value: declared(v.value),
          source: excerpt(v.source),
          median: declared(verdict.median),
          offBy: shown(v.value - verdict.median),
          z: round(o.z),
          tolerance: shown(o.tolerance),
          inUse: inUse(sp, v.row, field) ? 'yes' : 'no',
        };
        findings.push(
          makeFinding(rule, 'odd', params, where(sp, v.row, field), {
            ...ids,
            diagnosis: { cause: 'odd-source', field, corrected: toDeclared(verdict.median, field, unit), unit, residualAfter: 0 },
          }),
        );
      }
    }
  }
  return findings;
};

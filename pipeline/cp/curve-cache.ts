// One Cp curve per species and one dense scan per Cp range, built on first use and kept while the
// pipeline is looking at that species. Every Cp rule and the report summary read these, so a
// species' segments are built once however many rules look at them; the rules run species by
// species, so only the species in hand is kept (a million-row table does not hold a million curves).
// Asking for another species, or for a spec that is not the current species', builds afresh.
//
// A scan samples Cp on a grid that is the union of a linear and a logarithmic grid over the range
// (the logarithmic one resolves the T⁻¹ and T⁻² terms near the low end), plus any listed temperatures
// (a tabulated Cp has its extremes on its nodes). Every sampled local minimum and maximum is then
// refined by golden-section search between its two neighbouring samples, so the extremes found are
// those of the function, not of the grid. A scan keeps only what the rules read (the extremes and the
// sampled turning points), not the ~110 samples.

import type { CpCurve, CpSegment, CpSpec, Location, Species } from '../types.js';
import { buildCurve, buildSegment } from './index.js';

export interface SpeciesCp {
  /** the species' Cp specifications, sorted by Tmin (the order Species.cp keeps) */
  specs: CpSpec[];
  /** segments[i] is built from specs[i] */
  segments: CpSegment[];
  curve: CpCurve;
}

export interface CpPoint {
  T: number; // K
  cp: number; // J/(mol K)
}

export interface CpScan {
  /** the turning points of the sampled sequence, ascending in T, with both ends of the interval */
  turns: CpPoint[];
  min: CpPoint;
  max: CpPoint;
}

const LINEAR_POINTS = 64;
const LOG_POINTS = 48;
const GOLDEN_ITERATIONS = 60; // shrinks a bracket by 0.618^60 ≈ 3e-13

/** The species in hand: its curve (undefined when it has none) and the scans asked for so far. */
let current: { sp: Species; cp: SpeciesCp | undefined; scans: (CpScan | undefined)[] } | undefined;

function build(sp: Species): SpeciesCp | undefined {
  if (sp.cp.length === 0) return undefined;
  try {
    const specs = sp.cp.slice().sort((a, b) => a.Tmin - b.Tmin || a.Tmax - b.Tmax);
    const segments = specs.map(buildSegment);
    return { specs, segments, curve: buildCurve(segments) };
  } catch {
    return undefined; // ingest rejects specs that do not build; a hand-made Species may still carry one
  }
}

/** The species' segments and joined curve; undefined when it has no Cp or a range cannot be built. */
export function speciesCp(sp: Species): SpeciesCp | undefined {
  if (current?.sp !== sp) current = { sp, cp: build(sp), scans: [] };
  return current.cp;
}

/** Index of spec among the current species' specs, or −1. */
function currentIndex(spec: CpSpec): number {
  return current?.cp ? current.cp.specs.indexOf(spec) : -1;
}

/** The analytic segment of one Cp specification. Throws CpSpecError like buildSegment. */
export function segmentOf(spec: CpSpec): CpSegment {
  const i = currentIndex(spec);
  return i >= 0 ? current!.cp!.segments[i] : buildSegment(spec);
}

/** The dense scan of one range over its own [Tmin, Tmax]. */
export function scanOf(spec: CpSpec): CpScan {
  const i = currentIndex(spec);
  if (i >= 0 && current!.scans[i]) return current!.scans[i]!;
  const segment = segmentOf(spec);
  const scan = scanFunction((T) => segment.cp(T), spec.Tmin, spec.Tmax, spec.temps);
  if (i >= 0) current!.scans[i] = scan;
  return scan;
}

/** Grids without extra points by their ends: a table gives most of its ranges the same few bounds. Never modified. */
const grids = new Map<string, readonly number[]>();
const GRID_CACHE_LIMIT = 1000;

/** Sample grid over [a, b] (0 < a < b): linear ∪ logarithmic ∪ extra points inside, ascending, unique. */
export function sampleGrid(a: number, b: number, extra: readonly number[] = []): readonly number[] {
  if (extra.length > 0 || !(a > 0)) return makeGrid(a, b, extra); // (−0 and 0 would share a key)
  const key = `${a} ${b}`;
  let grid = grids.get(key);
  if (grid === undefined) {
    if (grids.size >= GRID_CACHE_LIMIT) grids.clear();
    grids.set(key, (grid = makeGrid(a, b, extra)));
  }
  return grid;
}

function makeGrid(a: number, b: number, extra: readonly number[]): number[] {
  const lin = new Array<number>(LINEAR_POINTS + 1);
  for (let i = 0; i <= LINEAR_POINTS; i++) lin[i] = a + ((b - a) * i) / LINEAR_POINTS;
  let log: number[] = [];
  if (a > 0) {
    const step = Math.pow(b / a, 1 / LOG_POINTS);
    log = new Array<number>(LOG_POINTS - 1);
    let t = a;
    for (let i = 0; i < LOG_POINTS - 1; i++) log[i] = t *= step;
  }
  let merged = merge(lin, log);
  if (extra.length) merged = merge(merged, extra.filter((t) => t > a && t < b).sort((x, y) => x - y));
  merged[0] = a;
  merged[merged.length - 1] = b;
  return merged;
}

/** Merge two ascending lists, dropping repeats and anything outside the first list's span. */
function merge(x: readonly number[], y: readonly number[]): number[] {
  const out: number[] = [];
  let i = 0;
  let j = 0;
  const lo = x[0];
  const hi = x[x.length - 1];
  while (i < x.length || j < y.length) {
    const v = j >= y.length || (i < x.length && x[i] <= y[j]) ? x[i++] : y[j++];
    if (v < lo || v > hi) continue;
    if (out.length === 0 || v > out[out.length - 1]) out.push(v);
  }
  return out;
}

/** Golden-section search for the minimum of f on [lo, hi] (f unimodal there). */
export function goldenMin(f: (T: number) => number, lo: number, hi: number): CpPoint {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = f(c);
  let fd = f(d);
  for (let i = 0; i < GOLDEN_ITERATIONS && b - a > 1e-9 * Math.max(1, Math.abs(a)); i++) {
    if (fc <= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return fc <= fd ? { T: c, cp: fc } : { T: d, cp: fd };
}

// Scratch buffers for the samples, grown as needed and reused by every scan (scans never nest).
let bufT = new Float64Array(256);
let bufCp = new Float64Array(256);

/**
 * Samples f densely over [a, b] and finds its minimum and maximum: the best sampled point, refined by
 * golden-section search between the neighbours of every sampled local extremum, and the two ends.
 */
export function scanFunction(f: (T: number) => number, a: number, b: number, extra: readonly number[] = []): CpScan {
  const grid = sampleGrid(a, b, extra);
  const n = grid.length;
  if (bufT.length < n) {
    bufT = new Float64Array(2 * n);
    bufCp = new Float64Array(2 * n);
  }
  const T = bufT;
  const cp = bufCp;
  let iMin = 0;
  let iMax = 0;
  for (let i = 0; i < n; i++) {
    T[i] = grid[i];
    cp[i] = f(grid[i]);
    if (cp[i] < cp[iMin]) iMin = i;
    if (cp[i] > cp[iMax]) iMax = i;
  }
  let min: CpPoint = { T: T[iMin], cp: cp[iMin] };
  let max: CpPoint = { T: T[iMax], cp: cp[iMax] };
  const turns: CpPoint[] = [{ T: T[0], cp: cp[0] }];
  let dir = 0;
  for (let i = 1; i < n; i++) {
    if (i < n - 1 && !(cp[i] === cp[i - 1] && cp[i] === cp[i + 1])) {
      // a sampled local extremum (a flat stretch has none to refine)
      const p = cp[i - 1];
      const s = cp[i];
      const q = cp[i + 1];
      if (s <= p && s <= q) {
        const m = goldenMin(f, T[i - 1], T[i + 1]);
        if (m.cp < min.cp) min = m;
      }
      if (s >= p && s >= q) {
        const m = goldenMin((x) => -f(x), T[i - 1], T[i + 1]);
        if (-m.cp > max.cp) max = { T: m.T, cp: -m.cp };
      }
    }
    const d = Math.sign(cp[i] - cp[i - 1]);
    if (d === 0) continue;
    if (dir !== 0 && d !== dir) turns.push({ T: T[i - 1], cp: cp[i - 1] });
    dir = d;
  }
  if (n > 1) turns.push({ T: T[n - 1], cp: cp[n - 1] });
  return { turns, min, max };
}

/** The location of a Cp row, pointing at one of its fields when the table says where that field is. */
export function cpLocation(sp: Species, spec: CpSpec, field?: string): Location {
  const loc: Location = { file: spec.location.file, line: spec.location.line };
  if (field !== undefined) {
    const column = sp.columns[field];
    if (column !== undefined) loc.column = column;
    loc.field = field;
  }
  return loc;
}

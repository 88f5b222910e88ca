// Build Species records directly (the shape ingest produces) and small numerical helpers written for
// these tests, independent of the code under test.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseFormula, splitPhaseSuffix } from '../../pipeline/chemistry/formula.js';
import type { CpSpec, Phase, Species } from '../../pipeline/types.js';

const loc = (line: number) => ({ file: 'species.csv', line });
let line = 1;

export interface SpeciesInput {
  name: string;
  formula?: string;
  phase: Phase;
  state?: string;
  dHf_kJ?: number;
  dGf_kJ?: number;
  S?: number; // J/(mol K)
  u?: { dHf_kJ?: number; dGf_kJ?: number; S?: number };
  /** Shomate ranges: [Tmin, Tmax, A, B, C, D, E, F, G, H] */
  shomate?: number[][];
  /** poly ranges in J/(mol K): { exponents, coeffs, Tmin, Tmax } */
  poly?: { exponents: number[]; coeffs: number[]; Tmin: number; Tmax: number }[];
}

/** A Species with SI values, kJ/mol declared as the unit of the energy columns (the default). */
export function species(s: SpeciesInput): Species {
  const l = line++;
  const cp: CpSpec[] = [];
  for (const r of s.shomate ?? []) {
    cp.push({ model: 'shomate', coeffs: r.slice(2), unit: 'shomate', unitFactor: 1, Tmin: r[0]!, Tmax: r[1]!, location: loc(l) });
  }
  for (const p of s.poly ?? []) {
    cp.push({ model: 'poly', coeffs: p.coeffs, exponents: p.exponents, unit: 'J/(mol K)', unitFactor: 1, Tmin: p.Tmin, Tmax: p.Tmax, location: loc(l) });
  }
  const formulaText = s.formula ?? splitPhaseSuffix(s.name).formula;
  const sp: Species = {
    key: `${s.name}|${s.phase}`,
    name: s.name,
    formulaText,
    formula: parseFormula(formulaText),
    phase: s.phase,
    u: {},
    P_ref: 1,
    values: [],
    cp: cp.sort((a, b) => a.Tmin - b.Tmin),
    location: loc(l),
    columns: { species: 1, dHf: 3, dGf: 4, S: 5 },
    units: { dHf: 'kJ/mol', dGf: 'kJ/mol', S: 'J/(mol K)' },
  };
  if (s.state) sp.state = s.state;
  if (s.dHf_kJ !== undefined) sp.dHf = s.dHf_kJ * 1000;
  if (s.dGf_kJ !== undefined) sp.dGf = s.dGf_kJ * 1000;
  if (s.S !== undefined) sp.S = s.S;
  if (s.u?.dHf_kJ !== undefined) sp.u.dHf = s.u.dHf_kJ * 1000;
  if (s.u?.dGf_kJ !== undefined) sp.u.dGf = s.u.dGf_kJ * 1000;
  if (s.u?.S !== undefined) sp.u.S = s.u.S;
  return sp;
}

/** Constant Cp over a range, as a poly correlation. */
export function constantCp(cp: number, Tmin = 200, Tmax = 3000): SpeciesInput['poly'] {
  return [{ exponents: [0], coeffs: [cp], Tmin, Tmax }];
}

const dir = mkdtempSync(join(tmpdir(), 'thermovet-eq-'));
let n = 0;
export function tempFile(content: string, ext = 'csv'): string {
  const p = join(dir, `f${++n}.${ext}`);
  writeFileSync(p, content);
  return p;
}

// ---------------------------------------------------------------------------------------------
// Independent quadrature: composite 10-point Gauss–Legendre (nodes and weights from Abramowitz and
// Stegun, Table 25.4) on many equal pieces, with breakpoints where the integrand has kinks.

const GL_X = [0.1488743389816312, 0.4333953941292472, 0.6794095682990244, 0.8650633666889845, 0.9739065285171717];
const GL_W = [0.2955242247147529, 0.2692667193099963, 0.219086362515982, 0.1494513491505806, 0.0666713443086881];

export function integrate(f: (t: number) => number, a: number, b: number, breaks: number[] = [], pieces = 64): number {
  const pts = [a, ...breaks.filter((x) => (x - a) * (x - b) < 0).sort((p, q) => (a < b ? p - q : q - p)), b];
  let sum = 0;
  for (let j = 0; j + 1 < pts.length; j++) {
    const h = (pts[j + 1]! - pts[j]!) / pieces;
    for (let k = 0; k < pieces; k++) {
      const c = pts[j]! + (k + 0.5) * h;
      let s = 0;
      for (let i = 0; i < GL_X.length; i++) s += GL_W[i]! * (f(c + (h / 2) * GL_X[i]!) + f(c - (h / 2) * GL_X[i]!));
      sum += (s * h) / 2;
    }
  }
  return sum;
}

/** Shomate Cp written out from the published form (t = T/1000), independent of pipeline/cp. */
export function shomateCp(ranges: number[][], T: number): number {
  // the range that holds T (upper range at a join), else the nearest one — the same reading the curve documents
  let r = ranges.find((x) => x[0]! < T && T < x[1]!) ?? ranges.find((x) => x[0] === T) ?? ranges.find((x) => x[1] === T);
  if (!r) r = T < ranges[0]![0]! ? ranges[0]! : ranges[ranges.length - 1]!;
  const [, , A, B, C, D, E] = r as number[];
  const t = T / 1000;
  return A! + B! * t + C! * t * t + D! * t ** 3 + E! / (t * t);
}

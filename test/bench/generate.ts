// SYNTHETIC benchmark data. Every species and value written here is invented by a seeded random
// generator, shaped like a real property table (formulas of plausible compositions, ΔfH° from −2000 to
// +500 kJ/mol, S° from 20 to 500 J/(mol K), Cp in poly, shomate, nasa7, nasa9 and table form, several
// ranges per species, units in the headers) so that the check does the work it does on real data.
// It is not data about any real substance and must never be used as such.
//
// Consistency by construction: ΔfG° = ΔfH° − 298.15·(S° − Σν S°(elements)) with the shipped element
// entropies, and the models' embedded constants (shomate F/G/H, nasa7 a6/a7, nasa9 b1/b2) reproduce the
// row's ΔfH° and S° at 298.15 K; a few percent of species carry a planted defect (see DEFECTS).
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { elementEntropySum, loadReference } from '../../pipeline/chemistry/reference.js';
import { R_J_PER_MOL_K as R } from '../../pipeline/cp/constants.js';
import type { Formula, Phase, ReferenceData } from '../../pipeline/types.js';

const T0 = 298.15;

/** Small, fast, seeded PRNG (mulberry32): the same seed gives the same file. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const HEADER = [
  'species', 'formula', 'phase', 'dHf [kJ/mol]', 'dGf [kJ/mol]', 'S [J/(mol K)]', 'u_dHf [kJ/mol]',
  'cp_model', 'cp_unit', 'cp_exponents', 'cp_T [K]', 'cp_coeffs', 'cp_Tmin [K]', 'cp_Tmax [K]', 'P_ref [bar]', 'source',
];

export const DEFECTS = [
  'kcal-as-kJ', // ΔfH° written in kcal/mol under a kJ/mol header (Gibbs–Helmholtz, diagnosed)
  'sign', // ΔfH° with the wrong sign (Gibbs–Helmholtz, diagnosed)
  'residual', // ΔfG° off by 3 kJ/mol with no slip to explain it
  'not-a-number', // S° = "n/a" (row rejected)
  'bad-phase', // phase "vapour?" (row rejected)
  'bad-formula', // an unknown element symbol (row rejected)
  'duplicate', // one row repeated verbatim
  'conflict', // a second range repeats ΔfH° from the same source with another number
  'ragged', // a row with a missing field (unreadable)
  'cp-coeffs', // nasa7 with six coefficients
  'cp-range', // Tmin above Tmax
  'incomplete', // ΔfG° left out
] as const;
export type Defect = (typeof DEFECTS)[number];

/** What the generator made, for the bench's reaction generator: clean gas species and their formulas. */
export interface GeneratedSpecies {
  name: string;
  formula: Formula;
  phase: Phase;
}

export interface GenerateResult {
  rows: number;
  species: number;
  defects: number;
  bytes: number;
  /** clean gas-phase species with C/H/O/N/Cl/F only, Cp valid 200…6000 K: usable in reactions */
  reactive: GeneratedSpecies[];
  /** the base species every combustion-type reaction needs, by name (O2, CO2, H2O, N2, HCl, HF) */
  base: Record<string, string>;
}

interface Plan {
  name: string;
  formulaText: string;
  formula: Formula;
  phase: Phase;
  atoms: number;
  dHf_kJ: number;
  S: number;
  dGf_kJ: number;
  /** Cp/R = a + bT + cT² + dT⁻² */
  cp: { a: number; b: number; c: number; d: number };
  ranges: [number, number][];
  model: 'poly' | 'shomate' | 'nasa7' | 'nasa9' | 'table' | 'none';
  defect?: Defect;
  reactive: boolean;
}

function formulaText(el: [string, number][], charge = 0): string {
  let s = '';
  for (const [e, n] of el) if (n > 0) s += e + (n === 1 ? '' : String(n));
  if (charge === -1) s += '-';
  else if (charge === 1) s += '+';
  else if (charge !== 0) s += `^${Math.abs(charge)}${charge < 0 ? '-' : '+'}`;
  return s;
}

function toFormula(el: [string, number][], charge = 0): Formula {
  const elements: Record<string, number> = {};
  for (const [e, n] of el) if (n > 0) elements[e] = (elements[e] ?? 0) + n;
  return { elements, charge };
}

const METALS = ['Li', 'Na', 'K', 'Mg', 'Ca', 'Ba', 'Al', 'Ti', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn', 'Zr', 'Mo', 'W', 'Sn', 'Pb'];
const ANIONS: [string, number][][] = [[['O', 1]], [['Cl', 1]], [['F', 1]], [['S', 1]], [['Br', 1]], [['Si', 1], ['O', 3]], [['S', 1], ['O', 4]], [['C', 1], ['O', 3]], [['P', 1], ['O', 4]]];

const SOURCES = [
  'synthetic bench set A (invented)',
  'synthetic bench set B: group additivity (invented)',
  'synthetic bench set C: screening run (invented)',
];

/** Cp/R shape: rises monotonically from c298 toward cmax reached at T_top (no interior extremum below it). */
function cpShape(c298: number, cmax: number, T_top: number, lowT: number): Plan['cp'] {
  const d = -lowT * c298 * T0 * T0; // a small T⁻² term, negative: Cp rises at low T as real curves do
  const target = c298 - d / (T0 * T0); // the quadratic part at 298.15 K
  const k = (cmax - target) / ((T_top - T0) * (T_top - T0));
  return { a: cmax - k * T_top * T_top, b: 2 * k * T_top, c: -k, d };
}

function cpOverR(p: Plan['cp'], T: number): number {
  return p.a + p.b * T + p.c * T * T + p.d / (T * T);
}

class Planner {
  private n = 0;
  private readonly seen = new Map<string, number>();
  constructor(
    private readonly rand: () => number,
    private readonly ref: ReferenceData,
    private readonly defectRate: number,
  ) {}

  private int(lo: number, hi: number): number {
    return lo + Math.floor(this.rand() * (hi - lo + 1));
  }
  private pick<T>(a: readonly T[]): T {
    return a[Math.floor(this.rand() * a.length)]!;
  }

  /** A unique name: the formula itself the first time, then `formula_k` for further isomers. */
  private name(text: string, phase: Phase): string {
    const key = `${text}|${phase}`;
    const k = this.seen.get(key) ?? 0;
    this.seen.set(key, k + 1);
    return k === 0 ? text : `${text}_${k}`;
  }

  base(text: string, el: [string, number][], phase: Phase, dHf_kJ: number, S: number | undefined, model: Plan['model']): Plan {
    const formula = toFormula(el);
    const sEl = elementEntropySum(formula, this.ref, phase)!;
    const atoms = el.reduce((s, [, n]) => s + n, 0);
    const S298 = S ?? sEl; // an element in its reference state: S° is the shipped value
    const c298 = atoms === 1 ? 2.5 : 3.5 + 0.55 * (atoms - 2);
    const cmax = atoms === 1 ? 2.5 : Math.min(3 * atoms - 2, c298 * 2.2);
    return this.finish({ name: this.name(text, phase), formulaText: text, formula, phase, atoms, dHf_kJ, S: S298, dGf_kJ: 0, cp: cpShape(c298, cmax, 6500, 0.03), ranges: [[200, 1000], [1000, 6000]], model, reactive: true }, sEl, false);
  }

  next(): Plan {
    this.n++;
    const r = this.rand();
    let el: [string, number][];
    let phase: Phase;
    let charge = 0;
    let reactive = false;
    if (r < 0.62) {
      // organic gas: CcHhOoNnClxFy with a plausible hydrogen count
      const c = this.int(1, 16);
      const o = this.rand() < 0.6 ? this.int(0, Math.min(6, c + 1)) : 0;
      const n = this.rand() < 0.25 ? this.int(1, 3) : 0;
      const x = this.rand() < 0.12 ? this.int(1, 3) : 0;
      const f = this.rand() < 0.06 ? this.int(1, 3) : 0;
      const unsat = this.int(0, Math.min(c, 6));
      const h = Math.max(0, 2 * c + 2 + n - 2 * unsat - x - f);
      el = [['C', c], ['H', h], ['Cl', x], ['F', f], ['N', n], ['O', o]];
      phase = this.rand() < 0.85 ? 'g' : 'l';
      reactive = phase === 'g' && h >= x + f;
    } else if (r < 0.95) {
      // inorganic solid: one or two metals with an anion group
      const m1 = this.pick(METALS);
      const an = this.pick(ANIONS);
      const k = this.int(1, 3);
      el = [[m1, this.int(1, 2)], ...an.map(([e, n]) => [e, n * k] as [string, number])];
      if (this.rand() < 0.3) el.splice(1, 0, [this.pick(METALS.filter((m) => m !== m1)), 1]);
      phase = 'cr';
    } else {
      // aqueous organic anion or metal cation
      if (this.rand() < 0.5) {
        const c = this.int(1, 8);
        el = [['C', c], ['H', 2 * c - 1], ['O', 2]];
        charge = -1;
      } else {
        el = [[this.pick(METALS), 1], ['Cl', this.int(0, 2)]];
        charge = this.int(1, 2);
      }
      phase = 'aq';
    }
    const formula = toFormula(el, charge);
    const text = formulaText(el, charge);
    const atoms = Object.values(formula.elements).reduce((s, v) => s + v, 0);
    const sEl = elementEntropySum(formula, this.ref, phase)!;
    const oxy = formula.elements.O ?? 0;
    const hal = (formula.elements.Cl ?? 0) + (formula.elements.F ?? 0) * 1.6;
    let dHf = -20 - 95 * oxy - 60 * hal - 12 * (formula.elements.C ?? 0) + 140 * (this.rand() - 0.4);
    if (phase === 'cr') dHf = -150 - 180 * oxy - 160 * hal + 120 * (this.rand() - 0.5);
    if (phase === 'aq') dHf = -300 * this.rand() - 150 * Math.abs(charge);
    dHf = Math.max(-2000, Math.min(500, dHf));
    let S: number;
    let c298: number;
    let cmax: number;
    let ranges: [number, number][];
    let Ttop: number;
    if (phase === 'g') {
      S = 130 + 9 * Math.pow(atoms, 0.9) + 20 * this.rand();
      c298 = 3.5 + 0.55 * (atoms - 2);
      cmax = Math.min(3 * atoms - 2, c298 * 2.2);
      Ttop = 6500;
      ranges = [[200, 1000], [1000, 6000]];
    } else if (phase === 'l') {
      S = 70 + 7 * Math.pow(atoms, 0.9) + 15 * this.rand();
      c298 = 1.4 * (3.5 + 0.55 * (atoms - 2));
      cmax = c298 * 1.25;
      Ttop = 900;
      ranges = [[250, 600]];
    } else if (phase === 'cr') {
      S = 8 * atoms + 25 * this.rand();
      c298 = 2.1 * atoms;
      cmax = 3 * atoms;
      Ttop = 2500;
      ranges = [[298.15, 800], [800, 1800]];
    } else {
      S = 40 + 10 * atoms + 80 * this.rand();
      c298 = 0;
      cmax = 0;
      Ttop = 0;
      ranges = [];
    }
    S = Math.max(20, Math.min(500, S));
    const models: Plan['model'][] = phase === 'aq' ? ['none'] : phase === 'l' ? ['poly', 'table', 'shomate'] : ['poly', 'shomate', 'nasa7', 'nasa9', 'table'];
    const model = this.pick(models);
    if (model === 'nasa9' && phase === 'g') ranges = [[200, 1000], [1000, 3000], [3000, 6000]];
    if (model === 'poly' || model === 'table') ranges = [ranges[0]!]; // single range, as such fits usually are
    const plan: Plan = {
      name: this.name(text, phase),
      formulaText: text,
      formula,
      phase,
      atoms,
      dHf_kJ: dHf,
      S,
      dGf_kJ: 0,
      cp: model === 'none' ? { a: 0, b: 0, c: 0, d: 0 } : cpShape(c298, cmax, Ttop, model === 'nasa7' ? 0 : 0.03),
      ranges: model === 'none' ? [[0, 0]] : ranges,
      model,
      reactive,
    };
    return this.finish(plan, sEl, true);
  }

  private finish(p: Plan, sEl: number, mayDefect: boolean): Plan {
    // round as a table would, then derive ΔfG° from the rounded values
    p.dHf_kJ = Math.round(p.dHf_kJ * 1000) / 1000;
    p.S = Math.round(p.S * 1000) / 1000;
    p.dGf_kJ = Math.round((p.dHf_kJ * 1000 - T0 * (p.S - sEl))) / 1000;
    if (mayDefect && this.rand() < this.defectRate) {
      p.defect = this.pick(DEFECTS);
      p.reactive = false;
    }
    return p;
  }
}

const fmt = (v: number): string => String(Number(v.toPrecision(9)));
const fix3 = (v: number): string => v.toFixed(3);

/** The rows of one species, one per Cp range, as CSV lines (nothing in them needs quoting). */
function rowsOf(p: Plan, rand: () => number): string[] {
  const R_ = R;
  const { a, b, c, d } = p.cp;
  let dHf = fix3(p.dHf_kJ);
  let dGf = fix3(p.dGf_kJ);
  let S = fix3(p.S);
  let phase: string = p.phase;
  let formula = p.formulaText;
  if (p.defect === 'kcal-as-kJ') dHf = fix3(p.dHf_kJ / 4.184);
  if (p.defect === 'sign') dHf = fix3(-p.dHf_kJ);
  if (p.defect === 'residual') dGf = fix3(p.dGf_kJ + 3);
  if (p.defect === 'not-a-number') S = 'n/a';
  if (p.defect === 'bad-phase') phase = 'vapour?';
  if (p.defect === 'bad-formula') formula = p.formulaText + 'Qx';
  if (p.defect === 'incomplete') dGf = '';
  const u = rand() < 0.3 ? fix3(0.2 + rand() * 2) : '';
  const source = SOURCES[Math.floor(rand() * SOURCES.length)]!;
  const H_J = p.dHf_kJ * 1000; // embedded constants follow the true values, not the planted defect
  const lines: string[] = [];
  p.ranges.forEach(([lo, hi], i) => {
    let model: string = p.model === 'none' ? '' : p.model;
    let unit = '';
    let exps = '';
    let temps = '';
    let coeffs = '';
    let Tmin = p.model === 'none' ? '' : String(lo);
    let Tmax = p.model === 'none' ? '' : String(hi);
    switch (p.model) {
      case 'poly': {
        const k = Math.floor(rand() * 3);
        const f = [R_, R_ / 4.184, 1][k]!;
        unit = ['J/(mol K)', 'cal/(mol K)', 'R'][k]!;
        exps = '0 1 2 -2';
        coeffs = [a * f, b * f, c * f, d * f].map(fmt).join(' ');
        break;
      }
      case 'shomate': {
        const A = R_ * a, B = R_ * b * 1e3, C = R_ * c * 1e6, D = 0, E = (R_ * d) / 1e6;
        const t = T0 / 1000;
        const hPoly = A * t + (B * t * t) / 2 + (C * t ** 3) / 3 + (D * t ** 4) / 4 - E / t;
        const sPoly = A * Math.log(t) + B * t + (C * t * t) / 2 + (D * t ** 3) / 3 - E / (2 * t * t);
        const Hc = p.dHf_kJ;
        coeffs = [A, B, C, D, E, Hc - hPoly, p.S - sPoly, Hc].map(fmt).join(' ');
        break;
      }
      case 'nasa7': {
        const h = a * T0 + (b * T0 * T0) / 2 + (c * T0 ** 3) / 3;
        const s = a * Math.log(T0) + b * T0 + (c * T0 * T0) / 2;
        coeffs = [a, b, c, 0, 0, H_J / R_ - h, p.S / R_ - s].map(fmt).join(' ');
        break;
      }
      case 'nasa9': {
        const h = -d / T0 + a * T0 + (b * T0 * T0) / 2 + (c * T0 ** 3) / 3;
        const s = -d / (2 * T0 * T0) + a * Math.log(T0) + b * T0 + (c * T0 * T0) / 2;
        coeffs = [d, 0, a, b, c, 0, 0, H_J / R_ - h, p.S / R_ - s].map(fmt).join(' ');
        break;
      }
      case 'table': {
        const n = 6;
        const ts = Array.from({ length: n }, (_, j) => Math.round(lo + ((hi - lo) * j) / (n - 1)));
        unit = 'J/(mol K)';
        temps = ts.join(' ');
        coeffs = ts.map((T) => (R_ * cpOverR(p.cp, T)).toFixed(3)).join(' ');
        Tmin = '';
        Tmax = ''; // the listed temperatures are the range
        break;
      }
    }
    if (p.defect === 'cp-coeffs' && model === 'nasa7') coeffs = coeffs.split(' ').slice(0, 6).join(' ');
    if (p.defect === 'cp-coeffs' && model !== 'nasa7' && i === 0) model = 'nasa7'; // wrong count for nasa7
    if (p.defect === 'cp-range' && i === 0 && Tmin !== '') [Tmin, Tmax] = [Tmax, Tmin];
    const dHfCell = p.defect === 'conflict' && i === 1 ? fix3(p.dHf_kJ + 12.5) : dHf;
    const cells = [p.name, formula, phase, dHfCell, dGf, S, u, model, unit, exps, temps, coeffs, Tmin, Tmax, '1', source];
    if (p.defect === 'ragged' && i === 0) cells.pop();
    lines.push(cells.join(','));
    if (p.defect === 'duplicate' && i === 0) lines.push(cells.join(','));
  });
  return lines;
}

export interface GenerateOptions {
  rows: number;
  seed?: number;
  /** fraction of species with a planted defect (default 0.03) */
  defectRate?: number;
}

/** Writes a synthetic table of exactly `rows` data rows (plus comment and header lines) to `path`. */
export async function generateTable(path: string, opts: GenerateOptions): Promise<GenerateResult> {
  const rand = rng(opts.seed ?? 20240611);
  const ref = loadReference();
  const planner = new Planner(rand, ref, opts.defectRate ?? 0.03);
  const out = createWriteStream(path);
  let buf =
    `# SYNTHETIC DATA generated by thermovet's benchmark (test/bench/generate.ts): invented values, not data about\n` +
    `# any real substance; never use them in equilibrium or design work.\n` +
    HEADER.join(',') + '\n';
  let bytes = 0;
  const flush = async (): Promise<void> => {
    bytes += Buffer.byteLength(buf);
    if (!out.write(buf)) await once(out, 'drain');
    buf = '';
  };
  const result: GenerateResult = { rows: 0, species: 0, defects: 0, bytes: 0, reactive: [], base: {} };
  const emit = async (p: Plan): Promise<void> => {
    const lines = rowsOf(p, rand);
    const take = Math.min(lines.length, opts.rows - result.rows);
    for (let i = 0; i < take; i++) buf += lines[i] + '\n';
    result.rows += take;
    result.species++;
    if (p.defect) result.defects++;
    if (p.reactive && take === lines.length && p.model !== 'none' && p.phase === 'g') result.reactive.push({ name: p.name, formula: p.formula, phase: p.phase });
    if (buf.length > 1 << 20) await flush();
  };
  // elements in their reference states and the products of combustion-type reactions (all synthetic values)
  const S_REF = (el: string): number => ref.elements[el]!.S;
  const bases: [string, Plan][] = [
    ['O2', planner.base('O2', [['O', 2]], 'g', 0, S_REF('O'), 'shomate')],
    ['N2', planner.base('N2', [['N', 2]], 'g', 0, S_REF('N'), 'nasa7')],
    ['H2', planner.base('H2', [['H', 2]], 'g', 0, S_REF('H'), 'nasa9')],
    ['CO2', planner.base('CO2', [['C', 1], ['O', 2]], 'g', -393.5, 213.8, 'shomate')],
    ['H2O', planner.base('H2O', [['H', 2], ['O', 1]], 'g', -241.8, 188.8, 'nasa7')],
    ['HCl', planner.base('HCl', [['H', 1], ['Cl', 1]], 'g', -92.3, 186.9, 'nasa7')],
    ['HF', planner.base('HF', [['F', 1], ['H', 1]], 'g', -273.3, 173.8, 'shomate')],
  ];
  for (const [key, p] of bases) {
    result.base[key] = p.name;
    await emit(p);
  }
  while (result.rows < opts.rows) await emit(planner.next());
  await flush();
  out.end();
  await once(out, 'finish');
  result.bytes = bytes;
  return result;
}

/** Balanced combustion-type reactions X + a O2 = c CO2 + h/2 H2O + n/2 N2 + x HCl + y HF over the generated species. */
export function combustionReactions(g: GenerateResult, count: number, temps: number[]): string {
  const lines = ['id,equation,T'];
  const T = temps.join(' ');
  const num = (v: number): string => String(Number(v.toFixed(6)));
  for (let i = 0, k = 0; i < count && k < g.reactive.length * 4; k++) {
    const sp = g.reactive[(k * 7919) % g.reactive.length]!;
    const e = sp.formula.elements;
    const c = e.C ?? 0, h = e.H ?? 0, o = e.O ?? 0, n = e.N ?? 0, x = e.Cl ?? 0, y = e.F ?? 0;
    const water = (h - x - y) / 2;
    if (c === 0 || water < 0) continue;
    const o2 = (2 * c + water - o) / 2;
    const left = [`${sp.name}(g)`];
    const right = [`${num(c)} ${g.base.CO2}(g)`];
    if (o2 > 0) left.push(`${num(o2)} ${g.base.O2}(g)`);
    if (o2 < 0) right.push(`${num(-o2)} ${g.base.O2}(g)`);
    if (water > 0) right.push(`${num(water)} ${g.base.H2O}(g)`);
    if (n > 0) right.push(`${num(n / 2)} ${g.base.N2}(g)`);
    if (x > 0) right.push(`${num(x)} ${g.base.HCl}(g)`);
    if (y > 0) right.push(`${num(y)} ${g.base.HF}(g)`);
    lines.push(`R${i + 1},${left.join(' + ')} = ${right.join(' + ')},${T}`);
    i++;
  }
  return lines.join('\n') + '\n';
}

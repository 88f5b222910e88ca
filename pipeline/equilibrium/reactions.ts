// Reactions: read from a CSV file (or given directly), then resolved against the species table and
// checked for element and charge balance.
//
// File: a header naming `id`, `equation` and either `T` (temperatures, space-separated) or `Tmin` and
// `Tmax`; both may be present, and a row with T filled uses T. Header names are matched without case;
// a unit in brackets (`Tmin [degC]`) is honoured for the temperature columns (K by default).
// Blank lines and lines starting with '#' are skipped. Each row keeps its file and physical line.
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { balance } from '../chemistry/balance.js';
import { formatFormula } from '../chemistry/formula.js';
import { InputError, excerpt } from '../errors.js';
import { sniff } from '../ingest/sniff.js';
import { makeFinding } from '../rules/finding.js';
import { findUnit, unitsOf } from '../units/table.js';
import type { Finding, Formula, Location, ReferenceData, ReactionResult, Species, UseWindow } from '../types.js';
import { asSpeciesList, type SpeciesList } from '../species-list.js';
import { EquationError, parseEquation, type EquationTerm } from './equation.js';
import { reactionData, reactionRow, reactionSpecies, reactionUnbalanced } from './rules.js';
import { reactionTemperatures } from './temperatures.js';
import { isThermo, thermoOf, type SpeciesThermo } from './thermo.js';

/** A reaction as read, before its species are looked up. */
export interface ReactionSpec {
  id: string;
  equation: string;
  file: string;
  line: number;
  terms: EquationTerm[];
  /** temperatures the row lists (K) */
  temps?: number[];
  /** the row's window (K) */
  Tmin?: number;
  Tmax?: number;
  /** false when the formulas as written already fail the balance (a finding was raised) */
  balancedAsWritten?: boolean;
}

export interface ResolvedTerm {
  /** signed: negative for reactants, positive for products (same species on both sides: merged) */
  coeff: number;
  thermo: SpeciesThermo;
}

/** A balanced reaction whose species are all in the table with usable formation data. */
export interface ResolvedReaction {
  id: string;
  equation: string;
  file: string;
  line: number;
  terms: ResolvedTerm[];
  /** the temperatures it is computed at, K, ascending */
  temps: number[];
}

const MAX_FILE_BYTES = 64 * 1024 * 1024;

function headerKey(h: string): { key: string; unit?: string } {
  const m = /^\s*([^[\]]*?)\s*(?:\[([^\]]*)\])?\s*$/.exec(h.replace(/^\uFEFF/, ''));
  const key = (m?.[1] ?? h).trim().toLowerCase().replace(/[\s_-]+/g, '');
  const unit = m?.[2]?.trim();
  return unit ? { key, unit } : { key };
}

const HEADER_ALIASES: Readonly<Record<string, 'id' | 'equation' | 'T' | 'Tmin' | 'Tmax'>> = {
  id: 'id',
  reaction: 'id',
  name: 'id',
  equation: 'equation',
  eq: 'equation',
  t: 'T',
  tk: 'T',
  temperatures: 'T',
  temperature: 'T',
  tmin: 'Tmin',
  tmink: 'Tmin',
  tmax: 'Tmax',
  tmaxk: 'Tmax',
};

/**
 * Reads a reactions CSV. Rows that cannot be used become findings (rule reaction-row, with file and
 * line) and are left out; formulas that do not balance as written become reaction-unbalanced findings
 * and the spec is kept with balancedAsWritten = false (it is reported, never computed).
 * Throws InputError (exit 2) when the file as a whole is unusable: missing, binary, not CSV, or
 * without the id and equation columns.
 */
export function loadReactions(path: string): { reactions: ReactionSpec[]; findings: Finding[] } {
  sniff(path);
  const size = readFileSync(path).length;
  if (size > MAX_FILE_BYTES) throw new InputError('file-too-large', `the reactions file has ${size} bytes; the limit is ${MAX_FILE_BYTES}`, { file: path });
  const text = readFileSync(path, 'utf8');
  let records: string[][];
  try {
    records = parse(text, { bom: true, relax_column_count: true, relax_quotes: true, skip_empty_lines: false }) as string[][];
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    throw new InputError('unreadable-file', `the reactions file cannot be read as CSV: ${excerpt((e as Error).message, 160)}`, { file: path, line });
  }

  const findings: Finding[] = [];
  const reactions: ReactionSpec[] = [];
  const seen = new Map<string, number>();
  let col: Partial<Record<'id' | 'equation' | 'T' | 'Tmin' | 'Tmax', { index: number; factor: number; offset: number }>> | undefined;
  let nextLine = 1;
  let headerLine = 1;
  for (const record of records) {
    const line = nextLine;
    nextLine += 1 + record.reduce((n, c) => n + (c.match(/\n/g)?.length ?? 0), 0);
    if (record.length === 1 && record[0]!.trim() === '') continue;
    if (record[0]!.trimStart().startsWith('#')) continue;
    if (!col) {
      headerLine = line;
      col = {};
      record.forEach((h, index) => {
        const { key, unit } = headerKey(h);
        const canon = HEADER_ALIASES[key];
        if (!canon || col![canon]) return;
        let factor = 1;
        let offset = 0;
        if (canon === 'T' || canon === 'Tmin' || canon === 'Tmax') {
          if (unit) {
            const u = findUnit(unit, 'temperature');
            if (!u) throw new InputError('unknown-unit', `unknown temperature unit "${excerpt(unit)}" in the header; accepted: ${unitsOf('temperature').join(', ')}`, { file: path, line, field: canon });
            factor = u.factor;
            offset = u.offset;
          }
        }
        col![canon] = { index, factor, offset };
      });
      const missing = (['id', 'equation'] as const).filter((c) => !col![c]);
      if (missing.length) {
        throw new InputError('reactions-header', `the reactions file needs the columns id and equation (and T, or Tmin and Tmax); ${missing.join(' and ')} not found in the header`, { file: path, line });
      }
      continue;
    }
    const cell = (c: keyof NonNullable<typeof col>): string => (col![c] ? (record[col![c]!.index] ?? '').trim() : '');
    const at = (c: keyof NonNullable<typeof col>): Location => ({ file: path, line, ...(col![c] ? { column: col![c]!.index + 1, field: c } : {}) });
    const id = cell('id');
    const equation = cell('equation');
    const label = id || `(line ${line})`;
    if (!id) {
      findings.push(makeFinding(reactionRow, 'missing-id', {}, at('id')));
      continue;
    }
    if (seen.has(id)) {
      findings.push(makeFinding(reactionRow, 'duplicate-id', { id: excerpt(id), firstLine: seen.get(id)! }, at('id')));
      continue;
    }
    seen.set(id, line);
    if (!equation) {
      findings.push(makeFinding(reactionRow, 'missing-equation', { id: excerpt(label) }, at('equation')));
      continue;
    }
    // temperatures
    const temp = (c: 'T' | 'Tmin' | 'Tmax', t: string): number | undefined => {
      const v = Number(t);
      const u = col![c]!;
      const K = v * u.factor + u.offset;
      if (t === '' || !Number.isFinite(v) || !(K > 0)) {
        findings.push(makeFinding(reactionRow, 'bad-temperature', { id: excerpt(label), text: excerpt(t) }, at(c)));
        return undefined;
      }
      return K;
    };
    const spec: ReactionSpec = { id, equation, file: path, line, terms: [] };
    let bad = false;
    const tList = cell('T');
    if (tList) {
      const temps = tList.split(/[\s;,]+/).filter(Boolean).map((t) => temp('T', t));
      if (temps.some((t) => t === undefined)) bad = true;
      else spec.temps = temps as number[];
    } else if (cell('Tmin') || cell('Tmax')) {
      if (!cell('Tmin') || !cell('Tmax')) {
        findings.push(makeFinding(reactionRow, 'half-window', { id: excerpt(label) }, at(cell('Tmin') ? 'Tmax' : 'Tmin')));
        bad = true;
      } else {
        const lo = temp('Tmin', cell('Tmin'));
        const hi = temp('Tmax', cell('Tmax'));
        if (lo === undefined || hi === undefined) bad = true;
        else if (lo > hi) {
          findings.push(makeFinding(reactionRow, 'bad-window', { id: excerpt(label), Tmin: lo, Tmax: hi }, at('Tmin')));
          bad = true;
        } else {
          spec.Tmin = lo;
          spec.Tmax = hi;
        }
      }
    }
    try {
      spec.terms = parseEquation(equation).terms;
    } catch (e) {
      if (!(e instanceof EquationError)) throw e;
      findings.push(makeFinding(reactionRow, 'syntax', { id: excerpt(label), detail: e.message }, at('equation')));
      bad = true;
    }
    if (bad) continue;
    const asWritten = balanceAsWritten(spec);
    if (asWritten) {
      findings.push(asWritten);
      spec.balancedAsWritten = false;
    }
    reactions.push(spec);
  }
  if (!col) throw new InputError('empty-file', 'the reactions file has no header and no rows', { file: path, line: 1 });
  if (reactions.length === 0 && findings.length === 0) {
    throw new InputError('no-reactions', 'the reactions file has a header but no reaction rows: add one row per reaction (id, equation, T or Tmin and Tmax)', { file: path, line: headerLine });
  }
  return { reactions, findings };
}

/**
 * Builds a spec from an equation given directly (command line, manifest); throws EquationError.
 * Its balance is checked (and reported) by resolveReactions.
 */
export function reactionFromEquation(id: string, equation: string, where: { file: string; line: number }, temps: { temps?: number[]; Tmin?: number; Tmax?: number } = {}): ReactionSpec {
  return { id, equation, file: where.file, line: where.line, terms: parseEquation(equation).terms, ...temps };
}

function describeResidual(residual: Record<string, number>): string {
  return Object.entries(residual)
    .map(([el, r]) => `${el} ${r > 0 ? '+' : ''}${Number(r.toPrecision(6))}`)
    .join(', ');
}

/** Balance of formulas: a finding when elements or charge do not balance, else undefined. */
function unbalancedFinding(id: string, terms: { coeff: number; formula: Formula }[], where: Location): Finding | undefined {
  const b = balance(terms);
  if (b.ok) return undefined;
  if (Object.keys(b.residual).length > 0) {
    return makeFinding(reactionUnbalanced, 'elements', { id: excerpt(id), residual: describeResidual(b.residual) + (b.chargeResidual ? `, charge ${b.chargeResidual > 0 ? '+' : ''}${b.chargeResidual}` : '') }, where);
  }
  return makeFinding(reactionUnbalanced, 'charge', { id: excerpt(id), charge: `${b.chargeResidual > 0 ? '+' : ''}${Number(b.chargeResidual.toPrecision(6))}` }, where);
}

/** When every term is a formula, check the balance as written (names are checked after resolution). */
function balanceAsWritten(spec: ReactionSpec): Finding | undefined {
  if (!spec.terms.every((t) => t.formula)) return undefined;
  return unbalancedFinding(spec.id, spec.terms.map((t) => ({ coeff: t.coeff, formula: t.formula! })), { file: spec.file, line: spec.line, field: 'equation' });
}

// ---------------------------------------------------------------------------------------------
// Resolution against the table

/**
 * Species looked up by name and by formula (Hill order with charge), for the names and formulas the
 * reactions ask for. `prepare` indexes a batch of them in one pass over the table: a name is one set
 * lookup per species; a formula is first compared by a cheap signature (element count, atom count,
 * charge), so only the few species that pass have their formula written out. A table of 10^6 species
 * thus costs one fast pass, not a map of 10^6 names and 10^6 formula renderings.
 */
export class SpeciesIndex {
  private readonly byName = new Map<string, Species[]>();
  private readonly byFormula = new Map<string, Species[]>();
  private readonly thermo = new Map<string, ReturnType<typeof thermoOf>>();

  readonly species: SpeciesList;

  constructor(
    species: readonly Species[] | SpeciesList,
    readonly reference: ReferenceData,
  ) {
    this.species = asSpeciesList(species);
  }

  /** Indexes the species having any of these names or formulas, in one pass over the table. */
  prepare(names: readonly string[], formulas: readonly Formula[]): void {
    const wantedNames = new Set<string>();
    for (const n of names) {
      if (this.byName.has(n)) continue;
      this.byName.set(n, []);
      wantedNames.add(n);
    }
    const wanted = new Map<string, Set<string>>(); // signature -> formula keys
    for (const f of formulas) {
      const key = formulaKey(f);
      if (this.byFormula.has(key)) continue;
      this.byFormula.set(key, []);
      const sig = signature(f);
      const set = wanted.get(sig);
      if (set) set.add(key);
      else wanted.set(sig, new Set([key]));
    }
    if (wantedNames.size === 0 && wanted.size === 0) return;
    // a species matching both a name and a formula is built once, so both lists hold the same object
    const list = this.species;
    for (let i = 0; i < list.length; i++) {
      let sp: Species | undefined;
      const name = list.name(i);
      if (wantedNames.has(name)) this.byName.get(name)!.push((sp = list.at(i)));
      if (wanted.size === 0) continue;
      const formula = list.formula(i);
      const keys = wanted.get(signature(formula));
      if (!keys) continue;
      const key = formulaKey(formula);
      if (keys.has(key)) this.byFormula.get(key)!.push(sp ?? list.at(i));
    }
  }

  /** Indexes every name and formula the terms of these reactions use. */
  prepareFor(specs: readonly ReactionSpec[]): void {
    const names: string[] = [];
    const formulas: Formula[] = [];
    for (const s of specs) {
      for (const t of s.terms) {
        names.push(t.text, t.bare);
        if (t.formula) formulas.push(t.formula);
      }
    }
    this.prepare(names, formulas);
  }

  /** Species with this name. */
  named(name: string): Species[] {
    if (!this.byName.has(name)) this.prepare([name], []);
    return this.byName.get(name)!;
  }

  /** Species with this formula. */
  withFormula(f: Formula): Species[] {
    const key = formulaKey(f);
    if (!this.byFormula.has(key)) this.prepare([], [f]);
    return this.byFormula.get(key)!;
  }

  /** The thermo record of a species, computed once. */
  thermoOf(sp: Species): ReturnType<typeof thermoOf> {
    let t = this.thermo.get(sp.key);
    if (!t) {
      t = thermoOf(sp, this.reference);
      this.thermo.set(sp.key, t);
    }
    return t;
  }
}

/** Formula keys by Formula object: parseFormula returns one frozen object per distinct text. */
const formulaKeys = new WeakMap<Formula, string>();
function formulaKey(f: Formula): string {
  let k = formulaKeys.get(f);
  if (k === undefined) formulaKeys.set(f, (k = formatFormula(f)));
  return k;
}

/** Number of elements, total atoms and charge: equal for equal formulas, cheap to compute. */
function signature(f: Formula): string {
  let n = 0;
  let atoms = 0;
  for (const el in f.elements) {
    n++;
    atoms += f.elements[el]!;
  }
  return `${n}|${Math.round(atoms * 1e6)}|${f.charge}`;
}

function push<K, V>(m: Map<K, V[]>, k: K, v: V): void {
  const a = m.get(k);
  if (a) a.push(v);
  else m.set(k, [v]);
}

function stateWords(s: string | undefined): string[] {
  return (s ?? '').toLowerCase().split(/[\s,;()]+/).filter(Boolean);
}

/** Keep candidates in the term's phase and, when the term names a state, those whose state agrees (or is unstated). */
function filterByPhaseAndState(cands: Species[], term: EquationTerm): Species[] {
  let out = term.phase ? cands.filter((s) => s.phase === term.phase) : cands;
  const want = stateWords(term.state);
  if (want.length) {
    const agree = out.filter((s) => want.every((w) => stateWords(s.state).includes(w) || stateWords(s.name).includes(w)));
    out = agree.length ? agree : out.filter((s) => stateWords(s.state).length === 0);
  }
  return out;
}

function uniq(a: Species[]): Species[] {
  return [...new Map(a.map((s) => [s.key, s])).values()];
}

export type TermMatch = { species: Species } | { candidates: Species[] } | { none: true; hint: string };

/**
 * Finds the table species a term names. In order, the first step that finds anything decides:
 *   1. a species whose name is the whole term as written (`H2O(g)` named so in the table);
 *   2. species named like the term without its phase suffix, in the term's phase (and state);
 *   3. species whose formula equals the term's formula, in the term's phase (and state).
 * One match resolves; several are ambiguous (named in the finding); none is unknown.
 */
export function matchTerm(term: EquationTerm, index: SpeciesIndex): TermMatch {
  const steps: (() => Species[])[] = [
    () => (term.text !== term.bare ? index.named(term.text) : []),
    () => filterByPhaseAndState(index.named(term.bare), term),
    () => (term.formula ? filterByPhaseAndState(index.withFormula(term.formula), term) : []),
  ];
  for (const step of steps) {
    const found = uniq(step());
    if (found.length === 1) return { species: found[0]! };
    if (found.length > 1) return { candidates: found.sort((a, b) => (a.key < b.key ? -1 : 1)) };
  }
  // near misses: the same name or formula in another phase
  const other = uniq([...index.named(term.bare), ...(term.formula ? index.withFormula(term.formula) : [])]);
  const hint = other.length ? ` (the table has ${other.slice(0, 5).map(labelOf).join(', ')})` : '';
  return { none: true, hint };
}

function labelOf(sp: Species): string {
  return `${sp.name} (${sp.phase}${sp.state ? `, ${sp.state}` : ''})`;
}

export interface ResolveOutcome {
  /** reactions ready to compute */
  resolved: ResolvedReaction[];
  /** one per spec, in input order; reactions that cannot be computed have no points */
  results: ReactionResult[];
  findings: Finding[];
}

/**
 * Looks up every species of every reaction, merges a species that stands on both sides, checks the
 * balance with the table's formulas, and builds each species' thermo record once. A reaction with an
 * unknown or ambiguous species, an imbalance, or a species without enough formation data is reported
 * (findings carry the reaction's file and line) and not computed.
 */
export function resolveReactions(specs: readonly ReactionSpec[], species: readonly Species[] | SpeciesList | SpeciesIndex, reference: ReferenceData, window: UseWindow = {}): ResolveOutcome {
  const index = species instanceof SpeciesIndex ? species : new SpeciesIndex(species, reference);
  index.prepareFor(specs);
  const resolved: ResolvedReaction[] = [];
  const results: ReactionResult[] = [];
  const findings: Finding[] = [];
  for (const spec of specs) {
    const where: Location = { file: spec.file, line: spec.line, field: 'equation' };
    const result: ReactionResult = { id: spec.id, equation: spec.equation, file: spec.file, line: spec.line, balanced: spec.balancedAsWritten !== false, points: [] };
    results.push(result);
    const id = excerpt(spec.id);
    let ok = true;
    const merged = new Map<string, { coeff: number; sp: Species }>();
    for (const term of spec.terms) {
      const m = matchTerm(term, index);
      if ('species' in m) {
        const e = merged.get(m.species.key);
        if (e) e.coeff += term.coeff;
        else merged.set(m.species.key, { coeff: term.coeff, sp: m.species });
        continue;
      }
      ok = false;
      if ('candidates' in m) {
        findings.push(makeFinding(reactionSpecies, 'ambiguous', { id, term: excerpt(term.text), count: m.candidates.length, candidates: m.candidates.slice(0, 8).map(labelOf).join('; ') }, where));
      } else {
        findings.push(makeFinding(reactionSpecies, 'unknown', { id, term: excerpt(term.text), hint: m.hint }, where));
      }
    }
    if (spec.balancedAsWritten === false) continue; // reported by loadReactions
    if (!ok) continue;
    const terms = [...merged.values()].filter((t) => Math.abs(t.coeff) > 1e-12);
    if (terms.length === 0) {
      result.balanced = false;
      findings.push(makeFinding(reactionUnbalanced, 'empty', { id }, where));
      continue;
    }
    const unbalanced = unbalancedFinding(spec.id, terms.map((t) => ({ coeff: t.coeff, formula: t.sp.formula })), where);
    if (unbalanced) {
      result.balanced = false;
      findings.push(unbalanced);
      continue;
    }
    result.balanced = true;
    const rterms: ResolvedTerm[] = [];
    for (const t of terms) {
      const th = index.thermoOf(t.sp);
      if (isThermo(th)) {
        rterms.push({ coeff: t.coeff, thermo: th });
        continue;
      }
      ok = false;
      const ids = { species: t.sp.name, phase: t.sp.phase };
      if (th.problem === 'incomplete') findings.push(makeFinding(reactionData, 'incomplete', { id, species: labelOf(t.sp), have: th.have }, where, ids));
      else findings.push(makeFinding(reactionData, 'no-element-entropy', { id, species: labelOf(t.sp) }, where, ids));
    }
    if (!ok) continue;
    resolved.push({ id: spec.id, equation: spec.equation, file: spec.file, line: spec.line, terms: rterms, temps: reactionTemperatures(spec, window) });
  }
  return { resolved, results, findings };
}

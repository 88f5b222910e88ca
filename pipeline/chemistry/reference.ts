// Element reference states and their standard entropies (datasets/reference/elements.json), and the
// element-entropy sum Σν·S°(element) that turns a species' absolute S° into its ΔfS°.

import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';
import { packageRoot } from '../paths.js';
import { PHASES, type Formula, type Phase, type ReferenceData } from '../types.js';
import { isElement } from './elements.js';
import { FormulaError, PHASE_WORDS, parseFormula } from './formula.js';

/** Where the shipped reference file sits, relative to the package root. */
export const DEFAULT_REFERENCE_FILE = 'datasets/reference/elements.json';

type BaseEntry = ReferenceData['elements'][string];

/** A state of an element other than its reference state (diamond, red P, O atoms, Br2 gas, …). */
export interface OtherState {
  species: string;
  formula: string;
  atoms: number;
  phase: Phase;
  state: string;
  S: number; // J/(mol K) per mole of `formula`
  source: string;
  provenance: string;
  note?: string;
}

/** One element's reference state as the shipped file gives it (a superset of ReferenceData's entry). */
export interface ReferenceEntry extends BaseEntry {
  provenance: string;
  note?: string;
  /** other words that name the same reference state (e.g. 'alpha' and 'bcc' for iron) */
  stateAliases: string[];
  otherStates: OtherState[];
}

/** ReferenceData with the extra fields the shipped file carries. Assignable to ReferenceData. */
export interface ChemistryReference extends ReferenceData {
  elements: Record<string, ReferenceEntry>;
  /** the electron gas e-(g), reference species of the gas-phase ion convention */
  electron?: { S: number; source: string; provenance: string };
}

/** The reference file cannot be used; `path` is the file, `field` the JSON path of the bad value. */
export class ReferenceDataError extends Error {
  override readonly name = 'ReferenceDataError';
  constructor(
    message: string,
    readonly path: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** Loads and validates the element reference file (default: the shipped one); records its sha256. */
export function loadReference(path?: string): ChemistryReference {
  const file = path === undefined ? join(packageRoot(), DEFAULT_REFERENCE_FILE) : isAbsolute(path) ? path : resolve(path);
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (err) {
    throw new ReferenceDataError(
      `Cannot read the element reference file ${file}: ${(err as Error).message}. Check the path.`,
      file,
    );
  }
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  let doc: unknown;
  try {
    doc = JSON.parse(bytes.toString('utf8'));
  } catch (err) {
    throw new ReferenceDataError(`The element reference file ${file} is not valid JSON: ${(err as Error).message}.`, file);
  }
  const fail = (field: string, why: string): ReferenceDataError =>
    new ReferenceDataError(`The element reference file ${file} is invalid at ${field}: ${why}.`, file, field);
  if (!isObject(doc) || !isObject(doc.elements)) throw fail('elements', 'expected an object keyed by element symbol');

  const readState = (raw: unknown, field: string, symbol: string): OtherState => {
    if (!isObject(raw)) throw fail(field, 'expected an object');
    const str = (k: string): string => {
      const v = raw[k];
      if (typeof v !== 'string' || v.trim() === '') throw fail(`${field}.${k}`, 'expected a non-empty string');
      return v;
    };
    const species = str('species');
    const formula = str('formula');
    const state = str('state');
    const source = str('source');
    const provenance = str('provenance');
    const phase = raw.phase;
    if (typeof phase !== 'string' || !(PHASES as readonly string[]).includes(phase)) {
      throw fail(`${field}.phase`, `expected one of ${PHASES.join(', ')}`);
    }
    const atoms = raw.atoms;
    if (typeof atoms !== 'number' || !Number.isInteger(atoms) || atoms < 1) throw fail(`${field}.atoms`, 'expected a whole number ≥ 1');
    const S = raw.S;
    if (typeof S !== 'number' || !Number.isFinite(S) || S <= 0) throw fail(`${field}.S`, 'expected a positive entropy in J/(mol K)');
    let parsed: Formula;
    try {
      parsed = parseFormula(formula);
    } catch (err) {
      if (err instanceof FormulaError) throw fail(`${field}.formula`, err.message);
      throw err;
    }
    const keys = Object.keys(parsed.elements);
    if (parsed.charge !== 0 || keys.length !== 1 || keys[0] !== symbol || parsed.elements[symbol] !== atoms) {
      throw fail(`${field}.formula`, `"${formula}" is not ${atoms} atom(s) of ${symbol}`);
    }
    const out: OtherState = { species, formula, atoms, phase: phase as Phase, state, S, source, provenance };
    if (typeof raw.note === 'string') out.note = raw.note;
    return out;
  };

  const elements: Record<string, ReferenceEntry> = {};
  for (const [symbol, raw] of Object.entries(doc.elements)) {
    const field = `elements.${symbol}`;
    if (!isElement(symbol)) throw fail(field, `"${symbol}" is not an element symbol`);
    const base = readState(raw, field, symbol);
    const r = raw as Record<string, unknown>;
    const aliases = r.stateAliases ?? [];
    if (!Array.isArray(aliases) || !aliases.every((a) => typeof a === 'string')) {
      throw fail(`${field}.stateAliases`, 'expected a list of words');
    }
    const others = r.otherStates ?? [];
    if (!Array.isArray(others)) throw fail(`${field}.otherStates`, 'expected a list');
    elements[symbol] = {
      ...base,
      stateAliases: (aliases as string[]).map((a) => a.toLowerCase()),
      otherStates: others.map((o, k) => readState(o, `${field}.otherStates[${k}]`, symbol)),
    };
  }
  if (!elements.H || elements.H.atoms !== 2 || elements.H.phase !== 'g') {
    throw fail('elements.H', 'the reference state of hydrogen must be H2(g); the aqueous-ion convention needs it');
  }

  const out: ChemistryReference = { elements, sha256, path: file };
  if (doc.electron !== undefined) {
    const e = doc.electron;
    if (!isObject(e) || typeof e.S !== 'number' || !Number.isFinite(e.S) || e.S <= 0) {
      throw fail('electron.S', 'expected a positive entropy in J/(mol K)');
    }
    out.electron = { S: e.S, source: String(e.source ?? ''), provenance: String(e.provenance ?? '') };
  }
  return out;
}

/** The single element a species is made of (O2, O3, O, O-, C), or undefined (H2O, e-). Charge is ignored. */
export function elementOf(formula: Formula): string | undefined {
  const keys = Object.keys(formula.elements);
  return keys.length === 1 ? keys[0] : undefined;
}

/*
 * Entropy of the elements that form one mole of a species, in J/(mol K):
 *   ΔfS° = S°(species) − elementEntropySum(species).
 *
 * Neutral species: Σ_el ν_el · S°(reference species of el) / (atoms per reference species);
 * e.g. H2O: 2·S°(H2)/2 + 1·S°(O2)/2.
 *
 * Ions need one more term, because an ion cannot be formed from neutral elements alone.
 *
 * Aqueous ions (the default): the convention is ΔfH°(H+,aq) = ΔfG°(H+,aq) = 0 and S°(H+,aq) = 0.
 * Under it the formation reaction of an ion M^z is the one that balances charge with H+(aq) and H2(g):
 *     elements + z H+(aq)  →  M^z(aq) + (z/2) H2(g)
 * (Na(cr) + H+(aq) → Na+(aq) + ½H2(g);   ½Cl2(g) + ½H2(g) → Cl−(aq) + H+(aq), i.e. z = −1.)
 * Its entropy change is
 *     ΔfS° = S°(M^z) + (z/2)·S°(H2) − Σν·S°(el) − z·S°(H+,aq)
 *          = S°(M^z) − [Σν·S°(el) − (z/2)·S°(H2)]          since S°(H+,aq) = 0,
 * so the element-entropy sum of an ion is Σν·S°(el) − (z/2)·S°(H2,g): ΔfS° gains +(z/2)·S°(H2).
 * The sign is checked in the tests against published ΔfH°, ΔfG°, S° of Na+(aq) and Cl−(aq): the
 * Gibbs–Helmholtz residual is below 0.1 kJ/mol with this sign and about ±39 kJ/mol with the other.
 *
 * Gas-phase ions (phase 'g'): the JANAF electron convention. The electron gas e−(g) is a reference
 * species (ΔfH° = ΔfG° = 0), and the formation reaction is elements → M^z(g) + z e−(g), so
 *     ΔfS° = S°(M^z) + z·S°(e−) − Σν·S°(el)   →   element-entropy sum = Σν·S°(el) − z·S°(e−,g).
 * For e−(g) itself (no elements, z = −1) this gives ΔfS° = 0, as a reference species must.
 *
 * Returns undefined when an element of the formula has no reference entry (or, for a gas-phase ion,
 * when the reference data carry no electron entropy).
 */
export function elementEntropySum(formula: Formula, ref: ReferenceData, phase?: Phase | string): number | undefined {
  let sum = 0;
  for (const el in formula.elements) {
    const entry = Object.hasOwn(ref.elements, el) ? ref.elements[el] : undefined;
    if (!entry) return undefined;
    sum += (formula.elements[el] * entry.S) / entry.atoms;
  }
  const z = formula.charge;
  if (z !== 0) {
    if (phase === 'g') {
      const eS = (ref as ChemistryReference).electron?.S;
      if (eS === undefined) return undefined;
      sum -= z * eS;
    } else {
      const h = ref.elements.H;
      if (!h) return undefined;
      sum -= z * (h.S / h.atoms); // (z/2)·S°(H2) when the H entry is H2
    }
  }
  return sum;
}

/** Words that say nothing about which polymorph is meant, ignored when matching a state word. */
const GENERIC_STATE_WORDS = new Set(['crystal', 'crystalline', 'ideal', 'reference', 'ref', 'std', 'standard']);
const GREEK: Readonly<Record<string, string>> = { α: 'alpha', β: 'beta', γ: 'gamma', δ: 'delta' };

function canonicalPhase(phase: string): Phase | undefined {
  const p = phase.trim().toLowerCase();
  if ((PHASES as readonly string[]).includes(p)) return p as Phase;
  return Object.hasOwn(PHASE_WORDS, p) ? PHASE_WORDS[p] : undefined;
}

/**
 * Is the species an element in its reference state at 298.15 K, 1 bar? O2(g) yes; O(g), O3(g),
 * O2(l), O2+ no; C(cr) with no state word counts as graphite, C(cr,diamond) no; S(cr) counts as
 * rhombic; Fe(cr,alpha) yes, Fe(cr,gamma) no. `stateWord` may hold several words ('alpha,white',
 * 'cr graphite'); phase words and generic words ('crystal') among them are ignored.
 */
export function isReferenceState(formula: Formula, phase: Phase | string, ref: ReferenceData): boolean;
export function isReferenceState(
  formula: Formula,
  phase: Phase | string,
  stateWord: string | undefined,
  ref: ReferenceData,
): boolean;
export function isReferenceState(
  formula: Formula,
  phase: Phase | string,
  stateOrRef: string | undefined | ReferenceData,
  maybeRef?: ReferenceData,
): boolean {
  const ref = typeof stateOrRef === 'object' ? stateOrRef : maybeRef;
  const stateWord = typeof stateOrRef === 'object' ? undefined : stateOrRef;
  if (!ref) throw new TypeError('isReferenceState: the reference data argument is missing');
  const el = elementOf(formula);
  if (el === undefined || formula.charge !== 0) return false;
  const entry = Object.hasOwn(ref.elements, el) ? (ref.elements[el] as ReferenceEntry) : undefined;
  if (!entry || formula.elements[el] !== entry.atoms) return false;
  if (canonicalPhase(phase) !== entry.phase) return false;
  if (stateWord === undefined) return true;
  const accepted = new Set([entry.state.toLowerCase(), ...(entry.stateAliases ?? []).map((a) => a.toLowerCase())]);
  const words = stateWord
    .toLowerCase()
    .split(/[\s,;()]+/)
    .filter((w) => w.length > 0)
    .map((w) => (Object.hasOwn(GREEK, w) ? GREEK[w] : w))
    .filter((w) => !Object.hasOwn(PHASE_WORDS, w) && !GENERIC_STATE_WORDS.has(w));
  return words.every((w) => accepted.has(w));
}

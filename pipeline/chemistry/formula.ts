// Chemical formula parsing: text such as `CuSO4·5H2O`, `Fe4[Fe(CN)6]3`, `SO4^2-` or `H2O(g)`
// -> { elements: { symbol: count }, charge }.
//
// Grammar (whitespace is allowed only at the ends, around hydrate separators and before a phase suffix):
//
//   text      := formula [charge] {phase-suffix}
//   formula   := part { separator part }              separator: · • ∙ ⋅ * or '.' (see below)
//   part      := [multiplier] item { item }           a multiplier on a lone part is refused (`2H2O`)
//   item      := symbol [count] | '(' item{item} ')' [count] | '[' item{item} ']' [count]
//   count     := digits ['.' digits]                  ASCII or subscript digits (H₂O), never 0
//   charge    := '+'… | '-'… | sign digits | '^' [digits] sign | '^{' … '}' | '(' digits sign ')'
//                | superscripts (²⁻) | digits sign   (last form: see readBareCharge)
//
// '.' is both a decimal point (Fe0.947O) and a hydrate separator (CuSO4.5H2O):
// - after a symbol or a group it is a separator (NaCl.2H2O, 3CaO.SiO2);
// - after a count of 0 or 1 (Fe0.947O, Mg1.5O), or when no multiplier and formula follow (TiO1.5),
//   it is a decimal point;
// - after a count of 2 or more and before a multiplier and a formula, it is a separator when that
//   formula is a common solvate molecule (H2O, NH3, H2O2, CH3OH, C2H5OH: CuSO4.5H2O, CaSO4.0.5H2O,
//   Na2CO3.10H2O); otherwise both readings are plausible (Fe2.95O4, Al2O3.2SiO2) and the parser
//   refuses with 'ambiguous-dot'. Write `·` or `*` for a hydrate, or bracket a decimal count: (Fe2.95)O4.

import type { Formula, Phase } from '../types.js';
import { HALOGENS, NON_METALS, isElement } from './elements.js';

/** Stable codes of formula errors, one per kind of mistake. */
export type FormulaErrorCode =
  | 'empty'
  | 'unknown-element'
  | 'lowercase-symbol'
  | 'unbalanced-parenthesis'
  | 'mismatched-parenthesis'
  | 'empty-group'
  | 'empty-part'
  | 'zero-count'
  | 'misplaced-number'
  | 'leading-coefficient'
  | 'hydrate-in-group'
  | 'ambiguous-dot'
  | 'bad-charge'
  | 'ambiguous-charge'
  | 'misplaced-charge'
  | 'bad-electron'
  | 'phase-conflict'
  | 'unexpected-character';

/** A formula that cannot be read. `index` is the 0-based position in the text given to the parser. */
export class FormulaError extends Error {
  override readonly name = 'FormulaError';
  constructor(
    readonly code: FormulaErrorCode,
    message: string,
    readonly index: number,
    readonly text: string,
  ) {
    super(message);
  }
}

// ---------------------------------------------------------------------------------------------
// Phase suffixes

/** Phase words accepted in a suffix, mapped to the canonical phase. */
export const PHASE_WORDS: Readonly<Record<string, Phase>> = {
  g: 'g',
  gas: 'g',
  l: 'l',
  liq: 'l',
  liquid: 'l',
  cr: 'cr',
  c: 'cr',
  s: 'cr',
  solid: 'cr',
  aq: 'aq',
  ao: 'aq', // NBS tables: aqueous, undissociated
  ai: 'aq', // NBS tables: aqueous, completely ionised
};

/** State words: polymorphs and named minerals. `true` marks words that can only be a crystal. */
const STATE_WORDS: Readonly<Record<string, boolean>> = {
  graphite: true,
  diamond: true,
  rhombic: true,
  orthorhombic: true,
  monoclinic: true,
  white: true,
  red: true,
  black: true,
  gray: true,
  grey: true,
  calcite: true,
  aragonite: true,
  quartz: true,
  cristobalite: true,
  tridymite: true,
  corundum: true,
  hematite: true,
  magnetite: true,
  wustite: true,
  rutile: true,
  anatase: true,
  periclase: true,
  halite: true,
  hexagonal: true,
  cubic: true,
  tetragonal: true,
  fcc: true,
  bcc: true,
  hcp: true,
  alpha: true,
  beta: true,
  gamma: true,
  delta: true,
  amorphous: false,
  vitreous: false,
  glass: false,
};

const GREEK_STATE: Readonly<Record<string, string>> = { α: 'alpha', β: 'beta', γ: 'gamma', δ: 'delta' };

/** Known phase and state words, for documentation and for other modules that read phase columns. */
export const PHASE_SUFFIX_WORDS: readonly string[] = [...Object.keys(PHASE_WORDS), ...Object.keys(STATE_WORDS)];

/** Result of splitting a trailing phase/state suffix off a formula. */
export interface PhaseSplit {
  /** the formula text without the suffix, trimmed */
  formula: string;
  /** canonical phase (g, l, cr, aq) if the suffix named one or a crystal-only state word implied one */
  phase?: Phase;
  /** state word(s), lower case, comma-joined in the order written (e.g. 'graphite', 'alpha,white') */
  state?: string;
}

interface SplitAt extends PhaseSplit {
  /** offset of `formula` in the original text */
  start: number;
}

const TRAILING_GROUP = /\(([^()]*)\)\s*$/;

/** strict: a suffix naming two phases throws; lenient: that suffix is left on the formula. */
function splitWithOffset(text: string, strict: boolean): SplitAt {
  const start = text.length - text.trimStart().length;
  let body = text.trim();
  let phase: Phase | undefined;
  let impliedPhase: Phase | undefined;
  const states: string[] = [];
  for (;;) {
    const m = TRAILING_GROUP.exec(body);
    if (!m) break;
    const words = m[1]
      .split(/[,;\s]+/)
      .filter((w) => w.length > 0)
      .map((w) => (Object.hasOwn(GREEK_STATE, w) ? GREEK_STATE[w] : w));
    if (words.length === 0) break;
    if (!words.every((w) => Object.hasOwn(PHASE_WORDS, w) || Object.hasOwn(STATE_WORDS, w))) break;
    const groupStates: string[] = [];
    const groupPhases = new Set(words.filter((w) => Object.hasOwn(PHASE_WORDS, w)).map((w) => PHASE_WORDS[w]));
    if (phase !== undefined) groupPhases.add(phase);
    if (groupPhases.size > 1 && !strict) break;
    for (const w of words) {
      if (Object.hasOwn(PHASE_WORDS, w)) {
        const p = PHASE_WORDS[w];
        if (phase !== undefined && phase !== p) {
          throw new FormulaError(
            'phase-conflict',
            `The phase suffix of ${quote(text)} names two phases (${phase} and ${p}); give one phase per species.`,
            start + m.index,
            text,
          );
        }
        phase = p;
      } else {
        groupStates.push(w);
        if (STATE_WORDS[w]) impliedPhase = 'cr';
      }
    }
    states.unshift(...groupStates);
    body = body.slice(0, m.index).trimEnd();
  }
  const out: SplitAt = { formula: body, start };
  if (phase !== undefined) out.phase = phase;
  else if (impliedPhase !== undefined) out.phase = impliedPhase;
  if (states.length > 0) out.state = states.join(',');
  return out;
}

/**
 * Splits an optional phase suffix off a formula: `H2O(g)` -> {formula: 'H2O', phase: 'g'},
 * `C(graphite)` -> {formula: 'C', phase: 'cr', state: 'graphite'}, `C(cr,diamond)`,
 * `CaCO3(cr)(calcite)`. A trailing parenthesis that is not made only of phase and state words is
 * part of the formula (`Ca(OH)2`, `Fe(OH)3`). Never throws: a suffix naming two phases, `(g,l)`, is
 * left on the formula, and parseFormula then reports it as 'phase-conflict'.
 */
export function splitPhaseSuffix(text: string): PhaseSplit {
  const { start: _start, ...split } = splitWithOffset(text, false);
  return split;
}

// ---------------------------------------------------------------------------------------------
// Character classes

const SEPARATORS = new Set(['·', '•', '∙', '⋅', '*']);
/** Molecules that make "n.m<molecule>" a hydrate (solvate) part rather than a decimal count. */
const SOLVATES = new Set(['H2O', 'NH3', 'H2O2', 'CH3OH', 'C2H5OH']);
const SUBSCRIPT_ZERO = 0x2080; // ₀ … ₉ are U+2080 … U+2089
const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';
const SIGN_CHARS = '+-−'; // ASCII plus, hyphen-minus, U+2212 minus sign

function digitValue(c: string | undefined): number {
  if (c === undefined) return -1;
  const code = c.charCodeAt(0);
  if (code >= 48 && code <= 57) return code - 48;
  if (code >= SUBSCRIPT_ZERO && code <= SUBSCRIPT_ZERO + 9) return code - SUBSCRIPT_ZERO;
  return -1;
}
const isDigit = (c: string | undefined): boolean => digitValue(c) >= 0;
const isUpper = (c: string | undefined): boolean => c !== undefined && c >= 'A' && c <= 'Z';
const isLower = (c: string | undefined): boolean => c !== undefined && c >= 'a' && c <= 'z';
const isSpace = (c: string | undefined): boolean => c === ' ' || c === '\t';
const isSign = (c: string | undefined): boolean => c !== undefined && SIGN_CHARS.includes(c);

function quote(text: string): string {
  const t = text.length > 60 ? `${text.slice(0, 57)}...` : text;
  return JSON.stringify(t);
}

// ---------------------------------------------------------------------------------------------
// Charge

interface ChargeSplit {
  body: string;
  charge: number;
}

const SUPERSCRIPT_CHARGE = /([⁰¹²³⁴⁵⁶⁷⁸⁹]*)([⁺⁻]+)$|([⁺⁻])([⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/;
const CARET_CHARGE = /\^(\{?)([0-9]*)([+\-−]*)([0-9]*)(\}?)$/;
const PAREN_CHARGE = /\(([0-9]*)([+\-−])\)$|\(([+\-−])([0-9]+)\)$/;
const SIGN_DIGITS_CHARGE = /([+\-−])([0-9]+)$/;
const SIGN_RUN = /[+\-−]+$/;

function signOf(c: string): 1 | -1 {
  return c === '+' || c === '⁺' ? 1 : -1;
}

function superscriptNumber(s: string): number {
  let n = 0;
  for (const c of s) n = n * 10 + SUPERSCRIPT_DIGITS.indexOf(c);
  return n;
}

/** Reads the charge written at the end of `body`; `at` is the offset of body in the original text. */
function splitCharge(body: string, at: number, text: string): ChargeSplit {
  const bad = (index: number, why: string): FormulaError =>
    new FormulaError(
      'bad-charge',
      `The charge in ${quote(text)} (at character ${index + 1}) cannot be read: ${why}. ` +
        'Write it at the end as NH4+, SO4-2, SO4^2- or SO4--.',
      index,
      text,
    );
  const checkMagnitude = (n: number, index: number): number => {
    if (!(n > 0)) throw bad(index, 'a charge of zero is written by leaving the charge out');
    return n;
  };

  let m = SUPERSCRIPT_CHARGE.exec(body);
  if (m) {
    const idx = at + m.index;
    if (m[2] !== undefined) {
      const signs = m[2];
      if (!signs.split('').every((c) => c === signs[0])) throw bad(idx, 'it mixes + and − signs');
      if (m[1] && signs.length > 1) throw bad(idx, 'it gives both a number and repeated signs');
      const n = m[1] ? superscriptNumber(m[1]) : signs.length;
      return { body: body.slice(0, m.index), charge: signOf(signs[0]) * checkMagnitude(n, idx) };
    }
    return { body: body.slice(0, m.index), charge: signOf(m[3]) * checkMagnitude(superscriptNumber(m[4]), idx) };
  }

  m = CARET_CHARGE.exec(body);
  if (m) {
    const idx = at + m.index;
    const [, open, digitsBefore, signs, digitsAfter, close] = m;
    if (open !== close.replace('}', '{')) throw bad(idx, 'its braces are not balanced');
    if (signs.length === 0) throw bad(idx, 'a ^ must be followed by a charge such as ^2- or ^+');
    if (!signs.split('').every((c) => c === signs[0])) throw bad(idx, 'it mixes + and − signs');
    if (digitsBefore && digitsAfter) throw bad(idx, 'it has digits on both sides of the sign');
    const digits = digitsBefore || digitsAfter;
    if (digits && signs.length > 1) throw bad(idx, 'it gives both a number and repeated signs');
    const n = digits ? Number(digits) : signs.length;
    return { body: body.slice(0, m.index), charge: signOf(signs[0]) * checkMagnitude(n, idx) };
  }

  m = PAREN_CHARGE.exec(body);
  if (m) {
    const idx = at + m.index;
    const sign = m[2] ?? m[3];
    const digits = m[1] ?? m[4];
    const n = digits ? Number(digits) : 1;
    return { body: body.slice(0, m.index), charge: signOf(sign) * checkMagnitude(n, idx) };
  }

  m = SIGN_DIGITS_CHARGE.exec(body);
  if (m) {
    const idx = at + m.index;
    return { body: body.slice(0, m.index), charge: signOf(m[1]) * checkMagnitude(Number(m[2]), idx) };
  }

  m = SIGN_RUN.exec(body);
  if (m) {
    const idx = at + m.index;
    const signs = m[0];
    if (!signs.split('').every((c) => c === signs[0])) throw bad(idx, 'it mixes + and − signs');
    const rest = body.slice(0, m.index);
    const sign = signOf(signs[0]);
    if (signs.length === 1) {
      const bare = readBareCharge(rest, sign, at, text);
      if (bare) return bare;
    }
    return { body: rest, charge: sign * signs.length };
  }
  return { body, charge: 0 };
}

const TRAILING_DIGITS = /([0-9]+)$/;
const SINGLE_SYMBOL = /^[A-Z][a-z]?$/;

/**
 * `Fe3+`, `NH4+`, `O2-`: digits followed by one sign. On a polyatomic formula the digits are a
 * count and the charge is ±1 (NH4+, H3O+, HSO4-), except that a count of two or more digits is
 * refused as ambiguous (`SO42-` is what SO₄²⁻ becomes when its superscripts are lost). On a single
 * element symbol:
 * - a metal with + is a multiply charged cation: Fe3+ = Fe³⁺, Ca2+ = Ca²⁺, Hg2+ = Hg²⁺ (write the
 *   mercury(I) dimer as Hg2^2+ or Hg2+2);
 * - hydrogen, and a halogen with −, can only be molecular ions: H2+ = H₂⁺, I3- = I₃⁻ (triiodide);
 * - anything else (O2-: oxide or superoxide? N3-: nitride or azide? S2-, N2+, O2+ …) has two real
 *   readings, and the parser refuses to guess.
 */
function readBareCharge(rest: string, sign: 1 | -1, at: number, text: string): ChargeSplit | undefined {
  const m = TRAILING_DIGITS.exec(rest);
  if (!m) return undefined;
  const digits = m[1];
  const head = rest.slice(0, m.index);
  if (head.endsWith('.')) return undefined; // a decimal count such as TiO1.5+
  const n = Number(digits);
  if (n === 0) return undefined; // the body parser reports the zero count
  const s = sign > 0 ? '+' : '-';
  const ambiguous = (readingA: string, writeA: string, readingB: string, writeB: string): FormulaError =>
    new FormulaError(
      'ambiguous-charge',
      `${quote(text)} can be read two ways: ${readingA}, or ${readingB}. Write ${writeA} for the first and ${writeB} for the second.`,
      at + m.index,
      text,
    );
  // a coordination entity's charge follows its square bracket: [Fe(H2O)6]3+ is Fe(H2O)6 with charge +3,
  // never three of them with charge +1 (a count on a round bracket stays a count: Fe(OH)2+)
  if (head.endsWith(']')) return { body: head, charge: sign * n };
  if (!SINGLE_SYMBOL.test(head) || !isElement(head)) {
    if (digits.length < 2) return undefined; // NH4+, H3O+, SO4-
    const last = digits.slice(-1);
    const lead = digits.slice(0, -1);
    if (last === '0' || last === '1') return undefined; // C10H20+ : no charge is written as 0 or 1
    throw ambiguous(
      `${head}${lead} with charge ${s}${last}`,
      `${head}${lead}^${last}${s}`,
      `${head}${digits} with charge ${s}1`,
      `${head}${digits}^${s}`,
    );
  }
  const sym = head;
  if (n === 1) return { body: sym, charge: sign };
  if (sym === 'H' || (sign < 0 && HALOGENS.has(sym))) return undefined; // a count: H2+, I3-
  if (!NON_METALS.has(sym) && sign > 0) return { body: sym, charge: sign * n };
  throw ambiguous(
    `${sym} with charge ${s}${n}`,
    `${sym}^${n}${s} (or ${sym}${s}${n})`,
    `${sym}${n} with charge ${s}1`,
    `${sym}${n}^${s} (or ${sym}${n}${s}1)`,
  );
}

// ---------------------------------------------------------------------------------------------
// Body

type Counts = Map<string, number>;

function addInto(target: Counts, source: Counts, factor: number): void {
  for (const [el, n] of source) target.set(el, (target.get(el) ?? 0) + n * factor);
}

class BodyParser {
  private i = 0;
  constructor(
    private readonly s: string,
    private readonly at: number, // offset of s in the original text
    private readonly text: string,
  ) {}

  private fail(code: FormulaErrorCode, index: number, message: string): FormulaError {
    return new FormulaError(code, message, this.at + index, this.text);
  }
  private where(index: number): string {
    return `at character ${this.at + index + 1} of ${quote(this.text)}`;
  }

  parse(): Counts {
    const total: Counts = new Map();
    let parts = 0;
    let firstHadMultiplier = false;
    for (;;) {
      const partStart = this.i;
      let multiplier = 1;
      if (isDigit(this.s[this.i])) {
        multiplier = this.readNumber(true);
        if (parts === 0) firstHadMultiplier = true;
      }
      const counts = this.parseItems(undefined, -1);
      if (counts.size === 0) {
        if (multiplier !== 1 || isDigit(this.s[partStart])) {
          throw this.fail(
            'misplaced-number',
            partStart,
            `The number ${this.where(partStart)} is not followed by a formula; a multiplier stands before a hydrate part, as in CuSO4·5H2O.`,
          );
        }
        if (this.i >= this.s.length && parts === 0 && partStart === 0) {
          throw this.fail('empty', 0, `The formula ${quote(this.text)} is empty; give the species' formula, e.g. H2O.`);
        }
        throw this.fail(
          'empty-part',
          partStart,
          `A part of the formula is empty ${this.where(partStart)}: a hydrate separator must stand between two formulas, as in CuSO4·5H2O.`,
        );
      }
      addInto(total, counts, multiplier);
      parts++;
      if (this.i >= this.s.length) break;
      this.consumeSeparator();
    }
    if (parts === 1 && firstHadMultiplier) {
      throw this.fail(
        'leading-coefficient',
        0,
        `The formula ${quote(this.text)} starts with a number; a formula names one formula unit, so put the ` +
          'coefficient in the reaction equation (a leading number is accepted only on hydrate parts, as in 3CaO·Al2O3).',
      );
    }
    return total;
  }

  /** At a separator (with optional spaces around it): consume it. */
  private consumeSeparator(): void {
    while (isSpace(this.s[this.i])) this.i++;
    const c = this.s[this.i];
    if (c === '.' || SEPARATORS.has(c)) this.i++;
    else throw this.unexpected(this.i);
    while (isSpace(this.s[this.i])) this.i++;
  }

  /** Items until the end, a separator, or the closing bracket `close` (opened at `openAt`). */
  private parseItems(close: ')' | ']' | undefined, openAt: number): Counts {
    const counts: Counts = new Map();
    for (;;) {
      const c = this.s[this.i];
      if (c === undefined) {
        if (close) {
          throw this.fail(
            'unbalanced-parenthesis',
            openAt,
            `The bracket opened ${this.where(openAt)} is never closed; add the missing "${close}".`,
          );
        }
        return counts;
      }
      if (c === ')' || c === ']') {
        if (close === c) {
          this.i++;
          return counts;
        }
        if (close) {
          throw this.fail(
            'mismatched-parenthesis',
            this.i,
            `The bracket opened ${this.where(openAt)} with "${this.s[openAt]}" is closed with "${c}" ${this.where(this.i)}; use "${close}".`,
          );
        }
        throw this.fail(
          'unbalanced-parenthesis',
          this.i,
          `The "${c}" ${this.where(this.i)} closes a bracket that was never opened; remove it or add the opening bracket.`,
        );
      }
      if (c === '(' || c === '[') {
        const open = this.i++;
        const inner = this.parseItems(c === '(' ? ')' : ']', open);
        if (inner.size === 0) {
          throw this.fail('empty-group', open, `The brackets ${this.where(open)} are empty; remove them or put a formula inside.`);
        }
        addInto(counts, inner, this.readCount());
        continue;
      }
      if (isUpper(c)) {
        const symStart = this.i++;
        while (isLower(this.s[this.i])) this.i++;
        const sym = this.s.slice(symStart, this.i);
        if (!isElement(sym)) {
          throw this.fail(
            'unknown-element',
            symStart,
            `"${sym}" ${this.where(symStart)} is not an element symbol; a symbol is a capital letter, optionally ` +
              'followed by a lowercase one (Co is cobalt, CO is carbon monoxide).',
          );
        }
        const n = this.readCount();
        counts.set(sym, (counts.get(sym) ?? 0) + n);
        continue;
      }
      if (isLower(c)) {
        throw this.fail(
          'lowercase-symbol',
          this.i,
          `"${c}" ${this.where(this.i)} starts with a lowercase letter; element symbols begin with a capital (e.g. Co, CO, NaCl).`,
        );
      }
      if (c === '.' || SEPARATORS.has(c) || (isSpace(c) && this.separatorAhead())) {
        if (close) {
          throw this.fail(
            'hydrate-in-group',
            this.i,
            `A hydrate separator ${this.where(this.i)} stands inside brackets; write hydrate parts at the top level, as in CuSO4·5H2O.`,
          );
        }
        return counts;
      }
      if (isDigit(c)) {
        throw this.fail(
          'misplaced-number',
          this.i,
          `The number ${this.where(this.i)} does not follow an element symbol or a closing bracket; a count is written after what it counts, as in H2O or (OH)2.`,
        );
      }
      if (isSign(c) || c === '^' || SUPERSCRIPT_DIGITS.includes(c) || c === '⁺' || c === '⁻') {
        throw this.fail(
          'misplaced-charge',
          this.i,
          `A charge sign ${this.where(this.i)} is not at the end of the formula; write the charge last, as in SO4^2- or NH4+.`,
        );
      }
      throw this.unexpected(this.i);
    }
  }

  private separatorAhead(): boolean {
    let j = this.i;
    while (isSpace(this.s[j])) j++;
    const c = this.s[j];
    return c === '.' || SEPARATORS.has(c);
  }

  private unexpected(index: number): FormulaError {
    const c = this.s[index];
    const what = isSpace(c) ? 'a space' : `the character ${JSON.stringify(c)}`;
    return this.fail(
      'unexpected-character',
      index,
      `The formula has ${what} ${this.where(index)} that is not part of a formula; remove it ` +
        '(spaces are allowed only around hydrate separators and before a phase suffix).',
    );
  }

  /** An optional count after a symbol or a group; 1 when absent. */
  private readCount(): number {
    if (!isDigit(this.s[this.i])) return 1;
    return this.readNumber(false);
  }

  /**
   * digits ['.' digits]. As a count (multiplier = false) a '.' after an integer of 2 or more that is
   * followed by a multiplier and a formula is left alone: it is a hydrate separator (CuSO4.5H2O).
   */
  private readNumber(multiplier: boolean): number {
    const start = this.i;
    let intText = '';
    while (isDigit(this.s[this.i])) intText += String(digitValue(this.s[this.i++]));
    let value = Number(intText);
    if (this.s[this.i] === '.' && isDigit(this.s[this.i + 1])) {
      let decimalPoint = true;
      if (!multiplier && value > 1) {
        const partAt = this.hydrateFollows(this.i + 1);
        if (partAt >= 0) {
          if (SOLVATES.has(this.partText(partAt))) decimalPoint = false;
          else {
            const lead = this.s.slice(start, this.i);
            throw this.fail(
              'ambiguous-dot',
              this.i,
              `The "." ${this.where(this.i)} can be a decimal point (a count of ${lead}.${this.s.slice(this.i + 1, partAt)}) ` +
                'or a hydrate separator; write "·" or "*" between hydrate parts, or put a decimal count in brackets, as in (Fe2.95)O4.',
            );
          }
        }
      }
      if (decimalPoint) {
        this.i++;
        let frac = '';
        while (isDigit(this.s[this.i])) frac += String(digitValue(this.s[this.i++]));
        value = Number(`${intText}.${frac}`);
      }
    }
    if (!(value > 0) || !Number.isFinite(value)) {
      throw this.fail(
        'zero-count',
        start,
        `The count ${this.where(start)} is zero; leave the element out instead of giving it a count of 0.`,
      );
    }
    return value;
  }

  /** At j: digits ['.' digits] then the start of a formula? Returns where the formula starts, or -1. */
  private hydrateFollows(j: number): number {
    while (isDigit(this.s[j])) j++;
    if (this.s[j] === '.' && isDigit(this.s[j + 1])) {
      j++;
      while (isDigit(this.s[j])) j++;
    }
    const c = this.s[j];
    return isUpper(c) || c === '(' || c === '[' ? j : -1;
  }

  /** The formula text of the hydrate part starting at j, up to the next separator or the end. */
  private partText(j: number): string {
    let k = j;
    while (k < this.s.length && !SEPARATORS.has(this.s[k]) && this.s[k] !== '.' && !isSpace(this.s[k])) k++;
    return this.s.slice(j, k);
  }
}

// ---------------------------------------------------------------------------------------------
// Public API

/** Twelve significant digits: removes binary noise such as 0.30000000000000004 from summed counts. */
function tidy(n: number): number {
  return Number(n.toPrecision(12));
}

function parseUncached(text: string): Formula {
  const split = splitWithOffset(text, true);
  const body = split.formula;
  if (body.length === 0) {
    throw new FormulaError(
      'empty',
      `The formula ${quote(text)} is empty; give the species' formula, e.g. H2O.`,
      split.start,
      text,
    );
  }
  const { body: rest, charge } = splitCharge(body, split.start, text);
  if (rest === 'e') {
    if (charge !== -1) {
      throw new FormulaError(
        'bad-electron',
        `${quote(text)} is read as the electron, which has charge −1; write it as e-.`,
        split.start,
        text,
      );
    }
    return { elements: {}, charge };
  }
  if (rest.trim().length === 0) {
    throw new FormulaError(
      'empty',
      `The formula ${quote(text)} has a charge but no elements; write e.g. H+ or e-.`,
      split.start,
      text,
    );
  }
  const counts = new BodyParser(rest, split.start, text).parse();
  const elements: Record<string, number> = {};
  for (const [el, n] of counts) elements[el] = tidy(n);
  return { elements, charge };
}

const CACHE_LIMIT = 100_000;
/** A failed parse is cached as its parts, not as the Error: a thrown Error's stack keeps its callers' closures alive. */
interface CachedFailure {
  code: FormulaErrorCode;
  message: string;
  index: number;
}
const cache = new Map<string, Formula | CachedFailure>();

/**
 * Parses a chemical formula (see the grammar at the top of this file). Results are cached by text
 * and returned frozen: do not mutate them (copy with `{ ...f, elements: { ...f.elements } }`).
 * Throws FormulaError, with a stable `code`, an actionable message and the 0-based `index`.
 */
export function parseFormula(text: string): Formula {
  let hit = cache.get(text);
  if (hit === undefined) {
    try {
      const f = parseUncached(text);
      Object.freeze(f.elements);
      hit = Object.freeze(f);
    } catch (err) {
      if (!(err instanceof FormulaError)) throw err;
      hit = { code: err.code, message: err.message, index: err.index };
    }
    if (cache.size >= CACHE_LIMIT) cache.clear();
    cache.set(text, hit);
  }
  if ('code' in hit) throw new FormulaError(hit.code, hit.message, hit.index, text);
  return hit;
}

/** Hill order: C first and H second when the formula has carbon, then the rest alphabetically; without carbon, all alphabetically. */
export function hillOrder(elements: Record<string, number>): string[] {
  const syms = Object.keys(elements).sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (!('C' in elements)) return syms;
  const rest = syms.filter((s) => s !== 'C' && s !== 'H');
  return 'H' in elements ? ['C', 'H', ...rest] : ['C', ...rest];
}

/**
 * The formula in Hill order with its charge: CH4, H2O, CuH10O9S, H4N+, O4S^2-, Fe^3+, O2^-, e-.
 * Counts of 1 are omitted; fractional counts are written as decimals, bracketed when above 1 and
 * followed by another symbol ((C2.5)H6) so that the '.' cannot read as a hydrate separator.
 * The text parses back to `f`.
 */
/** Written-out forms of the frozen formulas parseFormula hands out (a table repeats a few thousand formulas on 10^6 rows). */
const formatted = new WeakMap<Formula, string>();

export function formatFormula(f: Formula): string {
  if (!Object.isFrozen(f) || !Object.isFrozen(f.elements)) return formatUncached(f); // a formula built by hand may still change
  let text = formatted.get(f);
  if (text === undefined) formatted.set(f, (text = formatUncached(f)));
  return text;
}

function formatUncached(f: Formula): string {
  if (Object.keys(f.elements).length === 0) return f.charge === -1 ? 'e-' : '';
  let out = '';
  const order = hillOrder(f.elements);
  order.forEach((sym, k) => {
    const n = f.elements[sym];
    const text = n === 1 ? sym : `${sym}${String(n)}`;
    // a decimal count of 2 or more before another symbol would read as a hydrate: bracket it
    out += !Number.isInteger(n) && n > 1 && k < order.length - 1 ? `(${text})` : text;
  });
  if (f.charge !== 0) {
    const s = f.charge > 0 ? '+' : '-';
    const z = Math.abs(f.charge);
    // a bare sign after a digit could read as a charge on a single atom (O2- = O²⁻?): use ^ there
    out += z !== 1 ? `^${String(z)}${s}` : isDigit(out[out.length - 1]) ? `^${s}` : s;
  }
  return out;
}

/** Atom counts of the frozen formulas parseFormula hands out: four rules ask for each species'. */
const atoms = new WeakMap<Formula, number>();

/** Atoms per formula unit (fractional for non-stoichiometric formulas such as Fe0.947O). */
export function atomCount(f: Formula): number {
  const known = atoms.get(f);
  if (known !== undefined) return known;
  let n = 0;
  for (const sym in f.elements) n += f.elements[sym];
  n = tidy(n);
  if (Object.isFrozen(f) && Object.isFrozen(f.elements)) atoms.set(f, n); // a formula built by hand may still change
  return n;
}

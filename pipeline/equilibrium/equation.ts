// Reading a reaction equation: `CO(g) + H2O(g) = CO2(g) + H2(g)`, `N2 + 3H2 -> 2 NH3`,
// `1/2 O2(g) + H2(g) <=> H2O(l)`, `Fe^3+(aq) + e- = Fe^2+(aq)`.
//
// Grammar:
//   equation := side arrow side               arrow: = <=> <-> ⇌ ⇄ ↔ → -> =>   (exactly one)
//   side     := term { '+' term }
//   term     := [coefficient] species          species: a formula or a table name, optional phase suffix
//   coefficient := 3 | 0.5 | .5 | 1/2 | 3/2 | ½ ⅓ ⅔ ¼ ¾ (alone or after a whole number: 1½),
//                  followed by a space or directly by a formula (3H2, 2NH3)
//
// A '+' separates terms when what follows it (after spaces) can start a term: a digit, a capital,
// a bracket, an electron `e-`, or a fraction sign. Otherwise it belongs to a charge:
// `NH4+ + Cl-`, `NH4++Cl-`, `Fe+3 + e-`, `Fe^3+ + e-`. A lowercase name after '+' needs spaces
// around the '+' (`methane + 2 O2`): then the '+' is a separator whenever spaces flank it.

import { FormulaError, parseFormula, splitPhaseSuffix } from '../chemistry/formula.js';
import type { Formula, Phase } from '../types.js';

/** One species on one side, as written. */
export interface EquationTerm {
  /** signed stoichiometric coefficient: negative for reactants, positive for products */
  coeff: number;
  /** the term as written, without its coefficient (e.g. 'H2O(g)') */
  text: string;
  /** the text without its phase suffix (e.g. 'H2O') */
  bare: string;
  phase?: Phase;
  state?: string;
  /** the bare text read as a formula, when it is one */
  formula?: Formula;
}

export interface ParsedEquation {
  terms: EquationTerm[];
}

export class EquationError extends Error {
  override readonly name = 'EquationError';
  constructor(
    readonly code: 'no-arrow' | 'two-arrows' | 'empty-side' | 'empty-term' | 'bad-coefficient',
    message: string,
  ) {
    super(message);
  }
}

const ARROW = /<=>|<->|⇌|⇄|↔|→|->|=>|=/g;
const FRACTION_CHARS: Readonly<Record<string, number>> = { '½': 1 / 2, '⅓': 1 / 3, '⅔': 2 / 3, '¼': 1 / 4, '¾': 3 / 4 };
/** What may start a term after a '+' without spaces: digit, capital, bracket, fraction sign, the electron. */
const TERM_START = /^\s*(?:[0-9.]|[A-Z([]|[½⅓⅔¼¾]|e\s*[-−(])/;
/** A leading coefficient: number, optional /number, optional fraction sign; then space or a formula start. */
const COEFF = /^(?:(\d+(?:\.\d*)?|\.\d+)(?:\s*\/\s*(\d+(?:\.\d*)?|\.\d+))?)?([½⅓⅔¼¾])?(?=\s|[A-Z([]|e\s*[-−(]|$)/;

/** Splits one side into term texts at the '+' signs that separate terms (see the header). */
export function splitTerms(side: string): string[] {
  const out: string[] = [];
  let start = 0;
  for (let i = 0; i < side.length; i++) {
    if (side[i] !== '+') continue;
    const before = side[i - 1];
    const after = side[i + 1];
    const spaced = before !== undefined && /\s/.test(before) && after !== undefined && /\s/.test(after);
    const rest = side.slice(i + 1);
    // `^3+ ` and `(2+)` are charges, `H+ + OH-`: the first '+' is followed by another '+'
    if (before === '^' || before === '{') continue;
    if (spaced || (i > start && TERM_START.test(rest) && !/^\s*\+/.test(rest) && !chargeDigitsThenEnd(rest) && !PHASE_GROUP.test(rest))) {
      out.push(side.slice(start, i));
      start = i + 1;
    }
  }
  out.push(side.slice(start));
  return out.map((t) => t.trim());
}

/** `Fe^3+(aq)`: a bracket of lowercase words right after the '+' is the phase suffix of a charged species. */
const PHASE_GROUP = /^\([a-zα-δ,;\s]*\)/;

/** `Fe+3` / `Fe+3(aq)`: digits after the '+' that end the term (nothing but a phase suffix follows) are a charge. */
function chargeDigitsThenEnd(rest: string): boolean {
  return /^\d+(?:\s*\([^()]*\))*\s*(?:$|\+)/.test(rest);
}

function readCoefficient(term: string): { coeff: number; rest: string } {
  const m = COEFF.exec(term);
  if (!m || m[0] === '') return { coeff: 1, rest: term };
  const [all, num, den, frac] = m;
  let value = num !== undefined ? Number(num) : frac !== undefined ? 0 : 1;
  if (den !== undefined) {
    if (frac !== undefined) throw new EquationError('bad-coefficient', `the coefficient "${all}" mixes a fraction sign and a slash`);
    value /= Number(den);
  }
  if (frac !== undefined) value += FRACTION_CHARS[frac]!;
  if (!Number.isFinite(value) || value <= 0) {
    throw new EquationError('bad-coefficient', `the coefficient "${all.trim()}" must be a positive number (write 0.5, 1/2 or ½)`);
  }
  return { coeff: value, rest: term.slice(all.length).trim() };
}

function readTerm(text: string, sign: 1 | -1): EquationTerm {
  const { coeff, rest } = readCoefficient(text);
  if (rest === '') throw new EquationError('empty-term', `"${text}" is a coefficient without a species`);
  const split = splitPhaseSuffix(rest);
  const term: EquationTerm = { coeff: sign * coeff, text: rest, bare: split.formula };
  if (split.phase) term.phase = split.phase;
  if (split.state) term.state = split.state;
  try {
    term.formula = parseFormula(split.formula);
  } catch (e) {
    if (!(e instanceof FormulaError)) throw e;
    // not a formula: a species name, resolved against the table's names
  }
  return term;
}

/**
 * Reads an equation into signed terms, reactants first. Throws EquationError (stable `code`, a
 * sentence the user can act on) when it has no arrow or two, an empty side or term, or a
 * coefficient that is not a positive number. Terms are not merged and species are not resolved here.
 */
export function parseEquation(equation: string): ParsedEquation {
  const arrows = [...equation.matchAll(ARROW)];
  if (arrows.length === 0) throw new EquationError('no-arrow', 'the equation has no "=" (or <=>, ->, ⇌) between reactants and products');
  if (arrows.length > 1) throw new EquationError('two-arrows', `the equation has ${arrows.length} arrows ("=", "<=>", "->", …); write exactly one`);
  const a = arrows[0]!;
  const sides = [equation.slice(0, a.index), equation.slice(a.index + a[0].length)];
  const terms: EquationTerm[] = [];
  sides.forEach((side, k) => {
    if (side.trim() === '') throw new EquationError('empty-side', `the ${k === 0 ? 'left' : 'right'} side of the equation is empty`);
    for (const t of splitTerms(side)) {
      if (t === '') throw new EquationError('empty-term', `the ${k === 0 ? 'left' : 'right'} side has an empty term (two "+" in a row, or a "+" at an end)`);
      terms.push(readTerm(t, k === 0 ? -1 : 1));
    }
  });
  return { terms };
}

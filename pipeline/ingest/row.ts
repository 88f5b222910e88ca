// One raw row (strings by position) -> a SpeciesRow in SI units, or the findings that reject it.
// Numbers are parsed strictly: nothing bad is coerced into something valid.
import { excerpt } from '../errors.js';
import { parseFormula, splitPhaseSuffix, FormulaError } from '../chemistry/formula.js';
import { buildSegment, CpSpecError } from '../cp/index.js';
import { makeFinding } from '../rules/finding.js';
import { rule as badCpSpec } from '../rules/bad-cp-spec.js';
import { rule as badFormula } from '../rules/bad-formula.js';
import { rule as badNumber } from '../rules/bad-number.js';
import { rule as badPhase } from '../rules/bad-phase.js';
import { rule as missingField } from '../rules/missing-field.js';
import { findUnit } from '../units/table.js';
import { CP_MODELS, type CpModelName, type CpSpec, type Finding, type Location, type Phase, type RowValues, type SpeciesRow } from '../types.js';
import type { ColumnSlot, HeaderLayout } from './header.js';

/** A plain decimal: optional sign, digits with an optional point, optional exponent. */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

const PHASE_WORDS: Record<string, Phase> = {
  g: 'g', gas: 'g', l: 'l', liq: 'l', liquid: 'l', cr: 'cr', c: 'cr', s: 'cr', solid: 'cr', cd: 'cr', aq: 'aq', ao: 'aq', ai: 'aq',
};

/** Per-file context: the layout and what every row of the file shares. */
export interface RowContext {
  file: string;
  layout: HeaderLayout;
  /** canonical column -> 1-based position, shared by every row of the file */
  columns: Record<string, number>;
  /** canonical column -> unit name as declared, shared by every row of the file */
  units: Record<string, string>;
  /** CSV/TSV: locations carry the 1-based column of the field */
  positional: boolean;
}

export function rowContext(file: string, layout: HeaderLayout, positional: boolean): RowContext {
  const columns: Record<string, number> = {};
  const units: Record<string, string> = {};
  for (const s of layout.slots) {
    columns[s.def.name] = s.index + 1;
    if (s.unit) units[s.def.name] = s.unit.name;
  }
  return { file, layout, columns, units, positional };
}

/**
 * A table repeats a few citations over many rows, and the parser hands each row its own copy: kept
 * per accepted row in the species records, they would cost a string each. Bounded, like the formula cache.
 */
const interned = new Map<string, string>();
const INTERN_LIMIT = 10_000;
function intern(s: string): string {
  const hit = interned.get(s);
  if (hit !== undefined) return hit;
  if (interned.size >= INTERN_LIMIT) interned.clear();
  interned.set(s, s);
  return s;
}

export type RowResult = { row: SpeciesRow; findings?: undefined } | { row?: undefined; findings: Finding[] };

export function parseNumberText(text: string): number | 'nan' | 'inf' | undefined {
  let t = text.trim();
  if (t.indexOf('\u2212') !== -1) t = t.replace(/\u2212/g, '-'); // a typographic minus is a minus
  if (!DECIMAL.test(t)) {
    return /^[+-]?(nan|inf(inity)?)$/i.test(t) ? (/nan/i.test(t) ? 'nan' : 'inf') : undefined;
  }
  const v = Number(t);
  return Number.isFinite(v) ? v : 'inf';
}

/** Reads one row. `cells` are the row's strings by position; missing trailing cells are undefined. */
export function normalizeRow(cells: readonly (string | undefined)[], line: number, ctx: RowContext): RowResult {
  const findings: Finding[] = [];
  const { file, layout } = ctx;
  const loc = (slot?: ColumnSlot): Location =>
    slot ? (ctx.positional ? { file, line, column: slot.index + 1, field: slot.def.name } : { file, line, field: slot.def.name }) : { file, line };
  const text = (name: string): string => {
    const slot = layout.byName.get(name);
    return slot ? (cells[slot.index] ?? '').trim() : '';
  };
  const species0 = text('species');
  const name = species0 || text('formula');
  const ids = { species: name || undefined };

  const number = (name: string): number | undefined => {
    const slot = layout.byName.get(name);
    if (!slot) return undefined;
    const raw = cells[slot.index];
    if (raw === undefined || raw.trim() === '') return undefined;
    const v = parseNumberText(raw);
    if (typeof v !== 'number') {
      findings.push(makeFinding(badNumber, v === undefined ? 'notNumber' : 'notFinite', { field: name, text: excerpt(raw) }, loc(slot), ids));
      return undefined;
    }
    const u = slot.unit;
    const si = u ? v * u.factor + u.offset : v;
    if (!Number.isFinite(si)) {
      // finite as written, but not once converted to SI (1e306 kcal/mol)
      findings.push(makeFinding(badNumber, 'notFinite', { field: name, text: excerpt(raw) }, loc(slot), ids));
      return undefined;
    }
    return si;
  };
  const list = (name: string, unitSlot?: ColumnSlot): number[] | undefined => {
    const slot = layout.byName.get(name);
    if (!slot) return undefined;
    const raw = (cells[slot.index] ?? '').trim();
    if (raw === '') return undefined;
    const parts = raw.split(/\s+/);
    const out: number[] = new Array(parts.length);
    for (let i = 0; i < parts.length; i++) {
      const v = parseNumberText(parts[i]!);
      if (typeof v !== 'number') {
        findings.push(makeFinding(badNumber, v === undefined ? 'notNumber' : 'notFinite', { field: name, text: excerpt(parts[i]!) }, loc(slot), ids));
        return undefined;
      }
      const u = (unitSlot ?? slot).unit;
      out[i] = u ? v * u.factor + u.offset : v;
      if (!Number.isFinite(out[i])) {
        findings.push(makeFinding(badNumber, 'notFinite', { field: name, text: excerpt(parts[i]!) }, loc(slot), ids));
        return undefined;
      }
    }
    return out;
  };

  // identity: species, formula, phase
  if (!name) findings.push(makeFinding(missingField, 'missing', { field: layout.byName.has('species') ? 'species' : 'formula' }, loc(layout.byName.get('species') ?? layout.byName.get('formula'))));
  const phaseSlot = layout.byName.get('phase');
  const phaseText = text('phase');
  let phase: Phase | undefined;
  let state: string | undefined;
  if (!phaseText) {
    findings.push(makeFinding(missingField, 'missing', { field: 'phase' }, loc(phaseSlot), ids));
  } else {
    const [head, ...rest] = phaseText.toLowerCase().split(/[\s,;()]+/).filter(Boolean);
    phase = head === undefined ? undefined : PHASE_WORDS[head];
    if (!phase) findings.push(makeFinding(badPhase, 'unknown', { text: excerpt(phaseText) }, loc(phaseSlot), ids));
    if (rest.length) state = rest.join(' ');
  }
  const formulaCell = text('formula');
  const formulaText = formulaCell === '' || formulaCell === name ? name : formulaCell; // one string when they agree
  let formula;
  if (formulaText) {
    const split = splitPhaseSuffix(formulaText);
    state = state ?? split.state;
    try {
      formula = parseFormula(split.formula);
    } catch (e) {
      if (!(e instanceof FormulaError)) throw e;
      const slot = text('formula') ? layout.byName.get('formula') : layout.byName.get('species');
      findings.push(makeFinding(badFormula, 'parse', { text: excerpt(formulaText), detail: e.message }, loc(slot), ids));
    }
  }

  // formation values
  const location: Location = { file, line }; // one object for the row's values and its Cp range
  const values: RowValues = { P_ref: 1, source: intern(text('source')), location };
  const dHf = number('dHf');
  const dGf = number('dGf');
  const S = number('S');
  if (dHf !== undefined) values.dHf = dHf;
  if (dGf !== undefined) values.dGf = dGf;
  if (S !== undefined) values.S = S;
  for (const u of ['u_dHf', 'u_dGf', 'u_S'] as const) {
    const v = number(u);
    if (v !== undefined) {
      if (v < 0) findings.push(makeFinding(badNumber, 'negative', { field: u, text: String(v) }, loc(layout.byName.get(u)), ids));
      else values[u] = v;
    }
  }
  const P = number('P_ref');
  if (P !== undefined) {
    if (P <= 0) findings.push(makeFinding(badNumber, 'negative', { field: 'P_ref', text: String(P) }, loc(layout.byName.get('P_ref')), ids));
    else values.P_ref = P;
  }
  // a negative S° is not rejected here: the Gibbs–Helmholtz rule can tell a sign slip from other causes
  const cp = readCp(text, number, list, layout, loc, ids, findings, location);
  if (findings.length === 0 && dHf === undefined && dGf === undefined && S === undefined && !cp) {
    findings.push(makeFinding(missingField, 'nothing', {}, { file, line }, ids));
  }
  if (findings.length) {
    for (const f of findings) if (phase && f.phase === undefined) f.phase = phase;
    return { findings };
  }
  const row: SpeciesRow = {
    species: name,
    formulaText: formulaText,
    formula: formula!,
    phase: phase!,
    values,
    columns: ctx.columns,
    units: ctx.units,
  };
  if (state) row.state = state;
  if (cp) row.cp = cp;
  return { row };
}

function readCp(
  text: (n: string) => string,
  number: (n: string) => number | undefined,
  list: (n: string, unitSlot?: ColumnSlot) => number[] | undefined,
  layout: HeaderLayout,
  loc: (slot?: ColumnSlot) => Location,
  ids: { species?: string },
  findings: Finding[],
  location: Location,
): CpSpec | undefined {
  const modelText = text('cp_model').toLowerCase();
  const before = findings.length;
  const coeffs = list('cp_coeffs');
  if (!modelText) {
    if (coeffs) findings.push(makeFinding(missingField, 'cpModel', {}, loc(layout.byName.get('cp_model')), ids));
    return undefined;
  }
  const modelSlot = layout.byName.get('cp_model');
  if (!(CP_MODELS as readonly string[]).includes(modelText)) {
    findings.push(makeFinding(badCpSpec, 'unknownModel', { text: excerpt(text('cp_model')) }, loc(modelSlot), ids));
    return undefined;
  }
  const model = modelText as CpModelName;
  const coeffSlot = layout.byName.get('cp_coeffs');
  if (!coeffs) {
    if (findings.length === before) findings.push(makeFinding(missingField, 'missing', { field: 'cp_coeffs' }, loc(coeffSlot), ids));
    return undefined;
  }
  let Tmin = number('cp_Tmin');
  let Tmax = number('cp_Tmax');
  const spec: CpSpec = { model, coeffs, unit: '', unitFactor: 1, Tmin: NaN, Tmax: NaN, location };

  if (model === 'poly' || model === 'table') {
    const unitText = text('cp_unit') || 'J/(mol K)';
    const unit = findUnit(unitText, 'heat-capacity');
    if (!unit) {
      findings.push(makeFinding(badCpSpec, 'unit', { text: excerpt(unitText) }, loc(layout.byName.get('cp_unit')), ids));
    } else {
      spec.unit = unit.name;
      spec.unitFactor = unit.factor;
    }
  } else {
    spec.unit = model === 'shomate' ? 'J/(mol K), t = T/1000' : 'R';
  }

  if (model === 'poly') {
    const exps = list('cp_exponents');
    if (!exps) {
      if (findings.length === before) findings.push(makeFinding(missingField, 'missing', { field: 'cp_exponents' }, loc(layout.byName.get('cp_exponents')), ids));
    } else if (exps.length !== coeffs.length) {
      findings.push(makeFinding(badCpSpec, 'exponents', { coeffs: coeffs.length, exponents: exps.length }, loc(coeffSlot), ids));
    } else spec.exponents = exps;
  } else if (model === 'table') {
    const tSlot = layout.byName.get('cp_T') ?? layout.byName.get('cp_exponents');
    const temps = tSlot ? list(tSlot.def.name, layout.byName.get('cp_T') ? undefined : layout.byName.get('cp_Tmin')) : undefined;
    const ascending = temps !== undefined && temps.every((t, i) => i === 0 || t > temps[i - 1]!);
    if (!temps || temps.length !== coeffs.length || temps.length < 2 || !ascending) {
      if (findings.length === before) findings.push(makeFinding(badCpSpec, 'tableTemps', { coeffs: coeffs.length, temps: temps?.length ?? 0 }, loc(tSlot ?? coeffSlot), ids));
    } else {
      spec.temps = temps;
      Tmin ??= temps[0];
      Tmax ??= temps[temps.length - 1];
    }
  }

  if (Tmin === undefined || Tmax === undefined) {
    if (findings.length === before) findings.push(makeFinding(missingField, 'cpRange', { model }, loc(layout.byName.get(Tmin === undefined ? 'cp_Tmin' : 'cp_Tmax')), ids));
    return undefined;
  }
  for (const [field, T] of [['cp_Tmin', Tmin], ['cp_Tmax', Tmax]] as const) {
    if (T <= 0) findings.push(makeFinding(badNumber, 'nonPositiveT', { field, value: T }, loc(layout.byName.get(field)), ids));
  }
  if (Tmin > 0 && Tmax > 0 && Tmin >= Tmax) {
    findings.push(makeFinding(badCpSpec, 'range', { Tmin, Tmax }, loc(layout.byName.get('cp_Tmin')), ids));
  }
  if (findings.length > before) return undefined;
  spec.Tmin = Tmin;
  spec.Tmax = Tmax;
  try {
    buildSegment(spec); // validates coefficient counts and values against the model
  } catch (e) {
    if (!(e instanceof CpSpecError)) throw e;
    findings.push(makeFinding(badCpSpec, 'invalid', { model, detail: e.message }, loc(coeffSlot), ids));
    return undefined;
  }
  return spec;
}

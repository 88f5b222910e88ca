// Fold accepted rows into one record per species and phase; rows are not kept. The records live in
// typed columns (typed-columns.ts): a number per field per species, value row and Cp range; names in a
// code-unit pool with its own hash index (name-table.ts); other strings interned. 10^6 rows fold into
// ~200 MB of typed arrays instead of a JavaScript object graph of ~1 GB. `at` builds the Species
// object the rules read, one at a time; nothing keeps it.
import { makeFinding } from './rules/finding.js';
import { rule as conflictingValues } from './rules/conflicting-values.js';
import { rule as duplicateRow } from './rules/duplicate-row.js';
import { rule as badCpSpec } from './rules/bad-cp-spec.js';
import { formatFormula } from './chemistry/formula.js';
import { toDeclared } from './units/convert.js';
import { arrayList, type SpeciesList } from './species-list.js';
import { NameTable } from './name-table.js';
import { F64Column, I32Column, Interned, toCell } from './typed-columns.js';
import { CP_MODELS, PHASES, type CpModelName, type CpSpec, type Finding, type Formula, type Phase, type RowValues, type Species, type SpeciesRow } from './types.js';

const FIELDS = ['dHf', 'dGf', 'S'] as const;
/** Published correlations use 1–10 ranges per species; past this many, further ranges are refused (each
 *  with a finding), which keeps joining them cheap whatever a hostile or generated table holds. */
export const MAX_CP_RANGES = 200;
/** two values of one field from one source agree when within this relative difference (round-off of unit conversion) */
const SAME_REL = 1e-9;

function same(a: number | undefined, b: number | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return Math.abs(a - b) <= SAME_REL * Math.max(1, Math.abs(a), Math.abs(b));
}

function sameCp(a: CpSpec, b: CpSpec): boolean {
  return a.model === b.model && same(a.Tmin, b.Tmin) && same(a.Tmax, b.Tmax) && a.coeffs.length === b.coeffs.length && a.coeffs.every((c, i) => same(c, b.coeffs[i]));
}

/** Rows without a source text are attributed to their file, so files merged into one run stay apart (as cross-source reads them). */
function sourceKey(v: RowValues): string {
  return v.source !== '' ? `s:${v.source}` : `f:${v.location.file}`;
}

function rangeKey(c: CpSpec): string {
  return `${c.model}|${c.Tmin}|${c.Tmax}`;
}

function push<K, T>(map: Map<K, T[]>, key: K, item: T): void {
  const list = map.get(key);
  if (list) list.push(item);
  else map.set(key, [item]);
}

function hasValues(v: RowValues): boolean {
  return v.dHf !== undefined || v.dGf !== undefined || v.S !== undefined;
}

/** The optional numbers of a value row, in the order RowValues lists them; P_ref is always given. */
const VALUE_COLUMNS = ['dHf', 'dGf', 'S', 'u_dHf', 'u_dGf', 'u_S'] as const;
const VALUES = VALUE_COLUMNS.slice(0, 3);
const UNCERTAINTIES = VALUE_COLUMNS.slice(3);

/** Formation values as rows gave them: one entry per kept row, chained per species in input order. */
class ValueRows {
  readonly num = VALUES.map(() => new F64Column());
  /** the row's entry in `uNum`, or −1: most rows state no uncertainty */
  readonly u = new I32Column();
  readonly uNum = UNCERTAINTIES.map(() => new F64Column());
  readonly P_ref = new I32Column(); // interned: a table uses one or two standard pressures
  readonly source = new I32Column();
  readonly file = new I32Column();
  readonly line = new I32Column();
  readonly next = new I32Column();
}

/** Cp ranges as rows declared them: coefficients, exponents and listed temperatures in one number pool. */
class CpRows {
  readonly model = new I32Column();
  readonly unit = new I32Column(); // the declared unit and its factor, interned together
  readonly Tmin = new F64Column();
  readonly Tmax = new F64Column();
  readonly start = new I32Column(); // coefficients at pool[start, start + count)
  readonly count = new I32Column();
  /** poly: the exponents, table: the listed temperatures, at pool[extra, extra + count); else −1. Shared by equal lists. */
  readonly extra = new I32Column();
  readonly file = new I32Column();
  readonly line = new I32Column();
  readonly next = new I32Column();
  readonly pool = new F64Column();
}

/** One entry per species and phase, in order of first appearance. */
class SpeciesRows {
  readonly name = new I32Column(); // id in the name table
  readonly formulaText = new I32Column(); // interned text, or −1 when the row wrote the name itself as the formula
  readonly formula = new I32Column(); // id among the distinct Formula objects
  readonly phase = new I32Column();
  readonly state = new I32Column(); // interned text, or −1
  readonly table = new I32Column(); // the first row's columns and units
  readonly file = new I32Column(); // the first row's location
  readonly line = new I32Column();
  readonly P_ref = new I32Column(); // interned
  readonly values = { head: new I32Column(), tail: new I32Column(), count: new I32Column() };
  readonly cp = { head: new I32Column(), tail: new I32Column(), count: new I32Column() };
  /** the next species with the same name (another phase), or −1 */
  readonly sameName = new I32Column();
}

export class SpeciesStore {
  private readonly sp = new SpeciesRows();
  private readonly vals = new ValueRows();
  private readonly cps = new CpRows();
  private readonly names = new NameTable();
  private readonly nameHead = new I32Column(); // name id -> a species of that name (others chained by sameName)
  private readonly formulas = new Interned<Formula>();
  private readonly pressures = new Interned<number>();
  private readonly files = new Interned<string>();
  private readonly texts = new Interned<string>(); // sources, state words, formula texts
  private readonly cpUnits = new Interned<string>(); // `${unit}\0${factor}` -> id
  private readonly cpUnitOf: { unit: string; factor: number }[] = []; // id -> the unit and its factor
  private lastCpUnit = -1;
  private readonly lists = new Map<string, number>(); // exponent or temperature list -> its start in the Cp pool
  private readonly tables = new Interned<Record<string, number>>(); // a table's columns object
  private readonly tableUnits: Record<string, string>[] = [];
  /** uncertainties stated on a species' first row when that row gave no values (rare: a Cp-only row) */
  private readonly firstRowU = new Map<number, RowValues>();

  get size(): number {
    return this.sp.phase.length;
  }

  /** Adds an accepted row; returns findings about how it relates to earlier rows of the same species. */
  add(row: SpeciesRow): Finding[] {
    const v = row.values;
    const s = this.find(row.species, row.phase);
    if (s < 0) {
      this.create(row);
      return [];
    }
    const ids = { species: row.species, phase: row.phase };
    const findings: Finding[] = [];
    const formula = this.formulas.get(this.sp.formula.get(s));
    if (row.formula !== formula && formatFormula(row.formula) !== formatFormula(formula)) {
      findings.push(makeFinding(conflictingValues, 'formula', { formula: row.formulaText, first: this.formulaTextOf(s, row.species), firstLine: this.sp.line.get(s) }, { ...v.location, column: row.columns.formula ?? row.columns.species, field: 'formula' }, ids));
    }
    // exact repeat of an earlier row: same values from the same source, same Cp range (or none)
    const sameSourceRows = this.rowsOfSource(s, v);
    const twin = sameSourceRows.find((e) => FIELDS.every((f) => same(e[f], v[f])));
    const cpTwin = row.cp ? this.cpOfRange(s, row.cp).find((c) => sameCp(c, row.cp!)) : undefined;
    if ((hasValues(v) ? twin : true) && (row.cp ? cpTwin : !hasValues(v) || twin) && (twin || cpTwin)) {
      const first = (cpTwin ?? twin)!.location;
      findings.push(makeFinding(duplicateRow, 'repeat', { firstLine: first.line, firstFile: first.file, species: row.species, phase: row.phase }, v.location, ids));
      return findings;
    }
    if (row.cp && !cpTwin) {
      if (this.sp.cp.count.get(s) < MAX_CP_RANGES) this.addCp(s, row.cp);
      else findings.push(makeFinding(badCpSpec, 'tooMany', { max: MAX_CP_RANGES, species: row.species }, { ...v.location, column: row.columns.cp_Tmin, field: 'cp_Tmin' }, ids));
    }
    if (!hasValues(v) || twin) return findings;
    // the same source giving another number for the same field is a conflict with its first row;
    // other sources are compared across records (rule cross-source)
    const e = sameSourceRows[0];
    if (e) {
      for (const f of FIELDS) {
        const a = e[f];
        const b = v[f];
        if (a !== undefined && b !== undefined && !same(a, b)) {
          const unit = row.units[f] ?? '';
          findings.push(makeFinding(conflictingValues, 'value', { field: f, value: toDeclared(b, f, unit), first: toDeclared(a, f, unit), unit, firstLine: e.location.line }, { ...v.location, column: row.columns[f], field: f }, ids));
        }
      }
    }
    this.addValues(s, v);
    return findings;
  }

  private find(name: string, phase: Phase): number {
    const p = PHASES.indexOf(phase);
    const id = this.names.find(name);
    let s = id < 0 ? -1 : this.nameHead.get(id);
    while (s >= 0 && this.sp.phase.get(s) !== p) s = this.sp.sameName.get(s);
    return s;
  }

  private create(row: SpeciesRow): void {
    const sp = this.sp;
    const s = sp.phase.length;
    const v = row.values;
    const name = this.names.id(row.species);
    if (name === this.nameHead.length) this.nameHead.push(-1);
    sp.name.push(name);
    sp.formulaText.push(row.formulaText === row.species ? -1 : this.texts.id(row.formulaText));
    sp.formula.push(this.formulas.id(row.formula));
    sp.phase.push(PHASES.indexOf(row.phase));
    sp.state.push(row.state ? this.texts.id(row.state) : -1);
    const t = this.tables.id(row.columns);
    if (t === this.tableUnits.length) this.tableUnits.push(row.units);
    sp.table.push(t);
    sp.file.push(this.files.id(v.location.file));
    sp.line.push(v.location.line);
    sp.P_ref.push(this.pressures.id(v.P_ref));
    for (const list of [sp.values, sp.cp]) {
      list.head.push(-1);
      list.tail.push(-1);
      list.count.push(0);
    }
    sp.sameName.push(this.nameHead.get(name));
    this.nameHead.set(name, s);
    if (hasValues(v)) this.addValues(s, v);
    else if (v.u_dHf !== undefined || v.u_dGf !== undefined || v.u_S !== undefined) this.firstRowU.set(s, v); // a Cp row that states uncertainties
    if (row.cp) this.addCp(s, row.cp);
  }

  // --- value rows and Cp ranges, chained per species in input order

  private addValues(s: number, v: RowValues): void {
    const r = this.vals;
    const i = r.P_ref.push(this.pressures.id(v.P_ref));
    for (let k = 0; k < VALUES.length; k++) r.num[k]!.push(toCell(v[VALUES[k]!]));
    if (UNCERTAINTIES.some((f) => v[f] !== undefined)) {
      r.u.push(r.uNum[0]!.length);
      for (let k = 0; k < UNCERTAINTIES.length; k++) r.uNum[k]!.push(toCell(v[UNCERTAINTIES[k]!]));
    } else r.u.push(-1);
    r.source.push(this.texts.id(v.source));
    r.file.push(this.files.id(v.location.file));
    r.line.push(v.location.line);
    r.next.push(-1);
    const count = this.link(this.sp.values, r.next, s, i);
    if (count > SpeciesStore.SCAN) this.indexEntry(this.valueIndex, s, this.sp.values.head.get(s), r.next, i, (j) => sourceKey(this.valueRow(j)));
  }

  private addCp(s: number, c: CpSpec): void {
    const r = this.cps;
    const i = r.model.push(CP_MODELS.indexOf(c.model));
    r.unit.push(this.cpUnitId(c));
    r.Tmin.push(c.Tmin);
    r.Tmax.push(c.Tmax);
    r.start.push(this.pool(c.coeffs));
    r.count.push(c.coeffs.length);
    const extra = c.exponents ?? c.temps;
    r.extra.push(extra ? this.sharedList(extra) : -1);
    r.file.push(this.files.id(c.location.file));
    r.line.push(c.location.line);
    r.next.push(-1);
    const count = this.link(this.sp.cp, r.next, s, i);
    if (count > SpeciesStore.SCAN) this.indexEntry(this.cpIndex, s, this.sp.cp.head.get(s), r.next, i, (j) => rangeKey(this.cpRow(j)));
  }

  private cpUnitId(c: CpSpec): number {
    const last = this.cpUnitOf[this.lastCpUnit];
    if (last && last.unit === c.unit && last.factor === c.unitFactor) return this.lastCpUnit;
    const id = this.cpUnits.id(`${c.unit}\u0000${c.unitFactor}`);
    if (id === this.cpUnitOf.length) this.cpUnitOf.push({ unit: c.unit, factor: c.unitFactor });
    return (this.lastCpUnit = id);
  }

  /** Exponent and temperature lists repeat across a table (`0 1 2 3 -2`, the same grid of T): each distinct list is pooled once. */
  private sharedList(xs: readonly number[]): number {
    const key = xs.join(' ');
    let start = this.lists.get(key);
    if (start !== undefined) return start;
    start = this.pool(xs);
    if (this.lists.size < 10_000) this.lists.set(key, start); // past that, lists are not repeating: keys would cost more than they save
    return start;
  }

  private pool(xs: readonly number[]): number {
    const start = this.cps.pool.length;
    for (const x of xs) this.cps.pool.push(x);
    return start;
  }

  /** Appends entry i to species s's chain; returns the chain's new length. */
  private link(list: SpeciesRows['values'], next: I32Column, s: number, i: number): number {
    const tail = list.tail.get(s);
    if (tail < 0) list.head.set(s, i);
    else next.set(tail, i);
    list.tail.set(s, i);
    const count = list.count.get(s) + 1;
    list.count.set(s, count);
    return count;
  }

  private valueRow(i: number): RowValues {
    const r = this.vals;
    const v: RowValues = { P_ref: this.pressures.get(r.P_ref.get(i)), source: this.texts.get(r.source.get(i)), location: { file: this.files.get(r.file.get(i)), line: r.line.get(i) } };
    // one property at a time, by name: a computed key in a loop makes every store a slow keyed one
    const dHf = r.num[0]!.get(i);
    const dGf = r.num[1]!.get(i);
    const S = r.num[2]!.get(i);
    if (!Number.isNaN(dHf)) v.dHf = dHf;
    if (!Number.isNaN(dGf)) v.dGf = dGf;
    if (!Number.isNaN(S)) v.S = S;
    const u = r.u.get(i);
    if (u >= 0) {
      const uH = r.uNum[0]!.get(u);
      const uG = r.uNum[1]!.get(u);
      const uS = r.uNum[2]!.get(u);
      if (!Number.isNaN(uH)) v.u_dHf = uH;
      if (!Number.isNaN(uG)) v.u_dGf = uG;
      if (!Number.isNaN(uS)) v.u_S = uS;
    }
    return v;
  }

  private cpRow(i: number): CpSpec {
    const r = this.cps;
    const n = r.count.get(i);
    const numbers = (start: number): number[] => {
      const out = new Array<number>(n);
      for (let k = 0; k < n; k++) out[k] = r.pool.get(start + k);
      return out;
    };
    const { unit, factor } = this.cpUnitOf[r.unit.get(i)]!;
    const model = CP_MODELS[r.model.get(i)] as CpModelName;
    const c: CpSpec = {
      model,
      coeffs: numbers(r.start.get(i)),
      unit,
      unitFactor: factor,
      Tmin: r.Tmin.get(i),
      Tmax: r.Tmax.get(i),
      location: { file: this.files.get(r.file.get(i)), line: r.line.get(i) },
    };
    const extra = r.extra.get(i);
    if (extra >= 0) c[model === 'poly' ? 'exponents' : 'temps'] = numbers(extra);
    return c;
  }

  // Lookups of earlier rows by source and by Cp range. Short chains are walked; a species with many rows
  // (a hostile or generated table repeating one species 10^5 times) gets an index, so folding stays linear.
  private static readonly SCAN = 16;
  private readonly valueIndex = new Map<number, Map<string, number[]>>();
  private readonly cpIndex = new Map<number, Map<string, number[]>>();

  private rowsOfSource(s: number, v: RowValues): RowValues[] {
    const r = this.vals;
    if (this.sp.values.count.get(s) > SpeciesStore.SCAN) return (this.valueIndex.get(s)!.get(sourceKey(v)) ?? []).map((i) => this.valueRow(i));
    const source = this.texts.id(v.source);
    const file = this.files.id(v.location.file);
    const out: RowValues[] = [];
    for (let i = this.sp.values.head.get(s); i >= 0; i = r.next.get(i)) {
      if (r.source.get(i) === source && (v.source !== '' || r.file.get(i) === file)) out.push(this.valueRow(i));
    }
    return out;
  }

  private cpOfRange(s: number, c: CpSpec): CpSpec[] {
    if (this.sp.cp.count.get(s) > SpeciesStore.SCAN) return (this.cpIndex.get(s)!.get(rangeKey(c)) ?? []).map((i) => this.cpRow(i));
    const out: CpSpec[] = [];
    for (let i = this.sp.cp.head.get(s); i >= 0; i = this.cps.next.get(i)) out.push(this.cpRow(i));
    return out;
  }

  /** Adds entry i of species s to its index by `keyOf`; the first time, builds the index from the whole chain (i included). */
  private indexEntry(index: Map<number, Map<string, number[]>>, s: number, head: number, next: I32Column, i: number, keyOf: (j: number) => string): void {
    const map = index.get(s);
    if (map) return push(map, keyOf(i), i);
    const built = new Map<string, number[]>();
    for (let j = head; j >= 0; j = next.get(j)) push(built, keyOf(j), j);
    index.set(s, built);
  }

  /**
   * The record's values: each field from the first row giving it (the value rows, in input order),
   * each uncertainty too, except that a first row without values (a Cp row) may already have given one.
   */
  private takeValues(s: number, out: Species): void {
    const first = this.firstRowU.get(s);
    const pick = (f: (typeof VALUE_COLUMNS)[number]): number | undefined => {
      if (first?.[f] !== undefined) return first[f];
      for (const v of out.values) if (v[f] !== undefined) return v[f];
      return undefined;
    };
    const dHf = pick('dHf');
    const dGf = pick('dGf');
    const S = pick('S');
    if (dHf !== undefined) out.dHf = dHf;
    if (dGf !== undefined) out.dGf = dGf;
    if (S !== undefined) out.S = S;
    const uH = pick('u_dHf');
    const uG = pick('u_dGf');
    const uS = pick('u_S');
    if (uH !== undefined) out.u.dHf = uH;
    if (uG !== undefined) out.u.dGf = uG;
    if (uS !== undefined) out.u.S = uS;
  }

  /** S° the record takes: the first value row giving one. */
  private entropy(s: number): number | undefined {
    const r = this.vals;
    const k = VALUES.indexOf('S');
    for (let i = this.sp.values.head.get(s); i >= 0; i = r.next.get(i)) {
      const x = r.num[k]!.get(i);
      if (!Number.isNaN(x)) return x;
    }
    return undefined;
  }

  private formulaTextOf(s: number, name: string): string {
    const t = this.sp.formulaText.get(s);
    return t < 0 ? name : this.texts.get(t);
  }

  /** Species s (in order of first appearance) as the rules read it, built afresh; Cp ranges sorted by Tmin. */
  at(s: number): Species {
    const sp = this.sp;
    const name = this.names.name(sp.name.get(s));
    const phase = PHASES[sp.phase.get(s)]!;
    const t = sp.table.get(s);
    const out: Species = {
      key: `${name}|${phase}`,
      name,
      formulaText: this.formulaTextOf(s, name),
      formula: this.formulas.get(sp.formula.get(s)),
      phase,
      u: {},
      P_ref: this.pressures.get(sp.P_ref.get(s)),
      values: [],
      cp: [],
      location: { file: this.files.get(sp.file.get(s)), line: sp.line.get(s) },
      columns: this.tables.get(t),
      units: this.tableUnits[t]!,
    };
    for (let i = sp.values.head.get(s); i >= 0; i = this.vals.next.get(i)) out.values.push(this.valueRow(i));
    for (let i = sp.cp.head.get(s); i >= 0; i = this.cps.next.get(i)) out.cp.push(this.cpRow(i));
    if (out.cp.length > 1) out.cp.sort((a, b) => a.Tmin - b.Tmin);
    const state = sp.state.get(s);
    if (state >= 0) out.state = this.texts.get(state);
    this.takeValues(s, out);
    return out;
  }

  /** The species in a stable order (name, then phase), each built when asked for. */
  view(): SpeciesList {
    const sp = this.sp;
    const n = this.size;
    const order = Array.from({ length: n }, (_, i) => i);
    const phaseOf = (i: number): string => PHASES[sp.phase.get(i)]!;
    order.sort((a, b) => {
      const byName = this.names.compare(sp.name.get(a), sp.name.get(b));
      if (byName !== 0) return byName;
      const pa = phaseOf(a);
      const pb = phaseOf(b);
      return pa < pb ? -1 : pa > pb ? 1 : 0;
    });
    const ix = Int32Array.from(order);
    return {
      length: n,
      at: (i) => this.at(ix[i]!),
      name: (i) => this.names.name(sp.name.get(ix[i]!)),
      phase: (i) => PHASES[sp.phase.get(ix[i]!)]!,
      formula: (i) => this.formulas.get(sp.formula.get(ix[i]!)),
      S: (i) => this.entropy(ix[i]!),
      cpCount: (i) => sp.cp.count.get(ix[i]!),
    };
  }

  /** Every species built, in view() order: for small tables and tests. */
  list(): Species[] {
    const v = this.view();
    return Array.from({ length: v.length }, (_, i) => v.at(i));
  }
}

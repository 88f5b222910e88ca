// TEST ORACLE: the species store as it was before the columnar store (pipeline/records.ts), one
// JavaScript object per species. Kept only so records-oracle.test.ts can check that the columnar store
// folds any sequence of rows exactly as this plain version did (same findings, same species).
import { makeFinding } from '../../pipeline/rules/finding.js';
import { rule as conflictingValues } from '../../pipeline/rules/conflicting-values.js';
import { rule as duplicateRow } from '../../pipeline/rules/duplicate-row.js';
import { rule as badCpSpec } from '../../pipeline/rules/bad-cp-spec.js';
import { formatFormula } from '../../pipeline/chemistry/formula.js';
import { toDeclared } from '../../pipeline/units/convert.js';
import type { CpSpec, Finding, RowValues, Species, SpeciesRow } from '../../pipeline/types.js';

const FIELDS = ['dHf', 'dGf', 'S'] as const;
/** Published correlations use 1–10 ranges per species; past this many, further ranges are refused (each
 *  with a finding), which keeps joining them cheap whatever a hostile or generated table holds. */
const MAX_CP_RANGES = 200;
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
function sameSource(a: RowValues, b: RowValues): boolean {
  return a.source === b.source && (a.source !== '' || a.location.file === b.location.file);
}

function sourceKey(v: RowValues): string {
  return v.source !== '' ? `s:${v.source}` : `f:${v.location.file}`;
}

function rangeKey(c: CpSpec): string {
  return `${c.model}|${c.Tmin}|${c.Tmax}`;
}

function push<T>(map: Map<string, T[]>, key: string, item: T): void {
  const list = map.get(key);
  if (list) list.push(item);
  else map.set(key, [item]);
}

function hasValues(v: RowValues): boolean {
  return v.dHf !== undefined || v.dGf !== undefined || v.S !== undefined;
}

function formulaKey(s: { formula: { elements: Record<string, number>; charge: number } }): string {
  return formatFormula(s.formula);
}

export class ObjectStore {
  readonly byKey = new Map<string, Species>();

  /** Adds an accepted row; returns findings about how it relates to earlier rows of the same species. */
  add(row: SpeciesRow): Finding[] {
    const key = `${row.species}|${row.phase}`;
    const v = row.values;
    const sp = this.byKey.get(key);
    if (!sp) {
      const created: Species = {
        key,
        name: row.species,
        formulaText: row.formulaText,
        formula: row.formula,
        phase: row.phase,
        u: {},
        P_ref: v.P_ref,
        values: hasValues(v) ? [v] : [],
        cp: row.cp ? [row.cp] : [],
        location: v.location,
        columns: row.columns,
        units: row.units,
      };
      if (row.state) created.state = row.state;
      this.takeValues(created, v);
      this.byKey.set(key, created);
      return [];
    }
    const ids = { species: sp.name, phase: sp.phase };
    const findings: Finding[] = [];
    if (formulaKey(row) !== formulaKey(sp)) {
      findings.push(makeFinding(conflictingValues, 'formula', { formula: row.formulaText, first: sp.formulaText, firstLine: sp.location.line }, { ...v.location, column: row.columns.formula ?? row.columns.species, field: 'formula' }, ids));
    }
    // exact repeat of an earlier row: same values from the same source, same Cp range (or none)
    const sameSourceRows = this.rowsOfSource(sp, v);
    const twin = sameSourceRows.find((e) => FIELDS.every((f) => same(e[f], v[f])));
    const cpTwin = row.cp ? this.cpOfRange(sp, row.cp).find((c) => sameCp(c, row.cp!)) : undefined;
    if ((hasValues(v) ? twin : true) && (row.cp ? cpTwin : !hasValues(v) || twin) && (twin || cpTwin)) {
      const first = (cpTwin ?? twin)!.location;
      findings.push(makeFinding(duplicateRow, 'repeat', { firstLine: first.line, firstFile: first.file, species: sp.name, phase: sp.phase }, v.location, ids));
      return findings;
    }
    if (row.cp && !cpTwin) {
      if (sp.cp.length < MAX_CP_RANGES) this.addCp(sp, row.cp);
      else findings.push(makeFinding(badCpSpec, 'tooMany', { max: MAX_CP_RANGES, species: sp.name }, { ...v.location, column: row.columns.cp_Tmin, field: 'cp_Tmin' }, ids));
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
    this.addValues(sp, v);
    this.takeValues(sp, v);
    return findings;
  }

  // Lookups of earlier rows by source and by Cp range. Small lists are scanned; a species with many rows
  // (a hostile or generated table repeating one species 10^5 times) gets an index, so folding stays linear.
  private static readonly SCAN = 16;
  private readonly valueIndex = new WeakMap<Species, Map<string, RowValues[]>>();
  private readonly cpIndex = new WeakMap<Species, Map<string, CpSpec[]>>();

  private rowsOfSource(sp: Species, v: RowValues): RowValues[] {
    if (sp.values.length <= ObjectStore.SCAN) return sp.values.filter((e) => sameSource(e, v));
    return this.valueMap(sp).get(sourceKey(v)) ?? [];
  }

  private addValues(sp: Species, v: RowValues): void {
    sp.values.push(v);
    if (sp.values.length <= ObjectStore.SCAN) return;
    const map = this.valueMap(sp);
    if (sp.values.length === ObjectStore.SCAN + 1) return; // just built, v included
    push(map, sourceKey(v), v);
  }

  private valueMap(sp: Species): Map<string, RowValues[]> {
    let map = this.valueIndex.get(sp);
    if (!map) {
      map = new Map();
      for (const e of sp.values) push(map, sourceKey(e), e);
      this.valueIndex.set(sp, map);
    }
    return map;
  }

  private cpOfRange(sp: Species, c: CpSpec): CpSpec[] {
    if (sp.cp.length <= ObjectStore.SCAN) return sp.cp;
    return this.cpMap(sp).get(rangeKey(c)) ?? [];
  }

  private addCp(sp: Species, c: CpSpec): void {
    sp.cp.push(c);
    if (sp.cp.length <= ObjectStore.SCAN) return;
    const map = this.cpMap(sp);
    if (sp.cp.length === ObjectStore.SCAN + 1) return;
    push(map, rangeKey(c), c);
  }

  private cpMap(sp: Species): Map<string, CpSpec[]> {
    let map = this.cpIndex.get(sp);
    if (!map) {
      map = new Map();
      for (const c of sp.cp) push(map, rangeKey(c), c);
      this.cpIndex.set(sp, map);
    }
    return map;
  }

  private takeValues(sp: Species, v: RowValues): void {
    if (sp.dHf === undefined && v.dHf !== undefined) sp.dHf = v.dHf;
    if (sp.dGf === undefined && v.dGf !== undefined) sp.dGf = v.dGf;
    if (sp.S === undefined && v.S !== undefined) sp.S = v.S;
    if (sp.u.dHf === undefined && v.u_dHf !== undefined) sp.u.dHf = v.u_dHf;
    if (sp.u.dGf === undefined && v.u_dGf !== undefined) sp.u.dGf = v.u_dGf;
    if (sp.u.S === undefined && v.u_S !== undefined) sp.u.S = v.u_S;
  }

  /** Species in a stable order (name, then phase), each with its Cp ranges sorted. */
  list(): Species[] {
    const all = [...this.byKey.values()];
    for (const s of all) s.cp.sort((a, b) => a.Tmin - b.Tmin);
    return all.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : a.phase < b.phase ? -1 : a.phase > b.phase ? 1 : 0));
  }
}

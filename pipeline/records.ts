// Fold accepted rows into one compact record per species and phase; rows are not kept.
import { makeFinding } from './rules/finding.js';
import { rule as conflictingValues } from './rules/conflicting-values.js';
import { rule as duplicateRow } from './rules/duplicate-row.js';
import { formatFormula } from './chemistry/formula.js';
import { toDeclared } from './units/convert.js';
import type { CpSpec, Finding, RowValues, Species, SpeciesRow } from './types.js';

const FIELDS = ['dHf', 'dGf', 'S'] as const;
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

function hasValues(v: RowValues): boolean {
  return v.dHf !== undefined || v.dGf !== undefined || v.S !== undefined;
}

function formulaKey(s: { formula: { elements: Record<string, number>; charge: number } }): string {
  return formatFormula(s.formula);
}

export class SpeciesStore {
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
    const twin = sp.values.find((e) => sameSource(e, v) && FIELDS.every((f) => same(e[f], v[f])));
    const cpTwin = row.cp ? sp.cp.find((c) => sameCp(c, row.cp!)) : undefined;
    if ((hasValues(v) ? twin : true) && (row.cp ? cpTwin : !hasValues(v) || twin) && (twin || cpTwin)) {
      const first = (cpTwin ?? twin)!.location;
      findings.push(makeFinding(duplicateRow, 'repeat', { firstLine: first.line, firstFile: first.file, species: sp.name, phase: sp.phase }, v.location, ids));
      return findings;
    }
    if (row.cp && !cpTwin) sp.cp.push(row.cp);
    if (!hasValues(v) || twin) return findings;
    // the same source giving another number for the same field is a conflict; other sources are compared across records
    for (const e of sp.values) {
      if (!sameSource(e, v)) continue;
      for (const f of FIELDS) {
        const a = e[f];
        const b = v[f];
        if (a !== undefined && b !== undefined && !same(a, b)) {
          const unit = row.units[f] ?? '';
          findings.push(makeFinding(conflictingValues, 'value', { field: f, value: toDeclared(b, f, unit), first: toDeclared(a, f, unit), unit, firstLine: e.location.line }, { ...v.location, column: row.columns[f], field: f }, ids));
        }
      }
    }
    sp.values.push(v);
    this.takeValues(sp, v);
    return findings;
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

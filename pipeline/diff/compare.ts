// What changed between two versions of a dataset: species added and removed, fields changed (each in
// its declared unit), findings that appeared or went away. Pure: species and findings in, data out.
import { formatFormula } from '../chemistry/formula.js';
import { toDeclared } from '../units/convert.js';
import type { CpSpec, Finding, Location, Species } from '../types.js';
import type { SpeciesList } from '../species-list.js';

/** Fields compared, in report order. `cp` is the whole Cp description; `sources` the set of source texts. */
export const DIFF_FIELDS = ['formula', 'dHf', 'dGf', 'S', 'u_dHf', 'u_dGf', 'u_S', 'P_ref', 'cp', 'sources'] as const;
export type DiffField = (typeof DIFF_FIELDS)[number];
export type NumericField = 'dHf' | 'dGf' | 'S' | 'u_dHf' | 'u_dGf' | 'u_S' | 'P_ref';

/** Two numbers in SI are the same value when within this relative difference (round-off of unit conversion). */
const SAME_REL = 1e-9;
const same = (a: number, b: number): boolean => Math.abs(a - b) <= SAME_REL * Math.max(1, Math.abs(a), Math.abs(b));

export interface SpeciesRef {
  key: string;
  name: string;
  phase: string;
  formula: string;
  location: Location;
}

export interface FieldChange {
  field: DiffField;
  /** the old and new value, each in its own version's declared unit (text for formula, cp and sources; null when absent) */
  old: number | string | null;
  new: number | string | null;
  oldUnit?: string;
  newUnit?: string;
  /** new − old in the new version's declared unit, when both are numbers */
  delta?: number;
  /** the rows that give the new (else old) value */
  location: Location;
  /** filled by the ln K stage: per reaction of interest, the largest |Δln K| this change alone causes over its temperatures */
  lnK?: { reaction: string; maxAbsDeltaLnK: number; T_K: number; deltaLnK: { T: number; delta: number }[] }[];
  /** why no Δln K is given when a reaction uses the species (e.g. the route does not read this field) */
  lnKNote?: string;
}

export interface SpeciesChange extends SpeciesRef {
  changes: FieldChange[];
}

export interface SpeciesDiff {
  added: SpeciesRef[];
  removed: SpeciesRef[];
  changed: SpeciesChange[];
}

export function refOf(sp: Species): SpeciesRef {
  return { key: sp.key, name: sp.name, phase: sp.phase, formula: formatFormula(sp.formula), location: sp.location };
}

const ROUND = (x: number): number => Number(x.toPrecision(10));

function declaredUnit(sp: Species, field: NumericField): string | undefined {
  if (field === 'P_ref') return 'bar';
  const base = field.startsWith('u_') ? field.slice(2) : field;
  return sp.units[field] ?? sp.units[base] ?? (base === 'S' ? 'J/(mol K)' : 'kJ/mol');
}

function numeric(sp: Species, field: NumericField): number | undefined {
  switch (field) {
    case 'dHf':
    case 'dGf':
    case 'S':
      return sp[field];
    case 'u_dHf':
      return sp.u.dHf;
    case 'u_dGf':
      return sp.u.dGf;
    case 'u_S':
      return sp.u.S;
    case 'P_ref':
      return sp.P_ref;
  }
}

function declared(sp: Species, field: NumericField, si: number): number {
  if (field === 'P_ref') return ROUND(si);
  const base = field.startsWith('u_') ? field.slice(2) : field; // an uncertainty converts like its value (no offset)
  return ROUND(toDeclared(si, base, declaredUnit(sp, field)));
}

/** The Cp description as one line: model, range and coefficients of each range, in range order. */
export function cpText(cp: readonly CpSpec[]): string {
  return cp
    .map((c) => `${c.model} ${ROUND(c.Tmin)}–${ROUND(c.Tmax)} K [${c.coeffs.map((x) => ROUND(x)).join(' ')}]${c.exponents ? ` ^[${c.exponents.join(' ')}]` : ''}${c.unit && c.model !== 'shomate' && c.model !== 'nasa7' && c.model !== 'nasa9' ? ` ${c.unit}` : ''}`)
    .join('; ');
}

function sameCp(a: readonly CpSpec[], b: readonly CpSpec[]): boolean {
  if (a.length !== b.length) return false;
  return a.every((x, i) => {
    const y = b[i]!;
    return (
      x.model === y.model &&
      same(x.Tmin, y.Tmin) &&
      same(x.Tmax, y.Tmax) &&
      x.coeffs.length === y.coeffs.length &&
      // compare in J/(mol K) so a change of cp_unit alone is not a change
      x.coeffs.every((c, k) => same(c * x.unitFactor, y.coeffs[k]! * y.unitFactor)) &&
      (x.exponents ?? []).join(' ') === (y.exponents ?? []).join(' ') &&
      (x.temps ?? []).length === (y.temps ?? []).length &&
      (x.temps ?? []).every((t, k) => same(t, y.temps![k]!))
    );
  });
}

const sourcesOf = (sp: Species): string => [...new Set(sp.values.map((v) => v.source))].sort().join(' | ');

function fieldLocation(sp: Species, field: DiffField): Location {
  const base = field.startsWith('u_') ? field.slice(2) : field;
  if (base === 'dHf' || base === 'dGf' || base === 'S') {
    const row = sp.values.find((v) => v[base] !== undefined);
    if (row) return { ...row.location, field };
  }
  if (field === 'cp' && sp.cp[0]) return { ...sp.cp[0].location, field };
  return { ...sp.location, field };
}

/** The field changes of one species present in both versions (empty when nothing changed). */
export function compareSpecies(a: Species, b: Species): FieldChange[] {
  const out: FieldChange[] = [];
  for (const field of DIFF_FIELDS) {
    if (field === 'formula') {
      const fa = formatFormula(a.formula);
      const fb = formatFormula(b.formula);
      if (fa !== fb) out.push({ field, old: fa, new: fb, location: fieldLocation(b, field) });
    } else if (field === 'cp') {
      if (!sameCp(a.cp, b.cp)) out.push({ field, old: a.cp.length ? cpText(a.cp) : null, new: b.cp.length ? cpText(b.cp) : null, location: fieldLocation(b.cp.length ? b : a, field) });
    } else if (field === 'sources') {
      const sa = sourcesOf(a);
      const sb = sourcesOf(b);
      if (sa !== sb) out.push({ field, old: sa, new: sb, location: fieldLocation(b, field) });
    } else {
      const va = numeric(a, field);
      const vb = numeric(b, field);
      if (va === undefined && vb === undefined) continue;
      if (va !== undefined && vb !== undefined && same(va, vb)) continue;
      const ch: FieldChange = {
        field,
        old: va === undefined ? null : declared(a, field, va),
        new: vb === undefined ? null : declared(b, field, vb),
        location: fieldLocation(vb === undefined ? a : b, field),
      };
      if (va !== undefined) ch.oldUnit = declaredUnit(a, field)!;
      if (vb !== undefined) ch.newUnit = declaredUnit(b, field)!;
      if (va !== undefined && vb !== undefined) ch.delta = ROUND(declared(b, field, vb) - declared(b, field, va));
      out.push(ch);
    }
  }
  return out;
}

export function compareSpeciesLists(oldList: SpeciesList, newList: SpeciesList): SpeciesDiff {
  // both lists are in the store's order (name, then phase, as `<` orders them): one walk, one species
  // of each version built at a time, so two 10^6-row versions are never held as objects
  const order = (i: number, j: number): number => {
    const na = oldList.name(i);
    const nb = newList.name(j);
    if (na !== nb) return na < nb ? -1 : 1;
    const pa = oldList.phase(i);
    const pb = newList.phase(j);
    return pa < pb ? -1 : pa > pb ? 1 : 0;
  };
  const added: SpeciesRef[] = [];
  const removed: SpeciesRef[] = [];
  const changed: SpeciesChange[] = [];
  let i = 0;
  let j = 0;
  while (i < oldList.length || j < newList.length) {
    const c = i >= oldList.length ? 1 : j >= newList.length ? -1 : order(i, j);
    if (c < 0) removed.push(refOf(oldList.at(i++)));
    else if (c > 0) added.push(refOf(newList.at(j++)));
    else {
      const b = newList.at(j++);
      const changes = compareSpecies(oldList.at(i++), b);
      if (changes.length) changed.push({ ...refOf(b), changes });
    }
  }
  return { added, removed, changed };
}

// ---------------------------------------------------------------------------------------------
// Findings

/**
 * A finding's identity across versions: lines move and files are renamed between versions, so the key
 * is the rule, message, species, phase and field; findings on no species (rejected rows) also keep
 * the index of their table in the version's list and their line.
 */
export function findingKey(f: Finding, tableIndex: number): string {
  const base = `${f.rule}|${f.messageId}|${f.species ?? ''}|${f.phase ?? ''}|${f.location.field ?? ''}`;
  return f.species === undefined ? `${base}|${tableIndex}|${f.location.line}` : base;
}

export interface FindingsDiff {
  appeared: Finding[];
  gone: Finding[];
}

/** Findings of `next` not matched by one of `prev` (appeared) and the reverse (gone), as multisets by key. */
export function compareFindings(prev: readonly Finding[], next: readonly Finding[], tableIndexOld: (f: Finding) => number, tableIndexNew: (f: Finding) => number): FindingsDiff {
  const bucket = (fs: readonly Finding[], idx: (f: Finding) => number): Map<string, Finding[]> => {
    const m = new Map<string, Finding[]>();
    for (const f of fs) {
      const k = findingKey(f, idx(f));
      const l = m.get(k);
      if (l) l.push(f);
      else m.set(k, [f]);
    }
    return m;
  };
  const a = bucket(prev, tableIndexOld);
  const b = bucket(next, tableIndexNew);
  const appeared: Finding[] = [];
  const gone: Finding[] = [];
  for (const [k, list] of b) appeared.push(...list.slice(a.get(k)?.length ?? 0));
  for (const [k, list] of a) gone.push(...list.slice(b.get(k)?.length ?? 0));
  return { appeared, gone };
}

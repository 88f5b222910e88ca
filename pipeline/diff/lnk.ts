// What each change costs in ln K for the reactions of interest: the old dataset with that one change
// applied, against the old dataset, computed by the equilibrium stage (pipeline/equilibrium) at each
// reaction's temperatures (its own, else the use window's). Changes are taken one at a time, so each
// Δln K belongs to one change; the reactions table also gives old and new ln K with every change applied.
import { formatFormula } from '../chemistry/formula.js';
import { computeReaction } from '../equilibrium/lnk.js';
import { resolveReactions, type ReactionSpec, type ResolvedReaction } from '../equilibrium/reactions.js';
import type { ReferenceData, Species, UseWindow } from '../types.js';
import type { FieldChange, SpeciesDiff } from './compare.js';
import type { SpeciesList } from '../species-list.js';

export interface ReactionDiffPoint {
  T: number;
  lnKOld?: number;
  lnKNew?: number;
  deltaLnK?: number;
}

export interface ReactionDiff {
  id: string;
  equation: string;
  file: string;
  line: number;
  /** whether ln K could be computed with the old data, the new data, both or neither */
  computed: 'both' | 'old-only' | 'new-only' | 'neither';
  points: ReactionDiffPoint[];
  maxAbsDeltaLnK?: number;
}

/** Species that a reaction term could name (by name or formula): the only ones resolution looks at. */
function relevant(specs: readonly ReactionSpec[], species: SpeciesList): Species[] {
  const names = new Set<string>();
  const formulas = new Set<string>();
  for (const s of specs) {
    for (const t of s.terms) {
      names.add(t.text);
      names.add(t.bare);
      if (t.formula) formulas.add(formatFormula(t.formula));
    }
  }
  const out: Species[] = [];
  for (let i = 0; i < species.length; i++) if (names.has(species.name(i)) || formulas.has(formatFormula(species.formula(i)))) out.push(species.at(i));
  return out;
}

const specKey = (x: { id: string; file: string; line: number }): string => `${x.file}:${x.line}:${x.id}`;

function resolveAll(specs: readonly ReactionSpec[], species: readonly Species[], reference: ReferenceData, window: UseWindow): Map<string, ResolvedReaction> {
  const { resolved } = resolveReactions(specs, species, reference, window);
  return new Map(resolved.map((r) => [specKey(r), r]));
}

const lnKs = (r: ResolvedReaction): Map<number, number> => new Map(computeReaction(r).map((p) => [p.T, p.lnK]));

/** The old species with one field (or the Cp, or the formula) taken from the new version. */
function withChange(a: Species, b: Species, ch: FieldChange): Species | undefined {
  switch (ch.field) {
    case 'dHf':
    case 'dGf':
    case 'S': {
      const c: Species = { ...a };
      if (b[ch.field] === undefined) delete c[ch.field];
      else c[ch.field] = b[ch.field]!;
      return c;
    }
    case 'cp':
      return { ...a, cp: b.cp };
    case 'formula':
      return { ...a, formula: b.formula, formulaText: b.formulaText };
    default:
      return undefined; // uncertainties, P_ref and sources do not enter ln K
  }
}

const NOT_IN_LNK: Record<string, string> = {
  u_dHf: 'an uncertainty moves u(ln K), not ln K',
  u_dGf: 'an uncertainty moves u(ln K), not ln K',
  u_S: 'an uncertainty moves u(ln K), not ln K',
  P_ref: 'the ln K computation does not read P_ref (see the standard-pressure rule)',
  sources: 'a citation does not enter ln K',
};

/**
 * Fills `lnK` (or `lnKNote`) on every field change of a species that a reaction of interest uses, and
 * returns the reactions table (old and new ln K at each temperature).
 */
export function lnKImpact(
  specs: readonly ReactionSpec[],
  oldSpecies: SpeciesList,
  newSpecies: SpeciesList,
  diff: SpeciesDiff,
  reference: ReferenceData,
  window: UseWindow,
): ReactionDiff[] {
  const oldRel = relevant(specs, oldSpecies);
  const newRel = relevant(specs, newSpecies);
  const oldR = resolveAll(specs, oldRel, reference, window);
  const newR = resolveAll(specs, newRel, reference, window);

  const reactions: ReactionDiff[] = specs.map((s) => {
    const a = oldR.get(specKey(s));
    const b = newR.get(specKey(s));
    const computed = a && b ? 'both' : a ? 'old-only' : b ? 'new-only' : 'neither';
    const la = a ? lnKs(a) : new Map<number, number>();
    const lb = b ? lnKs(b) : new Map<number, number>();
    const temps = [...new Set([...la.keys(), ...lb.keys()])].sort((x, y) => x - y);
    const points = temps.map((T) => {
      const p: ReactionDiffPoint = { T };
      const o = la.get(T);
      const n = lb.get(T);
      if (o !== undefined) p.lnKOld = o;
      if (n !== undefined) p.lnKNew = n;
      if (o !== undefined && n !== undefined) p.deltaLnK = n - o;
      return p;
    });
    const r: ReactionDiff = { id: s.id, equation: s.equation, file: s.file, line: s.line, computed, points };
    if (computed === 'both') r.maxAbsDeltaLnK = Math.max(0, ...points.map((p) => Math.abs(p.deltaLnK ?? 0)));
    return r;
  });

  const oldByKey = new Map(oldRel.map((s) => [s.key, s]));
  const newByKey = new Map(newRel.map((s) => [s.key, s]));
  for (const sc of diff.changed) {
    const a = oldByKey.get(sc.key);
    const b = newByKey.get(sc.key);
    if (!a || !b) continue;
    const using = [...oldR.values()].filter((r) => r.terms.some((t) => t.thermo.species.key === sc.key));
    if (using.length === 0) continue;
    const usingSpecs = specs.filter((s) => using.some((r) => specKey(r) === specKey(s)));
    for (const ch of sc.changes) {
      const modified = withChange(a, b, ch);
      if (!modified) {
        ch.lnKNote = NOT_IN_LNK[ch.field] ?? 'does not enter ln K';
        continue;
      }
      const list = oldRel.map((s) => (s.key === sc.key ? modified : s));
      const modR = resolveAll(usingSpecs, list, reference, window);
      ch.lnK = [];
      const failed: string[] = [];
      for (const r of using) {
        const m = modR.get(specKey(r));
        if (!m) {
          failed.push(r.id);
          continue;
        }
        const before = lnKs(r);
        const after = lnKs(m);
        const deltaLnK = [...before].filter(([T]) => after.has(T)).map(([T, v]) => ({ T, delta: after.get(T)! - v }));
        let worst = deltaLnK[0] ?? { T: r.temps[0]!, delta: 0 };
        for (const d of deltaLnK) if (Math.abs(d.delta) > Math.abs(worst.delta)) worst = d;
        ch.lnK.push({ reaction: r.id, maxAbsDeltaLnK: Math.abs(worst.delta), T_K: worst.T, deltaLnK });
      }
      ch.lnK.sort((x, y) => y.maxAbsDeltaLnK - x.maxAbsDeltaLnK || (x.reaction < y.reaction ? -1 : 1));
      if (failed.length) ch.lnKNote = `with this change ${failed.join(', ')} can no longer be computed`;
      else if ((ch.field === 'dGf' || ch.field === 'dHf' || ch.field === 'S') && ch.lnK.every((x) => x.maxAbsDeltaLnK === 0)) {
        ch.lnKNote = 'the ln K route of this species does not read this field (two of ΔfH°, ΔfG°, S° are used; see pipeline/equilibrium/thermo.ts)';
      }
    }
  }
  return reactions;
}

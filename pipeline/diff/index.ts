// `thermovet diff`: two versions of a dataset, each checked as `check` would, then compared.
//
//   const d = await diffDatasets({ path: 'v1.csv' }, { path: 'v2/manifest.yaml' }, { reactionsFile, failOn }, run);
//
// Each version is a table (CSV, TSV, JSON array, NDJSON) or a manifest (YAML, or a JSON object with
// `tables`). Findings come from check() on each version; the species (for fields and ln K) are read
// again through the same ingest path (check() keeps no species).
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { check, compareFindings as byLocation } from '../check.js';
import { loadReference } from '../chemistry/reference.js';
import { loadReactions, type ReactionSpec } from '../equilibrium/reactions.js';
import { loadStore } from '../equilibrium/species.js';
import type { SpeciesList } from '../species-list.js';
import { normalizeOptions, type Options } from '../options.js';
import type { FailOn, Finding, OptionsNormalized, Report, Severity, UseWindow } from '../types.js';
import { loadWaivers, waiveReport } from '../waivers.js';
import { compareFindings, compareSpeciesLists, type SpeciesDiff } from './compare.js';
import { lnKImpact, type ReactionDiff } from './lnk.js';

export interface DiffVersionInput {
  path: string;
  format?: string;
}

export interface DiffOptions {
  reactionsFile?: string;
  failOn: FailOn;
}

export interface DiffVersion {
  name: string;
  inputs: Report['provenance']['inputs'];
  summary: Report['summary'];
}

export interface DiffReport {
  tool: { name: string; version: string };
  generatedAt: string;
  old: DiffVersion;
  new: DiffVersion;
  useWindow: UseWindow;
  reactionsFile: string | null;
  summary: {
    speciesAdded: number;
    speciesRemoved: number;
    speciesChanged: number;
    fieldChanges: number;
    findingsAppeared: number;
    findingsGone: number;
    /** appeared, unwaived findings at or above failOn */
    failing: number;
    failOn: FailOn;
  };
  species: SpeciesDiff;
  findings: { appeared: Finding[]; gone: Finding[] };
  reactions: ReactionDiff[];
  /** findings about the reactions file itself (rows that could not be read), from loadReactions */
  reactionFindings: Finding[];
  caution: string;
}

export const DIFF_CAUTION =
  'thermovet screens property data and does not certify it: a qualified engineer reviews these changes before design use; local codes and licensed practice govern design.';

/** A manifest is YAML, or a JSON object (a JSON table is an array). */
export function isManifest(path: string): boolean {
  if (/\.ya?ml$/i.test(path)) return true;
  if (!/\.json$/i.test(path)) return false;
  try {
    return readFileSync(path, 'utf8').replace(/^\uFEFF/, '').trimStart().startsWith('{');
  } catch {
    return false; // missing or unreadable: reported when it is read as a table
  }
}

export function optionsFor(v: DiffVersionInput, failOn: FailOn, reactions?: string): OptionsNormalized {
  const o: Options = isManifest(v.path) ? { tables: [], manifest: v.path, failOn } : { tables: [v.path], failOn };
  if (v.format) o.format = v.format;
  if (reactions) o.reactions = reactions;
  return normalizeOptions(o);
}

interface Loaded {
  options: OptionsNormalized;
  report: Report;
  /** the version's species in the store's order, each built when asked for */
  species: SpeciesList;
}

async function loadVersion(v: DiffVersionInput, opts: DiffOptions, run: { version: string; generatedAt: string; waiverDay: string }): Promise<Loaded> {
  const options = optionsFor(v, opts.failOn, opts.reactionsFile);
  // a diff shows no species summaries: without them the checked store can go before the species are read again
  const { species: _summaries, ...checked } = await check(options, run);
  let report: Report = checked;
  const species = (await loadStore(options)).store.view(); // check() keeps no rows: the species are read again
  if (options.waiversFile) report = waiveReport(report, loadWaivers(options.waiversFile), run.waiverDay);
  return { options, report, species };
}

function tableIndex(options: OptionsNormalized): (f: Finding) => number {
  const paths = options.tables.map((t) => resolve(t.path));
  return (f) => paths.indexOf(resolve(f.location.file));
}

const atOrAbove = (s: Severity, failOn: FailOn): boolean => (failOn === 'never' ? false : failOn === 'warning' ? s !== 'info' : s === 'error');

export async function diffDatasets(oldV: DiffVersionInput, newV: DiffVersionInput, opts: DiffOptions, run: { version: string; generatedAt: string; waiverDay: string }): Promise<DiffReport> {
  const a = await loadVersion(oldV, opts, run);
  const b = await loadVersion(newV, opts, run);
  const species = compareSpeciesLists(a.species, b.species);
  const findings = compareFindings([...a.report.findings], [...b.report.findings], tableIndex(a.options), tableIndex(b.options));

  // reactions: --reactions, else the new manifest's, else the old one's; the use window likewise
  const reactionsFile = b.options.reactionsFile ?? a.options.reactionsFile;
  const useWindow = Object.keys(b.options.useWindow).length ? b.options.useWindow : a.options.useWindow;
  let specs: ReactionSpec[] = [];
  let reactionFindings: Finding[] = [];
  if (reactionsFile) {
    const loaded = loadReactions(reactionsFile);
    specs = loaded.reactions.filter((s) => s.balancedAsWritten !== false);
    reactionFindings = loaded.findings;
  }
  const reactions = specs.length ? lnKImpact(specs, a.species, b.species, species, loadReference(), useWindow) : [];

  const failing = findings.appeared.filter((f) => !f.waived && atOrAbove(f.severity, opts.failOn)).length;
  const version = (l: Loaded): DiffVersion => ({ name: l.options.name, inputs: l.report.provenance.inputs, summary: l.report.summary });
  return {
    tool: { name: 'thermovet', version: run.version },
    generatedAt: run.generatedAt,
    old: version(a),
    new: version(b),
    useWindow,
    reactionsFile: reactionsFile ?? null,
    summary: {
      speciesAdded: species.added.length,
      speciesRemoved: species.removed.length,
      speciesChanged: species.changed.length,
      fieldChanges: species.changed.reduce((n, c) => n + c.changes.length, 0),
      findingsAppeared: findings.appeared.length,
      findingsGone: findings.gone.length,
      failing,
      failOn: opts.failOn,
    },
    species,
    findings: { appeared: findings.appeared.sort(byLocation), gone: findings.gone.sort(byLocation) },
    reactions,
    reactionFindings,
    caution: DIFF_CAUTION,
  };
}

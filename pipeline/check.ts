// The whole run as one function: options in, a finished Report out. No argv, no clock, no terminal here.
import { relative } from 'node:path';
import { loadReference } from './chemistry/reference.js';
import { packageRoot } from './paths.js';
import { ingestTable } from './ingest/table.js';
import { fileDigest } from './provenance.js';
import { SpeciesStore } from './records.js';
import { speciesSummary } from './summary.js';
import { DATASET_RULES, RULES, SPECIES_RULES } from './rules/index.js';
import { impactOfFindings, loadReactions, runEquilibrium } from './equilibrium/index.js';
import { speciesKey } from './species-list.js';
import { FindingStore } from './finding-store.js';
import { CHART_SPECIES_LIMIT, type CheckContext, type Finding, type OptionsNormalized, type ReactionResult, type Report, type Summary, type SummaryList } from './types.js';
import type { ResolvedReaction } from './equilibrium/reactions.js';

export interface RunInfo {
  version: string;
  generatedAt: string;
  /** called as rows are read, for a progress display */
  onProgress?: (rowsRead: number) => void;
}

export function compareFindings(a: Finding, b: Finding): number {
  const fa = a.location.file;
  const fb = b.location.file;
  if (fa !== fb) return fa < fb ? -1 : 1;
  if (a.location.line !== b.location.line) return a.location.line - b.location.line;
  const ca = a.location.column ?? 0;
  const cb = b.location.column ?? 0;
  if (ca !== cb) return ca - cb;
  if (a.rule !== b.rule) return a.rule < b.rule ? -1 : 1;
  return a.message < b.message ? -1 : a.message > b.message ? 1 : 0;
}

export function summarize(rows: number, accepted: number, rejected: number, species: number, findings: Iterable<Pick<Finding, 'severity' | 'waived'>>): Summary {
  let errors = 0;
  let warnings = 0;
  let infos = 0;
  for (const f of findings) {
    if (f.waived) continue;
    if (f.severity === 'error') errors++;
    else if (f.severity === 'warning') warnings++;
    else infos++;
  }
  return { rows, accepted, rejected, species, errors, warnings, infos };
}

/** What each finding on a reaction's species costs in ln K: only those findings are made into objects. */
function attachImpact(findings: FindingStore, resolved: readonly ResolvedReaction[]): void {
  const used = new Set<string>();
  for (const r of resolved) for (const t of r.terms) used.add(t.thermo.species.key);
  const positions: number[] = [];
  for (let i = 0; i < findings.length; i++) {
    const key = findings.speciesKey(i);
    if (key !== undefined && used.has(key)) positions.push(i);
  }
  const picked = positions.map((i) => findings.at(i));
  impactOfFindings(picked, resolved);
  picked.forEach((f, k) => {
    if (f.impact) findings.setImpact(positions[k]!, f.impact);
  });
}

export async function check(options: OptionsNormalized, run: RunInfo): Promise<Report> {
  const reference = loadReference();
  const ctx: CheckContext = { options, reference };
  const store = new SpeciesStore();
  const findings = new FindingStore(); // compact: a table can have a finding on every row
  const onFinding = (f: Finding): void => {
    findings.add(f);
  };
  let rows = 0;
  let read = 0; // accepted rows seen so far, for progress only
  let accepted = 0;
  let rejected = 0;
  for (const table of options.tables) {
    const counts = await ingestTable(
      { path: table.path, format: table.format, headerMap: options.headerMap, units: options.units },
      (row) => {
        for (const f of store.add(row)) findings.add(f);
        if (run.onProgress && ++read % 65536 === 0) run.onProgress(read);
      },
      onFinding,
    );
    rows += counts.rows;
    accepted += counts.accepted;
    rejected += counts.rejected;
  }
  const species = store.view(); // species order (name, then phase); each Species is built when asked for
  for (let i = 0; i < species.length; i++) {
    const sp = species.at(i);
    for (const rule of SPECIES_RULES) for (const f of rule.check!(sp, ctx)) findings.add(f);
  }
  for (const rule of DATASET_RULES) for (const f of rule.checkAll(species, ctx)) findings.add(f);
  // the equilibrium stage: ln K for the reactions of interest, then what each finding costs in ln K
  let reactions: ReactionResult[] | undefined;
  const charted = new Set<string>(); // species whose Cp curve the report samples for charts
  if (options.reactionsFile) {
    const loaded = loadReactions(options.reactionsFile);
    const eq = runEquilibrium(loaded.reactions, species, reference, options.useWindow, { cpMissingOnPoints: true });
    for (const f of loaded.findings) findings.add(f);
    for (const f of eq.findings) findings.add(f);
    attachImpact(findings, eq.resolved);
    reactions = eq.results;
    for (const r of eq.resolved) for (const t of r.terms) charted.add(t.thermo.species.key);
  }
  for (let i = 0; i < findings.length; i++) {
    if (!findings.rule(i).startsWith('cp-')) continue;
    const key = findings.speciesKey(i);
    if (key !== undefined) charted.add(key);
  }
  for (let i = 0; i < species.length && charted.size < CHART_SPECIES_LIMIT; i++) {
    if (species.cpCount(i) > 0) charted.add(speciesKey(species, i));
  }
  findings.sort();
  // reaction species first, then those with Cp findings, then the rest with a Cp correlation, in name order
  const chartKeys = new Set([...charted].slice(0, CHART_SPECIES_LIMIT));
  const inputs = await Promise.all([...options.tables.map((t) => t.path), ...(options.reactionsFile ? [options.reactionsFile] : [])].map((p) => fileDigest(p)));
  // The summaries are made as a writer reads them, from the species store, so at 10^6 rows the
  // records and several hundred MB of summaries are never both in memory.
  const summaries: SummaryList = {
    length: species.length,
    *[Symbol.iterator]() {
      for (let i = 0; i < species.length; i++) {
        const sp = species.at(i);
        yield speciesSummary(sp, reference, options.useWindow, chartKeys.has(sp.key));
      }
    },
  };
  return {
    tool: { name: 'thermovet', version: run.version },
    dataset: { name: options.name, useWindow: options.useWindow },
    summary: summarize(rows, accepted, rejected, species.length, findings.severities()),
    findings,
    species: summaries,
    reactions: reactions ?? [], // always present: empty when no reactions file is given
    provenance: {
      generatedAt: run.generatedAt,
      inputs,
      reference: { path: relative(packageRoot(), reference.path), sha256: reference.sha256 },
      options: {
        tables: options.tables,
        manifest: options.manifestPath ?? null,
        reactions: options.reactionsFile ?? null,
        headerMap: options.headerMap,
        units: options.units,
        useWindow: options.useWindow,
        tolerances: options.tolerances,
        failOn: options.failOn,
      },
      rules: RULES.map((r) => r.id),
    },
  };
}

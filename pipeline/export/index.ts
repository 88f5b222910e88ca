// `thermovet export`: the vetted rows of a dataset as one canonical CSV, with a provenance header and
// the JSON report beside it.
//
// 1. check() the tables (waivers applied when the options name a waivers file).
// 2. Decide what is left out: every row of a species with an unwaived finding at or above `dropOn`
//    (its data are what the finding is about), except for findings that concern one row of a species
//    with several (cross-source, conflicting-values): those leave out that row only. Exact repeats
//    (duplicate-row) are always left out: the canonical file holds each row once.
// 3. Read the tables again through ingestTable (check() keeps no rows) and write each kept row as it
//    comes, to a temporary file renamed into place at the end (a killed run leaves no half file).
import { closeSync, fsyncSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { basename, dirname, join, resolve } from 'node:path';
import { jsonChunks } from '../../reports/json.js';
import { inert } from '../../reports/terminal.js';
import { makeDirs, writeAtomicChunks } from '../../reports/write.js';
import { check } from '../check.js';
import { sourceOf } from '../rules/cross-source.js';
import { loadStore } from '../equilibrium/species.js';
import { InputError } from '../errors.js';
import { ingestTable } from '../ingest/table.js';
import type { SpeciesList } from '../species-list.js';
import type { FindingList, OptionsNormalized, Report, Severity } from '../types.js';
import { loadWaivers, waiveReport } from '../waivers.js';
import { headerLine, R_USED, rowCells } from './csv.js';

export type DropOn = 'error' | 'warning' | 'never';

export interface ExportOptions {
  out: string;
  /** where the JSON report goes; default: beside `out`, `<name>.report.json` */
  reportPath?: string;
  dropOn: DropOn;
}

export interface ExportResult {
  report: Report;
  out: string;
  reportPath: string;
  rowsRead: number;
  rowsRejected: number;
  rowsWritten: number;
  rowsLeftOut: number;
  speciesLeftOut: string[];
}

const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

export function defaultReportPath(out: string): string {
  return join(dirname(out), `${basename(out).replace(/\.csv$/i, '')}.report.json`);
}

const rowKey = (file: string, line: number): string => `${resolve(file)}:${line}`;
const sourceKey = (species: string, phase: string, source: string): string => `${species}|${phase}|${source}`;

export interface LeftOut {
  /** name|phase: every row of the species */
  species: Set<string>;
  /** name|phase|source: every row of that species from that source */
  sources: Set<string>;
  /** file:line */
  rows: Set<string>;
}

/**
 * What the export leaves out, from the finished findings and the species (which row gave which
 * source's values). A finding on the row of a source other than the one the species record takes
 * its values from (the first), and every cross-source finding, leaves out that source's rows only;
 * a conflicting-values or duplicate-row finding its own row; any other finding on a species all of
 * its rows.
 */
export function leftOut(findings: FindingList, species: SpeciesList, dropOn: DropOn): LeftOut {
  // which species and source gave each row a finding points at: only those rows are looked up, so
  // the species are built one at a time and a 10^6-row table is never held as objects
  const pointed = new Set<string>();
  for (const f of findings) pointed.add(rowKey(f.location.file, f.location.line));
  const byRow = new Map<string, { name: string; phase: string; source: string; firstSource: string }>();
  for (let i = 0; i < species.length; i++) {
    const sp = species.at(i);
    for (const v of sp.values) {
      const at = rowKey(v.location.file, v.location.line);
      if (pointed.has(at)) byRow.set(at, { name: sp.name, phase: sp.phase, source: sourceOf(v), firstSource: sourceOf(sp.values[0]!) });
    }
  }
  const out: LeftOut = { species: new Set(), sources: new Set(), rows: new Set() };
  for (const f of findings) {
    const at = rowKey(f.location.file, f.location.line);
    if (f.rule === 'duplicate-row') {
      out.rows.add(at);
      continue;
    }
    if (f.waived || dropOn === 'never' || RANK[f.severity] > RANK[dropOn]) continue;
    if (f.rule === 'conflicting-values' || f.species === undefined || f.phase === undefined) {
      out.rows.add(at);
      continue;
    }
    const row = byRow.get(at);
    if (row && row.name === f.species && row.phase === f.phase && (f.rule === 'cross-source' || row.source !== row.firstSource)) {
      out.sources.add(sourceKey(f.species, f.phase, row.source));
    } else out.species.add(`${f.species}|${f.phase}`);
  }
  return out;
}

/** A file written in pieces, to a temporary name renamed into place by `commit`. */
class AtomicWriter {
  private readonly tmp: string;
  private fd: number;
  private buf: string[] = [];
  private size = 0;
  constructor(readonly path: string) {
    this.tmp = join(dirname(path), `.${basename(path)}.${process.pid}.tmp`);
    try {
      makeDirs(dirname(path));
      this.fd = openSync(this.tmp, 'w');
    } catch (e) {
      throw new InputError('unwritable-output', `cannot write the export (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { file: path });
    }
  }
  write(text: string): void {
    this.buf.push(text);
    this.size += text.length;
    if (this.size >= 1 << 16) this.flush();
  }
  private flush(): void {
    if (this.buf.length) writeSync(this.fd, this.buf.join(''));
    this.buf = [];
    this.size = 0;
  }
  commit(): void {
    this.flush();
    fsyncSync(this.fd);
    closeSync(this.fd);
    renameSync(this.tmp, this.path);
  }
  abandon(): void {
    try {
      closeSync(this.fd);
    } catch {
      // already closed
    }
    rmSync(this.tmp, { force: true });
  }
}

const comment = (text: string): string => `# ${inert(text)}\n`;

export async function exportTables(options: OptionsNormalized, opts: ExportOptions, run: { version: string; generatedAt: string; waiverDay: string }): Promise<ExportResult> {
  let report = await check(options, run);
  if (options.waiversFile) report = waiveReport(report, loadWaivers(options.waiversFile), run.waiverDay);
  const { store } = await loadStore(options); // check() keeps no rows: which row gave which source is read again
  const drop = leftOut(report.findings, store.view(), opts.dropOn);

  const reportPath = opts.reportPath ?? defaultReportPath(opts.out);
  const reportHash = createHash('sha256');
  writeAtomicChunks(reportPath, (function* () {
    for (const piece of jsonChunks(report)) {
      reportHash.update(piece);
      yield piece;
    }
  })());
  const reportDigest = reportHash.digest('hex');

  const w = new AtomicWriter(opts.out);
  let rowsRead = 0;
  let rowsRejected = 0;
  let rowsWritten = 0;
  let rowsLeftOut = 0;
  const speciesLeftOut = new Set<string>();
  try {
    w.write(comment(`thermovet ${run.version} export of ${options.name}: the rows that passed screening, in canonical columns and units`));
    w.write(comment(`generated ${run.generatedAt}`));
    for (const i of report.provenance.inputs) w.write(comment(`input ${i.path} bytes ${i.bytes} sha256 ${i.sha256}`));
    if (options.manifestPath) w.write(comment(`manifest ${options.manifestPath}`));
    if (options.waiversFile) w.write(comment(`waivers ${options.waiversFile} (waived findings do not leave rows out)`));
    w.write(comment(`reference ${report.provenance.reference.path} sha256 ${report.provenance.reference.sha256}`));
    w.write(comment(`report ${reportPath} sha256 ${reportDigest}`));
    w.write(
      comment(
        `left out: rows rejected on reading; every row of a species with an unwaived finding at or above ${opts.dropOn}, ` +
          'or only the rows of one source when the finding is about that source (cross-source, or a row of a source other than the first); exact repeats',
      ),
    );
    w.write(comment(`units: energies kJ/mol, S and Cp J/(mol K) (poly and table Cp converted, R = ${R_USED} J/(mol K)); shomate, nasa7, nasa9 coefficients as published; temperatures K; P_ref bar`));
    w.write(comment('text cells starting with = + - @ tab or CR carry a leading apostrophe against spreadsheet formula injection'));
    w.write(comment('CAUTION: screening does not certify data; a qualified engineer reviews it before design use; local codes and licensed practice govern design'));
    w.write(headerLine() + '\n');
    for (const table of options.tables) {
      const counts = await ingestTable(
        { path: table.path, format: table.format, headerMap: options.headerMap, units: options.units },
        (row) => {
          const key = `${row.species}|${row.phase}`;
          const loc = row.values.location;
          if (drop.species.has(key) || drop.sources.has(sourceKey(row.species, row.phase, sourceOf(row.values))) || drop.rows.has(rowKey(loc.file, loc.line))) {
            rowsLeftOut++;
            if (drop.species.has(key)) speciesLeftOut.add(key);
            return;
          }
          w.write(rowCells(row).join(',') + '\n');
          rowsWritten++;
        },
        () => {}, // findings were collected by check() above
      );
      rowsRead += counts.rows;
      rowsRejected += counts.rejected;
    }
    w.write(comment(`rows read ${rowsRead}, rejected ${rowsRejected}, left out ${rowsLeftOut}, written ${rowsWritten}`));
    w.commit();
  } catch (e) {
    w.abandon();
    throw e;
  }
  return { report, out: opts.out, reportPath, rowsRead, rowsRejected, rowsWritten, rowsLeftOut, speciesLeftOut: [...speciesLeftOut].sort() };
}

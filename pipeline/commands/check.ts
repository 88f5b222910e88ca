// `thermovet check`: read tables, run the rules, write the reports, set the verdict.
import { Option, type Command } from 'commander';
import { writeJson } from '../../reports/json.js';
import { renderTerminal } from '../../reports/terminal.js';
import { writeAtomic, writeAtomicChunks } from '../../reports/write.js';
import { check } from '../check.js';
import { normalizeOptions, type Options } from '../options.js';
import { exitCodeFor } from '../verdict.js';
import { generatedAt, useColor, version, waiverDay } from './shared.js';
import { createProgress, estimateRows } from '../../reports/progress.js';
import { fieldColumns, sarifChunks } from '../../reports/sarif.js';
import { fileDigest } from '../provenance.js';
import { loadWaivers, waiveReport } from '../waivers.js';

interface CheckFlags {
  manifest?: string;
  json?: string;
  failOn: string;
  format?: string;
  quiet?: boolean;
  color: boolean;
  deterministic?: boolean;
  html?: string;
  sarif?: string;
  waivers?: string;
  reactions?: string;
}

async function runCheck(tables: string[], flags: CheckFlags): Promise<number> {
  const o: Options = { tables, failOn: flags.failOn };
  if (flags.manifest) o.manifest = flags.manifest;
  if (flags.format) o.format = flags.format;
  if (flags.waivers) o.waivers = flags.waivers;
  if (flags.reactions) o.reactions = flags.reactions;
  const options = normalizeOptions(o);
  // waivers, progress, HTML and SARIF (issue 6): the waivers file is read first so a bad one stops the run early
  const stamp = generatedAt(!!flags.deterministic);
  const waivers = options.waiversFile ? loadWaivers(options.waiversFile) : undefined;
  const progress = createProgress({ stream: process.stderr, enabled: !flags.quiet });
  let report;
  try {
    const expected = estimateRows(options.tables.map((t) => t.path));
    report = await check(options, { version, generatedAt: stamp, onProgress: (rows) => progress.update('reading rows', rows, Math.max(expected, rows + 1)) });
    if (waivers && options.waiversFile) {
      report = waiveReport(report, waivers, waiverDay()); // the clock's day (or SOURCE_DATE_EPOCH's), also under --deterministic
      const inputs = [...report.provenance.inputs, await fileDigest(options.waiversFile)];
      report = { ...report, provenance: { ...report.provenance, inputs, options: { ...report.provenance.options, waivers: options.waiversFile } } };
    }
    if (flags.sarif) writeAtomicChunks(flags.sarif, sarifChunks(report, { columns: await fieldColumns(report) }));
    if (flags.html) {
      // loaded only when asked for: the chart library costs a quarter of a second to import
      const { renderHtml } = await import('../../reports/html/template.js');
      writeAtomic(flags.html, await renderHtml(report, { onChart: (done, total) => progress.update('drawing charts', done, total) }));
    }
  } finally {
    progress.finish();
  }
  if (flags.json) writeJson(flags.json, report); // streamed: a 10^6-row report is never one string
  if (!flags.quiet) process.stdout.write(renderTerminal(report, { color: useColor(flags.color), failOn: options.failOn }));
  return exitCodeFor(report.summary, options.failOn);
}

export function registerCheck(program: Command): void {
  program
    .command('check')
    .description('check property tables and report findings (exit 0 clean, 1 findings at or above --fail-on, 2 unusable input)')
    .argument('[tables...]', 'CSV, TSV, JSON or NDJSON tables (or list them in the manifest)')
    .option('-m, --manifest <file>', 'dataset manifest (YAML or JSON)')
    .option('--json <out>', 'write the JSON report to this file')
    .option('--html <out>', 'write the HTML report (self-contained, no script) to this file')
    .option('--sarif <out>', 'write a SARIF 2.1.0 log to this file, for CI annotations')
    .option('-r, --reactions <file>', 'reactions of interest (CSV: id, equation, Tmin, Tmax or id, equation, T); overrides the manifest\'s reactions:')
    .option('--waivers <file>', 'waivers file (YAML or JSON); overrides the manifest\'s waivers:')
    .addOption(new Option('--fail-on <severity>', 'lowest severity that fails the run').choices(['error', 'warning', 'never']).default('error'))
    .addOption(new Option('--format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'json', 'ndjson']))
    .option('-q, --quiet', 'print nothing to the terminal; the exit code and the reports still tell')
    .option('--no-color', 'no colour in the terminal summary (NO_COLOR is respected too)')
    .option('--deterministic', 'fix the report timestamp so identical runs give identical bytes')
    .action(async (tables: string[], flags: CheckFlags) => {
      process.exitCode = await runCheck(tables, flags);
    });
}

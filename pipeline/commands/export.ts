// `thermovet export <tables…> --out vetted.csv`: the rows that pass screening as one canonical CSV (SI
// units, provenance header) with the JSON report beside it. Exit 0 once written (what fails is left
// out and counted); with --fail-on error|warning, 1 when the input had unwaived findings at or above
// it; 2 when the input cannot be used.
import { Option, type Command } from 'commander';
import { exportTables, type DropOn } from '../export/index.js';
import { normalizeOptions, type Options } from '../options.js';
import { excerpt } from '../errors.js';
import type { FailOn } from '../types.js';
import { exitCodeFor } from '../verdict.js';
import { generatedAt, version, waiverDay } from './shared.js';

interface ExportFlags {
  manifest?: string;
  out: string;
  json?: string;
  waivers?: string;
  dropOn: DropOn;
  failOn: FailOn;
  format?: string;
  quiet?: boolean;
  deterministic?: boolean;
}

async function runExport(tables: string[], flags: ExportFlags): Promise<number> {
  const o: Options = { tables, failOn: flags.failOn };
  if (flags.manifest) o.manifest = flags.manifest;
  if (flags.format) o.format = flags.format;
  if (flags.waivers) o.waivers = flags.waivers;
  const options = normalizeOptions(o);
  const r = await exportTables(options, { out: flags.out, dropOn: flags.dropOn, ...(flags.json ? { reportPath: flags.json } : {}) }, { version, generatedAt: generatedAt(!!flags.deterministic), waiverDay: waiverDay() });
  if (!flags.quiet) {
    // keys are name|phase; names come from the data, so they are cut and their control characters escaped
    const label = (key: string): string => `${excerpt(key.slice(0, key.lastIndexOf('|')))} (${excerpt(key.slice(key.lastIndexOf('|') + 1))})`;
    const left = r.speciesLeftOut.length ? ` (species left out: ${r.speciesLeftOut.slice(0, 10).map(label).join(', ')}${r.speciesLeftOut.length > 10 ? ', …' : ''})` : '';
    process.stdout.write(
      `thermovet ${version} export · screening only; a qualified engineer reviews before design use\n` +
        `  rows read ${r.rowsRead}, rejected ${r.rowsRejected}, left out ${r.rowsLeftOut}, written ${r.rowsWritten}${left}\n` +
        `  wrote ${r.out} and ${r.reportPath}\n`,
    );
  }
  return exitCodeFor(r.report.summary, options.failOn);
}

export function registerExport(program: Command): void {
  program
    .command('export')
    .description('write the rows that pass screening as one canonical CSV (kJ/mol, J/(mol K), K, bar) with a provenance header, and the JSON report beside it')
    .argument('[tables...]', 'CSV, TSV, JSON or NDJSON tables (or list them in the manifest)')
    .option('-m, --manifest <file>', 'dataset manifest (YAML or JSON)')
    .requiredOption('-o, --out <file.csv>', 'the canonical CSV to write')
    .option('--json <out>', 'where the JSON report goes (default: beside --out, <name>.report.json)')
    .option('--waivers <file>', 'waivers file (YAML or JSON); overrides the manifest\'s waivers:')
    .addOption(new Option('--drop-on <severity>', 'leave out species with unwaived findings at or above this severity').choices(['error', 'warning', 'never']).default('error'))
    .addOption(new Option('--fail-on <severity>', 'also exit 1 when the input has unwaived findings at or above this').choices(['error', 'warning', 'never']).default('never'))
    .addOption(new Option('--format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'json', 'ndjson']))
    .option('-q, --quiet', 'print nothing to the terminal')
    .option('--deterministic', 'fix the timestamps so identical runs give identical bytes')
    .action(async (tables: string[], flags: ExportFlags) => {
      process.exitCode = await runExport(tables, flags);
    });
}

// `thermovet check`: read tables, run the rules, write the reports, set the verdict.
import { Option, type Command } from 'commander';
import { renderJson } from '../../reports/json.js';
import { renderTerminal } from '../../reports/terminal.js';
import { writeAtomic } from '../../reports/write.js';
import { check } from '../check.js';
import { normalizeOptions, type Options } from '../options.js';
import { exitCodeFor } from '../verdict.js';
import { generatedAt, useColor, version } from './shared.js';

interface CheckFlags {
  manifest?: string;
  json?: string;
  failOn: string;
  format?: string;
  quiet?: boolean;
  color: boolean;
  deterministic?: boolean;
}

async function runCheck(tables: string[], flags: CheckFlags): Promise<number> {
  const o: Options = { tables, failOn: flags.failOn };
  if (flags.manifest) o.manifest = flags.manifest;
  if (flags.format) o.format = flags.format;
  const options = normalizeOptions(o);
  const report = await check(options, { version, generatedAt: generatedAt(!!flags.deterministic) });
  if (flags.json) writeAtomic(flags.json, renderJson(report));
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
    .addOption(new Option('--fail-on <severity>', 'lowest severity that fails the run').choices(['error', 'warning', 'never']).default('error'))
    .addOption(new Option('--format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'json', 'ndjson']))
    .option('-q, --quiet', 'print nothing to the terminal; the exit code and the reports still tell')
    .option('--no-color', 'no colour in the terminal summary (NO_COLOR is respected too)')
    .option('--deterministic', 'fix the report timestamp so identical runs give identical bytes')
    .action(async (tables: string[], flags: CheckFlags) => {
      process.exitCode = await runCheck(tables, flags);
    });
}

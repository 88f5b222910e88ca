#!/usr/bin/env node
// The only place that reads argv, the clock, the terminal and sets the exit code.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Command, CommanderError, Option } from 'commander';
import { renderJson } from '../reports/json.js';
import { renderTerminal } from '../reports/terminal.js';
import { writeAtomic } from '../reports/write.js';
import { check } from './check.js';
import { InputError } from './errors.js';
import { normalizeOptions, type Options } from './options.js';
import { packageRoot } from './paths.js';
import { exitCodeFor } from './verdict.js';

const version = (JSON.parse(readFileSync(join(packageRoot(), 'package.json'), 'utf8')) as { version: string }).version;

/** One timestamp per report; fixed by --deterministic or SOURCE_DATE_EPOCH (seconds) so reruns compare byte for byte. */
function generatedAt(deterministic: boolean): string {
  const epoch = process.env.SOURCE_DATE_EPOCH;
  if (epoch !== undefined && /^\d+$/.test(epoch)) return new Date(Number(epoch) * 1000).toISOString();
  return deterministic ? new Date(0).toISOString() : new Date().toISOString();
}

function useColor(flag: boolean): boolean {
  return flag && !!process.stdout.isTTY && process.env.NO_COLOR === undefined && process.env.TERM !== 'dumb';
}

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

function program(): Command {
  const p = new Command('thermovet')
    .description('Vet thermochemical property tables (ΔfH°, ΔfG°, S°, Cp correlations) before equilibrium work.\nScreening only: results need review by a qualified engineer; local codes and licensed practice govern design.')
    .version(version, '-V, --version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });
  p.command('check')
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
  return p;
}

function quietOnClosedPipe(stream: NodeJS.WriteStream): void {
  stream.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}

export async function main(argv: string[]): Promise<void> {
  quietOnClosedPipe(process.stdout);
  quietOnClosedPipe(process.stderr);
  try {
    await program().parseAsync(argv);
  } catch (e) {
    if (e instanceof CommanderError) {
      // --help and --version end with code 0; usage errors (already printed) with 2
      process.exitCode = e.exitCode === 0 ? 0 : 2;
      return;
    }
    if (e instanceof InputError) {
      process.stderr.write(`thermovet: ${e.describe()}\n`);
      process.exitCode = 2;
      return;
    }
    process.stderr.write(`thermovet: internal error: ${(e as Error).message}\n  (please report this with the input that caused it)\n`);
    process.exitCode = 2;
  }
}

await main(process.argv);

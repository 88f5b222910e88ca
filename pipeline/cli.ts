#!/usr/bin/env node
// The only place that reads argv and sets the exit code; each command lives in pipeline/commands/.
import { Command, CommanderError } from 'commander';
import { registerCheck } from './commands/check.js';
import { registerLnk } from './commands/lnk.js';
import { registerDiff } from './commands/diff.js';
import { registerExport } from './commands/export.js';
import { version } from './commands/shared.js';
import { InputError } from './errors.js';

function program(): Command {
  const p = new Command('thermovet')
    .description(
      'Vet thermochemical property tables (ΔfH°, ΔfG°, S°, Cp correlations) before equilibrium work.\n' +
        'Screening only: results need review by a qualified engineer; local codes and licensed practice govern design.',
    )
    .version(version, '-V, --version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });
  p.hook('preAction', (_root, action) => refuseEmptyValues(action));
  registerCheck(p);
  registerLnk(p);
  registerDiff(p);
  registerExport(p);
  return p;
}

/** An option given an empty value (`--json ''`) would otherwise be taken as not given at all. */
function refuseEmptyValues(cmd: Command): void {
  for (const opt of cmd.options) {
    const value: unknown = cmd.getOptionValue(opt.attributeName());
    if (value === '' || (Array.isArray(value) && value.includes(''))) {
      throw new InputError('empty-option', `option ${opt.long ?? opt.short} was given an empty value`);
    }
  }
}

/** Output to a closed pipe (`thermovet … | head`) ends the run quietly. */
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
      // --help and --version end with code 0; usage errors (already printed by commander) with 2
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

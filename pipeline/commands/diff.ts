// `thermovet diff <old> <new>`: what changed between two versions of a dataset and what it costs in
// ln K. Exit 0 when the new version introduces no finding at or above --fail-on, 1 when it does,
// 2 when an input cannot be used.
import { Option, type Command } from 'commander';
import { writeAtomic } from '../../reports/write.js';
import { diffDatasets } from '../diff/index.js';
import { renderDiffJson, renderDiffTerminal } from '../diff/render.js';
import type { FailOn } from '../types.js';
import { generatedAt, useColor, version, waiverDay } from './shared.js';

interface DiffFlags {
  reactions?: string;
  json?: string;
  failOn: FailOn;
  format?: string;
  quiet?: boolean;
  color: boolean;
  deterministic?: boolean;
}

async function runDiff(oldPath: string, newPath: string, flags: DiffFlags): Promise<number> {
  const fmt = flags.format ? { format: flags.format } : {};
  const opts = { failOn: flags.failOn, ...(flags.reactions ? { reactionsFile: flags.reactions } : {}) };
  const d = await diffDatasets({ path: oldPath, ...fmt }, { path: newPath, ...fmt }, opts, { version, generatedAt: generatedAt(!!flags.deterministic), waiverDay: waiverDay() });
  if (flags.json) writeAtomic(flags.json, renderDiffJson(d));
  if (!flags.quiet) process.stdout.write(renderDiffTerminal(d, { color: useColor(flags.color) }));
  return d.summary.failing > 0 ? 1 : 0;
}

export function registerDiff(program: Command): void {
  program
    .command('diff')
    .description('compare two versions of a dataset: species added, removed and changed, findings that appeared or went away, and the Δln K of each change (exit 1 when the new version introduces findings at or above --fail-on)')
    .argument('<old>', 'the old version: a table (CSV, TSV, JSON, NDJSON) or a manifest (YAML, or a JSON object)')
    .argument('<new>', 'the new version, likewise')
    .option('-r, --reactions <file>', 'reactions of interest (CSV: id, equation, T or Tmin/Tmax); else the manifest\'s')
    .option('--json <out>', 'write the diff as JSON (schemas/diff.schema.json) to this file')
    .addOption(new Option('--fail-on <severity>', 'lowest severity of a new finding that fails the run').choices(['error', 'warning', 'never']).default('error'))
    .addOption(new Option('--format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'json', 'ndjson']))
    .option('-q, --quiet', 'print nothing to the terminal')
    .option('--no-color', 'no colour in the terminal summary (NO_COLOR is respected too)')
    .option('--deterministic', 'fix the timestamp so identical runs give identical bytes')
    .action(async (oldPath: string, newPath: string, flags: DiffFlags) => {
      process.exitCode = await runDiff(oldPath, newPath, flags);
    });
}

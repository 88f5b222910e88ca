// `thermovet lnk`: the ln K table of given reactions at given temperatures, from the tables as read.
// Exit 0 when every reaction was computed, 1 when some could not be (unknown species, unbalanced, …:
// the findings go to stderr), 2 when the input cannot be used.
import { Option, type Command } from 'commander';
import { loadReference } from '../chemistry/reference.js';
import { InputError, excerpt } from '../errors.js';
import { EquationError } from '../equilibrium/equation.js';
import { runEquilibrium } from '../equilibrium/index.js';
import { loadReactions, reactionFromEquation, type ReactionSpec } from '../equilibrium/reactions.js';
import { renderLnk, type LnkFormat } from '../equilibrium/render.js';
import { loadStore } from '../equilibrium/species.js';
import { normalizeOptions, type Options } from '../options.js';
import { SPECIES_RULES } from '../rules/index.js';
import type { Finding, UseWindow } from '../types.js';
import { version } from './shared.js';
import { inert } from '../../reports/terminal.js';

interface LnkFlags {
  manifest?: string;
  reactions?: string;
  equation?: string[];
  temperatures?: string;
  tmin?: string;
  tmax?: string;
  format: LnkFormat;
  tableFormat?: string;
}

function kelvin(text: string, what: string): number {
  const v = Number(text);
  if (text.trim() === '' || !Number.isFinite(v) || v <= 0) throw new InputError('bad-option', `${what} must be a temperature in K above 0, not "${excerpt(text)}"`);
  return v;
}

/** Temperatures from the flags override those of the reactions file and of the manifest. */
function flagTemperatures(flags: LnkFlags): { temps?: number[]; Tmin?: number; Tmax?: number } | undefined {
  if (flags.temperatures !== undefined) {
    const temps = flags.temperatures.split(/[\s,;]+/).filter(Boolean).map((t) => kelvin(t, '--temperatures'));
    if (temps.length === 0) throw new InputError('bad-option', '--temperatures needs at least one temperature, e.g. "298.15 500 1000"');
    return { temps };
  }
  if (flags.tmin !== undefined || flags.tmax !== undefined) {
    if (flags.tmin === undefined || flags.tmax === undefined) throw new InputError('bad-option', 'give both --tmin and --tmax');
    const Tmin = kelvin(flags.tmin, '--tmin');
    const Tmax = kelvin(flags.tmax, '--tmax');
    if (Tmin > Tmax) throw new InputError('bad-option', `--tmin ${Tmin} K is above --tmax ${Tmax} K`);
    return { Tmin, Tmax };
  }
  return undefined;
}

async function runLnk(tables: string[], flags: LnkFlags): Promise<number> {
  const o: Options = { tables };
  if (flags.manifest) o.manifest = flags.manifest;
  if (flags.tableFormat) o.format = flags.tableFormat;
  if (flags.reactions) o.reactions = flags.reactions;
  const options = normalizeOptions(o);
  const override = flagTemperatures(flags);

  const specs: ReactionSpec[] = [];
  const findings: Finding[] = [];
  if (options.reactionsFile) {
    const loaded = loadReactions(options.reactionsFile);
    specs.push(...loaded.reactions);
    findings.push(...loaded.findings);
  }
  (flags.equation ?? []).forEach((eq, i) => {
    try {
      specs.push(reactionFromEquation(`eq${i + 1}`, eq, { file: 'command line', line: i + 1 }));
    } catch (e) {
      if (e instanceof EquationError) throw new InputError('bad-equation', `--equation "${excerpt(eq)}": ${e.message}`);
      throw e;
    }
  });
  if (specs.length === 0 && findings.length === 0) {
    throw new InputError('no-reactions', 'no reaction to compute: give --reactions <file>, --equation "<equation>", or a manifest that names a reactions file');
  }
  if (override) {
    for (const s of specs) {
      delete s.temps;
      delete s.Tmin;
      delete s.Tmax;
      Object.assign(s, override);
    }
  }

  const reference = loadReference();
  const loaded = await loadStore(options); // the species stay in their columns; only the reactions' are built
  const window: UseWindow = options.useWindow;
  const eq = runEquilibrium(specs, loaded.store.view(), reference, window, { cpMissingOnPoints: true });
  findings.push(...eq.findings);

  // the data these reactions use, checked by the species rules (the full check is `thermovet check`)
  const used = new Map(eq.resolved.flatMap((r) => r.terms.map((t) => [t.thermo.species.key, t.thermo.species] as const)));
  const dataFindings: Finding[] = [];
  for (const sp of used.values()) for (const rule of SPECIES_RULES) dataFindings.push(...rule.check!(sp, { options, reference }));
  for (const f of loaded.findings) if (f.species !== undefined && f.phase !== undefined && used.has(`${f.species}|${f.phase}`)) dataFindings.push(f);

  process.stdout.write(renderLnk(eq.results, flags.format, { version, findings: [...findings, ...dataFindings] }));

  for (const f of findings) if (f.severity !== 'info') process.stderr.write(inert(`${f.location.file}:${f.location.line}: ${f.severity}: ${f.message} [${f.rule}]`) + '\n');
  const errs = dataFindings.filter((f) => f.severity === 'error').length;
  const warns = dataFindings.filter((f) => f.severity === 'warning').length;
  if (errs + warns > 0) {
    process.stderr.write(`note: the data of these species carry ${errs} error(s) and ${warns} warning(s); run \`thermovet check\` for details before using these numbers\n`);
  }
  if (loaded.rejected > 0) process.stderr.write(`note: ${loaded.rejected} of ${loaded.rows} table rows were rejected on reading\n`);
  return findings.some((f) => f.severity === 'error') ? 1 : 0;
}

export function registerLnk(program: Command): void {
  program
    .command('lnk')
    .description('print ΔrH°, ΔrS°, ΔrG° and ln K (rigorous and constant-ΔrH°) of reactions at given temperatures (exit 0 all computed, 1 some not computable, 2 unusable input)')
    .argument('[tables...]', 'CSV, TSV, JSON or NDJSON tables (or list them in the manifest)')
    .option('-m, --manifest <file>', 'dataset manifest (YAML or JSON): tables, units, use window, reactions file')
    .option('-r, --reactions <file>', 'reactions CSV: id, equation, and T (space-separated) or Tmin and Tmax')
    .option('-e, --equation <equation>', 'a reaction given directly, e.g. "CO(g) + H2O(g) = CO2(g) + H2(g)" (repeatable)', (v: string, prev: string[] | undefined) => [...(prev ?? []), v])
    .option('-t, --temperatures <list>', 'temperatures in K for every reaction, e.g. "298.15 500 1000"')
    .option('--tmin <K>', 'lower end of a window for every reaction (with --tmax): its ends and a grid inside')
    .option('--tmax <K>', 'upper end of that window')
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'csv', 'json']).default('text'))
    .addOption(new Option('--table-format <format>', 'table format when the extension does not tell').choices(['csv', 'tsv', 'json', 'ndjson']))
    .action(async (tables: string[], flags: LnkFlags) => {
      process.exitCode = await runLnk(tables, flags);
    });
}

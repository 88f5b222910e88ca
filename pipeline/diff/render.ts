// The diff as JSON (schemas/diff.schema.json) and as a terminal summary. Text from input files is
// shown inert (control characters escaped), as in every terminal output of thermovet.
import { inert } from '../../reports/terminal.js';
import type { Finding } from '../types.js';
import type { FieldChange } from './compare.js';
import type { DiffReport } from './index.js';

export function renderDiffJson(d: DiffReport): string {
  return JSON.stringify(d, null, 2) + '\n';
}

function paint(on: boolean) {
  const wrap = (open: number, close: number) => (s: string) => (on ? `\u001b[${open}m${s}\u001b[${close}m` : s);
  return { red: wrap(31, 39), yellow: wrap(33, 39), green: wrap(32, 39), dim: wrap(2, 22), bold: wrap(1, 22) };
}

const num = (v: number): string => String(Number(v.toPrecision(6)));
const val = (v: number | string | null, unit?: string): string => (v === null ? '(none)' : typeof v === 'number' ? `${num(v)}${unit ? ` ${unit}` : ''}` : inert(v));

function changeLine(ch: FieldChange): string {
  const delta = ch.delta !== undefined ? `  (Δ ${ch.delta > 0 ? '+' : ''}${num(ch.delta)} ${ch.newUnit ?? ''})` : '';
  const signed = (x: NonNullable<FieldChange['lnK']>[number]): number => x.deltaLnK.find((p) => p.T === x.T_K)?.delta ?? x.maxAbsDeltaLnK;
  const lnk = ch.lnK?.length ? `  Δln K: ${ch.lnK.map((x) => `${inert(x.reaction)} ${signed(x) > 0 ? '+' : ''}${num(signed(x))} at ${num(x.T_K)} K`).join(', ')}` : '';
  const note = ch.lnKNote ? `  (${ch.lnKNote})` : '';
  return `      ${ch.field}: ${val(ch.old, ch.oldUnit)} -> ${val(ch.new, ch.newUnit)}${delta}${lnk}${note}`;
}

function findingLine(f: Finding): string {
  const at = `${f.location.file}:${f.location.line}`;
  return `    ${f.severity.padEnd(7)} ${inert(at)}  ${f.rule}  ${inert(f.message)}${f.waived ? ' (waived)' : ''}`;
}

export function renderDiffTerminal(d: DiffReport, opts: { color: boolean; limit?: number }): string {
  const c = paint(opts.color);
  const limit = opts.limit ?? 50;
  const s = d.summary;
  const out: string[] = [];
  out.push(c.bold(`thermovet ${d.tool.version} diff`) + c.dim(' · screening only; a qualified engineer reviews before design use'));
  out.push(`  old: ${inert(d.old.inputs.map((i) => i.path).join(', '))}  (${d.old.summary.species} species)`);
  out.push(`  new: ${inert(d.new.inputs.map((i) => i.path).join(', '))}  (${d.new.summary.species} species)`);
  out.push(`  species: ${s.speciesAdded} added, ${s.speciesRemoved} removed, ${s.speciesChanged} changed (${s.fieldChanges} field changes)`);
  out.push(`  findings: ${s.findingsAppeared} appeared, ${s.findingsGone} went away`);
  const verdict = s.failOn === 'never' ? 'not enforced (--fail-on never)' : s.failing > 0 ? c.red(c.bold(`REJECT: the new version introduces ${s.failing} finding${s.failing === 1 ? '' : 's'} at or above --fail-on ${s.failOn}`)) : c.green(c.bold(`PASS at --fail-on ${s.failOn}`));
  out.push(`  verdict: ${verdict}`);
  const list = <T>(title: string, items: T[], line: (x: T) => string[]): void => {
    if (!items.length) return;
    out.push('', c.bold(title));
    for (const x of items.slice(0, limit)) out.push(...line(x));
    if (items.length > limit) out.push(c.dim(`    … ${items.length - limit} more (see --json)`));
  };
  list('Added species', d.species.added, (x) => [`    + ${inert(x.name)} (${x.phase})  ${inert(x.location.file)}:${x.location.line}`]);
  list('Removed species', d.species.removed, (x) => [`    - ${inert(x.name)} (${x.phase})`]);
  list('Changed species', d.species.changed, (x) => [`    ~ ${inert(x.name)} (${x.phase})  ${inert(x.location.file)}:${x.location.line}`, ...x.changes.map(changeLine)]);
  list('Findings that appeared', d.findings.appeared, (f) => [findingLine(f)]);
  list('Findings that went away', d.findings.gone, (f) => [findingLine(f)]);
  list('Reactions of interest (ln K old -> new)', d.reactions, (r) => {
    const head = `    ${inert(r.id)}  ${inert(r.equation)}`;
    if (r.computed !== 'both') return [head, `      computed with ${r.computed === 'neither' ? 'neither version' : r.computed === 'old-only' ? 'the old version only' : 'the new version only'}`];
    return [head + `  max |Δln K| ${num(r.maxAbsDeltaLnK ?? 0)}`, ...r.points.map((p) => `      ${num(p.T).padStart(8)} K  ${num(p.lnKOld!).padStart(12)} -> ${num(p.lnKNew!).padStart(12)}  Δ ${num(p.deltaLnK!)}`)];
  });
  out.push('', c.dim(d.caution));
  return out.join('\n') + '\n';
}

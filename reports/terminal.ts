// The terminal summary: counts, the verdict, then the worst findings grouped by species with file:line.
// Bounded: however many findings there are, it prints at most `limit` of them plus counts per rule.
import { failingCount } from '../pipeline/verdict.js';
import { excerpt } from '../pipeline/errors.js';
import type { FailOn, Finding, FindingList, Report, Severity } from '../pipeline/types.js';

export interface TerminalOptions {
  color: boolean;
  failOn: FailOn;
  limit?: number;
}

const RANK: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Data from input files never reaches the terminal raw: control characters and escapes are shown escaped. */
export function inert(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

function paint(on: boolean) {
  const wrap = (open: number, close: number) => (s: string) => (on ? `\u001b[${open}m${s}\u001b[${close}m` : s);
  return { red: wrap(31, 39), yellow: wrap(33, 39), cyan: wrap(36, 39), dim: wrap(2, 22), bold: wrap(1, 22), green: wrap(32, 39) };
}

/** Largest |Δln K| a finding causes, 0 when it has no reaction impact. */
export function impactOf(f: Finding): number {
  return f.impact?.reduce((m, i) => Math.max(m, i.maxAbsDeltaLnK), 0) ?? 0;
}

const worse = (a: Finding, b: Finding): number => Number(!!a.waived) - Number(!!b.waived) || RANK[a.severity] - RANK[b.severity] || impactOf(b) - impactOf(a);

/**
 * The `limit` worst findings that pass `keep`, worst first: unwaived before waived, then severity, then
 * ln K impact, then report order. Selected in one pass holding at most `limit` of them, so a report
 * with a finding on each of 10^6 rows is never made into objects all at once.
 */
export function worstFindings(findings: FindingList, limit: number, keep: (f: Finding) => boolean = () => true): Finding[] {
  const top: Finding[] = [];
  if (limit <= 0) return top;
  for (const f of findings) {
    if (!keep(f)) continue;
    if (top.length === limit && worse(f, top[limit - 1]!) >= 0) continue;
    let lo = 0; // after every finding as bad as f or worse: equals keep report order
    let hi = top.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (worse(f, top[mid]!) < 0) hi = mid;
      else lo = mid + 1;
    }
    top.splice(lo, 0, f);
    if (top.length > limit) top.pop();
  }
  return top;
}

/** How many findings each severity and rule has, most first (ties in report order): the summary under the worst ones. */
export function findingsByRule(findings: FindingList): { severity: Severity; rule: string; count: number }[] {
  const counts = new Map<string, { severity: Severity; rule: string; count: number }>();
  for (const f of findings) {
    const key = `${f.severity}\u0000${f.rule}`;
    const entry = counts.get(key);
    if (entry) entry.count++;
    else counts.set(key, { severity: f.severity, rule: f.rule, count: 1 });
  }
  return [...counts.values()].sort((a, b) => b.count - a.count);
}

export function renderTerminal(report: Report, opts: TerminalOptions): string {
  const c = paint(opts.color);
  const limit = opts.limit ?? 25;
  const s = report.summary;
  const out: string[] = [];
  const sev = (v: Severity): string => (v === 'error' ? c.red('error  ') : v === 'warning' ? c.yellow('warning') : c.cyan('info   '));
  out.push(c.bold(`thermovet ${report.tool.version}`) + c.dim(' · screening only; a qualified engineer reviews before design use'));
  out.push(`  rows ${s.rows}  accepted ${s.accepted}  rejected ${s.rejected}  species ${s.species}`);
  out.push(`  ${c.red(`${s.errors} error${s.errors === 1 ? '' : 's'}`)}  ${c.yellow(`${s.warnings} warning${s.warnings === 1 ? '' : 's'}`)}  ${c.cyan(`${s.infos} info`)}`);
  const failing = failingCount(s, opts.failOn);
  const verdict = opts.failOn === 'never' ? c.bold(`not enforced (--fail-on never); at the default it would ${s.errors > 0 ? c.red('REJECT') : c.green('PASS')}`) : failing > 0 ? c.red(c.bold(`REJECT: ${failing} finding${failing === 1 ? '' : 's'} at or above --fail-on ${opts.failOn}`)) : c.green(c.bold(`PASS at --fail-on ${opts.failOn}`));
  out.push(`  verdict: ${verdict}`);
  if (report.findings.length === 0) return out.join('\n') + '\n';

  const shown = worstFindings(report.findings, limit, (f) => f.severity !== 'info' || report.findings.length <= limit);
  const groups = new Map<string, Finding[]>();
  for (const f of shown) {
    const key = f.species !== undefined ? `${f.species}${f.phase ? ` (${f.phase})` : ''}` : `${f.location.file} (rows)`;
    const list = groups.get(key);
    if (list) list.push(f);
    else groups.set(key, [f]);
  }
  out.push('');
  out.push(c.bold(`Worst findings${shown.length < report.findings.length ? ` (${shown.length} of ${report.findings.length})` : ''}`));
  for (const [key, list] of groups) {
    out.push(`  ${c.bold(inert(excerpt(key, 80)))}`); // a species name can be a whole paragraph
    for (const f of list) {
      const at = `${f.location.file}:${f.location.line}${f.location.column ? `:${f.location.column}` : ''}`;
      const impact = impactOf(f) > 0 ? c.dim(` [Δln K up to ${impactOf(f).toPrecision(3)}]`) : '';
      out.push(`    ${sev(f.severity)} ${c.dim(inert(at))}  ${inert(f.message)}${f.waived ? c.dim(' (waived)') : ''}${impact}`);
    }
  }
  if (shown.length < report.findings.length) {
    out.push('');
    out.push(c.bold('All findings by rule'));
    for (const r of findingsByRule(report.findings)) out.push(`  ${String(r.count).padStart(7)}  ${r.severity} ${r.rule}`);
  }
  return out.join('\n') + '\n';
}

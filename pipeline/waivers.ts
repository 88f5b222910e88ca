// Waivers: findings a reviewer has accepted, with who, why and until when. A waived finding stays in
// every report, marked `waived`, and does not count toward the exit code. An expired waiver waives
// nothing and is itself an error; a waiver that matches no finding is a warning.
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { LineCounter, isSeq, parseDocument } from 'yaml';
import { summarize } from './check.js';
import { FindingStore } from './finding-store.js';
import { loadStructured } from './ingest/structured.js';
import { displayPath } from './options.js';
import { makeFinding } from './rules/finding.js';
import { rule as waiverExpired } from './rules/waiver-expired.js';
import { rule as waiverUnmatched } from './rules/waiver-unmatched.js';
import type { Finding, Location, Report } from './types.js';

/** One waiver as written in the waivers file (schemas/waivers.schema.json). */
interface WaiverEntry {
  rule: string;
  species?: string;
  phase?: string;
  file?: string;
  line?: number;
  reason: string;
  accepted_by: string;
  expires: string;
}

export interface Waiver {
  rule: string;
  species?: string;
  phase?: string;
  /** table path as reports show it (relative to the working directory when inside it) */
  file?: string;
  line?: number;
  reason: string;
  acceptedBy: string;
  /** last day the waiver holds, YYYY-MM-DD */
  expires: string;
  /** where the waiver itself is written, for findings about it */
  location: Location;
}

/** Reads and validates a YAML or JSON waivers file; each waiver keeps the line it starts on. */
export function loadWaivers(path: string): Waiver[] {
  const entries = loadStructured<WaiverEntry[]>(path, 'waivers.schema.json', 'waivers');
  const lines = itemLines(path);
  const base = dirname(resolve(path));
  const file = displayPath(path);
  return entries.map((e, i) => {
    const w: Waiver = { rule: e.rule, reason: e.reason, acceptedBy: e.accepted_by, expires: e.expires, location: { file, line: lines[i] ?? 1 } };
    if (e.species !== undefined) w.species = e.species;
    if (e.phase !== undefined) w.phase = e.phase;
    if (e.file !== undefined) w.file = displayPath(resolve(base, e.file));
    if (e.line !== undefined) w.line = e.line;
    return w;
  });
}

/** 1-based line on which each item of the top-level list starts (the file has already been validated). */
function itemLines(path: string): number[] {
  const counter = new LineCounter();
  const doc = parseDocument(readFileSync(path, 'utf8').replace(/^\uFEFF/, ''), { lineCounter: counter });
  if (!isSeq(doc.contents)) return [];
  return doc.contents.items.map((it) => {
    const range = (it as { range?: [number, number, number] }).range;
    return range ? counter.linePos(range[0]).line : 1;
  });
}

const WAIVER_RULES = new Set([waiverExpired.id, waiverUnmatched.id]);

function matches(w: Waiver, f: Finding): boolean {
  if (w.rule !== f.rule || WAIVER_RULES.has(f.rule)) return false;
  if (w.species !== undefined && w.species !== f.species) return false;
  if (w.phase !== undefined && w.phase !== f.phase) return false;
  if (w.file !== undefined && resolve(w.file) !== resolve(f.location.file)) return false;
  if (w.line !== undefined && w.line !== f.location.line) return false;
  return true;
}

function target(w: Waiver): string {
  const sp = w.species !== undefined ? `${w.species}${w.phase ? ` (${w.phase})` : ''}` : '';
  const at = w.file !== undefined ? `${w.file}${w.line !== undefined ? `:${w.line}` : ''}` : '';
  return sp && at ? `${sp} at ${at}` : sp || at;
}

/**
 * Marks the findings that an unexpired waiver covers as waived (first matching waiver wins) and adds a
 * `waiver-expired` error for each waiver whose date is before `today` and a `waiver-unmatched` warning
 * for each unexpired waiver that matches nothing. Returns new finding objects; the input is not changed.
 * @param today the day of the run, YYYY-MM-DD (the CLI reads the clock, or the fixed date of a deterministic run)
 */
export function applyWaivers(findings: Finding[], waivers: Waiver[], today: string): Finding[] {
  const apply = waiverOf(waivers, today);
  const out = findings.map(apply.toFinding);
  for (const f of apply.findingsAboutWaivers()) out.push(f);
  return out;
}

/** One finding at a time: `toFinding` waives what an unexpired waiver covers; then the findings about the waivers themselves. */
function waiverOf(waivers: Waiver[], today: string): { toFinding: (f: Finding) => Finding; findingsAboutWaivers: () => Finding[] } {
  const active = waivers.filter((w) => w.expires >= today);
  const used = new Set<Waiver>();
  return {
    toFinding: (f) => {
      const w = active.find((x) => matches(x, f));
      if (!w) return f;
      used.add(w);
      return { ...f, waived: { by: w.acceptedBy, reason: w.reason, expires: w.expires } };
    },
    findingsAboutWaivers: () => {
      const out: Finding[] = [];
      for (const w of waivers) {
        const params = { rule: w.rule, target: target(w), expires: w.expires, by: w.acceptedBy };
        const extra = { ...(w.species !== undefined ? { species: w.species } : {}), ...(w.phase !== undefined ? { phase: w.phase } : {}) };
        if (w.expires < today) out.push(makeFinding(waiverExpired, 'expired', params, w.location, extra));
        else if (!used.has(w)) out.push(makeFinding(waiverUnmatched, 'unmatched', params, w.location, extra));
      }
      return out;
    },
  };
}

/**
 * The report with waivers applied: findings re-sorted, summary recounted (waived findings do not count).
 * The findings go into a new finding store one at a time: a report with a finding on every row is
 * never held as objects.
 */
export function waiveReport(report: Report, waivers: Waiver[], today: string): Report {
  const apply = waiverOf(waivers, today);
  const findings = new FindingStore();
  for (const f of report.findings) findings.add(apply.toFinding(f));
  for (const f of apply.findingsAboutWaivers()) findings.add(f);
  findings.sort();
  const s = report.summary;
  return { ...report, summary: summarize(s.rows, s.accepted, s.rejected, s.species, findings.severities()), findings };
}

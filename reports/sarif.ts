// The SARIF 2.1.0 view of the report, for CI systems that annotate the offending file and line.
// One run; the driver lists every rule from the registry; each finding is one result. Waived findings
// are results too, with an external suppression carrying who accepted them and why.
import { createReadStream, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { packageRoot } from '../pipeline/paths.js';
import { RULES } from '../pipeline/rules/index.js';
import type { Finding, Report, Rule, Severity } from '../pipeline/types.js';

export const SARIF_SCHEMA_URI = 'https://docs.oasis-open.org/sarif/sarif/v2.1.0/errata01/os/schemas/sarif-schema-2.1.0.json';

const LEVEL: Record<Severity, 'error' | 'warning' | 'note'> = { error: 'error', warning: 'warning', info: 'note' };

/** Character columns of table fields: key `${file}\u0000${line}\u0000${fieldPosition}`, value [startColumn, endColumn) in code points. */
export type FieldColumns = Map<string, [number, number]>;

const key = (file: string, line: number, field: number): string => `${file}\u0000${line}\u0000${field}`;

export interface SarifOptions {
  /** from fieldColumns(): turns a finding's field position into the character columns of that cell */
  columns?: FieldColumns;
}

/** A relative path as a URI reference: forward slashes, each segment percent-encoded. */
export function pathToUri(path: string): string {
  const p = path.replace(/\\/g, '/');
  const abs = p.startsWith('/');
  const uri = p
    .split('/')
    .map((seg) => encodeURIComponent(seg))
    .join('/');
  return abs ? `file://${uri}` : uri;
}

/** The rule's doc page, shipped with the tool, as the help CI systems show beside an annotation. */
function docPage(rule: Rule): string | undefined {
  try {
    return readFileSync(join(packageRoot(), rule.docs.replace(/#.*$/, '')), 'utf8');
  } catch {
    return undefined;
  }
}

function reportingDescriptor(rule: Rule) {
  const page = docPage(rule);
  return {
    id: rule.id,
    name: rule.id.replace(/(^|-)([a-z])/g, (_, __, c: string) => c.toUpperCase()),
    shortDescription: { text: rule.description },
    fullDescription: { text: rule.description },
    help: { text: `${rule.description} See ${rule.docs} in the thermovet distribution.`, ...(page ? { markdown: page } : {}) },
    defaultConfiguration: { level: LEVEL[rule.severity] },
    properties: { docs: rule.docs },
  };
}

function messageText(f: Finding): string {
  let text = f.message;
  if (f.species !== undefined) text = `${f.species}${f.phase ? ` (${f.phase})` : ''}: ${text}`;
  const impact = f.impact?.length ? Math.max(...f.impact.map((i) => i.maxAbsDeltaLnK)) : 0;
  if (impact > 0) text += ` [moves ln K by up to ${Number(impact.toPrecision(3))}]`;
  return text;
}

function result(f: Finding, ruleIndex: Map<string, number>, columns: FieldColumns | undefined) {
  const region: { startLine: number; startColumn?: number; endColumn?: number } = { startLine: Math.max(1, f.location.line) };
  const col = f.location.column !== undefined ? columns?.get(key(f.location.file, f.location.line, f.location.column)) : undefined;
  if (col) {
    region.startColumn = col[0];
    region.endColumn = col[1];
  }
  const r: Record<string, unknown> = {
    ruleId: f.rule,
    ...(ruleIndex.has(f.rule) ? { ruleIndex: ruleIndex.get(f.rule) } : {}),
    level: LEVEL[f.severity],
    message: { text: messageText(f) },
    locations: [{ physicalLocation: { artifactLocation: { uri: pathToUri(f.location.file) }, region } }],
  };
  const props: Record<string, unknown> = { messageId: f.messageId };
  if (f.species !== undefined) props.species = f.species;
  if (f.phase !== undefined) props.phase = f.phase;
  if (f.location.field !== undefined) props.field = f.location.field;
  if (f.location.column !== undefined) props.fieldPosition = f.location.column;
  if (f.diagnosis) props.diagnosis = f.diagnosis;
  if (f.impact?.length) props.impact = f.impact;
  r.properties = props;
  if (f.waived) {
    r.suppressions = [
      {
        kind: 'external',
        status: 'accepted',
        justification: `${f.waived.reason} (accepted by ${f.waived.by}, expires ${f.waived.expires})`,
        properties: { acceptedBy: f.waived.by, expires: f.waived.expires },
      },
    ];
  }
  return r;
}

/** SARIF 2.1.0 log of the report; deterministic for a deterministic report. */
export function renderSarif(report: Report, opts: SarifOptions = {}): string {
  return [...sarifChunks(report, opts)].join('');
}

const RESULTS_HERE = '\u0000results\u0000';

/**
 * The text of renderSarif in pieces, each result made as it is written: a report with a finding on each
 * of 10^6 rows would be one string of more than a gigabyte, longer than a JavaScript string can be.
 * The bytes are those of JSON.stringify(log, null, 2) + '\n'.
 */
export function* sarifChunks(report: Report, opts: SarifOptions = {}): Generator<string> {
  const ruleIndex = new Map(RULES.map((r, i) => [r.id, i]));
  const log = {
    $schema: SARIF_SCHEMA_URI,
    version: '2.1.0',
    runs: [
      {
        tool: {
          driver: {
            name: report.tool.name,
            version: report.tool.version,
            semanticVersion: report.tool.version,
            rules: RULES.map(reportingDescriptor),
          },
        },
        columnKind: 'unicodeCodePoints',
        artifacts: report.provenance.inputs.map((i) => ({ location: { uri: pathToUri(i.path) }, length: i.bytes, hashes: { 'sha-256': i.sha256 } })),
        invocations: [{ executionSuccessful: true, endTimeUtc: report.provenance.generatedAt }],
        results: report.findings.length === 0 ? [] : [RESULTS_HERE],
        properties: {
          summary: report.summary,
          caution: 'Screening, not certification: results must be reviewed by a qualified engineer; local codes and licensed practice govern design.',
        },
      },
    ],
  };
  const text = JSON.stringify(log, null, 2) + '\n';
  const at = text.indexOf(JSON.stringify(RESULTS_HERE));
  if (at < 0) {
    yield text;
    return;
  }
  const lineStart = text.lastIndexOf('\n', at) + 1;
  const indent = text.slice(lineStart, at); // the results' depth in the log
  yield text.slice(0, lineStart);
  let piece = '';
  let written = 0;
  for (const f of report.findings) {
    // a result's own lines shifted to the array's depth (JSON strings never hold a raw line feed)
    piece += indent + JSON.stringify(result(f, ruleIndex, opts.columns), null, 2).replace(/\n/g, '\n' + indent) + (++written < report.findings.length ? ',\n' : '\n');
    if (written % 32 === 0) {
      yield piece;
      piece = '';
    }
  }
  yield piece + text.slice(text.indexOf('\n', at) + 1);
}

/** 1-based [start, end) code-point columns of each field on a delimited line; quotes respected. */
export function splitColumns(line: string, delimiter: string): [number, number][] {
  const cps = Array.from(line);
  const out: [number, number][] = [];
  let start = 0;
  let quoted = false;
  for (let i = 0; i < cps.length; i++) {
    const c = cps[i];
    if (c === '"') quoted = !quoted; // an escaped "" toggles twice
    else if (c === delimiter && !quoted) {
      out.push([start + 1, i + 1]);
      start = i + 1;
    }
  }
  if (!quoted) out.push([start + 1, cps.length + 1]);
  return out;
}

/**
 * Finds the character columns of the cells that findings point at, by reading those lines of the CSV/TSV
 * tables again. The report locates a cell by its field position; SARIF wants characters, so that CI
 * annotates the cell itself. A record that spans lines, or a line that no longer matches, gets no column.
 */
export async function fieldColumns(report: Report): Promise<FieldColumns> {
  const wanted = new Map<string, Map<number, Set<number>>>();
  for (const f of report.findings) {
    if (f.location.column === undefined) continue;
    const lines = wanted.get(f.location.file) ?? new Map<number, Set<number>>();
    wanted.set(f.location.file, lines);
    const set = lines.get(f.location.line) ?? new Set<number>();
    lines.set(f.location.line, set);
    set.add(f.location.column);
  }
  const formats = new Map<string, string>();
  const tables = (report.provenance.options as { tables?: { path: string; format: string }[] }).tables ?? [];
  for (const t of tables) formats.set(t.path, t.format);
  const out: FieldColumns = new Map();
  for (const [file, lines] of wanted) {
    const format = formats.get(file);
    if (format !== 'csv' && format !== 'tsv') continue;
    const delimiter = format === 'tsv' ? '\t' : ',';
    let last = 0; // a loop: one line per finding can be too many arguments for Math.max(...)
    for (const n of lines.keys()) if (n > last) last = n;
    let n = 0;
    try {
      const rl = createInterface({ input: createReadStream(file), crlfDelay: Infinity });
      for await (const text of rl) {
        n++;
        const fields = lines.get(n);
        if (fields) {
          const cols = splitColumns(n === 1 ? text.replace(/^\uFEFF/, '') : text, delimiter);
          for (const pos of fields) {
            const c = cols[pos - 1];
            if (c) out.set(key(file, n, pos), c);
          }
        }
        if (n >= last) {
          rl.close();
          break;
        }
      }
    } catch {
      // the table went away or became unreadable since the run: locations keep their line only
    }
  }
  return out;
}

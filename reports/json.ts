// The JSON report: the Report itself, keys in a fixed order, trailing newline; objects indented by two
// spaces, the elements of the top-level arrays one per line.
// Each finding also carries its file and line at the top level (the contract's `findings[] {rule,
// severity, species, phase, file, line, message, …}`), beside the full `location`.
//
// A report of 10^6 rows holds 10^5–10^6 species summaries: as one string it would cost a few hundred
// MB at once. `jsonChunks` yields the text piece by piece (32 array elements at a time), and
// `writeJson` writes it to disk atomically without ever holding the whole text.
import { writeAtomicChunks } from './write.js';
import type { Finding, Report } from '../pipeline/types.js';

/** A finding as the JSON report writes it: file and line lifted beside rule, severity, species and phase. */
export function findingForJson(f: Finding): Record<string, unknown> {
  const { rule, severity, species, phase, message, ...rest } = f;
  return {
    rule,
    severity,
    ...(species !== undefined ? { species } : {}),
    ...(phase !== undefined ? { phase } : {}),
    file: f.location.file,
    line: f.location.line,
    message,
    ...rest,
  };
}

/** The whole report as one string (small reports: export, tests); the same bytes as `jsonChunks`. */
export function renderJson(report: Report): string {
  return [...jsonChunks(report)].join('');
}

/** Array elements per yielded piece: each piece (~10 kB) stays out of V8's large-object space, whose strings only full collections free. */
const BATCH = 32;

/** An array, or a list made as it is read (Report.species from check()): written element by element. */
function isList(v: unknown): v is { length: number } & Iterable<unknown> {
  return Array.isArray(v) || (typeof v === 'object' && v !== null && typeof (v as { length?: unknown }).length === 'number' && Symbol.iterator in v);
}

/** JSON.stringify(value, null, 2) placed at `indent`: its inner lines shifted right (strings never hold a raw line feed). */
function at(value: unknown, indent: string): string {
  return JSON.stringify(value, null, 2).replace(/\n/g, '\n' + indent);
}

/**
 * The report's text, in pieces. Top-level objects are indented by two spaces; each element of a
 * top-level array (findings, species, reactions) is one compact line, so the report greps and diffs
 * finding by finding, and a 10^6-row report is half the size it would be indented.
 */
export function* jsonChunks(report: Report): Generator<string> {
  const keys = Object.keys(report).filter((k) => {
    const v = (report as unknown as Record<string, unknown>)[k];
    return v !== undefined && typeof v !== 'function' && typeof v !== 'symbol';
  });
  if (keys.length === 0) {
    yield '{}\n';
    return;
  }
  yield '{\n';
  for (let k = 0; k < keys.length; k++) {
    const key = keys[k]!;
    const value = (report as unknown as Record<string, unknown>)[key];
    const end = k < keys.length - 1 ? ',\n' : '\n';
    if (isList(value) && value.length === 0) {
      yield `  ${JSON.stringify(key)}: []${end}`;
    } else if (isList(value)) {
      yield `  ${JSON.stringify(key)}: [\n`;
      let written = 0;
      let batch: string[] = [];
      for (const item of value) {
        // an element JSON cannot express (undefined, a function) is null, as in JSON.stringify of an array
        batch.push(JSON.stringify(key === 'findings' ? findingForJson(item as Finding) : item) ?? 'null');
        if (batch.length < BATCH) continue;
        written += batch.length;
        yield '    ' + batch.join(',\n    ') + (written < value.length ? ',\n' : '\n');
        batch = [];
      }
      if (batch.length > 0) yield '    ' + batch.join(',\n    ') + '\n';
      yield '  ]' + end;
    } else {
      yield `  ${JSON.stringify(key)}: ${at(value, '  ')}${end}`;
    }
  }
  yield '}\n';
}

/** Writes the JSON report to `path` through a temporary file and a rename (a killed run leaves no half report). */
export function writeJson(path: string, report: Report): void {
  writeAtomicChunks(path, jsonChunks(report));
}

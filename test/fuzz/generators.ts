// Generated inputs for the property tests (test/robustness/properties.test.ts) and the fuzz script
// (test/fuzz/fuzz.ts), and the one invariant every generated table must keep:
// it is either refused as a whole with an InputError naming the file, or every data row is accounted
// for, rows = accepted + rejected, each on the line where it starts.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { InputError } from '../../pipeline/errors.js';
import type { TableFormat } from '../../pipeline/ingest/events.js';
import { ingestTable, type TableCounts } from '../../pipeline/ingest/table.js';
import type { Finding, SpeciesRow } from '../../pipeline/types.js';

// ---------------------------------------------------------------------------------------------
// files

export class Scratch {
  readonly dir = mkdtempSync(join(tmpdir(), 'thermovet-fuzz-'));
  private n = 0;
  write(content: string | Uint8Array, ext: string): string {
    const p = join(this.dir, `f${++this.n}.${ext}`);
    writeFileSync(p, content);
    return p;
  }
  /** The same path every time for one extension: for long runs that should not fill the disk. */
  overwrite(content: string | Uint8Array, ext: string): string {
    const p = join(this.dir, `current.${ext}`);
    writeFileSync(p, content);
    return p;
  }
  dispose(): void {
    rmSync(this.dir, { recursive: true, force: true });
  }
}

export interface Ingested {
  counts?: TableCounts;
  error?: InputError;
  rows: SpeciesRow[];
  findings: Finding[];
}

/** Runs the real ingest path; an InputError is an allowed outcome, anything else thrown is not. */
export async function ingest(path: string, format: TableFormat, opts: { headerMap?: Record<string, string>; units?: Record<string, string> } = {}): Promise<Ingested> {
  const rows: SpeciesRow[] = [];
  const findings: Finding[] = [];
  try {
    const counts = await ingestTable({ path, format, headerMap: opts.headerMap ?? {}, units: opts.units ?? {} }, (r) => rows.push(r), (f) => findings.push(f));
    return { counts, rows, findings };
  } catch (e) {
    if (e instanceof InputError) return { error: e, rows, findings };
    throw e;
  }
}

/** The invariants any outcome must keep; returns a description of the first one broken, or undefined. */
export function brokenInvariant(r: Ingested, path: string): string | undefined {
  if (r.error) {
    if (r.error.file !== path) return `InputError names ${r.error.file}, not ${path}: ${r.error.describe()}`;
    if (/[\u0000-\u001f\u007f-\u009f]/.test(r.error.describe())) return `InputError message holds a control character: ${JSON.stringify(r.error.describe())}`;
    return undefined;
  }
  const c = r.counts!;
  if (c.rows !== c.accepted + c.rejected) return `rows ${c.rows} != accepted ${c.accepted} + rejected ${c.rejected}`;
  if (c.accepted !== r.rows.length) return `accepted ${c.accepted} but ${r.rows.length} rows handed on`;
  for (const row of r.rows) {
    for (const f of ['dHf', 'dGf', 'S', 'u_dHf', 'u_dGf', 'u_S', 'P_ref'] as const) {
      const v = row.values[f];
      if (v !== undefined && !Number.isFinite(v)) return `accepted row at line ${row.values.location.line} has ${f} = ${v}`;
    }
    if (row.cp && !row.cp.coeffs.every(Number.isFinite)) return `accepted row at line ${row.values.location.line} has a non-finite Cp coefficient`;
  }
  for (const f of r.findings) {
    if (f.location.file !== path) return `finding names ${f.location.file}`;
    if (!(f.location.line >= 1)) return `finding without a line: ${f.message}`;
  }
  const rejectedLines = new Set(r.findings.filter((f) => f.rule !== 'unknown-column').map((f) => f.location.line));
  if (rejectedLines.size > c.rejected) return `${rejectedLines.size} lines with row findings but ${c.rejected} rows rejected`;
  if (c.rejected > 0 && rejectedLines.size === 0) return `${c.rejected} rows rejected without a finding`;
  return undefined;
}

// ---------------------------------------------------------------------------------------------
// cells

const PUBLISHED_NUMBERS = ['-241.826', '-228.582', '188.835', '-393.522', '213.795', '0', '130.68', '29.12', '298.15', '1000'];
const BAD_NUMBERS = ['NaN', 'nan', 'Infinity', '-inf', '1e400', '-1e999', '0x10', '1,5', '1.2.3', '12abc', '−5', '+', '.', 'e5', '1e', '١٢', '∞', ' ', '--1', '1e-400'];
const FORMULAS = ['H2O', 'CO2', 'NH4+', 'SO4^2-', 'CuSO4·5H2O', 'Ca(OH)2', 'Fe4[Fe(CN)6]3', 'Xx', 'Ca(OH2', 'CaOH)2', 'h2o', 'H0', '', 'e-', 'C(graphite)', 'O2(g)', '2H2O'];
const PHASES = ['g', 'l', 'cr', 'aq', 'gas', 'cr, graphite', 'plasma', 'G', '', 's', 'liquid'];
const MODELS = ['poly', 'shomate', 'nasa7', 'nasa9', 'table', 'nasa8', 'POLY', ''];
const UNITS = ['J/(mol K)', 'cal/(mol K)', 'R', 'J/mol/K', 'kJ/(mol K)', 'BTU', ''];
const HOSTILE = ['<script>alert(1)</script>', '\u001b[31mred\u001b[0m', '=HYPERLINK("x")', '+1', '-1', '@SUM(A1)', '\u202eevil', 'a\u0007b', '"quoted"', 'a,b', 'line\nbreak', 'cr\rret', 'tab\there'];

export const numberText: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(...PUBLISHED_NUMBERS),
  fc.constantFrom(...BAD_NUMBERS),
  fc.double().map(String),
  fc.integer().map(String),
  fc.tuple(fc.integer({ min: -999, max: 999 }), fc.integer({ min: -330, max: 330 })).map(([m, e]) => `${m}e${e}`),
);

const listText: fc.Arbitrary<string> = fc.array(numberText, { minLength: 0, maxLength: 10 }).map((a) => a.join(' '));

/** Any text at all, biased towards characters that matter to a CSV reader. */
export const anyText: fc.Arbitrary<string> = fc.oneof(
  fc.string({ maxLength: 20 }),
  fc.string({ unit: fc.constantFrom(',', '"', '\n', '\r', '\t', ' ', '#', 'a', '1', ';', '\\', '\u00e9', '\ufeff'), maxLength: 12 }),
  fc.string({ unit: 'binary', maxLength: 12 }),
  fc.constantFrom(...HOSTILE),
);

/** A cell for a canonical column: mostly plausible, often wrong. */
export function cellFor(column: string): fc.Arbitrary<string> {
  switch (column) {
    case 'species':
    case 'formula':
      return fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...FORMULAS) }, { weight: 1, arbitrary: anyText });
    case 'phase':
      return fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...PHASES) }, { weight: 1, arbitrary: anyText });
    case 'cp_model':
      return fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...MODELS) }, { weight: 1, arbitrary: anyText });
    case 'cp_unit':
      return fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...UNITS) }, { weight: 1, arbitrary: anyText });
    case 'cp_coeffs':
    case 'cp_exponents':
    case 'cp_T':
      return fc.oneof({ weight: 4, arbitrary: listText }, { weight: 1, arbitrary: anyText });
    case 'source':
      return anyText;
    default:
      return fc.oneof({ weight: 4, arbitrary: numberText }, { weight: 1, arbitrary: fc.constant('') }, { weight: 1, arbitrary: anyText });
  }
}

const OPTIONAL_COLUMNS = ['formula', 'dHf', 'dGf', 'S', 'u_dHf', 'u_dGf', 'u_S', 'cp_model', 'cp_exponents', 'cp_unit', 'cp_coeffs', 'cp_T', 'cp_Tmin', 'cp_Tmax', 'P_ref', 'source', 'comment', 'Notes'];
const HEADER_UNITS: Record<string, string[]> = {
  dHf: ['kJ/mol', 'kcal/mol', 'J/mol', 'cal/mol'],
  dGf: ['kJ/mol', 'kcal/mol'],
  S: ['J/(mol K)', 'cal/(mol K)'],
  cp_Tmin: ['K', 'degC'],
  cp_Tmax: ['K', 'degC'],
  P_ref: ['bar', 'atm', 'Pa'],
};

export interface TableSpec {
  columns: string[]; // canonical names (or unknown ones), species and phase first in some order
  headerCells: string[];
  rows: string[][];
}

/** A header of canonical columns in random order, some with a bracketed unit, and rows of cells for them. */
export const tableSpec: fc.Arbitrary<TableSpec> = fc
  .tuple(fc.subarray(OPTIONAL_COLUMNS), fc.boolean())
  .chain(([extra, casing]) =>
    fc.shuffledSubarray(['species', 'phase', ...extra], { minLength: 2 + extra.length }).chain((columns) =>
      fc
        .tuple(
          fc.tuple(...columns.map((c) => (HEADER_UNITS[c] ? fc.option(fc.constantFrom(...HEADER_UNITS[c]!), { nil: undefined }) : fc.constant(undefined)))),
          fc.array(fc.tuple(...columns.map(cellFor)), { minLength: 1, maxLength: 12 }),
        )
        .map(([units, rows]) => ({
          columns,
          headerCells: columns.map((c, i) => {
            const name = casing ? c.toUpperCase() : c;
            return units[i] ? `${name} [${units[i]}]` : name;
          }),
          // a first cell starting with '#' makes the row a comment line (documented); keep rows rows
          rows: rows.map((r) => r.map((v, i) => (i === 0 && v.startsWith('#') ? `x${v}` : v))),
        })),
    ),
  );

// ---------------------------------------------------------------------------------------------
// CSV text with random (but valid) quoting, line ends, blank and comment lines

export interface CsvText {
  text: string;
  /** the physical line on which each data row starts */
  rowLines: number[];
  rows: number;
}

const NEEDS_QUOTES = /[",\r\n\t]|^\s|\s$|^#/;

export const csvLayout = fc.record({
  eol: fc.constantFrom('\n', '\r\n'),
  bom: fc.boolean(),
  quoteAll: fc.boolean(),
  quoteSeed: fc.integer(),
  preamble: fc.array(fc.constantFrom('', '# comment', '#,,,', '   '), { maxLength: 3 }),
  gaps: fc.array(fc.constantFrom('', '# note', '# a, "quoted" note'), { maxLength: 4 }),
  gapSeed: fc.integer(),
  finalEol: fc.boolean(),
});

/** Writes a table as CSV, quoting every cell that needs it and others at random; tracks each row's line. */
export type CsvLayout = typeof csvLayout extends fc.Arbitrary<infer L> ? L : never;

export function toCsv(spec: TableSpec, layout: CsvLayout, delimiter = ','): CsvText {
  let seed = layout.quoteSeed | 0;
  const coin = (): boolean => {
    seed = (Math.imul(seed, 1103515245) + 12345) | 0;
    return (seed & 0x10000) !== 0;
  };
  const cell = (v: string): string => {
    if (NEEDS_QUOTES.test(v) || v.includes(delimiter) || layout.quoteAll || coin()) return `"${v.replace(/"/g, '""')}"`;
    return v;
  };
  const lines: string[] = [...layout.preamble];
  lines.push(spec.headerCells.map(cell).join(delimiter));
  let line = lines.length; // the header's line
  const rowLines: number[] = [];
  let gapSeed = layout.gapSeed | 0;
  spec.rows.forEach((row, i) => {
    if (layout.gaps.length && i > 0) {
      gapSeed = (Math.imul(gapSeed, 1103515245) + 12345) | 0;
      const g = layout.gaps[(gapSeed >>> 8) % layout.gaps.length]!;
      if ((gapSeed & 0x100) !== 0) {
        lines.push(g);
        line += 1;
      }
    }
    // an all-empty row of one cell would read as a blank line; the header has at least two columns
    const text = row.map(cell).join(delimiter);
    rowLines.push(line + 1);
    lines.push(text);
    line += 1 + countFeeds(text);
  });
  const body = lines.join(layout.eol) + (layout.finalEol ? layout.eol : '');
  return { text: (layout.bom ? '\ufeff' : '') + body, rowLines, rows: spec.rows.length };
}

function countFeeds(s: string): number {
  let n = 0;
  for (let i = s.indexOf('\n'); i !== -1; i = s.indexOf('\n', i + 1)) n++;
  return n;
}

/** For well-formed CSV the accounting must be exact: every generated row, on its own line. */
export function brokenCsvAccounting(r: Ingested, csv: CsvText, path: string): string | undefined {
  const broken = brokenInvariant(r, path);
  if (broken) return broken;
  if (r.error) return undefined;
  const c = r.counts!;
  if (c.rows !== csv.rows) return `read ${c.rows} rows, wrote ${csv.rows}`;
  const expected = new Set(csv.rowLines);
  const accepted = r.rows.map((x) => x.values.location.line);
  for (const l of accepted) if (!expected.has(l)) return `accepted row on line ${l}, but no row starts there (rows start on ${csv.rowLines.join(',')})`;
  const rejected = new Set(r.findings.filter((f) => f.rule !== 'unknown-column').map((f) => f.location.line));
  for (const l of rejected) if (!expected.has(l)) return `row finding on line ${l}, but no row starts there (rows start on ${csv.rowLines.join(',')})`;
  for (const l of accepted) if (rejected.has(l)) return `line ${l} both accepted and rejected`;
  if (accepted.length + rejected.size !== csv.rows) return `accepted ${accepted.length} + rejected lines ${rejected.size} != ${csv.rows}`;
  return undefined;
}

/** Damage a text: insert, delete or replace a few characters with ones a CSV reader cares about. */
export const mutation = fc.array(
  fc.record({ at: fc.nat(), op: fc.constantFrom('insert', 'delete', 'replace'), ch: fc.constantFrom('"', ',', '\n', '\r', '\t', '#', '\u0000', '\ufeff', 'x', ' ') }),
  { minLength: 1, maxLength: 6 },
);

export function mutate(text: string, edits: { at: number; op: string; ch: string }[]): string {
  let t = text;
  for (const e of edits) {
    const i = t.length === 0 ? 0 : e.at % (t.length + 1);
    if (e.op === 'insert') t = t.slice(0, i) + e.ch + t.slice(i);
    else if (e.op === 'delete') t = t.slice(0, i) + t.slice(i + 1);
    else t = t.slice(0, i) + e.ch + t.slice(i + 1);
  }
  return t;
}

// ---------------------------------------------------------------------------------------------
// JSON and NDJSON records

const jsonLeaf: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(...FORMULAS, ...PHASES, ...MODELS),
  fc.double(),
  fc.integer(),
  fc.boolean(),
  fc.constant(null),
  anyText,
  fc.array(fc.double(), { maxLength: 5 }),
);

const jsonValue: fc.Arbitrary<unknown> = fc.oneof({ weight: 6, arbitrary: jsonLeaf }, { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) });

const KEYS = ['species', 'formula', 'phase', 'dHf', 'dGf', 'S', 'cp_model', 'cp_coeffs', 'cp_Tmin', 'cp_Tmax', 'source', 'other', '__proto__', 'constructor', 'toString', ''];

/** A record: an object of mostly canonical keys, sometimes something that is not an object at all. */
export const jsonRecord: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 8, arbitrary: fc.dictionary(fc.oneof(fc.constantFrom(...KEYS), fc.string({ maxLength: 6 })), jsonValue, { maxKeys: 8 }) },
  { weight: 1, arbitrary: jsonLeaf },
);

/** One record per line: the line of each record is its index + 1 (+1 for the array's opening line). */
export function toJsonArray(records: unknown[]): string {
  return '[\n' + records.map((r) => JSON.stringify(r)).join(',\n') + '\n]\n';
}

export function toNdjson(records: unknown[], badLines: string[]): { text: string; lines: number } {
  const lines = records.map((r) => JSON.stringify(r));
  for (const b of badLines) lines.splice(b.length % (lines.length + 1), 0, b);
  return { text: lines.join('\n') + '\n', lines: lines.length };
}

export const badJsonLine = fc.constantFrom('{"species": "CO",', '{species: "CO"}', '[1,2', 'NaN', '{"a":1}}', '"unterminated', '{"dHf": 1e400}', '{"x": ' + '['.repeat(100) + ']'.repeat(100) + '}');

/** Keys can make a header unusable as a whole: `S [x]` (unknown unit), `dhf` beside `dHf` (the same column twice). */
const JSON_FILE_ERRORS = new Set(['unknown-unit', 'duplicate-column', 'too-many-columns']);

/** For JSON arrays and NDJSON: rows must equal the number of records written (blank lines excepted). */
export function brokenRecordAccounting(r: Ingested, records: number, path: string): string | undefined {
  const broken = brokenInvariant(r, path);
  if (broken) return broken;
  if (r.error) return JSON_FILE_ERRORS.has(r.error.code) || ((r.error.code === 'no-rows' || r.error.code === 'empty-file') && records === 0) ? undefined : `unexpected InputError ${r.error.describe()}`;
  if (r.counts!.rows !== records) return `read ${r.counts!.rows} rows, wrote ${records} records`;
  return undefined;
}

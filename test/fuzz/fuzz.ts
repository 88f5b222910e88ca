// `npm run fuzz`: at least 10^5 generated inputs through the real ingest path, in-process, with the
// invariants of test/fuzz/generators.ts: no exception other than InputError, and every row accounted
// for (rows = accepted + rejected, each on its own line for well-formed CSV).
//
//   npm run fuzz                     # 10^5 table inputs, plus formula, unit and Cp-coefficient fields
//   node dist/test/fuzz/fuzz.js --scale 0.1 --seed 42
import { performance } from 'node:perf_hooks';
import fc from 'fast-check';
import { FormulaError, parseFormula, splitPhaseSuffix } from '../../pipeline/chemistry/formula.js';
import { buildSegment, CpSpecError } from '../../pipeline/cp/index.js';
import { findUnit, type Dimension } from '../../pipeline/units/table.js';
import type { CpModelName, CpSpec } from '../../pipeline/types.js';
import {
  Scratch,
  anyText,
  badJsonLine,
  brokenCsvAccounting,
  brokenInvariant,
  brokenRecordAccounting,
  csvLayout,
  ingest,
  jsonRecord,
  mutate,
  mutation,
  tableSpec,
  toCsv,
  toJsonArray,
  toNdjson,
  type Ingested,
} from './generators.js';

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i === -1 ? undefined : process.argv[i + 1];
}

const scale = Number(arg('scale') ?? 1);
const seed = Number(arg('seed') ?? Date.now() % 2 ** 31);
const scratch = new Scratch();

interface Tally {
  inputs: number;
  refused: number; // InputError: the file as a whole
  rows: number;
  accepted: number;
  rejected: number;
  ms: number;
}

const tallies = new Map<string, Tally>();

function tally(kind: string, r?: Ingested): void {
  let t = tallies.get(kind);
  if (!t) tallies.set(kind, (t = { inputs: 0, refused: 0, rows: 0, accepted: 0, rejected: 0, ms: 0 }));
  t.inputs++;
  if (!r) return;
  if (r.error) t.refused++;
  else {
    t.rows += r.counts!.rows;
    t.accepted += r.counts!.accepted;
    t.rejected += r.counts!.rejected;
  }
}

function fail(kind: string, why: string): never {
  throw new Error(`${kind}: ${why}`);
}

async function run(kind: string, runs: number, prop: fc.IAsyncPropertyWithHooks<any> | fc.IPropertyWithHooks<any>): Promise<void> {
  const n = Math.max(1, Math.round(runs * scale));
  const t0 = performance.now();
  const result = await fc.check(prop as fc.IAsyncProperty<any>, { numRuns: n, seed, endOnFailure: true });
  const t = tallies.get(kind);
  if (t) t.ms = performance.now() - t0;
  if (process.env.FUZZ_MEMORY) console.log(`${kind}: heap ${(process.memoryUsage().heapUsed / 2 ** 20).toFixed(0)} MiB`);
  if (result.failed) {
    console.error(`\nFAILED ${kind} after ${result.numRuns} inputs (seed ${seed}, path ${result.counterexamplePath}):`);
    console.error(String((result.errorInstance as Error | undefined)?.message ?? result.errorInstance));
    console.error('counterexample:', JSON.stringify(result.counterexample)?.slice(0, 4000));
    process.exitCode = 1;
  }
}

const FORMATS = ['csv', 'tsv', 'json', 'ndjson'] as const;

async function main(): Promise<void> {
  const start = performance.now();
  console.log(`thermovet fuzz: seed ${seed}, scale ${scale}`);

  // ---- the ingest path: >= 10^5 inputs at scale 1
  await run('random bytes (any format)', 20_000, fc.asyncProperty(fc.uint8Array({ maxLength: 600 }), fc.constantFrom(...FORMATS), async (bytes, format) => {
    const path = scratch.overwrite(bytes, format);
    const r = await ingest(path, format);
    tally('random bytes (any format)', r);
    const broken = brokenInvariant(r, path);
    if (broken) fail('bytes', broken);
  }));
  await run('CSV, random quoting and layout', 30_000, fc.asyncProperty(tableSpec, csvLayout, async (spec, layout) => {
    const csv = toCsv(spec, layout);
    const path = scratch.overwrite(csv.text, 'csv');
    const r = await ingest(path, 'csv');
    tally('CSV, random quoting and layout', r);
    const broken = brokenCsvAccounting(r, csv, path);
    if (broken) fail('csv', broken);
  }));
  await run('TSV, random quoting and layout', 10_000, fc.asyncProperty(tableSpec, csvLayout, async (spec, layout) => {
    const tsv = toCsv(spec, layout, '\t');
    const path = scratch.overwrite(tsv.text, 'tsv');
    const r = await ingest(path, 'tsv');
    tally('TSV, random quoting and layout', r);
    const broken = brokenCsvAccounting(r, tsv, path);
    if (broken) fail('tsv', broken);
  }));
  await run('damaged CSV', 20_000, fc.asyncProperty(tableSpec, csvLayout, mutation, async (spec, layout, edits) => {
    const path = scratch.overwrite(mutate(toCsv(spec, layout).text, edits), 'csv');
    const r = await ingest(path, 'csv');
    tally('damaged CSV', r);
    const broken = brokenInvariant(r, path);
    if (broken) fail('damaged csv', broken);
  }));
  await run('JSON arrays of random records', 10_000, fc.asyncProperty(fc.array(jsonRecord, { maxLength: 12 }), async (records) => {
    const path = scratch.overwrite(toJsonArray(records), 'json');
    const r = await ingest(path, 'json');
    tally('JSON arrays of random records', r);
    const broken = brokenRecordAccounting(r, records.length, path);
    if (broken) fail('json', broken);
  }));
  await run('NDJSON with bad lines', 10_000, fc.asyncProperty(fc.array(jsonRecord, { maxLength: 10 }), fc.array(badJsonLine, { maxLength: 3 }), async (records, bad) => {
    const nd = toNdjson(records, bad);
    const path = scratch.overwrite(nd.text, 'ndjson');
    const r = await ingest(path, 'ndjson');
    tally('NDJSON with bad lines', r);
    const broken = brokenRecordAccounting(r, nd.lines, path);
    if (broken) fail('ndjson', broken);
  }));
  await run('damaged JSON', 5_000, fc.asyncProperty(fc.array(jsonRecord, { maxLength: 8 }), mutation, async (records, edits) => {
    const path = scratch.overwrite(mutate(toJsonArray(records), edits), 'json');
    const r = await ingest(path, 'json');
    tally('damaged JSON', r);
    const broken = brokenInvariant(r, path);
    if (broken) fail('damaged json', broken);
  }));

  // ---- fields, in-process (cheap): they ride along, they are not counted in the 10^5
  const formulaChars = fc.constantFrom(...'HCONSFeClCaMgNaKXxyz0123456789()[]{}+-^·*. ₂²⁻⁺e'.split(''), '(g)', '(aq)');
  await run('formulas', 50_000, fc.property(fc.oneof(fc.array(formulaChars, { maxLength: 24 }).map((a) => a.join('')), anyText), (text) => {
    tally('formulas');
    try {
      parseFormula(splitPhaseSuffix(text).formula);
    } catch (e) {
      if (!(e instanceof FormulaError)) fail('formula', `${JSON.stringify(text)} threw ${String(e)}`);
    }
  }));
  const dims: Dimension[] = ['molar-energy', 'molar-entropy', 'temperature', 'pressure', 'heat-capacity'];
  await run('unit strings', 50_000, fc.property(anyText, fc.constantFrom(...dims), (text, dim) => {
    tally('unit strings');
    findUnit(text, dim);
  }));
  const coeff = fc.oneof(fc.double(), fc.double({ min: -1e3, max: 1e3, noNaN: true }));
  await run('Cp coefficient sets', 50_000, fc.property(
    fc.constantFrom<CpModelName>('poly', 'shomate', 'nasa7', 'nasa9', 'table'),
    fc.array(coeff, { maxLength: 11 }),
    fc.array(fc.oneof(fc.integer({ min: -3, max: 4 }), fc.double()), { maxLength: 11 }),
    fc.array(fc.double({ min: -10, max: 6000 }), { maxLength: 11 }),
    fc.double(),
    fc.double(),
    (model, coeffs, exponents, temps, Tmin, Tmax) => {
      tally('Cp coefficient sets');
      const spec: CpSpec = { model, coeffs, exponents, temps, unit: 'J/(mol K)', unitFactor: 1, Tmin, Tmax, location: { file: 'fuzz.csv', line: 2 } };
      try {
        const seg = buildSegment(spec);
        const T = Number.isFinite(Tmin + Tmax) ? (Tmin + Tmax) / 2 : 500;
        seg.cp(T);
        seg.intCp(T);
        seg.intCpOverT(T);
      } catch (e) {
        if (!(e instanceof CpSpecError)) fail('cp', `${JSON.stringify(spec)} threw ${String(e)}`);
      }
    },
  ));

  const total = performance.now() - start;
  const pad = (s: string | number, n: number) => String(s).padStart(n);
  console.log(`\n${'kind'.padEnd(34)}${pad('inputs', 9)}${pad('refused', 9)}${pad('rows', 10)}${pad('accepted', 10)}${pad('rejected', 10)}${pad('seconds', 9)}`);
  let tableInputs = 0;
  for (const [kind, t] of tallies) {
    const isTable = !['formulas', 'unit strings', 'Cp coefficient sets'].includes(kind);
    if (isTable) tableInputs += t.inputs;
    console.log(`${kind.padEnd(34)}${pad(t.inputs, 9)}${pad(isTable ? t.refused : '-', 9)}${pad(isTable ? t.rows : '-', 10)}${pad(isTable ? t.accepted : '-', 10)}${pad(isTable ? t.rejected : '-', 10)}${pad((t.ms / 1000).toFixed(1), 9)}`);
  }
  console.log(`\n${tableInputs} generated tables through the ingest path, ${[...tallies.values()].reduce((a, t) => a + t.inputs, 0)} inputs in all, ${(total / 1000).toFixed(1)} s; seed ${seed}`);
  console.log(process.exitCode ? 'FAILED (see above)' : 'no uncaught exception; rows = accepted + rejected for every table');
  scratch.dispose();
}

main().catch((e) => {
  console.error(e);
  scratch.dispose();
  process.exitCode = 1;
});

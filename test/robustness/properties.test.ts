// Property-based robustness: generated tables and fields never crash the reader, and every row is
// accounted for. Small runs here (seconds); `npm run fuzz` runs the same generators 10^5 times.
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { FormulaError, parseFormula, splitPhaseSuffix } from '../../pipeline/chemistry/formula.js';
import { buildSegment, CpSpecError } from '../../pipeline/cp/index.js';
import type { TableFormat } from '../../pipeline/ingest/events.js';
import { findUnit, type Dimension } from '../../pipeline/units/table.js';
import type { CpModelName, CpSpec } from '../../pipeline/types.js';
import {
  Scratch,
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
} from '../fuzz/generators.js';

const RUNS = 300;
const scratch = new Scratch();
afterAll(() => scratch.dispose());

const FORMATS: TableFormat[] = ['csv', 'tsv', 'json', 'ndjson'];

describe('generated tables through ingestTable', () => {
  it('random bytes, read as every format: an InputError or every row accounted for', async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 400 }), fc.constantFrom(...FORMATS), async (bytes, format) => {
        const path = scratch.write(bytes, format);
        const broken = brokenInvariant(await ingest(path, format), path);
        expect(broken).toBeUndefined();
      }),
      { numRuns: RUNS },
    );
  });

  it('random CSV with random quoting, line ends, BOM, blank and comment lines: rows = accepted + rejected, each on its line', async () => {
    await fc.assert(
      fc.asyncProperty(tableSpec, csvLayout, async (spec, layout) => {
        const csv = toCsv(spec, layout);
        const path = scratch.write(csv.text, 'csv');
        const broken = brokenCsvAccounting(await ingest(path, 'csv'), csv, path);
        expect(broken).toBeUndefined();
      }),
      { numRuns: RUNS },
    );
  });

  it('the same tables as TSV', async () => {
    await fc.assert(
      fc.asyncProperty(tableSpec, csvLayout, async (spec, layout) => {
        const tsv = toCsv(spec, layout, '\t');
        const path = scratch.write(tsv.text, 'tsv');
        expect(brokenCsvAccounting(await ingest(path, 'tsv'), tsv, path)).toBeUndefined();
      }),
      { numRuns: RUNS / 2 },
    );
  });

  it('damaged CSV (quotes, delimiters, line ends, NUL inserted or deleted): never a crash, never a lost count', async () => {
    await fc.assert(
      fc.asyncProperty(tableSpec, csvLayout, mutation, async (spec, layout, edits) => {
        const text = mutate(toCsv(spec, layout).text, edits);
        const path = scratch.write(text, 'csv');
        expect(brokenInvariant(await ingest(path, 'csv'), path)).toBeUndefined();
      }),
      { numRuns: RUNS },
    );
  });

  it('JSON arrays of random records: one row per record', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(jsonRecord, { maxLength: 12 }), async (records) => {
        const path = scratch.write(toJsonArray(records), 'json');
        expect(brokenRecordAccounting(await ingest(path, 'json'), records.length, path)).toBeUndefined();
      }),
      { numRuns: RUNS },
    );
  });

  it('NDJSON with bad lines among good ones: one row per line, the bad ones rejected on their line', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(jsonRecord, { maxLength: 10 }), fc.array(badJsonLine, { maxLength: 3 }), async (records, bad) => {
        const nd = toNdjson(records, bad);
        const path = scratch.write(nd.text, 'ndjson');
        const r = await ingest(path, 'ndjson');
        expect(brokenRecordAccounting(r, nd.lines, path)).toBeUndefined();
        if (!r.error) expect(r.counts!.rejected).toBeGreaterThanOrEqual(bad.length);
      }),
      { numRuns: RUNS },
    );
  });
});

describe('generated fields', () => {
  const formulaChars = fc.constantFrom(...'HCONSFeClCaMgNaKXxyz0123456789()[]{}+-^·*. ₂²⁻⁺e'.split(''), '(g)', '(aq)', '(cr, graphite)');

  it('parseFormula throws only FormulaError, on formula-like and on arbitrary text', () => {
    fc.assert(
      fc.property(fc.oneof(fc.array(formulaChars, { maxLength: 24 }).map((a) => a.join('')), fc.string({ maxLength: 30 }), fc.string({ unit: 'binary', maxLength: 30 })), (text) => {
        try {
          const f = parseFormula(splitPhaseSuffix(text).formula);
          for (const n of Object.values(f.elements)) expect(Number.isFinite(n) && n > 0).toBe(true);
          expect(Number.isFinite(f.charge)).toBe(true);
        } catch (e) {
          if (!(e instanceof FormulaError)) throw e;
        }
      }),
      { numRuns: RUNS * 3 },
    );
  });

  it('findUnit never throws, and what it finds converts finitely', () => {
    const dims: Dimension[] = ['molar-energy', 'molar-entropy', 'temperature', 'pressure', 'heat-capacity'];
    const unitChars = fc.constantFrom(...'JkcalmolKgdeCbarPt()/ ·*-^1°'.split(''));
    fc.assert(
      fc.property(fc.oneof(fc.array(unitChars, { maxLength: 16 }).map((a) => a.join('')), fc.string({ maxLength: 20 })), fc.constantFrom(...dims), (text, dim) => {
        const u = findUnit(text, dim);
        if (u) expect(Number.isFinite(u.factor) && Number.isFinite(u.offset)).toBe(true);
      }),
      { numRuns: RUNS * 3 },
    );
  });

  it('buildSegment throws only CpSpecError for any coefficient set, and what it builds evaluates in range', () => {
    const coeff = fc.oneof(fc.double(), fc.double({ min: -1e3, max: 1e3, noNaN: true }), fc.constantFrom(0, -0, 1e308, -1e-308, Number.MIN_VALUE));
    const spec = fc.record({
      model: fc.constantFrom<CpModelName>('poly', 'shomate', 'nasa7', 'nasa9', 'table', 'nasa8' as CpModelName),
      coeffs: fc.array(coeff, { maxLength: 11 }),
      exponents: fc.option(fc.array(fc.oneof(fc.integer({ min: -3, max: 4 }), fc.double()), { maxLength: 11 }), { nil: undefined }),
      temps: fc.option(fc.array(fc.double({ min: -10, max: 6000 }), { maxLength: 11 }), { nil: undefined }),
      unitFactor: fc.constantFrom(1, 4.184, 8.314462618),
      Tmin: fc.oneof(fc.double({ min: 1, max: 3000, noNaN: true }), fc.double()),
      Tmax: fc.oneof(fc.double({ min: 1, max: 6000, noNaN: true }), fc.double()),
    });
    fc.assert(
      fc.property(spec, (s) => {
        const full: CpSpec = { ...s, unit: 'J/(mol K)', location: { file: 'gen.csv', line: 2 } };
        if (full.exponents === undefined) delete full.exponents;
        if (full.temps === undefined) delete full.temps;
        try {
          const seg = buildSegment(full);
          const T = Number.isFinite(s.Tmin) && Number.isFinite(s.Tmax) ? (s.Tmin + s.Tmax) / 2 : 500;
          // may be any number for hostile coefficients, but must not throw
          seg.cp(T);
          seg.intCp(T);
          seg.intCpOverT(T);
          seg.embedded?.H(T);
          seg.embedded?.S(T);
        } catch (e) {
          if (!(e instanceof CpSpecError)) throw e;
        }
      }),
      { numRuns: RUNS * 3 },
    );
  });
});

// SARIF 2.1.0: validates against the vendored schema (schemas/README.md names its source), carries rules,
// levels, locations down to the cell, waivers as suppressions; JSON and SARIF are byte-identical on reruns.
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import { describe, expect, it } from 'vitest';
import { RULES } from '../../pipeline/rules/index.js';
import { pathToUri, renderSarif, sarifChunks, splitColumns } from '../../reports/sarif.js';
import { readReport, thermovet } from '../cli/run.js';
import { makeReport } from './fixture.js';

const ajv = new Ajv2020({ allErrors: true, strict: false });
addFormats.default(ajv);
const validateSarif = ajv.compile(JSON.parse(readFileSync('schemas/sarif-2.1.0.schema.json', 'utf8')));

function valid(text: string): any {
  const log = JSON.parse(text);
  if (!validateSarif(log)) throw new Error(`SARIF does not validate: ${ajv.errorsText(validateSarif.errors)}`);
  return log;
}

const dir = mkdtempSync(join(tmpdir(), 'thermovet-sarif-'));

describe('renderSarif', () => {
  it('is written in pieces with the bytes JSON.stringify(log, null, 2) gives: no findings, a few, and more than one piece holds', () => {
    const r = makeReport({ hostile: true });
    for (const n of [0, 1, r.findings.length, 31, 32, 33, 100]) {
      const findings = Array.from({ length: n }, (_, i) => ({ ...r.findings[i % r.findings.length]!, location: { file: 'big.csv', line: i + 2 } }));
      const text = [...sarifChunks({ ...r, findings })].join('');
      expect(text).toBe(JSON.stringify(valid(text), null, 2) + '\n');
      expect(valid(text).runs[0].results).toHaveLength(n);
    }
  });

  it('the schema itself rejects a broken log (so validation can fail)', () => {
    expect(validateSarif({ version: '2.1.0', runs: [{ tool: { driver: { name: 'x' } }, results: [{ message: { text: 'm' }, level: 'fatal' }] }] })).toBe(false);
    expect(validateSarif({ version: '2.1.0' })).toBe(false);
  });

  it('a hand-made report gives a valid log: one run, every rule, each result with rule, index, level, message, location', () => {
    const log = valid(renderSarif(makeReport({ hostile: true })));
    expect(log.version).toBe('2.1.0');
    expect(log.runs).toHaveLength(1);
    const run = log.runs[0];
    expect(run.tool.driver.name).toBe('thermovet');
    expect(run.tool.driver.rules.map((r: { id: string }) => r.id)).toEqual(RULES.map((r) => r.id));
    run.tool.driver.rules.forEach((r: any, i: number) => {
      expect(r.shortDescription.text.length).toBeGreaterThan(10);
      expect(r.help.text).toContain(RULES[i]!.docs);
      // the rule's doc page itself, when the page exists in this checkout
      if (existsSync(RULES[i]!.docs.replace(/#.*$/, ''))) expect(r.help.markdown).toMatch(/^#/);
      else expect(r.help.markdown).toBeUndefined();
    });
    expect(run.tool.driver.rules.find((r: any) => r.id === 'waiver-expired').help.markdown).toMatch(/^# waiver-expired/);
    const gh = run.results.find((r: any) => r.properties.species === 'CO2');
    expect(gh).toMatchObject({ ruleId: 'gibbs-helmholtz', level: 'error', locations: [{ physicalLocation: { artifactLocation: { uri: 'datasets/fixture/gases.csv' }, region: { startLine: 4 } } }] });
    expect(run.tool.driver.rules[gh.ruleIndex].id).toBe('gibbs-helmholtz');
    expect(gh.message.text).toMatch(/^CO2 \(g\): /);
    expect(gh.message.text).toContain('moves ln K by up to 5.83');
  });

  it('a waived finding is a result with an external suppression naming who and why', () => {
    const run = valid(renderSarif(makeReport())).runs[0];
    const dup = run.results.find((r: any) => r.ruleId === 'duplicate-row');
    expect(dup.level).toBe('warning');
    expect(dup.suppressions).toEqual([expect.objectContaining({ kind: 'external', justification: expect.stringContaining('A. Reviewer') })]);
    expect(run.results.filter((r: any) => r.suppressions)).toHaveLength(1);
  });

  it('info findings are notes', () => {
    const r = makeReport();
    r.findings[0]!.severity = 'info';
    expect(valid(renderSarif(r)).runs[0].results[0].level).toBe('note');
  });

  it('paths become URI references; cells become code-point columns, quotes respected', () => {
    expect(pathToUri('data/my table #1.csv')).toBe('data/my%20table%20%231.csv');
    expect(pathToUri('/abs/x.csv')).toBe('file:///abs/x.csv');
    expect(splitColumns('a,"b,c",dé,', ',')).toEqual([
      [1, 2],
      [3, 8],
      [9, 11],
      [12, 12],
    ]);
    expect(splitColumns('a\t"open', '\t')).toEqual([[1, 2]]); // the record goes on past this line: no column for the rest
  });
});

describe('thermovet check --sarif (built CLI)', () => {
  it('the demo SARIF validates, points at the offending cell, and lists the input with its hash', () => {
    const out = join(dir, 'demo.sarif');
    const json = join(dir, 'demo.json');
    const r = thermovet(['check', '--manifest', 'datasets/demo/manifest.yaml', '--sarif', out, '--json', json, '--fail-on', 'never', '-q']);
    expect(r.code).toBe(0);
    const run = valid(readFileSync(out, 'utf8')).runs[0];
    const report = readReport(json);
    expect(run.results).toHaveLength(report.findings.length);
    expect(run.artifacts[0]).toMatchObject({ location: { uri: 'datasets/demo/properties.csv' }, hashes: { 'sha-256': report.provenance.inputs[0].sha256 } });
    // every result with a column names exactly the cell text of that field on that line
    const lines = readFileSync('datasets/demo/properties.csv', 'utf8').split(/\r?\n/);
    let withColumn = 0;
    for (const res of run.results) {
      const reg = res.locations[0].physicalLocation.region;
      if (reg.startColumn === undefined) continue;
      withColumn++;
      const text = Array.from(lines[reg.startLine - 1]!).slice(reg.startColumn - 1, reg.endColumn - 1).join('');
      const fields = lines[reg.startLine - 1]!.split(',');
      expect(text).toBe(fields[res.properties.fieldPosition - 1]);
    }
    expect(withColumn).toBeGreaterThan(0);
  });

  it('a quoted cell holding the delimiter does not shift the column of the cells after it', () => {
    // H2O(g): CODATA Key Values (1989) ΔfH°, S°; NIST-JANAF 4th ed. (1998) ΔfG°; ΔfG° given a sign slip on purpose
    const p = join(dir, 'q.csv');
    writeFileSync(p, 'species,formula,phase,dHf,dGf,S\n"water, vapour",H2O,g,-241.826,228.582,188.835\n');
    const out = join(dir, 'q.sarif');
    thermovet(['check', p, '--sarif', out, '-q']);
    const res = valid(readFileSync(out, 'utf8')).runs[0].results.find((x: any) => x.ruleId === 'gibbs-helmholtz');
    // "water, vapour" is characters 1–15, so 228.582 (the fifth field) is characters 32–38
    expect(res.locations[0].physicalLocation.region).toEqual({ startLine: 2, startColumn: 32, endColumn: 39 });
  });

  it('JSON, SARIF and HTML are byte-identical on two runs with --deterministic; the JSON validates', () => {
    const files = (tag: string) => ['json', 'sarif', 'html'].map((ext) => join(dir, `det-${tag}.${ext}`));
    for (const tag of ['a', 'b']) {
      const [json, sarif, html] = files(tag);
      const r = thermovet(['check', '--manifest', 'datasets/demo/manifest.yaml', '--json', json!, '--sarif', sarif!, '--html', html!, '--deterministic', '--fail-on', 'never', '-q']);
      expect(r.code).toBe(0);
    }
    const [a, b] = [files('a'), files('b')];
    for (let i = 0; i < 3; i++) expect(readFileSync(a[i]!).equals(readFileSync(b[i]!))).toBe(true);
    expect(readReport(a[0]!).provenance.generatedAt).toBe('1970-01-01T00:00:00.000Z');
  });
});

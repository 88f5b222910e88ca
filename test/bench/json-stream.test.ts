// The streamed JSON writer: the report's content exactly as JSON.stringify gives it, each element of a
// top-level array on its own line, and the same bytes whether written to disk or rendered to a string.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { check } from '../../pipeline/check.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { Report } from '../../pipeline/types.js';
import { findingForJson, jsonChunks, renderJson, writeJson } from '../../reports/json.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-json-'));

/** What JSON.stringify makes of the report (findings with file and line lifted, lists as arrays): the content oracle. */
function plain(report: Report): unknown {
  const out: Record<string, unknown> = { ...report };
  if (report.findings) out.findings = Array.from(report.findings, findingForJson);
  if (report.species) out.species = [...report.species];
  return JSON.parse(JSON.stringify(out)) as unknown;
}

/** Checks text against the oracle, and that each top-level array element is exactly one line. */
function expectReport(text: string, report: Report): void {
  expect(JSON.parse(text)).toEqual(plain(report));
  expect(text.endsWith('}\n')).toBe(true);
  const lines = text.split('\n');
  for (const key of ['findings', 'species', 'reactions'] as const) {
    const items = (report as unknown as Record<string, unknown[] | undefined>)[key];
    if (!items || items.length === 0) continue;
    const open = lines.indexOf(`  "${key}": [`);
    expect(open).toBeGreaterThan(0);
    const body = lines.slice(open + 1, open + 1 + items.length);
    expect(lines[open + 1 + items.length]).toMatch(/^  \],?$/);
    const expected = (plain(report) as Record<string, unknown[]>)[key]!;
    body.forEach((line, i) => {
      expect(line.startsWith('    ')).toBe(true);
      expect(JSON.parse(line.replace(/,$/, ''))).toEqual(expected[i]);
    });
  }
}

describe('streamed JSON report', () => {
  it('equals renderJson on the demo dataset', async () => {
    const report = await check(normalizeOptions({ tables: [], manifest: 'datasets/demo/manifest.yaml' }), { version: '0.0.0', generatedAt: '1970-01-01T00:00:00.000Z' });
    expect(report.findings.length).toBeGreaterThan(0);
    const out = join(dir, 'demo.json');
    writeJson(out, report);
    expect(readFileSync(out, 'utf8')).toBe(renderJson(report));
    expectReport(renderJson(report), report);
    // the objects keep their indentation
    expect(renderJson(report)).toContain('\n  "summary": {\n    "rows": ');
  });

  it('gives the content of JSON.stringify on awkward content: empty arrays, undefined keys, line feeds and quotes in text', () => {
    const report = {
      tool: { name: 'thermovet', version: '0' },
      dataset: undefined,
      summary: { rows: 1, accepted: 0, rejected: 1, species: 0, errors: 1, warnings: 0, infos: 0 },
      findings: [
        { rule: 'bad-number', severity: 'error', messageId: 'x', params: { text: 'a\nb "q" \u2028 \\' }, message: 'line1\nline2', location: { file: 'f.csv', line: 2 } },
        { rule: 'r', severity: 'info', messageId: 'y', params: {}, message: '', location: { file: 'f.csv', line: 3, column: undefined } },
      ],
      species: [],
      reactions: [{ id: 'R1', equation: 'A = B', file: 'r.csv', line: 2, balanced: true, points: [] }],
      provenance: { generatedAt: 't', inputs: [], reference: { path: 'p', sha256: 's' }, options: { nested: [[1, 2], []] }, rules: ['a'] },
    } as unknown as Report;
    expectReport(renderJson(report), report);
    expect(renderJson(report)).toContain('\n    {"rule":"bad-number","severity":"error","file":"f.csv","line":2,"message":"line1\\nline2",');
    expect(renderJson({} as Report)).toBe('{}\n');
    // arrays longer than one serialisation batch, ending on and off a batch boundary
    for (const n of [511, 512, 513, 1024, 1300]) {
      const many = { ...report, findings: Array.from({ length: n }, (_, i) => ({ ...[...report.findings][i % 2]!, location: { file: 'f.csv', line: i + 2 } })) } as Report;
      expectReport([...jsonChunks(many)].join(''), many);
    }
  });

  it('writes species summaries made as they are read (check() gives a list, not an array) like an array of them', async () => {
    const report = await check(normalizeOptions({ tables: [], manifest: 'datasets/demo/manifest.yaml' }), { version: '0.0.0', generatedAt: '1970-01-01T00:00:00.000Z' });
    expect(Array.isArray(report.species)).toBe(false);
    const asArray = { ...report, species: [...report.species!] };
    expect(asArray.species.length).toBe(report.species!.length);
    expect(asArray.species.map((s) => s.name)).toContain('CO2');
    expect(renderJson(report)).toBe(renderJson(asArray));
    expectReport(renderJson(report), report);
    // a list longer than one batch, and an empty one
    const summary = asArray.species[0]!;
    for (const n of [0, 512, 700]) {
      const list = { length: n, *[Symbol.iterator]() { for (let i = 0; i < n; i++) yield { ...summary, key: `s${i}` }; } };
      const arr = [...list];
      expect([...jsonChunks({ ...report, species: list })].join('')).toBe(renderJson({ ...report, species: arr }));
      expectReport(renderJson({ ...report, species: arr }), { ...report, species: arr });
    }
  });

  it('reports an unwritable path as exit-2 input error and leaves no file behind', () => {
    const blocker = join(dir, 'a-file');
    writeFileSync(blocker, 'x');
    expect(() => writeJson(join(blocker, 'report.json'), {} as Report)).toThrow(/cannot write the report/);
  });
});

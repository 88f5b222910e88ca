// The catalogue of malformed and hostile inputs (test/fixtures/catalogue.json), each run through the
// built CLI: the exit code, a message naming file and line, no stack trace, every row accounted for.
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { leaks, readValidReport, runCliAsync } from './cli-run.js';

interface Case {
  id: string;
  description: string;
  file: string | null;
  args: string[];
  exit: 1 | 2;
  stream: 'stdout' | 'stderr';
  message: string;
  counts?: { rows: number; accepted: number; rejected: number };
  findings?: { rule: string; line: number }[];
}

const FIXTURES = join('test', 'fixtures');
const catalogue = JSON.parse(readFileSync(join(FIXTURES, 'catalogue.json'), 'utf8')) as { cases: Case[] };
const out = mkdtempSync(join(tmpdir(), 'thermovet-catalogue-'));

describe('catalogue of malformed input', () => {
  it('is large and its ids are unique', () => {
    const ids = catalogue.cases.map((c) => c.id);
    expect(ids.length).toBeGreaterThanOrEqual(40);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of catalogue.cases) {
      if (c.exit === 1) expect(c.counts, c.id).toBeDefined();
    }
  });

  it.concurrent.each(catalogue.cases.map((c) => [c.id, c] as const))('%s', async (_, c) => {
    const report = join(out, `${c.id}.json`);
    const args = c.args.map((a) => (a === '{file}' ? join(FIXTURES, c.file!) : a));
    const r = await runCliAsync([...args, '--json', report]);
    const where = `${c.id} (${c.description})\nstdout:\n${r.stdout.slice(0, 2000)}\nstderr:\n${r.stderr.slice(0, 2000)}`;
    expect(r.code, where).toBe(c.exit);
    expect(leaks(r.stdout + r.stderr), where).toEqual([]);
    expect(r[c.stream], where).toMatch(new RegExp(c.message));
    if (c.exit === 2) {
      expect(r.stdout, where).toBe('');
      expect(r.stderr.trimEnd().split('\n').length, where).toBeLessThanOrEqual(3);
      expect(existsSync(report), `${where}\nno report is written for unusable input`).toBe(false);
      return;
    }
    const data = readValidReport(report);
    const s = data.summary;
    expect(s.rows, where).toBe(s.accepted + s.rejected);
    expect({ rows: s.rows, accepted: s.accepted, rejected: s.rejected }, where).toEqual(c.counts);
    for (const f of c.findings ?? []) {
      const hit = data.findings.find((x: any) => x.rule === f.rule && x.location.line === f.line);
      expect(hit, `${where}\nexpected a ${f.rule} finding on line ${f.line}`).toBeDefined();
    }
    // every rejected row has at least one error finding on its line
    const errorLines = new Set(data.findings.filter((x: any) => x.severity === 'error').map((x: any) => `${x.location.file}:${x.location.line}`));
    expect(errorLines.size, where).toBeGreaterThanOrEqual(s.rejected);
  });
});

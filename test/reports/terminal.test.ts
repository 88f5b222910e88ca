// Terminal niceties: the progress bar (only on a TTY, only after about a second, erased at the end),
// --quiet, and output to a closed pipe ending quietly.
import { spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { createProgress, estimateRows } from '../../reports/progress.js';
import fc from 'fast-check';
import { renderTerminal, worstFindings } from '../../reports/terminal.js';
import type { Finding } from '../../pipeline/types.js';
import { makeReport } from './fixture.js';
import { CLI, NO_STACK, thermovet } from '../cli/run.js';

function fakeStream(isTTY: boolean) {
  const writes: string[] = [];
  return { writes, stream: { isTTY, columns: 100, write: (s: string) => (writes.push(s), true) } };
}

describe('progress bar', () => {
  it('draws nothing in the first second, then a bar with a percentage, and erases itself at the end', () => {
    let t = 0;
    const { writes, stream } = fakeStream(true);
    const p = createProgress({ stream, enabled: true, now: () => t });
    t = 500;
    p.update('reading rows', 10, 100);
    expect(writes).toEqual([]);
    t = 1200;
    p.update('reading rows', 40, 100);
    expect(writes).toHaveLength(1);
    expect(writes[0]).toMatch(/^\r\u001b\[2Kreading rows \[#{10}-{14}\] 40%  40\/100  1\.2 s$/);
    t = 1250; // redrawn at most ten times a second
    p.update('reading rows', 41, 100);
    expect(writes).toHaveLength(1);
    t = 1400;
    p.update('drawing charts', 3, 3);
    expect(writes[1]).toContain('100%');
    p.finish();
    expect(writes[2]).toBe('\r\u001b[2K');
    p.finish();
    expect(writes).toHaveLength(3);
  });

  it('never draws when the stream is not a terminal, or when quiet', () => {
    for (const [tty, enabled] of [
      [false, true],
      [true, false],
    ] as const) {
      let t = 0;
      const { writes, stream } = fakeStream(tty);
      const p = createProgress({ stream, enabled, now: () => t });
      t = 5000;
      p.update('reading rows', 1, 2);
      p.finish();
      expect(writes).toEqual([]);
    }
  });

  it('estimates rows from size and line density', () => {
    const dir = mkdtempSync(join(tmpdir(), 'thermovet-progress-'));
    const p = join(dir, 'rows.csv');
    writeFileSync(p, 'a,b\n'.repeat(50000)); // 200 000 bytes, 50 000 lines: the sample sees 16 384 of them
    expect(estimateRows([p])).toBe(50000);
    expect(estimateRows([join(dir, 'missing.csv')])).toBe(0);
  });
});

describe('the CLI at the terminal', () => {
  it('--quiet prints nothing; stderr stays empty when it is not a terminal', () => {
    const r = thermovet(['check', 'datasets/demo/properties.csv', '--quiet', '--fail-on', 'never']);
    expect(r.code).toBe(0);
    expect(r.stdout).toBe('');
    expect(r.stderr).toBe('');
    const loud = thermovet(['check', 'datasets/demo/properties.csv', '--fail-on', 'never']);
    expect(loud.stdout).toMatch(/verdict/);
    expect(loud.stderr).toBe(''); // no progress bar on a pipe
    expect(loud.stdout).not.toMatch(/\u001b\[/); // and no colour
  });

  it('output to a closed pipe ends quietly: no stack trace, the usual exit code', async () => {
    const child = spawn(process.execPath, [CLI, 'check', 'datasets/demo/properties.csv', '--fail-on', 'never'], { stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout.destroy(); // the reader went away before the first byte, as `| head -0` would
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    const code = await new Promise<number | null>((res) => child.on('close', (c) => res(c)));
    expect(stderr).not.toMatch(NO_STACK);
    expect(stderr).not.toMatch(/EPIPE|Error/);
    expect(code).toBe(0);
  });

  it('`thermovet check … | head -1` prints one line and no error', async () => {
    const child = spawn('bash', ['-c', `set -o pipefail; "${process.execPath}" ${CLI} check datasets/demo/properties.csv --fail-on never | head -1`], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (d: Buffer) => (out += d.toString()));
    child.stderr.on('data', (d: Buffer) => (err += d.toString()));
    const code = await new Promise<number | null>((res) => child.on('close', (c) => res(c)));
    expect(out.trim().split('\n')).toHaveLength(1);
    expect(out).toMatch(/^thermovet /);
    expect(err).toBe('');
    expect(code).toBe(0);
  });
});

describe('the terminal summary', () => {
  it('cuts a species name of a whole paragraph in its group heading, escaping its control characters', () => {
    const name = 'Q'.repeat(5000) + '\u001b[31m';
    const report = makeReport();
    report.findings = [{ rule: 'gibbs-helmholtz', severity: 'error', messageId: 'm', params: {}, message: 'residual', location: { file: 't.csv', line: 2 }, species: name, phase: 'g' }];
    const text = renderTerminal(report, { color: false, failOn: 'error' });
    const heading = text.split('\n').find((l) => l.startsWith('  Q'))!;
    expect(heading.length).toBeLessThan(100);
    expect(heading.endsWith('…')).toBe(true);
    expect(text).not.toContain('\u001b');
  });
});

describe('worst findings', () => {
  const RANK = { error: 0, warning: 1, info: 2 } as const;
  const impact = (f: Finding): number => f.impact?.reduce((m, i) => Math.max(m, i.maxAbsDeltaLnK), 0) ?? 0;
  /** the definition: sort everything (stable), keep, take the first `limit` */
  const oracle = (fs: Finding[], limit: number, keep: (f: Finding) => boolean): Finding[] =>
    [...fs].sort((a, b) => Number(!!a.waived) - Number(!!b.waived) || RANK[a.severity] - RANK[b.severity] || impact(b) - impact(a)).filter(keep).slice(0, limit);
  const findingArb = fc.record({
    severity: fc.constantFrom<Finding['severity']>('error', 'warning', 'info'),
    waived: fc.boolean(),
    impact: fc.option(fc.constantFrom(0, 0.5, 2, 7), { nil: undefined }),
    line: fc.nat(1000),
  }).map(({ severity, waived, impact: m, line }): Finding => ({
    rule: 'r', severity, messageId: 'm', params: {}, message: `line ${line}`, location: { file: 'f.csv', line },
    ...(waived ? { waived: { by: 'a', reason: 'b', expires: '2030-01-01' } } : {}),
    ...(m !== undefined ? { impact: [{ reaction: 'R', maxAbsDeltaLnK: m }] } : {}),
  }));

  it('selects in one pass exactly what sorting all of them and taking the first would give', () => {
    fc.assert(
      fc.property(fc.array(findingArb, { maxLength: 80 }), fc.nat(30), fc.boolean(), (fs, limit, dropInfo) => {
        const keep = (f: Finding): boolean => !dropInfo || f.severity !== 'info';
        expect(worstFindings(fs, limit, keep)).toEqual(oracle(fs, limit, keep));
      }),
      { numRuns: 500 },
    );
  });
});

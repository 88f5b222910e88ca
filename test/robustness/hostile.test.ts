// Hostile text in species names, formulas, sources and headers: the terminal never receives a raw
// escape or control character from data; the JSON report carries the text unchanged, as data.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { leaks, readValidReport, runCli } from './cli-run.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-hostile-'));
const CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/; // \t and \n are the tool's own layout

const ESC = '\u001b';
const NAMES = [
  '<script>alert(1)</script>',
  `${ESC}[31mred${ESC}[0m`,
  `${ESC}]8;;http://example.invalid${ESC}\\link${ESC}]8;;${ESC}\\`,
  `${ESC}]0;title\u0007`,
  '=HYPERLINK("http://example.invalid","x")',
  '+SUM(A1:A9)',
  '-2+3',
  '@cmd',
  'bell\u0007back\u0008cr\rdel\u007f',
  'rtl\u202eevil',
  'W'.repeat(20_000),
];
const csvCell = (s: string): string => `"${s.replace(/"/g, '""')}"`;

// H2O(g) values: CODATA Key Values (1989) ΔfH°, S°; NIST-JANAF 4th ed. (1998) ΔfG°. Each hostile name is an
// accepted species (the formula column carries H2O), with a hostile source; one row is given no dGf so it
// draws a finding that carries the name into the terminal summary.
function table(): string {
  const rows = NAMES.map((n, i) => `${csvCell(n)},H2O,g,-241.826,${i === 0 ? '' : '-228.582'},188.835,${csvCell(NAMES[(i + 1) % NAMES.length]!)}`);
  // and rows where the hostile text is the formula (rejected: it names no elements)
  const bad = NAMES.slice(0, 6).map((n) => `${csvCell(n)},,g,1,1,1,x`);
  return ['species,formula,phase,dHf,dGf,S,source', ...rows, ...bad].join('\n') + '\n';
}

describe('hostile text', () => {
  it('terminal: no escape or control character from data on stdout or stderr; JSON: the text unchanged', () => {
    const path = join(dir, 'hostile.csv');
    writeFileSync(path, table());
    const out = join(dir, 'hostile.json');
    const r = runCli(['check', path, '--json', out, '--no-color']);
    expect(r.code).toBe(1);
    expect(leaks(r.stdout + r.stderr)).toEqual([]);
    expect(r.stdout).not.toMatch(CONTROL);
    expect(r.stderr).not.toMatch(CONTROL);
    expect(r.stdout).toContain('\\u001b[31mred');
    const report = readValidReport(out);
    expect(report.summary.rows).toBe(report.summary.accepted + report.summary.rejected);
    expect(report.summary).toMatchObject({ rows: NAMES.length + 6, rejected: 6 });
    const species = new Set(report.findings.map((f: any) => f.species));
    expect(species.has(NAMES[0])).toBe(true);
    for (const n of NAMES.slice(0, 6)) expect(species.has(n), JSON.stringify(n)).toBe(true);
  });

  it('colour codes appear only when asked for on a terminal: with NO_COLOR and a pipe, stdout has no ESC at all', () => {
    const path = join(dir, 'hostile2.csv');
    writeFileSync(path, table());
    const r = runCli(['check', path]);
    expect(r.stdout.includes(ESC)).toBe(false);
  });

  it('a hostile header and a hostile unit in an exit-2 message are escaped', () => {
    const path = join(dir, `${ESC}[2Jname.csv`);
    writeFileSync(path, `species,phase,dHf [${ESC}[31m\u0007kJ]\nH2O,g,1\n`);
    const r = runCli(['check', path]);
    expect(r.code).toBe(2);
    expect(r.stderr).not.toMatch(CONTROL);
    expect(r.stderr).toContain('\\u001b[2Jname.csv:1:');
  });
});

describe('report paths that cannot be written', () => {
  const good = (): string => {
    const p = join(dir, 'good.csv');
    writeFileSync(p, 'species,phase,dHf,dGf,S\nH2O,g,-241.826,-228.582,188.835\n');
    return p;
  };

  it.each([
    ['a path whose parent is a regular file', () => {
      const f = join(dir, 'plain-file');
      writeFileSync(f, 'x');
      return join(f, 'report.json');
    }],
    ['a path two levels under a regular file', () => {
      const f = join(dir, 'plain-file-2');
      writeFileSync(f, 'x');
      return join(f, 'sub', 'report.json');
    }],
    ['an existing directory', () => dir],
  ])('%s: exit 2 naming the path, no stack trace', (_, target) => {
    const path = target();
    const r = runCli(['check', good(), '--json', path]);
    expect(r.code).toBe(2);
    expect(leaks(r.stdout + r.stderr)).toEqual([]);
    expect(r.stderr).toContain(path);
    expect(r.stderr).toMatch(/cannot write the report/);
  });
});

// How much of the "1.5 × csv-parse" budget the least work of a check uses up, on the bench's table.
//
//   npm run build && node dist/test/bench/least-work.js [table.csv]
//
// Four passes over the same file, in one process, each adding one piece of work that any check of
// thermovet's contract must do per row, and none of the work that organises it:
//   1. csv-parse alone (the bench's floor);
//   2. + the numeric cells turned into numbers;
//   3. + Cp evaluated across the row's fitted range at 111 temperatures (as a 5-term polynomial, the
//      cheapest model; the species rules scan every range at ~110 temperatures plus refinements);
//   4. + one compact JSON line per row written out (the report).
// Nothing here folds rows by species, parses a formula, detects a duplicate or applies a rule. Without
// a file it generates the 10^6-row synthetic table (invented data) into a temporary directory.
// A measurement, not a test: nothing asserts a time.
import { closeSync, createReadStream, mkdtempSync, openSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse';
import { generateTable } from './generate.js';

const STEPS = ['csv-parse alone', '+ numbers', '+ Cp at 111 temperatures per row', '+ one JSON line per row'] as const;
const NUMERIC = ['dHf [kJ/mol]', 'dGf [kJ/mol]', 'S [J/(mol K)]', 'u_dHf [kJ/mol]', 'cp_Tmin [K]', 'cp_Tmax [K]', 'P_ref [bar]'];

async function pass(path: string, step: number, out: string): Promise<number> {
  const t0 = performance.now();
  const fd = openSync(out, 'w');
  let header: string[] | undefined;
  let numeric: number[] = [];
  let cols = { name: 0, phase: 0, model: 0, coeffs: 0 };
  let lines: string[] = [];
  let sink = 0; // keeps the evaluations from being optimised away
  const parser = parse({ comment: '#', comment_no_infix: true, skip_empty_lines: true, relax_column_count: true, bom: true });
  parser.on('data', (r: string[]) => {
    if (!header) {
      header = r;
      numeric = NUMERIC.map((h) => r.indexOf(h));
      cols = { name: r.indexOf('species'), phase: r.indexOf('phase'), model: r.indexOf('cp_model'), coeffs: r.indexOf('cp_coeffs') };
      return;
    }
    if (step < 1) return;
    const x = numeric.map((i) => Number(r[i]));
    if (step < 2) return;
    const c = (r[cols.coeffs] ?? '').split(' ').map(Number);
    const a = x[4] || 298.15;
    const b = x[5] || 1000;
    let cp298 = 0;
    for (let k = 0; k <= 110; k++) {
      const T = a + ((b - a) * k) / 110;
      let s = 0;
      let Tp = 1;
      for (let j = 0; j < 5; j++) {
        s += (c[j] || 0) * Tp;
        Tp *= T;
      }
      if (k === 0) cp298 = s;
      sink += s;
    }
    if (step < 3) return;
    lines.push(JSON.stringify({ name: r[cols.name], phase: r[cols.phase], dHf: x[0], dGf: x[1], S: x[2], cp: { model: r[cols.model], Tmin: a, Tmax: b, cp298 } }));
    if (lines.length === 32) {
      writeSync(fd, lines.join('\n') + '\n');
      lines = [];
    }
  });
  await new Promise<void>((resolve, reject) => {
    parser.on('end', resolve);
    parser.on('error', reject);
    createReadStream(path).pipe(parser);
  });
  if (lines.length) writeSync(fd, lines.join('\n') + '\n');
  closeSync(fd);
  if (Number.isNaN(sink)) process.stdout.write(''); // read it
  return (performance.now() - t0) / 1000;
}

async function main(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'thermovet-least-'));
  try {
    let path = process.argv[2];
    if (!path) {
      path = join(dir, 'synthetic-1000000.csv');
      process.stdout.write('generating 1000000 rows of the synthetic (invented) table…\n');
      await generateTable(path, { rows: 1_000_000 });
    }
    const out = join(dir, 'lines.json');
    const times: number[] = [];
    for (let step = 0; step < STEPS.length; step++) {
      // the faster of two passes: the machine is shared
      times.push(Math.min(await pass(path, step, out), await pass(path, step, out)));
      process.stdout.write(`${STEPS[step]!.padEnd(36)} ${times[step]!.toFixed(2).padStart(7)} s   ${(times[step]! / times[0]!).toFixed(2)} × csv-parse\n`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();

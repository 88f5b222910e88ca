// `npm run bench`: how the full check scales against the cost of merely parsing the file.
//
// For 10^4, 10^5 and 10^6 rows of a synthetic table (test/bench/generate.ts; invented data) it times,
// in the same run and on the same file:
//   (a) csv-parse alone streaming the file (columns: false, no cast) — the floor;
//   (b) the built CLI: `node dist/pipeline/cli.js check <file> --json <out> -q`, with its peak RSS;
//   (c) the equilibrium stage: 10^3 balanced reactions × 50 temperatures over the table's species,
//       in-process (reactions read, resolved, computed; impacts attached to the findings).
// (a) and (b) run as child processes under /usr/bin/time -v (peak RSS from the operating system;
// without it, a preloaded probe reads getrusage at exit). Each is run BENCH_REPEAT times, alternating,
// and the fastest run counts (the machine is shared; the minimum is the least disturbed).
//
// Environment: BENCH_MAX_ROWS (default 1000000) to stop at a smaller size, BENCH_REPEAT (default 3
// up to 10^5 rows, 2 above), BENCH_KEEP=1 to keep the temporary directory, BENCH_PROFILE=1 to write a
// --cpu-prof profile of the largest check into it.
// This is a measurement, not a test: nothing here asserts a time.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createReadStream } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parse } from 'csv-parse';
import { loadReference } from '../../pipeline/chemistry/reference.js';
import { impactOfFindings, loadReactions, runEquilibrium } from '../../pipeline/equilibrium/index.js';
import { loadStore } from '../../pipeline/equilibrium/species.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { combustionReactions, generateTable, type GenerateResult } from './generate.js';

const here = dirname(fileURLToPath(import.meta.url)); // dist/test/bench
const root = resolve(here, '../../..');
const CLI = join(root, 'dist/pipeline/cli.js');
const PROBE = join(here, 'rss-probe.js');
const TIME = '/usr/bin/time';

/** (a) in a child: stream the file through csv-parse and count records; prints the count. */
async function floor(path: string): Promise<void> {
  const headerLine = firstDataLine(path);
  const parser = parse({ columns: false, bom: true, relax_column_count: true, from_line: headerLine });
  let n = 0;
  parser.on('data', () => n++);
  const done = new Promise<void>((res, rej) => {
    parser.on('end', res);
    parser.on('error', rej);
  });
  createReadStream(path).pipe(parser);
  await done;
  process.stdout.write(`${n}\n`);
}

/**
 * The physical line of the header: the first line that is neither blank nor a `#` comment. The floor
 * starts csv-parse there (from_line), so that csv-parse is not charged for rows whose width differs
 * from a comment line's, which is the fastest csv-parse reads this file (see docs/performance.md).
 */
function firstDataLine(path: string): number {
  const head = readFileSync(path).subarray(0, 1 << 16).toString('utf8').split('\n');
  const i = head.findIndex((l) => l.trim() !== '' && !l.startsWith('#'));
  return i < 0 ? 1 : i + 1;
}

interface Measured {
  seconds: number;
  rssMB?: number;
  code: number | null;
  stdout: string;
  /** why the run did not finish, when it did not */
  failed?: string;
}

function run(args: string[], env: Record<string, string> = {}): Measured {
  const useTime = existsSync(TIME);
  const rssFile = join(tmpdir(), `thermovet-bench-rss-${process.pid}`);
  const nodeArgs = useTime ? args : ['--import', PROBE, ...args];
  const cmd = useTime ? TIME : process.execPath;
  const argv = useTime ? ['-v', process.execPath, ...nodeArgs] : nodeArgs;
  const t0 = performance.now();
  const timeout = 1000 * Number(process.env.BENCH_TIMEOUT ?? 1800);
  const r = spawnSync(cmd, argv, { encoding: 'utf8', env: { ...process.env, ...env, BENCH_RSS_OUT: rssFile }, maxBuffer: 1 << 26, timeout });
  const seconds = (performance.now() - t0) / 1000;
  let rssMB: number | undefined;
  if (useTime) {
    const m = /Maximum resident set size \(kbytes\): (\d+)/.exec(r.stderr ?? '');
    if (m) rssMB = Number(m[1]) / 1024;
  } else if (existsSync(rssFile)) {
    rssMB = Number(readFileSync(rssFile, 'utf8')) / 1024;
    rmSync(rssFile, { force: true });
  }
  if (r.status !== 0 && r.status !== 1) {
    // a run that dies (out of memory, timeout) is a result to show, not a reason to stop the bench
    const why = /heap out of memory/i.test(r.stderr ?? '') ? 'out of memory' : r.error ? String(r.error.message) : `exit ${r.status ?? r.signal}`;
    process.stderr.write(`  failed (${why}): node ${args.join(' ')}\n`);
    return { seconds, rssMB, code: r.status, stdout: r.stdout ?? '', failed: why };
  }
  return { seconds, rssMB, code: r.status, stdout: r.stdout };
}

function best(runs: Measured[]): Measured {
  return runs.reduce((a, b) => (b.seconds < a.seconds ? b : a));
}

/** (c) in this process: the species are loaded into their store first (not timed); the stage itself is timed. */
async function equilibriumStage(path: string, gen: GenerateResult, dir: string): Promise<{ seconds: number; reactions: number; points: number }> {
  const temps = Array.from({ length: 50 }, (_, i) => 300 + i * 25); // 300…1525 K
  const reactionsPath = join(dir, `reactions-${gen.rows}.csv`);
  writeFileSync(reactionsPath, combustionReactions(gen, 1000, temps));
  const options = normalizeOptions({ tables: [path] });
  const loaded = await loadStore(options);
  const species = loaded.store.view(); // as check() reads them
  const reference = loadReference();
  const t0 = performance.now();
  const { reactions: specs, findings } = loadReactions(reactionsPath);
  const eq = runEquilibrium(specs, species, reference, options.useWindow);
  impactOfFindings([...loaded.findings, ...findings, ...eq.findings], eq.resolved);
  const seconds = (performance.now() - t0) / 1000;
  const points = eq.results.reduce((n, r) => n + r.points.length, 0);
  return { seconds, reactions: eq.resolved.length, points };
}

const fmt = (v: number | undefined, digits = 2): string => (v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(digits));
const rate = (rows: number, s: number): string => (Number.isFinite(s) ? `${Math.round(rows / s).toLocaleString('en-US')}` : '—');
/** the check's time, NaN when it did not finish (shown as —) */
const checkS = (r: { b: Measured }): number => (r.b.failed ? NaN : r.b.seconds);
const pad = (cells: string[], widths: number[]): string => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');

async function main(): Promise<void> {
  if (process.argv[2] === '--floor') return floor(process.argv[3]!);
  if (!existsSync(CLI)) throw new Error(`${CLI} not found: build first (npm run bench does)`);
  const maxRows = Number(process.env.BENCH_MAX_ROWS ?? 1_000_000);
  const sizes = [10_000, 100_000, 1_000_000].filter((n) => n <= maxRows);
  const dir = mkdtempSync(join(tmpdir(), 'thermovet-bench-'));
  const lines: string[] = [];
  const say = (s = ''): void => {
    lines.push(s);
    process.stdout.write(s + '\n');
  };
  say(`thermovet benchmark · node ${process.version} · ${existsSync(TIME) ? 'peak RSS from /usr/bin/time -v' : 'peak RSS from getrusage (probe)'} · data in ${dir}`);
  say('synthetic data (invented, not about real substances): mixed Cp models and units, ~3 % defective species, multi-range species');
  const results: { rows: number; mb: number; a: Measured; b: Measured; c?: Awaited<ReturnType<typeof equilibriumStage>>; species: number }[] = [];
  try {
    for (const rows of sizes) {
      const path = join(dir, `synthetic-${rows}.csv`);
      process.stderr.write(`generating ${rows} rows…\n`);
      const gen = await generateTable(path, { rows });
      const repeat = Number(process.env.BENCH_REPEAT ?? (rows > 100_000 ? 2 : 3));
      const as: Measured[] = [];
      const bs: Measured[] = [];
      const out = join(dir, `report-${rows}.json`);
      for (let i = 0; i < repeat; i++) {
        process.stderr.write(`  ${rows} rows: run ${i + 1}/${repeat} (csv-parse, check)\n`);
        const a = run([fileURLToPath(import.meta.url), '--floor', path]);
        if (Number(a.stdout.trim()) < rows) throw new Error(`csv-parse read ${a.stdout.trim()} records, expected at least ${rows}`);
        as.push(a);
        const b = run([CLI, 'check', path, '--json', out, '-q']);
        bs.push(b);
        if (b.failed) break; // a second attempt would fail the same way
      }
      const ok = bs.filter((b) => !b.failed);
      let species = 0;
      if (ok.length) {
        const report = JSON.parse(readFileSync(out, 'utf8')) as { summary: { rows: number; species: number } };
        if (report.summary.rows !== rows) throw new Error(`the check read ${report.summary.rows} rows, expected ${rows}`);
        species = report.summary.species;
      }
      if (process.env.BENCH_PROFILE === '1' && ok.length && rows === sizes[sizes.length - 1]) {
        spawnSync(process.execPath, ['--cpu-prof', '--cpu-prof-dir', dir, CLI, 'check', path, '--json', out, '-q'], { stdio: 'ignore' });
      }
      process.stderr.write(`  ${rows} rows: equilibrium stage\n`);
      const c = await equilibriumStage(path, gen, dir);
      results.push({ rows, mb: statSync(path).size / 1e6, a: best(as), b: ok.length ? best(ok) : bs[0]!, c, species });
      rmSync(out, { force: true });
    }
  } finally {
    if (process.env.BENCH_KEEP !== '1') rmSync(dir, { recursive: true, force: true });
  }

  const w = [9, 7, 8, 11, 7, 8, 11, 7, 8, 9, 8, 7];
  say();
  say(pad(['rows', 'MB', '(a) s', '(a) rows/s', 'RSS MB', '(b) s', '(b) rows/s', '(b)/(a)', 'RSS MB', '(c) s', 'points', '(c)/(b)'], w));
  for (const r of results) {
    say(
      pad(
        [
          r.rows.toLocaleString('en-US'),
          fmt(r.mb, 1),
          fmt(r.a.seconds),
          rate(r.rows, r.a.seconds),
          fmt(r.a.rssMB, 0),
          fmt(checkS(r)),
          rate(r.rows, checkS(r)),
          fmt(checkS(r) / r.a.seconds),
          fmt(r.b.rssMB, 0),
          r.c ? fmt(r.c.seconds, 3) : 'n/a',
          r.c ? String(r.c.points) : 'n/a',
          r.c ? `${fmt((100 * r.c.seconds) / checkS(r), 1)} %` : 'n/a',
        ],
        w,
      ),
    );
  }
  for (const r of results) if (r.b.failed) say(`the check of ${r.rows.toLocaleString('en-US')} rows did not finish: ${r.b.failed} after ${fmt(r.b.seconds, 0)} s, peak RSS ${fmt(r.b.rssMB, 0)} MB`);
  say('(a) csv-parse alone, streaming, columns: false, no cast, in a child process   (b) thermovet check --json, built CLI');
  say(`(c) equilibrium stage in-process: ${results[0]?.c ? `${results[results.length - 1]!.c!.reactions} reactions resolved` : ''} × 50 temperatures; points = reactions × temperatures computed`);
  const by = new Map(results.map((r) => [r.rows, r]));
  const growth = (from: number, to: number): void => {
    const x = by.get(from);
    const y = by.get(to);
    if (x && y) say(`growth ${from.toLocaleString('en-US')} → ${to.toLocaleString('en-US')} rows (×${to / from}): csv-parse ×${fmt(y.a.seconds / x.a.seconds, 1)}, check ×${fmt(checkS(y) / checkS(x), 1)}`);
  };
  say();
  growth(10_000, 100_000);
  growth(100_000, 1_000_000);
  growth(10_000, 1_000_000);
  const big = by.get(1_000_000);
  const mid = by.get(100_000);
  if (big) {
    say();
    say('targets at 10^6 rows:');
    say(`  check ≤ 1.5 × csv-parse:         ${fmt(checkS(big) / big.a.seconds)} ×   ${checkS(big) / big.a.seconds <= 1.5 ? 'met' : 'NOT met'}`);
    if (mid) say(`  10^6 rows ≤ 12 × 10^5 rows:     ${fmt(checkS(big) / checkS(mid), 1)} ×   ${checkS(big) / checkS(mid) <= 12 ? 'met' : 'NOT met'}`);
    say(`  peak RSS ≤ 400 MB:               ${fmt(big.b.rssMB, 0)} MB   ${!big.b.failed && (big.b.rssMB ?? Infinity) <= 400 ? "met" : "NOT met"}`);
    if (big.c) say(`  equilibrium ≤ 10 % of check:     ${fmt((100 * big.c.seconds) / checkS(big), 1)} %   ${big.c.seconds <= 0.1 * checkS(big) ? 'met' : 'NOT met'}`);
  }
}

main().catch((e: unknown) => {
  process.stderr.write(`bench: ${(e as Error).message}\n`);
  process.exitCode = 1;
});

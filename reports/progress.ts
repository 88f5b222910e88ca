// A progress bar on stderr for runs longer than about a second, and never when stderr is not a terminal
// (CI logs, pipes and files stay clean). A few lines of our own rather than a dependency: one line,
// redrawn at most ten times a second with a carriage return, erased when the run ends.
import { closeSync, openSync, readSync, statSync } from 'node:fs';

export interface ProgressOptions {
  stream: Pick<NodeJS.WriteStream, 'write'> & { isTTY?: boolean; columns?: number };
  /** false for --quiet */
  enabled: boolean;
  /** milliseconds before anything is drawn */
  delayMs?: number;
  now?: () => number;
}

export interface Progress {
  /** `done` of `total` units of `label`; total 0 when unknown (a counter is shown instead of a bar) */
  update(label: string, done: number, total: number): void;
  /** erase the line; idempotent */
  finish(): void;
}

const BAR = 24;
const MIN_REDRAW_MS = 100;

export function createProgress(opts: ProgressOptions): Progress {
  const now = opts.now ?? Date.now;
  const start = now();
  const delay = opts.delayMs ?? 1000;
  const on = opts.enabled && opts.stream.isTTY === true;
  let drawn = false;
  let last = -Infinity;
  return {
    update(label, done, total) {
      if (!on) return;
      const t = now();
      if (t - start < delay || t - last < MIN_REDRAW_MS) return;
      last = t;
      const secs = ((t - start) / 1000).toFixed(1);
      let line: string;
      if (total > 0) {
        const frac = Math.min(1, Math.max(0, done / total));
        const fill = Math.round(frac * BAR);
        line = `${label} [${'#'.repeat(fill)}${'-'.repeat(BAR - fill)}] ${Math.floor(frac * 100)}%  ${done.toLocaleString('en-US')}/${total.toLocaleString('en-US')}  ${secs} s`;
      } else {
        line = `${label} ${done.toLocaleString('en-US')}  ${secs} s`;
      }
      const width = Math.max(20, (opts.stream.columns || 80) - 1); // a pty that reports 0 columns gets 80
      opts.stream.write(`\r\u001b[2K${line.slice(0, width)}`);
      drawn = true;
    },
    finish() {
      if (drawn) opts.stream.write('\r\u001b[2K');
      drawn = false;
    },
  };
}

/**
 * Rough number of rows in the tables, from their sizes and the line density of their first 64 KiB:
 * enough for a bar that moves; the bar never claims more than 99% before the reading ends.
 */
export function estimateRows(paths: string[]): number {
  let rows = 0;
  for (const p of paths) {
    try {
      const size = statSync(p).size;
      const fd = openSync(p, 'r');
      try {
        const buf = Buffer.alloc(Math.min(size, 65536));
        const got = readSync(fd, buf, 0, buf.length, 0);
        let lines = 0;
        for (let i = 0; i < got; i++) if (buf[i] === 10) lines++;
        rows += got > 0 ? Math.round((Math.max(lines, 1) * size) / got) : 0;
      } finally {
        closeSync(fd);
      }
    } catch {
      // unreadable here means the run itself will report it; the bar just knows less
    }
  }
  return rows;
}

// Reports are written atomically: a temporary file beside the target, then a rename, so a killed run
// never leaves a truncated report that CI could take for a valid one.
import { closeSync, mkdirSync, openSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { InputError } from '../pipeline/errors.js';

/**
 * Creates `dir` and its missing parents, one level at a time. Node's own `mkdirSync(dir, { recursive:
 * true })` never returns under /proc (mkdir there answers ENOENT for a parent that exists), so an output
 * path such as /proc/nope/report.json would hang the run instead of failing with exit 2.
 */
export function makeDirs(dir: string): void {
  try {
    mkdirSync(dir);
    return;
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'EEXIST') {
      if (statSync(dir).isDirectory()) return;
      throw Object.assign(new Error(`${dir} is not a directory`), { code: 'ENOTDIR' });
    }
    if (code !== 'ENOENT') throw e;
  }
  const parent = dirname(dir);
  if (parent === dir) throw Object.assign(new Error(`cannot create ${dir}`), { code: 'ENOENT' });
  makeDirs(parent);
  mkdirSync(dir); // once: a second ENOENT means this file system will not hold it
}

export function writeAtomic(path: string, content: string): void {
  writeAtomicChunks(path, [content]);
}

/** A report made in pieces (JSON, SARIF), written as they come and never held as one string; a temporary file renamed into place. */
export function writeAtomicChunks(path: string, chunks: Iterable<string>): void {
  const dir = dirname(path);
  const tmp = join(dir, `.${basename(path)}.${process.pid}.tmp`);
  let fd: number | undefined;
  try {
    makeDirs(dir);
    fd = openSync(tmp, 'w');
    for (const piece of chunks) writeSync(fd, piece);
    closeSync(fd);
    fd = undefined;
    renameSync(tmp, path);
  } catch (e) {
    try {
      if (fd !== undefined) closeSync(fd);
      rmSync(tmp, { force: true }); // `force` ignores only ENOENT; under a regular file this throws ENOTDIR
    } catch {
      // nothing was created there
    }
    const code = (e as NodeJS.ErrnoException).code ?? 'error';
    throw new InputError('unwritable-output', `cannot write the report (${code})`, { file: path });
  }
}

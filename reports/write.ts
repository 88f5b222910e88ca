// Reports are written atomically: a temporary file beside the target, then a rename, so a killed run
// never leaves a truncated report that CI could take for a valid one.
import { mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { InputError } from '../pipeline/errors.js';

export function writeAtomic(path: string, content: string): void {
  const dir = dirname(path);
  const tmp = join(dir, `.${basename(path)}.${process.pid}.tmp`);
  try {
    mkdirSync(dir, { recursive: true });
    writeFileSync(tmp, content);
    renameSync(tmp, path);
  } catch (e) {
    try {
      rmSync(tmp, { force: true }); // `force` ignores only ENOENT; under a regular file this throws ENOTDIR
    } catch {
      // nothing was created there
    }
    const code = (e as NodeJS.ErrnoException).code ?? 'error';
    throw new InputError('unwritable-output', `cannot write the report (${code})`, { file: path });
  }
}

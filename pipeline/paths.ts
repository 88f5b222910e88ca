import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/** The package root (the folder holding package.json), from source under vitest or from dist/. */
export function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  for (;;) {
    if (existsSync(join(dir, 'package.json')) && existsSync(join(dir, 'datasets'))) return dir;
    const up = dirname(dir);
    if (up === dir) throw new Error('thermovet: cannot find the package root');
    dir = up;
  }
}

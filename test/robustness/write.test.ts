// Reports are written atomically; a path that cannot be written is an InputError (exit 2) naming the path.
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../pipeline/errors.js';
import { writeAtomic } from '../../reports/write.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-write-'));

function thrown(f: () => void): unknown {
  try {
    f();
  } catch (e) {
    return e;
  }
  return undefined;
}

describe('writeAtomic', () => {
  it('writes the content and leaves no temporary file behind', () => {
    const target = join(dir, 'ok', 'r.json');
    writeAtomic(target, '{"a":1}');
    expect(readFileSync(target, 'utf8')).toBe('{"a":1}');
    expect(readdirSync(join(dir, 'ok'))).toEqual(['r.json']);
  });

  it.each([
    ['a path under a regular file', (f: string) => join(f, 'r.json')],
    ['a path two levels under a regular file', (f: string) => join(f, 'sub', 'r.json')],
  ])('%s gives an InputError naming the path, not a crash', (_, make) => {
    const file = join(dir, `plain-${Math.random().toString(36).slice(2)}`);
    writeFileSync(file, 'x');
    const target = make(file);
    const e = thrown(() => writeAtomic(target, 'report'));
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).code).toBe('unwritable-output');
    expect((e as InputError).describe()).toContain(target);
    expect(readFileSync(file, 'utf8')).toBe('x');
  });

  it('a missing directory under /proc is an InputError at once, not an endless mkdir (Node recursive mkdir loops there)', () => {
    // Linux only: /proc refuses mkdir with ENOENT although /proc exists
    const target = '/proc/thermovet-no-such-dir/sub/r.json';
    const e = thrown(() => writeAtomic(target, 'report'));
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).describe()).toContain(target);
  });

  it('a directory as the target is refused and keeps no partial file', () => {
    const target = join(dir, 'isdir');
    writeAtomic(join(target, 'inner.json'), '1');
    const e = thrown(() => writeAtomic(target, 'report'));
    expect(e).toBeInstanceOf(InputError);
    expect(readdirSync(target)).toEqual(['inner.json']);
  });
});

// Manifest errors name the line where the problem is, so a user can go straight to it.
import { describe, expect, it } from 'vitest';
import { InputError } from '../../pipeline/errors.js';
import { loadStructured } from '../../pipeline/ingest/structured.js';
import { tempFile } from '../ingest/helpers.js';

function failure(text: string): InputError {
  const path = tempFile(text, 'yaml');
  try {
    loadStructured(path, 'manifest.schema.json', 'manifest');
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('manifest schema errors', () => {
  it('an unknown top-level key is located on its own line', () => {
    const e = failure('name: x\ntables:\n  - a.csv\nbogus: 1\n');
    expect(e.code).toBe('invalid-document');
    expect(e.line).toBe(4);
    expect(e.describe()).toMatch(/:4: manifest: .*unknown key "bogus"/);
  });

  it('an unknown nested key is located on its own line, also when its value is a block', () => {
    const e = failure('tables: [a.csv]\nuse_window:\n  Tmin: 400\n  Tmax: 900\n  Tmid:\n    - 600\n');
    expect(e.line).toBe(5);
    expect(e.message).toContain('use_window has an unknown key "Tmid"');
  });

  it('a value of the wrong type is located at the value', () => {
    const e = failure('tables: [a.csv]\nuse_window:\n  Tmin: hot\n  Tmax: 900\n');
    expect(e.line).toBe(3);
  });
});

// InputError.describe() is the one line a user sees on exit 2; its file and field come from user input.
import { describe, expect, it } from 'vitest';
import { InputError } from '../../pipeline/errors.js';

const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

describe('InputError.describe', () => {
  it('names file, line and field', () => {
    expect(new InputError('x', 'bad', { file: 'a.csv', line: 3, field: 'dHf' }).describe()).toBe('a.csv:3: bad [field dHf]');
  });

  it('never prints control characters from a file name or a header', () => {
    // a table path listed in a manifest and a header cell, both carrying terminal escape sequences
    const e = new InputError('unknown-unit', 'unknown unit', { file: '\u001b[31mred.csv', line: 1, field: 'dHf [\u001b]0;title\u0007kJ]' });
    const text = e.describe();
    expect(text).not.toMatch(CONTROL);
    expect(text).toContain('\\u001b[31mred.csv:1:');
    expect(text).toContain('[field dHf [\\u001b]0;title\\u0007kJ]]');
  });
});

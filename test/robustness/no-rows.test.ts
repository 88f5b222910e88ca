// A table with no data rows is unusable input (exit 2), never a clean pass: a file truncated to its
// header in a commit must not let CI through.
import { describe, expect, it } from 'vitest';
import { InputError } from '../../pipeline/errors.js';
import type { TableFormat } from '../../pipeline/ingest/events.js';
import { readTable } from '../ingest/helpers.js';

async function failure(text: string, format: TableFormat): Promise<InputError> {
  try {
    await readTable(text, format);
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('expected an InputError');
}

describe('tables without data rows', () => {
  it.each([
    ['header only', 'species,phase,dHf\n', 'csv', 1],
    ['header after comments, then blank lines', '# note\n# note\nspecies,phase,dHf\n\n\n', 'csv', 3],
    ['TSV header only', 'species\tphase\tdHf\r\n', 'tsv', 1],
    ['an empty JSON array', '[\n]\n', 'json', 1],
  ] as const)('%s is exit-2 input naming the line', async (_, text, format, line) => {
    const e = await failure(text, format);
    expect(e.code).toBe('no-rows');
    expect(e.line).toBe(line);
    expect(e.describe()).toMatch(new RegExp(`\\.${format}:${line}: `));
  });

  it('one data row is enough', async () => {
    const { counts } = await readTable('species,phase,dHf\nH2O,g,x\n');
    expect(counts).toEqual({ rows: 1, accepted: 0, rejected: 1 });
  });
});

import { describe, expect, it } from 'vitest';
import { check } from '../../pipeline/check.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { tempFile } from '../ingest/helpers.js';

// CO2(g): ΔfH° −393.522 kJ/mol, ΔfG° −394.389 kJ/mol, S° 213.795 J/(mol K) (CODATA 1989; NIST-JANAF 1998).
const head = 'species,phase,dHf,dGf,S\n';
const run = (...tables: string[]) => check(normalizeOptions({ tables }), { version: 't', generatedAt: '1970-01-01T00:00:00.000Z' });

describe('folding rows into species', () => {
  it('the same file repeating a species with another value is a conflict on the later line', async () => {
    const r = await run(tempFile(head + 'CO2,g,-393.522,-394.389,213.795\nCO2,g,-390.0,-394.389,213.795\n'));
    expect(r.findings.filter((f) => f.rule === 'conflicting-values').map((f) => [f.location.line, f.location.field])).toEqual([[3, 'dHf']]);
  });

  it('two files without a source column are two sources, not one conflicting source', async () => {
    const a = tempFile(head + 'CO2,g,-393.522,-394.389,213.795\n');
    const b = tempFile(head + 'CO2,g,-390.0,-394.389,213.795\n');
    const r = await run(a, b);
    expect(r.findings.filter((f) => f.rule === 'conflicting-values')).toEqual([]);
    expect(r.findings.some((f) => f.rule === 'cross-source' && f.location.file === b)).toBe(true);
  });

  it('an exact repeat is a duplicate, accepted once', async () => {
    const r = await run(tempFile(head + 'CO2,g,-393.522,-394.389,213.795\nCO2,g,-393.522,-394.389,213.795\n'));
    expect(r.summary).toMatchObject({ rows: 2, accepted: 2, species: 1 });
    expect(r.findings.map((f) => [f.rule, f.location.line])).toEqual([['duplicate-row', 3]]);
  });
});

import { describe, expect, it } from 'vitest';
import { readTable } from './helpers.js';

// H2O(g): ΔfH° −241.826 kJ/mol (CODATA 1989), ΔfG° −228.582 kJ/mol, S° 188.835 J/(mol K) (NIST-JANAF 1998).
const water = { species: 'H2O', phase: 'g', dHf: -241.826, dGf: -228.582, S: 188.835 };

describe('JSON and NDJSON ingest', () => {
  it('reads an array of objects with the line where each record starts', async () => {
    const text = `[\n  ${JSON.stringify(water)},\n  {\n    "species": "CO", "phase": "g",\n    "dHf": -110.53\n  }\n]\n`;
    const { rows, counts } = await readTable(text, 'json');
    expect(counts).toEqual({ rows: 2, accepted: 2, rejected: 0 });
    expect(rows.map((r) => r.values.location.line)).toEqual([2, 3]);
  });

  it('accepts cp coefficient arrays or strings', async () => {
    // Shomate coefficients of CO(g), 298–1300 K, as published on the NIST Chemistry WebBook (from memory)
    const coeffs = [25.56759, 6.09613, 4.054656, -2.671301, 0.131021, -118.0089, 227.3665, -110.5271];
    const a = { ...water, species: 'CO', dHf: -110.53, dGf: -137.163, S: 197.66, cp_model: 'shomate', cp_coeffs: coeffs, cp_Tmin: 298, cp_Tmax: 1300 };
    const b = { ...a, cp_coeffs: coeffs.join(' '), cp_Tmin: 1300, cp_Tmax: 1400 };
    const { rows, findings } = await readTable(JSON.stringify([a, b]), 'json');
    expect(findings).toEqual([]);
    expect(rows[0]!.cp!.coeffs).toEqual(coeffs);
    expect(rows[1]!.cp!.coeffs).toEqual(coeffs);
  });

  it('rejects wrong types and non-objects per record', async () => {
    const text = JSON.stringify([water, { ...water, dHf: true }, 42, { ...water, S: { v: 1 } }], null, 1);
    const { counts, findings } = await readTable(text, 'json');
    expect(counts).toEqual({ rows: 4, accepted: 1, rejected: 3 });
    expect(findings.map((f) => f.messageId)).toEqual(['type', 'notObject', 'type']);
  });

  it('refuses JSON that is not an array, or never closes', async () => {
    await expect(readTable(JSON.stringify(water), 'json')).rejects.toMatchObject({ code: 'not-an-array' });
    await expect(readTable('[' + JSON.stringify(water), 'json')).rejects.toMatchObject({ code: 'bad-json' });
  });

  it('refuses deep nesting per record without exhausting the stack', async () => {
    const deep = '['.repeat(100000) + ']'.repeat(100000);
    const { counts, findings } = await readTable(`[${JSON.stringify(water)}, ${deep}]`, 'json');
    expect(counts).toEqual({ rows: 2, accepted: 1, rejected: 1 });
    expect(findings[0]!.message).toMatch(/nested deeper/);
  });

  it('NDJSON: one bad line is one rejected row on its line', async () => {
    const text = [JSON.stringify(water), '{"species": "CO", "phase": "g", "dHf": -110.53,', '', JSON.stringify({ ...water, species: 'NH3' })].join('\n');
    const { counts, findings, rows } = await readTable(text, 'ndjson');
    expect(counts).toEqual({ rows: 3, accepted: 2, rejected: 1 });
    expect(findings[0]).toMatchObject({ rule: 'unreadable-row', location: { line: 2 } });
    expect(rows.map((r) => r.values.location.line)).toEqual([1, 4]);
  });

  it('NDJSON: a record without phase is that row\'s problem, not the file\'s', async () => {
    const text = [JSON.stringify({ species: 'H2O', dHf: -241.826 }), JSON.stringify(water)].join('\n');
    const { counts, findings } = await readTable(text, 'ndjson');
    expect(counts).toEqual({ rows: 2, accepted: 1, rejected: 1 });
    expect(findings[0]).toMatchObject({ rule: 'missing-field', params: { field: 'phase' } });
  });
});

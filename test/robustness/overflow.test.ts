// A number that is finite as written but overflows when converted to SI must be rejected, never
// accepted as ±Infinity (it would then poison every sum it enters).
import { describe, expect, it } from 'vitest';
import { readTable } from '../ingest/helpers.js';

describe('overflow on unit conversion', () => {
  it('rejects 1e306 kcal/mol (×4184 J/kcal overflows a double) with file, line and field', async () => {
    const { rows, findings, counts } = await readTable('species,phase,dHf [kcal/mol]\nH2O,g,-57.798\nCO,g,1e306\nCO2,g,-1.7e308\n');
    expect(counts).toEqual({ rows: 3, accepted: 1, rejected: 2 });
    expect(rows.every((r) => Number.isFinite(r.values.dHf))).toBe(true);
    expect(findings.map((f) => [f.rule, f.messageId, f.location.line, f.location.field])).toEqual([
      ['bad-number', 'notFinite', 3, 'dHf'],
      ['bad-number', 'notFinite', 4, 'dHf'],
    ]);
  });

});

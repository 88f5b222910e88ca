// incomplete-species: an empty ΔfH°, ΔfG° or S° is never read as 0; the finding names the empty field.
// Values: NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998) for CH4(g) and CO2(g).
import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { tempFile } from '../ingest/helpers.js';

describe('incomplete-species', () => {
  it('names the empty field and its column, and does not take the empty cell for 0', async () => {
    const csv = 'species,formula,phase,dHf,dGf,S\nCH4,CH4,g,,-50.768,186.251\nCO2,CO2,g,-393.522,,213.795\n';
    const report = await checkArrays(normalizeOptions({ tables: [tempFile(csv, 'csv')] }), { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z' });
    const hits = report.findings.filter((f) => f.rule === 'incomplete-species');
    expect(hits.map((f) => [f.location.line, f.messageId, f.location.field, f.location.column, f.severity])).toEqual([
      [2, 'unusable', 'dHf', 4, 'warning'],
      [3, 'unchecked', 'dGf', 5, 'info'],
    ]);
    expect(report.findings.filter((f) => f.rule === 'gibbs-helmholtz')).toEqual([]);
  });
});

import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { tempFile } from '../ingest/helpers.js';

// H2O(g) S° = 188.835 J/(mol K) on the 1 bar state (CODATA Key Values 1989); on the 1 atm state it is
// lower by R ln(1.01325) = 0.1094 J/(mol K) (exact from the definitions of bar and atm).
describe('standard-pressure', () => {
  it('gives the 1 bar entropy of a gas declared on the 1 atm state', async () => {
    const csv = 'species,phase,dHf,dGf,S,P_ref [atm]\nH2O,g,-241.826,-228.582,188.7256,1\nH2O,l,-285.83,-237.141,69.95,1\nCO2,g,-393.522,-394.389,213.795,\n';
    const report = await checkArrays(normalizeOptions({ tables: [tempFile(csv)] }), { version: 't', generatedAt: '' });
    const f = report.findings.filter((x) => x.rule === 'standard-pressure');
    expect(f.map((x) => [x.location.line, x.severity])).toEqual([[2, 'warning'], [3, 'info']]);
    expect(f[0]!.diagnosis).toMatchObject({ cause: 'atm-vs-bar', field: 'S' });
    expect(f[0]!.diagnosis!.corrected).toBeCloseTo(188.835, 3);
  });
});

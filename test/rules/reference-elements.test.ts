// reference-elements: an element in its reference state has ΔfH° = ΔfG° = 0; the element in another state does not.
// Values: CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989) for the reference entropies and
// O(g); NBS Tables (Wagman et al. 1982) for C(diamond), from memory.
import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { Report } from '../../pipeline/types.js';
import { tempFile } from '../ingest/helpers.js';

async function run(csv: string): Promise<ArrayReport> {
  return checkArrays(normalizeOptions({ tables: [tempFile(csv, 'csv')] }), { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z' });
}

const ruleHits = (r: ArrayReport) =>
  r.findings.filter((f) => f.rule === 'reference-elements').map((f) => [f.location.line, f.messageId, f.location.field, f.severity]);

describe('reference-elements', () => {
  it('accepts zeros for the reference states: diatomic gases, liquids, named solids, and H+(aq) by convention', async () => {
    const report = await run(
      'species,formula,phase,dHf,dGf,S\n' +
        'H2,H2,g,0,0,130.68\nO2,O2,g,0,0,205.152\nN2,N2,g,0,0,191.609\nCl2,Cl2,g,0,0,223.081\nF2,F2,g,0,0,202.791\n' +
        'Br2,Br2,l,0,0,152.21\nC(graphite),C,cr,0,0,5.74\nS(rhombic),S,cr,0,0,32.054\nH+,H+,aq,0,0,0\n',
    );
    expect(ruleHits(report)).toEqual([]);
    expect(report.summary.errors).toBe(0);
  });

  it('flags a zero on an element in another state (O(g), diamond), naming the reference species, on each field', async () => {
    const report = await run('species,formula,phase,dHf,dGf,S\nO,O,g,0,0,161.059\nC(diamond),C,"cr, diamond",0,0,2.377\n');
    expect(ruleHits(report)).toEqual([
      [2, 'zero', 'dHf', 'error'],
      [2, 'zero', 'dGf', 'error'],
      [3, 'zero', 'dHf', 'error'],
      [3, 'zero', 'dGf', 'error'],
    ]);
    const o = report.findings.find((f) => f.rule === 'reference-elements' && f.location.line === 2)!;
    expect(o.message).toContain('the reference is O2(g)');
  });

  it('accepts the published non-zero values of those states (O(g) 249.18 kJ/mol, diamond 1.895 kJ/mol)', async () => {
    const report = await run('species,formula,phase,dHf,dGf,S\nO,O,g,249.18,231.736,161.059\nC(diamond),C,"cr, diamond",1.895,2.900,2.377\n');
    expect(ruleHits(report)).toEqual([]);
  });

  it('flags a non-zero formation value on a reference state, in the declared unit', async () => {
    const report = await run('species,formula,phase,dHf [kcal/mol],dGf [kcal/mol],S\nN2,N2,g,0,0.5,191.609\n');
    expect(ruleHits(report)).toEqual([[2, 'notZero', 'dGf', 'error']]);
    expect(report.findings.find((f) => f.rule === 'reference-elements')!.params).toMatchObject({ value: 0.5, unit: 'kcal/mol' });
  });
});

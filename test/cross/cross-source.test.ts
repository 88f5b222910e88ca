import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { DEFAULT_U, judgeSources, rule } from '../../pipeline/rules/cross-source.js';
import { tempFile } from '../ingest/helpers.js';
import { contextFor, speciesOf } from './helpers.js';

// Published ΔfH° at 298.15 K, kJ/mol, with the compilation each comes from:
//   CODATA = CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989)
//   JANAF  = NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998)
//   NBS    = NBS Tables of Chemical Thermodynamic Properties (Wagman et al. 1982)
//   Gurvich = Thermodynamic Properties of Individual Substances (Gurvich et al. 1989-), from memory
// Rows marked "planted" are invented: the odd source the test must find.
const CO2 = [
  ['CO2', 'g', -393.51, 0.13, 'CODATA 1989'], // CODATA, u = 0.13 kJ/mol
  ['CO2', 'g', -393.522, '', 'JANAF 1998'], // JANAF
  ['CO2', 'g', -393.509, '', 'NBS 1982'], // NBS
  ['CO2', 'g', -383.5, '', 'planted odd source'], // invented: 10 kJ/mol off
  ['CO2', 'g', -393.51, '', 'Gurvich 1989'], // Gurvich (from memory)
];
const NH3 = [
  ['NH3', 'g', -45.94, 0.35, 'CODATA 1989'], // CODATA, u = 0.35 kJ/mol
  ['NH3', 'g', -45.898, '', 'JANAF 1998'], // JANAF
  ['NH3', 'g', -46.11, '', 'NBS 1982'], // NBS
];
const CH4 = [
  ['CH4', 'g', -74.873, '', 'JANAF 1998'], // JANAF
  ['CH4', 'g', -74.81, '', 'NBS 1982'], // NBS
];

function csv(rows: (string | number)[][]): string {
  return 'species,phase,dHf,u_dHf,source\n' + rows.map((r) => r.map((c) => (typeof c === 'string' && c.includes(' ') ? `"${c}"` : c)).join(',')).join('\n') + '\n';
}

async function crossFindings(rows: (string | number)[][]) {
  const { species, path } = await speciesOf(csv(rows));
  const ctx = contextFor(path);
  return species.flatMap((sp) => rule.check!(sp, ctx));
}

describe('cross-source: published values from several compilations agree', () => {
  it('finds nothing for 2, 3 and 4 clean sources', async () => {
    expect(await crossFindings(CH4)).toEqual([]);
    expect(await crossFindings(NH3)).toEqual([]);
    expect(await crossFindings(CO2.filter((r) => r[4] !== 'planted odd source'))).toEqual([]);
  });
});

describe('cross-source: one odd source', () => {
  it('names the odd source of five on its own line, with the median as the correction', async () => {
    const f = await crossFindings(CO2);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ rule: 'cross-source', messageId: 'odd', severity: 'error', species: 'CO2', phase: 'g' });
    expect(f[0]!.location.line).toBe(5); // header is line 1; the planted row is the 4th data row
    expect(f[0]!.location.field).toBe('dHf');
    expect(f[0]!.params.source).toBe('planted odd source');
    // median of the five: −393.51 (CODATA and Gurvich), the spread −383.5 − (−393.522) = 10.022 kJ/mol
    expect(f[0]!.diagnosis).toMatchObject({ cause: 'odd-source', field: 'dHf', unit: 'kJ/mol', residualAfter: 0 });
    expect(f[0]!.diagnosis!.corrected).toBeCloseTo(-393.51, 6);
    expect(f[0]!.params.spread).toBeCloseTo(10.022, 6);
    expect(f[0]!.params.inUse).toBe('no');
  });

  it('names the odd source of three', async () => {
    // NH3 with NBS replaced by a value 10 kJ/mol off (planted)
    const f = await crossFindings([NH3[0]!, NH3[1]!, ['NH3', 'g', -35.94, '', 'planted odd source']]);
    expect(f.map((x) => [x.messageId, x.location.line, x.params.source])).toEqual([['odd', 4, 'planted odd source']]);
    expect(f[0]!.diagnosis!.corrected).toBeCloseTo(-45.898, 6); // median of −45.94, −45.898, −35.94
  });

  it('says two sources disagree without picking one, on the later row', async () => {
    // CH4: JANAF and a planted value 9 kJ/mol off: beyond 2·√(1² + 1²) = 2.83 kJ/mol (defaults)
    const f = await crossFindings([CH4[0]!, ['CH4', 'g', -83.873, '', 'planted odd source']]);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ messageId: 'two', severity: 'warning' });
    expect(f[0]!.location.line).toBe(3);
    expect(f[0]!.diagnosis).toBeUndefined();
    expect(f[0]!.params.spread).toBeCloseTo(9, 6);
    expect(f[0]!.params.tolerance).toBeCloseTo(2 * Math.SQRT2, 4);
  });

  it('respects stated uncertainties: a wide stated uncertainty absorbs the same difference', async () => {
    const f = await crossFindings([
      ['CH4', 'g', -74.873, 4, 'JANAF 1998'],
      ['CH4', 'g', -83.873, 4, 'planted wide source'],
    ]);
    expect(f).toEqual([]); // 9 < 2·√(4² + 4²) = 11.3 kJ/mol
  });

  it('tells an odd source in another file and another unit (kcal/mol)', async () => {
    const a = tempFile(csv(CO2.filter((r) => r[4] !== 'planted odd source')));
    // −383.5 kJ/mol = −91.659 kcal/mol (thermochemical calorie 4.184 J, exact)
    const b = tempFile('species,phase,dHf [kcal/mol],source\nCO2,g,-91.6587,planted odd source\n');
    const report = await checkArrays(normalizeOptions({ tables: [a, b] }), { version: 't', generatedAt: '' });
    const f = report.findings.filter((x) => x.rule === 'cross-source');
    expect(f).toHaveLength(1);
    expect(f[0]!.location).toMatchObject({ file: expect.stringContaining(b.split('/').pop()!), line: 2 });
    expect(f[0]!.params.offBy).toBeCloseTo(10.01, 2);
  });
});

describe('cross-source: tables merged from several files without a source column', () => {
  it('takes each file for a source and names the odd file', async () => {
    // NH3(g) ΔfH° from CODATA (−45.94), JANAF (−45.898), NBS (−46.11); a fourth file planted 10 kJ/mol off
    const files = [-45.94, -45.898, -46.11, -35.94].map((v) => tempFile(`species,phase,dHf\nNH3,g,${v}\n`));
    const report = await checkArrays(normalizeOptions({ tables: files }), { version: 't', generatedAt: '' });
    const f = report.findings.filter((x) => x.rule === 'cross-source');
    expect(f).toHaveLength(1);
    expect(f[0]!.location.file).toBe(report.provenance.inputs[3]!.path);
    expect(f[0]!.messageId).toBe('odd');
  });
});

describe('cross-source statistics', () => {
  const u = DEFAULT_U.dHf;
  it('does not explode when most values are identical (MAD = 0): the scale has a floor', () => {
    const v = [0, 0, 0, 0, 300].map((value) => ({ value, u }));
    expect(judgeSources(v, u)).toEqual({ kind: 'agree' }); // 0.3 kJ/mol is within the default uncertainty
  });
  it('gives no odd one out when the sources scatter with no majority', () => {
    const v = [0, 5000, 10000].map((value) => ({ value, u }));
    expect(judgeSources(v, u).kind).toBe('spread');
  });
  it('flags two odd sources of five when three agree', () => {
    const v = [0, 0, 100, 20000, -20000].map((value) => ({ value, u }));
    const r = judgeSources(v, u);
    expect(r.kind).toBe('odd');
    expect(r.kind === 'odd' && r.odd.map((o) => o.index)).toEqual([3, 4]);
  });
});

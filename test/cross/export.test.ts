import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { check } from '../../pipeline/check.js';
import { loadSpecies } from '../../pipeline/equilibrium/species.js';
import { exportTables } from '../../pipeline/export/index.js';
import { numberCell, textCell } from '../../pipeline/export/csv.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { Species } from '../../pipeline/types.js';
import { readReport, thermovet } from '../cli/run.js';
import { tempFile } from '../ingest/helpers.js';

const run = { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z', waiverDay: '1970-01-01' };
const out = mkdtempSync(join(tmpdir(), 'thermovet-export-'));
const K = 4.184; // thermochemical calorie, J, exact

// Formation values from test/rules/published.ts (CODATA Key Values 1989, NIST-JANAF 1998, NBS 1982),
// written here in kcal/mol and cal/(mol K) so the export has to convert them.
// Cp correlations:
//   H2O(g) Shomate 500–1700 K, NIST-JANAF fit as published in the NIST Chemistry WebBook (from memory);
//   N2(g) Maier–Kelley a + bT + cT⁻² in cal/(mol K): 6.83, 0.90e-3, −0.12e5, 298–2500 K (Kelley 1960, from memory);
//   H2(g) tabulated Cp, J/(mol K), at 300/400/500/600 K: 28.849 29.181 29.260 29.327 (NIST-JANAF, from memory);
//   CH4(g) NASA 7-coefficient, 200–1000 and 1000–3500 K (GRI-Mech 3.0 thermo data, from memory).
const kc = (kJ: number): string => String(Number((kJ / K).toPrecision(12)));
const ROWS = [
  `H2O,g,${kc(-241.826)},${kc(-228.582)},${188.835 / K},CODATA/JANAF,shomate,,,30.092 6.832514 6.793435 -2.53448 0.082139 -250.881 223.3967 -241.8264,500,1700`,
  `N2,g,0,0,${191.609 / K},CODATA,poly,0 1 -2,cal/(mol K),6.83 0.00090 -12000,298,2500`,
  `H2,g,0,0,${130.68 / K},CODATA,table,300 400 500 600,J/(mol K),28.849 29.181 29.260 29.327,,`,
  `CH4,g,${kc(-74.873)},${kc(-50.768)},${186.251 / K},JANAF,nasa7,,,5.14987613 -0.0136709788 4.91800599e-05 -4.84743026e-08 1.66693956e-11 -10246.6476 -4.64130376,200,1000`,
  `CH4,g,${kc(-74.873)},${kc(-50.768)},${186.251 / K},JANAF,nasa7,,,0.074851495 0.0133909467 -5.73285809e-06 1.22292535e-09 -1.0181523e-13 -9468.34459 18.437318,1000,3500`,
  `CO2,g,${kc(-393.522)},${kc(-394.389)},${213.795 / K},CODATA/JANAF,,,,,,`,
  `CO2,g,${kc(-393.51)},${kc(-394.39)},${213.785 / K},NBS 1982,,,,,,`,
  `CO2,g,${kc(-383.5)},${kc(-394.389)},${213.795 / K},planted odd source,,,,,,`,
  // planted: a ΔfG° off by 5 kJ/mol (a Gibbs–Helmholtz error), invented
  `NH3,g,${kc(-45.898)},${kc(-21.367)},${192.77 / K},planted error,,,,,,`,
  // planted text cells a spreadsheet would run as formulas (invented); the values are H2O2(g), NBS 1982
  `"=HYPERLINK(""http://example.invalid"")",g,${kc(-136.31)},${kc(-105.57)},${232.7 / K},"@SUM(1+1)",,,,,,`,
];
const HEADER = 'species,phase,dHf [kcal/mol],dGf [kcal/mol],S [cal/(mol K)],source,cp_model,cp_exponents,cp_unit,cp_coeffs,cp_Tmin,cp_Tmax';
// the formula of the hostile name must be given: the name is no formula
const TABLE = HEADER + ',formula\n' + ROWS.map((r) => (r.startsWith('"=') ? r + ',H2O2' : r + ',')).join('\n') + '\n';

function sameSpecies(a: Species, b: Species): void {
  for (const f of ['dHf', 'dGf', 'S'] as const) {
    if (a[f] === undefined) expect(b[f]).toBeUndefined();
    else expect(b[f]! / a[f]! - 1 || 0, `${a.key} ${f}`).toBeCloseTo(0, 8); // 10 significant digits are written: relative error ≤ 5e-10
  }
  expect(b.cp.length).toBe(a.cp.length);
  a.cp.forEach((c, i) => {
    const d = b.cp[i]!;
    expect([d.model, d.Tmin, d.Tmax]).toEqual([c.model, c.Tmin, c.Tmax]);
    c.coeffs.forEach((x, k) => expect((d.coeffs[k]! * d.unitFactor) / (x * c.unitFactor) - 1).toBeCloseTo(0, 8));
    expect(d.exponents).toEqual(c.exponents);
    expect(d.temps).toEqual(c.temps);
  });
}

describe('export round trip', async () => {
  const src = tempFile(TABLE);
  const file = join(out, 'vetted.csv');
  const options = normalizeOptions({ tables: [src] });
  const r = await exportTables(options, { out: file, dropOn: 'error' }, run);
  const text = readFileSync(file, 'utf8');

  it('leaves out what fails: the species with an error, the odd source row; writes the rest', () => {
    expect(r.rowsRead).toBe(10);
    expect(r.speciesLeftOut).toEqual(['NH3|g']);
    expect(r.rowsLeftOut).toBe(2); // NH3 and the planted CO2 row (its source only: the published CO2 rows stay)
    expect(r.rowsWritten).toBe(8);
    expect(text).not.toMatch(/planted/);
    expect(readdirSync(out).filter((n) => n.endsWith('.tmp'))).toEqual([]);
  });

  it('checking the export gives the same accepted rows and no errors', async () => {
    const again = await check(normalizeOptions({ tables: [file] }), run);
    expect(again.summary).toMatchObject({ rows: r.rowsWritten, accepted: r.rowsWritten, rejected: 0, errors: 0 });
    const before = (await loadSpecies(options)).species.filter((s) => s.key !== 'NH3|g');
    const after = (await loadSpecies(normalizeOptions({ tables: [file] }))).species;
    // the hostile name comes back with its protective apostrophe
    const rename = (k: string): string => (k.startsWith('=') ? `'${k}` : k);
    expect(after.map((s) => s.key).sort()).toEqual(before.map((s) => rename(s.key)).sort());
    for (const a of before) {
      const b = after.find((s) => s.key === rename(a.key))!;
      if (a.key === 'CO2|g') {
        // the planted source is gone; the two published sources remain
        expect(b.values.map((v) => v.source)).toEqual(['CODATA/JANAF', 'NBS 1982']);
      }
      sameSpecies(a, b);
    }
  });

  it('is idempotent: exporting the export gives the same rows', async () => {
    const file2 = join(out, 'vetted2.csv');
    await exportTables(normalizeOptions({ tables: [file] }), { out: file2, dropOn: 'error' }, run);
    const rows = (t: string): string[] => t.split('\n').filter((l) => l && !l.startsWith('#'));
    expect(rows(readFileSync(file2, 'utf8'))).toEqual(rows(text));
  });

  it('writes SI values in the declared units, numbers as numbers, a provenance header and the report beside it', () => {
    const lines = text.split('\n');
    expect(lines[0]).toMatch(/^# thermovet test export/);
    expect(text).toMatch(/^# input .* sha256 [0-9a-f]{64}$/m);
    expect(lines.find((l) => l.startsWith('species,'))).toBe(
      'species,formula,phase,dHf [kJ/mol],dGf [kJ/mol],S [J/(mol K)],u_dHf [kJ/mol],u_dGf [kJ/mol],u_S [J/(mol K)],P_ref [bar],cp_model,cp_exponents,cp_unit,cp_coeffs,cp_T [K],cp_Tmin [K],cp_Tmax [K],source',
    );
    // −241.826 kJ/mol given in kcal/mol comes back as the published number; a negative number is not touched
    expect(lines.find((l) => l.startsWith('H2O,'))).toMatch(/^H2O,H2O,g,-241\.826,-228\.582,188\.835,/);
    // Maier–Kelley in cal/(mol K) -> J/(mol K): 6.83·4.184 = 28.57672, 0.0009·4.184 = 0.0037656, −12000·4.184 = −50208
    expect(lines.find((l) => l.startsWith('N2,'))).toMatch(/,poly,0 1 -2,J\/\(mol K\),28\.57672 0\.0037656 -50208,/);
    const report = readReport(r.reportPath);
    expect(report.summary.rows).toBe(10);
  });

  it('neutralises spreadsheet formulas in text cells', () => {
    const line = text.split('\n').find((l) => l.includes('HYPERLINK'))!;
    expect(line.startsWith(`"'=HYPERLINK(""http://example.invalid"")",H2O2,g,-136.31,`)).toBe(true);
    expect(line.endsWith(`,"'@SUM(1+1)"`)).toBe(true);
  });
});

describe('export at the terminal', () => {
  it('names the species left out inert: escapes from the data never reach the terminal raw', () => {
    // an invented species name carrying an ANSI colour sequence; its ΔfG° of 0 fails Gibbs–Helmholtz, so it is left out
    const p = tempFile('species,formula,phase,dHf,dGf,S\n"\u001b[31mEVIL",CO,g,-110.53,0,197.66\n');
    const r = thermovet(['export', p, '-o', join(mkdtempSync(join(tmpdir(), 'thermovet-export-')), 'v.csv')]);
    expect(r.stdout).toContain('species left out: \\u001b[31mEVIL (g)');
    expect(r.stdout).not.toContain('\u001b');
  });
});

describe('export cells', () => {
  it('protects every formula-starting character and leaves other text alone', () => {
    expect(['=1', '+1', '-1', '@A', '\tx', '\rx'].map((t) => textCell(t))).toEqual(['"\'=1"', '"\'+1"', '"\'-1"', '"\'@A"', '"\'\tx"', '"\'\rx"']);
    expect(textCell('NH4+')).toBe('NH4+');
    expect(textCell('a,b')).toBe('"a,b"');
    expect(textCell('#x', true)).toBe('"\'#x"');
    expect(textCell('#x')).toBe('#x');
    expect(numberCell(-241.826)).toBe('-241.826');
    expect(numberCell(-57.79780115 * 4.184)).toBe('-241.826'); // kcal round-off hidden at 10 digits
  });
});

describe('export with waivers and from the CLI', () => {
  it('keeps a species whose error is waived, and writes both files', () => {
    const src = tempFile(TABLE);
    const waivers = tempFile(
      '- rule: gibbs-helmholtz\n  species: NH3\n  phase: g\n  reason: planted in the test\n  accepted_by: test\n  expires: 2999-12-31\n',
      'yaml',
    );
    const file = join(out, 'waived.csv');
    const r = thermovet(['export', src, '--waivers', waivers, '--out', file, '--deterministic']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/left out 1, written 9/);
    expect(readFileSync(file, 'utf8')).toMatch(/^NH3,NH3,g,-45\.898,/m);
    expect(readReport(join(out, 'waived.report.json')).findings.some((f: { waived?: unknown }) => f.waived)).toBe(true);
  });

  it('exits 2 without --out, 1 with --fail-on error on an input with errors', () => {
    const src = tempFile(TABLE);
    expect(thermovet(['export', src]).code).toBe(2);
    expect(thermovet(['export', src, '--out', join(out, 'x.csv'), '--fail-on', 'error', '-q']).code).toBe(1);
  });
});

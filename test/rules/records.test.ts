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

describe('one species repeated very many times (generated or hostile tables)', () => {
  it('5000 sources agreeing give no finding; one odd among them is found on its line', async () => {
    const rows = Array.from({ length: 5000 }, (_, i) => `CO2,g,${i === 4321 ? -390.0 : -393.522},-394.389,213.795,src${i}`);
    const r = await run(tempFile('species,phase,dHf,dGf,S,source\n' + rows.join('\n') + '\n'));
    expect(r.summary).toMatchObject({ rows: 5000, accepted: 5000, species: 1 });
    // the odd ΔfH° also breaks Gibbs–Helmholtz on its own row
    expect(r.findings.map((f) => [f.rule, f.location.line])).toEqual([['cross-source', 4323], ['gibbs-helmholtz', 4323]]);
  });

  it('refuses Cp ranges past the per-species limit, each with a finding, and keeps the rows', async () => {
    // CO(g) Shomate fit, 298–1300 K, NIST Chemistry WebBook (from memory), cut into 1 K ranges
    const coeffs = '25.56759 6.09613 4.054656 -2.671301 0.131021 -118.0089 227.3665 -110.5271';
    const rows = Array.from({ length: 250 }, (_, i) => `CO,g,-110.53,-137.163,197.66,shomate,${coeffs},${298 + i},${299 + i}`);
    const r = await run(tempFile('species,phase,dHf,dGf,S,cp_model,cp_coeffs,cp_Tmin,cp_Tmax\n' + rows.join('\n') + '\n'));
    expect(r.summary).toMatchObject({ rows: 250, accepted: 250 });
    const refused = r.findings.filter((f) => f.rule === 'bad-cp-spec' && f.messageId === 'tooMany');
    expect(refused).toHaveLength(50);
    expect(refused[0]!.location.line).toBe(202);
  });
});

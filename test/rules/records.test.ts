import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import { SpeciesStore } from '../../pipeline/records.js';
import { readTable, tempFile } from '../ingest/helpers.js';

// CO2(g): ΔfH° −393.522 kJ/mol, ΔfG° −394.389 kJ/mol, S° 213.795 J/(mol K) (CODATA 1989; NIST-JANAF 1998).
const head = 'species,phase,dHf,dGf,S\n';
const run = (...tables: string[]) => checkArrays(normalizeOptions({ tables }), { version: 't', generatedAt: '1970-01-01T00:00:00.000Z' });

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

describe('the species store (columns, one Species built per request)', () => {
  // H2O: ΔfH° −241.826 (g) and −285.830 (l) kJ/mol, S° 188.835 (g) and 69.95 (l) J/(mol K) (CODATA 1989);
  // CO2 as above. Cp: O2(g) Shomate coefficients, 100–700 K and 700–2000 K (NIST Chemistry WebBook, from memory).
  const o2lo = '31.32234 -20.23531 57.86644 -36.50624 -0.007374 -8.903471 246.7945 0';
  const o2hi = '30.03235 8.772972 -3.988133 0.788313 -0.741599 -11.32468 236.1663 0';
  // H2O(g) Shomate, 500–1700 K (NIST Chemistry WebBook, from memory)
  const h2o = '30.092 6.832514 6.793435 -2.53448 0.082139 -250.881 223.3967 -241.8264';
  const csv =
    'species,phase,dHf,dGf,S,u_dHf,cp_model,cp_coeffs,cp_Tmin,cp_Tmax,source\n' +
    'H2O,g,,,,0.04,shomate,' + h2o + ',500,1700,A\n' + // line 2: a Cp range and an uncertainty, no values: the record takes the uncertainty, the row is no value row
    'CO2,g,-393.522,-394.389,213.795,,,,,,A\n' +
    'H2O,l,-285.830,-237.129,69.95,,,,,,A\n' +
    'O2,g,0,0,205.152,,shomate,' + o2hi + ',700,2000,A\n' +
    'H2O,g,-241.826,-228.582,188.835,0.5,,,,,A\n' + // line 6: the first values of H2O(g); its u_dHf does not replace line 2's
    'O2,g,0,0,205.152,,shomate,' + o2lo + ',100,700,A\n' + // line 7: a second range, sorted before the first when built
    'H2O,g,-241.826,-228.582,188.835,0.5,,,,,B\n';

  it('folds interleaved rows per species and phase, in input order, and builds each Species on request', async () => {
    const { rows, findings } = await readTable(csv);
    const store = new SpeciesStore();
    for (const r of rows) findings.push(...store.add(r));
    expect(findings).toEqual([]);
    const list = store.view();
    expect(Array.from({ length: list.length }, (_, i) => `${list.name(i)}|${list.phase(i)}`)).toEqual(['CO2|g', 'H2O|g', 'H2O|l', 'O2|g']);
    const water = list.at(1);
    expect(water).toMatchObject({ key: 'H2O|g', dHf: -241826, dGf: -228582, S: 188.835, u: { dHf: 40 }, location: { line: 2 } });
    expect(water.values.map((v) => [v.location.line, v.source, v.u_dHf])).toEqual([[6, 'A', 500], [8, 'B', 500]]);
    expect(water.cp.map((c) => [c.model, c.Tmin, c.Tmax, c.location.line])).toEqual([['shomate', 500, 1700, 2]]);
    expect(list.S(1)).toBe(188.835);
    expect(list.at(2)).toMatchObject({ key: 'H2O|l', dHf: -285830, S: 69.95, values: [{ location: { line: 4 } }] });
    const o2 = list.at(3);
    expect(o2.cp.map((c) => [c.Tmin, c.Tmax, c.location.line])).toEqual([[100, 700, 7], [700, 2000, 5]]);
    expect(o2.cp[0]!.coeffs).toEqual(o2lo.split(' ').map(Number));
    expect(list.cpCount(3)).toBe(2);
    expect(list.at(3)).not.toBe(o2); // built afresh on every call
    expect(list.at(3)).toEqual(o2);
    expect(store.list().map((s) => s.key)).toEqual(['CO2|g', 'H2O|g', 'H2O|l', 'O2|g']);
  });

  it('past 16 rows of one source, repeats and conflicts are still found against the first row (the per-species index)', async () => {
    const rows = Array.from({ length: 40 }, (_, i) => `CO2,g,${i === 30 ? -390.0 : -393.522},-394.389,${213.795 + (i < 20 ? i : 0)},S`);
    const { rows: parsed, findings } = await readTable('species,phase,dHf,dGf,S,source\n' + rows.join('\n') + '\n');
    const store = new SpeciesStore();
    for (const r of parsed) findings.push(...store.add(r));
    // rows 1–19 give other S° values from the same source: conflicts with line 2; rows 20–39 repeat line 2
    // exactly (duplicates) except row 30, whose ΔfH° conflicts
    const conflicts = findings.filter((f) => f.rule === 'conflicting-values');
    expect(conflicts.map((f) => [f.location.line, f.location.field])).toEqual([...Array.from({ length: 19 }, (_, i) => [i + 3, 'S']), [32, 'dHf']]);
    const dups = findings.filter((f) => f.rule === 'duplicate-row');
    expect(dups).toHaveLength(19);
    expect(dups.every((f) => f.params.firstLine === 2)).toBe(true);
    expect(store.view().at(0).values).toHaveLength(21);
  });
});

import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import { R_J_PER_MOL_K } from '../../pipeline/cp/constants.js';
import { diffDatasets } from '../../pipeline/diff/index.js';
import { thermovet } from '../cli/run.js';
import { tempFile } from '../ingest/helpers.js';

// The fixture and its planted changes are described in test/fixtures-cross/diff/README.md.
const DIR = 'test/fixtures-cross/diff';
const run = { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z', waiverDay: '1970-01-01' };
const R = R_J_PER_MOL_K; // CODATA 2018, J/(mol K)

const ajv = new Ajv({ allErrors: true, strict: false });
const validateDiff = ajv.compile(JSON.parse(readFileSync('schemas/diff.schema.json', 'utf8')));

describe('diff of two versions of a small dataset', async () => {
  const d = await diffDatasets({ path: `${DIR}/v1.csv` }, { path: `${DIR}/v2.csv` }, { reactionsFile: `${DIR}/reactions.csv`, failOn: 'error' }, run);

  it('reports every kind of change exactly once', () => {
    expect(d.species.added.map((s) => s.key).sort()).toEqual(['C2H6|g', 'NO|g']);
    expect(d.species.removed.map((s) => s.key)).toEqual(['NH3|g']);
    const changes = d.species.changed.flatMap((s) => s.changes.map((c) => `${s.key} ${c.field}`)).sort();
    expect(changes).toEqual(['CH4|g sources', 'CO2|g dHf', 'CO|g dGf', 'H2|g u_S', 'O2|g cp']);
    // H2O: only the declared unit of its columns changed (kJ/mol -> kcal/mol, same values): not a change
    expect(d.species.changed.find((s) => s.key === 'H2O|g')).toBeUndefined();
    expect(d.summary).toMatchObject({ speciesAdded: 2, speciesRemoved: 1, speciesChanged: 5, fieldChanges: 5, findingsAppeared: 1, findingsGone: 1, failing: 1 });
    expect(d.findings.appeared.map((f) => [f.rule, f.species])).toEqual([['gibbs-helmholtz', 'CO2']]);
    expect(d.findings.gone.map((f) => [f.rule, f.location.line])).toEqual([['bad-number', 12]]);
    expect(validateDiff(JSON.parse(JSON.stringify(d))), ajv.errorsText(validateDiff.errors)).toBe(true);
  });

  it('gives each value in its declared unit', () => {
    const co2 = d.species.changed.find((s) => s.key === 'CO2|g')!.changes[0]!;
    expect(co2).toMatchObject({ old: -393.522, oldUnit: 'kJ/mol', newUnit: 'kcal/mol' });
    expect(co2.new as number).toBeCloseTo(-391.522 / 4.184, 7); // thermochemical calorie, 4.184 J exactly
    expect(co2.delta!).toBeCloseTo(2 / 4.184, 7);
    expect(co2.location.line).toBe(7);
  });

  // Hand computation: ln K = −ΔrG°/(RT). ΔfH° of a species (route ΔfH° + S°) moved by δ at fixed S° and Cp
  // moves its G(T) by δ at every T, so Δln K = −ν·δ/(RT); the same holds for ΔfG° of a species given
  // by ΔfG° and S° (its ΔfH° = ΔfG° + T0·ΔfS° moves by δ). Tolerance 5e-8: v2.csv gives kcal/mol to 10
  // significant digits, so δ itself is exact only to about 2e-8 kJ/mol (4e-9 in ln K at 500 K).
  it('gives the Δln K of the CO2 ΔfH° change (+2 kJ/mol, ν = +1) as −ν·δ/(RT)', () => {
    const ch = d.species.changed.find((s) => s.key === 'CO2|g')!.changes[0]!;
    expect(ch.lnK).toHaveLength(1);
    expect(ch.lnK![0]!.reaction).toBe('wgs');
    for (const { T, delta } of ch.lnK![0]!.deltaLnK) expect(delta).toBeCloseTo((-1 * 2000) / (R * T), 7);
    expect(ch.lnK![0]!.deltaLnK.map((p) => p.T)).toEqual([500, 800, 1000]);
    expect(ch.lnK![0]!.T_K).toBe(500);
    expect(ch.lnK![0]!.maxAbsDeltaLnK).toBeCloseTo(2000 / (R * 500), 7);
  });

  it('gives the Δln K of the CO ΔfG° change (−1.5 kJ/mol, ν = −1, route ΔfG° + S°) as −ν·δ/(RT)', () => {
    const ch = d.species.changed.find((s) => s.key === 'CO|g')!.changes[0]!;
    for (const { T, delta } of ch.lnK![0]!.deltaLnK) expect(delta).toBeCloseTo((-(-1) * -1500) / (R * T), 7);
  });

  it('says why changes that do not enter ln K have no Δln K', () => {
    const h2 = d.species.changed.find((s) => s.key === 'H2|g')!.changes[0]!;
    expect(h2.lnK).toBeUndefined();
    expect(h2.lnKNote).toMatch(/uncertainty/);
  });

  it('gives old and new ln K of the reaction, the whole change being the sum of the two (ln K is linear in them)', () => {
    expect(d.reactions).toHaveLength(1);
    const r = d.reactions[0]!;
    expect(r.computed).toBe('both');
    for (const p of r.points) expect(p.deltaLnK!).toBeCloseTo((-2000 - 1500) / (R * p.T), 7);
  });
});

describe('diff: a ΔfG° change on a species whose route reads ΔfH° and S°', () => {
  it('moves ln K by zero and says so', async () => {
    const head = 'species,phase,dHf,dGf,S\n';
    // CODATA/JANAF values as in test/rules/published.ts; v2 moves H2O(g) ΔfG° by +0.05 kJ/mol (invented)
    const rest = 'CO,g,-110.53,-137.163,197.66\nCO2,g,-393.522,-394.389,213.795\nH2,g,0,0,130.68\n';
    const v1 = tempFile(head + 'H2O,g,-241.826,-228.582,188.835\n' + rest);
    const v2 = tempFile(head + 'H2O,g,-241.826,-228.532,188.835\n' + rest);
    const rx = tempFile('id,equation,T\nwgs,CO(g) + H2O(g) = CO2(g) + H2(g),800\n');
    const d = await diffDatasets({ path: v1 }, { path: v2 }, { reactionsFile: rx, failOn: 'error' }, run);
    const ch = d.species.changed[0]!.changes[0]!;
    expect(ch.field).toBe('dGf');
    expect(ch.lnK![0]!.maxAbsDeltaLnK).toBe(0);
    expect(ch.lnKNote).toMatch(/does not read this field/);
  });
});

describe('thermovet diff (CLI)', () => {
  const out = mkdtempSync(join(tmpdir(), 'thermovet-diff-'));
  it('exits 1 when the new version introduces an error, writes JSON that validates, and 0 with --fail-on never', () => {
    const json = join(out, 'd.json');
    const r = thermovet(['diff', `${DIR}/v1.csv`, `${DIR}/v2.csv`, '--reactions', `${DIR}/reactions.csv`, '--json', json, '--deterministic']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/2 added, 1 removed, 5 changed/);
    expect(r.stdout).toMatch(/wgs -0\.481089 at 500 K/);
    const data = JSON.parse(readFileSync(json, 'utf8'));
    expect(validateDiff(data), ajv.errorsText(validateDiff.errors)).toBe(true);
    expect(thermovet(['diff', `${DIR}/v1.csv`, `${DIR}/v2.csv`, '--fail-on', 'never', '-q']).code).toBe(0);
    // -r is --reactions here too, as for check and lnk (the README's example uses it)
    expect(thermovet(['diff', `${DIR}/v1.csv`, `${DIR}/v2.csv`, '-r', `${DIR}/reactions.csv`, '--fail-on', 'never']).stdout).toMatch(/wgs -0\.481089 at 500 K/);
  });
  it('exits 0 when nothing changed, and 2 on a missing file', () => {
    expect(thermovet(['diff', `${DIR}/v1.csv`, `${DIR}/v1.csv`, '-q']).code).toBe(0);
    const r = thermovet(['diff', `${DIR}/v1.csv`, `${DIR}/nope.csv`]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/nope\.csv/);
  });
});

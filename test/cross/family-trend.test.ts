import { describe, expect, it } from 'vitest';
import { entropyAtomFindings } from '../../pipeline/rules/entropy-atoms.js';
import { familyTrendFindings, findSeries } from '../../pipeline/rules/family-trend.js';
import { PUBLISHED } from '../rules/published.js';
import { speciesOf } from './helpers.js';

// Gas-phase n-alkanes at 298.15 K: ΔfH° kJ/mol, S° J/(mol K).
// CH4 from NIST-JANAF (Chase 1998: −74.873, 186.251); C2–C7 from the TRC Thermodynamic Tables and
// Pedley's compilation (Pedley, Naylor and Kirby 1986), from memory.
const ALKANES: [string, number, number][] = [
  ['CH4', -74.87, 186.25],
  ['C2H6', -84.0, 229.2],
  ['C3H8', -104.7, 270.3],
  ['n-butane', -125.6, 310.2],
  ['n-pentane', -146.8, 349.5],
  ['n-hexane', -166.9, 388.8],
  ['n-heptane', -187.8, 428.0],
];
// isobutane (2-methylpropane), gas: ΔfH° −134.2 kJ/mol, S° 295.4 J/(mol K) (TRC, from memory): an isomer
// at C4 that must not be taken for the straight-chain member.
const ISOBUTANE: [string, number, number] = ['isobutane', -134.2, 295.4];
// Gas-phase 1-alkanols, ΔfH° kJ/mol (Pedley, Naylor and Kirby 1986, from memory).
const ALCOHOLS: [string, string, number][] = [
  ['methanol', 'CH3OH', -201.0],
  ['ethanol', 'C2H5OH', -234.8],
  ['1-propanol', 'C3H7OH', -255.1],
  ['1-butanol', 'C4H9OH', -274.9],
  ['1-pentanol', 'C5H11OH', -294.6],
];
const FORMULA: Record<string, string> = { 'n-butane': 'C4H10', 'n-pentane': 'C5H12', 'n-hexane': 'C6H14', 'n-heptane': 'C7H16', isobutane: 'C4H10' };

function table(alkanes = ALKANES, extra: string[] = []): string {
  const rows = alkanes.map(([n, h, s]) => `${n},${FORMULA[n] ?? n},g,${h},${s}`);
  const alcohols = ALCOHOLS.map(([n, f, h]) => `${n},${f},g,${h},`);
  return ['species,formula,phase,dHf,S', ...rows, ...alcohols, ...extra].join('\n') + '\n';
}

async function trend(csv: string) {
  const { species } = await speciesOf(csv);
  return { findings: familyTrendFindings(species), series: findSeries(species) };
}

describe('family-trend on published homologous series', () => {
  it('finds the n-alkane and 1-alkanol series and flags nothing in the clean data', async () => {
    const { findings, series } = await trend(table([...ALKANES, ISOBUTANE]));
    expect(series.map((s) => [s.label, s.members.map((m) => m.name)])).toEqual([
      ['CnH2n+2', ['CH4', 'C2H6', 'C3H8', 'n-butane', 'n-pentane', 'n-hexane', 'n-heptane']],
      ['CnH2n+2O', ['methanol', 'ethanol', '1-propanol', '1-butanol', '1-pentanol']],
    ]);
    expect(findings).toEqual([]);
  });

  it('finds a planted off-trend ΔfH° (n-pentane 10 kJ/mol high) on its line, naming the expected value', async () => {
    const planted = ALKANES.map((r): [string, number, number] => (r[0] === 'n-pentane' ? [r[0], -136.8, r[2]] : r));
    const { findings } = await trend(table(planted));
    expect(findings).toHaveLength(1);
    const f = findings[0]!;
    expect(f).toMatchObject({ rule: 'family-trend', severity: 'warning', species: 'n-pentane', location: { line: 6, field: 'dHf' } });
    // the line through C2–C4, C6, C7 must give the published C5 value (−146.8) to within 1 kJ/mol, the
    // scatter of the published CH2 increments (−20.7 … −21.2 kJ/mol between C2 and C7)
    expect(Math.abs((f.params.expected as number) - -146.8)).toBeLessThan(1);
    expect(Math.abs((f.params.increment as number) - -20.6)).toBeLessThan(0.5);
    expect(Math.abs((f.params.offBy as number) - 10)).toBeLessThan(1);
  });

  it('finds a planted off-trend S° (n-butane 10 J/(mol K) high)', async () => {
    const planted = ALKANES.map((r): [string, number, number] => (r[0] === 'n-butane' ? [r[0], r[1], 320.2] : r));
    const { findings } = await trend(table(planted));
    expect(findings.map((f) => [f.species, f.location.field, f.location.line])).toEqual([['n-butane', 'S', 5]]);
    // expected within 1 J/(mol K) of the published 310.2 (the scatter of the S° increments, 39.3 … 41.1)
    expect(Math.abs((findings[0]!.params.expected as number) - 310.2)).toBeLessThan(1);
  });

  it('finds a kcal/mol value entered as kJ/mol (n-hexane −166.9/4.184) and only that', async () => {
    const planted = ALKANES.map((r): [string, number, number] => (r[0] === 'n-hexane' ? [r[0], -39.89, r[2]] : r));
    const { findings } = await trend(table(planted));
    expect(findings.map((f) => f.species)).toEqual(['n-hexane']);
  });

  it('finds an off-trend 1-alkanol (1-butanol 12 kJ/mol low)', async () => {
    const csv = table().replace('1-butanol,C4H9OH,g,-274.9', '1-butanol,C4H9OH,g,-286.9');
    const { findings } = await trend(csv);
    expect(findings.map((f) => f.species)).toEqual(['1-butanol']);
  });

  it('sets the first member aside: CH4 off the line is a known effect, not flagged', async () => {
    const planted = ALKANES.map((r): [string, number, number] => (r[0] === 'CH4' ? [r[0], -50, r[2]] : r));
    expect((await trend(table(planted))).findings).toEqual([]);
  });

  it('needs four members besides the first: C1–C4 is not fitted', async () => {
    const short = ALKANES.slice(0, 4).map((r): [string, number, number] => (r[0] === 'C3H8' ? [r[0], -150, r[2]] : r));
    const { findings, series } = await trend(table(short));
    expect(series.map((s) => s.label)).toEqual(['CnH2n+2O']);
    expect(findings).toEqual([]);
  });

  it('leaves out a carbon count whose isomers the names cannot tell apart', async () => {
    // two C4H10 rows, neither named as the straight chain
    const rows = ALKANES.map((r): [string, number, number] => (r[0] === 'n-butane' ? ['butane A', r[1], r[2]] : r));
    FORMULA['butane A'] = 'C4H10';
    FORMULA['butane B'] = 'C4H10';
    const { series } = await trend(table([...rows, ['butane B', -134.2, 295.4]]));
    expect(series[0]!.members.map((m) => m.n)).toEqual([1, 2, 3, 5, 6, 7]);
  });
});

describe('entropy-atoms screen', () => {
  const gases = PUBLISHED.filter((p) => p.phase === 'g');
  const csvOf = (rows: typeof gases) => 'species,phase,S\n' + rows.map((r) => `${r.species},${r.phase},${r.S}`).join('\n') + '\n';

  it('flags none of the published gas entropies (test/rules/published.ts: CODATA, JANAF, NBS)', async () => {
    const { species } = await speciesOf(csvOf(gases));
    expect(entropyAtomFindings(species)).toEqual([]);
  });

  it('flags an entropy given in cal/(mol K) where J/(mol K) is declared, and a J value read as kJ', async () => {
    const slipped = gases.map((g) => (g.species === 'SO2' ? { ...g, S: 248.212 / 4.184 } : g.species === 'NO2' ? { ...g, S: 240.034 * 1000 } : g));
    const { species } = await speciesOf(csvOf(slipped));
    const f = entropyAtomFindings(species);
    expect(f.map((x) => [x.species, x.messageId]).sort()).toEqual([
      ['NO2', 'off'],
      ['SO2', 'off'],
    ]);
  });

  it('flags a non-positive S° of a gas', async () => {
    const slipped = gases.map((g) => (g.species === 'CO' ? { ...g, S: -197.66 } : g));
    const { species } = await speciesOf(csvOf(slipped));
    expect(entropyAtomFindings(species).map((x) => [x.species, x.messageId])).toEqual([['CO', 'nonpositive']]);
  });
});

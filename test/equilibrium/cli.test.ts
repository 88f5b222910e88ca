// `thermovet lnk` driven as a user would: the built CLI, real files, exit codes.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { NO_STACK, thermovet } from '../cli/run.js';
import { SHOMATE } from './published-data.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-lnk-'));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

// Formation values: CODATA 1989 / JANAF 1998 as in published-data.ts; Shomate fits: NIST WebBook, from memory.
const sh = (name: keyof typeof SHOMATE, i = 0) => {
  const r = SHOMATE[name][i]!;
  return `${r.slice(2).join(' ')},${r[0]},${r[1]}`;
};
const TABLE = [
  'species,phase,dHf,dGf,S,u_dHf,cp_model,cp_coeffs,cp_Tmin,cp_Tmax',
  `H2O,g,-241.826,-228.582,188.835,0.04,shomate,${sh('H2O')}`,
  `CO,g,-110.53,-137.163,197.66,0.17,shomate,${sh('CO')}`,
  `CO2,g,-393.522,-394.389,213.795,0.13,shomate,${sh('CO2')}`,
  `H2,g,0,0,130.68,,shomate,${sh('H2', 0)}`,
  `H2,g,0,0,130.68,,shomate,${sh('H2', 1)}`,
  `N2,g,0,0,191.609,,shomate,${sh('N2', 0)}`,
  `N2,g,0,0,191.609,,shomate,${sh('N2', 1)}`,
  `NH3,g,-45.898,-16.367,192.77,,shomate,${sh('NH3')}`,
].join('\n');
const table = file('gases.csv', TABLE + '\n');

describe('thermovet lnk (built CLI)', () => {
  it('prints the table for equations given directly; log10 K of the shift at 500 K matches JANAF (2.1389, Chase 1998)', () => {
    const r = thermovet(['lnk', table, '-e', 'CO(g) + H2O(g) = CO2(g) + H2(g)', '-t', '500 800', '--format', 'json']);
    expect(r.code).toBe(0);
    // the water Shomate fit starts at 500 K: the integral from 298.15 K runs through its extrapolation
    expect(r.stderr).toMatch(/H2O\(g\) \(fitted 500–1700 K\) does not reach 298.15 K/);
    const out = JSON.parse(r.stdout);
    expect(out.caution).toMatch(/qualified engineer/);
    const p500 = out.reactions[0].points[0];
    expect(p500.T).toBe(500);
    expect(Math.abs(p500.lnK / Math.LN10 - 2.1389)).toBeLessThan(0.005); // tolerance as in published.test.ts
    expect(p500.u_lnK).toBeGreaterThan(0);
  });

  it('reads a reactions file; CSV output has one row per reaction and temperature', () => {
    const reactions = file('r1.csv', 'id,equation,T\nwgs,CO + H2O(g) = CO2 + H2,500 1000\nnh3,N2 + 3H2 = 2NH3,500 700\n');
    const r = thermovet(['lnk', table, '-r', reactions, '--format', 'csv']);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^reaction,equation,T_K,dH_kJmol,dS_JmolK,dG_kJmol,lnK,log10K,lnK_shortcut/);
    expect(lines.slice(1).map((l) => l.split(',').slice(0, 1).concat(l.split(',')[2]!))).toEqual([
      ['wgs', '500'],
      ['wgs', '1000'],
      ['nh3', '500'],
      ['nh3', '700'],
    ]);
    // ammonia synthesis at 700 K: log10 K = −4.0578 (2 × JANAF log Kf of NH3, table H-083)
    const nh3at700 = lines[4]!.split(',');
    expect(Math.abs(Number(nh3at700[7]) - -4.0578)).toBeLessThan(0.005);
  });

  it('CSV names the extrapolated species with the kelvin outside, without float noise', () => {
    // NH3's Shomate fit ends at 1400 K; 1448.15 − 1400 is 48.15000000000009 in floating point
    const r = thermovet(['lnk', table, '-e', 'N2(g) + 3 H2(g) = 2 NH3(g)', '-t', '1448.15', '--format', 'csv']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('NH3(g):48.15,');
  });

  it('text output shows the extrapolated species at the right temperatures and the caution', () => {
    const r = thermovet(['lnk', table, '-e', 'N2(g) + 3 H2(g) = 2 NH3(g)', '-t', '1000 1500']);
    expect(r.code).toBe(0);
    const rows = r.stdout.split('\n').filter((l) => /^\s+\d+\.\d\d\s/.test(l));
    expect(rows).toHaveLength(2);
    expect(rows[0]).not.toMatch(/extrapolated/);
    expect(rows[1]).toMatch(/NH3\(g\) Cp extrapolated 100 K/);
    expect(r.stdout).toMatch(/qualified engineer/);
    expect(r.stderr).toMatch(/reaction-extrapolation/);
    // an equation given with -e is located on the command line, by its place among the -e options
    expect(r.stdout).toContain('(command line:1)');
    expect(r.stderr).toMatch(/^command line:1: warning: /m);
  });

  it('a manifest supplies the reactions file and the use window', () => {
    file('r2.csv', 'id,equation\nwgs,CO(g) + H2O(g) = CO2(g) + H2(g)\n');
    const manifest = file('m.yaml', 'name: invented test set\ntables: [gases.csv]\nreactions: r2.csv\nuse_window: {Tmin: 400, Tmax: 1000}\n');
    const r = thermovet(['lnk', '-m', manifest, '--format', 'json']);
    expect(r.code).toBe(0);
    const T = JSON.parse(r.stdout).reactions[0].points.map((p: { T: number }) => p.T);
    expect(T[0]).toBe(400);
    expect(T[T.length - 1]).toBe(1000);
    expect(T.length).toBeGreaterThanOrEqual(11);
  });

  it('exit 1 when a reaction cannot be computed: the unbalanced one is refused with its file and line', () => {
    const reactions = file('r3.csv', 'id,equation,T\nok,CO + H2O(g) = CO2 + H2,500\nbad,N2 + H2 = 2NH3,500\n');
    const r = thermovet(['lnk', table, '-r', reactions, '--format', 'json']);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`${reactions}:3: error: reaction bad does not balance`);
    const out = JSON.parse(r.stdout);
    expect(out.reactions.map((x: { id: string; balanced: boolean; points: unknown[] }) => [x.id, x.balanced, x.points.length])).toEqual([
      ['ok', true, 1],
      ['bad', false, 0],
    ]);
  });

  it.each([
    ['a missing reactions file', ['-r', join(dir, 'nope.csv')]],
    ['no reactions at all', []],
    ['an equation without an arrow', ['-e', 'CO + H2O']],
    ['a bad temperature', ['-e', 'CO(g) + H2O(g) = CO2(g) + H2(g)', '-t', '500 hot']],
    ['a reactions file without an equation column', ['-r', file('r4.csv', 'id,T\na,500\n')]],
  ])('exit 2 with a clear message and no stack trace on %s', (_what, args) => {
    const r = thermovet(['lnk', table, ...args]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^thermovet: /);
    expect(r.stderr).not.toMatch(NO_STACK);
  });
});

describe('schemas/reactions.schema.json', () => {
  it('accepts the reactions of lnk --format json, computed, refused and without Cp alike', async () => {
    const { Ajv } = await import('ajv');
    const { readFileSync } = await import('node:fs');
    const validate = new Ajv({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schemas/reactions.schema.json', 'utf8')));
    const noCp = file('nocp.csv', TABLE.split('\n').filter((l) => !l.startsWith('NH3')).join('\n') + '\nNH3,g,-45.898,-16.367,192.77,,,,,\n');
    const reactions = file('r5.csv', 'id,equation,T\nok,CO + H2O(g) = CO2 + H2,298.15 1500\nbad,N2 + H2 = 2NH3,500\nnh3,N2 + 3H2 = 2NH3,500\n');
    const out = JSON.parse(thermovet(['lnk', noCp, '-r', reactions, '--format', 'json']).stdout);
    expect(out.reactions.map((r: { points: unknown[] }) => r.points.length)).toEqual([2, 0, 1]);
    expect(out.reactions[2].points[0].cpMissing).toEqual(['NH3(g)']);
    expect(validate(out.reactions), JSON.stringify(validate.errors)).toBe(true);
  });
});

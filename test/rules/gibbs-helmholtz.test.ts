import { describe, expect, it } from 'vitest';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { Report } from '../../pipeline/types.js';
import { tempFile } from '../ingest/helpers.js';
import { csvOf, PUBLISHED, type Published } from './published.js';

async function run(csv: string, ext = 'csv'): Promise<ArrayReport> {
  return checkArrays(normalizeOptions({ tables: [tempFile(csv, ext)] }), { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z' });
}

describe('gibbs-helmholtz on published data', () => {
  it('finds no errors and no warnings on clean published species', async () => {
    const report = await run(csvOf(PUBLISHED));
    expect(report.summary).toMatchObject({ rows: PUBLISHED.length, accepted: PUBLISHED.length, rejected: 0, errors: 0 });
    // every published triple closes to better than 0.1 kJ/mol (the warning tolerance)
    expect(report.findings.filter((f) => f.rule === 'gibbs-helmholtz')).toEqual([]);
  });

  it('gives the same findings whatever the units and column order', async () => {
    const kcal = PUBLISHED.map((r) => `${r.S / 4.184},${r.dGf / 4.184},${r.phase},${r.species},${r.dHf / 4.184}`).join('\n');
    const report = await run('S [cal/(mol K)],dGf [kcal/mol],phase,species,dHf [kcal/mol]\n' + kcal + '\n');
    expect(report.summary.errors).toBe(0);
    expect(report.findings.filter((f) => f.rule === 'gibbs-helmholtz')).toEqual([]);
  });
});

type Field = 'dHf' | 'dGf' | 'S';
const slips: { cause: string; field: Field; apply: (v: number) => number }[] = [
  { cause: 'J-read-as-kJ', field: 'dHf', apply: (v) => v * 1000 },
  { cause: 'kJ-read-as-J', field: 'dGf', apply: (v) => v / 1000 },
  { cause: 'cal-read-as-J', field: 'dHf', apply: (v) => v / 4.184 },
  { cause: 'cal-read-as-J', field: 'dGf', apply: (v) => v / 4.184 },
  { cause: 'cal-read-as-J', field: 'S', apply: (v) => v / 4.184 },
  { cause: 'J-read-as-cal', field: 'S', apply: (v) => v * 4.184 },
  { cause: 'sign', field: 'dHf', apply: (v) => -v },
  { cause: 'sign', field: 'dGf', apply: (v) => -v },
];

describe('slip diagnosis on real species', () => {
  // species whose values are far enough from zero that every slip moves the residual well past tolerance
  const victims = ['H2O|g', 'CO2|g', 'NH3|g', 'CH3OH|g', 'CaCO3|cr', 'SO2|g', 'Al2O3|cr', 'CO|g'];
  const base = PUBLISHED.filter((p) => victims.includes(`${p.species}|${p.phase}`));

  for (const slip of slips) {
    it(`diagnoses ${slip.cause} on ${slip.field} for each species, on the right line, with the published value as correction`, async () => {
      const rows: Published[] = base.map((p) => ({ ...p, [slip.field]: Number(slip.apply(p[slip.field]).toPrecision(10)) }));
      const report = await run(csvOf(rows));
      const gh = report.findings.filter((f) => f.rule === 'gibbs-helmholtz');
      expect(gh).toHaveLength(base.length);
      for (const [i, p] of base.entries()) {
        const f = gh.find((x) => x.location.line === i + 2)!;
        expect(f, `${p.species} line ${i + 2}`).toBeDefined();
        expect(f.severity).toBe('error');
        expect(f.diagnosis).toMatchObject({ cause: slip.cause, field: slip.field });
        expect(f.diagnosis!.corrected).toBeCloseTo(p[slip.field], 3);
        expect(Math.abs(f.diagnosis!.residualAfter)).toBeLessThan(0.1);
        expect(f.location.field).toBe(slip.field);
      }
    });
  }

  it('does not call a value that should be zero a 1000× slip: H+(aq) given the entropy of H2(g)', async () => {
    // ΔfH°, ΔfG° and S° of H+(aq) are 0 by convention (fact of the trade); 130.68 J/(mol K) is S° of
    // H2(g) (CODATA Key Values). Dividing it by 1000 also closes the residual, as any S near 0 would.
    const report = await run(csvOf([{ species: 'H+', phase: 'aq', dHf: 0, dGf: 0, S: 130.68, source: 'invented: a convention value replaced' }]));
    const gh = report.findings.filter((f) => f.rule === 'gibbs-helmholtz');
    expect(gh).toHaveLength(1);
    expect(gh[0]!.messageId).toBe('residual');
    expect(gh[0]!.diagnosis).toBeUndefined();
  });

  it('states the correction in the declared unit (kcal/mol column, sign slip)', async () => {
    const water = PUBLISHED[0]!;
    const csv = `species,phase,dHf [kcal/mol],dGf [kcal/mol],S\nH2O,g,${water.dHf / 4.184},${-water.dGf / 4.184},${water.S}\n`;
    const report = await run(csv);
    const f = report.findings.find((x) => x.rule === 'gibbs-helmholtz')!;
    expect(f.diagnosis).toMatchObject({ cause: 'sign', field: 'dGf', unit: 'kcal/mol' });
    expect(f.diagnosis!.corrected).toBeCloseTo(-228.582 / 4.184, 6);
  });

  it('words the slip in the declared unit, not in kJ/mol and J/(mol K) always', async () => {
    // H2O(g) CODATA 1989 and CH4(g) NIST-JANAF 1998 (test/rules/published.ts), in a kcal/mol, cal/(mol K) table:
    // H2O's ΔfH° typed in cal/mol (1000× too large), CH4's S° typed in kcal/(mol K) (1000× too small)
    const water = PUBLISHED[0]!;
    const csv =
      'species,phase,dHf [kcal/mol],dGf [kcal/mol],S [cal/(mol K)]\n' +
      `H2O,g,${(water.dHf * 1000) / 4.184},${water.dGf / 4.184},${water.S / 4.184}\n` +
      `CH4,g,${-74.873 / 4.184},${-50.768 / 4.184},${186.251 / 4.184 / 1000}\n`;
    const report = await run(csv);
    const gh = report.findings.filter((f) => f.rule === 'gibbs-helmholtz');
    expect(gh.map((f) => [f.location.line, f.diagnosis?.cause, f.params.words])).toEqual([
      [2, 'J-read-as-kJ', 'cal/mol entered where kcal/mol was declared (1000× too large)'],
      [3, 'kJ-read-as-J', 'kcal/(mol K) entered where cal/(mol K) was declared (1000× too small)'],
    ]);
    // and a joule column given calories says "cal/mol read as J/mol", not "kcal/mol read as kJ/mol"
    const joules = await run(`species,phase,dHf [J/mol],dGf [J/mol],S\nCO2,g,${-393522 / 4.184},-394389,213.795\n`);
    expect(joules.findings.find((f) => f.rule === 'gibbs-helmholtz')!.params.words).toBe('cal/mol read as J/mol (4.184× too small)');
  });

  it('uses stated uncertainties to widen the tolerance', async () => {
    const water = PUBLISHED[0]!;
    // a 0.8 kJ/mol residual: an error with no uncertainty, but within 2·u when u(ΔfG°) = 0.5 kJ/mol
    const csv = `species,phase,dHf,dGf,S,u_dGf\nH2O,g,${water.dHf},${water.dGf + 0.8},${water.S},0.5\nCO2,g,-393.522,${-394.389 + 0.8},213.795,\n`;
    const report = await run(csv);
    const gh = report.findings.filter((f) => f.rule === 'gibbs-helmholtz');
    expect(gh.map((f) => [f.location.line, f.severity])).toEqual([[2, 'warning'], [3, 'error']]);
  });
});

import { describe, expect, it } from 'vitest';
import { InputError } from '../../pipeline/errors.js';
import { readTable } from './helpers.js';

// Published values used as realistic cells: H2O(g) ΔfH° −241.826 kJ/mol, ΔfG° −228.582 kJ/mol,
// S° 188.835 J/(mol K) (CODATA Key Values 1989 / NIST-JANAF 4th ed. 1998).
const HEADER = 'species,phase,dHf,dGf,S';
const WATER = 'H2O,g,-241.826,-228.582,188.835';

describe('CSV ingest', () => {
  it('reads rows with their physical lines, through BOM, CRLF, blank, comment and multi-line quoted cells', async () => {
    const text = '\uFEFF# a comment\r\n' + 'species,phase,dHf,dGf,S,source\r\n' + `${WATER},"two\r\nlines"\r\n` + '\r\n' + 'CO2,g,-393.522,-394.389,213.795,CODATA\r\n';
    const { rows, findings, counts } = await readTable(text);
    expect(findings).toEqual([]);
    expect(counts).toEqual({ rows: 2, accepted: 2, rejected: 0 });
    expect(rows.map((r) => [r.species, r.values.location.line])).toEqual([['H2O', 3], ['CO2', 6]]);
    expect(rows[0]!.values.dHf).toBeCloseTo(-241826, 6);
    expect(rows[0]!.values.source).toBe('two\r\nlines');
  });

  it('converts bracketed units once, on ingest', async () => {
    // −57.798 kcal/mol × 4.184 = −241.827 kJ/mol; 45.132 cal/(mol K) × 4.184 = 188.83 J/(mol K)
    const { rows } = await readTable('species,phase,dHf [kcal/mol],dGf [kJ/mol],S [cal/(mol K)],cp_Tmin [degC]\nH2O,g,-57.798,-228.582,45.132,\n');
    expect(rows[0]!.values.dHf).toBeCloseTo(-57.798 * 4184, 6);
    expect(rows[0]!.values.S).toBeCloseTo(45.132 * 4.184, 9);
    expect(rows[0]!.units).toMatchObject({ dHf: 'kcal/mol', S: 'cal/(mol K)', cp_Tmin: 'degC' });
  });

  it('applies manifest header maps and units', async () => {
    const { rows } = await readTable('Name,State,Hf298,Gf298,S298\nH2O,g,-57.798,-54.633,45.132\n', 'csv', {
      headerMap: { Name: 'species', State: 'phase', Hf298: 'dHf', Gf298: 'dGf', S298: 'S' },
      units: { dHf: 'kcal/mol', dGf: 'kcal/mol', S: 'cal/(mol K)' },
    });
    expect(rows[0]!.values.dGf).toBeCloseTo(-54.633 * 4184, 6);
  });

  it.each([
    ['', 'empty field is absent, not zero'],
    ['0x10', 'hexadecimal'],
    ['12abc', 'trailing text'],
    ['1,234.5', 'thousands separator'],
    ['NaN', 'NaN'],
    ['Infinity', 'Infinity'],
    ['1e400', 'overflow'],
  ])('never coerces a bad number (%s: %s)', async (cell) => {
    const { rows, findings, counts } = await readTable(`${HEADER}\nH2O,g,"${cell}",-228.582,188.835\n`);
    if (cell === '') {
      expect(rows[0]!.values.dHf).toBeUndefined();
      return;
    }
    expect(counts).toEqual({ rows: 1, accepted: 0, rejected: 1 });
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ rule: 'bad-number', location: { line: 2, column: 3, field: 'dHf' } });
  });

  it('rejects ragged rows with their line and keeps the rest', async () => {
    const { findings, counts } = await readTable(`${HEADER}\n${WATER}\nCO,g,-110.53\n${WATER.replace('H2O', 'NH3')}\n`);
    expect(counts).toEqual({ rows: 3, accepted: 2, rejected: 1 });
    expect(findings[0]).toMatchObject({ rule: 'unreadable-row', messageId: 'ragged', location: { line: 3 } });
  });

  it('keeps a stray quote in its field and rejects only that row', async () => {
    const { findings, counts } = await readTable(`${HEADER}\nCO,g,"-110.53"x,-137.163,197.66\n${WATER}\n`);
    expect(counts).toEqual({ rows: 2, accepted: 1, rejected: 1 });
    expect(findings[0]).toMatchObject({ rule: 'bad-number', location: { line: 2 } });
  });

  it('rejects bad phases, unknown elements and unbalanced parentheses', async () => {
    const { findings, counts } = await readTable(`${HEADER}\nH2O,plasma,-241.826,-228.582,188.835\nXx2O,g,1,1,1\nCa(OH2,cr,1,1,1\n`);
    expect(counts.rejected).toBe(3);
    expect(findings.map((f) => [f.rule, f.location.line])).toEqual([['bad-phase', 2], ['bad-formula', 3], ['bad-formula', 4]]);
  });

  it.each([
    ['', 'empty-file'],
    ['species;phase;dHf\nH2O;g;1\n', 'wrong-delimiter'],
    ['species,phase,dHf\nH2O,g,"-241.8\n', 'unterminated-quote'],
    ['species,dHf\nH2O,1\n', 'missing-column'],
    ['species,phase,dHf [furlongs]\nH2O,g,1\n', 'unknown-unit'],
    ['species,phase,dHf,dHf\nH2O,g,1,1\n', 'duplicate-column'],
  ])('refuses an unusable file as a whole (%#)', async (text, code) => {
    await expect(readTable(text)).rejects.toMatchObject({ code });
    await expect(readTable(text)).rejects.toBeInstanceOf(InputError);
  });

  it('refuses binary and UTF-16 files', async () => {
    await expect(readTable(Buffer.from([0xff, 0xfe, 0x73, 0x00, 0x70, 0x00]))).rejects.toMatchObject({ code: 'not-utf8' });
    await expect(readTable(Buffer.from([0x00, 0x01, 0x02, 0x9f, 0x92, 0x96]))).rejects.toMatchObject({ code: 'binary-file' });
  });

  it('reads TSV', async () => {
    const { rows } = await readTable(`${HEADER.replace(/,/g, '\t')}\n${WATER.replace(/,/g, '\t')}\n`, 'tsv');
    expect(rows).toHaveLength(1);
  });
});

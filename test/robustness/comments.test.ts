// Comment lines (`#` at the start of a line, outside quotes) are skipped but counted; nothing else is
// ever taken for a comment, and a comment never swallows the rows after it.
import { describe, expect, it } from 'vitest';
import { readTable } from '../ingest/helpers.js';

const lines = (r: Awaited<ReturnType<typeof readTable>>) => ({
  accepted: r.rows.map((x) => [x.species, x.values.location.line]),
  rejected: r.findings.map((f) => [f.rule, f.location.line]),
  counts: r.counts,
});

describe('CSV comment lines', () => {
  it('a quoted cell starting with # is data, not a comment: the row is read, not dropped', async () => {
    const r = await readTable('species,formula,phase,dHf\n"#1 isomer",C4H10,g,-125.6\nH2O,H2O,g,-241.826\n');
    expect(lines(r)).toEqual({ accepted: [['#1 isomer', 2], ['H2O', 3]], rejected: [], counts: { rows: 2, accepted: 2, rejected: 0 } });
  });

  it('a quote inside a comment opens nothing: the rows after it are still read', async () => {
    const r = await readTable('species,phase,dHf\nH2O,g,-241.826\n# see,"note 4\nCO,g,-110.53\nCO2,g,x\n');
    expect(lines(r)).toEqual({ accepted: [['H2O', 2], ['CO', 4]], rejected: [['bad-number', 5]], counts: { rows: 3, accepted: 2, rejected: 1 } });
  });

  it('keeps physical lines through a comment preamble, comments between rows, CRLF and multi-line cells', async () => {
    const text = ['# a', '', '# b,"c', 'species,phase,dHf,source', 'H2O,g,-241.826,"two', 'lines"', '# mid', '#', 'CO,g,x,ok', '', 'CO2,g,-393.522,ok'].join('\r\n') + '\r\n';
    const r = await readTable(text);
    expect(lines(r)).toEqual({ accepted: [['H2O', 5], ['CO2', 11]], rejected: [['bad-number', 9]], counts: { rows: 3, accepted: 2, rejected: 1 } });
  });

  it('an indented # and a # inside a row are data', async () => {
    const r = await readTable('species,phase,dHf\n  #x,g,1\nH2O,g,#1\n');
    expect(r.counts).toEqual({ rows: 2, accepted: 0, rejected: 2 });
    expect(r.findings.map((f) => f.location.line)).toEqual([2, 3]);
  });
});

// Findings do not explode: a table where every row is bad still gives a bounded terminal summary (the
// worst findings plus counts per rule) and a complete JSON report. Functional, not timed.
// The rows are invented; no value in them is meant as data.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readReport, thermovet } from '../cli/run.js';

const ROWS = 20_000;

describe('a table where every row is bad', () => {
  const dir = mkdtempSync(join(tmpdir(), 'thermovet-allbad-'));
  const path = join(dir, 'all-bad.csv');
  const lines = ['# invented rows, every one defective on purpose', 'species,formula,phase,dHf [kJ/mol],dGf [kJ/mol],S [J/(mol K)]'];
  // each row: an unknown phase and a non-numeric ΔfH°, so two findings per row, both errors
  for (let i = 0; i < ROWS; i++) lines.push(`isomer ${i},C${(i % 40) + 1}H${2 * (i % 40) + 4},vapour?,n/a,-${i % 500}.5,${100 + (i % 300)}`);
  writeFileSync(path, lines.join('\n') + '\n');
  const out = join(dir, 'report.json');
  const r = thermovet(['check', path, '--json', out]);

  it('rejects every row and reports each one in the JSON report', () => {
    expect(r.code).toBe(1);
    const report = readReport(out);
    expect(report.summary).toMatchObject({ rows: ROWS, accepted: 0, rejected: ROWS, species: 0 });
    expect(report.findings).toHaveLength(2 * ROWS);
    const perRule: Record<string, number> = {};
    const lineSeen = new Set<number>();
    for (const f of report.findings) {
      perRule[f.rule] = (perRule[f.rule] ?? 0) + 1;
      lineSeen.add(f.location.line);
    }
    expect(perRule).toEqual({ 'bad-phase': ROWS, 'bad-number': ROWS });
    expect(lineSeen.size).toBe(ROWS); // every data line (3 … ROWS + 2) is named
    expect(Math.min(...lineSeen)).toBe(3);
    expect(Math.max(...lineSeen)).toBe(ROWS + 2);
  });

  it('prints a bounded terminal summary: at most 25 findings, then the count of each rule', () => {
    const text = r.stdout;
    const findingLines = text.split('\n').filter((l) => /^\s+error\s/.test(l));
    expect(findingLines.length).toBeLessThanOrEqual(25);
    expect(findingLines.length).toBeGreaterThan(0);
    expect(text).toContain(`(${findingLines.length} of ${2 * ROWS})`);
    expect(text).toMatch(new RegExp(`^\\s+${ROWS}\\s+error bad-phase$`, 'm'));
    expect(text).toMatch(new RegExp(`^\\s+${ROWS}\\s+error bad-number$`, 'm'));
    expect(text.split('\n').length).toBeLessThan(60);
  });
});

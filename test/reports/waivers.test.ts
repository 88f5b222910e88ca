// Waivers: applied (marked, kept, not counted), expired (an error, waives nothing), unmatched (a warning),
// the file format and its line numbers, and the CLI end to end on the invented demo.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { summarize } from '../../pipeline/check.js';
import { InputError } from '../../pipeline/errors.js';
import type { Finding } from '../../pipeline/types.js';
import { applyWaivers, loadWaivers, waiveReport, type Waiver } from '../../pipeline/waivers.js';
import { NO_STACK, readReport, thermovet } from '../cli/run.js';
import { makeReport } from './fixture.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-waivers-'));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

const finding = (rule: string, species: string, line: number, severity: Finding['severity'] = 'error'): Finding => ({
  rule,
  severity,
  messageId: 'm',
  params: {},
  message: `${rule} on ${species}`,
  species,
  phase: 'g',
  location: { file: 'data/t.csv', line },
});

const waiver = (w: Partial<Waiver>): Waiver => ({
  rule: 'gibbs-helmholtz',
  reason: 'accepted for the screening study',
  acceptedBy: 'A. Reviewer',
  expires: '2030-06-30',
  location: { file: 'waivers.yaml', line: 1 },
  ...w,
});

describe('applyWaivers', () => {
  const findings = [finding('gibbs-helmholtz', 'CO2', 4), finding('gibbs-helmholtz', 'NH3', 9), finding('duplicate-row', 'H2O', 6, 'warning')];

  it('marks the matching finding waived, keeps every finding, and the summary stops counting it', () => {
    const out = applyWaivers(findings, [waiver({ species: 'CO2' })], '2030-01-01');
    expect(out).toHaveLength(3);
    expect(out[0]!.waived).toEqual({ by: 'A. Reviewer', reason: 'accepted for the screening study', expires: '2030-06-30' });
    expect(out[1]!.waived).toBeUndefined();
    expect(findings[0]!.waived).toBeUndefined(); // input untouched
    expect(summarize(3, 3, 0, 3, out)).toMatchObject({ errors: 1, warnings: 1 });
  });

  it('holds through its expiry day and expires the day after: then it waives nothing and is itself an error', () => {
    const w = waiver({ species: 'CO2', location: { file: 'waivers.yaml', line: 7 } });
    expect(applyWaivers(findings, [w], '2030-06-30')[0]!.waived).toBeDefined();
    const out = applyWaivers(findings, [w], '2030-07-01');
    expect(out[0]!.waived).toBeUndefined();
    const expired = out.filter((f) => f.rule === 'waiver-expired');
    expect(expired).toHaveLength(1);
    expect(expired[0]).toMatchObject({ severity: 'error', species: 'CO2', location: { file: 'waivers.yaml', line: 7 } });
    expect(expired[0]!.message).toContain('2030-06-30');
    expect(summarize(3, 3, 0, 3, out).errors).toBe(3);
  });

  it('a waiver that matches nothing is a warning at its own line', () => {
    const out = applyWaivers(findings, [waiver({ species: 'CH4', location: { file: 'waivers.yaml', line: 12 } })], '2030-01-01');
    const unmatched = out.filter((f) => f.rule === 'waiver-unmatched');
    expect(unmatched).toHaveLength(1);
    expect(unmatched[0]).toMatchObject({ severity: 'warning', location: { file: 'waivers.yaml', line: 12 } });
    expect(out.filter((f) => f.waived)).toHaveLength(0);
  });

  it('rule, phase, file and line must all match when given', () => {
    expect(applyWaivers(findings, [waiver({ rule: 'duplicate-row', species: 'CO2' })], '2030-01-01').some((f) => f.waived)).toBe(false);
    expect(applyWaivers(findings, [waiver({ species: 'CO2', phase: 'l' })], '2030-01-01').some((f) => f.waived)).toBe(false);
    expect(applyWaivers(findings, [waiver({ file: 'data/t.csv', line: 8 })], '2030-01-01').some((f) => f.waived)).toBe(false);
    const byLine = applyWaivers(findings, [waiver({ file: 'data/t.csv', line: 9 })], '2030-01-01');
    expect(byLine.filter((f) => f.waived).map((f) => f.species)).toEqual(['NH3']);
    // one waiver without species covers every finding of its rule in that file
    expect(applyWaivers(findings, [waiver({ file: 'data/t.csv' })], '2030-01-01').filter((f) => f.waived)).toHaveLength(2);
  });

  it('waiver findings themselves cannot be waived', () => {
    const ws = [waiver({ species: 'CO2', expires: '2000-01-01' }), waiver({ rule: 'waiver-expired', species: 'CO2' })];
    const out = applyWaivers(findings, ws, '2030-01-01');
    expect(out.find((f) => f.rule === 'waiver-expired')!.waived).toBeUndefined();
    expect(out.filter((f) => f.rule === 'waiver-unmatched')).toHaveLength(1);
  });

  it('waiveReport recounts the summary and keeps findings sorted by file and line', () => {
    const r = makeReport();
    const before = r.summary.errors;
    const out = waiveReport(r, [waiver({ species: 'CO2' }), waiver({ species: 'nobody', location: { file: 'a-waivers.yaml', line: 3 } })], '2030-01-01');
    expect(out.summary.errors).toBe(before - 1);
    expect(out.summary.warnings).toBe(1); // the unmatched waiver
    expect([...out.findings][0]!.rule).toBe('waiver-unmatched'); // a-waivers.yaml sorts before datasets/
  });
});

describe('loadWaivers', () => {
  it('reads YAML, keeps each waiver\'s line, resolves files relative to the waivers file', () => {
    const p = file(
      'w.yaml',
      '# accepted findings\n- rule: gibbs-helmholtz\n  species: CO2\n  reason: vendor value kept\n  accepted_by: A. Reviewer\n  expires: 2030-06-30\n\n- rule: duplicate-row\n  file: t.csv\n  line: 6\n  reason: repeat on purpose\n  accepted_by: B. Auditor\n  expires: 2031-01-31\n',
    );
    const ws = loadWaivers(p);
    expect(ws).toHaveLength(2);
    expect(ws[0]).toMatchObject({ rule: 'gibbs-helmholtz', species: 'CO2', acceptedBy: 'A. Reviewer', expires: '2030-06-30', location: { line: 2 } });
    expect(ws[1]!.location.line).toBe(8);
    expect(ws[1]!.file).toBe(join(dir, 't.csv'));
  });

  it('reads JSON too', () => {
    const p = file('w.json', JSON.stringify([{ rule: 'duplicate-row', species: 'H2O', reason: 'r', accepted_by: 'x', expires: '2030-01-01' }], null, 2));
    expect(loadWaivers(p)[0]).toMatchObject({ species: 'H2O', location: { line: 2 } });
  });

  it('rejects a waiver without an expiry, naming the line', () => {
    const p = file('bad.yaml', '- rule: gibbs-helmholtz\n  species: CO2\n  reason: r\n  accepted_by: x\n- rule: duplicate-row\n  species: H2O\n  reason: r\n  accepted_by: x\n');
    expect(() => loadWaivers(p)).toThrow(InputError);
    try {
      loadWaivers(p);
    } catch (e) {
      expect((e as InputError).message).toMatch(/expires/);
      expect((e as InputError).line).toBe(1);
    }
  });

  it('rejects an impossible date and a waiver that names neither species nor file', () => {
    expect(() => loadWaivers(file('d.yaml', '- rule: r\n  species: CO2\n  reason: r\n  accepted_by: x\n  expires: 2030-02-30\n'))).toThrow(/expires/);
    expect(() => loadWaivers(file('n.yaml', '- rule: r\n  reason: r\n  accepted_by: x\n  expires: 2030-02-01\n'))).toThrow(InputError);
  });
});

describe('thermovet check --waivers (built CLI, invented demo)', () => {
  const demo = 'datasets/demo/manifest.yaml';
  // demo findings at the time of writing include reference-elements on N2 (dGf = 0.5) and the repeated H2O row
  const WAIVERS = (expires: string) =>
    `- rule: duplicate-row\n  species: H2O\n  reason: repeated row kept to exercise the ingest\n  accepted_by: A. Reviewer\n  expires: ${expires}\n` +
    `- rule: gibbs-helmholtz\n  species: Nobody\n  reason: a waiver for a species that is not in the table\n  accepted_by: A. Reviewer\n  expires: ${expires}\n`;

  it('applied: the finding stays in the report marked waived and drops out of the counts; unmatched is a warning', () => {
    const w = file('demo-waivers.yaml', WAIVERS('2099-12-31'));
    const plain = join(dir, 'plain.json');
    const waived = join(dir, 'waived.json');
    thermovet(['check', '--manifest', demo, '--json', plain, '--fail-on', 'never', '-q', '--deterministic']);
    const r = thermovet(['check', '--manifest', demo, '--waivers', w, '--json', waived, '--fail-on', 'never', '-q', '--deterministic']);
    expect(r.code).toBe(0);
    const a = readReport(plain);
    const b = readReport(waived);
    const dup = b.findings.filter((f: Finding) => f.rule === 'duplicate-row' && f.species === 'H2O');
    expect(dup.length).toBeGreaterThan(0);
    for (const f of dup) expect(f.waived).toMatchObject({ by: 'A. Reviewer', expires: '2099-12-31' });
    expect(b.findings.filter((f: Finding) => f.rule === 'waiver-unmatched')).toHaveLength(1);
    // the duplicate warnings no longer count; the unmatched-waiver warning does
    expect(b.summary.warnings).toBe(a.summary.warnings - dup.length + 1);
    expect(b.provenance.inputs.map((i: { path: string }) => i.path)).toContain(w);
    expect(b.provenance.options.waivers).toBe(w);
  });

  it('expired: with SOURCE_DATE_EPOCH after the expiry the run fails on the expired waiver', () => {
    const w = file('demo-expired.yaml', WAIVERS('2001-01-31'));
    const out = join(dir, 'expired.json');
    // the day after the expiry, as Unix seconds
    const epoch = String(Date.UTC(2001, 1, 1) / 1000);
    const r = thermovet(['check', '--manifest', demo, '--waivers', w, '--json', out, '--fail-on', 'warning', '-q'], { SOURCE_DATE_EPOCH: epoch });
    expect(r.code).toBe(1);
    const rep = readReport(out);
    expect(rep.provenance.generatedAt).toBe('2001-02-01T00:00:00.000Z');
    expect(rep.findings.filter((f: Finding) => f.rule === 'waiver-expired')).toHaveLength(2);
    expect(rep.findings.filter((f: Finding) => f.waived)).toHaveLength(0);
  });

  it('expired under --deterministic too: fixing the timestamp does not bring a lapsed waiver back', () => {
    const w = file('demo-expired-det.yaml', WAIVERS('2001-01-31'));
    const out = join(dir, 'expired-det.json');
    const r = thermovet(['check', '--manifest', demo, '--waivers', w, '--json', out, '--fail-on', 'error', '-q', '--deterministic']);
    expect(r.code).toBe(1);
    const rep = readReport(out);
    expect(rep.provenance.generatedAt).toBe('1970-01-01T00:00:00.000Z');
    expect(rep.findings.filter((f: Finding) => f.rule === 'waiver-expired')).toHaveLength(2);
    expect(rep.findings.filter((f: Finding) => f.waived)).toHaveLength(0);
  });

  it('a broken waivers file is unusable input: exit 2 with file and line', () => {
    const w = file('broken.yaml', '- rule: duplicate-row\n  species: H2O\n  reason: r\n  accepted_by: x\n  expires: someday\n');
    const r = thermovet(['check', '--manifest', demo, '--waivers', w, '-q']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${w}:5`);
    expect(r.stderr).not.toMatch(NO_STACK);
  });
});

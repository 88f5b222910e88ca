import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { NO_STACK, readReport, thermovet } from './run.js';

const dir = mkdtempSync(join(tmpdir(), 'thermovet-cli-'));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

// H2O(g) and CO2(g): CODATA Key Values (1989) ΔfH°, S°; NIST-JANAF 4th ed. (1998) ΔfG°.
const CLEAN = 'species,phase,dHf,dGf,S\nH2O,g,-241.826,-228.582,188.835\nCO2,g,-393.522,-394.389,213.795\nH2,g,0,0,130.68\n';
// the same with ΔfH° of CO2 in kcal/mol under a kJ/mol header
const SLIP = CLEAN.replace('-393.522', String(-393.522 / 4.184));

describe('thermovet check (built CLI)', () => {
  it('exit 0 on clean published data, with a JSON report that validates', () => {
    const out = join(dir, 'clean.json');
    const r = thermovet(['check', file('clean.csv', CLEAN), '--json', out]);
    expect(r.code).toBe(0);
    const report = readReport(out);
    expect(report.summary).toMatchObject({ rows: 3, accepted: 3, rejected: 0, errors: 0, warnings: 0 });
    expect(report.provenance.inputs[0].sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(r.stdout).toMatch(/PASS/);
  });

  it('exit 1 when a finding is at or above --fail-on, 0 with --fail-on never', () => {
    const p = file('slip.csv', SLIP);
    const out = join(dir, 'slip.json');
    const r = thermovet(['check', p, '--json', out]);
    expect(r.code).toBe(1);
    const report = readReport(out);
    const f = report.findings.find((x: any) => x.rule === 'gibbs-helmholtz');
    expect(f).toMatchObject({ species: 'CO2', location: { line: 3, field: 'dHf' }, diagnosis: { cause: 'cal-read-as-J', field: 'dHf' } });
    // the contract's flat form too: findings[] {rule, severity, species, phase, file, line, message, …}
    expect(Object.keys(f).slice(0, 7)).toEqual(['rule', 'severity', 'species', 'phase', 'file', 'line', 'message']);
    expect([f.file, f.line]).toEqual([p, 3]);
    expect(f.diagnosis.corrected).toBeCloseTo(-393.522, 3);
    expect(r.stdout).toContain(`${p}:3:3`);
    expect(thermovet(['check', p, '--fail-on', 'never']).code).toBe(0);
  });

  it('--fail-on warning fails on a warning', () => {
    // a 0.2 kJ/mol residual on H2O(g): above the 0.1 warning tolerance, below the 0.5 error tolerance
    const p = file('warn.csv', CLEAN.replace('-228.582', '-228.382'));
    expect(thermovet(['check', p]).code).toBe(0);
    expect(thermovet(['check', p, '--fail-on', 'warning']).code).toBe(1);
  });

  it('exit 2 with a one-line message, no stack trace, on unusable input', () => {
    for (const args of [
      ['check', join(dir, 'missing.csv')],
      ['check', dir],
      ['check', file('unit.csv', 'species,phase,dHf [kcal/furlong]\nH2O,g,1\n')],
      ['check', file('empty.csv', '')],
      ['check', file('x.dat', CLEAN)],
      ['check', '--fail-on', 'sometimes', file('ok.csv', CLEAN)],
      ['check'],
    ]) {
      const r = thermovet(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr + r.stdout).not.toMatch(NO_STACK);
    }
    const r = thermovet(['check', file('unit2.csv', 'species,phase,dHf [kcal/furlong]\nH2O,g,1\n')]);
    expect(r.stderr).toMatch(/unit2\.csv:1: unknown unit "kcal\/furlong" for column dHf/);
  });

  it('--json output is deterministic with --deterministic', () => {
    const p = file('det.csv', SLIP);
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    thermovet(['check', p, '--json', a, '--deterministic', '-q']);
    thermovet(['check', p, '--json', b, '--deterministic', '-q']);
    expect(readFileSync(a, 'utf8')).toBe(readFileSync(b, 'utf8'));
    expect(readReport(a).provenance.generatedAt).toBe('1970-01-01T00:00:00.000Z');
  });

  it('reads a manifest with header map, units and tolerances', () => {
    file('mapped.csv', 'Name,State,Hf,Gf,S298\nH2O,g,-57.7978,-54.6324,188.835\n');
    const m = file('manifest.yaml', 'name: mapped\ntables: [mapped.csv]\ncolumns: { Name: species, State: phase, Hf: dHf, Gf: dGf, S298: S }\nunits: { dHf: kcal/mol, dGf: kcal/mol }\n');
    const out = join(dir, 'mapped.json');
    const r = thermovet(['check', '--manifest', m, '--json', out]);
    expect(r.code).toBe(0);
    expect(readReport(out).summary).toMatchObject({ accepted: 1, errors: 0 });
  });

  it('names the manifest line of a schema violation', () => {
    const m = file('bad-manifest.yaml', 'tables:\n  - a.csv\nuse_window:\n  Tmin: -5\n  Tmax: 900\n');
    const r = thermovet(['check', '--manifest', m]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bad-manifest\.yaml:4: manifest: use_window\.Tmin must be > 0/);
  });

  it('--help and --version exit 0', () => {
    expect(thermovet(['--help']).code).toBe(0);
    const v = thermovet(['--version']);
    expect(v.code).toBe(0);
    expect(v.stdout.trim()).toBe(JSON.parse(readFileSync('package.json', 'utf8')).version);
  });
});

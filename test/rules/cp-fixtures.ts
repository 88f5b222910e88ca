// Real Cp correlations in all five forms, for the Cp rule tests, each with its source beside it, and
// helpers that write them as a CSV table (and a manifest with a use window) and run the whole check.
//
// Sources (all "from memory": recalled, not checked against a copy of the source):
//   shomate — NIST Chemistry WebBook Shomate fits of the NIST-JANAF Thermochemical Tables, 4th ed.
//             (Chase 1998); the gas-phase sets are in test/cp/published-data.ts;
//   nasa7   — GRI-Mech 3.0 thermo data; N2 from Burcat's compilation (test/cp/published-data.ts);
//   nasa9   — McBride, Zehe and Gordon 2002, NASA TP-2002-211556 (test/cp/published-data.ts);
//   poly    — cubic a + bT + cT² + dT³ of Reid, Prausnitz and Poling, The Properties of Gases and
//             Liquids, 4th ed. (1987), Appendix A; Maier–Kelley a + bT + cT⁻² of Kelley 1960 (US Bureau
//             of Mines Bulletin 584), in cal/(mol K); Cp/R polynomials from the NASA-7 sets above;
//   table   — Cp values of the NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998).
// Formation values: CODATA Key Values (Cox, Wagman, Medvedev 1989) and JANAF, as in
// test/cp/published-data.ts and /work/shared/reference-values.json.

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkArrays, type ArrayReport } from '../check-arrays.js';
import { normalizeOptions } from '../../pipeline/options.js';
import type { Finding, UseWindow } from '../../pipeline/types.js';
import { SPECIES } from '../cp/published-data.js';

export interface CpRow {
  species: string;
  formula?: string; // defaults to species
  phase: string; // 'g', 'l', 'cr', 'aq', optionally with a state word ('cr graphite')
  dHf?: number; // kJ/mol
  dGf?: number; // kJ/mol
  S?: number; // J/(mol K)
  model: 'poly' | 'shomate' | 'nasa7' | 'nasa9' | 'table';
  coeffs: number[];
  exponents?: number[]; // poly
  temps?: number[]; // table
  unit?: string; // poly and table
  Tmin?: number;
  Tmax?: number;
  source: string;
}

const quote = (s: string): string => (/[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
const num = (x: number | undefined): string => (x === undefined ? '' : String(x));

export const HEADER = 'species,formula,phase,dHf,dGf,S,cp_model,cp_unit,cp_exponents,cp_T,cp_coeffs,cp_Tmin,cp_Tmax,source';

/** One CSV row per Cp range; line 1 is the header, so rows[i] is on line i + 2. */
export function csvOf(rows: readonly CpRow[]): string {
  const lines = rows.map((r) =>
    [
      r.species,
      r.formula ?? r.species,
      r.phase,
      num(r.dHf),
      num(r.dGf),
      num(r.S),
      r.model,
      r.unit ?? '',
      (r.exponents ?? []).join(' '),
      (r.temps ?? []).join(' '),
      r.coeffs.join(' '),
      num(r.Tmin),
      num(r.Tmax),
      quote(r.source),
    ].join(','),
  );
  return [HEADER, ...lines].join('\n') + '\n';
}

const dir = mkdtempSync(join(tmpdir(), 'thermovet-cp-'));
let n = 0;

/** Runs the whole check on the rows (and a manifest carrying `useWindow` when given). */
export async function runRows(rows: readonly CpRow[], useWindow?: UseWindow): Promise<ArrayReport> {
  const k = ++n;
  const table = join(dir, `cp${k}.csv`);
  writeFileSync(table, csvOf(rows));
  let options;
  if (useWindow) {
    const manifest = join(dir, `cp${k}.json`);
    const w: Record<string, unknown> = {};
    if (useWindow.Tmin !== undefined) w.Tmin = useWindow.Tmin;
    if (useWindow.Tmax !== undefined) w.Tmax = useWindow.Tmax;
    if (useWindow.temperatures) w.temperatures = useWindow.temperatures;
    writeFileSync(manifest, JSON.stringify({ name: 'cp rule test', tables: [table], use_window: w }));
    options = normalizeOptions({ tables: [], manifest });
  } else {
    options = normalizeOptions({ tables: [table] });
  }
  const report = await checkArrays(options, { version: 'test', generatedAt: '1970-01-01T00:00:00.000Z' });
  // a defect test that passes because its row was rejected on ingest would prove nothing
  if (report.summary.rejected > 0) {
    throw new Error(`rows rejected on ingest: ${report.findings.map((f) => `line ${f.location.line} ${f.rule}: ${f.message}`).join('; ')}`);
  }
  return report;
}

/** The findings of the Cp rules only. */
export function cpFindings(report: ArrayReport): Finding[] {
  return report.findings.filter((f) => f.rule.startsWith('cp-'));
}

/** Findings of `rule` on 1-based `line`. */
export function on(report: ArrayReport, rule: string, line: number): Finding[] {
  return report.findings.filter((f) => f.rule === rule && f.location.line === line);
}

// ---------------------------------------------------------------------------------------------------
// The five forms, real data

const byName = (s: string) => SPECIES.find((x) => x.species === s)!;

/** Gas rows from test/cp/published-data.ts, one per range, with the species' ΔfH° and S°. */
function publishedRows(name: string, model: 'shomate' | 'nasa7' | 'nasa9'): CpRow[] {
  const sp = byName(name);
  const ranges = sp[model] ?? [];
  const source =
    model === 'shomate'
      ? 'NIST WebBook Shomate fit of NIST-JANAF 1998 (from memory)'
      : model === 'nasa7'
        ? sp.nasa7Source
        : 'McBride, Zehe and Gordon 2002, NASA TP-2002-211556 (from memory)';
  return ranges.map((r) => ({
    species: name.replace('(g)', ''),
    phase: 'g',
    dHf: sp.dHf298_kJ,
    S: sp.S298,
    model,
    coeffs: r.slice(2),
    Tmin: r[0],
    Tmax: r[1],
    source,
  }));
}

export const SHOMATE = {
  H2O: publishedRows('H2O(g)', 'shomate'),
  CO2: publishedRows('CO2(g)', 'shomate'),
  N2: publishedRows('N2(g)', 'shomate'),
  CO: publishedRows('CO(g)', 'shomate'),
  H2: publishedRows('H2(g)', 'shomate'),
  CH4: publishedRows('CH4(g)', 'shomate'),
  // NIST WebBook Shomate fit for Al2O3 (corundum) from NIST-JANAF 1998, 298–2327 K, from memory;
  // ΔfH° −1675.692 kJ/mol (its H coefficient), S° 50.92 J/(mol K) CODATA (from memory)
  Al2O3: [
    {
      species: 'Al2O3',
      phase: 'cr',
      dHf: -1675.7,
      S: 50.92,
      model: 'shomate',
      coeffs: [102.429, 38.7498, -15.9109, 2.628181, -3.007551, -1717.93, 146.997, -1675.692],
      Tmin: 298,
      Tmax: 2327,
      source: 'NIST WebBook Shomate fit of NIST-JANAF 1998 (from memory); CODATA 1989',
    },
  ] as CpRow[],
};

export const NASA7 = {
  H2O: publishedRows('H2O(g)', 'nasa7'),
  CO2: publishedRows('CO2(g)', 'nasa7'),
  N2: publishedRows('N2(g)', 'nasa7'),
  CO: publishedRows('CO(g)', 'nasa7'),
  H2: publishedRows('H2(g)', 'nasa7'),
  CH4: publishedRows('CH4(g)', 'nasa7'),
};

export const NASA9 = {
  H2O: publishedRows('H2O(g)', 'nasa9'),
  CO2: publishedRows('CO2(g)', 'nasa9'),
  N2: publishedRows('N2(g)', 'nasa9'),
};

const RPP = 'Reid, Prausnitz and Poling 1987, Appendix A cubic (from memory)';
const KELLEY = 'Kelley 1960, US Bureau of Mines Bulletin 584, Maier–Kelley (from memory)';

export const POLY = {
  // Cp = a + bT + cT² + dT³, J/(mol K); RPP state 273–1500 K, used here to 1000 K where the recall
  // was checked against JANAF (see cp-fixtures.test.ts)
  N2: [{ species: 'N2', phase: 'g', dHf: 0, S: 191.609, model: 'poly', exponents: [0, 1, 2, 3], unit: 'J/(mol K)', coeffs: [31.15, -1.357e-2, 2.68e-5, -1.168e-8], Tmin: 273, Tmax: 1000, source: RPP }] as CpRow[],
  CO2: [{ species: 'CO2', phase: 'g', dHf: -393.51, S: 213.785, model: 'poly', exponents: [0, 1, 2, 3], unit: 'J/(mol K)', coeffs: [19.8, 7.344e-2, -5.602e-5, 1.715e-8], Tmin: 273, Tmax: 1000, source: RPP }] as CpRow[],
  CH4: [{ species: 'CH4', phase: 'g', dHf: -74.873, S: 186.251, model: 'poly', exponents: [0, 1, 2, 3], unit: 'J/(mol K)', coeffs: [19.25, 5.213e-2, 1.197e-5, -1.132e-8], Tmin: 273, Tmax: 1000, source: RPP }] as CpRow[],
  H2O: [{ species: 'H2O', phase: 'g', dHf: -241.826, S: 188.835, model: 'poly', exponents: [0, 1, 2, 3], unit: 'J/(mol K)', coeffs: [32.24, 1.924e-3, 1.055e-5, -3.596e-9], Tmin: 273, Tmax: 1000, source: RPP }] as CpRow[],
  // Cp/R as a poly in T⁰…T⁴: the GRI-Mech 3.0 CO low range a1…a5 (from memory), declared in R
  COoverR: [{ species: 'CO', phase: 'g', dHf: -110.53, S: 197.66, model: 'poly', exponents: [0, 1, 2, 3, 4], unit: 'R', coeffs: [3.57953347, -6.1035368e-4, 1.01681433e-6, 9.07005884e-10, -9.04424499e-13], Tmin: 200, Tmax: 1000, source: 'GRI-Mech 3.0 CO a1…a5 (from memory)' }] as CpRow[],
  // Maier–Kelley a + bT + cT⁻², cal/(mol K)
  CaCO3: [{ species: 'CaCO3', phase: 'cr', dHf: -1207.6, S: 91.7, model: 'poly', exponents: [0, 1, -2], unit: 'cal/(mol K)', coeffs: [24.98, 5.24e-3, -6.2e5], Tmin: 298, Tmax: 1200, source: `${KELLEY}; calcite` }] as CpRow[],
  Al2O3: [{ species: 'Al2O3', phase: 'cr', dHf: -1675.7, S: 50.92, model: 'poly', exponents: [0, 1, -2], unit: 'cal/(mol K)', coeffs: [27.43, 3.06e-3, -8.47e5], Tmin: 298, Tmax: 1800, source: `${KELLEY}; corundum` }] as CpRow[],
  C: [{ species: 'C', phase: 'cr graphite', dHf: 0, S: 5.74, model: 'poly', exponents: [0, 1, -2], unit: 'cal/(mol K)', coeffs: [4.03, 1.14e-3, -2.04e5], Tmin: 298, Tmax: 2300, source: `${KELLEY}; graphite` }] as CpRow[],
};

export const TABLE = {
  // NIST-JANAF 1998, N-023 (from memory)
  N2: [{ species: 'N2', phase: 'g', dHf: 0, S: 191.609, model: 'table', unit: 'J/(mol K)', temps: [298.15, 400, 500, 600, 700, 800, 900, 1000, 1500], coeffs: [29.124, 29.249, 29.58, 30.11, 30.754, 31.433, 32.09, 32.697, 34.852], source: 'NIST-JANAF 1998 N-023 Cp (from memory)' }] as CpRow[],
  // NIST-JANAF 1998, H-064 (from memory; 298.15, 500, 1000, 1500 K also in reference-values.json)
  H2O: [{ species: 'H2O', phase: 'g', dHf: -241.826, S: 188.835, model: 'table', unit: 'J/(mol K)', temps: [298.15, 400, 500, 600, 700, 800, 900, 1000, 1500], coeffs: [33.59, 34.262, 35.226, 36.325, 37.495, 38.721, 39.987, 41.268, 47.073], source: 'NIST-JANAF 1998 H-064 Cp (from memory)' }] as CpRow[],
  // NIST-JANAF 1998, Al2O3 (cr, alpha) (from memory)
  Al2O3: [{ species: 'Al2O3', phase: 'cr', dHf: -1675.7, S: 50.92, model: 'table', unit: 'J/(mol K)', temps: [298.15, 400, 500, 600, 700, 800, 900, 1000], coeffs: [79.033, 96.086, 106.087, 112.545, 116.926, 120.135, 122.662, 124.771], source: 'NIST-JANAF 1998 Al2O3 (cr) Cp (from memory)' }] as CpRow[],
};

/** Every valid real correlation above, one species per entry (each a list of its range rows). */
export function allValid(): { label: string; rows: CpRow[] }[] {
  const out: { label: string; rows: CpRow[] }[] = [];
  const add = (form: string, set: Record<string, CpRow[]>) => {
    for (const [k, rows] of Object.entries(set)) out.push({ label: `${form} ${k}`, rows });
  };
  add('shomate', SHOMATE);
  add('nasa7', NASA7);
  add('nasa9', NASA9);
  add('poly', POLY);
  add('table', TABLE);
  return out;
}

/** Gives a species a distinct name, so several variants of one species can sit in one table. */
export function renamed(rows: readonly CpRow[], name: string): CpRow[] {
  return rows.map((r) => ({ ...r, formula: r.formula ?? r.species, species: name }));
}

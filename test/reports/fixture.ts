// A hand-made Report with species, Cp samples and a reaction, so the renderers can be tested before the
// pipeline fills report.species[] and report.reactions[] itself. These numbers feed drawings only: no test
// checks a value computed here against a reference.
//
// Formation values: CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989): ΔfH° and S° at
// 298.15 K; ΔfG° from NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998).
// Cp: Shomate coefficients as published in the NIST Chemistry WebBook (fits of NIST-JANAF 1998).
import type { Finding, ReactionResult, Report, SpeciesSummary } from '../../pipeline/types.js';

const R = 8.314462618; // J/(mol K), CODATA 2018 exact value

type Shomate = { Tmin: number; Tmax: number; c: [number, number, number, number, number] };
const cpShomate = (s: Shomate, T: number): number => {
  const t = T / 1000;
  const [A, B, C, D, E] = s.c;
  return A + B * t + C * t * t + D * t * t * t + E / (t * t);
};

interface Src {
  name: string;
  formula: string;
  dHf: number; // kJ/mol
  dGf: number; // kJ/mol
  S: number; // J/(mol K)
  u_dHf: number; // kJ/mol
  ranges: Shomate[];
}

export const SOURCES: Record<string, Src> = {
  CO: { name: 'CO', formula: 'CO', dHf: -110.53, dGf: -137.163, S: 197.66, u_dHf: 0.17, ranges: [{ Tmin: 298, Tmax: 1300, c: [25.56759, 6.09613, 4.054656, -2.671301, 0.131021] }] },
  H2O: { name: 'H2O', formula: 'H2O', dHf: -241.826, dGf: -228.582, S: 188.835, u_dHf: 0.04, ranges: [{ Tmin: 500, Tmax: 1700, c: [30.092, 6.832514, 6.793435, -2.53448, 0.082139] }] },
  CO2: { name: 'CO2', formula: 'CO2', dHf: -393.522, dGf: -394.389, S: 213.785, u_dHf: 0.13, ranges: [{ Tmin: 298, Tmax: 1200, c: [24.99735, 55.18696, -33.69137, 7.948387, -0.136638] }] },
  H2: {
    name: 'H2',
    formula: 'H2',
    dHf: 0,
    dGf: 0,
    S: 130.68,
    u_dHf: 0,
    ranges: [
      { Tmin: 298, Tmax: 1000, c: [33.066178, -11.363417, 11.432816, -2.772874, -0.158558] },
      { Tmin: 1000, Tmax: 2500, c: [18.563083, 12.257357, -2.859786, 0.268238, 1.97799] },
    ],
  },
};

/** Cp of a species from its Shomate ranges; outside them, the nearest range's formula (as a user who extrapolates gets). */
function cpOf(s: Src, T: number): { cp: number; outsideK: number } {
  const inside = s.ranges.find((r) => T >= r.Tmin && T <= r.Tmax);
  if (inside) return { cp: cpShomate(inside, T), outsideK: 0 };
  const first = s.ranges[0]!;
  const last = s.ranges[s.ranges.length - 1]!;
  return T < first.Tmin ? { cp: cpShomate(first, T), outsideK: first.Tmin - T } : { cp: cpShomate(last, T), outsideK: T - last.Tmax };
}

export const USE_WINDOW = { Tmin: 400, Tmax: 1400 };

function summary(s: Src, file: string, line: number, name = s.name): SpeciesSummary {
  const samples = [];
  for (let T = 300; T <= 1500; T += 25) samples.push({ T, ...cpOf(s, T) });
  return {
    key: `${name}|g`,
    name,
    phase: 'g',
    formula: s.formula,
    dHf: s.dHf,
    dGf: s.dGf,
    S: s.S,
    gibbsResidual: 0,
    location: { file, line },
    cp: {
      models: ['shomate'],
      ranges: s.ranges.map((r, i) => ({ model: 'shomate', Tmin: r.Tmin, Tmax: r.Tmax, file, line: line + i })),
      cp298: cpOf(s, 298.15).cp,
      atWindow: [USE_WINDOW.Tmin, USE_WINDOW.Tmax].map((T) => ({ T, ...cpOf(s, T) })),
      samples,
    },
  };
}

/** CO + H2O = CO2 + H2 by both routes, with ΔrCp integrated numerically (1 K trapezoid steps). */
function waterGasShift(id: string, equation: string): ReactionResult {
  const nu: [Src, number][] = [
    [SOURCES.CO!, -1],
    [SOURCES.H2O!, -1],
    [SOURCES.CO2!, 1],
    [SOURCES.H2!, 1],
  ];
  const dH298 = nu.reduce((a, [s, v]) => a + v * s.dHf * 1000, 0);
  const dS298 = nu.reduce((a, [s, v]) => a + v * s.S, 0);
  const u = Math.sqrt(nu.reduce((a, [s]) => a + (s.u_dHf * 1000) ** 2, 0));
  const dCp = (T: number): number => nu.reduce((a, [s, v]) => a + v * cpOf(s, T).cp, 0);
  const points = [];
  for (let T = 400; T <= 1400; T += 100) {
    let iH = 0;
    let iS = 0;
    const steps = Math.round(T - 298.15);
    const h = (T - 298.15) / steps;
    for (let k = 0; k < steps; k++) {
      const a = 298.15 + k * h;
      const b = a + h;
      iH += ((dCp(a) + dCp(b)) / 2) * h;
      iS += ((dCp(a) / a + dCp(b) / b) / 2) * h;
    }
    const dH = dH298 + iH;
    const dS = dS298 + iS;
    const dG = dH - T * dS;
    const lnK298 = -(dH298 - 298.15 * dS298) / (R * 298.15);
    const extrapolated = nu
      .map(([s]) => ({ species: s.name, ...cpOf(s, T) }))
      .filter((e) => e.outsideK > 0)
      .map((e) => ({ species: `${e.species}(g)`, outsideK: e.outsideK, cp: e.cp }));
    points.push({
      T,
      lnK: -dG / (R * T),
      lnKShortcut: lnK298 - (dH298 / R) * (1 / T - 1 / 298.15),
      dG: dG / 1000,
      dH: dH / 1000,
      dS,
      u_lnK: u / (R * T),
      extrapolated,
    });
  }
  return { id, equation, file: 'reactions.yaml', line: 3, balanced: true, points, uncertaintyRanking: [{ species: 'CO(g)', share: 0.61 }, { species: 'CO2(g)', share: 0.36 }, { species: 'H2O(g)', share: 0.03 }] };
}

export const HOSTILE_IMG = '<img src=x onerror="window.__pwned=1">';
export const HOSTILE_SCRIPT = '<script>window.__pwned=2</script>';

/** A report as check() would return it for four gases, optionally with hostile names in every text field. */
export function makeReport(opts: { hostile?: boolean } = {}): Report & { species: SpeciesSummary[]; findings: Finding[] } {
  const file = 'datasets/fixture/gases.csv';
  const species = [summary(SOURCES.CO!, file, 2), summary(SOURCES.H2O!, file, 3), summary(SOURCES.CO2!, file, 4), summary(SOURCES.H2!, file, 5)];
  // residuals as a defective table would give them (kJ/mol): one slip, one small drift, the rest clean
  species[2]!.gibbsResidual = -48.509;
  species[0]!.gibbsResidual = 0.18;
  species[1]!.gibbsResidual = -0.002;
  if (opts.hostile) {
    species.push(summary(SOURCES.CO!, file, 7, HOSTILE_IMG), summary(SOURCES.H2!, file, 8, HOSTILE_SCRIPT));
    species[4]!.gibbsResidual = 2.5;
    species[5]!.gibbsResidual = -0.7;
  }
  const findings: Finding[] = [
    {
      rule: 'gibbs-helmholtz',
      severity: 'error',
      messageId: 'diagnosed',
      params: { residual: -48.509 },
      message: 'ΔfG° differs from ΔfH° − T·ΔfS° by -48.509 kJ/mol (tolerance 0.5 kJ/mol); S looks like cal/(mol K) read as J/(mol K)',
      species: 'CO2',
      phase: 'g',
      location: { file, line: 4, column: 6, field: 'S' },
      diagnosis: { cause: 'cal-read-as-J', field: 'S', corrected: 213.802, unit: 'J/(mol K)', residualAfter: 0.001 },
      impact: [{ reaction: 'WGS', maxAbsDeltaLnK: 5.83, T_K: 400 }],
    },
    {
      rule: 'duplicate-row',
      severity: 'warning',
      messageId: 'repeat',
      params: { firstLine: 3 },
      message: `row repeats line 3 of ${file} (H2O, g)`,
      species: 'H2O',
      phase: 'g',
      location: { file, line: 6 },
      waived: { by: 'A. Reviewer', reason: 'kept on purpose for the ingest test', expires: '2031-12-31' },
    },
  ];
  if (opts.hostile) {
    for (const name of [HOSTILE_IMG, HOSTILE_SCRIPT]) {
      findings.push({
        rule: 'gibbs-helmholtz',
        severity: 'error',
        messageId: 'residual',
        params: { residual: 2.5, name },
        message: `ΔfG° of ${name} differs by 2.5 kJ/mol`,
        species: name,
        phase: 'g',
        location: { file: `${file}${name}`, line: 7, field: name },
        diagnosis: { cause: name, field: name, corrected: 1, unit: name, residualAfter: 0 },
        impact: [{ reaction: name, maxAbsDeltaLnK: 1 }],
      });
    }
  }
  const reactions = [waterGasShift('WGS', 'CO(g) + H2O(g) = CO2(g) + H2(g)')];
  if (opts.hostile) reactions.push(waterGasShift(HOSTILE_SCRIPT, `${HOSTILE_IMG} + H2O(g) = CO2(g) + H2(g)`));
  return {
    tool: { name: 'thermovet', version: '0.0.0-test' },
    dataset: { name: opts.hostile ? `fixture ${HOSTILE_IMG}` : 'four gases (test fixture)', useWindow: USE_WINDOW },
    summary: { rows: 6, accepted: 6, rejected: 0, species: species.length, errors: opts.hostile ? 3 : 1, warnings: 0, infos: 0 },
    findings,
    species,
    reactions,
    provenance: {
      generatedAt: '1970-01-01T00:00:00.000Z',
      inputs: [{ path: file, bytes: 512, sha256: '0'.repeat(64) }],
      reference: { path: 'datasets/reference/elements.json', sha256: 'f'.repeat(64) },
      options: { failOn: 'error', tolerances: { gibbsErrorKJ: 0.5, gibbsWarningKJ: 0.1 }, note: opts.hostile ? HOSTILE_SCRIPT : 'none' },
      rules: ['gibbs-helmholtz', 'duplicate-row'],
    },
  };
}

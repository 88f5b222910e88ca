// u(ln K) by first-order propagation, and what each finding costs in ln K.
import { describe, expect, test } from 'vitest';
import { R_J_PER_MOL_K } from '../../pipeline/cp/constants.js';
import { impactOfFindings } from '../../pipeline/equilibrium/impact.js';
import { runEquilibrium } from '../../pipeline/equilibrium/index.js';
import { computeReaction } from '../../pipeline/equilibrium/lnk.js';
import { reactionFromEquation, resolveReactions } from '../../pipeline/equilibrium/reactions.js';
import { uncertaintyRanking } from '../../pipeline/equilibrium/uncertainty.js';
import { parseFormula } from '../../pipeline/chemistry/formula.js';
import { DEFAULT_TOLERANCES } from '../../pipeline/options.js';
import { rule as gasBounds } from '../../pipeline/rules/cp-gas-bounds.js';
import { rule as cpPositive } from '../../pipeline/rules/cp-positive.js';
import { rule as gibbsHelmholtz } from '../../pipeline/rules/gibbs-helmholtz.js';
import type { CheckContext, CpSpec, Finding, Species } from '../../pipeline/types.js';
import { species } from './helpers.js';
import { publishedSpecies, REFERENCE } from './published-data.js';

const R = R_J_PER_MOL_K;
const where = { file: 'r.csv', line: 2 };
const WGS = 'CO(g) + H2O(g) = CO2(g) + H2(g)';

function resolved(table: Species[], eq = WGS, temps = [298.15, 500, 800, 1000, 1200]) {
  const out = resolveReactions([reactionFromEquation('wgs', eq, where, { temps })], table, REFERENCE);
  expect(out.findings).toEqual([]);
  return out.resolved[0]!;
}

/** CODATA Key Values (Cox, Wagman, Medvedev 1989) standard uncertainties, from memory. */
const CODATA_U: Record<string, { dHf_kJ?: number; S?: number }> = {
  CO: { dHf_kJ: 0.17, S: 0.004 },
  H2O: { dHf_kJ: 0.04, S: 0.01 },
  CO2: { dHf_kJ: 0.13, S: 0.01 },
  H2: { S: 0.003 },
};

function withU(table: Species[]): Species[] {
  return table.map((s) => {
    const u = CODATA_U[s.name];
    if (!u) return s;
    return { ...s, u: { ...(u.dHf_kJ !== undefined ? { dHf: u.dHf_kJ * 1000 } : {}), ...(u.S !== undefined ? { S: u.S } : {}) } };
  });
}

describe('u(ln K) by first-order propagation', () => {
  test('equals the root-sum-square of one-at-a-time shifts by each stated uncertainty (ln K is linear in them)', () => {
    // each species by a different route: H2O from ΔfH° and ΔfG° (S° derived), CO from ΔfG° and S°
    const base = withU(publishedSpecies()).map((s) => {
      if (s.name === 'H2O') return { ...s, S: undefined, u: { dHf: 40, dGf: 40 } };
      if (s.name === 'CO') return { ...s, dHf: undefined, u: { dGf: 170, S: 0.004 } };
      return s;
    });
    const temps = [298.15, 600, 1100];
    const p0 = computeReaction(resolved(base, WGS, temps));
    let sq = temps.map(() => 0);
    for (const sp of base) {
      for (const field of ['dHf', 'dGf', 'S'] as const) {
        const u = sp.u[field];
        if (u === undefined || sp[field] === undefined) continue;
        const moved = base.map((s) => (s === sp ? { ...s, [field]: s[field]! + u } : s));
        const p1 = computeReaction(resolved(moved, WGS, temps));
        sq = sq.map((v, i) => v + (p1[i]!.lnK - p0[i]!.lnK) ** 2);
      }
    }
    p0.forEach((p, i) => expect(p.u_lnK!).toBeCloseTo(Math.sqrt(sq[i]!), 9));
  });

  test('with the CODATA uncertainties, ΔfH° of CO dominates the water-gas shift, then CO2', () => {
    const ranking = uncertaintyRanking(resolved(withU(publishedSpecies())), [298.15, 1000]);
    expect(ranking!.map((r) => r.species)).toEqual(['CO(g)', 'CO2(g)', 'H2O(g)', 'H2(g)']);
    expect(ranking!.reduce((s, r) => s + r.share, 0)).toBeCloseTo(1, 12);
    // at 298.15 K: u(ln K)² ≈ (0.17² + 0.13² + 0.04²)(1000/RT)², the entropy terms being negligible
    const [p] = computeReaction(resolved(withU(publishedSpecies()), WGS, [298.15]));
    expect(p!.u_lnK).toBeCloseTo((Math.hypot(170, 130, 40) / (R * 298.15)) * 1, 3);
  });

  test('no stated uncertainty: no u(ln K) and no ranking', () => {
    const r = resolved(publishedSpecies());
    expect(computeReaction(r).every((p) => p.u_lnK === undefined)).toBe(true);
    expect(uncertaintyRanking(r, r.temps)).toBeUndefined();
  });
});

const ctx: CheckContext = {
  reference: REFERENCE,
  options: { name: 't', tables: [], headerMap: {}, units: {}, useWindow: {}, tolerances: DEFAULT_TOLERANCES, failOn: 'error' },
};

function finding(over: Partial<Finding>): Finding {
  return { rule: 'x', severity: 'error', messageId: 'm', params: {}, message: '', location: { file: 'species.csv', line: 1 }, ...over };
}

describe('impact of findings', () => {
  test('a diagnosed slip: the ln K difference between the value as given and the correction', () => {
    // CO2's ΔfH° typed in kcal/mol under a kJ/mol header; the Gibbs–Helmholtz rule diagnoses the slip
    const slipped = publishedSpecies().map((s) => (s.name === 'CO2' ? { ...s, dHf: s.dHf! / 4.184 } : s));
    const co2 = slipped.find((s) => s.name === 'CO2')!;
    const findings = gibbsHelmholtz.check!(co2, ctx);
    expect(findings[0]!.diagnosis).toMatchObject({ cause: 'cal-read-as-J', field: 'dHf' });
    const r = resolved(slipped);
    impactOfFindings(findings, [r]);
    // ν(CO2) = +1; ΔfH° moves from −94.054 to −393.522 kJ/mol; the largest shift is at the lowest T
    const dH = findings[0]!.diagnosis!.corrected * 1000 - co2.dHf!;
    expect(findings[0]!.impact).toEqual([{ reaction: 'wgs', maxAbsDeltaLnK: expect.any(Number), T_K: 298.15 }]);
    expect(findings[0]!.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(Math.abs(dH) / (R * 298.15), 9);
    // and it is what recomputing the reaction with the corrected value gives
    const fixed = slipped.map((s) => (s.name === 'CO2' ? { ...s, dHf: findings[0]!.diagnosis!.corrected * 1000 } : s));
    const [a] = computeReaction(r, [298.15]);
    const [b] = computeReaction(resolved(fixed), [298.15]);
    expect(findings[0]!.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(Math.abs(a!.lnK - b!.lnK), 6);
  });

  test('a correction to ΔfG° of a species whose ΔfH° and S° are used moves ln K by 0', () => {
    const r = resolved(publishedSpecies());
    const f = finding({ species: 'CO', phase: 'g', diagnosis: { cause: 'sign', field: 'dGf', corrected: 137.163, unit: 'kJ/mol', residualAfter: 0 } });
    impactOfFindings([f], [r]);
    expect(f.impact![0]!.maxAbsDeltaLnK).toBe(0);
  });

  test('a Cp extrapolation: the spread against Cp frozen at the range end (closed form for a linear Cp)', () => {
    // Cp = a + bT fitted on 298–1000 K; beyond 1000 K frozen at a + 1000 b. Then, for T > 1000 K,
    //   ΔH = b (T² − 1000²)/2 − 1000 b (T − 1000),  ΔS = b (T − 1000) − 1000 b ln(T/1000)
    const a = 25;
    const b = 0.02;
    const table = [
      species({ name: 'butane', formula: 'C4H10', phase: 'g', dHf_kJ: -125.6, S: 310.23, poly: [{ exponents: [0, 1], coeffs: [a, b], Tmin: 298, Tmax: 1000 }] }),
      species({ name: 'isobutane', formula: 'C4H10', phase: 'g', dHf_kJ: -134.2, S: 294.75, poly: [{ exponents: [0], coeffs: [90], Tmin: 200, Tmax: 3000 }] }),
    ];
    const temps = [500, 1000, 1200, 1500];
    const out = runEquilibrium([reactionFromEquation('iso', 'butane(g) = isobutane(g)', where, { temps })], table, REFERENCE);
    const fx = out.findings.filter((f) => f.rule === 'reaction-extrapolation');
    expect(fx.map((f) => [f.species, f.params.temps])).toEqual([['butane', '1200, 1500']]);
    impactOfFindings(fx, out.resolved);
    const T = 1500;
    const dH = (b * (T * T - 1e6)) / 2 - 1000 * b * (T - 1000);
    const dS = b * (T - 1000) - 1000 * b * Math.log(T / 1000);
    expect(fx[0]!.impact![0]!.T_K).toBe(1500);
    expect(fx[0]!.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(Math.abs(dH - T * dS) / (R * T), 10);
  });

  test('a Cp unit slip: the ln K difference between the curve as given and the curve with the unit corrected', () => {
    // H2's NASA-7 low-range Cp/R polynomial (GRI-Mech 3.0 thermo data, 200–1000 K, from memory) copied
    // into a poly row declared in J/(mol K): every Cp is R times too small.
    const a = [2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12];
    const h2 = (unit: 'J/(mol K)' | 'R'): Species => {
      const base = publishedSpecies().find((s) => s.name === 'H2')!;
      const cp: CpSpec = { model: 'poly', coeffs: a, exponents: [0, 1, 2, 3, 4], unit, unitFactor: unit === 'R' ? R : 1, Tmin: 200, Tmax: 1000, location: { file: 'species.csv', line: 7 } };
      return { ...base, cp: [cp] };
    };
    const slipped = publishedSpecies().map((s) => (s.name === 'H2' ? h2('J/(mol K)') : s));
    const fixed = publishedSpecies().map((s) => (s.name === 'H2' ? h2('R') : s));
    const findings = gasBounds.check!(slipped.find((s) => s.name === 'H2')!, ctx);
    expect(findings.map((f) => [f.messageId, f.diagnosis?.cause])).toEqual([['belowDiagnosed', 'cp-over-R-as-J']]);
    const temps = [298.15, 500, 800, 1000, 1200];
    impactOfFindings(findings, [resolved(slipped, WGS, temps)]);
    const a0 = computeReaction(resolved(slipped, WGS, temps), temps);
    const b0 = computeReaction(resolved(fixed, WGS, temps), temps);
    const diffs = a0.map((p, i) => Math.abs(p.lnK! - b0[i]!.lnK!));
    const worst = Math.max(...diffs);
    expect(worst).toBeGreaterThan(1); // far more than any stated uncertainty would give
    expect(findings[0]!.impact).toEqual([{ reaction: 'wgs', maxAbsDeltaLnK: expect.any(Number), T_K: temps[diffs.indexOf(worst)] }]);
    expect(findings[0]!.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(worst, 9);
  });

  test('a range with °C ends read as K: the ln K difference against the range moved up by 273.15 K', () => {
    // H2's two NIST WebBook Shomate ranges, 298–1000 and 1000–2500 K (from memory), typed as 24.85–726.85
    // and 726.85–2226.85 under a K header: the upper formula then speaks from 726.85 K, and near 25 K
    // the lower one's E/t² term makes Cp negative (cp-positive)
    const h2 = (shift: number): Species => {
      const base = publishedSpecies().find((s) => s.name === 'H2')!;
      return { ...base, cp: base.cp.map((c) => ({ ...c, Tmin: c.Tmin - shift, Tmax: c.Tmax - shift })) };
    };
    const slipped = publishedSpecies().map((s) => (s.name === 'H2' ? h2(273.15) : s));
    const findings = cpPositive.check!(slipped.find((s) => s.name === 'H2')!, ctx);
    expect(findings.map((f) => [f.diagnosis?.cause, f.location.field])).toEqual([['degC-read-as-K', 'cp_Tmin']]);
    const temps = [298.15, 500, 800, 1000, 1200];
    impactOfFindings(findings, [resolved(slipped, WGS, temps)]);
    const a0 = computeReaction(resolved(slipped, WGS, temps), temps);
    const b0 = computeReaction(resolved(publishedSpecies(), WGS, temps), temps);
    const diffs = a0.map((p, i) => Math.abs(p.lnK! - b0[i]!.lnK!));
    const worst = Math.max(...diffs);
    expect(worst).toBeGreaterThan(1e-3);
    expect(findings[0]!.impact).toEqual([{ reaction: 'wgs', maxAbsDeltaLnK: expect.any(Number), T_K: temps[diffs.indexOf(worst)] }]);
    expect(findings[0]!.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(worst, 9);
  });

  test('a Gibbs–Helmholtz residual without a diagnosis: the residual moved through each value used, largest kept', () => {
    const r = resolved(publishedSpecies());
    const f = finding({ rule: 'gibbs-helmholtz', species: 'H2O', phase: 'g', params: { residual: 2.5 }, location: { file: 'species.csv', line: 1, field: 'dGf' } });
    impactOfFindings([f], [r]);
    // ΔfH° off by 2.5 kJ/mol moves ln K by 2500/(RT), largest at 298.15 K; S° off by 2500/298.15 by 2500/(298.15 R): the same
    expect(f.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(2500 / (R * 298.15), 9);
  });

  test('a finding on a field without a correction: its stated uncertainty, else the 1 kJ/mol screening default', () => {
    const table = withU(publishedSpecies());
    const r = resolved(table);
    const stated = finding({ species: 'CO', phase: 'g', location: { file: 'species.csv', line: 1, field: 'dHf' } });
    const fallback = finding({ species: 'NH3', phase: 'g', location: { file: 'species.csv', line: 1, field: 'dHf' } });
    const other = finding({ species: 'H2', phase: 'g', location: { file: 'species.csv', line: 1, field: 'dHf' } });
    impactOfFindings([stated, fallback, other], [r]);
    expect(stated.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(170 / (R * 298.15), 9);
    expect(fallback.impact).toBeUndefined(); // NH3 takes no part in the shift
    expect(other.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(1000 / (R * 298.15), 9);
  });

  test('an odd source on a later row: from the value on that row to the correction, not from the value ln K uses', () => {
    // CO(g) ΔfH° −110.53 kJ/mol (CODATA 1989) on line 2; a second source on line 4 typed it in kcal/mol
    const table = publishedSpecies().map((s) => {
      if (s.name !== 'CO') return s;
      const loc = (line: number) => ({ file: 'species.csv', line });
      const rows = [
        { dHf: s.dHf!, S: s.S!, P_ref: 1, source: 'CODATA 1989', location: loc(2) },
        { dHf: s.dHf! / 4.184, S: s.S!, P_ref: 1, source: 'lab sheet (invented)', location: loc(4) },
      ];
      return { ...s, values: rows };
    });
    const co = table.find((s) => s.name === 'CO')!;
    const f = finding({
      rule: 'cross-source',
      species: 'CO',
      phase: 'g',
      location: { file: 'species.csv', line: 4, field: 'dHf' },
      diagnosis: { cause: 'odd-source', field: 'dHf', corrected: -110.53, unit: 'kJ/mol', residualAfter: 0 },
    });
    impactOfFindings([f], [resolved(table)]);
    // ν(CO) = −1; the shift is T-independent in ΔH, so largest at the lowest temperature
    const dH = co.dHf! - co.dHf! / 4.184;
    expect(f.impact![0]!.T_K).toBe(298.15);
    expect(f.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(Math.abs(dH) / (R * 298.15), 6);
  });

  test('two sources that disagree: the field moved by their spread, not by a nominal uncertainty', () => {
    const f = finding({ rule: 'cross-source', messageId: 'two', species: 'CO2', phase: 'g', params: { field: 'S', spread: 4.2 }, location: { file: 'species.csv', line: 7, field: 'S' } });
    impactOfFindings([f], [resolved(publishedSpecies())]);
    // S° moved by 4.2 J/(mol K) moves ln K by 4.2/R at every temperature (ν(CO2) = +1)
    expect(f.impact![0]!.maxAbsDeltaLnK).toBeCloseTo(4.2 / R, 9);
  });

  test('an exact repeat of an earlier row questions no value: no impact', () => {
    const r = resolved(publishedSpecies());
    const f = finding({ rule: 'duplicate-row', species: 'CO', phase: 'g', location: { file: 'species.csv', line: 9 } });
    impactOfFindings([f], [r]);
    expect(f.impact).toBeUndefined();
  });

  test('impacts are listed per reaction, largest first', () => {
    const table = publishedSpecies();
    const out = runEquilibrium(
      [reactionFromEquation('wgs', WGS, where, { temps: [800] }), reactionFromEquation('nh3', 'N2(g) + 3 H2(g) = 2 NH3(g)', { file: 'r.csv', line: 3 }, { temps: [500] })],
      table,
      REFERENCE,
    );
    const f = finding({ species: 'H2', phase: 'g', location: { file: 'species.csv', line: 1, field: 'S' } });
    impactOfFindings([f], out.resolved);
    // S° moved by 1 J/(mol K): |ν|/R, so ammonia (ν = −3) before the shift (ν = +1)
    expect(f.impact!.map((i) => [i.reaction, Number(i.maxAbsDeltaLnK.toFixed(9))])).toEqual([
      ['nh3', Number((3 / R).toFixed(9))],
      ['wgs', Number((1 / R).toFixed(9))],
    ]);
  });
});

describe('scale', () => {
  // The size of the benchmark's equilibrium stage (npm run bench times it; nothing is timed here): the
  // table has 2·10^5 species, most of which no reaction uses; every point and impact must be there.
  test('10^3 reactions × 50 temperatures over 2·10^5 species: resolve, compute and impacts (timed by npm run bench, not here)', () => {
    const base = publishedSpecies();
    const table: Species[] = [...base];
    // filler species (invented, for timing only): distinct names and formulas, never used by a reaction
    for (let i = 0; i < 200_000; i++) {
      const formulaText = `C${1 + (i % 400)}H${2 + Math.floor(i / 400)}O`;
      table.push({ ...base[0]!, key: `filler${i}|g`, name: `filler${i}`, formulaText, formula: parseFormula(formulaText) });
    }
    const temps = Array.from({ length: 50 }, (_, k) => 300 + 20 * k);
    const specs = Array.from({ length: 1000 }, (_, i) =>
      reactionFromEquation(`r${i}`, i % 2 ? WGS : 'N2(g) + 3 H2(g) = 2 NH3(g)', { file: 'r.csv', line: i + 2 }, { temps }),
    );
    const findings = Array.from({ length: 1000 }, (_, i) => finding({ species: base[i % base.length]!.name, phase: 'g', location: { file: 'species.csv', line: 1, field: 'dHf' } }));
    const out = runEquilibrium(specs, table, REFERENCE);
    impactOfFindings(findings, out.resolved);
    expect(out.results.every((r) => r.points.length === 50)).toBe(true);
    expect(findings.every((f) => f.impact && f.impact.length >= 500)).toBe(true);
  });
});

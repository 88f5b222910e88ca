// The two routes and how they relate, derived formation values, extrapolation, missing Cp, temperatures.
import { describe, expect, test } from 'vitest';
import { R_J_PER_MOL_K } from '../../pipeline/cp/constants.js';
import { runEquilibrium } from '../../pipeline/equilibrium/index.js';
import { computeReaction } from '../../pipeline/equilibrium/lnk.js';
import { reactionFromEquation, resolveReactions } from '../../pipeline/equilibrium/reactions.js';
import { reactionTemperatures, windowGrid } from '../../pipeline/equilibrium/temperatures.js';
import { constantCp, species } from './helpers.js';
import { EQUILIBRIUM_CHECKS, publishedSpecies, REFERENCE, SHOMATE } from './published-data.js';

const where = { file: 'r.csv', line: 3 };
const R = R_J_PER_MOL_K;
const T0 = 298.15;

function resolved(eq: string, table: ReturnType<typeof species>[], temps: number[]) {
  const out = resolveReactions([reactionFromEquation('r', eq, where, { temps })], table, REFERENCE);
  expect(out.findings).toEqual([]);
  return out.resolved[0]!;
}

// An isomerisation keeps the elements equal on both sides, so any Cp can be given to each isomer.
// Formation values: NBS 1982 (Wagman et al.) for n-butane and isobutane, from memory; the Cp values
// below are chosen to make ΔrCp exactly 0 or exactly constant — the identities hold for any data.
const butanes = (cpN: number, cpIso: number) => [
  species({ name: 'butane', formula: 'C4H10', phase: 'g', dHf_kJ: -125.6, S: 310.23, poly: constantCp(cpN) }),
  species({ name: 'isobutane', formula: 'C4H10', phase: 'g', dHf_kJ: -134.2, S: 294.75, poly: constantCp(cpIso) }),
];
const temps = [200, 298.15, 350, 500, 800, 1000, 1500, 2500];

describe('the constant-ΔrH° shortcut against the rigorous route', () => {
  test('equal when ΔrCp = 0 (to round-off)', () => {
    for (const p of computeReaction(resolved('butane(g) = isobutane(g)', butanes(98, 98), temps))) {
      expect(Math.abs(p.lnK - p.lnKShortcut)).toBeLessThan(1e-12);
      expect(p.dH).toBeCloseTo(-8.6, 12); // ΔrH° stays at its 298.15 K value
    }
  });

  test('the shortcut is ln K(298.15) − (ΔrH°298/R)(1/T − 1/298.15)', () => {
    const pts = computeReaction(resolved('butane(g) = isobutane(g)', butanes(98, 110), temps));
    const at298 = pts.find((p) => p.T === T0)!;
    const dH298 = at298.dH * 1000;
    for (const p of pts) expect(p.lnKShortcut).toBeCloseTo(at298.lnK - (dH298 / R) * (1 / p.T - 1 / T0), 12);
  });

  test('with constant ΔrCp they differ by (ΔrCp/R)[ln(T/T0) + T0/T − 1], the integrated Kirchhoff form', () => {
    const dCp = 12.5; // J/(mol K)
    for (const p of computeReaction(resolved('butane(g) = isobutane(g)', butanes(98, 98 + dCp), temps))) {
      const expected = (dCp / R) * (Math.log(p.T / T0) + T0 / p.T - 1);
      expect(Math.abs(p.lnK - p.lnKShortcut - expected)).toBeLessThan(1e-10);
      // and ΔrH°(T) = ΔrH°298 + ΔrCp (T − T0), ΔrS°(T) = ΔrS°298 + ΔrCp ln(T/T0)
      expect(p.dH).toBeCloseTo(-8.6 + (dCp * (p.T - T0)) / 1000, 10);
      expect(p.dS).toBeCloseTo(294.75 - 310.23 + dCp * Math.log(p.T / T0), 10);
    }
  });

  test('ln K = −ΔrG°/(RT) and ΔrG° = ΔrH° − TΔrS° at every point', () => {
    const r = resolved('CO(g) + H2O(g) = CO2(g) + H2(g)', publishedSpecies(), [298.15, 700, 1100]);
    for (const p of computeReaction(r)) {
      expect(p.dG).toBeCloseTo(p.dH - (p.T * p.dS) / 1000, 10);
      expect(p.lnK).toBeCloseTo((-p.dG * 1000) / (R * p.T), 10);
    }
  });
});

describe('a third formation value derived from the other two', () => {
  // H2O(g) given without S°: S° = Σ S°(elements) + (ΔfH° − ΔfG°)/T0 with the shipped element entropies
  // (CODATA); CO(g) given without ΔfH°: ΔfH° = ΔfG° + T0 (S° − Σ S°(elements)). The JANAF checks still hold.
  const table = publishedSpecies().map((s) => {
    if (s.name === 'H2O') return { ...s, S: undefined };
    if (s.name === 'CO') return { ...s, dHf: undefined };
    return s;
  });
  test.each(EQUILIBRIUM_CHECKS.filter((c) => c.equation.startsWith('CO')))('water-gas shift at $T K ($tables)', ({ T, log10K }) => {
    const r = resolved('CO(g) + H2O(g) = CO2(g) + H2(g)', table, [T]);
    expect(r.terms.find((t) => t.thermo.species.name === 'H2O')!.thermo.route).toBe('HG');
    expect(r.terms.find((t) => t.thermo.species.name === 'CO')!.thermo.route).toBe('GS');
    const [p] = computeReaction(r);
    expect(Math.abs(p!.lnK / Math.LN10 - log10K)).toBeLessThan(0.005); // same budget as published.test.ts
  });

  test('a species with only ΔfG° has too little data: error finding, no ln K', () => {
    const t = publishedSpecies().map((s) => (s.name === 'CO' ? { ...s, dHf: undefined, S: undefined } : s));
    const out = runEquilibrium([reactionFromEquation('r', 'CO(g) + H2O(g) = CO2(g) + H2(g)', where, { temps: [500] })], t, REFERENCE);
    expect(out.findings.map((f) => [f.rule, f.messageId, f.species])).toEqual([['reaction-data', 'incomplete', 'CO']]);
    expect(out.results[0]!.points).toEqual([]);
  });

  test('an element in its reference state with ΔfH° left blank takes 0', () => {
    const t = publishedSpecies().map((s) => (s.name === 'H2' ? { ...s, dHf: undefined, dGf: undefined } : s));
    const r = resolved('CO(g) + H2O(g) = CO2(g) + H2(g)', t, [500]);
    expect(r.terms.find((x) => x.thermo.species.name === 'H2')!.thermo.dHf).toBe(0);
  });
});

describe('extrapolation is flagged where the Cp range ends', () => {
  // NH3's Shomate fit is published for 298–1400 K, H2's in two ranges 298–1000–2500 K, N2's 100–500–2000 K.
  const T = [298.15, 500, 1000, 1400, 1500, 1800, 2100];
  const r = resolved('N2(g) + 3 H2(g) = 2 NH3(g)', publishedSpecies(), T);
  const pts = computeReaction(r);

  test('NH3 past 1400 K, N2 past 2000 K, by the right number of kelvin', () => {
    const flagged = pts.map((p) => [p.T, p.extrapolated.map((e) => [e.species, Number(e.outsideK.toFixed(6))])]);
    expect(flagged).toEqual([
      [298.15, []],
      [500, []],
      [1000, []],
      [1400, []],
      [1500, [['NH3(g)', 100]]],
      [1800, [['NH3(g)', 400]]],
      [2100, [['N2(g)', 100], ['NH3(g)', 700]]],
    ]);
  });

  test('the Cp shown is the correlation extrapolated, i.e. the NH3 Shomate formula at 1800 K', () => {
    const [, , A, B, C, D, E] = SHOMATE.NH3[0]!;
    const t = 1.8;
    const cp = A + B * t + C * t * t + D * t ** 3 + E / (t * t); // published Shomate form
    expect(pts[5]!.extrapolated.find((e) => e.species === 'NH3(g)')!.cp).toBeCloseTo(cp, 10);
  });

  test('one warning per extrapolated species, at the reaction, naming the temperatures', () => {
    const out = runEquilibrium([reactionFromEquation('nh3', 'N2(g) + 3 H2(g) = 2 NH3(g)', where, { temps: T })], publishedSpecies(), REFERENCE);
    expect(out.findings.map((f) => [f.rule, f.species, f.params.temps, f.params.outsideK, f.location.line])).toEqual([
      ['reaction-extrapolation', 'N2', '2100', 100, 3],
      ['reaction-extrapolation', 'NH3', '1500, 1800, 2100', 700, 3],
    ]);
  });

  test('a range that does not reach 298.15 K is reported: its integrals run through the extrapolated part', () => {
    const out = runEquilibrium([reactionFromEquation('wgs', 'CO(g) + H2O(g) = CO2(g) + H2(g)', where, { temps: [500, 800] })], publishedSpecies(), REFERENCE);
    expect(out.findings.map((f) => [f.messageId, f.species, f.params.outsideK])).toEqual([['reference-outside', 'H2O', 201.85]]);
    expect(out.results[0]!.points.every((p) => p.extrapolated.length === 0)).toBe(true);
  });
});

describe('a species without any Cp', () => {
  test('the reaction falls back to ΔrCp = 0: ln K is the shortcut, the species is listed, a warning says so', () => {
    const t = publishedSpecies().map((s) => (s.name === 'NH3' ? { ...s, cp: [] } : s));
    const spec = reactionFromEquation('nh3', 'N2(g) + 3 H2(g) = 2 NH3(g)', where, { temps: [298.15, 700] });
    const out = runEquilibrium([spec], t, REFERENCE, {}, { cpMissingOnPoints: true });
    // by default the points stay as the report schema has them; the finding carries the news
    expect(runEquilibrium([spec], t, REFERENCE).results[0]!.points.every((p) => !('cpMissing' in p))).toBe(true);
    expect(out.findings.map((f) => [f.rule, f.messageId, f.severity, f.species])).toEqual([['reaction-data', 'cp-missing', 'warning', 'NH3']]);
    for (const p of out.results[0]!.points as { lnK: number; lnKShortcut: number; cpMissing?: string[] }[]) {
      expect(p.lnK).toBeCloseTo(p.lnKShortcut, 12);
      expect(p.cpMissing).toEqual(['NH3(g)']);
    }
  });
});

describe('temperatures', () => {
  test('a listed T is used as given (sorted, duplicates dropped)', () => {
    expect(reactionTemperatures({ temps: [1000, 500, 500, 298.15] })).toEqual([298.15, 500, 1000]);
  });

  test('a window gives its ends, a 10–20 interval grid of round values, and 298.15 K when inside', () => {
    const g = windowGrid(250, 1200);
    expect(g[0]).toBe(250);
    expect(g[g.length - 1]).toBe(1200);
    expect(g).toContain(298.15);
    expect(g.length - 1).toBeGreaterThanOrEqual(10);
    expect(g.length - 1).toBeLessThanOrEqual(21); // 298.15 K may add one interval
    expect(g).toEqual([...g].sort((a, b) => a - b));
    expect(g.filter((T) => T !== 250 && T !== 1200 && T !== 298.15).every((T) => T % 50 === 0)).toBe(true);
    expect(g).not.toContain(300); // too close to 298.15 K
  });

  test('a window above 298.15 K does not get it; a degenerate window is one point', () => {
    expect(windowGrid(400, 1200)).not.toContain(298.15);
    expect(windowGrid(500, 500)).toEqual([500]);
  });

  test('without its own temperatures a reaction takes the use window, else 298.15 K', () => {
    expect(reactionTemperatures({}, { temperatures: [700, 600] })).toEqual([600, 700]);
    expect(reactionTemperatures({}, { Tmin: 400, Tmax: 600 })[0]).toBe(400);
    expect(reactionTemperatures({})).toEqual([298.15]);
  });
});

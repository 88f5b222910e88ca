// A species' Cp correlation as the report shows it: its models and ranges (with file and line), Cp at
// 298.15 K, Cp at the use window's ends and listed temperatures with the kelvin outside the fitted
// ranges, and optionally a sampled curve for charts. Charts read this; they compute nothing.
import type { CpSummary, Species, UseWindow } from '../types.js';
import { T_REF_K } from './constants.js';
import { speciesCp } from './curve-cache.js';

/** Points in the sampled curve, spread evenly from 298.15 K over the fitted ranges and the use window (the range ends are added). */
export const SUMMARY_SAMPLES = 40;

const r6 = (x: number): number => Number(x.toPrecision(6));

export function cpSummary(sp: Species, useWindow: UseWindow, withSamples: boolean): CpSummary | undefined {
  const cp = speciesCp(sp);
  if (!cp) return undefined;
  const { specs, curve } = cp;
  const models: string[] = [];
  for (const s of specs) if (!models.includes(s.model)) models.push(s.model);
  const point = (T: number) => ({ T, cp: r6(curve.cp(T)), outsideK: r6(curve.outside(T)) });

  const windowTs = [useWindow.Tmin, useWindow.Tmax, ...(useWindow.temperatures ?? [])].filter(
    (t): t is number => typeof t === 'number' && Number.isFinite(t) && t > 0,
  );
  const atWindow = [...new Set(windowTs)].sort((a, b) => a - b).map(point);

  const summary: CpSummary = {
    models,
    ranges: specs.map((s) => ({ model: s.model, Tmin: s.Tmin, Tmax: s.Tmax, file: s.location.file, line: s.location.line })),
    cp298: r6(curve.cp(T_REF_K)),
    atWindow,
  };
  if (withSamples) {
    // from 298.15 K, where the H and S integrals start, so a range that begins above it shows the
    // extrapolated stretch the integrals run through; every range end is a sample, so the chart
    // changes from fitted to extrapolated exactly where the fitted range ends
    const lo = Math.min(curve.Tmin, T_REF_K, ...windowTs);
    const hi = Math.max(curve.Tmax, ...windowTs);
    const Ts = new Set<number>();
    for (let i = 0; i < SUMMARY_SAMPLES - 1; i++) Ts.add(r6(lo + ((hi - lo) * i) / (SUMMARY_SAMPLES - 1)));
    Ts.add(r6(hi));
    for (const s of specs) for (const t of [s.Tmin, s.Tmax]) if (t >= lo && t <= hi) Ts.add(r6(t));
    summary.samples = [...Ts].sort((a, b) => a - b).map(point);
  }
  return summary;
}

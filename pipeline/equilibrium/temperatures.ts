// Which temperatures a reaction is computed at.
import { T_REF_K } from '../cp/constants.js';
import type { UseWindow } from '../types.js';

/** What a reactions-file row (or the manifest) says about temperatures, in K. */
export interface TemperatureSpec {
  temps?: number[];
  Tmin?: number;
  Tmax?: number;
}

/** Interior grid spacing: the 1-2-5 step that cuts the window into 10 to 20 intervals (fewer for a narrow window). */
export function gridStep(span: number): number {
  if (!(span > 0)) return 0;
  const raw = span / 20;
  const decade = 10 ** Math.floor(Math.log10(raw));
  for (const m of [1, 2, 5, 10]) if (m * decade >= raw) return m * decade;
  return 10 * decade;
}

/**
 * The window's ends and a grid of round temperatures inside it (multiples of a 1-2-5 step giving
 * 10–20 intervals), plus 298.15 K when it lies inside the window. Grid points closer than a fifth of
 * a step to an end or to 298.15 K are left out, so 298.15 K is not followed by 300 K. Ascending.
 */
export function windowGrid(Tmin: number, Tmax: number): number[] {
  if (Tmax <= Tmin) return [Tmin];
  const step = gridStep(Tmax - Tmin);
  const anchors = [Tmin, Tmax];
  if (Tmin < T_REF_K && T_REF_K < Tmax) anchors.push(T_REF_K);
  const out = [...anchors];
  for (let k = Math.ceil(Tmin / step - 1e-9); ; k++) {
    const T = Number((k * step).toPrecision(12)); // integer multiples: no accumulated round-off
    if (T >= Tmax - 1e-9) break;
    if (T <= Tmin + 1e-9 || anchors.some((a) => Math.abs(a - T) < step / 5)) continue;
    out.push(T);
  }
  return out.sort((a, b) => a - b);
}

/** Ascending, duplicates (to 1e-9 K) removed. */
export function tidyTemperatures(temps: readonly number[]): number[] {
  const s = [...temps].sort((a, b) => a - b);
  return s.filter((T, i) => i === 0 || Math.abs(T - s[i - 1]!) > 1e-9);
}

/**
 * A reaction's temperatures: its own list; else its own Tmin–Tmax as a grid; else the use window
 * (its listed temperatures, or its Tmin–Tmax as a grid); else 298.15 K alone.
 */
export function reactionTemperatures(spec: TemperatureSpec, window: UseWindow = {}): number[] {
  if (spec.temps && spec.temps.length > 0) return tidyTemperatures(spec.temps);
  if (spec.Tmin !== undefined && spec.Tmax !== undefined) return windowGrid(spec.Tmin, spec.Tmax);
  if (window.temperatures && window.temperatures.length > 0) return tidyTemperatures(window.temperatures);
  if (window.Tmin !== undefined && window.Tmax !== undefined) return windowGrid(window.Tmin, window.Tmax);
  return [T_REF_K];
}

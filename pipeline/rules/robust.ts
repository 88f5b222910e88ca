// Robust statistics shared by the rules that compare records with each other (cross-source,
// family-trend, entropy-atoms): a median-based scale with a floor, and straight-line fits.
import { linearRegression, median, medianAbsoluteDeviation } from 'simple-statistics';

/** MAD × 1.4826 estimates the standard deviation of normally distributed data (common practice). */
export const MAD_TO_SIGMA = 1.4826;

/**
 * A robust scale of `xs`: 1.4826·MAD, never below `floor`. The floor keeps the scale finite when most
 * values are identical (MAD = 0), which would otherwise make any small difference look infinitely odd.
 */
export function robustScale(xs: readonly number[], floor: number): number {
  if (xs.length === 0) return floor;
  return Math.max(MAD_TO_SIGMA * medianAbsoluteDeviation([...xs]), floor);
}

export function medianOf(xs: readonly number[]): number {
  return median([...xs]);
}

export interface Line {
  slope: number;
  intercept: number;
}

/** Least-squares line through (x, y) points (simple-statistics). */
export function fitLine(points: readonly (readonly [number, number])[]): Line {
  const { m, b } = linearRegression(points.map(([x, y]) => [x, y]));
  return { slope: m, intercept: b };
}

export function lineAt(line: Line, x: number): number {
  return line.intercept + line.slope * x;
}

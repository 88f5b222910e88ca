// Robust statistics shared by the rules that compare records with each other (cross-source,
// family-trend, entropy-atoms): a median-based scale with a floor, and straight-line fits.
import { linearRegression, median } from 'simple-statistics';

/** MAD × 1.4826 estimates the standard deviation of normally distributed data (common practice). */
export const MAD_TO_SIGMA = 1.4826;

/**
 * A robust scale of `xs`: 1.4826·MAD, never below `floor`. The floor keeps the scale finite when most
 * values are identical (MAD = 0), which would otherwise make any small difference look infinitely odd.
 */
export function robustScale(xs: ArrayLike<number>, floor: number): number {
  if (xs.length === 0) return floor;
  // on typed copies: entropy-atoms passes ~10^5 residuals per phase at 10^6 rows, and array copies of
  // that size go straight to the old generation; same median and MAD as simple-statistics'
  const sorted = Float64Array.from(xs).sort();
  const mid = sortedMedian(sorted);
  for (let i = 0; i < sorted.length; i++) sorted[i] = Math.abs(xs[i]! - mid);
  return Math.max(MAD_TO_SIGMA * sortedMedian(sorted.sort()), floor);
}

/** The median of ascending values: the middle one, or halfway between the two middle ones, written as simple-statistics writes it (a + 0.5·(b − a)) so the last bit agrees too. */
function sortedMedian(sorted: Float64Array): number {
  const n = sorted.length;
  const h = n >> 1;
  return n % 2 === 1 ? sorted[h]! : sorted[h - 1]! + 0.5 * (sorted[h]! - sorted[h - 1]!);
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

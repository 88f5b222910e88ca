// table: Cp given at listed temperatures (spec.temps, strictly ascending, > 0 K, at least two),
// values spec.coeffs × spec.unitFactor in J/(mol K).
//
// Between the listed points: monotone piecewise-cubic Hermite interpolation (Fritsch and Carlson
// 1980, SIAM J. Numer. Anal. 17, 238). Node slopes start from the three-point (parabola) derivative,
// are set to zero at local extrema of the data, and are then limited so that (α, β) = (m_i, m_i+1)/δ_i
// lies in the quarter disc of radius 3: each cubic piece is then monotone between its two data
// values, so the interpolant never overshoots the data.
//
// Outside the listed points: the straight line through the end point with the interpolant's end
// slope (C¹ at the ends). That line is what an extrapolating user gets; the curve reports how far
// outside the range it is.
//
// Integrals are exact for this interpolant:
//   ∫ p(s) ds of the cubic p(s) = y + m s + c2 s² + c3 s³ (s = T − x_i) is a polynomial;
//   ∫ p(s)/(x_i + s) ds = Σ_k a_k I_k with I_k(s) = ∫₀ˢ t^k/(x_i + t) dt = (s^(k+1)/x_i) Φ_k(s/x_i),
//   Φ_k(u) = ∫₀¹ v^k/(1 + u v) dv, Φ_0 = ln(1+u)/u, Φ_k = (1/k − Φ_(k−1))/u.
// The closed form loses digits when u = s/x_i is small (a short piece far from 0 K), so there Φ_3 is
// summed from its convergent series Σ_j (−u)^j/(j+4) and Φ_2, Φ_1, Φ_0 follow from the recurrence
// run backwards (Φ_(k−1) = 1/k − u Φ_k), which damps errors instead of amplifying them.
// Cumulative integrals at the nodes make one evaluation a binary search plus one piece.

import type { CpSegment, CpSpec } from '../types.js';
import { CpSpecError } from './errors.js';
import { requireFinite, unitFactorOf } from './validate.js';

/** Φ_0..Φ_3 at u ≥ 0 (see the header). */
function phi(u: number): [number, number, number, number] {
  if (u >= 0.5) {
    const p0 = Math.log1p(u) / u;
    const p1 = (1 - p0) / u;
    const p2 = (1 / 2 - p1) / u;
    const p3 = (1 / 3 - p2) / u;
    return [p0, p1, p2, p3];
  }
  let p3 = 0;
  let term = 1; // (−u)^j
  for (let j = 0; j < 200; j++) {
    const add = term / (j + 4);
    p3 += add;
    if (Math.abs(add) <= 1e-17 * Math.abs(p3)) break;
    term *= -u;
  }
  const p2 = 1 / 3 - u * p3;
  const p1 = 1 / 2 - u * p2;
  const p0 = 1 - u * p1;
  return [p0, p1, p2, p3];
}

/** Fritsch–Carlson node slopes for data (x, y), n ≥ 2. */
export function monotoneSlopes(x: readonly number[], y: readonly number[]): number[] {
  const n = x.length;
  const h: number[] = [];
  const d: number[] = [];
  for (let i = 0; i < n - 1; i++) {
    h.push(x[i + 1] - x[i]);
    d.push((y[i + 1] - y[i]) / h[i]);
  }
  const m = new Array<number>(n).fill(0);
  if (n === 2) {
    m[0] = m[1] = d[0];
    return m;
  }
  for (let k = 1; k < n - 1; k++) {
    if (d[k - 1] * d[k] > 0) m[k] = (h[k] * d[k - 1] + h[k - 1] * d[k]) / (h[k - 1] + h[k]);
  }
  // One-sided three-point end slopes, kept shape-preserving.
  const end = (h0: number, h1: number, d0: number, d1: number): number => {
    let s = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
    if (Math.sign(s) !== Math.sign(d0)) s = 0;
    else if (Math.sign(d0) !== Math.sign(d1) && Math.abs(s) > 3 * Math.abs(d0)) s = 3 * d0;
    return s;
  };
  m[0] = end(h[0], h[1], d[0], d[1]);
  m[n - 1] = end(h[n - 2], h[n - 3], d[n - 2], d[n - 3]);
  // The Fritsch–Carlson limiter: (α, β) inside the quarter disc of radius 3.
  for (let i = 0; i < n - 1; i++) {
    if (d[i] === 0) {
      m[i] = 0;
      m[i + 1] = 0;
      continue;
    }
    const a = m[i] / d[i];
    const b = m[i + 1] / d[i];
    const r2 = a * a + b * b;
    if (r2 > 9) {
      const tau = 3 / Math.sqrt(r2);
      m[i] = tau * a * d[i];
      m[i + 1] = tau * b * d[i];
    }
  }
  return m;
}

export function buildTable(spec: CpSpec): CpSegment {
  const temps = spec.temps ?? [];
  if (temps.length !== spec.coeffs.length || temps.length < 2) {
    throw new CpSpecError(
      'cp-temp-count',
      `table needs one temperature per Cp value and at least two points: got ${spec.coeffs.length} value(s) and ${temps.length} temperature(s)`,
      spec.location,
    );
  }
  requireFinite(spec, 'Cp value', spec.coeffs);
  requireFinite(spec, 'temperature', temps);
  for (let i = 0; i < temps.length; i++) {
    if (!(temps[i] > 0)) {
      throw new CpSpecError('cp-temps-not-positive', `table temperature #${i + 1} is ${temps[i]} K; temperatures must be above 0 K`, spec.location);
    }
    if (i > 0 && !(temps[i] > temps[i - 1])) {
      throw new CpSpecError(
        'cp-temps-not-ascending',
        `table temperatures must be strictly ascending: #${i} is ${temps[i - 1]} K, #${i + 1} is ${temps[i]} K`,
        spec.location,
      );
    }
  }
  const f = unitFactorOf(spec);
  const x = temps.slice();
  const y = spec.coeffs.map((v) => v * f);
  const n = x.length;
  const m = monotoneSlopes(x, y);

  // Per piece i on [x_i, x_i+1]: p(s) = y_i + m_i s + c2_i s² + c3_i s³.
  const c2: number[] = [];
  const c3: number[] = [];
  for (let i = 0; i < n - 1; i++) {
    const h = x[i + 1] - x[i];
    const d = (y[i + 1] - y[i]) / h;
    c2.push((3 * d - 2 * m[i] - m[i + 1]) / h);
    c3.push((m[i] + m[i + 1] - 2 * d) / (h * h));
  }
  const pieceCp = (i: number, s: number): number => y[i] + s * (m[i] + s * (c2[i] + s * c3[i]));
  const pieceInt = (i: number, s: number): number => s * (y[i] + s * (m[i] / 2 + s * (c2[i] / 3 + s * (c3[i] / 4))));
  const pieceIntOverT = (i: number, s: number): number => {
    if (s === 0) return 0;
    const xi = x[i];
    const u = s / xi;
    const [p0, p1, p2, p3] = phi(u);
    // Σ a_k s^(k+1)/x_i Φ_k
    return (s / xi) * (y[i] * p0 + s * (m[i] * p1 + s * (c2[i] * p2 + s * (c3[i] * p3))));
  };

  // Cumulative integrals from x_0 to each node.
  const F = new Array<number>(n).fill(0);
  const G = new Array<number>(n).fill(0);
  for (let i = 0; i < n - 1; i++) {
    const h = x[i + 1] - x[i];
    F[i + 1] = F[i] + pieceInt(i, h);
    G[i + 1] = G[i] + pieceIntOverT(i, h);
  }

  /** the piece i with x_i ≤ T < x_i+1 (the last piece for T = x_n−1); only for x_0 ≤ T ≤ x_n−1 */
  const pieceOf = (T: number): number => {
    let lo = 0;
    let hi = n - 2;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (x[mid] <= T) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };
  const last = n - 1;

  return {
    model: 'table',
    Tmin: spec.Tmin,
    Tmax: spec.Tmax,
    location: spec.location,
    cp(T) {
      if (T < x[0]) return y[0] + m[0] * (T - x[0]);
      if (T > x[last]) return y[last] + m[last] * (T - x[last]);
      const i = pieceOf(T);
      return pieceCp(i, T - x[i]);
    },
    intCp(T) {
      if (T < x[0]) {
        const dT = T - x[0];
        return dT * (y[0] + (m[0] * dT) / 2);
      }
      if (T > x[last]) {
        const dT = T - x[last];
        return F[last] + dT * (y[last] + (m[last] * dT) / 2);
      }
      const i = pieceOf(T);
      return F[i] + pieceInt(i, T - x[i]);
    },
    intCpOverT(T) {
      if (!(T > 0)) return NaN;
      // the line y_e + m_e (T − x_e) over T integrates to (y_e − m_e x_e) ln(T/x_e) + m_e (T − x_e)
      if (T < x[0]) return (y[0] - m[0] * x[0]) * Math.log(T / x[0]) + m[0] * (T - x[0]);
      if (T > x[last]) return G[last] + (y[last] - m[last] * x[last]) * Math.log(T / x[last]) + m[last] * (T - x[last]);
      const i = pieceOf(T);
      return G[i] + pieceIntOverT(i, T - x[i]);
    },
  };
}

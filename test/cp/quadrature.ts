// Numerical quadrature written for the tests, independent of the code under test.

/** Nodes and weights of n-point Gauss–Legendre on [−1, 1] (Newton on P_n, from Chebyshev guesses). */
export function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    let z = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      // p1 = P_n(z), p0 = P_(n−1)(z)
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x.push(z);
    w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
}

const GL20 = gaussLegendre(20);

/** ∫_a^b f by 20-point Gauss–Legendre on `pieces` equal sub-intervals (or on the given breakpoints). */
export function integrateGL(f: (t: number) => number, a: number, b: number, pieces = 16, breaks: number[] = []): number {
  const pts = [a, ...breaks.filter((t) => (t - a) * (t - b) < 0).sort((p, q) => (a < b ? p - q : q - p)), b];
  let sum = 0;
  for (let j = 0; j + 1 < pts.length; j++) {
    const lo = pts[j];
    const hi = pts[j + 1];
    const h = (hi - lo) / pieces;
    for (let k = 0; k < pieces; k++) {
      const c = lo + (k + 0.5) * h;
      let s = 0;
      for (let i = 0; i < GL20.x.length; i++) s += GL20.w[i] * f(c + (h / 2) * GL20.x[i]);
      sum += (s * h) / 2;
    }
  }
  return sum;
}

/** ∫_a^b f by adaptive Simpson with Richardson correction, to absolute tolerance `tol`. */
export function adaptiveSimpson(f: (t: number) => number, a: number, b: number, tol: number, maxDepth = 50): number {
  const simpson = (fa: number, fm: number, fb: number, h: number): number => (h / 6) * (fa + 4 * fm + fb);
  const rec = (a0: number, b0: number, fa: number, fm: number, fb: number, whole: number, eps: number, depth: number): number => {
    const m = (a0 + b0) / 2;
    const lm = (a0 + m) / 2;
    const rm = (m + b0) / 2;
    const flm = f(lm);
    const frm = f(rm);
    const left = simpson(fa, flm, fm, m - a0);
    const right = simpson(fm, frm, fb, b0 - m);
    const delta = left + right - whole;
    if (depth <= 0 || Math.abs(delta) <= 15 * eps) return left + right + delta / 15;
    return rec(a0, m, fa, flm, fm, left, eps / 2, depth - 1) + rec(m, b0, fm, frm, fb, right, eps / 2, depth - 1);
  };
  const fa = f(a);
  const fb = f(b);
  const fm = f((a + b) / 2);
  return rec(a, b, fa, fm, fb, simpson(fa, fm, fb, b - a), tol, maxDepth);
}

// A species' Cp ranges joined into one curve, with H(T) − H(298.15) and S(T) − S(298.15)
// integrated exactly through the joins.
//
// Which segment speaks at T:
//   - inside one or more segments: the one with the highest Tmin (so at a join, the upper segment);
//   - below or above every segment: the nearest segment's own formula, extrapolated;
//   - in a gap between segments: the nearer of the two (the upper one at the exact middle).
// The real line is cut once, at build time, into pieces that each use one segment; cp, dH and dS all
// read the same pieces, so dH is exactly ∫cp dT and dS exactly ∫cp/T dT. Each piece stores the
// offset that turns its segment's antiderivative into a value relative to 298.15 K, so an
// evaluation is a binary search over a handful of boundaries plus one antiderivative call.

import type { CpCurve, CpSegment } from '../types.js';
import { T_REF_K } from './constants.js';
import { CpSpecError } from './errors.js';

interface Piece {
  lo: number; // left boundary (−Infinity for the first piece); the piece owns it
  seg: CpSegment;
  offH: number; // dH(T) = offH + seg.intCp(T)
  offS: number; // dS(T) = offS + seg.intCpOverT(T)
}

/** The index of the segment that speaks at x, for x not on any segment boundary or gap middle. */
function chooseAt(x: number, segs: readonly CpSegment[]): number {
  let best = -1;
  for (let i = 0; i < segs.length; i++) {
    const s = segs[i];
    if (s.Tmin < x && x < s.Tmax && (best < 0 || s.Tmin >= segs[best].Tmin)) best = i;
  }
  if (best >= 0) return best;
  let bestDist = Infinity;
  for (let i = 0; i < segs.length; i++) {
    const s = segs[i];
    const dist = Math.max(s.Tmin - x, x - s.Tmax, 0);
    if (dist < bestDist || (dist === bestDist && s.Tmin >= segs[best].Tmin)) {
      best = i;
      bestDist = dist;
    }
  }
  return best;
}

export function buildCurve(segments: CpSegment[]): CpCurve {
  if (segments.length === 0) throw new CpSpecError('cp-no-segments', 'a Cp curve needs at least one segment');
  const segs = segments.slice().sort((a, b) => a.Tmin - b.Tmin || a.Tmax - b.Tmax);

  // Points where the speaking segment can change: every segment end and the middle of every gap.
  const cuts = new Set<number>();
  for (const s of segs) {
    cuts.add(s.Tmin);
    cuts.add(s.Tmax);
  }
  let coveredTo = segs[0].Tmax;
  for (let i = 1; i < segs.length; i++) {
    if (segs[i].Tmin > coveredTo) cuts.add((coveredTo + segs[i].Tmin) / 2);
    coveredTo = Math.max(coveredTo, segs[i].Tmax);
  }
  const c = [...cuts].filter(Number.isFinite).sort((a, b) => a - b);

  // One sample point inside each elementary interval (−∞, c0), (c0, c1), …, (c_last, ∞); merge runs.
  const raw: { lo: number; seg: number }[] = [];
  for (let k = 0; k <= c.length; k++) {
    const lo = k === 0 ? -Infinity : c[k - 1];
    const sample = c.length === 0 ? 0 : k === 0 ? c[0] - 1 : k === c.length ? c[k - 1] + 1 : (c[k - 1] + c[k]) / 2;
    const seg = chooseAt(sample, segs);
    if (raw.length === 0 || raw[raw.length - 1].seg !== seg) raw.push({ lo, seg });
  }

  const pieces: Piece[] = raw.map((r) => ({ lo: r.lo, seg: segs[r.seg], offH: 0, offS: 0 }));
  const pieceIndex = (T: number): number => {
    let lo = 0;
    let hi = pieces.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (pieces[mid].lo <= T) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  };

  // Offsets relative to 298.15 K, walking out from the piece that holds it.
  const p0 = pieceIndex(T_REF_K);
  pieces[p0].offH = -pieces[p0].seg.intCp(T_REF_K);
  pieces[p0].offS = -pieces[p0].seg.intCpOverT(T_REF_K);
  for (let k = p0 + 1; k < pieces.length; k++) {
    const b = pieces[k].lo; // value at the shared boundary must agree
    const prev = pieces[k - 1];
    const cur = pieces[k];
    cur.offH = prev.offH + prev.seg.intCp(b) - cur.seg.intCp(b);
    cur.offS = prev.offS + prev.seg.intCpOverT(b) - cur.seg.intCpOverT(b);
  }
  for (let k = p0 - 1; k >= 0; k--) {
    const b = pieces[k + 1].lo;
    const next = pieces[k + 1];
    const cur = pieces[k];
    cur.offH = next.offH + next.seg.intCp(b) - cur.seg.intCp(b);
    cur.offS = next.offS + next.seg.intCpOverT(b) - cur.seg.intCpOverT(b);
  }

  // a loop, not Math.min(...): a hostile table may give one species 10^5 ranges, too many for spread arguments
  let Tmin = Infinity;
  let Tmax = -Infinity;
  for (const s of segs) {
    if (s.Tmin < Tmin) Tmin = s.Tmin;
    if (s.Tmax > Tmax) Tmax = s.Tmax;
  }

  return {
    segments: segs,
    Tmin,
    Tmax,
    cp(T) {
      return pieces[pieceIndex(T)].seg.cp(T);
    },
    dH(T) {
      const p = pieces[pieceIndex(T)];
      return p.offH + p.seg.intCp(T);
    },
    dS(T) {
      const p = pieces[pieceIndex(T)];
      return p.offS + p.seg.intCpOverT(T);
    },
    outside(T) {
      let d = Infinity;
      for (const s of segs) d = Math.min(d, Math.max(s.Tmin - T, T - s.Tmax, 0));
      return d;
    },
  };
}

/**
 * Refine a crossing on a segment with the point solver: the Illinois variant of regula falsi
 * (Dowell & Jarratt, BIT 11, 1971) on φ(t), t ∈ [0, 1], bracketed by the two grid nodes (whose φ
 * are exact point solutions of opposite sign). Superlinear, never leaves the bracket; stops when
 * the bracket is shorter than `tolT` or |φ| ≤ `tolPhi`. Returns the crossing and the far end of the
 * final bracket (the side where φ < 0), used to name the neighbour.
 * Worked example: φ(t) = t − 0.3 from φ(0) = −0.3, φ(1) = 0.7 → t = 0.3 in one step.
 */
export interface Crossing {
  t: number;
  /** A parameter just on the negative side (within tolT). */
  tOut: number;
}

export function refineCrossing(phi: (t: number) => number, phi0: number, phi1: number, tolT: number, tolPhi = 1e-12, maxIter = 60): Crossing {
  // Orient so that f(lo) ≥ 0 > f(hi) in parameter order.
  let a = 0;
  let b = 1;
  let fa = phi0;
  let fb = phi1;
  if (fa === 0) return { t: 0, tOut: Math.min(1, tolT) };
  let side = 0;
  for (let k = 0; k < maxIter && Math.abs(b - a) > tolT; k++) {
    const t = (a * fb - b * fa) / (fb - fa);
    const ft = phi(Number.isFinite(t) ? t : 0.5 * (a + b));
    if (Math.abs(ft) <= tolPhi) return { t, tOut: fa < 0 ? Math.max(a, t - tolT) : Math.min(b, t + tolT) };
    if ((ft >= 0) === (fa >= 0)) {
      a = t;
      fa = ft;
      if (side === -1) fb /= 2;
      side = -1;
    } else {
      b = t;
      fb = ft;
      if (side === 1) fa /= 2;
      side = 1;
    }
  }
  const t = (a * fb - b * fa) / (fb - fa);
  const tc = Number.isFinite(t) ? Math.min(Math.max(t, Math.min(a, b)), Math.max(a, b)) : 0.5 * (a + b);
  return { t: tc, tOut: fa < 0 ? a : b };
}

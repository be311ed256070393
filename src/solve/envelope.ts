/**
 * Lower envelope of planes over a convex cell, exactly: the predominance pieces.
 *
 * Algorithm: for each candidate i, start from the cell polygon and clip it by the half-planes
 * ψ_i − ψ_j ≤ 0 for every competitor j (clip.ts). What is left is the convex set where i has the
 * lowest ψ. Ties between identical planes go to the lower index, so pieces never overlap.
 * Cost O(N²) clips per cell, each O(vertices); N is tens of species.
 */
import { type ConvexPoly, clipHalfPlane } from './clip.js';
import { type Plane, subPlane } from './plane.js';

export interface Piece {
  /** Index of the winning plane. */
  owner: number;
  poly: ConvexPoly;
}

/** Planes closer than this (J/mol over the cell) count as equal. */
export const PSI_EPS = 1e-6;

export function lowerEnvelope(cell: ConvexPoly, planes: Plane[]): Piece[] {
  const pieces: Piece[] = [];
  // Step 1: scale of the cell, to tell a flat difference plane from a tilted one.
  let span = 0;
  for (const [x, y] of cell.pts) span = Math.max(span, Math.abs(x), Math.abs(y));
  span = Math.max(span, 1);
  for (let i = 0; i < planes.length; i++) {
    let poly: ConvexPoly | null = cell;
    for (let j = 0; j < planes.length && poly; j++) {
      if (j === i) continue;
      const d = subPlane(planes[i], planes[j]);
      // Step 2: a flat difference is a constant: i always above j, always below, or tied.
      if ((Math.abs(d.p) + Math.abs(d.e)) * span <= PSI_EPS) {
        if (d.g > PSI_EPS || (Math.abs(d.g) <= PSI_EPS && j < i)) poly = null;
        continue;
      }
      // Step 3: keep where ψ_i ≤ ψ_j; ties on the line are harmless (zero area).
      poly = clipHalfPlane(poly, d, j, PSI_EPS);
    }
    if (poly) pieces.push({ owner: i, poly });
  }
  return pieces;
}

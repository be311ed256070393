/**
 * Exact clipping of a convex polygon by a half-plane (Sutherland–Hodgman, one edge).
 *
 * A polygon is a list of vertices [pH, E] in counter-clockwise order with, for each edge
 * (vertex k → k+1), a tag naming what made that edge (a competing species, a ligand cell edge,
 * or the domain). The half-plane kept is { d(pH, E) ≤ 0 } for a plane d. New vertices are the
 * exact intersection of the polygon edge with the line d = 0 (two-line intersection, no grid),
 * so triple points come out as exact three-plane intersections.
 */
import { type Plane, planeAt } from './plane.js';

export type Pt = [number, number];

export interface ConvexPoly {
  pts: Pt[];
  /** tags[k] labels edge pts[k] → pts[k+1]. */
  tags: number[];
}

/** Tag values below zero are reserved: domain edges. */
export const DOMAIN_TAG = -1;

/**
 * Keep the part of `poly` where d ≤ 0; the new edge along d = 0 gets `tag`.
 * `eps` (same units as d) treats near-zero values as on the line.
 * Returns null when nothing (or only a degenerate sliver) is left.
 */
export function clipHalfPlane(poly: ConvexPoly, d: Plane, tag: number, eps: number): ConvexPoly | null {
  const n = poly.pts.length;
  const vals = new Array<number>(n);
  let anyOut = false;
  let anyIn = false;
  for (let k = 0; k < n; k++) {
    const v = planeAt(d, poly.pts[k][0], poly.pts[k][1]);
    vals[k] = Math.abs(v) <= eps ? 0 : v;
    if (vals[k] > 0) anyOut = true;
    else if (vals[k] < 0) anyIn = true;
  }
  if (!anyOut) return poly;
  if (!anyIn) return null;
  const pts: Pt[] = [];
  const tags: number[] = [];
  for (let k = 0; k < n; k++) {
    const a = poly.pts[k];
    const b = poly.pts[(k + 1) % n];
    const va = vals[k];
    const vb = vals[(k + 1) % n];
    if (va <= 0) {
      // Step 1: an inside (or on-line) vertex is kept.
      pts.push(a);
      if (vb > 0) {
        if (va < 0) {
          // Step 2: in → out; the exact crossing ends the old edge, the next edge runs along d = 0.
          tags.push(poly.tags[k]);
          pts.push(crossing(a, b, va, vb));
        }
        tags.push(tag);
      } else {
        tags.push(poly.tags[k]);
      }
    } else if (vb < 0) {
      // Step 3: out → in; the crossing starts the remainder of the old edge.
      pts.push(crossing(a, b, va, vb));
      tags.push(poly.tags[k]);
    }
  }
  const out = dedupe({ pts, tags });
  return out.pts.length >= 3 && Math.abs(signedArea(out.pts)) > 1e-14 ? out : null;
}

/** Exact intersection of segment a→b with the line where the linear function is zero. */
function crossing(a: Pt, b: Pt, va: number, vb: number): Pt {
  const t = va / (va - vb);
  return [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
}

/** Drop consecutive duplicate vertices (keeps the tag of the surviving edge). */
function dedupe(poly: ConvexPoly): ConvexPoly {
  const pts: Pt[] = [];
  const tags: number[] = [];
  const n = poly.pts.length;
  for (let k = 0; k < n; k++) {
    const a = poly.pts[k];
    const b = poly.pts[(k + 1) % n];
    if (Math.abs(a[0] - b[0]) < 1e-13 && Math.abs(a[1] - b[1]) < 1e-13) continue;
    pts.push(a);
    tags.push(poly.tags[k]);
  }
  return { pts, tags };
}

/** Shoelace area, positive for counter-clockwise rings. */
export function signedArea(pts: Pt[]): number {
  let s = 0;
  for (let k = 0, n = pts.length; k < n; k++) {
    const a = pts[k];
    const b = pts[(k + 1) % n];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s / 2;
}

export function rectangle(pH: [number, number], E: [number, number]): ConvexPoly {
  return {
    pts: [
      [pH[0], E[0]],
      [pH[1], E[0]],
      [pH[1], E[1]],
      [pH[0], E[1]],
    ],
    tags: [DOMAIN_TAG, DOMAIN_TAG, DOMAIN_TAG, DOMAIN_TAG],
  };
}

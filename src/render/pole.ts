/**
 * Where a label of a given shape fits best inside a region: the pole of inaccessibility for a
 * rectangle (largest scaled clearance), by best-first cell subdivision. Pure, deterministic.
 */
import { chebyshevToSegment, type Segment } from './geometry.js';
import type { Point } from './scene-types.js';

interface Cell {
  x: number;
  y: number;
  h: number;
  d: number;
  /** Objective: d with the plateau tie-break. */
  score: number;
  max: number;
  seq: number;
}

/** Largest tie-break penalty (scaled units) across a region's box; below the default precision. */
const CENTRE_BIAS = 0.008;
/** Largest centring penalty across a region's box when the clearance is capped. */
const CAPPED_BIAS = 0.15;

/** Area centroid of rings (holes clockwise count negative), in coordinates scaled by 1/hx, 1/hy; null when degenerate. */
function areaCentroid(rings: readonly (readonly Point[])[], hx: number, hy: number): [number, number] | null {
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const xi = ring[i]![0] / hx;
      const yi = ring[i]![1] / hy;
      const xj = ring[j]![0] / hx;
      const yj = ring[j]![1] / hy;
      const f = xj * yi - xi * yj;
      a += f;
      cx += (xj + xi) * f;
      cy += (yj + yi) * f;
    }
  }
  if (Math.abs(a) < 1e-12) return null;
  return [cx / (3 * a), cy / (3 * a)];
}

/** Binary max-heap on `max`, ties broken by insertion order (deterministic). */
class Heap {
  private a: Cell[] = [];
  get size(): number {
    return this.a.length;
  }
  private before(x: Cell, y: Cell): boolean {
    return x.max > y.max || (x.max === y.max && x.seq < y.seq);
  }
  push(c: Cell): void {
    const a = this.a;
    let i = a.length;
    a.push(c);
    while (i > 0) {
      const p = (i - 1) >> 1;
      const parent = a[p]!;
      if (!this.before(c, parent)) break;
      a[i] = parent;
      i = p;
    }
    a[i] = c;
  }
  pop(): Cell {
    const a = this.a;
    const top = a[0]!;
    const last = a.pop()!;
    const n = a.length;
    if (n > 0) {
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= n) break;
        const r = l + 1;
        const m = r < n && this.before(a[r]!, a[l]!) ? r : l;
        if (!this.before(a[m]!, last)) break;
        a[i] = a[m]!;
        i = m;
      }
      a[i] = last;
    }
    return top;
  }
}

export interface PoleOptions {
  /** Search tolerance in scaled units (default 0.01). */
  precision?: number;
  /**
   * Clearance (scale, > 1) beyond which more does not count: the search then returns the most
   * central place (nearest the area centroid) among those with at least this clearance, if any.
   * Between scale 1 and the cap, clearance and centrality are traded smoothly.
   */
  cap?: number;
  /**
   * Feasibility only: stop as soon as a centre with scale ≥ `need` is found, and skip cells
   * that cannot exceed it by more than the precision (the same tolerance as the full search). The
   * returned point is then *a* fitting centre, not the best one.
   */
  need?: number;
}

/**
 * Pole of inaccessibility of a region for a rectangle of half-sizes (hx, hy): the point that
 * maximises the L∞ distance (x scaled by 1/hx, y by 1/hy) to the region's edges and to extra
 * obstacle segments — i.e. the centre at which the largest copy of the rectangle fits. Returns the
 * point and that distance `scale` (≥ 1 means the full-size rectangle fits; ≤ 0 means outside).
 * Quadtree branch-and-bound after Agafonkin's polylabel (Mapbox, 2016), with the L∞ metric;
 * `precision` (or `opts.precision`) is in scaled units. Segments are kept in one flat array in
 * scaled coordinates with their bounding boxes, so that a distance query skips every segment
 * whose box is already farther than the nearest one found (exact: the L∞ distance to a segment is
 * at least the distance to its box).
 */
export function rectPole(
  rings: readonly (readonly Point[])[],
  obstacles: readonly Segment[],
  hx: number,
  hy: number,
  precisionOrOpts: number | PoleOptions = 0.01,
): { point: Point; scale: number } {
  const opts: PoleOptions = typeof precisionOrOpts === 'number' ? { precision: precisionOrOpts } : precisionOrOpts;
  const precision = opts.precision ?? 0.01;
  const need = opts.need;
  // (1) Bounding box; (2) segments in scaled coordinates; (3) the signed L∞ distance.
  const { minX, minY, maxX, maxY } = ringsBounds(rings);
  if (!(maxX > minX && maxY > minY)) return { point: [minX, minY], scale: 0 };
  const dist = signedDistance(scaledSegments(rings, obstacles, hx, hy), rings.reduce((n, ring) => n + ring.length, 0));
  const x0 = minX / hx;
  const y0 = minY / hy;
  const w = maxX / hx - x0;
  const hgt = maxY / hy - y0;
  // Preference for the middle: a penalty for the L∞ distance from the area centroid, at most
  // CENTRE_BIAS over the box (a mere tie-break on plateaus), or CAPPED_BIAS when the clearance is
  // capped (then the most central place with that clearance wins).
  const [mx, my] = areaCentroid(rings, hx, hy) ?? [x0 + w / 2, y0 + hgt / 2];
  const cap = opts.cap ?? Infinity;
  const bias = need !== undefined ? 0 : (opts.cap === undefined ? CENTRE_BIAS : CAPPED_BIAS) / Math.max(w, hgt);
  let seq = 0;
  let reached: Cell | null = null;
  const cell = (x: number, y: number, h: number): Cell => {
    const d = dist(x, y);
    const ox = Math.abs(x - mx);
    const oy = Math.abs(y - my);
    // In L∞ the distance changes at most by h (the cell's half-size) inside the cell.
    const off = ox > oy ? ox : oy;
    // With a cap, the centring weight grows from 0 at scale 1 (a label that barely fits keeps all
    // its clearance) to full at the cap, so the score is continuous.
    const weight = (t: number): number => (cap === Infinity ? 1 : Math.min(1, Math.max(0, (t - 1) / (cap - 1))));
    // Upper bound of the score inside the cell: d grows by at most h and the offset shrinks by at
    // most h; the score increases with d (slope ≥ 1 − CAPPED_BIAS/(cap − 1) > 0), so the bound is
    // the score at d + h with the smallest offset.
    const hi = Math.min(d + h, cap) - bias * weight(d + h) * Math.max(0, off - h);
    const c: Cell = { x, y, h, d, score: Math.min(d, cap) - bias * weight(d) * off, max: hi, seq: seq++ };
    if (need !== undefined && d >= need && !reached) reached = c;
    return c;
  };
  const size = Math.min(w, hgt);
  const heap = new Heap();
  const h0 = size / 2;
  // Start from the centroid of the vertices and the bbox centre, whichever is better.
  let best = cell(mx, my, 0);
  let cx = 0;
  let cy = 0;
  let n = 0;
  for (const ring of rings)
    for (const [x, y] of ring) {
      cx += x / hx;
      cy += y / hy;
      n++;
    }
  const centroid = cell(cx / n, cy / n, 0);
  if (centroid.score > best.score) best = centroid;
  if (!reached) {
    for (let x = x0; x < x0 + w; x += size) for (let y = y0; y < y0 + hgt; y += size) heap.push(cell(x + h0, y + h0, h0));
  }
  let guard = 0;
  while (heap.size > 0 && guard++ < 200000 && !reached) {
    const c = heap.pop();
    if (c.score > best.score) best = c;
    if (c.max - best.score <= precision) continue;
    // The heap is ordered by bound: nothing left can reach `need` by more than the tolerance.
    if (need !== undefined && c.max < need + precision) break;
    const h = c.h / 2;
    heap.push(cell(c.x - h, c.y - h, h));
    heap.push(cell(c.x + h, c.y - h, h));
    heap.push(cell(c.x - h, c.y + h, h));
    heap.push(cell(c.x + h, c.y + h, h));
  }
  if (reached) {
    // Feasibility answer: the first centre found that reaches `need`.
    const r: Cell = reached;
    return { point: [r.x * hx, r.y * hy], scale: r.d };
  }
  return { point: [best.x * hx, best.y * hy], scale: best.d };
}

/** Bounding box of the rings' vertices. */
function ringsBounds(rings: readonly (readonly Point[])[]): { minX: number; minY: number; maxX: number; maxY: number } {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const ring of rings) {
    for (const [x, y] of ring) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  }
  return { minX, minY, maxX, maxY };
}

/**
 * Ring edges then obstacles in scaled coordinates (x/hx, y/hy), so the metric is plain L∞: per
 * segment ax, ay, bx, by, then its box (min x, min y, max x, max y) — 8 numbers.
 */
function scaledSegments(rings: readonly (readonly Point[])[], obstacles: readonly Segment[], hx: number, hy: number): Float64Array {
  let nSeg = obstacles.length;
  for (const ring of rings) nSeg += ring.length;
  const S = new Float64Array(nSeg * 8);
  let k = 0;
  const add = (a: Point, b: Point): void => {
    const ax = a[0] / hx;
    const ay = a[1] / hy;
    const bx = b[0] / hx;
    const by = b[1] / hy;
    S[k] = ax;
    S[k + 1] = ay;
    S[k + 2] = bx;
    S[k + 3] = by;
    S[k + 4] = Math.min(ax, bx);
    S[k + 5] = Math.min(ay, by);
    S[k + 6] = Math.max(ax, bx);
    S[k + 7] = Math.max(ay, by);
    k += 8;
  };
  for (const ring of rings) for (let i = 0; i < ring.length; i++) add(ring[i]!, ring[(i + 1) % ring.length]!);
  for (const [a, b] of obstacles) add(a, b);
  return S;
}

/**
 * Signed L∞ distance (scaled units) from a point to the nearest segment of S: positive inside the
 * rings (even–odd over the first `nEdge` entries, the ring edges), negative outside. A segment whose
 * box is already farther than the nearest one found is skipped (exact: the L∞ distance to a segment
 * is at least the distance to its box).
 */
function signedDistance(S: Float64Array, nEdge: number): (x: number, y: number) => number {
  const k = S.length;
  const inside = (x: number, y: number): boolean => {
    let c = false;
    for (let i = 0; i < nEdge * 8; i += 8) {
      const yi = S[i + 1]!;
      const yj = S[i + 3]!;
      if (yi > y !== yj > y) {
        const xi = S[i]!;
        if (x < ((S[i + 2]! - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
      }
    }
    return c;
  };
  return (x, y) => {
    let d = Infinity;
    for (let i = 0; i < k; i += 8) {
      // Lower bound: L∞ distance to the segment's box.
      const ox = x < S[i + 4]! ? S[i + 4]! - x : x > S[i + 6]! ? x - S[i + 6]! : 0;
      const oy = y < S[i + 5]! ? S[i + 5]! - y : y > S[i + 7]! ? y - S[i + 7]! : 0;
      if ((ox > oy ? ox : oy) >= d) continue;
      const v = chebyshevToSegment(S[i]! - x, S[i + 1]! - y, S[i + 2]! - x, S[i + 3]! - y);
      if (v < d) d = v;
    }
    return inside(x, y) ? d : -d;
  };
}

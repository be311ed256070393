/**
 * Plane geometry for label layout, in figure coordinates (pt). Pure functions, deterministic.
 */
import type { Point, Rect } from './scene-types.js';

export type Segment = [Point, Point];

/** Even–odd point-in-polygon test over all rings (outer rings and holes alike). */
export function insideRings(p: Point, rings: readonly (readonly Point[])[]): boolean {
  let inside = false;
  const [x, y] = p;
  for (const ring of rings) {
    const n = ring.length;
    for (let i = 0, j = n - 1; i < n; j = i++) {
      const [xi, yi] = ring[i]!;
      const [xj, yj] = ring[j]!;
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

/** Edges of closed rings as segments. */
export function ringSegments(rings: readonly (readonly Point[])[]): Segment[] {
  const out: Segment[] = [];
  for (const ring of rings) {
    for (let i = 0; i < ring.length; i++) out.push([ring[i]!, ring[(i + 1) % ring.length]!]);
  }
  return out;
}

/** Segments of an open polyline. */
export function polylineSegments(points: readonly Point[]): Segment[] {
  const out: Segment[] = [];
  for (let i = 0; i + 1 < points.length; i++) out.push([points[i]!, points[i + 1]!]);
  return out;
}

/** Signed area (shoelace) of a ring; positive when counter-clockwise in a y-up frame. */
export function ringArea(ring: readonly Point[]): number {
  let a = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) a += ring[j]![0] * ring[i]![1] - ring[i]![0] * ring[j]![1];
  return a / 2;
}

/**
 * L∞ distance from point (px, py) to segment ab after scaling x by 1/hx and y by 1/hy:
 * min over t ∈ [0,1] of max(|px − x(t)|/hx, |py − y(t)|/hy). A rectangle of half-sizes
 * (s·hx, s·hy) centred at p touches the segment exactly when s equals this value.
 * The function of t is convex and piecewise linear, so its minimum is at an end or a breakpoint.
 */
export function scaledChebyshev(px: number, py: number, a: Point, b: Point, hx: number, hy: number): number {
  return chebyshevToSegment((a[0] - px) / hx, (a[1] - py) / hy, (b[0] - px) / hx, (b[1] - py) / hy);
}

/**
 * Plain L∞ distance from the origin to the segment (ax, ay)–(bx, by). No allocation (hot path of
 * the pole search): the candidates are the ends and the breakpoints t where x(t) = 0, y(t) = 0 or
 * |x(t)| = |y(t)|.
 */
function chebyshevToSegment(ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  let best = Math.max(Math.abs(ax), Math.abs(ay));
  const e = Math.max(Math.abs(bx), Math.abs(by));
  if (e < best) best = e;
  let t: number;
  let v: number;
  if (dx !== 0) {
    t = -ax / dx;
    if (t > 0 && t < 1) {
      v = Math.abs(ay + dy * t);
      if (v < best) best = v;
    }
  }
  if (dy !== 0) {
    t = -ay / dy;
    if (t > 0 && t < 1) {
      v = Math.abs(ax + dx * t);
      if (v < best) best = v;
    }
  }
  if (dx !== dy) {
    t = (ay - ax) / (dx - dy);
    if (t > 0 && t < 1) {
      v = Math.abs(ax + dx * t);
      if (v < best) best = v;
    }
  }
  if (dx !== -dy) {
    t = -(ax + ay) / (dx + dy);
    if (t > 0 && t < 1) {
      v = Math.abs(ax + dx * t);
      if (v < best) best = v;
    }
  }
  return best;
}

/** Euclidean distance from a point to a segment. */
export function segmentDistance(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  let t = l2 === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / l2;
  t = Math.max(0, Math.min(1, t));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

function orient(a: Point, b: Point, c: Point): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
}

/** Whether two closed segments intersect (touching counts). */
export function segmentsIntersect(p: Point, q: Point, r: Point, s: Point): boolean {
  const d1 = orient(r, s, p);
  const d2 = orient(r, s, q);
  const d3 = orient(p, q, r);
  const d4 = orient(p, q, s);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  const on = (a: Point, b: Point, c: Point): boolean =>
    Math.min(a[0], b[0]) <= c[0] && c[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= c[1] && c[1] <= Math.max(a[1], b[1]);
  if (d1 === 0 && on(r, s, p)) return true;
  if (d2 === 0 && on(r, s, q)) return true;
  if (d3 === 0 && on(p, q, r)) return true;
  if (d4 === 0 && on(p, q, s)) return true;
  return false;
}

/**
 * Whether a segment meets an axis-aligned rectangle (inside, crossing or touching an edge).
 * Liang–Barsky parametric clipping, allocation-free (hot path of label layout).
 */
export function segmentHitsRect(a: Point, b: Point, r: Rect): boolean {
  const x0 = r.x;
  const y0 = r.y;
  const x1 = r.x + r.w;
  const y1 = r.y + r.h;
  const ax = a[0];
  const ay = a[1];
  const bx = b[0];
  const by = b[1];
  if ((ax < x0 && bx < x0) || (ax > x1 && bx > x1) || (ay < y0 && by < y0) || (ay > y1 && by > y1)) return false;
  // Liang–Barsky: narrow the parameter interval [0, 1] by the x slab, then the y slab.
  const tx = slab(ax, bx - ax, x0, x1, 0, 1);
  if (!tx) return false;
  return slab(ay, by - ay, y0, y1, tx[0], tx[1]) !== null;
}

/** The part [t0, t1] of a + t·d (t in the given interval) inside [lo, hi], or null if none. */
function slab(a: number, d: number, lo: number, hi: number, t0: number, t1: number): [number, number] | null {
  if (d === 0) return a < lo || a > hi ? null : [t0, t1];
  let ta = (lo - a) / d;
  let tb = (hi - a) / d;
  if (ta > tb) [ta, tb] = [tb, ta];
  if (ta > t0) t0 = ta;
  if (tb < t1) t1 = tb;
  return t0 > t1 ? null : [t0, t1];
}

/** Whether two rectangles overlap (with `gap` of clearance required). */
export function rectsOverlap(a: Rect, b: Rect, gap = 0): boolean {
  return a.x < b.x + b.w + gap && b.x < a.x + a.w + gap && a.y < b.y + b.h + gap && b.y < a.y + a.h + gap;
}

/** Rectangle grown by d on every side. */
export function inflate(r: Rect, d: number): Rect {
  return { x: r.x - d, y: r.y - d, w: r.w + 2 * d, h: r.h + 2 * d };
}

/** Whether rectangle `inner` lies inside `outer`. */
export function rectInside(inner: Rect, outer: Rect): boolean {
  return inner.x >= outer.x && inner.y >= outer.y && inner.x + inner.w <= outer.x + outer.w && inner.y + inner.h <= outer.y + outer.h;
}

/** Nearest point of a rectangle's boundary/interior to p. */
export function nearestOnRect(p: Point, r: Rect): Point {
  return [Math.max(r.x, Math.min(r.x + r.w, p[0])), Math.max(r.y, Math.min(r.y + r.h, p[1]))];
}

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
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  let nSeg = obstacles.length;
  for (const ring of rings) {
    nSeg += ring.length;
    for (const [x, y] of ring) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  }
  if (!(maxX > minX && maxY > minY)) return { point: [minX, minY], scale: 0 };
  // Work in scaled coordinates so the metric is plain L∞. Per segment: ax, ay, bx, by, then box.
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
  // Ring edges (scaled) for the even–odd inside test: the first entries of S.
  const nEdge = nSeg - obstacles.length;
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
  const dist = (x: number, y: number): number => {
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

/** Clips a polygon ring to an axis-aligned rectangle (Sutherland–Hodgman). */
export function clipRing(ring: readonly Point[], r: Rect): Point[] {
  const x1 = r.x + r.w;
  const y1 = r.y + r.h;
  type Edge = { inside: (p: Point) => boolean; cut: (a: Point, b: Point) => Point };
  const edges: Edge[] = [
    { inside: (p) => p[0] >= r.x, cut: (a, b) => [r.x, a[1] + ((b[1] - a[1]) * (r.x - a[0])) / (b[0] - a[0])] },
    { inside: (p) => p[0] <= x1, cut: (a, b) => [x1, a[1] + ((b[1] - a[1]) * (x1 - a[0])) / (b[0] - a[0])] },
    { inside: (p) => p[1] >= r.y, cut: (a, b) => [a[0] + ((b[0] - a[0]) * (r.y - a[1])) / (b[1] - a[1]), r.y] },
    { inside: (p) => p[1] <= y1, cut: (a, b) => [a[0] + ((b[0] - a[0]) * (y1 - a[1])) / (b[1] - a[1]), y1] },
  ];
  let out: Point[] = [...ring];
  for (const e of edges) {
    const input = out;
    out = [];
    for (let i = 0; i < input.length; i++) {
      const cur = input[i]!;
      const prev = input[(i + input.length - 1) % input.length]!;
      const ci = e.inside(cur);
      const pi = e.inside(prev);
      if (ci) {
        if (!pi) out.push(e.cut(prev, cur));
        out.push(cur);
      } else if (pi) {
        out.push(e.cut(prev, cur));
      }
    }
    if (out.length === 0) break;
  }
  return out;
}

/**
 * Clips a polyline to a rectangle (Liang–Barsky per segment), returning the visible pieces.
 */
export function clipPolyline(points: readonly Point[], r: Rect): Point[][] {
  const pieces: Point[][] = [];
  let cur: Point[] = [];
  const x1 = r.x + r.w;
  const y1 = r.y + r.h;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    let t0 = 0;
    let t1 = 1;
    let ok = true;
    const test = (p: number, q: number): void => {
      if (!ok) return;
      if (p === 0) {
        if (q < 0) ok = false;
        return;
      }
      const t = q / p;
      if (p < 0) {
        if (t > t1) ok = false;
        else if (t > t0) t0 = t;
      } else {
        if (t < t0) ok = false;
        else if (t < t1) t1 = t;
      }
    };
    test(-dx, a[0] - r.x);
    test(dx, x1 - a[0]);
    test(-dy, a[1] - r.y);
    test(dy, y1 - a[1]);
    if (!ok) {
      if (cur.length > 1) pieces.push(cur);
      cur = [];
      continue;
    }
    const p0: Point = [a[0] + t0 * dx, a[1] + t0 * dy];
    const p1: Point = [a[0] + t1 * dx, a[1] + t1 * dy];
    if (cur.length === 0) cur.push(p0);
    else {
      const last = cur[cur.length - 1]!;
      if (Math.abs(last[0] - p0[0]) > 1e-9 || Math.abs(last[1] - p0[1]) > 1e-9) {
        if (cur.length > 1) pieces.push(cur);
        cur = [p0];
      }
    }
    cur.push(p1);
    if (t1 < 1) {
      if (cur.length > 1) pieces.push(cur);
      cur = [];
    }
  }
  if (cur.length > 1) pieces.push(cur);
  return pieces;
}

/** Length of a polyline. */
export function polylineLength(points: readonly Point[]): number {
  let l = 0;
  for (let i = 0; i + 1 < points.length; i++) l += Math.hypot(points[i + 1]![0] - points[i]![0], points[i + 1]![1] - points[i]![1]);
  return l;
}

/** Point and unit direction at fraction f (0…1) of a polyline's length. */
export function pointAlong(points: readonly Point[], f: number): { p: Point; dir: Point } {
  const total = polylineLength(points);
  let target = total * f;
  for (let i = 0; i + 1 < points.length; i++) {
    const a = points[i]!;
    const b = points[i + 1]!;
    const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (l === 0) continue;
    if (target <= l || i + 2 === points.length) {
      const t = Math.min(1, target / l);
      return { p: [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])], dir: [(b[0] - a[0]) / l, (b[1] - a[1]) / l] };
    }
    target -= l;
  }
  const p = points[0]!;
  return { p, dir: [1, 0] };
}

/**
 * Drops vertices that lie within `tol` of the line through their neighbours (collinear runs from
 * a solver's sampling), so layout works on few long edges. Closed rings keep at least 3 vertices.
 */
export function simplifyCollinear(points: readonly Point[], closed: boolean, tol = 0.01): Point[] {
  if (points.length <= (closed ? 3 : 2)) return [...points];
  const out: Point[] = [];
  const n = points.length;
  for (let i = 0; i < n; i++) {
    const cur = points[i]!;
    if (!closed && (i === 0 || i === n - 1)) {
      out.push(cur);
      continue;
    }
    const prev = out.length ? out[out.length - 1]! : points[(i + n - 1) % n]!;
    const next = points[(i + 1) % n]!;
    const dx = next[0] - prev[0];
    const dy = next[1] - prev[1];
    const len = Math.hypot(dx, dy);
    const off = len === 0 ? Math.hypot(cur[0] - prev[0], cur[1] - prev[1]) : Math.abs((cur[0] - prev[0]) * dy - (cur[1] - prev[1]) * dx) / len;
    const between = len === 0 || ((cur[0] - prev[0]) * dx + (cur[1] - prev[1]) * dy >= 0 && (next[0] - cur[0]) * dx + (next[1] - cur[1]) * dy >= 0);
    if (off > tol || !between) out.push(cur);
  }
  return closed && out.length < 3 ? [...points] : out;
}

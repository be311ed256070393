/**
 * Plane geometry for label layout, in figure coordinates (pt): rings, segments, distances,
 * rectangles and polylines. Pure functions, deterministic. Clipping is in clip.ts, the label pole
 * search in pole.ts.
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
export function chebyshevToSegment(ax: number, ay: number, bx: number, by: number): number {
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

/** The four corners of a rectangle, clockwise on the page from the top left (a closed ring). */
export function rectRing(r: Rect): Point[] {
  return [
    [r.x, r.y],
    [r.x + r.w, r.y],
    [r.x + r.w, r.y + r.h],
    [r.x, r.y + r.h],
  ];
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

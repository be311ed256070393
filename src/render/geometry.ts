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
  const a1 = (a[0] - px) / hx;
  const b1 = (b[0] - a[0]) / hx;
  const a2 = (a[1] - py) / hy;
  const b2 = (b[1] - a[1]) / hy;
  const f = (t: number): number => Math.max(Math.abs(a1 + b1 * t), Math.abs(a2 + b2 * t));
  let best = Math.min(f(0), f(1));
  const cand = (t: number): void => {
    if (t > 0 && t < 1) best = Math.min(best, f(t));
  };
  if (b1 !== 0) cand(-a1 / b1);
  if (b2 !== 0) cand(-a2 / b2);
  if (b1 - b2 !== 0) cand((a2 - a1) / (b1 - b2));
  if (b1 + b2 !== 0) cand(-(a1 + a2) / (b1 + b2));
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

/** Whether a segment meets an axis-aligned rectangle (inside or crossing an edge). */
export function segmentHitsRect(a: Point, b: Point, r: Rect): boolean {
  const x1 = r.x + r.w;
  const y1 = r.y + r.h;
  if (Math.max(a[0], b[0]) < r.x || Math.min(a[0], b[0]) > x1 || Math.max(a[1], b[1]) < r.y || Math.min(a[1], b[1]) > y1) return false;
  const inR = (p: Point): boolean => p[0] >= r.x && p[0] <= x1 && p[1] >= r.y && p[1] <= y1;
  if (inR(a) || inR(b)) return true;
  const c: Point[] = [
    [r.x, r.y],
    [x1, r.y],
    [x1, y1],
    [r.x, y1],
  ];
  for (let i = 0; i < 4; i++) if (segmentsIntersect(a, b, c[i]!, c[(i + 1) % 4]!)) return true;
  return false;
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
  max: number;
  seq: number;
}

/** Binary max-heap on `max`, ties broken by insertion order (deterministic). */
class Heap {
  private a: Cell[] = [];
  get size(): number {
    return this.a.length;
  }
  private less(i: number, j: number): boolean {
    const x = this.a[i]!;
    const y = this.a[j]!;
    return x.max < y.max || (x.max === y.max && x.seq > y.seq);
  }
  push(c: Cell): void {
    const a = this.a;
    a.push(c);
    let i = a.length - 1;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(p, i)) break;
      [a[p], a[i]] = [a[i]!, a[p]!];
      i = p;
    }
  }
  pop(): Cell {
    const a = this.a;
    const top = a[0]!;
    const last = a.pop()!;
    if (a.length > 0) {
      a[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        const r = l + 1;
        let m = i;
        if (l < a.length && this.less(m, l)) m = l;
        if (r < a.length && this.less(m, r)) m = r;
        if (m === i) break;
        [a[m], a[i]] = [a[i]!, a[m]!];
        i = m;
      }
    }
    return top;
  }
}

/**
 * Pole of inaccessibility of a region for a rectangle of half-sizes (hx, hy): the point that
 * maximises the L∞ distance (x scaled by 1/hx, y by 1/hy) to the region's edges and to extra
 * obstacle segments — i.e. the centre at which the largest copy of the rectangle fits. Returns the
 * point and that distance `scale` (≥ 1 means the full-size rectangle fits; ≤ 0 means outside).
 * Quadtree branch-and-bound after Agafonkin's polylabel (Mapbox, 2016), with the L∞ metric;
 * `precision` is in scaled units.
 */
export function rectPole(
  rings: readonly (readonly Point[])[],
  obstacles: readonly Segment[],
  hx: number,
  hy: number,
  precision = 0.01,
): { point: Point; scale: number } {
  const edges = ringSegments(rings);
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const ring of rings)
    for (const [x, y] of ring) {
      minX = Math.min(minX, x);
      minY = Math.min(minY, y);
      maxX = Math.max(maxX, x);
      maxY = Math.max(maxY, y);
    }
  if (!(maxX > minX && maxY > minY)) return { point: [minX, minY], scale: 0 };
  // Work in scaled coordinates so the metric is plain L∞.
  const sx = (x: number): number => x / hx;
  const sy = (y: number): number => y / hy;
  const dist = (x: number, y: number): number => {
    const px = x * hx;
    const py = y * hy;
    let d = Infinity;
    for (const [a, b] of edges) d = Math.min(d, scaledChebyshev(px, py, a, b, hx, hy));
    for (const [a, b] of obstacles) d = Math.min(d, scaledChebyshev(px, py, a, b, hx, hy));
    return insideRings([px, py], rings) ? d : -d;
  };
  let seq = 0;
  const cell = (x: number, y: number, h: number): Cell => {
    const d = dist(x, y);
    return { x, y, h, d, max: d + h, seq: seq++ };
  };
  const x0 = sx(minX);
  const y0 = sy(minY);
  const w = sx(maxX) - x0;
  const hgt = sy(maxY) - y0;
  const size = Math.min(w, hgt);
  const heap = new Heap();
  const h0 = size / 2;
  for (let x = x0; x < x0 + w; x += size) for (let y = y0; y < y0 + hgt; y += size) heap.push(cell(x + h0, y + h0, h0));
  // Start from the centroid of the vertices and the bbox centre, whichever is better.
  let best = cell(x0 + w / 2, y0 + hgt / 2, 0);
  let cx = 0;
  let cy = 0;
  let n = 0;
  for (const ring of rings)
    for (const [x, y] of ring) {
      cx += sx(x);
      cy += sy(y);
      n++;
    }
  const centroid = cell(cx / n, cy / n, 0);
  if (centroid.d > best.d) best = centroid;
  let guard = 0;
  while (heap.size > 0 && guard++ < 200000) {
    const c = heap.pop();
    if (c.d > best.d) best = c;
    if (c.max - best.d <= precision) continue;
    const h = c.h / 2;
    heap.push(cell(c.x - h, c.y - h, h));
    heap.push(cell(c.x + h, c.y - h, h));
    heap.push(cell(c.x - h, c.y + h, h));
    heap.push(cell(c.x + h, c.y + h, h));
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

/**
 * Clipping of rings and polylines to an axis-aligned rectangle (the plot). Pure, deterministic.
 */
import type { Point, Rect } from './scene-types.js';

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

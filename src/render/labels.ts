/**
 * Label layout in figure space (pt): text boxes, a registry of placed boxes and lines, region
 * labels at the rectangle pole of inaccessibility (shrunk within limits, else moved out with a
 * leader line), and first-fit placement for the smaller labels. Deterministic: candidates are
 * tried in a fixed order and ties go to the first.
 */
import {
  inflate,
  insideRings,
  nearestOnRect,
  rectInside,
  rectPole,
  rectsOverlap,
  segmentHitsRect,
  type Segment,
} from './geometry.js';
import { FONT_SAFETY, runsExtent, runsWidth } from './metrics.js';
import type { Point, Rect, TextRun } from './scene-types.js';

/** Box around the ink of unrotated text at (x, baseline y), widened by FONT_SAFETY. */
export function textBox(runs: readonly TextRun[], size: number, x: number, y: number, anchor: 'start' | 'middle' | 'end'): Rect {
  const w0 = runsWidth(runs, size);
  const w = w0 * FONT_SAFETY;
  const { top, bottom } = runsExtent(runs, size);
  const left = anchor === 'start' ? x : anchor === 'middle' ? x - w / 2 : x - w;
  return { x: left, y: y + top, w, h: bottom - top };
}

/** Baseline y that centres the ink box of `runs` vertically on `cy`. */
export function baselineForCentre(runs: readonly TextRun[], size: number, cy: number): number {
  const { top, bottom } = runsExtent(runs, size);
  return cy - (top + bottom) / 2;
}

/** An oriented text box: centre, half-sizes, angle (degrees clockwise). */
export interface OrientedBox {
  cx: number;
  cy: number;
  hx: number;
  hy: number;
  angle: number;
}

function corners(o: OrientedBox): Point[] {
  const a = (o.angle * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const pts: Point[] = [];
  for (const [u, v] of [
    [-1, -1],
    [1, -1],
    [1, 1],
    [-1, 1],
  ] as const) {
    const x = u * o.hx;
    const y = v * o.hy;
    pts.push([o.cx + x * c - y * s, o.cy + x * s + y * c]);
  }
  return pts;
}

/** Axis-aligned bounding rectangle of an oriented box. */
export function orientedBounds(o: OrientedBox): Rect {
  const p = corners(o);
  const xs = p.map((q) => q[0]);
  const ys = p.map((q) => q[1]);
  const x = Math.min(...xs);
  const y = Math.min(...ys);
  return { x, y, w: Math.max(...xs) - x, h: Math.max(...ys) - y };
}

/** Whether a segment meets an oriented box (exact: tested in the box's own frame). */
export function segmentHitsOriented(seg: Segment, o: OrientedBox): boolean {
  const a = (-o.angle * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const tr = (p: Point): Point => {
    const x = p[0] - o.cx;
    const y = p[1] - o.cy;
    return [x * c - y * s, x * s + y * c];
  };
  return segmentHitsRect(tr(seg[0]), tr(seg[1]), { x: -o.hx, y: -o.hy, w: 2 * o.hx, h: 2 * o.hy });
}

/** Placed boxes and the lines labels must keep off. */
export class Layout {
  /** Lines no label may cross: region boundaries. */
  readonly hard: Segment[] = [];
  /** Lines labels should avoid: water lines, families, overlays, neutral line, operating paths. */
  readonly soft: Segment[] = [];
  /** Boxes of placed text and marks. */
  readonly boxes: { rect: Rect; role: string }[] = [];

  constructor(
    readonly plot: Rect,
    readonly figure: Rect,
  ) {}

  addBox(rect: Rect, role: string): void {
    this.boxes.push({ rect, role });
  }

  boxFree(r: Rect, gap: number): boolean {
    for (const b of this.boxes) if (rectsOverlap(r, b.rect, gap)) return false;
    return true;
  }

  hits(r: Rect, segs: readonly Segment[]): number {
    let n = 0;
    for (const [a, b] of segs) if (segmentHitsRect(a, b, r)) n++;
    return n;
  }

  /**
   * Whether an oriented box is free: inside the plot, off the placed boxes, off hard lines and
   * (when `soft`) off soft lines and `extra` segments.
   */
  orientedFree(o: OrientedBox, gap: number, soft: boolean, extra: readonly Segment[] = []): boolean {
    const bounds = orientedBounds(o);
    if (!rectInside(bounds, this.plot)) return false;
    if (!this.boxFree(bounds, gap)) return false;
    for (const s of this.hard) if (segmentHitsOriented(s, o)) return false;
    if (soft) for (const s of this.soft) if (segmentHitsOriented(s, o)) return false;
    for (const s of extra) if (segmentHitsOriented(s, o)) return false;
    return true;
  }
}

export interface RegionLabelRequest {
  key: string;
  runs: TextRun[];
  /** Region rings in figure coordinates (clipped to the plot). */
  rings: Point[][];
}

export interface RegionLabelPlacement {
  key: string;
  runs: TextRun[];
  size: number;
  /** Centre of the text ink box. */
  cx: number;
  cy: number;
  box: Rect;
  /** Present when the label sits outside its region: from the region's interior point to the box. */
  leader?: [Point, Point];
}

/**
 * Places region labels. Each label goes to the pole of inaccessibility of its region for a
 * rectangle of the label's shape (the centre where the largest copy fits), keeping off region
 * edges, boundary lines and, if it can, soft lines. If the full size does not fit, the font shrinks
 * down to `minSize`; if even that does not fit, the label goes outside at the nearest free place
 * and a leader line joins it to the region's interior point. Labels never overlap each other.
 * Requests are handled largest region first (as given).
 */
export function placeRegionLabels(
  layout: Layout,
  requests: readonly RegionLabelRequest[],
  size: number,
  minSize: number,
): RegionLabelPlacement[] {
  // Clearance around the ink, in pt, kept at full value even when the font shrinks.
  const padX = 0.3 * size;
  const padY = 0.22 * size;
  const out: (RegionLabelPlacement | null)[] = requests.map(() => null);
  const outside: number[] = [];
  const anchors: Point[] = requests.map(() => [0, 0]);
  requests.forEach((req, i) => {
    // Only lines near the region can limit its label.
    const near = nearSegments(req.rings);
    const hardNear = near(layout.hard);
    const softNear = near(layout.soft);
    const w1 = (runsWidth(req.runs, size) * FONT_SAFETY) / size; // width per pt of font
    const { top, bottom } = runsExtent(req.runs, size);
    const h1 = (bottom - top) / size;
    const half = (f: number): [number, number] => [(w1 * f) / 2 + padX, (h1 * f) / 2 + padY];
    // Best centre for font size f: clear of soft lines if possible, else of hard lines only.
    const fit = (f: number): { point: Point; ok: boolean } => {
      const [hx, hy] = half(f);
      const soft = rectPole(req.rings, [...hardNear, ...softNear], hx, hy);
      if (soft.scale >= 1) return { point: soft.point, ok: true };
      const hard = rectPole(req.rings, hardNear, hx, hy);
      return { point: hard.point, ok: hard.scale >= 1 };
    };
    anchors[i] = rectPole(req.rings, [], 1, 1).point;
    let best: { f: number; point: Point } | null = null;
    const full = fit(size);
    if (full.ok) best = { f: size, point: full.point };
    else {
      const low = fit(minSize);
      if (low.ok) {
        // Largest size in [minSize, size] that fits (bisection, 6 steps ≈ 1.5 % of the range).
        best = { f: minSize, point: low.point };
        let lo = minSize;
        let hi = size;
        for (let k = 0; k < 6; k++) {
          const mid = (lo + hi) / 2;
          const m = fit(mid);
          if (m.ok) {
            lo = mid;
            best = { f: mid, point: m.point };
          } else hi = mid;
        }
      }
    }
    if (best) {
      const fs = Math.round(best.f * 100) / 100;
      const [cx, cy] = best.point;
      const box = centredBox(req.runs, fs, cx, cy);
      out[i] = { key: req.key, runs: req.runs, size: fs, cx, cy, box };
      layout.addBox(box, 'region-label');
    } else {
      outside.push(i);
    }
  });
  for (const i of outside) {
    const req = requests[i]!;
    out[i] = placeOutside(layout, req, anchors[i]!, size);
  }
  return out as RegionLabelPlacement[];
}

/** Filter for segments whose bounding box meets the rings' bounding box (any other cannot limit a label inside). */
function nearSegments(rings: readonly (readonly Point[])[]): (segs: readonly Segment[]) => Segment[] {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const r of rings)
    for (const [x, y] of r) {
      x0 = Math.min(x0, x);
      y0 = Math.min(y0, y);
      x1 = Math.max(x1, x);
      y1 = Math.max(y1, y);
    }
  return (segs) =>
    segs.filter(
      ([a, b]) => Math.max(a[0], b[0]) >= x0 && Math.min(a[0], b[0]) <= x1 && Math.max(a[1], b[1]) >= y0 && Math.min(a[1], b[1]) <= y1,
    );
}

function centredBox(runs: readonly TextRun[], size: number, cx: number, cy: number): Rect {
  const w = runsWidth(runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(runs, size);
  const h = bottom - top;
  return { x: cx - w / 2, y: cy - h / 2, w, h };
}

/** Directions tried around an anchor, 16 compass points starting east, clockwise on the page. */
const DIRECTIONS: Point[] = Array.from({ length: 16 }, (_, k) => {
  const a = (k * Math.PI) / 8;
  return [Math.round(Math.cos(a) * 1e9) / 1e9, Math.round(Math.sin(a) * 1e9) / 1e9] as Point;
});

function placeOutside(layout: Layout, req: RegionLabelRequest, anchor: Point, size: number): RegionLabelPlacement {
  const gap = 0.25 * size;
  const w = runsWidth(req.runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(req.runs, size);
  const h = bottom - top;
  let best: { cost: number; cx: number; cy: number; box: Rect } | null = null;
  for (let k = 0; k < 24; k++) {
    const r = (k + 1) * 0.7 * size;
    for (const [dx, dy] of DIRECTIONS) {
      // Offset so that the box edge (not its centre) is r away from the anchor.
      const ex = (w / 2) * Math.abs(dx);
      const ey = (h / 2) * Math.abs(dy);
      const cx = anchor[0] + dx * (r + ex);
      const cy = anchor[1] + dy * (r + ey);
      const box = { x: cx - w / 2, y: cy - h / 2, w, h };
      const padded = inflate(box, gap);
      if (!rectInside(padded, layout.plot)) continue;
      if (!layout.boxFree(padded, 0)) continue;
      const hard = layout.hits(padded, layout.hard);
      if (hard > 0) continue;
      if (insideRings([cx, cy], req.rings)) continue;
      const soft = layout.hits(padded, layout.soft);
      const end = nearestOnRect(anchor, box);
      let leaderHitsBox = false;
      for (const b of layout.boxes) if (segmentHitsRect(anchor, end, b.rect)) leaderHitsBox = true;
      if (leaderHitsBox) continue;
      const crossings = countCrossings(anchor, end, layout.hard);
      const cost = r + 4 * size * soft + 1.5 * size * Math.max(0, crossings - 1);
      if (!best || cost < best.cost - 1e-9) best = { cost, cx, cy, box };
    }
    if (best && best.cost <= (k + 1) * 0.7 * size) break;
  }
  if (!best) {
    // Last resort: beside the anchor, over whatever is there (still reported through the box).
    const cx = anchor[0];
    const cy = anchor[1] - h;
    best = { cost: 0, cx, cy, box: { x: cx - w / 2, y: cy - h / 2, w, h } };
  }
  layout.addBox(best.box, 'region-label');
  const end = nearestOnRect(anchor, best.box);
  const len = Math.hypot(end[0] - anchor[0], end[1] - anchor[1]);
  const trim = Math.min(len * 0.5, 0.15 * size);
  const tip: Point = len > 0 ? [end[0] - ((end[0] - anchor[0]) / len) * trim, end[1] - ((end[1] - anchor[1]) / len) * trim] : end;
  return { key: req.key, runs: req.runs, size, cx: best.cx, cy: best.cy, box: best.box, leader: [anchor, tip] };
}

function countCrossings(a: Point, b: Point, segs: readonly Segment[]): number {
  let n = 0;
  const r = { x: Math.min(a[0], b[0]), y: Math.min(a[1], b[1]), w: Math.abs(a[0] - b[0]), h: Math.abs(a[1] - b[1]) };
  for (const [p, q] of segs) {
    if (Math.max(p[0], q[0]) < r.x || Math.min(p[0], q[0]) > r.x + r.w || Math.max(p[1], q[1]) < r.y || Math.min(p[1], q[1]) > r.y + r.h)
      continue;
    if (segmentCross(a, b, p, q)) n++;
  }
  return n;
}

function segmentCross(p: Point, q: Point, r: Point, s: Point): boolean {
  const o = (a: Point, b: Point, c: Point): number => (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
  const d1 = o(r, s, p);
  const d2 = o(r, s, q);
  const d3 = o(p, q, r);
  const d4 = o(p, q, s);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

/**
 * First free place among candidate oriented boxes (in order). Returns its index or −1.
 * `soft` asks to avoid soft lines too; `extra` adds lines to avoid (e.g. the labelled line itself).
 */
export function firstFree(layout: Layout, candidates: readonly OrientedBox[], gap: number, soft: boolean, extra: readonly Segment[] = []): number {
  for (let i = 0; i < candidates.length; i++) if (layout.orientedFree(candidates[i]!, gap, soft, extra)) return i;
  return -1;
}

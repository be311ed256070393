/**
 * Label layout in figure space (pt): text boxes, oriented boxes, the registry of placed boxes and
 * lines (Layout), first-fit placement for the smaller labels, and the search helpers the region
 * and mark labels share (compass directions, leader crossings). Deterministic: candidates are
 * tried in a fixed order and ties go to the first. Region labels: label-regions.ts; mark and
 * overlay-layer labels: label-marks.ts.
 */
import { rectInside, rectRing, rectsOverlap, ringSegments, segmentHitsRect, type Segment } from './geometry.js';
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
  if (o.angle === 0) return segmentHitsRect(seg[0], seg[1], { x: o.cx - o.hx, y: o.cy - o.hy, w: 2 * o.hx, h: 2 * o.hy });
  const a = (-o.angle * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const x0 = seg[0][0] - o.cx;
  const y0 = seg[0][1] - o.cy;
  const x1 = seg[1][0] - o.cx;
  const y1 = seg[1][1] - o.cy;
  return segmentHitsRect([x0 * c - y0 * s, x0 * s + y0 * c], [x1 * c - y1 * s, x1 * s + y1 * c], { x: -o.hx, y: -o.hy, w: 2 * o.hx, h: 2 * o.hy });
}

/** Placed boxes and the lines labels must keep off. */
export class Layout {
  /** Lines no label may cross: region boundaries. */
  readonly hard: Segment[] = [];
  /** Lines labels should avoid: water lines, families, overlays, neutral line, operating paths. */
  readonly soft: Segment[] = [];
  /** Boxes of placed text and marks. */
  readonly boxes: { rect: Rect; role: string }[] = [];
  /** Leader lines of outside region labels (also in `hard`). */
  readonly leaders: Segment[] = [];

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

  /** Whether any of the segments meets the rectangle. */
  anyHit(r: Rect, segs: readonly Segment[]): boolean {
    for (const [a, b] of segs) if (segmentHitsRect(a, b, r)) return true;
    return false;
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

/** Bounding box [x0, y0, x1, y1] of a set of rings. */
export function ringsBox(rings: readonly (readonly Point[])[]): [number, number, number, number] {
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
  return [x0, y0, x1, y1];
}

/** Filter for segments whose bounding box meets the rings' bounding box (any other cannot limit a label inside). */
export function nearSegments(rings: readonly (readonly Point[])[]): (segs: readonly Segment[]) => Segment[] {
  const [x0, y0, x1, y1] = ringsBox(rings);
  return (segs) =>
    segs.filter(
      ([a, b]) => Math.max(a[0], b[0]) >= x0 && Math.min(a[0], b[0]) <= x1 && Math.max(a[1], b[1]) >= y0 && Math.min(a[1], b[1]) <= y1,
    );
}

/** Axis-aligned box of text centred at (cx, cy), widened by FONT_SAFETY (turned: reading upwards). */
export function centredBox(runs: readonly TextRun[], size: number, cx: number, cy: number, turned = false): Rect {
  const along = runsWidth(runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(runs, size);
  const across = bottom - top;
  const w = turned ? across : along;
  const h = turned ? along : across;
  return { x: cx - w / 2, y: cy - h / 2, w, h };
}

/** Directions tried around an anchor, 16 compass points starting east, clockwise on the page. */
export const DIRECTIONS: Point[] = Array.from({ length: 16 }, (_, k) => {
  const a = (k * Math.PI) / 8;
  return [Math.round(Math.cos(a) * 1e9) / 1e9, Math.round(Math.sin(a) * 1e9) / 1e9] as Point;
});

/** Clearance (padded label scale) beyond which a region label prefers the middle of its region. */
export const LABEL_ROOM = 1.5;

/** Squared distance from point p to segment ab. */
export function segmentDistanceSq(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  let t = l2 === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / l2;
  t = Math.max(0, Math.min(1, t));
  const ex = p[0] - (a[0] + t * dx);
  const ey = p[1] - (a[1] + t * dy);
  return ex * ex + ey * ey;
}

/** How many of the segments the segment a–b crosses properly (bounding-box prefilter). */
export function countCrossings(a: Point, b: Point, segs: readonly Segment[]): number {
  let n = 0;
  const r = { x: Math.min(a[0], b[0]), y: Math.min(a[1], b[1]), w: Math.abs(a[0] - b[0]), h: Math.abs(a[1] - b[1]) };
  for (const [p, q] of segs) {
    if (Math.max(p[0], q[0]) < r.x || Math.min(p[0], q[0]) > r.x + r.w || Math.max(p[1], q[1]) < r.y || Math.min(p[1], q[1]) > r.y + r.h)
      continue;
    if (segmentCross(a, b, p, q)) n++;
  }
  return n;
}

/** Whether segments p–q and r–s cross at a single interior point (touching does not count). */
export function segmentCross(p: Point, q: Point, r: Point, s: Point): boolean {
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

/** The four edges of a rectangle (top, right, bottom, left). */
export function boxSegments(r: Rect): Segment[] {
  return ringSegments([rectRing(r)]);
}

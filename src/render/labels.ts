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

export interface RegionLabelRequest {
  key: string;
  runs: TextRun[];
  /** Region rings in figure coordinates (clipped to the plot). */
  rings: Point[][];
  /** Label only if it fits inside (no leader): for the smaller parts of a region in several pieces. */
  optional?: boolean;
}

export interface RegionLabelPlacement {
  key: string;
  runs: TextRun[];
  size: number;
  /** Centre of the text ink box. */
  cx: number;
  cy: number;
  /** 0, or −90 for text reading upwards in a tall narrow region. */
  angle: 0 | -90;
  /** Axis-aligned box of the ink (rotated with the text). */
  box: Rect;
  /** Present when the label sits outside its region: from the region's interior point to the box. */
  leader?: [Point, Point];
}

/**
 * Places region labels. Each label goes to the pole of inaccessibility of its region for a
 * rectangle of the label's shape (the centre where the largest copy fits), keeping off region
 * edges, boundary lines and, if it can, soft lines. Preference: full size; else the largest size
 * down to `minSize`; else, in a tall narrow region, the same turned to read upwards; else the
 * label goes outside at the nearest free place with a leader line from the region's interior
 * point (leaders never cross each other or a label, and the order of several outside labels is
 * chosen for the least total cost). Labels never overlap each other. Requests are handled largest
 * region first (as given). Optional requests that do not fit inside are dropped (null).
 */
export function placeRegionLabels(
  layout: Layout,
  requests: readonly RegionLabelRequest[],
  size: number,
  minSize: number,
): (RegionLabelPlacement | null)[] {
  // Clearance around the ink, in pt, kept at full value even when the font shrinks.
  const padX = 0.3 * size;
  const padY = 0.22 * size;
  const out: (RegionLabelPlacement | null)[] = requests.map(() => null);
  const outside: number[] = [];
  requests.forEach((req, i) => {
    // Only lines near the region can limit its label.
    const near = nearSegments(req.rings);
    const hardNear = near(layout.hard);
    const softNear = near(layout.soft);
    const bothNear = [...hardNear, ...softNear];
    const w1 = (runsWidth(req.runs, size) * FONT_SAFETY) / size; // width per pt of font
    const { top, bottom } = runsExtent(req.runs, size);
    const h1 = (bottom - top) / size;
    const half = (f: number, turned: boolean): [number, number] => {
      const along = (w1 * f) / 2 + padX;
      const across = (h1 * f) / 2 + padY;
      return turned ? [across, along] : [along, across];
    };
    // Whether a label at font size f fits clear of soft lines ('soft'), of hard lines only
    // ('hard') or not at all (null): a feasibility search, much cheaper than finding the best centre.
    // A label that would fit only with less than 3 % of its padded size to spare counts as not
    // fitting (the search then ends far sooner on long bands of nearly equal clearance).
    const probe = { need: 1, precision: 0.03 };
    const fits = (f: number, turned: boolean): 'soft' | 'hard' | null => {
      const [hx, hy] = half(f, turned);
      if (rectPole(req.rings, bothNear, hx, hy, probe).scale >= 1) return 'soft';
      if (rectPole(req.rings, hardNear, hx, hy, probe).scale >= 1) return 'hard';
      return null;
    };
    // Centre for font size f, given what it can keep clear of: the most central place (nearest
    // the region's centroid) where the padded label could grow by half again, else the place of
    // largest clearance.
    const centre = (f: number, turned: boolean, clear: 'soft' | 'hard'): Point => {
      const [hx, hy] = half(f, turned);
      const obstacles = clear === 'soft' ? bothNear : hardNear;
      const middle = rectPole(req.rings, obstacles, hx, hy, { cap: LABEL_ROOM });
      // The centring may trade clearance for position only while the label still fits.
      return middle.scale >= 1 ? middle.point : rectPole(req.rings, obstacles, hx, hy).point;
    };
    const largest = (turned: boolean): { f: number; point: Point } | null => {
      const full = fits(size, turned);
      if (full) return { f: size, point: centre(size, turned, full) };
      let low = fits(minSize, turned);
      if (!low) return null;
      // Largest size in [minSize, size] that fits (bisection, 6 steps ≈ 1.5 % of the range).
      let lo = minSize;
      let hi = size;
      for (let k = 0; k < 6; k++) {
        const mid = (lo + hi) / 2;
        const m = fits(mid, turned);
        if (m) {
          lo = mid;
          low = m;
        } else hi = mid;
      }
      return { f: lo, point: centre(lo, turned, low) };
    };
    let turned = false;
    let best = largest(false);
    if (!best && tallNarrow(req.rings)) {
      best = largest(true);
      turned = best !== null;
    }
    if (best) {
      const fs = Math.round(best.f * 100) / 100;
      const [cx, cy] = best.point;
      const box = centredBox(req.runs, fs, cx, cy, turned);
      out[i] = { key: req.key, runs: req.runs, size: fs, cx, cy, angle: turned ? -90 : 0, box };
      layout.addBox(box, 'region-label');
    } else if (!req.optional) {
      outside.push(i);
    }
  });
  if (outside.length === 0) return out;
  // Leader anchors: each region's own pole (a square probe; 1 pt is ample for a dot).
  const anchors = outside.map((i) => rectPole(requests[i]!.rings, [], 1, 1, 1).point);
  // Try the orders of the outside labels (all of them up to 4 labels, else as given) and keep the
  // cheapest layout; ties keep the earlier order, so the result is deterministic.
  const orders = outside.length <= 4 ? permutations(outside.map((_, k) => k)) : [outside.map((_, k) => k)];
  const mark = { boxes: layout.boxes.length, hard: layout.hard.length, leaders: layout.leaders.length };
  let best: { cost: number; placed: [number, RegionLabelPlacement][]; boxes: Layout['boxes']; hard: Segment[]; leaders: Segment[] } | null = null;
  for (const order of orders) {
    let total = 0;
    const placed: [number, RegionLabelPlacement][] = [];
    for (const k of order) {
      const r = placeOutside(layout, requests[outside[k]!]!, anchors[k]!, size);
      placed.push([outside[k]!, r.placement]);
      total += r.cost;
      if (best && total >= best.cost) break;
    }
    if (!best || total < best.cost - 1e-9) {
      best = { cost: total, placed, boxes: layout.boxes.slice(mark.boxes), hard: layout.hard.slice(mark.hard), leaders: layout.leaders.slice(mark.leaders) };
    }
    layout.boxes.length = mark.boxes;
    layout.hard.length = mark.hard;
    layout.leaders.length = mark.leaders;
  }
  // Commit the cheapest order's placements and what they added to the layout.
  layout.boxes.push(...best!.boxes);
  layout.hard.push(...best!.hard);
  layout.leaders.push(...best!.leaders);
  for (const [i, pl] of best!.placed) out[i] = pl;
  return out;
}

/** All orderings of a short list, in lexicographic order of positions (the given order first). */
function permutations(xs: number[]): number[][] {
  if (xs.length <= 1) return [xs];
  const out: number[][] = [];
  xs.forEach((x, i) => {
    for (const rest of permutations([...xs.slice(0, i), ...xs.slice(i + 1)])) out.push([x, ...rest]);
  });
  return out;
}

/** Whether the rings' bounding box is at least twice as tall as wide (a candidate for upright text). */
function tallNarrow(rings: readonly (readonly Point[])[]): boolean {
  const [x0, y0, x1, y1] = ringsBox(rings);
  return y1 - y0 >= 2 * (x1 - x0);
}

/** Bounding box [x0, y0, x1, y1] of a set of rings. */
function ringsBox(rings: readonly (readonly Point[])[]): [number, number, number, number] {
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
function nearSegments(rings: readonly (readonly Point[])[]): (segs: readonly Segment[]) => Segment[] {
  const [x0, y0, x1, y1] = ringsBox(rings);
  return (segs) =>
    segs.filter(
      ([a, b]) => Math.max(a[0], b[0]) >= x0 && Math.min(a[0], b[0]) <= x1 && Math.max(a[1], b[1]) >= y0 && Math.min(a[1], b[1]) <= y1,
    );
}

function centredBox(runs: readonly TextRun[], size: number, cx: number, cy: number, turned = false): Rect {
  const along = runsWidth(runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(runs, size);
  const across = bottom - top;
  const w = turned ? across : along;
  const h = turned ? along : across;
  return { x: cx - w / 2, y: cy - h / 2, w, h };
}

/** Directions tried around an anchor, 16 compass points starting east, clockwise on the page. */
const DIRECTIONS: Point[] = Array.from({ length: 16 }, (_, k) => {
  const a = (k * Math.PI) / 8;
  return [Math.round(Math.cos(a) * 1e9) / 1e9, Math.round(Math.sin(a) * 1e9) / 1e9] as Point;
});

/** Clearance (padded label scale) beyond which a region label prefers the middle of its region. */
const LABEL_ROOM = 1.5;

/** Cost of an outside label that found no free place (drawn beside its anchor regardless). */
const NO_PLACE = 1e6;

/**
 * Outside place for a region label: the nearest free box around the anchor (16 directions, growing
 * radius) whose leader crosses no other leader or label; cost = distance + penalties for soft lines
 * under the box and for each boundary the leader crosses beyond the region's own. Adds the box and
 * the leader to the layout (the leader as a hard line, so later labels keep off it).
 */
function placeOutside(layout: Layout, req: RegionLabelRequest, anchor: Point, size: number): { placement: RegionLabelPlacement; cost: number } {
  const gap = 0.25 * size;
  const w = runsWidth(req.runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(req.runs, size);
  const h = bottom - top;
  const step = 0.7 * size;
  let best: { cost: number; cx: number; cy: number; box: Rect } | null = null;
  for (let k = 0; k < 24; k++) {
    const r = (k + 1) * step;
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
      if (insideRings([cx, cy], req.rings)) continue;
      if (layout.anyHit(padded, layout.hard)) continue;
      const end = nearestOnRect(anchor, box);
      let blocked = false;
      for (const b of layout.boxes) {
        if (segmentHitsRect(anchor, end, b.rect)) {
          blocked = true;
          break;
        }
      }
      if (blocked) continue;
      for (const [p, q] of layout.leaders) {
        if (segmentCross(anchor, end, p, q) || segmentDistanceSq(p, anchor, end) < 1 || segmentDistanceSq(anchor, p, q) < 1) {
          blocked = true;
          break;
        }
      }
      if (blocked) continue;
      const soft = layout.hits(padded, layout.soft);
      const crossings = countCrossings(anchor, end, layout.hard);
      const cost = r + 4 * size * soft + 3 * size * Math.max(0, crossings - 1);
      if (!best || cost < best.cost - 1e-9) best = { cost, cx, cy, box };
    }
    if (best && best.cost <= r) break;
  }
  if (!best) {
    // Last resort: beside the anchor, over whatever is there (still reported through the box).
    const cx = anchor[0];
    const cy = anchor[1] - h;
    best = { cost: NO_PLACE, cx, cy, box: { x: cx - w / 2, y: cy - h / 2, w, h } };
  }
  layout.addBox(best.box, 'region-label');
  const end = nearestOnRect(anchor, best.box);
  const len = Math.hypot(end[0] - anchor[0], end[1] - anchor[1]);
  const trim = Math.min(len * 0.5, 0.15 * size);
  const tip: Point = len > 0 ? [end[0] - ((end[0] - anchor[0]) / len) * trim, end[1] - ((end[1] - anchor[1]) / len) * trim] : end;
  layout.leaders.push([anchor, tip]);
  layout.hard.push([anchor, tip]);
  return { placement: { key: req.key, runs: req.runs, size, cx: best.cx, cy: best.cy, angle: 0, box: best.box, leader: [anchor, tip] }, cost: best.cost };
}

/** Squared distance from point p to segment ab. */
function segmentDistanceSq(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  let t = l2 === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / l2;
  t = Math.max(0, Math.min(1, t));
  const ex = p[0] - (a[0] + t * dx);
  const ey = p[1] - (a[1] + t * dy);
  return ex * ex + ey * ey;
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

export interface MarkLabelPlacement {
  /** Centre of the text ink box. */
  cx: number;
  cy: number;
  box: Rect;
  /** From the mark's edge to the label box, when the label had to move away from its mark. */
  leader?: [Point, Point];
  /** Whether a soft line (water line, family, overlay, …) runs under the label (knock it out). */
  overSoft: boolean;
}

/**
 * Places the label of an operating mark: a point (`kind` 'point', `mark` the marker's square) or a
 * box or path end ('box', `mark` its rectangle). Same rules as region labels: never over a
 * boundary or another label, off soft lines when possible, inside the plot. Tried in order:
 * (1) the usual places beside the mark (points: the four diagonals, then above, below, right,
 * left; boxes: above and below aligned with either edge, then beside, then centred) at two
 * distances, clear of everything; (2) the nearest free place around the mark (16
 * directions, growing radius) with a leader line from the mark's edge (also where a boundary runs
 * between the mark and a place beside it), clear of soft lines, then
 * allowing them at a cost; (3) a place beside the mark over soft lines; (4) the first place beside
 * the mark regardless. `own` are segments of the mark itself to keep off (e.g. a path). Adds the
 * box (and leader, as a hard line) to the layout.
 */
export function placeMarkLabel(
  layout: Layout,
  runs: readonly TextRun[],
  size: number,
  mark: Rect,
  kind: 'point' | 'box',
  role: string,
  own: readonly Segment[] = [],
): MarkLabelPlacement {
  const w = runsWidth(runs, size) * FONT_SAFETY;
  const { top, bottom } = runsExtent(runs, size);
  const h = bottom - top;
  const hw = w / 2;
  const hh = h / 2;
  const gap = 0.12 * size;
  const mx0 = mark.x;
  const my0 = mark.y;
  const mx1 = mark.x + mark.w;
  const my1 = mark.y + mark.h;
  const near = (g: number): OrientedBox[] => {
    const at = (cx: number, cy: number): OrientedBox => ({ cx, cy, hx: hw, hy: hh, angle: 0 });
    if (kind === 'point') {
      const d = 0.5 * g;
      return [
        at(mx1 + d + hw, my0 - d - hh),
        at(mx1 + d + hw, my1 + d + hh),
        at(mx0 - d - hw, my0 - d - hh),
        at(mx0 - d - hw, my1 + d + hh),
        at((mx0 + mx1) / 2, my0 - g - hh),
        at((mx0 + mx1) / 2, my1 + g + hh),
        at(mx1 + g + hw, (my0 + my1) / 2),
        at(mx0 - g - hw, (my0 + my1) / 2),
      ];
    }
    return [
      at(mx0 + hw, my0 - g - hh),
      at(mx1 - hw, my0 - g - hh),
      at(mx0 + hw, my1 + g + hh),
      at(mx1 - hw, my1 + g + hh),
      at(mx1 + g + hw, my0 + hh),
      at(mx0 - g - hw, my0 + hh),
      at(mx1 + g + hw, my1 - hh),
      at(mx0 - g - hw, my1 - hh),
      at((mx0 + mx1) / 2, my0 - g - hh),
      at((mx0 + mx1) / 2, my1 + g + hh),
      at(mx1 + g + hw, (my0 + my1) / 2),
      at(mx0 - g - hw, (my0 + my1) / 2),
    ];
  };
  const g0 = 0.3 * size;
  const first = near(g0);
  const commit = (ob: OrientedBox, leader?: [Point, Point]): MarkLabelPlacement => {
    const box = { x: ob.cx - hw, y: ob.cy - hh, w, h };
    layout.addBox(box, role);
    if (leader) {
      layout.leaders.push(leader);
      layout.hard.push(leader);
    }
    const overSoft = layout.anyHit(box, layout.soft);
    return { cx: ob.cx, cy: ob.cy, box, ...(leader ? { leader } : {}), overSoft };
  };
  // (1) Beside the mark, clear of everything, with no boundary between mark and label.
  const separated = (ob: OrientedBox): boolean => {
    const a = nearestOnRect([ob.cx, ob.cy], mark);
    const b = nearestOnRect(a, { x: ob.cx - hw, y: ob.cy - hh, w, h });
    return countCrossings(a, b, layout.hard) > 0;
  };
  for (const g of [g0, g0 + 0.6 * size]) {
    for (const ob of g === g0 ? first : near(g)) if (layout.orientedFree(ob, gap, true, own) && !separated(ob)) return commit(ob);
  }
  // (2) Further away with a leader.
  for (const allowSoft of [false, true]) {
    const r = leaderPlace(layout, w, h, mark, size, allowSoft, own);
    if (r) return commit({ cx: r.cx, cy: r.cy, hx: hw, hy: hh, angle: 0 }, r.leader);
  }
  // (3) Beside the mark over soft lines; (4) the first place regardless.
  const idx = firstFree(layout, first, gap, false);
  return commit(first[Math.max(0, idx)]!);
}

/** Leader placement for placeMarkLabel: nearest free box around the mark, cost = distance + penalties. */
function leaderPlace(
  layout: Layout,
  w: number,
  h: number,
  mark: Rect,
  size: number,
  allowSoft: boolean,
  own: readonly Segment[],
): { cx: number; cy: number; leader: [Point, Point] } | null {
  const mc: Point = [mark.x + mark.w / 2, mark.y + mark.h / 2];
  const step = 0.6 * size;
  const pad = 0.2 * size;
  let best: { cost: number; cx: number; cy: number; leader: [Point, Point] } | null = null;
  for (let k = 1; k <= 16; k++) {
    const r = 0.9 * size + k * step;
    for (const [dx, dy] of DIRECTIONS) {
      const cx = mc[0] + dx * (r + (mark.w / 2) * Math.abs(dx) + (w / 2) * Math.abs(dx));
      const cy = mc[1] + dy * (r + (mark.h / 2) * Math.abs(dy) + (h / 2) * Math.abs(dy));
      const box = { x: cx - w / 2, y: cy - h / 2, w, h };
      const padded = inflate(box, pad);
      if (!rectInside(padded, layout.plot)) continue;
      if (!layout.boxFree(padded, 0)) continue;
      if (layout.anyHit(padded, layout.hard) || layout.anyHit(padded, own)) continue;
      const soft = layout.hits(padded, layout.soft);
      if (soft > 0 && !allowSoft) continue;
      const start = nearestOnRect([cx, cy], mark);
      const end = nearestOnRect(start, box);
      let blocked = false;
      for (const b of layout.boxes) {
        if (rectsOverlap(b.rect, mark, -1e-6)) continue; // the mark's own box
        if (segmentHitsRect(start, end, b.rect)) {
          blocked = true;
          break;
        }
      }
      if (!blocked) {
        for (const [p, q] of layout.leaders) {
          if (segmentCross(start, end, p, q)) {
            blocked = true;
            break;
          }
        }
      }
      if (blocked) continue;
      const cost = r + 4 * size * soft + 3 * size * countCrossings(start, end, layout.hard);
      if (!best || cost < best.cost - 1e-9) best = { cost, cx, cy, leader: [start, end] };
    }
    if (best && best.cost <= r) break;
  }
  if (!best) return null;
  // Stop the leader just short of the text.
  const [s, e] = best.leader;
  const len = Math.hypot(e[0] - s[0], e[1] - s[1]);
  const trim = Math.min(len * 0.5, 0.15 * size);
  const tip: Point = len > 0 ? [e[0] - ((e[0] - s[0]) / len) * trim, e[1] - ((e[1] - s[1]) / len) * trim] : e;
  return { cx: best.cx, cy: best.cy, leader: [s, tip] };
}

export interface LayerLabelRequest {
  key: string;
  /** What the label names (e.g. the species): a field already named the same is not labelled again. */
  name: string;
  runs: TextRun[];
  /** Pieces of the region in figure coordinates (clipped to the plot), tried in the given order. */
  pieces: Point[][][];
}

export interface LayerLabelPlacement {
  key: string;
  /** Centre of the text ink box. */
  cx: number;
  cy: number;
  box: Rect;
}

/**
 * Places the small labels of an overlay layer's regions, in the given order: each goes inside
 * its region (the first piece where it fits), at the most central place (nearest the piece's
 * centroid) where the padded label could grow by half again, else at the place of largest
 * clearance. Unlike a base region label it never shrinks, turns or moves out with a leader: it
 * must keep clear of every line (hard and soft: base boundaries, water lines, every overlay, the
 * marks) and every placed box, or it is left out (null) — a missing small label is better than a
 * crowded figure. A region is also left unlabelled when a label of the same name already lies
 * inside it (`named`: the points of the labels placed so far, e.g. the base's; e.g. Fe₂O₃ at
 * 150 °C over the 25 °C Fe₂O₃ field, whose label names both). Adds each placed box to the layout
 * (role 'overlay-label') and its centre to `named`.
 */
export function placeLayerLabels(
  layout: Layout,
  requests: readonly LayerLabelRequest[],
  size: number,
  gap: number,
  named: { name: string; at: Point }[] = [],
): (LayerLabelPlacement | null)[] {
  const padX = 0.25 * size;
  const padY = 0.2 * size;
  return requests.map((req) => {
    if (named.some((n) => n.name === req.name && req.pieces.some((rings) => insideRings(n.at, rings)))) return null;
    const w = runsWidth(req.runs, size) * FONT_SAFETY;
    const { top, bottom } = runsExtent(req.runs, size);
    const h = bottom - top;
    const hx = w / 2 + padX;
    const hy = h / 2 + padY;
    for (const rings of req.pieces) {
      const near = nearSegments(rings);
      const boxSegs = layout.boxes.flatMap((b) => boxSegments(inflate(b.rect, gap)));
      const obstacles = [...near(layout.hard), ...near(layout.soft), ...near(boxSegs)];
      const middle = rectPole(rings, obstacles, hx, hy, { cap: LABEL_ROOM });
      const at = middle.scale >= 1 ? middle : rectPole(rings, obstacles, hx, hy);
      if (at.scale < 1) continue;
      const [cx, cy] = at.point;
      const box = centredBox(req.runs, size, cx, cy);
      if (!rectInside(box, layout.plot) || !layout.boxFree(box, gap)) continue;
      layout.addBox(box, 'overlay-label');
      named.push({ name: req.name, at: [cx, cy] });
      return { key: req.key, cx, cy, box };
    }
    return null;
  });
}

/** The four edges of a rectangle. */
export function boxSegments(r: Rect): Segment[] {
  const a: Point = [r.x, r.y];
  const b: Point = [r.x + r.w, r.y];
  const c: Point = [r.x + r.w, r.y + r.h];
  const d: Point = [r.x, r.y + r.h];
  return [
    [a, b],
    [b, c],
    [c, d],
    [d, a],
  ];
}

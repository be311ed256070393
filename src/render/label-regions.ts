/**
 * Region labels at the rectangle pole of inaccessibility of their region (shrunk within limits,
 * turned upright in a tall narrow region, else moved out with a leader line). Deterministic.
 */
import { inflate, insideRings, nearestOnRect, rectInside, segmentHitsRect, type Segment } from './geometry.js';
import { Layout, ringsBox, nearSegments, centredBox, DIRECTIONS, LABEL_ROOM, segmentDistanceSq, countCrossings, segmentCross, boxSegments } from './labels.js';
import { FONT_SAFETY, runsExtent, runsWidth } from './metrics.js';
import { rectPole } from './pole.js';
import type { Point, Rect, TextRun } from './scene-types.js';

export interface RegionLabelRequest {
  key: string;
  runs: TextRun[];
  /** Region rings in figure coordinates (clipped to the plot). */
  rings: Point[][];
  /** Label only if it fits inside (no leader): for the smaller parts of a region in several pieces. */
  optional?: boolean;
  /**
   * The label is the region's number (keyed in the legend): it may sit over boundary lines as a
   * last resort. A name is not put over lines: it is reported `crowded` instead.
   */
  keyed?: boolean;
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
  /**
   * The label found no free place, inside or outside (even over lines): it was put down where it
   * overlaps or its leader may cross. The scene then labels the region by number with a key.
   */
  crowded?: true;
  /** Placed by the last resort (over whatever is there): the figure needs more room. */
  lastResort?: true;
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
  const out: (RegionLabelPlacement | null)[] = requests.map(() => null);
  const outside: number[] = [];
  // (1) Inside each region, largest region first; (2) the rest outside, in the cheapest order.
  requests.forEach((req, i) => {
    const best = placeInside(layout, req, size, minSize);
    if (best) {
      const fs = Math.round(best.f * 100) / 100;
      const [cx, cy] = best.point;
      const box = centredBox(req.runs, fs, cx, cy, best.turned);
      out[i] = { key: req.key, runs: req.runs, size: fs, cx, cy, angle: best.turned ? -90 : 0, box };
      layout.addBox(box, 'region-label');
    } else if (!req.optional) {
      outside.push(i);
    }
  });
  // Numbers first (small, and they must land near their region), then the names with leaders.
  outside.sort((a, b) => Number(!requests[a]!.keyed) - Number(!requests[b]!.keyed) || a - b);
  if (outside.length > 0) placeAllOutside(layout, requests, outside, size, out, minSize);
  return out;
}

/**
 * The largest size in [minSize, size] at which a region's label fits inside it, and its centre:
 * upright text only in a tall narrow region where flat text does not fit. Null: it does not fit.
 */
function placeInside(layout: Layout, req: RegionLabelRequest, size: number, minSize: number): { f: number; point: Point; turned: boolean } | null {
  // Clearance around the ink, in pt, kept at full value even when the font shrinks.
  const padX = 0.3 * size;
  const padY = 0.22 * size;
  // Only lines near the region can limit its label.
  const near = nearSegments(req.rings);
  // Operating points and arrowheads already placed are hard too: a label never hides them.
  const hardNear = near([...layout.hard, ...markSegments(layout, ['point', 'arrow'])]);
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
  return best ? { ...best, turned } : null;
}

/**
 * Outside places for the labels that fit nowhere inside: the orders of the outside labels are
 * tried (all of them up to 4 labels, else as given) and the cheapest layout is kept.
 */
function placeAllOutside(layout: Layout, requests: readonly RegionLabelRequest[], outside: number[], size: number, out: (RegionLabelPlacement | null)[], minSize = size): void {
  // Leader anchors: each region's own pole (a square probe; 1 pt is ample for a dot), kept off the
  // operating marks and the labels already placed where the region leaves room (so that a leader
  // can get out).
  const placed = layout.boxes.flatMap((b) => boxSegments(b.rect));
  const anchors = outside.map((i) => rectPole(requests[i]!.rings, nearSegments(requests[i]!.rings)(placed), 1, 1, 1).point);
  // Try the orders of the outside labels (all of them up to 4 labels, else as given) and keep the
  // cheapest layout; ties keep the earlier order, so the result is deterministic.
  const orders = outside.length <= 4 ? permutations(outside.map((_, k) => k)) : [outside.map((_, k) => k)];
  const mark = { boxes: layout.boxes.length, hard: layout.hard.length, leaders: layout.leaders.length };
  let best: { cost: number; placed: [number, RegionLabelPlacement][]; boxes: Layout['boxes']; hard: Segment[]; leaders: Segment[] } | null = null;
  for (const order of orders) {
    let total = 0;
    const placed: [number, RegionLabelPlacement][] = [];
    for (const k of order) {
      const r = placeOutside(layout, requests[outside[k]!]!, anchors[k]!, size, minSize);
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
}

/** Edges of the placed boxes with the given roles (the operating marks). */
function markSegments(layout: Layout, roles: readonly string[]): Segment[] {
  return layout.boxes.filter((b) => roles.includes(b.role)).flatMap((b) => boxSegments(b.rect));
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

/** Cost of an outside label that found no free place (drawn beside its anchor regardless). */
const NO_PLACE = 1e6;

/**
 * Outside place for a region label: the nearest free box around the anchor (16 directions, growing
 * radius) whose leader crosses no other leader or label; cost = distance + penalties for soft lines
 * under the box and for each boundary the leader crosses beyond the region's own. Tried at full
 * size, then at `minSize`, then — for a region's number only (`keyed`) — still at `minSize` letting
 * the box sit over boundary lines at a heavy cost. A name that finds no place is marked `crowded`
 * (the scene numbers its region) and put down at the nearest free box regardless. Adds the
 * box and the leader to the layout (the leader as a hard line, so later labels keep off it).
 */
function placeOutside(layout: Layout, req: RegionLabelRequest, anchorAt: Point, size: number, minSize = size): { placement: RegionLabelPlacement; cost: number } {
  let anchor = anchorAt;
  const tries: [number, boolean][] = req.keyed ? [[size, false], [minSize, false], [minSize, true]] : [[size, false], [minSize, false]];
  let best: OutsideSpot | null = null;
  let f = size;
  for (const [s, overLines] of tries) {
    best = searchOutside(layout, req, anchor, s, overLines);
    f = s;
    if (best) break;
  }
  const crowded = !best;
  if (!best && req.keyed) {
    // A region's number at its own pole, over lines if need be, where no label or leader is.
    const pole = atPole(layout, req, anchor, f);
    if (pole) {
      layout.addBox(pole.box, 'region-label');
      return { placement: { key: req.key, runs: req.runs, size: f, cx: pole.cx, cy: pole.cy, angle: 0, box: pole.box }, cost: pole.cost };
    }
  }
  if (!best) best = nearestFreeBox(layout, req, anchor, f);
  if (!best && req.keyed) {
    // The anchor may be boxed in by labels placed since: try other points of the region.
    for (const a of otherAnchors(req.rings, anchor)) {
      if (layout.boxes.some((b) => insideRect(a, b.rect))) continue;
      best = nearestFreeBox(layout, req, a, f);
      if (best) {
        anchor = a;
        break;
      }
    }
  }
  if (!best) {
    // Last resort: beside the anchor, kept inside the plot, over whatever is there.
    const { w, h } = labelSize(req, f);
    const cx = Math.min(Math.max(anchor[0], layout.plot.x + w / 2), layout.plot.x + layout.plot.w - w / 2);
    const cy = Math.min(Math.max(anchor[1] - h, layout.plot.y + h / 2), layout.plot.y + layout.plot.h - h / 2);
    best = { cost: NO_PLACE, cx, cy, box: { x: cx - w / 2, y: cy - h / 2, w, h } };
  }
  layout.addBox(best.box, 'region-label');
  const end = nearestOnRect(anchor, best.box);
  const len = Math.hypot(end[0] - anchor[0], end[1] - anchor[1]);
  const trim = Math.min(len * 0.5, 0.15 * f);
  const tip: Point = len > 0 ? [end[0] - ((end[0] - anchor[0]) / len) * trim, end[1] - ((end[1] - anchor[1]) / len) * trim] : end;
  layout.leaders.push([anchor, tip]);
  layout.hard.push([anchor, tip]);
  return { placement: { key: req.key, runs: req.runs, size: f, cx: best.cx, cy: best.cy, angle: 0, box: best.box, leader: [anchor, tip], ...(crowded ? { crowded: true as const } : {}), ...(best.cost === NO_PLACE ? { lastResort: true as const } : {}) }, cost: best.cost };
}

interface OutsideSpot {
  cost: number;
  cx: number;
  cy: number;
  box: Rect;
}

/** Whether a point lies in a rectangle (edges included). */
const insideRect = (p: Point, r: Rect): boolean => p[0] >= r.x && p[0] <= r.x + r.w && p[1] >= r.y && p[1] <= r.y + r.h;

/** Other leader anchors inside a region: halfway from the anchor to each vertex of its outer rings, in order. */
function otherAnchors(rings: readonly Point[][], anchor: Point): Point[] {
  const out: Point[] = [];
  for (const ring of rings) for (const v of ring) {
    const p: Point = [(anchor[0] + v[0]) / 2, (anchor[1] + v[1]) / 2];
    if (insideRings(p, rings)) out.push(p);
  }
  return out;
}

/**
 * A number's box inside its region, over lines if need be: at the leader anchor, else where the
 * region keeps it farthest from placed labels and leaders; null if no placed box or leader is clear.
 */
function atPole(layout: Layout, req: RegionLabelRequest, anchor: Point, size: number): OutsideSpot | null {
  const { w, h } = labelSize(req, size);
  const gap = 0.15 * size;
  const free = (cx: number, cy: number): Rect | null => {
    const box = { x: cx - w / 2, y: cy - h / 2, w, h };
    const padded = inflate(box, gap);
    return rectInside(padded, layout.plot) && layout.boxFree(padded, 0) && !layout.anyHit(padded, layout.leaders) ? box : null;
  };
  const atAnchor = free(anchor[0], anchor[1]);
  if (atAnchor) return { cost: NO_PLACE / 4, cx: anchor[0], cy: anchor[1], box: atAnchor };
  // Else the place in the region farthest from the placed labels and leaders (lines ignored).
  const obstacles = nearSegments(req.rings)([...layout.boxes.flatMap((b) => boxSegments(b.rect)), ...layout.leaders]);
  const pole = rectPole(req.rings, obstacles, w / 2 + gap, h / 2 + gap);
  const box = pole.scale >= 1 ? free(pole.point[0], pole.point[1]) : null;
  return box ? { cost: NO_PLACE / 4, cx: pole.point[0], cy: pole.point[1], box } : null;
}

/**
 * Fallback of placeOutside: the free box (clear of every placed box and leader, inside the plot)
 * nearest the anchor on a grid of half font sizes whose leader strikes no box and crosses no other
 * leader, whatever boundary lines it covers or its leader crosses.
 */
function nearestFreeBox(layout: Layout, req: RegionLabelRequest, anchor: Point, size: number): OutsideSpot | null {
  const { w, h } = labelSize(req, size);
  const gap = 0.25 * size;
  const { plot } = layout;
  let best: OutsideSpot | null = null;
  for (let y = plot.y + gap + h / 2; y <= plot.y + plot.h - gap - h / 2; y += size / 2) {
    for (let x = plot.x + gap + w / 2; x <= plot.x + plot.w - gap - w / 2; x += size / 2) {
      const box = { x: x - w / 2, y: y - h / 2, w, h };
      const d = Math.hypot(x - anchor[0], y - anchor[1]);
      if (best && d >= best.cost - NO_PLACE / 2) continue;
      if (!layout.boxFree(inflate(box, gap), 0)) continue;
      // The box keeps off the leaders, and its own leader off every box and leader.
      if (layout.anyHit(inflate(box, gap), layout.leaders)) continue;
      const end = nearestOnRect(anchor, box);
      if (layout.boxes.some((b) => segmentHitsRect(anchor, end, b.rect))) continue;
      if (layout.leaders.some(([p, q]) => segmentCross(anchor, end, p, q))) continue;
      best = { cost: NO_PLACE / 2 + d, cx: x, cy: y, box };
    }
  }
  return best;
}

/** Ink box size of a label at font size f (with the font-substitution widening). */
function labelSize(req: RegionLabelRequest, f: number): { w: number; h: number } {
  const { top, bottom } = runsExtent(req.runs, f);
  return { w: runsWidth(req.runs, f) * FONT_SAFETY, h: bottom - top };
}

/** The search of placeOutside at one size; `overLines` lets the box cross boundaries (cost 6 sizes each). */
function searchOutside(layout: Layout, req: RegionLabelRequest, anchor: Point, size: number, overLines: boolean): OutsideSpot | null {
  const gap = 0.25 * size;
  const { w, h } = labelSize(req, size);
  const step = 0.7 * size;
  let best: OutsideSpot | null = null;
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
      const hardHits = layout.hits(padded, layout.hard);
      if (hardHits > 0 && !overLines) continue;
      if (overLines && layout.anyHit(padded, layout.leaders)) continue;
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
      const cost = r + 4 * size * soft + 3 * size * Math.max(0, crossings - 1) + 6 * size * hardHits;
      if (!best || cost < best.cost - 1e-9) best = { cost, cx, cy, box };
    }
    if (best && best.cost <= r) break;
  }
  return best;
}

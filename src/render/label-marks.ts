/**
 * Labels of the user's marks (points, boxes, path starts), beside the mark or away with a leader,
 * and the small region labels of overlay layers. Deterministic.
 */
import { inflate, insideRings, nearestOnRect, rectInside, rectsOverlap, segmentHitsRect, type Segment } from './geometry.js';
import { type OrientedBox, Layout, nearSegments, centredBox, DIRECTIONS, LABEL_ROOM, countCrossings, segmentCross, firstFree, boxSegments } from './labels.js';
import { FONT_SAFETY, runsExtent, runsWidth } from './metrics.js';
import { rectPole } from './pole.js';
import type { Point, Rect, TextRun } from './scene-types.js';

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
 * allowing them at a cost; (3) a place beside the mark over soft lines; (4) the free place in the
 * plot nearest the mark whose leader strikes no other box or leader; (5) the first place beside
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
  // (3) Beside the mark over soft lines; (4) the free place in the plot nearest the mark, with a
  // leader; (5) the first place, kept inside the plot.
  const idx = firstFree(layout, first, gap, false);
  if (idx >= 0) return commit(first[idx]!);
  const free = nearestFreeInPlot(layout, w, h, mark, gap);
  if (free) {
    const end = nearestOnRect([free.cx, free.cy], mark);
    return commit({ cx: free.cx, cy: free.cy, hx: hw, hy: hh, angle: 0 }, [end, nearestOnRect(end, { x: free.cx - hw, y: free.cy - hh, w, h })]);
  }
  const p = layout.plot;
  const f0 = first[0]!;
  return commit({ ...f0, cx: Math.min(Math.max(f0.cx, p.x + hw), p.x + p.w - hw), cy: Math.min(Math.max(f0.cy, p.y + hh), p.y + p.h - hh) });
}

/** A w × h box inside the plot, clear of every placed box (with `gap`), nearest the mark (grid of half heights). */
function nearestFreeInPlot(layout: Layout, w: number, h: number, mark: Rect, gap: number): { cx: number; cy: number } | null {
  const p = layout.plot;
  const mc: Point = [mark.x + mark.w / 2, mark.y + mark.h / 2];
  const step = Math.max(1, h / 2);
  let best: { cx: number; cy: number; d: number } | null = null;
  for (let cy = p.y + gap + h / 2; cy <= p.y + p.h - gap - h / 2; cy += step) {
    for (let cx = p.x + gap + w / 2; cx <= p.x + p.w - gap - w / 2; cx += step) {
      const d = Math.hypot(cx - mc[0], cy - mc[1]);
      if (best && d >= best.d) continue;
      const box = { x: cx - w / 2, y: cy - h / 2, w, h };
      if (rectsOverlap(box, mark, 0)) continue;
      if (!layout.boxFree(inflate(box, gap), 0)) continue;
      if (layout.anyHit(inflate(box, gap), layout.leaders)) continue;
      if (!leaderClear(layout, mark, box)) continue;
      best = { cx, cy, d };
    }
  }
  return best;
}

/** Roles of the marks' own boxes in the layout (scene-labels.ts registerMarks). */
const MARK_ROLES = new Set(['point', 'box', 'arrow']);

/** Whether a placed box is the mark's own (a mark box over it), not a label that happens to cover it. */
const ownMark = (b: { rect: Rect; role: string }, mark: Rect): boolean => MARK_ROLES.has(b.role) && rectsOverlap(b.rect, mark, -1e-6);

/**
 * Whether the leader from the mark's edge to a label box at `box` keeps off every placed box (but
 * the mark's own) and crosses no other leader.
 */
function leaderClear(layout: Layout, mark: Rect, box: Rect): boolean {
  const start = nearestOnRect([box.x + box.w / 2, box.y + box.h / 2], mark);
  const end = nearestOnRect(start, box);
  for (const b of layout.boxes) if (!ownMark(b, mark) && segmentHitsRect(start, end, b.rect)) return false;
  return !layout.leaders.some(([p, q]) => segmentCross(start, end, p, q));
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
        if (ownMark(b, mark)) continue; // the mark's own box
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

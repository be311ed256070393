/**
 * The user's operating marks: envelopes (hatched boxes), paths (polyline with an arrowhead) and
 * points (dots). Their outlines are soft obstacles for region labels; their own labels are placed
 * later (scene-labels.ts), from the jobs returned here.
 */
import { clipPolyline } from './clip.js';
import { inflate, type Segment } from './geometry.js';
import { boxSegments } from './labels.js';
import { figLine, line, rectPath, segsOf, type SceneContext } from './scene-context.js';
import type { Point, Rect, SceneItem } from './scene-types.js';

export interface MarkJobs {
  boxes: { rect: Rect; label: string }[];
  paths: { start: Point; label: string; segs: Segment[] }[];
  arrowTips: Rect[];
  points: { at: Point; label: string; r: number }[];
}

/** Stroke width of the marks. */
export const markWidth = (lw: number): number => Math.max(0.5, 0.8 * lw);

/** Radius of a point's dot. */
const pointRadius = (markW: number): number => 1.1 * markW + 1.0;

/** Hatched envelopes: diagonal hatch clipped to the box, then the outline. */
function boxMarks(ctx: SceneContext, items: SceneItem[], jobs: MarkJobs): void {
  const { input, fr, ink, lw, k, layout } = ctx;
  const markW = markWidth(lw);
  for (const bx of input.boxes ?? []) {
    const xa = fr.x(Math.min(...bx.pH));
    const xb = fr.x(Math.max(...bx.pH));
    const ya = fr.y(Math.max(...bx.E));
    const yb = fr.y(Math.min(...bx.E));
    const rect = { x: xa, y: ya, w: xb - xa, h: yb - ya };
    const hatch: Point[][] = [];
    const step = 2.4 * k;
    for (let c = rect.x - rect.h; c < rect.x + rect.w; c += step) {
      hatch.push(...clipPolyline([[c, rect.y + rect.h], [c + rect.h, rect.y]], rect));
    }
    items.push(line('box-hatch', hatch, ink.mark, Math.max(0.25, 0.3 * lw), null, { data: { label: bx.label } }));
    items.push(rectPath('box', rect, { stroke: ink.mark, strokeWidth: markW, data: { label: bx.label } }));
    layout.soft.push(...boxSegments(rect));
    jobs.boxes.push({ rect, label: bx.label });
  }
}

/** Operating paths: the polyline, then an arrowhead at its end (stopping short of a point's dot). */
function pathMarks(ctx: SceneContext, items: SceneItem[], jobs: MarkJobs): void {
  const { input, fr, ink, lw, layout } = ctx;
  const markW = markWidth(lw);
  for (const p of input.paths ?? []) {
    if (p.points.length < 2) continue;
    const pieces = figLine(ctx, p.points);
    if (!pieces.length) continue;
    const last = pieces[pieces.length - 1]!;
    let tip = last[last.length - 1]!;
    const prev = last[last.length - 2]!;
    const len = Math.hypot(tip[0] - prev[0], tip[1] - prev[1]) || 1;
    const ux = (tip[0] - prev[0]) / len;
    const uy = (tip[1] - prev[1]) / len;
    const al = 2.6 * markW + 2.2;
    // A path that ends on an operating point stops at the marker's edge, so the arrowhead stays visible.
    const pointR = pointRadius(markW);
    const onPoint = (input.points ?? []).some((q) => {
      const [qx, qy] = fr.toFig([q.pH, q.E]);
      return Math.hypot(qx - tip[0], qy - tip[1]) < pointR;
    });
    if (onPoint && len > al + pointR + 0.5) {
      tip = [tip[0] - ux * (pointR + 0.5), tip[1] - uy * (pointR + 0.5)];
      last[last.length - 1] = tip;
    }
    items.push(line('path', pieces, ink.mark, markW, null, { lineJoin: 'round', lineCap: 'round', data: { label: p.label } }));
    const aw = 0.45 * al;
    items.push({
      type: 'path',
      role: 'arrow',
      subpaths: [{ points: [tip, [tip[0] - ux * al - uy * aw, tip[1] - uy * al + ux * aw], [tip[0] - ux * al + uy * aw, tip[1] - uy * al - ux * aw]], closed: true }],
      fill: ink.mark,
      stroke: null,
      strokeWidth: 0,
      dash: null,
    });
    layout.soft.push(...segsOf(pieces));
    jobs.arrowTips.push(inflate({ x: tip[0] - ux * al * 0.5, y: tip[1] - uy * al * 0.5, w: 0, h: 0 }, al * 0.5));
    jobs.paths.push({ start: pieces[0]![0]!, label: p.label, segs: segsOf(pieces) });
  }
}

/** Operating points inside the plot: a dot with a white rim; a soft square keeps region labels off it. */
function pointMarks(ctx: SceneContext, items: SceneItem[], jobs: MarkJobs): void {
  const { input, fr, plot, ink, lw, layout } = ctx;
  const r = pointRadius(markWidth(lw));
  for (const p of input.points ?? []) {
    const at = fr.toFig([p.pH, p.E]);
    if (at[0] < plot.x || at[0] > plot.x + plot.w || at[1] < plot.y || at[1] > plot.y + plot.h) continue;
    items.push({ type: 'circle', role: 'point', cx: at[0], cy: at[1], r, fill: ink.mark, stroke: '#ffffff', strokeWidth: 0.5, data: { label: p.label } });
    layout.soft.push(...boxSegments(inflate({ x: at[0], y: at[1], w: 0, h: 0 }, r + 0.5)));
    jobs.points.push({ at, label: p.label, r });
  }
}

/** Boxes, then paths, then points (the order of their items in the plot). */
export function buildMarks(ctx: SceneContext): { items: SceneItem[]; jobs: MarkJobs } {
  const items: SceneItem[] = [];
  const jobs: MarkJobs = { boxes: [], paths: [], arrowTips: [], points: [] };
  boxMarks(ctx, items, jobs);
  pathMarks(ctx, items, jobs);
  pointMarks(ctx, items, jobs);
  return { items, jobs };
}

/**
 * The family tags of the figure scene (family-tags.ts says where they may go): one tag per family
 * line that meets the plot frame, in the tag column of its preferred side, spread so that tags never
 * overlap; a tag moved off its line end gets a short leader in the family ink.
 */
import { nearestOnRect } from './geometry.js';
import { edgesAt, preferredEdge, spreadTags, tagGap, tagRuns, tagSize, type ColumnTag, type TagEdge } from './family-tags.js';
import { textBox } from './labels.js';
import { runsExtent, runsWidth, FONT_SAFETY } from './metrics.js';
import { line, text, type SceneContext } from './scene-context.js';
import type { Point, Rect, SceneItem, TextRun } from './scene-types.js';

/** A family line as the scene drew it: its activity and its pieces inside the plot (figure points). */
export interface FamilyTagJob {
  activity: number;
  pieces: Point[][];
}

interface Pending {
  runs: TextRun[];
  end: Point;
  activity: number;
  tag: ColumnTag;
}

/** Where a tag's box goes in its column, given its centre along the column. */
function tagBox(ctx: SceneContext, edge: TagEdge, centre: number, w: number, h: number): Rect {
  const { plot, tickLen } = ctx;
  const gap = tagGap(ctx.fs);
  if (edge === 'right') return { x: plot.x + plot.w + gap, y: centre - h / 2, w, h };
  if (edge === 'left') return { x: plot.x - tickLen - gap - w, y: centre - h / 2, w, h };
  if (edge === 'top') return { x: centre - w / 2, y: plot.y - gap - h, w, h };
  return { x: centre - w / 2, y: plot.y + plot.h + tickLen + gap, w, h };
}

/**
 * Places the tags: (1) each line's ends on the frame, the preferred side with a reserved column,
 * (2) per column, the tags spread along it (at most three tag sizes from their line end), (3) the
 * text items, with a leader where a tag had to move. Returns how many lines meeting the frame got
 * no tag (for the figure's note).
 */
export function familyTags(ctx: SceneContext, jobs: readonly FamilyTagJob[], out: SceneItem[]): number {
  const cols = ctx.bands.tagCols;
  // No column at all: the fitting left the tags out (and said so once).
  if (!Object.values(cols).some((c) => c > 0)) return 0;
  const size = tagSize(ctx.fs);
  const gap = tagGap(ctx.fs);
  const byEdge = new Map<TagEdge, Pending[]>();
  let missing = 0;
  // (1) Ends on the frame and the side each tag goes to.
  jobs.forEach((job, rank) => {
    const ends = job.pieces.flatMap((p) => (p.length >= 2 ? [p[0]!, p[p.length - 1]!] : []));
    const sides = ends.map((p) => edgesAt(p, ctx.plot, 0.01, false));
    if (!sides.some((s) => s.length)) return; // the line does not reach the frame
    const edge = preferredEdge(sides.flat(), (e) => cols[e] > 0);
    if (!edge) {
      missing++;
      return;
    }
    const end = ends[sides.findIndex((s) => s.includes(edge))]!;
    const runs = tagRuns(job.activity);
    const vertical = edge === 'left' || edge === 'right';
    const { top, bottom } = runsExtent(runs, size);
    const len = vertical ? bottom - top : runsWidth(runs, size) * FONT_SAFETY;
    const list = byEdge.get(edge) ?? [];
    list.push({ runs, end, activity: job.activity, tag: { at: vertical ? end[1] : end[0], len, rank } });
    byEdge.set(edge, list);
  });
  // (2)–(3) Per column, in a fixed order of sides.
  for (const edge of ['right', 'top', 'left', 'bottom'] as const) {
    const list = byEdge.get(edge);
    if (!list) continue;
    const vertical = edge === 'left' || edge === 'right';
    const [lo, hi] = vertical ? [ctx.plot.y, ctx.plot.y + ctx.plot.h] : [ctx.plot.x, ctx.plot.x + ctx.plot.w];
    const pos = spreadTags(list.map((p) => p.tag), lo, hi, gap, 3 * size);
    list.forEach((p, k) => {
      const c = pos[k];
      if (c === null || c === undefined) {
        missing++;
        return;
      }
      const w = runsWidth(p.runs, size) * FONT_SAFETY;
      const { top, bottom } = runsExtent(p.runs, size);
      const box = tagBox(ctx, edge, c, w, bottom - top);
      const baseline = box.y - top;
      const anchor = edge === 'left' ? 'end' : edge === 'right' ? 'start' : 'middle';
      const x = anchor === 'end' ? box.x + box.w : anchor === 'start' ? box.x : box.x + box.w / 2;
      const t = text('family-tag', p.runs, x, baseline, size, anchor, ctx.ink.text, { data: { activity: p.activity.toExponential(2), side: edge } });
      t.box = textBox(t.runs, size, x, baseline, anchor);
      out.push(t);
      if (Math.abs(c - p.tag.at) > 0.2 * p.tag.len) {
        out.push(line('family-tag-leader', [[p.end, nearestOnRect(p.end, box)]], ctx.ink.family, Math.max(0.25, 0.5 * ctx.thin), null, { lineCap: 'round' }));
      }
    });
  }
  return missing;
}

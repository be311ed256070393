/**
 * Region labels and the labels of the user's marks. Region labels go first (one per region in its
 * largest piece, then the other pieces where they fit), then the marks' labels (boxes, points,
 * paths: the user's own marks come before the water and family labels). A label over a soft line
 * gets a knock-out in the fill under it.
 */
import { inflate, segmentHitsRect, segmentsIntersect, type Segment } from './geometry.js';
import { placeMarkLabel } from './label-marks.js';
import { placeRegionLabels, type RegionLabelPlacement, type RegionLabelRequest } from './label-regions.js';
import { baselineForCentre } from './labels.js';
import { runsExtent } from './metrics.js';
import { MIN_FONT_PT } from './options.js';
import { knockout, line, text, type SceneContext } from './scene-context.js';
import { fillAt, polyArea, type RegionFills } from './scene-fills.js';
import { markWidth, type MarkJobs } from './scene-marks.js';
import type { Rect, SceneItem, TextRun } from './scene-types.js';
import { formulaRuns, plainRuns, richRuns } from './typeset.js';

/** Label requests: main pieces first, then by decreasing area (ties: region, piece order). */
function regionRequests(ctx: SceneContext, f: RegionFills): RegionLabelRequest[] {
  const pieces: { i: number; k: number; area: number; main: boolean }[] = [];
  ctx.model.regions.forEach((_, i) => {
    const areas = f.polys[i]!.map(polyArea);
    const mainK = areas.indexOf(Math.max(...areas));
    areas.forEach((area, k) => {
      if (area > 0) pieces.push({ i, k, area, main: k === mainK });
    });
  });
  pieces.sort((a, b) => Number(b.main) - Number(a.main) || b.area - a.area || a.i - b.i || a.k - b.k);
  // A numbered region (scene.ts: its name fits nowhere) shows its number; the legend keys it.
  const numbers = ctx.input.regionNumbers ?? [];
  const runsOf = (species: string): TextRun[] => (numbers.includes(species) ? plainRuns(String(numbers.indexOf(species) + 1)) : formulaRuns(species));
  return pieces.map(({ i, k, main }) => ({
    key: `${i}:${k}`,
    runs: runsOf(ctx.model.regions[i]!.species),
    ...(numbers.includes(ctx.model.regions[i]!.species) ? { keyed: true } : {}),
    rings: f.polys[i]![k]!,
    ...(main ? {} : { optional: true }),
  }));
}

/** Items of one placed region label: knock-out, text (horizontal or reading upwards), leader. */
function regionLabelItems(ctx: SceneContext, f: RegionFills, pl: RegionLabelPlacement, out: SceneItem[]): void {
  const { model, layout, ink, lw } = ctx;
  const ri = Number(pl.key.split(':')[0]);
  const r = model.regions[ri]!;
  if (layout.hits(pl.box, layout.soft) > 0) {
    // A soft line (water, family, …) runs under the label: knock it out with the fill under it.
    out.push(knockout(pl.box, pl.size, pl.leader ? fillAt(f, [pl.cx, pl.cy]) : (f.fills[ri] ?? '#ffffff')));
  }
  const n = (ctx.input.regionNumbers ?? []).indexOf(r.species);
  const data = { species: r.species, placement: pl.leader ? 'outside' : 'inside', ...(n >= 0 ? { number: String(n + 1) } : {}) };
  if (pl.angle === 0) {
    const base = baselineForCentre(pl.runs, pl.size, pl.cy);
    out.push(text('region-label', pl.runs, pl.cx, base, pl.size, 'middle', ink.text, { box: pl.box, data }));
  } else {
    // Reading upwards: the baseline is a vertical line right of the ink centre.
    const { top, bottom } = runsExtent(pl.runs, pl.size);
    out.push(text('region-label', pl.runs, pl.cx - (top + bottom) / 2, pl.cy, pl.size, 'middle', ink.text, { rotate: -90, data }));
  }
  if (pl.leader) {
    out.push(line('leader', [[pl.leader[0], pl.leader[1]]], ink.text, Math.max(0.3, 0.4 * lw), null, { lineCap: 'round', data: { species: r.species } }));
    out.push({ type: 'circle', role: 'leader-dot', cx: pl.leader[0][0], cy: pl.leader[0][1], r: Math.max(0.5, 0.55 * lw), fill: ink.text, stroke: null, strokeWidth: 0 });
  }
}

/**
 * Places and draws the region labels; returns the placements (overlay labels skip named fields)
 * and the species whose name found no free place (not yet numbered), in region order.
 */
export function regionLabels(ctx: SceneContext, f: RegionFills, out: SceneItem[]): { placements: (RegionLabelPlacement | null)[]; crowded: string[]; cramped: boolean } {
  const minLabel = Math.max(MIN_FONT_PT, 0.7 * ctx.fs);
  const placements = placeRegionLabels(ctx.layout, regionRequests(ctx, f), ctx.fs, minLabel);
  for (const pl of placements) if (pl) regionLabelItems(ctx, f, pl, out);
  const numbered = new Set(ctx.input.regionNumbers ?? []);
  const crowded = new Set<number>();
  for (const pl of placements) if (pl?.crowded && !numbered.has(ctx.model.regions[Number(pl.key.split(':')[0])]!.species)) crowded.add(Number(pl.key.split(':')[0]));
  // Safety net over the placer's own checks: a name whose leader strikes another label or crosses
  // another leader is numbered in the next pass like a name that found no place.
  // A number that still strikes or sits over something: the plot needs more room (scene.ts grows it).
  let cramped = placements.some((pl) => pl?.lastResort === true);
  for (const i of strayLeaders(placements)) {
    if (!numbered.has(ctx.model.regions[i]!.species)) crowded.add(i);
    else cramped = true;
  }
  return { placements, crowded: [...crowded].sort((a, b) => a - b).map((i) => ctx.model.regions[i]!.species).filter((s, k, all) => all.indexOf(s) === k), cramped };
}

/** Regions (by index) whose label's leader strikes another placed label's box or crosses another leader. */
function strayLeaders(placements: readonly (RegionLabelPlacement | null)[]): number[] {
  const placed = placements.filter((p): p is RegionLabelPlacement => p !== null);
  const shrink = (r: Rect): Rect => ({ x: r.x + 0.05, y: r.y + 0.05, w: Math.max(0, r.w - 0.1), h: Math.max(0, r.h - 0.1) });
  const out: number[] = [];
  for (const p of placed) {
    if (!p.leader) continue;
    const [a, b] = p.leader;
    const strikes = placed.some((q) => q !== p && segmentHitsRect(a, b, shrink(q.box)));
    const crosses = placed.some((q) => q !== p && q.leader !== undefined && segmentsIntersect(a, b, q.leader[0], q.leader[1]));
    if (strikes || crosses) out.push(Number(p.key.split(':')[0]));
  }
  return out;
}

/** One mark's label at the small size, with a knock-out over soft lines and a leader if moved away. */
function markLabel(ctx: SceneContext, f: RegionFills, out: SceneItem[], role: string, label: string, mark: Rect, kind: 'point' | 'box', own: Segment[] = []): void {
  const { small, ink, lw, layout } = ctx;
  const runs = richRuns(label);
  const pl = placeMarkLabel(layout, runs, small, mark, kind, role, own);
  if (pl.overSoft) out.push(knockout(pl.box, small, fillAt(f, [pl.cx, pl.cy])));
  out.push(text(role, runs, pl.cx, baselineForCentre(runs, small, pl.cy), small, 'middle', ink.text, { box: pl.box, data: { label } }));
  if (pl.leader) out.push(line('leader', [[pl.leader[0], pl.leader[1]]], ink.mark, Math.max(0.3, 0.4 * lw), null, { lineCap: 'round', data: { label } }));
}

/**
 * Every mark's own box joins the layout (before the region labels, so that their leaders keep off
 * the marks).
 */
export function registerMarks(ctx: SceneContext, jobs: MarkJobs): void {
  const { layout } = ctx;
  for (const pj of jobs.points) layout.addBox(inflate({ x: pj.at[0], y: pj.at[1], w: 0, h: 0 }, pj.r + 0.3), 'point');
  for (const bj of jobs.boxes) layout.addBox(bj.rect, 'box');
  for (const tip of jobs.arrowTips) layout.addBox(tip, 'arrow');
}

/**
 * The marks' labels (their boxes already in the layout: registerMarks): boxes are labelled first
 * (their labels have the fewest good places), then points, then paths (at their start).
 */
export function markLabels(ctx: SceneContext, f: RegionFills, jobs: MarkJobs, out: SceneItem[]): void {
  const markW = markWidth(ctx.lw);
  for (const bj of jobs.boxes) markLabel(ctx, f, out, 'box-label', bj.label, bj.rect, 'box');
  for (const pj of jobs.points) markLabel(ctx, f, out, 'point-label', pj.label, inflate({ x: pj.at[0], y: pj.at[1], w: 0, h: 0 }, pj.r + 0.3), 'point');
  for (const pj of jobs.paths) markLabel(ctx, f, out, 'path-label', pj.label, inflate({ x: pj.start[0], y: pj.start[1], w: 0, h: 0 }, markW + 1), 'point', pj.segs);
}

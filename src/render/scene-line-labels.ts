/**
 * Labels of the lines, placed after the region and mark labels, each only where it fits clear of
 * every line and label: water couples along their lines, overlay layers' region formulas,
 * "neutral" beside its line, ligand fields at their pole. (Family lines get tags in the margin:
 * scene-family-tags.ts.)
 */
import { pointAlong, polylineLength } from './geometry.js';
import { rectPole } from './pole.js';
import { placeLayerLabels, type LayerLabelRequest } from './label-marks.js';
import type { RegionLabelPlacement } from './label-regions.js';
import { baselineForCentre, boxSegments, firstFree, orientedBounds, type OrientedBox } from './labels.js';
import { FONT_SAFETY, runsExtent, runsWidth } from './metrics.js';
import { MIN_FONT_PT } from './options.js';
import { textInk } from './palette.js';
import { overlayInk, segsOf, text, type SceneContext } from './scene-context.js';
import { clipPolygons, polyArea } from './scene-fills.js';
import type { Point, SceneItem, SceneText, TextRun } from './scene-types.js';
import { formulaRuns, plainRuns, richRuns } from './typeset.js';

/** A small label centred on an oriented box (baseline placed so the ink box is centred, rotated). */
function smallLabel(ctx: SceneContext, role: string, runs: TextRun[], size: number, ob: OrientedBox, data?: Record<string, string>): SceneText {
  const { top, bottom } = runsExtent(runs, size);
  const a = (ob.angle * Math.PI) / 180;
  const off = -(top + bottom) / 2;
  const bx = ob.cx - Math.sin(a) * off;
  const by = ob.cy + Math.cos(a) * off;
  const fill = role === 'water-label' ? ctx.ink.water : role === 'iso-label' ? ctx.ink.iso : ctx.ink.text;
  return text(role, runs, bx, by, size, 'middle', fill, { rotate: ob.angle, ...(ob.angle === 0 ? { box: orientedBounds(ob) } : {}), ...(data ? { data } : {}) });
}

/** Candidate boxes beside the longest piece at the given fractions of its length, on one side. */
export function alongLine(ctx: SceneContext, pieces: Point[][], runs: TextRun[], size: number, side: -1 | 1, fractions: number[], rotate: boolean): OrientedBox[] {
  const longest = [...pieces].sort((a, b) => polylineLength(b) - polylineLength(a))[0];
  if (!longest) return [];
  const gapLine = 0.28 * ctx.fs;
  const w = (runsWidth(runs, size) * FONT_SAFETY) / 2 + 0.1 * size;
  const { top, bottom } = runsExtent(runs, size);
  const h = (bottom - top) / 2 + 0.05 * size;
  const out: OrientedBox[] = [];
  for (const f of fractions) {
    const { p, dir } = pointAlong(longest, f);
    let d = dir;
    if (d[0] < 0) d = [-d[0], -d[1]];
    // Normal pointing up the page (side = 1) or down (side = −1).
    const n: Point = [d[1], -d[0]];
    if (rotate) {
      const dist = gapLine + h;
      out.push({ cx: p[0] + n[0] * dist * side, cy: p[1] + n[1] * dist * side, hx: w, hy: h, angle: (Math.atan2(d[1], d[0]) * 180) / Math.PI });
    } else {
      // Unrotated: move out along the normal until the box clears the line.
      const dist = gapLine + Math.abs(n[0]) * w + Math.abs(n[1]) * h;
      out.push({ cx: p[0] + n[0] * dist * side, cy: p[1] + n[1] * dist * side, hx: w, hy: h, angle: 0 });
    }
  }
  return out;
}

/** Unrotated boxes just past either end of the longest piece, along its direction (end first). */
export function beyondEnds(pieces: Point[][], runs: TextRun[], size: number): OrientedBox[] {
  const longest = [...pieces].sort((a, b) => polylineLength(b) - polylineLength(a))[0];
  if (!longest || longest.length < 2) return [];
  const w = (runsWidth(runs, size) * FONT_SAFETY) / 2 + 0.1 * size;
  const { top, bottom } = runsExtent(runs, size);
  const h = (bottom - top) / 2;
  const out: OrientedBox[] = [];
  const ends: [Point, Point][] = [
    [longest[longest.length - 1]!, longest[longest.length - 2]!],
    [longest[0]!, longest[1]!],
  ];
  for (const [end, prev] of ends) {
    const l = Math.hypot(end[0] - prev[0], end[1] - prev[1]) || 1;
    const u: Point = [(end[0] - prev[0]) / l, (end[1] - prev[1]) / l];
    const dist = 0.35 * size + Math.abs(u[0]) * w + Math.abs(u[1]) * h;
    out.push({ cx: end[0] + u[0] * dist, cy: end[1] + u[1] * dist, hx: w, hy: h, angle: 0 });
  }
  return out;
}

/** Places the first free candidate (if any) as a small label and reserves its box. */
export function placeFirst(ctx: SceneContext, out: SceneItem[], role: string, runs: TextRun[], size: number, cands: OrientedBox[], idx: number, data?: Record<string, string>): void {
  if (idx < 0) return;
  const ob = cands[idx]!;
  out.push(smallLabel(ctx, role, runs, size, ob, data));
  ctx.layout.addBox(orientedBounds(ob), role);
}

/** "O₂" above the oxygen line and "H₂" below the hydrogen line, turned along them. */
export function waterLabels(ctx: SceneContext, hw: Point[][], ow: Point[][], out: SceneItem[]): void {
  if (!ctx.o.show.water) return;
  const { fs, small, layout } = ctx;
  const fractions = [0.93, 0.86, 0.07, 0.14, 0.78, 0.22, 0.7, 0.3, 0.62, 0.38, 0.5];
  const jobs: { pieces: Point[][]; text: string; side: -1 | 1; couple: string }[] = [
    { pieces: ow, text: '{O2}', side: 1, couple: 'O2/H2O' },
    { pieces: hw, text: '{H2}', side: -1, couple: 'H2/H2O' },
  ];
  for (const j of jobs) {
    const runs = richRuns(j.text);
    const cands = alongLine(ctx, j.pieces, runs, small, j.side, fractions, true);
    const own = segsOf(j.pieces);
    let idx = firstFree(layout, cands, 0.15 * fs, true, own);
    if (idx < 0) idx = firstFree(layout, cands, 0.1 * fs, false, own);
    placeFirst(ctx, out, 'water-label', runs, small, cands, idx, { couple: j.couple });
  }
}

/**
 * Overlay layers' region formulas in each layer's ink, largest regions first over all layers (ties:
 * earlier layer), so every layer gets its main fields named before any gets its small ones. Fields
 * of a species the base already names nearby are skipped.
 */
export function overlayLabels(ctx: SceneContext, placements: (RegionLabelPlacement | null)[], out: SceneItem[]): void {
  const { input, model, fs, ink, layout } = ctx;
  const size = Math.max(MIN_FONT_PT, fs * 0.75);
  const jobs: { req: LayerLabelRequest; area: number; layer: number; region: number; species: string }[] = [];
  (input.overlays ?? []).forEach((ov, li) => {
    // The layer is drawn in the base's frame (its points mapped with the base's scales).
    ov.model.regions.forEach((r, ri) => {
      const pieces = clipPolygons(ctx, r.polygons)
        .map((rings) => ({ rings, area: polyArea(rings) }))
        .filter((pc) => pc.area > 0)
        .sort((a, b) => b.area - a.area);
      if (!pieces.length) return;
      jobs.push({ req: { key: `${li}:${ri}`, name: r.species, runs: formulaRuns(r.species), pieces: pieces.map((pc) => pc.rings) }, area: pieces[0]!.area, layer: li, region: ri, species: r.species });
    });
  });
  jobs.sort((a, b) => b.area - a.area || a.layer - b.layer || a.region - b.region);
  const named = placements.flatMap((pl) => (pl ? [{ name: model.regions[Number(pl.key.split(':')[0])]!.species, at: pl.leader ? pl.leader[0] : ([pl.cx, pl.cy] as Point) }] : []));
  const placed = placeLayerLabels(layout, jobs.map((j) => j.req), size, 0.15 * fs, named);
  placed.forEach((pl, k) => {
    if (!pl) return;
    const j = jobs[k]!;
    const ov = input.overlays![j.layer]!;
    const runs = j.req.runs;
    out.push(text('overlay-label', runs, pl.cx, baselineForCentre(runs, size, pl.cy), size, 'middle', textInk(overlayInk(ink, ov, j.layer)), { box: pl.box, data: { species: j.species, layer: ov.label } }));
  });
}

/** "neutral" reading upwards beside the neutral line, tried from the ends inwards. */
export function neutralLabel(ctx: SceneContext, piece: Point[] | null, out: SceneItem[]): void {
  if (!piece) return;
  const { fs, plot } = ctx;
  const famSize = Math.max(MIN_FONT_PT, fs * 0.75);
  const runs = plainRuns('neutral', true);
  const w = (runsWidth(runs, famSize) * FONT_SAFETY) / 2 + 0.1 * famSize;
  const { top, bottom } = runsExtent(runs, famSize);
  const h = (bottom - top) / 2;
  const x = piece[0]![0];
  const cands: OrientedBox[] = [];
  for (const f of [0.08, 0.92, 0.2, 0.8, 0.35, 0.65, 0.5]) {
    const cy = plot.y + plot.h * (1 - f);
    for (const side of [1, -1]) cands.push({ cx: x + side * (h + 0.3 * fs), cy, hx: w, hy: h, angle: -90 });
  }
  placeFirst(ctx, out, 'neutral-label', runs, famSize, cands, firstFree(ctx.layout, cands, 0.1 * fs, false));
}

/** Ligand field formulas at the pole of their field, only where they fit whole and clear. */
export function ligandLabels(ctx: SceneContext, reqs: { runs: TextRun[]; rings: Point[][] }[], out: SceneItem[]): void {
  const { fs, layout, ink } = ctx;
  const size = Math.max(MIN_FONT_PT, fs * 0.75);
  for (const lj of reqs) {
    const w = (runsWidth(lj.runs, size) * FONT_SAFETY) / 2 + 0.2 * size;
    const { top, bottom } = runsExtent(lj.runs, size);
    const h = (bottom - top) / 2 + 0.15 * size;
    const boxSegs = layout.boxes.flatMap((b) => boxSegments(b.rect));
    const pole = rectPole(lj.rings, [...layout.hard, ...layout.soft, ...boxSegs], w, h);
    if (pole.scale < 1) continue;
    const ob: OrientedBox = { cx: pole.point[0], cy: pole.point[1], hx: w - 0.2 * size, hy: h - 0.15 * size, angle: 0 };
    if (!layout.boxFree(orientedBounds(ob), 0.1 * fs)) continue;
    const t = smallLabel(ctx, 'ligand-label', lj.runs, size, ob);
    t.fill = ink.ligand;
    out.push(t);
    layout.addBox(orientedBounds(ob), 'ligand-label');
  }
}

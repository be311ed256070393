/**
 * The lines of the plot: ligand predominance edges, grid, other-activity families, water limits,
 * neutral pH, overlay layers, boundaries and triple points. Each builder registers its lines with
 * the label layout (boundaries and region edges as hard obstacles, the others as soft ones that a
 * label may cover with a knock-out) and returns its items and what its labels need later.
 */
import { clipRing } from './clip.js';
import { polylineSegments, ringSegments, type Segment } from './geometry.js';
import { coincides, dashStroke, figLine, line, onFrame, overlayInk, parseDash, segsOf, type SceneContext } from './scene-context.js';
import type { Point, SceneItem, TextRun } from './scene-types.js';
import { formulaRuns } from './typeset.js';
import { movingSpecies } from './family-tags.js';

/** Ligand predominance fields: dotted edges under everything, and their label requests. */
export function ligandLines(ctx: SceneContext): { items: SceneItem[]; labels: { runs: TextRun[]; rings: Point[][] }[] } {
  const { o, model, fr, plot, ink, thin, k } = ctx;
  const items: SceneItem[] = [];
  const labels: { runs: TextRun[]; rings: Point[][] }[] = [];
  if (!o.show.ligands || !model.ligandRegions) return { items, labels };
  for (const el of Object.keys(model.ligandRegions).sort()) {
    for (const lr of model.ligandRegions[el]!) {
      const rings = lr.polygons.flatMap((poly) => poly.map((ring) => clipRing(ring.map((p) => fr.toFig(p)), plot)).filter((g) => g.length >= 3));
      if (rings.length === 0) continue;
      const edges = ringSegments(rings).filter(([a, b]) => !onFrame(a, b, plot));
      // Dash-dot, so that it never reads as the dotted neutral-pH line (keyed in the legend).
      if (edges.length) items.push(line('ligand-boundary', edges.map(([a, b]) => [a, b]), ink.ligand, thin * 0.8, ligandDash(k), { lineCap: 'round', data: { element: el } }));
      labels.push({ runs: formulaRuns(lr.species), rings });
    }
  }
  return { items, labels };
}

/** Dash of the ligand acid–base boundaries: dash-dot (a dot needs round caps). */
export const ligandDash = (k: number): number[] => [2.4 * k, 1.3 * k, 0.01, 1.3 * k];

/** Dash of the neutral-pH line: dotted. */
export const neutralDash = (k: number): number[] => [0.01, 1.6 * k];

/** Whether the ligand underlay is drawn (show.ligands and a ligand field exists). */
export const drawsLigands = (o: { show: { ligands: boolean } }, model: { ligandRegions?: Record<string, unknown[]> }): boolean =>
  o.show.ligands && Object.values(model.ligandRegions ?? {}).some((r) => r.length > 0);

/** Grid lines at the inner ticks (when show.grid). */
export function gridLines(ctx: SceneContext): SceneItem[] {
  const { o, model, fr, plot, ink, lw, bands } = ctx;
  if (!o.show.grid) return [];
  const [pH0, pH1] = model.domain.pH;
  const [E0, E1] = model.domain.E;
  const pieces: Point[][] = [];
  for (const t of bands.xTicks) if (t.value > pH0 && t.value < pH1) pieces.push([[fr.x(t.value), plot.y], [fr.x(t.value), plot.y + plot.h]]);
  for (const t of bands.yTicks) if (t.value > E0 && t.value < E1) pieces.push([[plot.x, fr.y(t.value)], [plot.x + plot.w, fr.y(t.value)]]);
  return [line('grid', pieces, ink.grid, Math.max(0.25, 0.35 * lw), null)];
}

/** Boundaries at other activities (pieces that coincide with a main boundary left out); soft. */
export function familyLines(ctx: SceneContext): { items: SceneItem[]; labels: { activity: number; pieces: Point[][] }[] } {
  const { input, model, ink, thin, layout } = ctx;
  const items: SceneItem[] = [];
  const labels: { activity: number; pieces: Point[][] }[] = [];
  const mainSegs: Segment[] = model.boundaries.flatMap((b) => segsOf(figLine(ctx, b.points)));
  // Only a line with a dissolved species of the element on one side moves with its activity; the
  // others (solid/solid, solid/metal) are drawn where they extend but not tagged.
  const dissolved = movingSpecies(model);
  for (const fam of input.families ?? []) {
    for (const b of fam.boundaries) {
      const pieces = figLine(ctx, b.points).filter((p) => !coincides(p, mainSegs, 0.4));
      if (!pieces.length) continue;
      items.push(line('family', pieces, ink.family, thin, null, { lineCap: 'round', data: { activity: fam.activity.toExponential(2) } }));
      layout.soft.push(...segsOf(pieces));
      if (b.between.some((f) => dissolved.has(f))) labels.push({ activity: fam.activity, pieces });
    }
  }
  return { items, labels };
}

/** The water stability limits (H₂ and O₂ lines), dashed; soft. The pieces are returned for labels. */
export function waterLines(ctx: SceneContext): { items: SceneItem[]; hw: Point[][]; ow: Point[][] } {
  const { o, model, ink, lw, waterDash, layout } = ctx;
  const hw = figLine(ctx, model.waterLines.hydrogen.points);
  const ow = figLine(ctx, model.waterLines.oxygen.points);
  const items: SceneItem[] = [];
  if (o.show.water) {
    items.push(line('water', hw, ink.water, 0.75 * lw, waterDash, { data: { couple: 'H2/H2O' } }));
    items.push(line('water', ow, ink.water, 0.75 * lw, waterDash, { data: { couple: 'O2/H2O' } }));
    layout.soft.push(...segsOf(hw), ...segsOf(ow));
  }
  return { items, hw, ow };
}

/** Dotted vertical line at the pH of neutral water (when shown and inside the domain); soft. */
export function neutralLine(ctx: SceneContext): { items: SceneItem[]; piece: Point[] | null } {
  const { o, input, model, fr, plot, ink, lw, k, layout } = ctx;
  const [pH0, pH1] = model.domain.pH;
  if (!(o.show.neutral && input.neutralPH !== undefined && input.neutralPH > pH0 && input.neutralPH < pH1)) return { items: [], piece: null };
  const x = fr.x(input.neutralPH);
  const piece: Point[] = [
    [x, plot.y + plot.h],
    [x, plot.y],
  ];
  layout.soft.push(...polylineSegments(piece));
  return { items: [line('neutral', [piece], ink.family, Math.max(0.5, 0.7 * lw), neutralDash(k), { lineCap: 'round' })], piece };
}

/** Overlay layers' boundaries in their dash and ink; soft. */
export function overlayLines(ctx: SceneContext): SceneItem[] {
  const { input, ink, lw, layout } = ctx;
  const items: SceneItem[] = [];
  (input.overlays ?? []).forEach((ov, i) => {
    const pieces = ov.model.boundaries.flatMap((b) => figLine(ctx, b.points));
    if (!pieces.length) return;
    const st = dashStroke(parseDash(ov.dash, lw), 0.8 * lw);
    items.push(line('overlay', pieces, overlayInk(ink, ov, i), 0.8 * lw, st.dash, { lineCap: st.lineCap, lineJoin: 'round', data: { label: ov.label } }));
    layout.soft.push(...segsOf(pieces));
  });
  return items;
}

/** The boundaries (hard), then region edges not on a boundary (e.g. the solver's outline), hard too. */
export function boundaryLines(ctx: SceneContext, regionRings: Point[][][]): SceneItem[] {
  const { model, ink, lw, layout, plot } = ctx;
  const items: SceneItem[] = [];
  for (const b of model.boundaries) {
    const pieces = figLine(ctx, b.points);
    if (!pieces.length) continue;
    items.push(line('boundary', pieces, ink.boundary, lw, null, { lineCap: 'round', lineJoin: 'round', data: { between: b.between.join('|') } }));
    layout.hard.push(...segsOf(pieces));
  }
  for (const rings of regionRings) for (const s of ringSegments(rings)) if (!onFrame(s[0], s[1], plot)) layout.hard.push(s);
  return items;
}

/** Dots at the triple points inside the plot (when show.triplePoints). */
export function triplePoints(ctx: SceneContext): SceneItem[] {
  const { o, model, fr, plot, ink, lw } = ctx;
  if (!o.show.triplePoints) return [];
  const items: SceneItem[] = [];
  for (const t of model.triplePoints) {
    const [cx, cy] = fr.toFig([t.pH, t.E]);
    if (cx < plot.x || cx > plot.x + plot.w || cy < plot.y || cy > plot.y + plot.h) continue;
    items.push({ type: 'circle', role: 'triple-point', cx, cy, r: 0.9 * lw + 0.5, fill: ink.boundary, stroke: null, strokeWidth: 0, data: { species: t.species.join('|') } });
  }
  return items;
}

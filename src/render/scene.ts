/**
 * Builds the renderer-neutral scene of a diagram figure: frame, axes, region fills, lines,
 * labels, legend and caption, in points (1/72 in) with the origin at the top left. Pure: no I/O.
 * Each layer has its own builder (scene-*.ts), all sharing one SceneContext.
 */
import { Layout } from './labels.js';
import { axisItems, titleItems } from './scene-axes.js';
import { makeFrame, type FigureInput, type SceneContext } from './scene-context.js';
import { buildFills } from './scene-fills.js';
import { isoLabels, isoLines, undeterminedFills } from './scene-iso.js';
import { fitFigure } from './scene-fit.js';
import { captionItems, legendItems } from './scene-legend.js';
import { ligandLabels, neutralLabel, overlayLabels, waterLabels } from './scene-line-labels.js';
import { boundaryLines, familyLines, gridLines, ligandLines, neutralLine, overlayLines, triplePoints, waterLines } from './scene-lines.js';
import { buildMarks } from './scene-marks.js';
import { familyTags } from './scene-family-tags.js';
import { markLabels, regionLabels, registerMarks } from './scene-labels.js';
import type { Scene, SceneItem } from './scene-types.js';
import { runsUnicode } from './typeset.js';

export type { Scene, SceneItem, ScenePath, SceneText, SceneCircle, SceneGroup, TextRun, Rect, Point, PlotFrame } from './scene-types.js';
export type { FigureInput } from './scene-context.js';
export { dashStroke, parseDash, wrapText } from './scene-context.js';
export { CAUTION } from './scene-legend.js';

/** Passes of buildScene at most: the first, then up to five with more regions numbered. */
const NUMBERING_PASSES = 6;

/**
 * Builds the figure scene, squeezed to fit its size (scene-fit.ts; the steps taken are in
 * `notes`). Region names that fit nowhere (not inside, not outside with a leader, at the smallest
 * size) are replaced by numbers keyed in the legend ("1 Cr₂O₃ + Fe₃O₄ + Ni"): the figure is laid
 * out again with the key (which takes room, so more regions may need numbers: up to
 * NUMBERING_PASSES passes), reported once as a note. Throws FigureFitError (naming the option) for
 * a request that cannot fit, Error for other invalid options.
 */
export function buildScene(input: FigureInput): Scene {
  let inp = input;
  for (let pass = 1; ; pass++) {
    const { scene, crowded, cramped } = buildOnce(inp);
    const last = pass === NUMBERING_PASSES;
    if (!last && crowded.length) {
      inp = { ...inp, regionNumbers: [...(inp.regionNumbers ?? []), ...crowded] };
      continue;
    }
    if (!last && cramped) {
      // Even the numbers found no free place: grow the height (a fitting step of its own) and lay out again.
      inp = { ...inp, options: { ...inp.options, height: Math.round(Math.max(inp.options.height, scene.heightMm) * 1.2) } };
      continue;
    }
    const n = inp.regionNumbers?.length ?? 0;
    if (n > (input.regionNumbers?.length ?? 0)) scene.notes.push(`${n} region${n > 1 ? 's' : ''} numbered (names in the legend key) where the names did not fit`);
    if (inp.options.height > input.options.height) scene.notes.push(`height grown from ${input.options.height} to ${inp.options.height} mm to give the numbered regions room`);
    return scene;
  }
}

/** One layout of the figure; `crowded`: region names that found no free place (not numbered yet). */
function buildOnce(input: FigureInput): { scene: Scene; crowded: string[]; cramped: boolean } {
  // (1)–(2) Sizes, inks and the layout of the bands and the plot, squeezed to fit; (3) the context.
  const { base, bands, notes, droppedCaption } = fitFigure(input);
  const plot = bands.plot;
  const ctx: SceneContext = { ...base, bands, plot, fr: makeFrame(base.model, plot), layout: new Layout(plot, { x: 0, y: 0, w: base.W, h: base.H }) };
  // (4) Fills, then the lines in drawing order (each registers its obstacles with the layout).
  const fills = buildFills(ctx);
  const undetermined = undeterminedFills(ctx);
  const ligands = ligandLines(ctx);
  const grid = gridLines(ctx);
  const families = familyLines(ctx);
  const water = waterLines(ctx);
  const iso = isoLines(ctx);
  const neutral = neutralLine(ctx);
  const overlays = overlayLines(ctx);
  const boundaries = boundaryLines(ctx, fills.rings);
  const triples = triplePoints(ctx);
  // (5) The user's marks.
  const marks = buildMarks(ctx);
  // (6) Labels: regions, marks, then the lines' labels where they still fit.
  const labelItems: SceneItem[] = [];
  registerMarks(ctx, marks.jobs);
  const { placements, crowded, cramped } = regionLabels(ctx, fills, labelItems);
  markLabels(ctx, fills, marks.jobs, labelItems);
  waterLabels(ctx, water.hw, water.ow, labelItems);
  overlayLabels(ctx, placements, labelItems);
  isoLabels(ctx, iso.labels, labelItems);
  neutralLabel(ctx, neutral.piece, labelItems);
  ligandLabels(ctx, ligands.labels, labelItems);
  // (6b) The family tags in the margins (never along the lines).
  const tagItems: SceneItem[] = [];
  const untagged = familyTags(ctx, families.labels, tagItems);
  if (untagged > 0) notes.push(`${untagged} family tag${untagged > 1 ? 's' : ''} left out for want of room in the margin (the legend key lists the activities)`);
  // (7) Assembly: the plot (clipped), axes, labels, then title, legend and caption.
  const plotChildren = [...fills.items, ...undetermined, ...ligands.items, ...grid, ...families.items, ...water.items, ...iso.items, ...neutral.items, ...overlays, ...boundaries, ...triples, ...marks.items];
  const items: SceneItem[] = [
    { type: 'group', role: 'plot', clip: plot, children: plotChildren },
    { type: 'group', role: 'axes', children: axisItems(ctx) },
    { type: 'group', role: 'labels', children: [...labelItems, ...tagItems] },
    { type: 'group', role: 'annotations', children: [...titleItems(ctx), ...legendItems(ctx, fills.fills), ...captionItems(ctx)] },
  ];
  const o = base.o;
  const scene: Scene = {
    widthPt: base.W,
    heightPt: base.H,
    widthMm: o.width,
    heightMm: o.height,
    fontFamily: o.fontFamily,
    background: '#ffffff',
    plot,
    frame: { x0: plot.x, x1: plot.x + plot.w, y0: plot.y + plot.h, y1: plot.y, pH: [base.model.domain.pH[0], base.model.domain.pH[1]], E: [base.model.domain.E[0], base.model.domain.E[1]] },
    items,
    title: runsUnicode(bands.titleRuns),
    notes,
    ...(droppedCaption !== undefined ? { caption: droppedCaption } : {}),
  };
  return { scene, crowded, cramped };
}

/**
 * Figure layout: tick values, the margins they need, the bands below the plot (axis title,
 * legend, caption) and above it (title), and so the plot rectangle. The fitting steps (scene-fit.ts) decide what
 * to squeeze when the plot would be too small.
 */
import { niceTicks, type Tick } from './axes.js';
import { CAP_HEIGHT, DESCENT, FONT_SAFETY, stringWidth } from './metrics.js';
import { MIN_FONT_PT } from './options.js';
import type { FigureBands, SceneBase } from './scene-context.js';
import { captionLines, legendEntries, legendRows } from './scene-legend.js';
import { NO_TAG_COLUMNS, tagColumns, type TagColumns } from './family-tags.js';
import type { Rect } from './scene-types.js';
import { richRuns } from './typeset.js';
import { fitTitle } from './title-wrap.js';

/** Tick values, their counts from a first guess of the plot size. */
function axisTicks(b: SceneBase): { xTicks: Tick[]; yTicks: Tick[]; y2Ticks: Tick[]; off: number } {
  const { o, model, W, H, fs } = b;
  const [pH0, pH1] = model.domain.pH;
  const [E0, E1] = model.domain.E;
  const guessW = W * 0.78;
  const guessH = H * 0.62;
  const off = o.secondAxis?.offset ?? 0;
  return {
    xTicks: niceTicks(pH0, pH1, guessW / (fs * 4.2)),
    yTicks: niceTicks(E0, E1, guessH / (fs * 2.8)),
    y2Ticks: o.secondAxis ? niceTicks(E0 - off, E1 - off, guessH / (fs * 2.8)) : [],
    off,
  };
}

/** Left and right margins: axis title band, tick labels, gap and tick (or the last x label's overhang). */
function sideMargins(b: SceneBase, t: ReturnType<typeof axisTicks>, tags: TagColumns): { left: number; right: number } {
  const { o, model, fs, pad, tickGap, tickLen } = b;
  const tickW = (ts: Tick[]): number => Math.max(0, ...ts.map((k) => stringWidth(k.label, fs) * FONT_SAFETY));
  const titleBand = fs * 1.05; // rotated axis title thickness
  const left = pad + titleBand + 0.45 * fs + tickW(t.yTicks) + tickGap + tickLen + tags.left;
  const lastX = t.xTicks[t.xTicks.length - 1];
  const xOverhang = lastX && Math.abs(lastX.value - model.domain.pH[1]) < 1e-9 ? (stringWidth(lastX.label, fs) * FONT_SAFETY) / 2 : 0;
  const right = o.secondAxis ? pad + titleBand + 0.45 * fs + tickW(t.y2Ticks) + tickGap + tickLen : Math.max(0.9 * fs, xOverhang + pad, tags.right + pad);
  return { left, right };
}

/** How hard the layout squeezes: set by the fitting steps of scene-fit.ts. */
export interface LayoutPlan {
  /** Smallest title size the title may shrink to (pt). */
  titleFloor: number;
  /** Legend folded: set at the smallest font with tight spacing. */
  foldLegend: boolean;
  /** Caption left out of the drawing (kept in the figure's metadata). */
  dropCaption: boolean;
  /** Family tags left out of the margins (the legend key still lists the activities). */
  dropTags: boolean;
}

export const PLAN_AS_GIVEN: LayoutPlan = { titleFloor: MIN_FONT_PT, foldLegend: false, dropCaption: false, dropTags: false };

/** Smallest plot the layout accepts, in font sizes: 12 across, 10 down. */
export const MIN_PLOT_W_FS = 12;
export const MIN_PLOT_H_FS = 10;

/**
 * Lays the figure out: (1) ticks, (2) side margins, (3) the title fitted to the width (wrapped,
 * shrunk, cut), caption and legend rows at the inner width, (4) the bands from the top (title) and
 * from the plot's bottom edge down (tick labels, axis title, legend, caption), (5) the plot
 * rectangle between them. The family tags' columns (family-tags.ts) widen the margins they sit in. `fits` says whether the plot keeps at least MIN_PLOT_W_FS × MIN_PLOT_H_FS
 * font sizes; `below`/`top` let the fitting steps compute the height needed.
 */
export function layoutFigure(b: SceneBase, plan: LayoutPlan = PLAN_AS_GIVEN): FigureBands & { fits: { w: boolean; h: boolean }; titleSteps: string[]; chrome: number } {
  const { o, model, W, H, fs, pad, tickLen, tickGap } = b;
  const ticks = axisTicks(b);
  // Tag columns of the family lines (family-tags.ts), reserved beside the frame.
  const tagCols = plan.dropTags ? { ...NO_TAG_COLUMNS } : tagColumns(b);
  const tagged = Object.values(tagCols).some((c) => c > 0);
  const { left, right } = sideMargins(b, ticks, tagCols);
  const innerW = W - 2 * pad;
  const capSize = Math.max(MIN_FONT_PT, fs * 0.85);
  const capLead = capSize * 1.28;
  const caption = plan.dropCaption ? [] : captionLines(b, capSize, innerW);
  const legSize = plan.foldLegend ? MIN_FONT_PT : b.small;
  const legRowH = legSize * (plan.foldLegend ? 1.3 : 1.45);
  const rows = legendRows(legendEntries(b, tagged), legSize, innerW, plan.foldLegend ? 0.8 : 1.4);
  const showTitle = o.show.title;
  const titleRuns = o.title !== undefined ? richRuns(o.title) : richRuns(`${model.element}\u2013{H2O}, ${model.temperature.celsius.toFixed(0)} \u00b0C`);
  const title = showTitle ? fitTitle(titleRuns, fs * 1.1, innerW, Math.min(fs * 1.1, plan.titleFloor)) : { lines: [], size: fs * 1.1, steps: [] };
  const titleSize = title.size;
  const titleLead = titleSize * 1.2;
  // Title band: the last title line's cap height and descent, then room for the top E tick label's upper half.
  const top = (showTitle ? pad + (CAP_HEIGHT + DESCENT) * titleSize + (title.lines.length - 1) * titleLead + 0.6 * fs : Math.max(pad, 0.65 * fs)) + tagCols.top;
  const xLabelBase = tickLen + tagCols.bottom + tickGap + CAP_HEIGHT * fs; // below plot bottom
  const xTitleBase = xLabelBase + 0.5 * fs + CAP_HEIGHT * fs * 1.05 + 0.25 * fs;
  let below = xTitleBase + 0.25 * fs;
  const legendTop = below + (rows.length ? 0.5 * fs : 0);
  below = legendTop + rows.length * legRowH;
  const captionTop = below + (caption.length ? 0.45 * fs : 0);
  below = captionTop + caption.length * capLead + pad * 0.6;
  const plot: Rect = { x: left, y: top, w: W - left - right, h: H - top - below };
  const fits = { w: plot.w >= MIN_PLOT_W_FS * fs, h: plot.h >= MIN_PLOT_H_FS * fs };
  return {
    ...ticks, showTitle, titleSize, titleRuns, titleLines: title.lines, titleLead, xLabelBase, xTitleBase, legendRows: rows, legendTop, legSize, legRowH, legGap: plan.foldLegend ? 0.8 : 1.4,
    captionLines: caption, captionTop, capSize, capLead, plot, tagCols, fits, titleSteps: title.steps, chrome: top + below,
  };
}


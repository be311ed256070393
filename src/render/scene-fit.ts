/**
 * Fitting a figure to the requested size. The layout is tried as given, then squeezed step by step
 * until the plot keeps its minimum size: (1) the title wraps, shrinks or is cut, (2) every font
 * shrinks in 0.5 pt steps down to a floor (75 % of the request, at least 6 pt), (2b) the family
 * tags leave the margins (the legend key lists the activities; here when the width does not fit,
 * else after step 5), (3) the height
 * grows (up to twice the width or the requested height, whichever is larger), (4) the legend folds
 * (smallest font, tight spacing), (5) the caption leaves the drawing for the figure's metadata.
 * Each step taken is reported once as a note. Only a request that still cannot fit is refused,
 * as FigureFitError naming the option to change. Pure: no I/O.
 */
import { FigureFitError } from '../errors.js';
import { MIN_FONT_PT, ptToMm } from './options.js';
import { sceneBase, type FigureInput, type SceneBase } from './scene-context.js';
import { layoutFigure, MIN_PLOT_H_FS, PLAN_AS_GIVEN, type LayoutPlan } from './scene-layout.js';

export interface FittedFigure {
  base: SceneBase;
  bands: ReturnType<typeof layoutFigure>;
  /** Steps taken to fit, one sentence each, in order. */
  notes: string[];
  /** The caption text when it was moved out of the drawing (for metadata), else undefined. */
  droppedCaption?: string;
}

/** The base of the figure at another font size and height (mm). */
function rebase(input: FigureInput, fontSize: number, heightMm: number): SceneBase {
  return sceneBase({ ...input, options: { ...input.options, fontSize, height: heightMm } });
}

/** Height in mm that gives the plot at least its minimum and a 2:1 aspect at most (wide:high). */
function neededHeight(f: FittedFigure['bands'], fs: number): number {
  const plotH = Math.max(MIN_PLOT_H_FS * fs, f.plot.w / 2);
  return Math.ceil(ptToMm(f.chrome + plotH));
}

const fmt = (x: number): string => String(Math.round(x * 10) / 10);

/** Lays the figure out, squeezing as needed (see the module comment). */
export function fitFigure(input: FigureInput): FittedFigure {
  const o = input.options;
  const notes: string[] = [];
  let plan: LayoutPlan = { ...PLAN_AS_GIVEN };
  let fs = o.fontSize;
  let height = o.height;
  let base = sceneBase(input);
  let bands = layoutFigure(base, plan);
  const titleNote = (): void => {
    if (bands.titleSteps.length && !notes.some((n) => n.startsWith('title'))) {
      notes.push(`title ${bands.titleSteps.join(', ')} to fit the ${fmt(o.width)} mm width${bands.titleSize < o.fontSize * 1.1 ? ` (${fmt(bands.titleSize)} pt)` : ''}`);
    }
  };
  titleNote();
  const ok = (): boolean => bands.fits.w && bands.fits.h;
  // (2) Fonts down to the floor.
  const floor = Math.max(MIN_FONT_PT, Math.round(o.fontSize * 0.75 * 2) / 2);
  while (!ok() && fs - 0.5 >= floor - 1e-9) {
    fs -= 0.5;
    base = rebase(input, fs, height);
    bands = layoutFigure(base, plan);
  }
  if (fs < o.fontSize) notes.push(`font size reduced from ${fmt(o.fontSize)} to ${fmt(fs)} pt to fit`);
  titleNote();
  // (2b) Family tags out of the margins (the legend key lists the activities): here only when the
  // width does not fit (their columns take width); for the height, after the other steps.
  const dropTags = (): void => {
    if (ok() || !Object.values(bands.tagCols).some((c) => c > 0)) return;
    plan = { ...plan, dropTags: true };
    bands = layoutFigure(base, plan);
    notes.push('family tags left out of the margins to fit (the legend key lists the activities)');
  };
  if (!bands.fits.w) dropTags();
  // (3) Height, up to the larger of twice the width and the request.
  const maxH = Math.max(o.height, 2 * o.width);
  if (!ok() && bands.fits.w) {
    height = Math.min(maxH, Math.max(height, neededHeight(bands, fs)));
    base = rebase(input, fs, height);
    bands = layoutFigure(base, plan);
    notes.push(`height grown from ${fmt(o.height)} to ${fmt(height)} mm to fit the title, legend and caption`);
  }
  // (4) Legend folded; (5) caption to the metadata.
  if (!ok() && bands.fits.w && bands.legendRows.length) {
    plan = { ...plan, foldLegend: true };
    bands = layoutFigure(base, plan);
    notes.push('legend folded (smaller type, tighter spacing) to fit');
  }
  let droppedCaption: string | undefined;
  if (!ok() && bands.fits.w && bands.captionLines.length) {
    droppedCaption = bands.captionLines.map((l) => l.text).join(' ');
    plan = { ...plan, dropCaption: true };
    bands = layoutFigure(base, plan);
    notes.push('caption moved to the figure metadata (not drawn) to fit');
  }
  dropTags();
  if (!ok()) {
    // The plot's size as a person reads it: a side squeezed to nothing is "no room", never a negative length.
    const side = (pt: number): number => Math.max(0, Math.round(ptToMm(pt)));
    if (!bands.fits.w) {
      const room = side(bands.plot.w) > 0 ? `the plot only ${side(bands.plot.w)} mm wide` : 'no width for the plot';
      throw new FigureFitError('--width', `figure ${fmt(o.width)} mm wide leaves ${room} even at ${fmt(fs)} pt; make it wider or use a smaller --font-size`);
    }
    const room = side(bands.plot.h) > 0 ? `the plot only ${side(bands.plot.w)}×${side(bands.plot.h)} mm` : 'no height for the plot';
    throw new FigureFitError('--height', `figure ${fmt(o.width)}×${fmt(height)} mm leaves ${room}; make it taller or hide the caption/legend`);
  }
  return { base, bands, notes, ...(droppedCaption !== undefined ? { droppedCaption } : {}) };
}

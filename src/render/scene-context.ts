/**
 * What every layer builder of the figure scene shares: the figure input, the sizes derived from the
 * options (in pt), the inks, the plot frame and the label layout; plus the small item factories
 * (text, line, rectangle ring, knock-out) and the dash and text-wrapping rules. Pure: no I/O.
 */
import type { BoundaryModel, DiagramModel, RegionClass } from '../model.js';
import type { Tick } from './axes.js';
import type { TagColumns } from './family-tags.js';
import { clipPolyline } from './clip.js';
import { inflate, polylineSegments, rectRing, segmentDistance, simplifyCollinear, type Segment } from './geometry.js';
import type { Layout } from './labels.js';
import { runsWidth } from './metrics.js';
import { MIN_FONT_PT, mmToPt, validateOptions, type FigureOptions } from './options.js';
import { inks, normColor } from './palette.js';
import type { Point, Rect, ScenePath, SceneText, TextRun } from './scene-types.js';
import type { ShareGrid } from './share-grid.js';
import { expandScripts } from './typeset.js';

export interface FigureInput {
  model: DiagramModel;
  options: FigureOptions;
  /** Boundaries at other activities: thinner lines labelled with their power of ten. */
  families?: { activity: number; boundaries: BoundaryModel[] }[];
  /** pH of neutral water at the diagram's temperature (dotted line when show.neutral). */
  neutralPH?: number;
  /** Caption lines given by the caller; the caution line is always added. */
  caption?: string[];
  /** Operating points (marker + label). */
  points?: { label: string; pH: number; E: number }[];
  /** Operating paths (polyline with an arrow at the end), points as [pH, E]. */
  paths?: { label: string; points: [number, number][] }[];
  /** Operating envelopes (hatched box). */
  boxes?: { label: string; pH: [number, number]; E: [number, number] }[];
  /**
   * Extra layers: boundaries in their own dash style, named in the legend, with small labels of
   * their regions in the layer's ink (where they fit clear of every line and label). `color` sets
   * the layer's ink (default: the style's overlay inks in turn).
   */
  overlays?: { label: string; model: DiagramModel; dash: string; color?: string }[];
  /**
   * Legend name of the base layer's boundaries when there are overlays or families, e.g.
   * "Fe, 25 °C, a = 10⁻⁶ (filled)"; default "boundaries, a = 10⁻⁶". Rich text ({H2O}, ^…^) allowed.
   */
  baseLabel?: string;
  /** Composition mode: the HTML page's share read-out grid. */
  readout?: ShareGrid;
  /**
   * Regions labelled by number (their names did not fit in or beside them), in key order: region
   * species i is labelled "i + 1" and keyed "i + 1 <name>" in the legend. Set by buildScene.
   */
  regionNumbers?: string[];
}

export type Inks = ReturnType<typeof inks>;

/** Sizes (pt) and inks fixed by the options before any layout. */
export interface SceneBase {
  input: FigureInput;
  o: FigureOptions;
  model: DiagramModel;
  /** Figure width and height. */
  W: number;
  H: number;
  /** Base font size, the smaller size (legend, marks, water labels), main and thin line widths. */
  fs: number;
  small: number;
  lw: number;
  thin: number;
  /** Dash unit: the line width, at least 0.8 pt. */
  k: number;
  pad: number;
  tickLen: number;
  tickGap: number;
  ink: Inks;
  waterDash: number[];
}

export interface LegendEntry {
  /** 'key': text only (a numbered region's name, "1 Cr₂O₃ + Fe₃O₄ + Ni"). */
  kind: 'swatch' | 'line' | 'key';
  /** Swatches: the tint group (region class) whose every tint in use the swatch shows. */
  group?: RegionClass;
  fill?: string | null;
  stroke?: string;
  width?: number;
  dash?: number[] | null;
  runs: TextRun[];
  /** Extra attributes of the entry's label (data-*). */
  data?: Record<string, string>;
}

/** Where everything outside the plot goes, and the plot rectangle itself. */
export interface FigureBands {
  xTicks: Tick[];
  yTicks: Tick[];
  /** Second-axis ticks (reference-scale values) and the scale's offset in V. */
  y2Ticks: Tick[];
  off: number;
  showTitle: boolean;
  titleSize: number;
  /** The whole title (document metadata), and as laid out: wrapped lines, their line spacing. */
  titleRuns: TextRun[];
  titleLines: TextRun[][];
  titleLead: number;
  /** Baselines of the x tick labels and of the x-axis title, below the plot's bottom edge. */
  xLabelBase: number;
  xTitleBase: number;
  legendRows: LegendEntry[][];
  legendTop: number;
  legSize: number;
  legRowH: number;
  /** Gap between legend entries in a row, in legend font sizes. */
  legGap: number;
  captionLines: { text: string; italic: boolean }[];
  captionTop: number;
  capSize: number;
  capLead: number;
  plot: Rect;
  /** Thickness of the family tag columns beside the frame (family-tags.ts), pt; 0 where none. */
  tagCols: TagColumns;
}

/** Diagram coordinates → figure points within the plot rectangle. */
export interface Frame {
  plot: Rect;
  x: (pH: number) => number;
  y: (E: number) => number;
  toFig: (p: readonly [number, number]) => Point;
}

/** Everything a layer builder needs: the base sizes, the bands, the frame and the label layout. */
export interface SceneContext extends SceneBase {
  bands: FigureBands;
  plot: Rect;
  fr: Frame;
  layout: Layout;
}

/** Validates the options and derives the sizes and inks. Throws for an empty diagram domain. */
export function sceneBase(input: FigureInput): SceneBase {
  const o = input.options;
  validateOptions(o);
  const model = input.model;
  const [pH0, pH1] = model.domain.pH;
  const [E0, E1] = model.domain.E;
  if (!(pH1 > pH0 && E1 > E0)) throw new Error(`diagram domain is empty: pH ${pH0}…${pH1}, E ${E0}…${E1} V`);
  const fs = o.fontSize;
  const lw = o.lineWidth;
  const k = Math.max(0.8, lw);
  return {
    input,
    o,
    model,
    W: mmToPt(o.width),
    H: mmToPt(o.height),
    fs,
    small: Math.max(MIN_FONT_PT, fs * 0.85),
    lw,
    thin: Math.max(0.3, 0.55 * lw),
    k,
    pad: 0.4 * fs,
    tickLen: 0.4 * fs,
    tickGap: 0.3 * fs,
    ink: inks(o.style),
    waterDash: [3 * k, 1.7 * k],
  };
}

/** Ink of overlay layer `i`: its own colour, else the style's overlay inks in turn. */
export function overlayInk(ink: Inks, ov: { color?: string }, i: number): string {
  return ov.color !== undefined ? normColor(ov.color) : ink.overlay[i % ink.overlay.length]!;
}

/** Linear scales from the diagram's domain to the plot rectangle (E grows upwards). */
export function makeFrame(model: DiagramModel, plot: Rect): Frame {
  const [p0, p1] = model.domain.pH;
  const [e0, e1] = model.domain.E;
  const x = (pH: number): number => plot.x + ((pH - p0) / (p1 - p0)) * plot.w;
  const y = (E: number): number => plot.y + ((e1 - E) / (e1 - e0)) * plot.h;
  return { plot, x, y, toFig: (p) => [x(p[0]), y(p[1])] };
}

/** A text item (super/subscripts expanded into raised runs). */
export const text = (
  role: string,
  runs: TextRun[],
  x: number,
  y: number,
  size: number,
  anchor: SceneText['anchor'],
  fill: string,
  extra: Partial<SceneText> = {},
): SceneText => ({ type: 'text', role, x, y, size, anchor, rotate: 0, runs: expandScripts(runs), fill, ...extra });

/** An open-polyline item, one subpath per piece. */
export const line = (role: string, pieces: Point[][], stroke: string, width: number, dash: number[] | null, extra: Partial<ScenePath> = {}): ScenePath => ({
  type: 'path',
  role,
  subpaths: pieces.map((points) => ({ points, closed: false })),
  fill: null,
  stroke,
  strokeWidth: width,
  dash,
  ...extra,
});

/** A closed rectangle path item (no fill and no stroke unless given). */
export function rectPath(role: string, r: Rect, extra: Partial<ScenePath> = {}): ScenePath {
  return { type: 'path', role, subpaths: [{ points: rectRing(r), closed: true }], fill: null, stroke: null, strokeWidth: 0, dash: null, ...extra };
}

/** The fill-coloured patch that knocks out soft lines under a label's box. */
export function knockout(box: Rect, size: number, fill: string): ScenePath {
  return rectPath('label-knockout', inflate(box, 0.08 * size), { fill });
}

/** A polyline in diagram coordinates → its pieces inside the plot, in figure points. */
export function figLine(ctx: SceneContext, pts: readonly [number, number][]): Point[][] {
  return clipPolyline(pts.map((p) => ctx.fr.toFig(p)), ctx.plot).map((piece) => simplifyCollinear(piece, false));
}

export const segsOf = (pieces: Point[][]): Segment[] => pieces.flatMap((p) => polylineSegments(p));

/**
 * Parses a dash style: "dash", "dot", "dashdot", "solid" or numbers in pt ("4 2", "4,2,1,2").
 * Throws Error for anything else.
 */
export function parseDash(dash: string, lineWidth: number): number[] | null {
  const k = Math.max(0.8, lineWidth);
  const named: Record<string, number[] | null> = {
    solid: null,
    dash: [3.5 * k, 2 * k],
    dot: [0.01, 1.8 * k],
    dashdot: [3.5 * k, 1.6 * k, 0.01, 1.6 * k],
    longdash: [6 * k, 2.2 * k],
  };
  const key = dash.trim().toLowerCase();
  if (key in named) return named[key]!;
  const nums = key.split(/[\s,]+/).filter(Boolean).map(Number);
  if (nums.length === 0 || nums.some((n) => !Number.isFinite(n) || n < 0) || nums.every((n) => n === 0)) {
    throw new Error(`dash "${dash}": use solid, dash, dot, dashdot, longdash or lengths in pt such as "4 2"`);
  }
  return nums.length % 2 === 1 ? [...nums, ...nums] : nums;
}

/**
 * Stroke settings for a dash pattern: patterns with dots (a dash shorter than 0.1 pt) need round
 * caps, or the dots have no length and vanish. A round cap adds half the line width at each end of
 * every dash, so the gaps are widened by the line width to keep the pattern's look.
 */
export function dashStroke(dash: number[] | null, width: number): { dash: number[] | null; lineCap: 'butt' | 'round' } {
  if (!dash || !dash.some((d, k) => k % 2 === 0 && d < 0.1)) return { dash, lineCap: 'butt' };
  return { dash: dash.map((d, k) => (k % 2 === 1 ? d + width : d)), lineCap: 'round' };
}

/** Widening for running text (caption, legend), as FONT_SAFETY: the metrics are the bundled font's own. */
export const PROSE_SAFETY = 1.06;

/** Words wrapped greedily to `width` pt at `size` pt (measured as drawn, scripts raised, with PROSE_SAFETY). */
export function wrapText(s: string, size: number, width: number): string[] {
  const words = s.split(/\s+/).filter(Boolean);
  const out: string[] = [];
  let cur = '';
  for (const w of words) {
    const next = cur ? `${cur} ${w}` : w;
    if (cur && runsWidth(expandScripts([{ text: next, shift: 'normal' }]), size) * PROSE_SAFETY > width) {
      out.push(cur);
      cur = w;
    } else cur = next;
  }
  if (cur) out.push(cur);
  return out;
}

/** Whether the segment a–b lies on an edge of the rectangle (the plot frame). */
export function onFrame(a: Point, b: Point, r: Rect): boolean {
  const e = 1e-6;
  const x1 = r.x + r.w;
  const y1 = r.y + r.h;
  return (
    (Math.abs(a[0] - r.x) < e && Math.abs(b[0] - r.x) < e) ||
    (Math.abs(a[0] - x1) < e && Math.abs(b[0] - x1) < e) ||
    (Math.abs(a[1] - r.y) < e && Math.abs(b[1] - r.y) < e) ||
    (Math.abs(a[1] - y1) < e && Math.abs(b[1] - y1) < e)
  );
}

/** Whether every vertex and segment midpoint of a polyline lies within `tol` pt of the given segments. */
export function coincides(piece: Point[], segs: readonly Segment[], tol: number): boolean {
  const probes: Point[] = [...piece];
  for (let i = 0; i + 1 < piece.length; i++) probes.push([(piece[i]![0] + piece[i + 1]![0]) / 2, (piece[i]![1] + piece[i + 1]![1]) / 2]);
  return probes.every((p) => segs.some(([a, b]) => segmentDistance(p, a, b) <= tol));
}

/**
 * The shares plot (composition mode, a second figure kind): share of the main element held by each
 * form against pH at a fixed potential (or against E at a fixed pH), one line per form in its own
 * ink (and dash in the gray and lines styles), unsolved stretches shaded as undetermined, a legend
 * and a caption. Builds a renderer-neutral Scene (svg.ts, pdf.ts draw it); draws, never computes.
 */
import type { SharesData } from '../analysis/shares.js';
import { FigureFitError } from '../errors.js';
import { niceTicks, type Tick } from './axes.js';
import { CAP_HEIGHT, FONT_SAFETY, runsWidth, stringWidth } from './metrics.js';
import { MIN_FONT_PT, mmToPt, validateOptions, type FigureOptions } from './options.js';
import { inks, toGray } from './palette.js';
import { dashStroke, line, parseDash, PROSE_SAFETY, rectPath, text, wrapText, type LegendEntry } from './scene-context.js';
import { CAUTION, legendLabel, legendLineSample, legendRows } from './scene-legend.js';
import type { Point, Rect, Scene, SceneItem, TextRun } from './scene-types.js';
import { formulaRuns, plainRuns, quantityRuns, runsUnicode } from './typeset.js';

export interface SharesFigureInput {
  data: SharesData;
  options: FigureOptions;
  /** Caption lines (the caution line is always added when the caption is shown). */
  caption?: string[];
}

/** Line inks, colour style: the Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2008), black last. */
const FORM_INKS = ['#0072b2', '#d55e00', '#009e73', '#cc79a7', '#e69f00', '#56b4e9', '#000000', '#f0e442'];
const DASHES = ['solid', 'dash', 'dot', 'dashdot', 'longdash'];

/** Ink and dash of form i: colours in turn (then dashes) in colour; dashes in turn in gray and lines. */
function formStroke(o: FigureOptions, i: number): { stroke: string; dash: number[] | null } {
  if (o.style === 'color') return { stroke: FORM_INKS[i % FORM_INKS.length]!, dash: parseDash(DASHES[Math.floor(i / FORM_INKS.length) % DASHES.length]!, o.lineWidth) };
  return { stroke: i % 2 ? '#555555' : '#000000', dash: parseDash(DASHES[i % DASHES.length]!, o.lineWidth) };
}

/** A potential as "−0.20 V vs SHE" (minus sign U+2212). */
export const fmtPotential = (E: number): string => `${E.toFixed(2).replace('-', '\u2212')} V vs SHE`;

/** The fixed potential: "−0.20 V vs SHE", or "−0.45 V vs SCE (= −0.21 V vs SHE)" when given against an electrode. */
export function fixedPotentialText(d: SharesData): string {
  if (!d.reference) return fmtPotential(d.at);
  return `${d.reference.E.toFixed(2).replace('-', '\u2212')} V vs ${d.reference.label} (= ${fmtPotential(d.at)})`;
}

/** The default title: "Ag shares vs pH at E = −0.20 V vs SHE, 25 °C". */
export function sharesTitle(d: SharesData): string {
  const T = `${Number.isInteger(d.temperature.celsius) ? d.temperature.celsius : d.temperature.celsius.toFixed(1)} \u00b0C`;
  return d.along === 'pH' ? `${d.element} shares vs pH at E = ${fixedPotentialText(d)}, ${T}` : `${d.element} shares vs E at pH ${d.at.toFixed(2)}, ${T}`;
}

/** The data's polyline of one form in figure points, broken where a point is unsolved (NaN). */
function pieces(d: SharesData, share: number[], X: (v: number) => number, Y: (v: number) => number): Point[][] {
  const out: Point[][] = [];
  let cur: Point[] = [];
  d.x.forEach((x, k) => {
    const s = share[k]!;
    if (Number.isFinite(s)) cur.push([X(x), Y(Math.min(1, Math.max(0, s)))]);
    else if (cur.length) {
      out.push(cur);
      cur = [];
    }
  });
  if (cur.length) out.push(cur);
  return out.filter((p) => p.length >= 2);
}

/** Sizes, ticks, legend and caption rows and the plot rectangle of a shares figure. */
interface SharesLayout {
  o: FigureOptions;
  d: SharesData;
  ink: ReturnType<typeof inks>;
  W: number;
  H: number;
  fs: number;
  lw: number;
  pad: number;
  tickLen: number;
  tickGap: number;
  xTicks: Tick[];
  yTicks: Tick[];
  rows: LegendEntry[][];
  legSize: number;
  legRowH: number;
  caption: { t: string; italic: boolean }[];
  capSize: number;
  capLead: number;
  titleRuns: TextRun[];
  showTitle: boolean;
  titleSize: number;
  xLabelBase: number;
  xTitleBase: number;
  legendTop: number;
  captionTop: number;
  undetermined: string;
  plot: Rect;
  X: (v: number) => number;
  Y: (s: number) => number;
}

/**
 * (1) sizes and ticks, (2) legend and caption rows, (3) the bands above and below the plot and the
 * plot rectangle; FigureFitError (naming --width or --height) when the plot would be smaller than
 * 4 × 4 × 3 font sizes.
 */
function sharesLayout(input: SharesFigureInput): SharesLayout {
  const o = input.options;
  validateOptions(o);
  const d = input.data;
  const ink = inks(o.style);
  const W = mmToPt(o.width);
  const H = mmToPt(o.height);
  const fs = o.fontSize;
  const small = Math.max(MIN_FONT_PT, fs * 0.85);
  const pad = 0.4 * fs;
  const tickLen = 0.4 * fs;
  const tickGap = 0.3 * fs;
  const [x0, x1] = d.range;
  const xTicks = niceTicks(x0, x1, (W * 0.78) / (fs * 4.2));
  const yTicks = niceTicks(0, 1, 5);
  const tickW = (ts: Tick[]): number => Math.max(0, ...ts.map((k) => stringWidth(k.label, fs) * FONT_SAFETY));
  const left = pad + fs * 1.05 + 0.45 * fs + tickW(yTicks) + tickGap + tickLen;
  const right = Math.max(0.9 * fs, pad + (stringWidth(xTicks[xTicks.length - 1]?.label ?? '', fs) * FONT_SAFETY) / 2);
  const innerW = W - 2 * pad;
  const undetermined = o.style === 'color' ? ink.undetermined : toGray(ink.undetermined);
  const entries: LegendEntry[] = d.forms.map((f, i) => {
    const st = formStroke(o, i);
    return { kind: 'line', stroke: st.stroke, width: o.lineWidth, dash: st.dash, runs: [...formulaRuns(f.species), ...(f.phase === 's' ? plainRuns(' (solid)') : [])] };
  });
  if (d.failed.length) entries.push({ kind: 'swatch', fill: undetermined, runs: plainRuns('undetermined (not solved)') });
  const legSize = small;
  const legRowH = legSize * 1.45;
  const rows = o.show.legend ? legendRows(entries, legSize, innerW) : [];
  const capSize = small;
  const caption = o.show.caption ? [...(input.caption ?? []).flatMap((c) => wrapText(c, capSize, innerW).map((t) => ({ t, italic: false }))), ...wrapText(CAUTION, capSize, innerW).map((t) => ({ t, italic: true }))] : [];
  const showTitle = o.show.title || o.title !== undefined;
  const titleSize = fs * 1.1;
  const top = showTitle ? pad + titleSize * 1.5 : Math.max(pad, 0.65 * fs);
  const xLabelBase = tickLen + tickGap + CAP_HEIGHT * fs;
  const xTitleBase = xLabelBase + 0.5 * fs + CAP_HEIGHT * fs * 1.05 + 0.25 * fs;
  const legendTop = xTitleBase + 0.25 * fs + (rows.length ? 0.5 * fs : 0);
  const captionTop = legendTop + rows.length * legRowH + (caption.length ? 0.45 * fs : 0);
  const capLead = capSize * 1.28;
  const below = captionTop + caption.length * capLead + pad * 0.6;
  const plot: Rect = { x: left, y: top, w: W - left - right, h: H - top - below };
  if (plot.h < 4 * fs * 3 || plot.w < 4 * fs * 4) {
    throw new FigureFitError(plot.w < 4 * fs * 4 ? '--width' : '--height', `figure ${o.width}×${o.height} mm is too small for the shares plot with its caption and legend; make it larger or hide the caption/legend`);
  }
  const X = (v: number): number => plot.x + ((v - x0) / (x1 - x0)) * plot.w;
  const Y = (sh: number): number => plot.y + (1 - sh) * plot.h;
  return { o, d, ink, W, H, fs, lw: o.lineWidth, pad, tickLen, tickGap, xTicks, yTicks, rows, legSize, legRowH, caption, capSize, capLead, titleRuns: plainRuns(o.title ?? sharesTitle(d)), showTitle, titleSize, xLabelBase, xTitleBase, legendTop, captionTop, undetermined, plot, X, Y };
}

/** Inside the plot: undetermined stretches (shaded), grid, one line per form. */
function plotItems(L: SharesLayout): SceneItem[] {
  const { d, o, plot, X, Y, lw } = L;
  const [x0, x1] = d.range;
  const items: SceneItem[] = [];
  const half = d.x.length > 1 ? (x1 - x0) / (d.x.length - 1) / 2 : 0;
  for (const k of d.failed) {
    const a = X(Math.max(x0, d.x[k]! - half));
    items.push(rectPath('undetermined', { x: a, y: plot.y, w: X(Math.min(x1, d.x[k]! + half)) - a, h: plot.h }, { fill: L.undetermined }));
  }
  if (o.show.grid) items.push(line('grid', L.yTicks.map((t) => [[plot.x, Y(t.value)], [plot.x + plot.w, Y(t.value)]] as Point[]), L.ink.grid, 0.4, null));
  d.forms.forEach((f, i) => {
    const st = formStroke(o, i);
    const ds = dashStroke(st.dash, lw);
    items.push(line('share', pieces(d, f.share, X, Y), st.stroke, lw, ds.dash, { lineCap: ds.lineCap, lineJoin: 'round', data: { species: f.species } }));
  });
  return items;
}

/** Frame, ticks and tick labels, and the axis titles (x names the fixed coordinate). */
function axisItems(L: SharesLayout): SceneItem[] {
  const { d, plot, X, Y, fs, ink, tickLen, tickGap, pad } = L;
  const frameW = Math.max(0.5, 0.6 * L.lw);
  const items: SceneItem[] = [rectPath('frame', plot, { stroke: ink.frame, strokeWidth: frameW })];
  const ticks: Point[][] = [];
  const bottom = plot.y + plot.h;
  for (const t of L.xTicks) {
    ticks.push([[X(t.value), bottom], [X(t.value), bottom + tickLen]]);
    items.push(text('tick-label', plainRuns(t.label), X(t.value), bottom + L.xLabelBase, fs, 'middle', ink.text, { data: { axis: 'x', value: String(t.value) } }));
  }
  for (const t of L.yTicks) {
    ticks.push([[plot.x, Y(t.value)], [plot.x - tickLen, Y(t.value)]]);
    items.push(text('tick-label', plainRuns(t.label), plot.x - tickLen - tickGap, Y(t.value) + (CAP_HEIGHT * fs) / 2, fs, 'end', ink.text, { data: { axis: 'share', value: String(t.value) } }));
  }
  items.push(line('tick', ticks, ink.frame, frameW, null));
  const xTitle = d.along === 'pH' ? plainRuns(`pH (at E = ${fixedPotentialText(d)})`) : [...quantityRuns('E / V vs SHE'), ...plainRuns(` (at pH ${d.at.toFixed(2)})`)];
  items.push(text('axis-title', xTitle, plot.x + plot.w / 2, bottom + L.xTitleBase, fs, 'middle', ink.text, { data: { axis: 'x' } }));
  items.push(text('axis-title', plainRuns(`share of ${d.element} (mol/mol)`), pad + CAP_HEIGHT * fs, plot.y + plot.h / 2, fs, 'middle', ink.text, { rotate: -90, data: { axis: 'share' } }));
  return items;
}

/** Title (when shown), legend rows (sample then label) and caption lines below the plot. */
function noteItems(L: SharesLayout): SceneItem[] {
  const { plot, pad, legSize, ink } = L;
  const bottom = plot.y + plot.h;
  const items: SceneItem[] = [];
  if (L.showTitle) items.push(text('title', L.titleRuns, L.W / 2, pad + CAP_HEIGHT * L.titleSize, L.titleSize, 'middle', ink.text, { bold: true }));
  L.rows.forEach((row, ri) => {
    let x = pad;
    const cy = bottom + L.legendTop + ri * L.legRowH + L.legRowH / 2;
    for (const e of row) {
      const sw = e.kind === 'swatch' ? legSize * 1.1 : legSize * 2.6;
      if (e.kind === 'swatch') items.push(rectPath('legend-swatch', { x, y: cy - legSize * 0.475, w: sw, h: legSize * 0.95 }, { fill: e.fill ?? null, stroke: '#4d4d4d', strokeWidth: 0.35 }));
      else items.push(legendLineSample(e, x, sw, cy));
      const tx = x + sw + 0.4 * legSize;
      items.push(legendLabel(e, tx, cy, legSize, ink.text));
      x = tx + runsWidth(e.runs, legSize) * PROSE_SAFETY + 1.4 * legSize;
    }
  });
  L.caption.forEach((l, i) => items.push(text('caption', plainRuns(l.t, l.italic), pad, bottom + L.captionTop + CAP_HEIGHT * L.capSize + i * L.capLead, L.capSize, 'start', ink.text)));
  return items;
}

/** The shares figure as a Scene: layout, then plot, axes and notes (title, legend, caption). */
export function buildSharesScene(input: SharesFigureInput): Scene {
  const L = sharesLayout(input);
  const { plot, o } = L;
  return {
    widthPt: L.W,
    heightPt: L.H,
    widthMm: o.width,
    heightMm: o.height,
    fontFamily: o.fontFamily,
    background: '#ffffff',
    notes: [],
    plot,
    // The frame maps the swept quantity (pH or E) on x and the share 0…1 on y (kept in the pH and E slots).
    frame: { x0: plot.x, x1: plot.x + plot.w, y0: plot.y + plot.h, y1: plot.y, pH: [L.d.range[0], L.d.range[1]], E: [0, 1] },
    items: [
      { type: 'group', role: 'plot', clip: plot, children: plotItems(L) },
      { type: 'group', role: 'axes', children: axisItems(L) },
      { type: 'group', role: 'annotations', children: noteItems(L) },
    ],
    title: runsUnicode(L.titleRuns),
  };
}

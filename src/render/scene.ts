/**
 * Builds the renderer-neutral scene of a diagram figure: frame, axes, region fills, lines,
 * labels, legend and caption, in points (1/72 in) with the origin at the top left. Pure: no I/O.
 */
import { FigureFitError } from '../errors.js';
import type { BoundaryModel, DiagramModel, RegionClass } from '../model.js';
import { niceTicks, type Tick } from './axes.js';
import {
  clipPolyline,
  clipRing,
  inflate,
  insideRings,
  pointAlong,
  polylineLength,
  polylineSegments,
  rectPole,
  ringArea,
  ringSegments,
  segmentDistance,
  simplifyCollinear,
  type Segment,
} from './geometry.js';
import {
  baselineForCentre,
  firstFree,
  Layout,
  orientedBounds,
  placeLayerLabels,
  placeMarkLabel,
  placeRegionLabels,
  type LayerLabelRequest,
  textBox,
  boxSegments,
  type OrientedBox,
  type RegionLabelRequest,
} from './labels.js';
import { CAP_HEIGHT, FONT_SAFETY, runsExtent, runsWidth, stringWidth } from './metrics.js';
import { MIN_FONT_PT, mmToPt, validateOptions, type FigureOptions } from './options.js';
import { assignFills, CLASS_NAMES, CLASS_TINTS, fillGroup, inks, normColor, textInk, toGray } from './palette.js';
import type { Point, Rect, Scene, SceneGroup, SceneItem, ScenePath, SceneText, TextRun } from './scene-types.js';
import { expandScripts, formulaRuns, plainRuns, powerOfTenRuns, quantityRuns, richRuns, runsUnicode } from './typeset.js';

export type { Scene, SceneItem, ScenePath, SceneText, SceneCircle, SceneGroup, TextRun, Rect, Point, PlotFrame } from './scene-types.js';

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
}

/** The caution printed with every caption. */
export const CAUTION =
  'Equilibrium thermodynamics only \u2014 not kinetics: no rates, film quality or localized attack. A screening aid, not a design rule.';

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

interface Frame {
  plot: Rect;
  x: (pH: number) => number;
  y: (E: number) => number;
  toFig: (p: readonly [number, number]) => Point;
}

function makeFrame(model: DiagramModel, plot: Rect): Frame {
  const [p0, p1] = model.domain.pH;
  const [e0, e1] = model.domain.E;
  const x = (pH: number): number => plot.x + ((pH - p0) / (p1 - p0)) * plot.w;
  const y = (E: number): number => plot.y + ((e1 - E) / (e1 - e0)) * plot.h;
  return { plot, x, y, toFig: (p) => [x(p[0]), y(p[1])] };
}

const text = (
  role: string,
  runs: TextRun[],
  x: number,
  y: number,
  size: number,
  anchor: SceneText['anchor'],
  fill: string,
  extra: Partial<SceneText> = {},
): SceneText => ({ type: 'text', role, x, y, size, anchor, rotate: 0, runs: expandScripts(runs), fill, ...extra });

const line = (role: string, pieces: Point[][], stroke: string, width: number, dash: number[] | null, extra: Partial<ScenePath> = {}): ScenePath => ({
  type: 'path',
  role,
  subpaths: pieces.map((points) => ({ points, closed: false })),
  fill: null,
  stroke,
  strokeWidth: width,
  dash,
  ...extra,
});

/** Widening for running text (caption, legend): lower-case prose in DejaVu Sans is up to 18 % wider. */
const PROSE_SAFETY = 1.2;

/** Words wrapped greedily to `width` pt at `size` pt (measured with PROSE_SAFETY). */
export function wrapText(s: string, size: number, width: number): string[] {
  const words = s.split(/\s+/).filter(Boolean);
  const out: string[] = [];
  let cur = '';
  for (const w of words) {
    const next = cur ? `${cur} ${w}` : w;
    if (cur && stringWidth(next, size) * PROSE_SAFETY > width) {
      out.push(cur);
      cur = w;
    } else cur = next;
  }
  if (cur) out.push(cur);
  return out;
}

interface LegendEntry {
  kind: 'swatch' | 'line';
  fill?: string | null;
  stroke?: string;
  width?: number;
  dash?: number[] | null;
  runs: TextRun[];
}

/**
 * Builds the figure scene. Throws FigureFitError (naming the option) for a figure too small for its
 * plot, Error for other invalid options.
 */
export function buildScene(input: FigureInput): Scene {
  const o = input.options;
  validateOptions(o);
  const model = input.model;
  const [pH0, pH1] = model.domain.pH;
  const [E0, E1] = model.domain.E;
  if (!(pH1 > pH0 && E1 > E0)) throw new Error(`diagram domain is empty: pH ${pH0}…${pH1}, E ${E0}…${E1} V`);
  const W = mmToPt(o.width);
  const H = mmToPt(o.height);
  const fs = o.fontSize;
  const small = Math.max(MIN_FONT_PT, fs * 0.85);
  const lw = o.lineWidth;
  const thin = Math.max(0.3, 0.55 * lw);
  const ink = inks(o.style);
  const overlayInk = (ov: { color?: string }, i: number): string => (ov.color !== undefined ? normColor(ov.color) : ink.overlay[i % ink.overlay.length]!);
  const pad = 0.4 * fs;
  const tickLen = 0.4 * fs;
  const tickGap = 0.3 * fs;

  // ---- Ticks (counts from a first guess of the plot size) ----------------------------------
  const guessW = W * 0.78;
  const guessH = H * 0.62;
  const xTicks = niceTicks(pH0, pH1, guessW / (fs * 4.2));
  const yTicks = niceTicks(E0, E1, guessH / (fs * 2.8));
  const off = o.secondAxis?.offset ?? 0;
  const y2Ticks: Tick[] = o.secondAxis ? niceTicks(E0 - off, E1 - off, guessH / (fs * 2.8)) : [];
  const tickW = (ts: Tick[]): number => Math.max(0, ...ts.map((t) => stringWidth(t.label, fs) * FONT_SAFETY));

  // ---- Horizontal layout --------------------------------------------------------------------
  const titleBand = fs * 1.05; // rotated axis title thickness
  const left = pad + titleBand + 0.45 * fs + tickW(yTicks) + tickGap + tickLen;
  const lastX = xTicks[xTicks.length - 1];
  const xOverhang = lastX && Math.abs(lastX.value - pH1) < 1e-9 ? (stringWidth(lastX.label, fs) * FONT_SAFETY) / 2 : 0;
  const right = o.secondAxis ? pad + titleBand + 0.45 * fs + tickW(y2Ticks) + tickGap + tickLen : Math.max(0.9 * fs, xOverhang + pad);
  const innerW = W - 2 * pad;

  // ---- Caption and legend (bottom blocks) ---------------------------------------------------
  const capSize = Math.max(MIN_FONT_PT, fs * 0.85);
  const capLead = capSize * 1.28;
  const captionLines: { text: string; italic: boolean }[] = [];
  if (o.show.caption) {
    for (const c of input.caption ?? []) for (const l of wrapText(c, capSize, innerW)) captionLines.push({ text: l, italic: false });
    for (const l of wrapText(CAUTION, capSize, innerW)) captionLines.push({ text: l, italic: true });
  }
  const legend: LegendEntry[] = [];
  // Swatches by tint group: a region's class, or the group of the verdict it was reclassified to.
  const present = new Set<RegionClass>(model.regions.map((r) => fillGroup(r.class, r.verdict)));
  const reclassified = (c: RegionClass): string[] => [...new Set(model.regions.filter((r) => r.class !== c && fillGroup(r.class, r.verdict) === c).map((r) => r.species))].sort();
  const k = Math.max(0.8, lw);
  const waterDash = [3 * k, 1.7 * k];
  if (o.show.legend) {
    if (o.style !== 'lines') {
      for (const c of ['element', 'solid', 'dissolved', 'gas'] as RegionClass[]) {
        if (!present.has(c)) continue;
        const tint = CLASS_TINTS[c][0]!;
        const moved = reclassified(c);
        const runs = moved.length ? [...plainRuns(`${CLASS_NAMES[c]}; reclassified: `), ...moved.flatMap((f, i) => [...(i ? plainRuns(', ') : []), ...formulaRuns(f)])] : plainRuns(CLASS_NAMES[c]);
        legend.push({ kind: 'swatch', fill: o.style === 'gray' ? toGray(tint) : tint, runs });
      }
    }
    if ((input.families?.length ?? 0) > 0 || (input.overlays?.length ?? 0) > 0) {
      const runs: TextRun[] =
        input.baseLabel !== undefined
          ? richRuns(input.baseLabel)
          : [...plainRuns('boundaries, '), { text: 'a', shift: 'normal', italic: true }, ...plainRuns(' = '), ...powerOfTenRuns(model.activity)];
      legend.push({ kind: 'line', stroke: ink.boundary, width: lw, dash: null, runs });
    }
    if ((input.families?.length ?? 0) > 0) {
      legend.push({ kind: 'line', stroke: ink.family, width: thin, dash: null, runs: plainRuns('other activities') });
    }
    if (o.show.water) legend.push({ kind: 'line', stroke: ink.water, width: 0.75 * lw, dash: waterDash, runs: richRuns('water stability limits') });
    (input.overlays ?? []).forEach((ov, i) => {
      legend.push({ kind: 'line', stroke: overlayInk(ov, i), width: 0.8 * lw, dash: parseDash(ov.dash, lw), runs: richRuns(ov.label) });
    });
  }
  const legSize = small;
  const legRowH = legSize * 1.45;
  const sampleW = (e: LegendEntry): number => (e.kind === 'swatch' ? legSize * 1.1 : legSize * 2.6);
  const entryW = (e: LegendEntry): number => sampleW(e) + 0.4 * legSize + runsWidth(e.runs, legSize) * PROSE_SAFETY;
  const legendRows: LegendEntry[][] = [];
  {
    let row: LegendEntry[] = [];
    let x = 0;
    for (const e of legend) {
      const w = entryW(e);
      if (row.length > 0 && x + w > innerW) {
        legendRows.push(row);
        row = [];
        x = 0;
      }
      row.push(e);
      x += w + 1.4 * legSize;
    }
    if (row.length) legendRows.push(row);
  }

  // ---- Vertical layout ----------------------------------------------------------------------
  const showTitle = o.show.title;
  const titleSize = fs * 1.1;
  const titleRuns = o.title !== undefined ? richRuns(o.title) : richRuns(`${model.element}\u2013{H2O}, ${model.temperature.celsius.toFixed(0)} \u00b0C`);
  const top = showTitle ? pad + titleSize * 1.5 : Math.max(pad, 0.65 * fs);
  const xLabelBase = tickLen + tickGap + CAP_HEIGHT * fs; // below plot bottom
  const xTitleBase = xLabelBase + 0.5 * fs + CAP_HEIGHT * fs * 1.05 + 0.25 * fs;
  let below = xTitleBase + 0.25 * fs;
  const legendTop = below + (legendRows.length ? 0.5 * fs : 0);
  below = legendTop + legendRows.length * legRowH;
  const captionTop = below + (captionLines.length ? 0.45 * fs : 0);
  below = captionTop + captionLines.length * capLead + pad * 0.6;
  const plot: Rect = { x: left, y: top, w: W - left - right, h: H - top - below };
  if (plot.h < 4 * fs * 3 || plot.w < 4 * fs * 4) {
    throw new FigureFitError(
      plot.w < 4 * fs * 4 ? '--width' : '--height',
      `figure ${o.width}×${o.height} mm is too small for the plot with its caption and legend (plot ${(plot.w * 25.4 / 72).toFixed(0)}×${((plot.h * 25.4) / 72).toFixed(0)} mm); make it larger or hide the caption/legend`,
    );
  }
  const fr = makeFrame(model, plot);
  const layout = new Layout(plot, { x: 0, y: 0, w: W, h: H });

  // ---- Region fills -------------------------------------------------------------------------
  // Per region, per polygon (outer ring and holes), clipped to the plot.
  const regionPolys: Point[][][][] = model.regions.map((r) =>
    r.polygons
      .map((poly) => poly.map((ring) => simplifyCollinear(clipRing(ring.map((p) => fr.toFig(p)), plot), true)).filter((ring) => ring.length >= 3))
      .filter((rings) => rings.length > 0),
  );
  const regionRings: Point[][][] = regionPolys.map((polys) => polys.flat());
  const speciesIndex = new Map<string, number[]>();
  model.regions.forEach((r, i) => speciesIndex.set(r.species, [...(speciesIndex.get(r.species) ?? []), i]));
  const neighbours: Set<number>[] = model.regions.map(() => new Set());
  for (const b of model.boundaries) {
    for (const i of speciesIndex.get(b.between[0]) ?? [])
      for (const j of speciesIndex.get(b.between[1]) ?? []) {
        if (i !== j) {
          neighbours[i]!.add(j);
          neighbours[j]!.add(i);
        }
      }
  }
  const fills = assignFills(
    model.regions.map((r, i) => ({ species: r.species, class: fillGroup(r.class, r.verdict), neighbours: [...neighbours[i]!].sort((a, b) => a - b), area: regionPolys[i]!.flat().reduce((sum, ring) => sum + Math.abs(ringArea(ring)), 0) })),
    o.style,
    o.colors,
  );
  const under: SceneItem[] = [];
  model.regions.forEach((r, i) => {
    const rings = regionRings[i]!;
    if (rings.length === 0) return;
    under.push({
      type: 'path',
      role: 'region',
      subpaths: rings.map((points) => ({ points, closed: true })),
      fill: fills[i] ?? (o.style === 'lines' ? null : '#ffffff'),
      fillRule: 'evenodd',
      stroke: null,
      strokeWidth: 0,
      dash: null,
      data: { species: r.species, class: r.class },
    });
  });

  // ---- Lines --------------------------------------------------------------------------------
  const figLine = (pts: readonly [number, number][]): Point[][] =>
    clipPolyline(pts.map((p) => fr.toFig(p)), plot).map((piece) => simplifyCollinear(piece, false));
  const segsOf = (pieces: Point[][]): Segment[] => pieces.flatMap((p) => polylineSegments(p));

  // Ligand underlay.
  const ligandItems: SceneItem[] = [];
  const ligandLabelReqs: { runs: TextRun[]; rings: Point[][] }[] = [];
  if (o.show.ligands && model.ligandRegions) {
    for (const el of Object.keys(model.ligandRegions).sort()) {
      for (const lr of model.ligandRegions[el]!) {
        const rings = lr.polygons.flatMap((poly) => poly.map((ring) => clipRing(ring.map((p) => fr.toFig(p)), plot)).filter((g) => g.length >= 3));
        if (rings.length === 0) continue;
        const edges = ringSegments(rings).filter(([a, b]) => !onFrame(a, b, plot));
        if (edges.length) ligandItems.push(line('ligand-boundary', edges.map(([a, b]) => [a, b]), ink.ligand, thin * 0.8, [0.01, 1.4 * k], { lineCap: 'round', data: { element: el } }));
        ligandLabelReqs.push({ runs: formulaRuns(lr.species), rings });
      }
    }
  }

  // Grid.
  const gridItems: SceneItem[] = [];
  if (o.show.grid) {
    const pieces: Point[][] = [];
    for (const t of xTicks) if (t.value > pH0 && t.value < pH1) pieces.push([[fr.x(t.value), plot.y], [fr.x(t.value), plot.y + plot.h]]);
    for (const t of yTicks) if (t.value > E0 && t.value < E1) pieces.push([[plot.x, fr.y(t.value)], [plot.x + plot.w, fr.y(t.value)]]);
    gridItems.push(line('grid', pieces, ink.grid, Math.max(0.25, 0.35 * lw), null));
  }

  // Families.
  const familyItems: SceneItem[] = [];
  const mainSegs: Segment[] = model.boundaries.flatMap((b) => segsOf(figLine(b.points)));
  const familyLabelJobs: { runs: TextRun[]; pieces: Point[][] }[] = [];
  for (const fam of input.families ?? []) {
    for (const b of fam.boundaries) {
      const pieces = figLine(b.points).filter((p) => !coincides(p, mainSegs, 0.4));
      if (!pieces.length) continue;
      familyItems.push(line('family', pieces, ink.family, thin, null, { lineCap: 'round', data: { activity: fam.activity.toExponential(2) } }));
      layout.soft.push(...segsOf(pieces));
      familyLabelJobs.push({ runs: powerOfTenRuns(fam.activity), pieces });
    }
  }

  // Water lines.
  const waterItems: SceneItem[] = [];
  const hw = figLine(model.waterLines.hydrogen.points);
  const ow = figLine(model.waterLines.oxygen.points);
  if (o.show.water) {
    waterItems.push(line('water', hw, ink.water, 0.75 * lw, waterDash, { data: { couple: 'H2/H2O' } }));
    waterItems.push(line('water', ow, ink.water, 0.75 * lw, waterDash, { data: { couple: 'O2/H2O' } }));
    layout.soft.push(...segsOf(hw), ...segsOf(ow));
  }

  // Neutral line.
  const neutralItems: SceneItem[] = [];
  let neutralPiece: Point[] | null = null;
  if (o.show.neutral && input.neutralPH !== undefined && input.neutralPH > pH0 && input.neutralPH < pH1) {
    const x = fr.x(input.neutralPH);
    neutralPiece = [
      [x, plot.y + plot.h],
      [x, plot.y],
    ];
    neutralItems.push(line('neutral', [neutralPiece], ink.family, Math.max(0.5, 0.7 * lw), [0.01, 1.6 * k], { lineCap: 'round' }));
    layout.soft.push(...polylineSegments(neutralPiece));
  }

  // Overlays.
  const overlayItems: SceneItem[] = [];
  (input.overlays ?? []).forEach((ov, i) => {
    const pieces = ov.model.boundaries.flatMap((b) => figLine(b.points));
    if (!pieces.length) return;
    const st = dashStroke(parseDash(ov.dash, lw), 0.8 * lw);
    overlayItems.push(line('overlay', pieces, overlayInk(ov, i), 0.8 * lw, st.dash, { lineCap: st.lineCap, lineJoin: 'round', data: { label: ov.label } }));
    layout.soft.push(...segsOf(pieces));
  });

  // Boundaries.
  const boundaryItems: SceneItem[] = [];
  for (const b of model.boundaries) {
    const pieces = figLine(b.points);
    if (!pieces.length) continue;
    boundaryItems.push(line('boundary', pieces, ink.boundary, lw, null, { lineCap: 'round', lineJoin: 'round', data: { between: b.between.join('|') } }));
    layout.hard.push(...segsOf(pieces));
  }
  // Region edges that are not on a boundary (e.g. the solver's region outline) are hard too.
  for (const rings of regionRings) for (const s of ringSegments(rings)) if (!onFrame(s[0], s[1], plot)) layout.hard.push(s);

  // Triple points.
  const tripleItems: SceneItem[] = [];
  if (o.show.triplePoints) {
    for (const t of model.triplePoints) {
      const [cx, cy] = fr.toFig([t.pH, t.E]);
      if (cx < plot.x || cx > plot.x + plot.w || cy < plot.y || cy > plot.y + plot.h) continue;
      tripleItems.push({ type: 'circle', role: 'triple-point', cx, cy, r: 0.9 * lw + 0.5, fill: ink.boundary, stroke: null, strokeWidth: 0, data: { species: t.species.join('|') } });
    }
  }

  // Operating boxes, paths, points (marks; labels later).
  const markItems: SceneItem[] = [];
  const markW = Math.max(0.5, 0.8 * lw);
  const boxJobs: { rect: Rect; label: string }[] = [];
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
    markItems.push(line('box-hatch', hatch, ink.mark, Math.max(0.25, 0.3 * lw), null, { data: { label: bx.label } }));
    markItems.push({
      type: 'path',
      role: 'box',
      subpaths: [{ points: [[rect.x, rect.y], [rect.x + rect.w, rect.y], [rect.x + rect.w, rect.y + rect.h], [rect.x, rect.y + rect.h]], closed: true }],
      fill: null,
      stroke: ink.mark,
      strokeWidth: markW,
      dash: null,
      data: { label: bx.label },
    });
    layout.soft.push(...ringSegments([[[rect.x, rect.y], [rect.x + rect.w, rect.y], [rect.x + rect.w, rect.y + rect.h], [rect.x, rect.y + rect.h]]]));
    boxJobs.push({ rect, label: bx.label });
  }
  const pathJobs: { start: Point; label: string; segs: Segment[] }[] = [];
  const arrowTips: Rect[] = [];
  for (const p of input.paths ?? []) {
    if (p.points.length < 2) continue;
    const pieces = figLine(p.points);
    if (!pieces.length) continue;
    const last = pieces[pieces.length - 1]!;
    let tip = last[last.length - 1]!;
    const prev = last[last.length - 2]!;
    const len = Math.hypot(tip[0] - prev[0], tip[1] - prev[1]) || 1;
    const ux = (tip[0] - prev[0]) / len;
    const uy = (tip[1] - prev[1]) / len;
    const al = 2.6 * markW + 2.2;
    // A path that ends on an operating point stops at the marker's edge, so the arrowhead stays visible.
    const pointR = 1.1 * markW + 1.0;
    const onPoint = (input.points ?? []).some((q) => {
      const [qx, qy] = fr.toFig([q.pH, q.E]);
      return Math.hypot(qx - tip[0], qy - tip[1]) < pointR;
    });
    if (onPoint && len > al + pointR + 0.5) {
      tip = [tip[0] - ux * (pointR + 0.5), tip[1] - uy * (pointR + 0.5)];
      last[last.length - 1] = tip;
    }
    markItems.push(line('path', pieces, ink.mark, markW, null, { lineJoin: 'round', lineCap: 'round', data: { label: p.label } }));
    const aw = 0.45 * al;
    markItems.push({
      type: 'path',
      role: 'arrow',
      subpaths: [{ points: [tip, [tip[0] - ux * al - uy * aw, tip[1] - uy * al + ux * aw], [tip[0] - ux * al + uy * aw, tip[1] - uy * al - ux * aw]], closed: true }],
      fill: ink.mark,
      stroke: null,
      strokeWidth: 0,
      dash: null,
    });
    layout.soft.push(...segsOf(pieces));
    arrowTips.push(inflate({ x: tip[0] - ux * al * 0.5, y: tip[1] - uy * al * 0.5, w: 0, h: 0 }, al * 0.5));
    pathJobs.push({ start: pieces[0]![0]!, label: p.label, segs: segsOf(pieces) });
  }
  const pointJobs: { at: Point; label: string; r: number }[] = [];
  const pointR0 = 1.1 * markW + 1.0;
  for (const p of input.points ?? []) {
    const at = fr.toFig([p.pH, p.E]);
    if (at[0] < plot.x || at[0] > plot.x + plot.w || at[1] < plot.y || at[1] > plot.y + plot.h) continue;
    const r = pointR0;
    markItems.push({ type: 'circle', role: 'point', cx: at[0], cy: at[1], r, fill: ink.mark, stroke: '#ffffff', strokeWidth: 0.5, data: { label: p.label } });
    // Keep region labels off the marker.
    const q = r + 0.5;
    layout.soft.push(...ringSegments([[[at[0] - q, at[1] - q], [at[0] + q, at[1] - q], [at[0] + q, at[1] + q], [at[0] - q, at[1] + q]]]));
    pointJobs.push({ at, label: p.label, r });
  }

  // ---- Region labels --------------------------------------------------------------------------
  // One label per region, in its largest piece; the other pieces of a region in several pieces
  // get a label too where it fits inside them (no leaders for those).
  const polyArea = (rings: Point[][]): number => rings.reduce((s, ring) => s + Math.abs(ringArea(ring)), 0);
  const pieces: { i: number; k: number; area: number; main: boolean }[] = [];
  model.regions.forEach((_, i) => {
    const areas = regionPolys[i]!.map(polyArea);
    const mainK = areas.indexOf(Math.max(...areas));
    areas.forEach((area, k) => {
      if (area > 0) pieces.push({ i, k, area, main: k === mainK });
    });
  });
  pieces.sort((a, b) => Number(b.main) - Number(a.main) || b.area - a.area || a.i - b.i || a.k - b.k);
  const requests: RegionLabelRequest[] = pieces.map(({ i, k, main }) => ({
    key: `${i}:${k}`,
    runs: formulaRuns(model.regions[i]!.species),
    rings: regionPolys[i]![k]!,
    ...(main ? {} : { optional: true }),
  }));
  const minLabel = Math.max(MIN_FONT_PT, 0.7 * fs);
  const placements = placeRegionLabels(layout, requests, fs, minLabel);
  const labelItems: SceneItem[] = [];
  /** Fill of the region under a point (for knock-outs), white where there is none. */
  const fillAt = (p: Point): string => {
    for (let i = 0; i < regionRings.length; i++) if (insideRings(p, regionRings[i]!)) return fills[i] ?? '#ffffff';
    return '#ffffff';
  };
  for (const pl of placements) {
    if (!pl) continue;
    const ri = Number(pl.key.split(':')[0]);
    const r = model.regions[ri]!;
    if (layout.hits(pl.box, layout.soft) > 0) {
      // A soft line (water, family, …) runs under the label: knock it out with the fill under it.
      const kb = inflate(pl.box, 0.08 * pl.size);
      labelItems.push({
        type: 'path',
        role: 'label-knockout',
        subpaths: [{ points: [[kb.x, kb.y], [kb.x + kb.w, kb.y], [kb.x + kb.w, kb.y + kb.h], [kb.x, kb.y + kb.h]], closed: true }],
        fill: pl.leader ? fillAt([pl.cx, pl.cy]) : (fills[ri] ?? '#ffffff'),
        stroke: null,
        strokeWidth: 0,
        dash: null,
      });
    }
    const data = { species: r.species, placement: pl.leader ? 'outside' : 'inside' };
    if (pl.angle === 0) {
      const base = baselineForCentre(pl.runs, pl.size, pl.cy);
      labelItems.push(text('region-label', pl.runs, pl.cx, base, pl.size, 'middle', ink.text, { box: pl.box, data }));
    } else {
      // Reading upwards: the baseline is a vertical line right of the ink centre.
      const { top, bottom } = runsExtent(pl.runs, pl.size);
      labelItems.push(text('region-label', pl.runs, pl.cx - (top + bottom) / 2, pl.cy, pl.size, 'middle', ink.text, { rotate: -90, data }));
    }
    if (pl.leader) {
      labelItems.push(line('leader', [[pl.leader[0], pl.leader[1]]], ink.text, Math.max(0.3, 0.4 * lw), null, { lineCap: 'round', data: { species: r.species } }));
      labelItems.push({ type: 'circle', role: 'leader-dot', cx: pl.leader[0][0], cy: pl.leader[0][1], r: Math.max(0.5, 0.55 * lw), fill: ink.text, stroke: null, strokeWidth: 0 });
    }
  }
  for (const pj of pointJobs) layout.addBox(inflate({ x: pj.at[0], y: pj.at[1], w: 0, h: 0 }, pj.r + 0.3), 'point');

  // ---- Operating labels (before the water and family labels: the user's own marks come first) ----
  for (const bj of boxJobs) layout.addBox(bj.rect, 'box');
  for (const tip of arrowTips) layout.addBox(tip, 'arrow');
  const markLabel = (role: string, label: string, mark: Rect, kind: 'point' | 'box', own: Segment[] = []): void => {
    const runs = richRuns(label);
    const pl = placeMarkLabel(layout, runs, small, mark, kind, role, own);
    if (pl.overSoft) {
      const kb = inflate(pl.box, 0.08 * small);
      labelItems.push({
        type: 'path',
        role: 'label-knockout',
        subpaths: [{ points: [[kb.x, kb.y], [kb.x + kb.w, kb.y], [kb.x + kb.w, kb.y + kb.h], [kb.x, kb.y + kb.h]], closed: true }],
        fill: fillAt([pl.cx, pl.cy]),
        stroke: null,
        strokeWidth: 0,
        dash: null,
      });
    }
    labelItems.push(text(role, runs, pl.cx, baselineForCentre(runs, small, pl.cy), small, 'middle', ink.text, { box: pl.box, data: { label } }));
    if (pl.leader) labelItems.push(line('leader', [[pl.leader[0], pl.leader[1]]], ink.mark, Math.max(0.3, 0.4 * lw), null, { lineCap: 'round', data: { label } }));
  };
  // Boxes first (their labels have the fewest good places), then points, then paths.
  for (const bj of boxJobs) markLabel('box-label', bj.label, bj.rect, 'box');
  for (const pj of pointJobs) markLabel('point-label', pj.label, inflate({ x: pj.at[0], y: pj.at[1], w: 0, h: 0 }, pj.r + 0.3), 'point');
  for (const pj of pathJobs) markLabel('path-label', pj.label, inflate({ x: pj.start[0], y: pj.start[1], w: 0, h: 0 }, markW + 1), 'point', pj.segs);

  // ---- Water labels ---------------------------------------------------------------------------
  const gapLine = 0.28 * fs;
  const smallLabel = (role: string, runs: TextRun[], size: number, ob: OrientedBox, data?: Record<string, string>): SceneText => {
    const { top, bottom } = runsExtent(runs, size);
    // Baseline so that the ink box is centred on the box centre, in the rotated frame.
    const a = (ob.angle * Math.PI) / 180;
    const off = -(top + bottom) / 2;
    const bx = ob.cx - Math.sin(a) * off;
    const by = ob.cy + Math.cos(a) * off;
    return text(role, runs, bx, by, size, 'middle', role === 'water-label' ? ink.water : ink.text, { rotate: ob.angle, ...(ob.angle === 0 ? { box: orientedBounds(ob) } : {}), ...(data ? { data } : {}) });
  };
  const alongLine = (pieces: Point[][], runs: TextRun[], size: number, side: -1 | 1, fractions: number[], rotate: boolean): OrientedBox[] => {
    const longest = [...pieces].sort((a, b) => polylineLength(b) - polylineLength(a))[0];
    if (!longest) return [];
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
  };
  /** Unrotated boxes just past either end of the longest piece, along its direction (end first). */
  const beyondEnds = (pieces: Point[][], runs: TextRun[], size: number): OrientedBox[] => {
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
  };
  const waterFractions = [0.93, 0.86, 0.07, 0.14, 0.78, 0.22, 0.7, 0.3, 0.62, 0.38, 0.5];
  const waterSize = small;
  if (o.show.water) {
    const jobs: { pieces: Point[][]; text: string; side: -1 | 1; couple: string }[] = [
      { pieces: ow, text: '{O2}', side: 1, couple: 'O2/H2O' },
      { pieces: hw, text: '{H2}', side: -1, couple: 'H2/H2O' },
    ];
    for (const j of jobs) {
      const runs = richRuns(j.text);
      const cands = alongLine(j.pieces, runs, waterSize, j.side, waterFractions, true);
      const own = segsOf(j.pieces);
      let idx = firstFree(layout, cands, 0.15 * fs, true, own);
      if (idx < 0) idx = firstFree(layout, cands, 0.1 * fs, false, own);
      if (idx >= 0) {
        const ob = cands[idx]!;
        labelItems.push(smallLabel('water-label', runs, waterSize, ob, { couple: j.couple }));
        layout.addBox(orientedBounds(ob), 'water-label');
      }
    }
  }

  // ---- Overlay layer labels ----------------------------------------------------------------
  // Small formulas in each layer's ink, largest regions first over all layers (ties: earlier
  // layer), so that every layer gets its main fields named before any gets its small ones.
  {
    const size = Math.max(MIN_FONT_PT, fs * 0.75);
    const jobs: { req: LayerLabelRequest; area: number; layer: number; region: number; species: string }[] = [];
    (input.overlays ?? []).forEach((ov, li) => {
      // The layer is drawn in the base's frame (its points mapped with the base's scales).
      ov.model.regions.forEach((r, ri) => {
        const pieces = r.polygons
          .map((poly) => poly.map((ring) => simplifyCollinear(clipRing(ring.map((p) => fr.toFig(p)), plot), true)).filter((ring) => ring.length >= 3))
          .filter((rings) => rings.length > 0)
          .map((rings) => ({ rings, area: polyArea(rings) }))
          .filter((pc) => pc.area > 0)
          .sort((a, b) => b.area - a.area);
        if (!pieces.length) return;
        jobs.push({ req: { key: `${li}:${ri}`, name: r.species, runs: formulaRuns(r.species), pieces: pieces.map((pc) => pc.rings) }, area: pieces[0]!.area, layer: li, region: ri, species: r.species });
      });
    });
    jobs.sort((a, b) => b.area - a.area || a.layer - b.layer || a.region - b.region);
    // Fields of the same species that hold the base's label are named by it already.
    const named = placements.flatMap((pl) => (pl ? [{ name: model.regions[Number(pl.key.split(':')[0])]!.species, at: pl.leader ? pl.leader[0] : ([pl.cx, pl.cy] as Point) }] : []));
    const placed = placeLayerLabels(layout, jobs.map((j) => j.req), size, 0.15 * fs, named);
    placed.forEach((pl, k) => {
      if (!pl) return;
      const j = jobs[k]!;
      const ov = input.overlays![j.layer]!;
      const runs = j.req.runs;
      labelItems.push(text('overlay-label', runs, pl.cx, baselineForCentre(runs, size, pl.cy), size, 'middle', textInk(overlayInk(ov, j.layer)), { box: pl.box, data: { species: j.species, layer: ov.label } }));
    });
  }

  // ---- Family labels ------------------------------------------------------------------------
  const famSize = Math.max(MIN_FONT_PT, fs * 0.75);
  for (const job of familyLabelJobs) {
    const len = job.pieces.reduce((s, p) => s + polylineLength(p), 0);
    if (len < 2.5 * famSize) continue;
    const fr2 = [0.5, 0.35, 0.65, 0.2, 0.8, 0.1, 0.9];
    const cands = [
      ...beyondEnds(job.pieces, job.runs, famSize),
      ...alongLine(job.pieces, job.runs, famSize, 1, fr2, false),
      ...alongLine(job.pieces, job.runs, famSize, -1, fr2, false),
    ];
    const own = segsOf(job.pieces);
    const idx = firstFree(layout, cands, 0.02 * fs, true, own);
    if (idx >= 0) {
      const ob = cands[idx]!;
      labelItems.push(smallLabel('family-label', job.runs, famSize, ob));
      layout.addBox(orientedBounds(ob), 'family-label');
    }
  }

  // ---- Neutral label --------------------------------------------------------------------------
  if (neutralPiece) {
    const runs = plainRuns('neutral', true);
    const w = (runsWidth(runs, famSize) * FONT_SAFETY) / 2 + 0.1 * famSize;
    const { top, bottom } = runsExtent(runs, famSize);
    const h = (bottom - top) / 2;
    const x = neutralPiece[0]![0];
    const cands: OrientedBox[] = [];
    for (const f of [0.08, 0.92, 0.2, 0.8, 0.35, 0.65, 0.5]) {
      const cy = plot.y + plot.h * (1 - f);
      for (const side of [1, -1]) cands.push({ cx: x + side * (h + 0.3 * fs), cy, hx: w, hy: h, angle: -90 });
    }
    const idx = firstFree(layout, cands, 0.1 * fs, false);
    if (idx >= 0) {
      const ob = cands[idx]!;
      labelItems.push(smallLabel('neutral-label', runs, famSize, ob));
      layout.addBox(orientedBounds(ob), 'neutral-label');
    }
  }

  // ---- Ligand labels (only where they fit cleanly) -------------------------------------------
  for (const lj of ligandLabelReqs) {
    const size = famSize;
    const w = (runsWidth(lj.runs, size) * FONT_SAFETY) / 2 + 0.2 * size;
    const { top, bottom } = runsExtent(lj.runs, size);
    const h = (bottom - top) / 2 + 0.15 * size;
    const boxSegs = layout.boxes.flatMap((b) => rectSegments(b.rect));
    const pole = rectPole(lj.rings, [...layout.hard, ...layout.soft, ...boxSegs], w, h);
    if (pole.scale < 1) continue;
    const ob: OrientedBox = { cx: pole.point[0], cy: pole.point[1], hx: w - 0.2 * size, hy: h - 0.15 * size, angle: 0 };
    if (!layout.boxFree(orientedBounds(ob), 0.1 * fs)) continue;
    const t = smallLabel('ligand-label', lj.runs, size, ob);
    t.fill = ink.ligand;
    labelItems.push(t);
    layout.addBox(orientedBounds(ob), 'ligand-label');
  }

  // ---- Frame, ticks, axis titles -------------------------------------------------------------
  const frameW = Math.max(0.5, 0.6 * lw);
  const axisItems: SceneItem[] = [];
  axisItems.push({
    type: 'path',
    role: 'frame',
    subpaths: [{ points: [[plot.x, plot.y], [plot.x + plot.w, plot.y], [plot.x + plot.w, plot.y + plot.h], [plot.x, plot.y + plot.h]], closed: true }],
    fill: null,
    stroke: ink.frame,
    strokeWidth: frameW,
    dash: null,
    lineJoin: 'miter',
  });
  const ticks: Point[][] = [];
  const bottomY = plot.y + plot.h;
  for (const t of xTicks) {
    const x = fr.x(t.value);
    ticks.push([[x, bottomY], [x, bottomY + tickLen]]);
    axisItems.push(text('tick-label', plainRuns(t.label), x, bottomY + xLabelBase, fs, 'middle', ink.text, { data: { axis: 'pH', value: String(t.value) } }));
  }
  for (const t of yTicks) {
    const y = fr.y(t.value);
    ticks.push([[plot.x, y], [plot.x - tickLen, y]]);
    axisItems.push(text('tick-label', plainRuns(t.label), plot.x - tickLen - tickGap, y + (CAP_HEIGHT * fs) / 2, fs, 'end', ink.text, { data: { axis: 'E', value: String(t.value) } }));
  }
  const rx = plot.x + plot.w;
  for (const t of y2Ticks) {
    const y = fr.y(t.value + off);
    ticks.push([[rx, y], [rx + tickLen, y]]);
    axisItems.push(text('tick-label', plainRuns(t.label), rx + tickLen + tickGap, y + (CAP_HEIGHT * fs) / 2, fs, 'start', ink.text, { data: { axis: 'E2', value: String(t.value) } }));
  }
  axisItems.push(line('tick', ticks, ink.frame, frameW, null));
  const axisSize = fs;
  axisItems.push(text('axis-title', plainRuns('pH'), plot.x + plot.w / 2, bottomY + xTitleBase, axisSize, 'middle', ink.text, { data: { axis: 'pH' } }));
  const yTitleX = pad + CAP_HEIGHT * axisSize;
  axisItems.push(text('axis-title', quantityRuns('E / V vs SHE'), yTitleX, plot.y + plot.h / 2, axisSize, 'middle', ink.text, { rotate: -90, data: { axis: 'E' } }));
  if (o.secondAxis) {
    const x2 = W - pad - 0.2 * axisSize;
    axisItems.push(text('axis-title', quantityRuns(o.secondAxis.label), x2, plot.y + plot.h / 2, axisSize, 'middle', ink.text, { rotate: -90, data: { axis: 'E2' } }));
  }

  // ---- Title, legend, caption -----------------------------------------------------------------
  const outerItems: SceneItem[] = [];
  if (showTitle) {
    outerItems.push(text('title', titleRuns, W / 2, pad + CAP_HEIGHT * titleSize, titleSize, 'middle', ink.text, { bold: true }));
  }
  legendRows.forEach((row, ri) => {
    let x = pad;
    const cy = bottomY + legendTop + ri * legRowH + legRowH / 2;
    for (const e of row) {
      const sw = sampleW(e);
      if (e.kind === 'swatch') {
        const s = legSize * 0.95;
        outerItems.push({
          type: 'path',
          role: 'legend-swatch',
          subpaths: [{ points: [[x, cy - s / 2], [x + sw, cy - s / 2], [x + sw, cy + s / 2], [x, cy + s / 2]], closed: true }],
          fill: e.fill ?? null,
          stroke: '#4d4d4d',
          strokeWidth: 0.35,
          dash: null,
        });
      } else {
        const st = dashStroke(e.dash ?? null, e.width!);
        // A dotted sample starts and ends inside the swatch width (round caps reach half a width out).
        const inset = st.lineCap === 'round' ? e.width! / 2 : 0;
        outerItems.push(line('legend-line', [[[x + inset, cy], [x + sw - inset, cy]]], e.stroke!, e.width!, st.dash, { lineCap: st.lineCap }));
      }
      const tx = x + sw + 0.4 * legSize;
      outerItems.push(text('legend-label', e.runs, tx, baselineForCentre(e.runs, legSize, cy), legSize, 'start', ink.text, { box: textBox(e.runs, legSize, tx, baselineForCentre(e.runs, legSize, cy), 'start') }));
      x += entryW(e) + 1.4 * legSize;
    }
  });
  captionLines.forEach((l, i) => {
    const y = bottomY + captionTop + CAP_HEIGHT * capSize + i * capLead;
    outerItems.push(text('caption', plainRuns(l.text, l.italic), pad, y, capSize, 'start', ink.text));
  });

  // ---- Assemble -------------------------------------------------------------------------------
  const plotGroup: SceneGroup = {
    type: 'group',
    role: 'plot',
    clip: plot,
    children: [...under, ...ligandItems, ...gridItems, ...familyItems, ...waterItems, ...neutralItems, ...overlayItems, ...boundaryItems, ...tripleItems, ...markItems],
  };
  const items: SceneItem[] = [
    plotGroup,
    { type: 'group', role: 'axes', children: axisItems },
    { type: 'group', role: 'labels', children: labelItems },
    { type: 'group', role: 'annotations', children: outerItems },
  ];
  return {
    widthPt: W,
    heightPt: H,
    widthMm: o.width,
    heightMm: o.height,
    fontFamily: o.fontFamily,
    background: '#ffffff',
    plot,
    frame: { x0: plot.x, x1: plot.x + plot.w, y0: plot.y + plot.h, y1: plot.y, pH: [pH0, pH1], E: [E0, E1] },
    items,
    title: runsUnicode(titleRuns),
  };
}

function onFrame(a: Point, b: Point, r: Rect): boolean {
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
function coincides(piece: Point[], segs: readonly Segment[], tol: number): boolean {
  const probes: Point[] = [...piece];
  for (let i = 0; i + 1 < piece.length; i++) probes.push([(piece[i]![0] + piece[i + 1]![0]) / 2, (piece[i]![1] + piece[i + 1]![1]) / 2]);
  return probes.every((p) => segs.some(([a, b]) => segmentDistance(p, a, b) <= tol));
}

const rectSegments = boxSegments;

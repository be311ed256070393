/**
 * The legend and the caption of a figure: which entries and lines there are, how they wrap into
 * rows (layout), and their scene items once the plot is placed (drawing).
 */
import { elementAmountText } from '../report/format.js';
import type { RegionClass } from '../model.js';
import { textBox, baselineForCentre } from './labels.js';
import { CAP_HEIGHT, runsWidth } from './metrics.js';
import { CLASS_NAMES, CLASS_TINTS, fillGroup, toGray, UNDETERMINED_FILL } from './palette.js';
import { dashStroke, line, overlayInk, parseDash, PROSE_SAFETY, rectPath, text, wrapText, type LegendEntry, type SceneBase, type SceneContext } from './scene-context.js';
import { bathLegendEntries } from './scene-iso.js';
import { drawsLigands, ligandDash, neutralDash } from './scene-lines.js';
import type { SceneItem, TextRun } from './scene-types.js';
import { formulaRuns, plainRuns, powerOfTenRuns, richRuns } from './typeset.js';

/** The caution printed with every caption. */
export const CAUTION =
  'Equilibrium thermodynamics only \u2014 not kinetics: no rates, film quality or localized attack. A screening aid, not a design rule.';

/** Caption lines wrapped to the inner width: the caller's lines, then the caution in italics. */
export function captionLines(b: SceneBase, capSize: number, innerW: number): { text: string; italic: boolean }[] {
  const out: { text: string; italic: boolean }[] = [];
  if (!b.o.show.caption) return out;
  for (const c of b.input.caption ?? []) for (const l of wrapText(c, capSize, innerW)) out.push({ text: l, italic: false });
  for (const l of wrapText(CAUTION, capSize, innerW)) out.push({ text: l, italic: true });
  return out;
}

/** Class swatches, by tint group: a region's class, or the group of the verdict it was reclassified to. */
function swatchEntries(b: SceneBase): LegendEntry[] {
  const { o, model } = b;
  const known = model.regions.filter((r) => !r.undetermined);
  const present = new Set<RegionClass>(known.map((r) => fillGroup(r.class, r.verdict)));
  const reclassified = (c: RegionClass): string[] => [...new Set(known.filter((r) => r.class !== c && fillGroup(r.class, r.verdict) === c).map((r) => r.species))].sort();
  const out: LegendEntry[] = [];
  for (const c of ['element', 'solid', 'dissolved', 'gas'] as RegionClass[]) {
    if (!present.has(c)) continue;
    const tint = CLASS_TINTS[c][0]!;
    const moved = model.kind === 'alloy' ? [] : reclassified(c);
    const runs = model.kind === 'alloy' ? plainRuns(alloySwatchName(c, model.regions.some((r) => r.species.includes('(aq)')))) : moved.length ? [...plainRuns(`${CLASS_NAMES[c]}; reclassified: `), ...moved.flatMap((f, i) => [...(i ? plainRuns(', ') : []), ...formulaRuns(f)])] : plainRuns(CLASS_NAMES[c]);
    out.push({ kind: 'swatch', group: c, fill: o.style === 'gray' ? toGray(tint) : tint, runs });
  }
  const und = [...new Set(model.regions.filter((r) => r.undetermined).map((r) => r.species))].sort();
  if (und.length || model.composition?.heldBy?.length) {
    // Short, to share a legend row; the caption names the species (figure/compose.ts).
    out.push({ kind: 'swatch', fill: UNDETERMINED_FILL, runs: plainRuns('undetermined') });
  }
  return out;
}

/** Alloy kind: the swatch names by assemblage verdict, naming the elements that dissolve; where a
 *  label holds a neutral dissolved species (tagged "(aq)"), the key says that it is dissolved too. */
function alloySwatchName(c: RegionClass, neutralDissolved: boolean): string {
  if (c === 'element') return 'metals (immune)';
  if (c === 'solid') return 'solids only (passive)';
  if (c === 'dissolved') return 'all dissolved (corroding)';
  return neutralDissolved ? 'partly corroding: ions and (aq) species in the label dissolved' : 'partly corroding: dissolved species in the label';
}

/** Every legend entry in order: swatches, the base boundaries, families, water, overlay layers. */
export function legendEntries(b: SceneBase, tagged = false): LegendEntry[] {
  const { o, input, model, ink, lw, thin } = b;
  // The numbered regions' key is kept even without a legend: it names regions the plot cannot.
  if (!o.show.legend) return regionKeyEntries(b);
  const legend: LegendEntry[] = o.style !== 'lines' ? swatchEntries(b) : [];
  if ((input.families?.length ?? 0) > 0 || (input.overlays?.length ?? 0) > 0) {
    const runs: TextRun[] =
      input.baseLabel !== undefined
        ? richRuns(input.baseLabel)
        : model.amounts && model.amounts.element.kind !== 'activity'
          ? plainRuns(`boundaries, ${elementAmountText(model)}`)
          : [...plainRuns('boundaries, '), { text: 'a', shift: 'normal', italic: true }, ...plainRuns(' = '), ...powerOfTenRuns(model.activity)];
    legend.push({ kind: 'line', stroke: ink.boundary, width: lw, dash: null, runs });
  }
  if ((input.families?.length ?? 0) > 0) {
    // One key for the family: "a = 1, 10⁻², 10⁻⁴", and what the tags at the line ends say (log a).
    const acts = input.families!.map((f) => f.activity);
    const a: TextRun = { text: 'a', shift: 'normal', italic: true };
    const runs: TextRun[] = [a, ...plainRuns(' = '), ...acts.flatMap((x, i) => [...(i ? plainRuns(', ') : []), ...powerOfTenRuns(x)])];
    legend.push({ kind: 'line', stroke: ink.family, width: thin, dash: null, runs });
    // What the tags say, as an entry of its own (it wraps to the next row on a narrow figure).
    if (tagged) legend.push({ kind: 'key', runs: [...plainRuns('tags: log '), a] });
  }
  if (o.show.water) legend.push({ kind: 'line', stroke: ink.water, width: 0.75 * lw, dash: b.waterDash, runs: richRuns('water stability limits') });
  legend.push(...bathLegendEntries(b));
  const [pH0, pH1] = model.domain.pH;
  if (o.show.neutral && input.neutralPH !== undefined && input.neutralPH > pH0 && input.neutralPH < pH1) {
    legend.push({ kind: 'line', stroke: ink.family, width: Math.max(0.5, 0.7 * lw), dash: neutralDash(b.k), runs: plainRuns('neutral water') });
  }
  if (drawsLigands(o, model)) legend.push({ kind: 'line', stroke: ink.ligand, width: thin * 0.8, dash: ligandDash(b.k), runs: plainRuns('ligand acid\u2013base boundaries') });
  (input.overlays ?? []).forEach((ov, i) => {
    legend.push({ kind: 'line', stroke: overlayInk(ink, ov, i), width: 0.8 * lw, dash: parseDash(ov.dash, lw), runs: richRuns(ov.label) });
  });
  legend.push(...regionKeyEntries(b));
  return legend;
}

/** Width of an entry's sample (swatch or line) at legend size `legSize`. */
const sampleW = (e: LegendEntry, legSize: number): number => (e.kind === 'swatch' ? legSize * 1.6 : e.kind === 'key' ? 0 : legSize * 2.6);

/** Key entries of the numbered regions: "1 Cr₂O₃ + Fe₃O₄ + Ni" (figure input regionNumbers). */
function regionKeyEntries(b: SceneBase): LegendEntry[] {
  return (b.input.regionNumbers ?? []).map((species, i) => ({ kind: 'key', runs: [...plainRuns(`${i + 1} `), ...formulaRuns(species)], data: { species, number: String(i + 1) } }));
}

/** Width of an entry: sample, gap, text. */
const entryW = (e: LegendEntry, legSize: number): number => sampleW(e, legSize) + 0.4 * legSize + runsWidth(e.runs, legSize) * PROSE_SAFETY;

/** Entries wrapped greedily into rows of at most `innerW` pt. */
export function legendRows(legend: LegendEntry[], legSize: number, innerW: number, gapEm = 1.4): LegendEntry[][] {
  const rows: LegendEntry[][] = [];
  let row: LegendEntry[] = [];
  let x = 0;
  for (const e of legend) {
    const w = entryW(e, legSize);
    // The numbered regions' key starts a row of its own.
    const numbered = (x: LegendEntry): boolean => x.kind === 'key' && x.data?.number !== undefined;
    const keyStarts = numbered(e) && row.length > 0 && !numbered(row[row.length - 1]!);
    if (row.length > 0 && (x + w > innerW || keyStarts)) {
      rows.push(row);
      row = [];
      x = 0;
    }
    row.push(e);
    x += w + gapEm * legSize;
  }
  if (row.length) rows.push(row);
  return rows;
}

/**
 * Tints a swatch shows: every fill used by the regions of its group (the class's tints in their
 * order, then per-species colours), else the entry's own fill.
 */
function swatchTints(ctx: SceneContext, e: LegendEntry, fills: readonly (string | null)[]): string[] {
  const used = new Set<string>();
  ctx.model.regions.forEach((r, i) => {
    const f = fills[i];
    if (f && fillGroup(r.class, r.verdict) === e.group) used.add(f);
  });
  const order = CLASS_TINTS[e.group ?? 'solid'].map((t) => (ctx.o.style === 'gray' ? toGray(t) : t));
  const tints = [...order.filter((t) => used.has(t)), ...[...used].filter((t) => !order.includes(t)).sort()];
  return tints.length ? tints : [e.fill ?? '#ffffff'];
}

/** A swatch: one rectangle, or side-by-side stripes of every tint in use, outlined once. */
function swatchItems(r: { x: number; y: number; w: number; h: number }, tints: string[]): SceneItem[] {
  const sw = r.w / tints.length;
  const stripes = tints.map((t, k) => rectPath('legend-swatch', { x: r.x + k * sw, y: r.y, w: sw, h: r.h }, { fill: t }));
  return [...stripes, rectPath('legend-swatch-frame', r, { stroke: '#4d4d4d', strokeWidth: 0.35 })];
}

/** A line entry's sample from x to x + sw at height cy (legends of the diagram and of the shares plot). */
export function legendLineSample(e: LegendEntry, x: number, sw: number, cy: number): SceneItem {
  const st = dashStroke(e.dash ?? null, e.width!);
  // A dotted sample starts and ends inside the swatch width (round caps reach half a width out).
  const inset = st.lineCap === 'round' ? e.width! / 2 : 0;
  return line('legend-line', [[[x + inset, cy], [x + sw - inset, cy]]], e.stroke!, e.width!, st.dash, { lineCap: st.lineCap });
}

/** An entry's label, starting at tx, its text centred on cy. */
export function legendLabel(e: LegendEntry, tx: number, cy: number, size: number, fill: string): SceneItem {
  const base = baselineForCentre(e.runs, size, cy);
  return text('legend-label', e.runs, tx, base, size, 'start', fill, { box: textBox(e.runs, size, tx, base, 'start'), ...(e.data ? { data: e.data } : {}) });
}

/**
 * Legend rows below the x-axis title: sample (swatch or line) then label, left to right. `fills`
 * (the regions' fills, as drawn) lets each swatch show every tint its group uses.
 */
export function legendItems(ctx: SceneContext, fills: readonly (string | null)[] = []): SceneItem[] {
  const { bands, pad, plot, ink } = ctx;
  const { legSize, legRowH } = bands;
  const bottomY = plot.y + plot.h;
  const out: SceneItem[] = [];
  bands.legendRows.forEach((row, ri) => {
    let x = pad;
    const cy = bottomY + bands.legendTop + ri * legRowH + legRowH / 2;
    for (const e of row) {
      const sw = sampleW(e, legSize);
      if (e.kind === 'swatch') {
        const s = legSize * 0.95;
        out.push(...swatchItems({ x, y: cy - s / 2, w: sw, h: s }, swatchTints(ctx, e, fills)));
      } else if (e.kind === 'line') {
        out.push(legendLineSample(e, x, sw, cy));
      }
      out.push(legendLabel(e, x + (e.kind === 'key' ? 0 : sw + 0.4 * legSize), cy, legSize, ink.text));
      x += entryW(e, legSize) + bands.legGap * legSize;
    }
  });
  return out;
}

/** Caption lines below the legend, left-aligned. */
export function captionItems(ctx: SceneContext): SceneItem[] {
  const { bands, pad, plot, ink } = ctx;
  const bottomY = plot.y + plot.h;
  return bands.captionLines.map((l, i) => {
    const y = bottomY + bands.captionTop + CAP_HEIGHT * bands.capSize + i * bands.capLead;
    return text('caption', plainRuns(l.text, l.italic), pad, y, bands.capSize, 'start', ink.text);
  });
}

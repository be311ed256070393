/**
 * Composition-mode layers of the figure: the undetermined areas (where the point solver failed; a
 * fill of their own, never blank) and the iso-solubility lines (contours of the total dissolved
 * main element, thin dashed lines in their own ink, each labelled with its level in mol/kg along
 * the line where the label fits), with their legend entries. Pure: no I/O.
 */
import type { DiagramModel } from '../model.js';
import { polylineLength } from './geometry.js';
import { firstFree } from './labels.js';
import { MIN_FONT_PT } from './options.js';
import { clipPolygons } from './scene-fills.js';
import { alongLine, beyondEnds, placeFirst } from './scene-line-labels.js';
import { figLine, line, segsOf, type LegendEntry, type SceneBase, type SceneContext } from './scene-context.js';
import type { Point, SceneItem, TextRun } from './scene-types.js';
import { plainRuns } from './typeset.js';

/** Dash of the iso-solubility lines: long dashes, short gaps (apart from water's and the neutral line's). */
export const isoDash = (k: number): number[] => [2.4 * k, 1.0 * k];

/** Width of the iso-solubility lines, pt. */
const isoWidth = (b: SceneBase): number => Math.max(0.35, 0.7 * b.thin);

/**
 * A level in mol/kg as text runs: a decade as 10⁻⁶, any other value as mantissa×10ⁿ (3×10⁻⁵);
 * values from 0.01 to 10 plainly (0.05).
 */
export function levelRuns(level: number): TextRun[] {
  const e = Math.floor(Math.log10(level) + 1e-9);
  const mant = Number((level / 10 ** e).toPrecision(2));
  const sup = (n: number): TextRun => ({ text: String(n).replace('-', '\u2212'), shift: 'sup' });
  if (Math.abs(mant - 1) < 1e-9) return e === 0 ? plainRuns('1') : [{ text: '10', shift: 'normal' }, sup(e)];
  if (level >= 0.01) return plainRuns(String(Number(level.toPrecision(2))));
  return [{ text: `${mant}\u00d710`, shift: 'normal' }, sup(e)];
}

/** Undetermined areas (grid resolution), over the region fills. */
export function undeterminedFills(ctx: SceneContext): SceneItem[] {
  const polys = clipPolygons(ctx, ctx.model.composition?.undetermined ?? []);
  if (!polys.length) return [];
  return [{ type: 'path', role: 'undetermined', subpaths: polys.flat().map((points) => ({ points, closed: true })), fill: ctx.ink.undetermined, fillRule: 'evenodd', stroke: null, strokeWidth: 0, dash: null, data: { reading: 'undetermined' } }];
}

/** The iso-solubility lines (soft obstacles) and their label jobs. */
export function isoLines(ctx: SceneContext): { items: SceneItem[]; labels: { runs: TextRun[]; pieces: Point[][]; level: number }[] } {
  const items: SceneItem[] = [];
  const labels: { runs: TextRun[]; pieces: Point[][]; level: number }[] = [];
  const w = isoWidth(ctx);
  for (const iso of ctx.model.isoSolubility ?? []) {
    const pieces = iso.lines.flatMap((l) => figLine(ctx, l));
    if (!pieces.length) continue;
    items.push(line('iso-solubility', pieces, ctx.ink.iso, w, isoDash(ctx.k), { lineJoin: 'round', data: { level: iso.level.toExponential(2) } }));
    ctx.layout.soft.push(...segsOf(pieces));
    labels.push({ runs: levelRuns(iso.level), pieces, level: iso.level });
  }
  return { items, labels };
}

/** Each level's label beside its longest piece (middle first, then towards the ends), where it fits. */
export function isoLabels(ctx: SceneContext, jobs: { runs: TextRun[]; pieces: Point[][]; level: number }[], out: SceneItem[]): void {
  const size = Math.max(MIN_FONT_PT, ctx.fs * 0.7);
  for (const job of jobs) {
    if (job.pieces.reduce((s, p) => s + polylineLength(p), 0) < 2.5 * size) continue;
    const fr = [0.5, 0.35, 0.65, 0.2, 0.8, 0.1, 0.9];
    // Turned along the line, always reading upwards (a vertical line gives +90°: turn it half round).
    const along = [...alongLine(ctx, job.pieces, job.runs, size, 1, fr, true), ...alongLine(ctx, job.pieces, job.runs, size, -1, fr, true)].map((c) => (c.angle > 89.999 ? { ...c, angle: c.angle - 180 } : c));
    const cands = [...along, ...beyondEnds(job.pieces, job.runs, size)];
    const idx = firstFree(ctx.layout, cands, 0.02 * ctx.fs, true, segsOf(job.pieces));
    placeFirst(ctx, out, 'iso-label', job.runs, size, cands, idx, { level: job.level.toExponential(2) });
  }
}

/** Legend entries of the composition layers: iso-solubility lines, undetermined areas. */
export function bathLegendEntries(b: SceneBase): LegendEntry[] {
  const out: LegendEntry[] = [];
  if ((b.model.isoSolubility ?? []).some((l) => l.lines.length > 0)) {
    out.push({ kind: 'line', stroke: b.ink.iso, width: isoWidth(b), dash: isoDash(b.k), runs: plainRuns(`dissolved ${b.model.element} total, mol/kg`) });
  }
  if ((b.model.composition?.undetermined.length ?? 0) > 0) {
    out.push({ kind: 'swatch', fill: b.ink.undetermined, runs: plainRuns(`undetermined (${undeterminedCause(b.model)})`) });
  }
  return out;
}

/** Why the undetermined areas are undetermined: failed points, gaps left near junctions, or both. */
export function undeterminedCause(model: DiagramModel): string {
  const c = model.composition;
  const gaps = c?.unresolved ?? 0;
  const failed = (c?.undetermined.length ?? 0) > gaps;
  return failed && gaps ? 'not solved or not resolved' : gaps ? 'not resolved at this grid' : 'not solved';
}

/**
 * The frame around the plot, tick marks and labels on the pH, E and (optional) second E axis, the
 * axis titles, and the figure title above the plot.
 */
import type { Tick } from './axes.js';
import { CAP_HEIGHT, FONT_SAFETY, runsWidth } from './metrics.js';
import { textBox } from './labels.js';
import { line, rectPath, text, type SceneContext } from './scene-context.js';
import type { Point, SceneItem } from './scene-types.js';
import { plainRuns, quantityRuns } from './typeset.js';

/** Tick marks (outwards) and labels of one axis; `at` places a tick value in figure points. */
function axisTicks(ctx: SceneContext, axis: 'pH' | 'E' | 'E2', ticks: Tick[], ticksOut: Point[][], items: SceneItem[]): void {
  const { fr, plot, fs, tickLen, tickGap, ink, bands } = ctx;
  const bottomY = plot.y + plot.h;
  const rx = plot.x + plot.w;
  for (const t of ticks) {
    const data = { axis, value: String(t.value) };
    if (axis === 'pH') {
      const x = fr.x(t.value);
      ticksOut.push([[x, bottomY], [x, bottomY + tickLen]]);
      items.push(text('tick-label', plainRuns(t.label), x, bottomY + bands.xLabelBase, fs, 'middle', ink.text, { data }));
    } else if (axis === 'E') {
      const y = fr.y(t.value);
      ticksOut.push([[plot.x, y], [plot.x - tickLen, y]]);
      items.push(text('tick-label', plainRuns(t.label), plot.x - tickLen - bands.tagCols.left - tickGap, y + (CAP_HEIGHT * fs) / 2, fs, 'end', ink.text, { data }));
    } else {
      const y = fr.y(t.value + bands.off);
      ticksOut.push([[rx, y], [rx + tickLen, y]]);
      items.push(text('tick-label', plainRuns(t.label), rx + tickLen + tickGap, y + (CAP_HEIGHT * fs) / 2, fs, 'start', ink.text, { data }));
    }
  }
}

/** Frame, ticks with their labels (pH, E, second E), then the axis titles. */
export function axisItems(ctx: SceneContext): SceneItem[] {
  const { o, plot, lw, ink, fs, pad, W, bands } = ctx;
  const frameW = Math.max(0.5, 0.6 * lw);
  const items: SceneItem[] = [rectPath('frame', plot, { stroke: ink.frame, strokeWidth: frameW, lineJoin: 'miter' })];
  const ticks: Point[][] = [];
  axisTicks(ctx, 'pH', bands.xTicks, ticks, items);
  axisTicks(ctx, 'E', bands.yTicks, ticks, items);
  axisTicks(ctx, 'E2', bands.y2Ticks, ticks, items);
  items.push(line('tick', ticks, ink.frame, frameW, null));
  const bottomY = plot.y + plot.h;
  items.push(text('axis-title', plainRuns('pH'), plot.x + plot.w / 2, bottomY + bands.xTitleBase, fs, 'middle', ink.text, { data: { axis: 'pH' } }));
  const yTitleX = pad + CAP_HEIGHT * fs;
  items.push(text('axis-title', quantityRuns('E / V vs SHE'), yTitleX, plot.y + plot.h / 2, fs, 'middle', ink.text, { rotate: -90, data: { axis: 'E' } }));
  if (o.secondAxis) {
    const x2 = W - pad - 0.2 * fs;
    items.push(text('axis-title', quantityRuns(o.secondAxis.label), x2, plot.y + plot.h / 2, fs, 'middle', ink.text, { rotate: -90, data: { axis: 'E2' } }));
  }
  return items;
}

/** The bold title centred above the plot (when shown), one item per wrapped line. */
export function titleItems(ctx: SceneContext): SceneItem[] {
  const { bands, W, pad, ink } = ctx;
  if (!bands.showTitle) return [];
  return bands.titleLines.map((runs, i) => {
    const y = pad + CAP_HEIGHT * bands.titleSize + i * bands.titleLead;
    // The layout box of bold text: the regular box widened to the bold width.
    const box = textBox(runs, bands.titleSize, W / 2, y, 'middle');
    const w = runsWidth(runs, bands.titleSize, true) * FONT_SAFETY;
    return text('title', runs, W / 2, y, bands.titleSize, 'middle', ink.text, { bold: true, box: { ...box, x: W / 2 - w / 2, w } });
  });
}

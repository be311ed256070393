/**
 * The renderer's FigureInput for an alloy diagram (issue 18): caption (composition, thresholds,
 * what the diagram does not say), operating marks from the file, and for a composition sweep the
 * other compositions' boundaries as keyed overlay layers (one dash style per fraction).
 */
import type { DiagramModel } from '../model.js';
import type { FigureInput } from '../render/scene.js';
import type { AlloySpec } from '../system/alloy-spec.js';
import { fmtCelsius, ligandAmountTexts, powerOfTen, shortSource } from '../report/format.js';
import { temperatureCaveats } from './compose.js';
import type { FigureSettings } from './options.js';
import { placeOperatingMarks } from './operating-marks.js';

/** Dash patterns of the sweep layers, in turn (pt, scaled by the renderer's line width). */
const SWEEP_DASHES = ['4 2', '1.5 1.5', '6 2 1.5 2', '8 3', '2 3'];

/** "Fe 70 %, Cr 18 %, Ni 12 % (atoms)". */
export function compositionText(c: Record<string, number>): string {
  return `${Object.entries(c).map(([e, x]) => `${e} ${(100 * x).toFixed(x < 0.1 ? 1 : 0)} %`).join(', ')} (atom %)`;
}

export function alloyCaption(model: DiagramModel): string[] {
  const a = model.alloy!;
  const acts = Object.entries(a.activities);
  const same = acts.every(([, v]) => v === acts[0][1]);
  const th = same ? `dissolved species of every element at activity ${powerOfTen(acts[0][1])}` : `dissolved ${acts.map(([e, v]) => `${e} ${powerOfTen(v)}`).join(', ')}`;
  const lig = ligandAmountTexts(model);
  const lines = [
    `Alloy ${compositionText(a.composition)} in water at ${fmtCelsius(model.temperature.celsius)} °C; ${th}${lig.length ? `; ligand totals ${lig.join(', ')}` : ''}.`,
    'Assemblages of lowest grand potential; pure phases (no solid solutions).',
    ...temperatureCaveats(model),
  ];
  const short = model.sources.map(shortSource).filter((s, k, arr) => arr.indexOf(s) === k);
  if (short.length) lines.push(`Data: ${short.join('; ')}.`);
  return lines;
}

export function alloyFigureInput(model: DiagramModel, spec: AlloySpec, fig: FigureSettings, sweep: { label: string; model: DiagramModel }[] = []): FigureInput {
  const input: FigureInput = { model, options: fig.options };
  if (fig.options.show.caption) input.caption = alloyCaption(model);
  placeOperatingMarks(input, spec.base.operating, spec.base.temperature);
  if (sweep.length) {
    input.baseLabel = `${compositionText(model.alloy!.composition)} (filled)`;
    input.overlays = sweep.map((s, i) => ({ label: s.label, model: s.model, dash: SWEEP_DASHES[i % SWEEP_DASHES.length] }));
  }
  return input;
}

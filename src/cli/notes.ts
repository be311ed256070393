/** Reporting what the figure layout did to fit the requested size, on stderr. */
import type { DiagramModel } from '../model.js';

/** Writes each figure note of the model as `note: figure: …` on stderr. */
export function reportFigureNotes(model: DiagramModel, prefix = ''): void {
  for (const n of model.figureNotes ?? []) process.stderr.write(`note: ${prefix}figure: ${n}\n`);
}

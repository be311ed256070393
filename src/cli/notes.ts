/** Reporting what the figure layout did to fit the requested size, on stderr. */
import { textForPeople } from '../chem/present.js';
import type { DiagramModel } from '../model.js';

/** Writes each figure note of the model as `note: figure: …` on stderr. */
export function reportFigureNotes(model: DiagramModel, prefix = ''): void {
  for (const n of model.figureNotes ?? []) process.stderr.write(`note: ${prefix}figure: ${n}\n`);
}

/**
 * The warnings of several lists, each once in first-seen order (the model's and a reference
 * electrode's may both carry the same one), written as `warning: …` on stderr; returns that list
 * for the JSON `warnings` so that stderr and JSON agree.
 */
export function writeWarnings(...lists: readonly (readonly string[])[]): string[] {
  const once = [...new Set(lists.flat())];
  for (const w of once) process.stderr.write(`warning: ${textForPeople(w)}\n`);
  return once;
}

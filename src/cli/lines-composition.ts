/**
 * `lines` on a composition-mode file: each boundary curve with the exchange reaction at its
 * midpoint and its span (report/composition-lines.ts). Called by cli/core.ts.
 */
import { textForPeople } from '../chem/present.js';
import { displayReference } from '../analysis/points.js';
import { computeComposition } from '../diagram/composition.js';
import { compositionLineRows, compositionLinesText } from '../report/composition-lines.js';
import { stableJson } from '../report/json.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import type { SystemSpec } from '../system/spec.js';

export function linesComposition(spec: SystemSpec, opts: { json?: boolean; ref?: string }): void {
  const { model } = computeComposition(spec);
  const ref = opts.ref === undefined ? undefined : displayReference(readReference(new Fields('command line'), opts.ref, '--ref'), spec.temperature, 'command line', '--ref');
  for (const w of [...model.warnings, ...(ref?.warnings ?? [])]) process.stderr.write(`warning: ${textForPeople(w)}\n`);
  if (opts.json) {
    const lines = compositionLineRows(model, ref);
    process.stdout.write(stableJson({ mode: 'composition', basis: 'the bath as made up', element: model.element, temperature: model.temperature, units: model.units, totals: model.composition?.totals, ...(ref ? { reference: { id: ref.id, label: ref.label, offset: ref.offset } } : {}), lines, waterLines: model.waterLines }));
  } else process.stdout.write(compositionLinesText(model, ref));
}

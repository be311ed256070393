/**
 * `report` on a composition-mode file (the bath as made up): the composition diagram as the
 * figure, boundaries as curves, the speciation at the file's operating points, the plating window
 * (when the file sets platingWindow: true).
 * Everything is computed before anything is written. Called by cli/report.ts.
 */
import { textForPeople } from '../chem/present.js';
import { basename, dirname, extname, join } from 'node:path';
import { compositionWindow } from '../analysis/composition-window.js';
import { displayReference } from '../analysis/points.js';
import { withSecondAxis } from '../figure/compose.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import type { FigureSettings } from '../figure/options.js';
import { placeOperatingMarks } from '../figure/operating-marks.js';
import { renderFigure } from '../figure/output.js';
import { writeOne, writeSet } from './outputs.js';
import { buildScene } from '../render/scene.js';
import type { FigureInput } from '../render/scene-context.js';
import { compositionReportData } from '../report/composition-report-data.js';
import { type ReportData, speciesSources } from '../report/report-data.js';
import { reportHtml } from '../report/report-html.js';
import { reportMarkdown } from '../report/report-md.js';
import type { SystemSpec } from '../system/spec.js';

/** Caption of the composition figure: the totals, stated as the bath as made up. */
function caption(data: ReportData, totals: Record<string, number>): string[] {
  const t = Object.entries(totals).map(([c, v]) => `${c} ${Number(v.toPrecision(6))}`).join(', ');
  return [`${data.title}: totals ${t} mol/kg; regions where each form holds the largest share of the element.`];
}

export async function reportComposition(spec: SystemSpec, fig: FigureSettings, output: string, fmt: 'md' | 'html' | 'pdf', ref?: string): Promise<void> {
  const { computed, result: win } = compositionWindow(spec);
  // The second potential axis: --ref, else the file's reference (as draw does; the RHE has none).
  const given = ref !== undefined ? readReference(new Fields('command line'), ref, '--ref') : spec.operating.reference;
  if (given !== undefined && given !== 'she' && !(ref === undefined && given === 'rhe')) {
    const [where, field] = ref !== undefined ? ['command line', '--ref'] : [spec.file, 'reference'];
    withSecondAxis(computed, fig, displayReference(given, spec.temperature, where, field));
  }
  for (const w of computed.model.warnings) process.stderr.write(`warning: ${textForPeople(w)}\n`);
  const data = compositionReportData(spec, computed, win, speciesSources({ spec, model: computed.model, built: computed.setup.built }));
  const cap = caption(data, computed.setup.totals);
  // The document prints the caption under the figure once; the figure itself carries none.
  const input: FigureInput = { model: computed.model, options: { ...fig.options, show: { ...fig.options.show, caption: false } } };
  // Operating points, boxes and paths on the figure, as draw places them.
  placeOperatingMarks(input, spec.operating, spec.temperature);
  if (fmt === 'md') {
    const svgName = `${basename(output, extname(output))}.svg`;
    const svg = (await renderFigure(input, 'svg')) as string;
    const md = reportMarkdown(data, svgName, cap);
    const svgPath = join(dirname(output), svgName);
    await writeSet([{ path: svgPath, data: svg }, { path: output, data: md }]);
    process.stdout.write(`wrote ${output} and ${svgPath}\n`);
    return;
  }
  if (fmt === 'html') await writeOne(output, reportHtml(data, (await renderFigure(input, 'svg')) as string, cap));
  else {
    const { reportPdf } = await import('../report/report-pdf.js');
    await writeOne(output, await reportPdf(data, buildScene(input), { width: fig.options.width, height: fig.options.height }, cap));
  }
  process.stdout.write(`wrote ${output}\n`);
}

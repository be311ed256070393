/**
 * `ephmap report FILE -o report.md|report.html|report.pdf`: one document with the conditions, the
 * figure, every reaction and line, the operating points with their verdicts, the plating window,
 * the data sources, warnings and cautions. Markdown writes the figure next to it as `<name>.svg`.
 * Everything is computed before anything is written; bad input writes nothing (exit 2).
 */
import { textForPeople } from '../chem/present.js';
import { basename, dirname, extname, join } from 'node:path';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { loadAlloyWith, reportAlloy } from './alloy.js';
import { captionLines, figureInput, withSecondAxis } from '../figure/compose.js';
import { type FigureOverrides, figureSettingsWidth } from '../figure/options.js';
import { withFigureFlags } from './figure-flags.js';
import { displayReference } from '../analysis/points.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import { compute } from '../pipeline.js';
import { reportData } from '../report/report-data.js';
import { reportHtml } from '../report/report-html.js';
import { reportMarkdown } from '../report/report-md.js';
import { InputError } from '../system/errors.js';
import { renderFigure } from '../figure/output.js';
import { buildScene } from '../render/scene.js';
import { checkOutputs, writeOne, writeSet } from './outputs.js';
import { reportComposition } from './report-composition.js';

const REPORT_FORMATS = ['md', 'html', 'pdf'] as const;
type ReportFormat = (typeof REPORT_FORMATS)[number];

/** Report figures default to a 160 mm wide (two-column) figure unless the file sets a width. */
const REPORT_WIDTH = '160mm';

export function registerReport(program: Command): void {
  withFigureFlags(withSpecOptions(program
    .command('report')))
    .description('one document (.md with a .svg beside it, self-contained .html, or .pdf): conditions, figure, reactions, operating points with verdicts, plating window, sources, cautions')
    .argument('<file>', 'system file (.json, .yaml, .yml)')
    .requiredOption('-o, --output <path>', 'output file (.md, .html or .pdf)')
    .action(async (file: string, opts: { output: string; ref?: string } & SpecOverrides & FigureOverrides) => {
      if (basename(opts.output, extname(opts.output)) === '') {
        throw new InputError('command line', '--output', 'a file name ending in .md, .html or .pdf', JSON.stringify(opts.output));
      }
      const outputs = [{ path: opts.output, option: '--output', extensions: REPORT_FORMATS.map((x) => `.${x}`) }];
      const ext = extname(opts.output).toLowerCase().slice(1);
      // A Markdown report also writes its figure beside it: that file is an output of the run too.
      if (ext === 'md') outputs.push({ path: join(dirname(opts.output), `${basename(opts.output, extname(opts.output))}.svg`), option: '--output (its figure)', extensions: ['.svg'] });
      checkOutputs(outputs, [{ path: file, option: '<file>' }]);
      const fmt = ext as ReportFormat;
      const alloy = loadAlloyWith(file, opts);
      const { output: _o, ref: _r, ...figOpts } = opts;
      if (alloy) return reportAlloy(alloy, opts.output, fmt, figOpts, opts.ref);
      const spec = loadSpecWith(file, opts);
      const fig = figureSettingsWidth(spec, figOpts, REPORT_WIDTH);
      if (spec.composition) return reportComposition(spec, fig, opts.output, fmt, opts.ref);
      const c = compute(spec);
      if (opts.ref !== undefined) {
        withSecondAxis(c, fig, displayReference(readReference(new Fields('command line'), opts.ref, '--ref'), spec.temperature, 'command line', '--ref'));
      }
      for (const w of c.model.warnings) process.stderr.write(`warning: ${textForPeople(w)}\n`);
      const data = reportData(c);
      // The document prints the caption under the figure once; the figure itself carries none.
      const withCap = figureInput(c, fig);
      const input = { ...withCap, options: { ...withCap.options, show: { ...withCap.options.show, caption: false } } };
      delete input.caption;
      const caption = captionLines(c);
      if (fmt === 'md') {
        const svgName = `${basename(opts.output, extname(opts.output))}.svg`;
        const svg = (await renderFigure(input, 'svg')) as string;
        const md = reportMarkdown(data, svgName, caption);
        const svgPath = join(dirname(opts.output), svgName);
        await writeSet([{ path: svgPath, data: svg }, { path: opts.output, data: md }]);
        process.stdout.write(`wrote ${opts.output} and ${svgPath}\n`);
        return;
      }
      if (fmt === 'html') {
        const svg = (await renderFigure(input, 'svg')) as string;
        await writeOne(opts.output, reportHtml(data, svg, caption));
      } else {
        // Vector figure; its caption is printed under it by the report.
        const scene = buildScene(input);
        const { reportPdf } = await import('../report/report-pdf.js');
        await writeOne(opts.output, await reportPdf(data, scene, { width: fig.options.width, height: fig.options.height }, caption));
      }
      process.stdout.write(`wrote ${opts.output}\n`);
    });
}

/**
 * `ephmap report FILE -o report.md|report.html|report.pdf`: one document with the conditions, the
 * figure, every reaction and line, the operating points with their verdicts, the plating window,
 * the data sources, warnings and cautions. Markdown writes the figure next to it as `<name>.svg`.
 * Everything is computed before anything is written; bad input writes nothing (exit 2).
 */
import { basename, dirname, extname, join } from 'node:path';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { loadAlloyWith, reportAlloy } from './alloy.js';
import { captionLines, figureInput } from '../figure/compose.js';
import { figureSettingsWidth } from '../figure/options.js';
import { compute } from '../pipeline.js';
import { reportData } from '../report/report-data.js';
import { reportHtml } from '../report/report-html.js';
import { reportMarkdown } from '../report/report-md.js';
import { InputError } from '../system/errors.js';
import { renderFigure } from '../figure/output.js';
import { buildScene } from '../render/scene.js';
import { writeAtomic } from '../io/write.js';

const REPORT_FORMATS = ['md', 'html', 'pdf'] as const;
type ReportFormat = (typeof REPORT_FORMATS)[number];

/** Report figures default to a 160 mm wide (two-column) figure unless the file sets a width. */
const REPORT_WIDTH = '160mm';

export function registerReport(program: Command): void {
  withSpecOptions(program
    .command('report'))
    .description('one document (.md with a .svg beside it, self-contained .html, or .pdf): conditions, figure, reactions, operating points with verdicts, plating window, sources, cautions')
    .argument('<file>', 'system file (.json, .yaml, .yml)')
    .requiredOption('-o, --output <path>', 'output file (.md, .html or .pdf)')
    .action(async (file: string, opts: { output: string } & SpecOverrides) => {
      const ext = extname(opts.output).toLowerCase().slice(1);
      if (!(REPORT_FORMATS as readonly string[]).includes(ext) || basename(opts.output, extname(opts.output)) === '') {
        throw new InputError('command line', '--output', 'a file name ending in .md, .html or .pdf', JSON.stringify(opts.output));
      }
      const fmt = ext as ReportFormat;
      const alloy = loadAlloyWith(file, opts);
      if (alloy) return reportAlloy(alloy, opts.output, fmt);
      const spec = loadSpecWith(file, opts);
      const fig = figureSettingsWidth(spec, {}, REPORT_WIDTH);
      const c = compute(spec);
      for (const w of c.model.warnings) process.stderr.write(`warning: ${w}\n`);
      const data = reportData(c);
      const input = figureInput(c, fig);
      const caption = captionLines(c);
      if (fmt === 'md') {
        const svgName = `${basename(opts.output, extname(opts.output))}.svg`;
        const svg = (await renderFigure(input, 'svg')) as string;
        const md = reportMarkdown(data, svgName, caption);
        const svgPath = join(dirname(opts.output), svgName);
        writeAtomic(svgPath, svg);
        writeAtomic(opts.output, md);
        process.stdout.write(`wrote ${opts.output} and ${svgPath}\n`);
        return;
      }
      if (fmt === 'html') {
        const svg = (await renderFigure(input, 'svg')) as string;
        writeAtomic(opts.output, reportHtml(data, svg, caption));
      } else {
        // Vector figure; its caption is printed under it by the report, so the figure omits its own.
        const noCaption = { ...input, options: { ...input.options, show: { ...input.options.show, caption: false } } };
        const scene = buildScene(noCaption);
        const { reportPdf } = await import('../report/report-pdf.js');
        writeAtomic(opts.output, await reportPdf(data, scene, { width: fig.options.width, height: fig.options.height }, caption));
      }
      process.stdout.write(`wrote ${opts.output}\n`);
    });
}

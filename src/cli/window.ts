/**
 * `ephmap window FILE`: the plating pH window of a bath (table, --json, or a figure with -o).
 */
import { textForPeople } from '../chem/present.js';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { windowFigureInput } from '../figure/compose.js';
import { figureSettings } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';
import { compute } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { platingWindow } from '../analysis/window.js';
import { windowHeading, windowText } from '../report/window-text.js';
import { checkOutputs, writeOne } from './outputs.js';
import { InputError } from '../system/errors.js';
import { compositionWindow } from '../analysis/composition-window.js';
import { compositionWindowHeading } from '../report/composition-window-text.js';

export function registerWindow(program: Command): void {
  withSpecOptions(program
    .command('window'))
    .description('plating pH window: where the metal stays dissolved, its deposition potential and margin to hydrogen evolution')
    .argument('<file>', 'bath system file')
    .option('--json', 'machine-readable output')
    .option('-o, --output <path>', 'also draw the diagram with the window highlighted (.svg, .pdf, .png)')
    .action(async (file: string, opts: { json?: boolean; output?: string } & SpecOverrides) => {
      let fmt: FigureFormat | undefined;
      if (opts.output) {
        const [ext] = checkOutputs([{ path: opts.output, option: '--output', extensions: ['.svg', '.pdf', '.png'] }], [{ path: file, option: '<file>' }]);
        fmt = ext!.slice(1) as FigureFormat;
      }
      const spec = loadSpecWith(file, opts);
      if (spec.composition) {
        if (opts.output) throw new InputError('command line', '--output', 'no --output for a composition file yet (draw the bath with `ephmap draw`); the window table and --json work', JSON.stringify(opts.output));
        const { computed, result } = compositionWindow(spec);
        for (const w of computed.model.warnings) process.stderr.write(`warning: ${textForPeople(w)}\n`);
        process.stdout.write(opts.json ? stableJson(result) : windowText(result, compositionWindowHeading(result)));
        return;
      }
      const fig = figureSettings(spec);
      const c = compute(spec);
      for (const w of c.model.warnings) process.stderr.write(`warning: ${textForPeople(w)}\n`);
      const r = platingWindow(c.model);
      if (opts.output && fmt) {
        await writeOne(opts.output, await renderFigure(windowFigureInput(c, fig, r.windows), fmt));
        reportFigureNotes(c.model);
      }
      const head = windowHeading(c.model);
      if (opts.json) process.stdout.write(stableJson(r));
      else process.stdout.write(windowText(r, head));
      if (opts.output) process.stdout.write(`wrote ${opts.output}\n`);
    });
}

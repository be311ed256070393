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
import { windowOnScale } from '../analysis/window-scale.js';
import type { WindowResult } from '../analysis/window.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import type { SystemSpec } from '../system/spec.js';
import { displayReference } from '../analysis/points.js';
import { withSecondAxis } from '../figure/compose.js';

/**
 * The window on the scale of --ref, else of the file's `reference:` (as probe and lines do); as it
 * is (V vs SHE) for neither or the SHE. Warnings of the electrode not already in `printed` are
 * written to stderr once.
 */
function onScale<R extends WindowResult>(r: R, spec: SystemSpec, ref: string | undefined, printed: readonly string[]) {
  const given = ref !== undefined ? readReference(new Fields('command line'), ref, '--ref') : spec.operating.reference;
  if (given === undefined || given === 'she') return r;
  const [where, field] = ref !== undefined ? ['command line', '--ref'] : [spec.file, 'reference'];
  const scaled = windowOnScale(r, given, spec.temperature, where, field);
  for (const w of scaled.warnings) if (!r.warnings.includes(w) && !printed.includes(w)) process.stderr.write(`warning: ${textForPeople(w)}\n`);
  return scaled;
}

export function registerWindow(program: Command): void {
  withSpecOptions(program
    .command('window'))
    .description('plating pH window: where the metal stays dissolved, its deposition potential and margin to hydrogen evolution')
    .argument('<file>', 'bath system file')
    .option('--json', 'machine-readable output')
    .option('--ref <name>', "give deposition potentials against this reference electrode (sce, agcl-sat, cse, rhe, ...; default: the file's reference)")
    .option('-o, --output <path>', 'also draw the diagram with the window highlighted (.svg, .pdf, .png)')
    .action(async (file: string, opts: { json?: boolean; output?: string; ref?: string } & SpecOverrides) => {
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
        const scaled = onScale(result, spec, opts.ref, computed.model.warnings);
        process.stdout.write(opts.json ? stableJson(scaled) : windowText(scaled, compositionWindowHeading(result, 'reference' in scaled ? scaled.reference : undefined)));
        return;
      }
      const fig = figureSettings(spec);
      const c = compute(spec);
      const cliRef = opts.ref === undefined ? undefined : readReference(new Fields('command line'), opts.ref, '--ref');
      if (cliRef !== undefined && opts.output && cliRef !== 'rhe') {
        // The figure's second axis follows --ref (the RHE, pH-dependent, has none).
        withSecondAxis(c, fig, displayReference(cliRef, spec.temperature, 'command line', '--ref'));
      }
      for (const w of c.model.warnings) process.stderr.write(`warning: ${textForPeople(w)}\n`);
      const r = onScale(platingWindow(c.model), spec, opts.ref, c.model.warnings);
      if (opts.output && fmt) {
        await writeOne(opts.output, await renderFigure(windowFigureInput(c, fig, r.windows), fmt));
        reportFigureNotes(c.model);
      }
      const head = windowHeading(c.model, 'reference' in r ? r.reference : undefined);
      if (opts.json) process.stdout.write(stableJson(r));
      else process.stdout.write(windowText(r, head));
      if (opts.output) process.stdout.write(`wrote ${opts.output}\n`);
    });
}

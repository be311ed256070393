/**
 * `ephmap overlay FILE... -o out.svg|pdf|png|html [--temperatures 25,90,150] [--activities 1e-6,1e-4]`:
 * several diagrams in one frame (one system at several temperatures/activities, or several systems).
 */
import { textForPeople } from '../chem/present.js';
import type { Command } from 'commander';
import type { FigureOverrides } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';
import { loadSpec } from '../pipeline.js';
import { computeLayers, layerSpecs, layerWarnings, overlayFigure, overlaySettings } from '../figure/overlay.js';
import { InputError } from '../system/errors.js';
import { NUMBER_TEXT } from '../system/fields.js';
import { checkOutputs, writeOne } from './outputs.js';
import { withSecondAxis } from '../figure/compose.js';
import { displayReference } from '../analysis/points.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';

/** "25,90,150" → [25, 90, 150]; InputError naming the option for anything that is not a number list. */
export function numberList(v: string, option: string, what: string): number[] {
  const parts = v.split(',').map((x) => x.trim());
  if (parts.length > 20) throw new InputError('command line', option, `at most 20 ${what}`, JSON.stringify(v));
  return parts.map((x) => {
    const n = Number(x);
    if (!NUMBER_TEXT.test(x) || !Number.isFinite(n)) throw new InputError('command line', option, `a comma-separated list of ${what}, e.g. ${option === '--temperatures' ? '25,90,150' : '1e-6,1e-4'}`, JSON.stringify(v));
    return n;
  });
}

interface OverlayOpts extends FigureOverrides {
  output: string;
  temperatures?: string;
  activities?: string;
  ref?: string;
}

const OVERLAY_FORMATS = ['svg', 'pdf', 'png', 'html'];

export function registerOverlay(program: Command): void {
  program
    .command('overlay')
    .description('several diagrams in one figure: one system file at several --temperatures or --activities, or several system files (e.g. Fe, Cr, Ni)')
    .argument('<files...>', 'system files; the first is the base layer')
    .requiredOption('-o, --output <path>', 'output file (.svg, .pdf, .png or .html; in .html the pointer read-out is that of the base layer)')
    .option('--temperatures <list>', 'temperatures in °C, comma-separated, e.g. 25,90,150')
    .option('--activities <list>', 'activities of the dissolved species, comma-separated, e.g. 1e-6,1e-4')
    .option('--width <length>', 'figure width: mm, or e.g. "170mm", "3in", "800px" (a PNG then has 800 pixels across)')
    .option('--dpi <n>', 'PNG resolution in dots per inch (default 300; 96 with a width in px)')
    .option('--font <family>', 'font family (SVG/PNG/HTML)')
    .option('--ref <name>', "second potential axis against this reference electrode (sce, agcl-sat, cse, ...; default: the base file's reference)")
    .option('--height <length>', 'figure height')
    .option('--style <style>', 'color, gray or lines (lines only when the elements differ)')
    .option('--title <text>', 'figure title')
    .option('--no-caption', 'leave out the caption block (kept when the elements differ)')
    .option('--grid', 'draw a light grid')
    .action(async (files: string[], opts: OverlayOpts) => {
      const [dotExt] = checkOutputs([{ path: opts.output, option: '--output', extensions: OVERLAY_FORMATS.map((x) => `.${x}`) }], files.map((f, i) => ({ path: f, option: `<files> #${i + 1}` })));
      const ext = dotExt!.slice(1);
      const temperatures = opts.temperatures === undefined ? undefined : numberList(opts.temperatures, '--temperatures', 'temperatures in °C');
      const activities = opts.activities === undefined ? undefined : numberList(opts.activities, '--activities', 'activities');
      const specs = files.map((f) => loadSpec(f));
      const layers = computeLayers(layerSpecs({ specs, temperatures, activities }));
      const fig = overlaySettings(layers, opts);
      if (opts.ref !== undefined) {
        // At the base file's own temperature, like its operating marks (see overlayFigure).
        const r = displayReference(readReference(new Fields('command line'), opts.ref, '--ref'), specs[0].temperature, 'command line', '--ref');
        withSecondAxis(layers[0], fig, r);
      }
      for (const w of layerWarnings(layers)) process.stderr.write(`warning: ${textForPeople(w)}\n`);
      const { input } = overlayFigure(layers, fig, ext === 'pdf', specs[0]);
      await writeOne(opts.output, await renderFigure(input, ext as FigureFormat));
      reportFigureNotes(input.model);
      process.stdout.write(`wrote ${opts.output} (${layers.length} layers)\n`);
    });
}

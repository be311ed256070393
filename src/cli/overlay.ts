/**
 * `ephmap overlay FILE... -o out.svg|pdf|png [--temperatures 25,90,150] [--activities 1e-6,1e-4]`:
 * several diagrams in one frame (one system at several temperatures/activities, or several systems).
 */
import { extname } from 'node:path';
import type { Command } from 'commander';
import type { FigureOverrides } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';
import { loadSpec } from '../pipeline.js';
import { computeLayers, layerSpecs, layerWarnings, overlayFigure, overlaySettings } from '../figure/overlay.js';
import { InputError } from '../system/errors.js';
import { writeAtomic } from '../io/write.js';

/** "25,90,150" → [25, 90, 150]; InputError naming the option for anything that is not a number list. */
export function numberList(v: string, option: string, what: string): number[] {
  const parts = v.split(',').map((x) => x.trim());
  if (parts.length > 20) throw new InputError('command line', option, `at most 20 ${what}`, JSON.stringify(v));
  return parts.map((x) => {
    const n = Number(x);
    if (x === '' || !Number.isFinite(n)) throw new InputError('command line', option, `a comma-separated list of ${what}, e.g. ${option === '--temperatures' ? '25,90,150' : '1e-6,1e-4'}`, JSON.stringify(v));
    return n;
  });
}

interface OverlayOpts extends FigureOverrides {
  output: string;
  temperatures?: string;
  activities?: string;
}

export function registerOverlay(program: Command): void {
  program
    .command('overlay')
    .description('several diagrams in one figure: one system file at several --temperatures or --activities, or several system files (e.g. Fe, Cr, Ni)')
    .argument('<files...>', 'system files; the first is the base layer')
    .requiredOption('-o, --output <path>', 'output file (.svg, .pdf or .png)')
    .option('--temperatures <list>', 'temperatures in °C, comma-separated, e.g. 25,90,150')
    .option('--activities <list>', 'activities of the dissolved species, comma-separated, e.g. 1e-6,1e-4')
    .option('--width <length>', 'figure width: mm, or e.g. "170mm", "800px"')
    .option('--height <length>', 'figure height')
    .option('--style <style>', 'color, gray or lines (lines only when the elements differ)')
    .option('--title <text>', 'figure title')
    .option('--no-caption', 'leave out the caption block (kept when the elements differ)')
    .option('--grid', 'draw a light grid')
    .action(async (files: string[], opts: OverlayOpts) => {
      const ext = extname(opts.output).toLowerCase().slice(1);
      if (!['svg', 'pdf', 'png'].includes(ext)) throw new InputError('command line', '--output', 'a file name ending in .svg, .pdf or .png', JSON.stringify(opts.output));
      const temperatures = opts.temperatures === undefined ? undefined : numberList(opts.temperatures, '--temperatures', 'temperatures in °C');
      const activities = opts.activities === undefined ? undefined : numberList(opts.activities, '--activities', 'activities');
      const specs = files.map((f) => loadSpec(f));
      const layers = computeLayers(layerSpecs({ specs, temperatures, activities }));
      const fig = overlaySettings(layers, opts);
      for (const w of layerWarnings(layers)) process.stderr.write(`warning: ${w}\n`);
      const { input } = overlayFigure(layers, fig, ext === 'pdf');
      writeAtomic(opts.output, await renderFigure(input, ext as FigureFormat));
      reportFigureNotes(input.model);
      process.stdout.write(`wrote ${opts.output} (${layers.length} layers)\n`);
    });
}

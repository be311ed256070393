/**
 * Verbs draw, probe, lines (issue 2 core) and demo.
 */
import { writeWarnings } from './notes.js';
import { textForPeople } from '../chem/present.js';
import type { Command } from 'commander';
import { compute, computeAny } from '../pipeline.js';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { drawAlloy, linesAlloy, loadAlloyWith } from './alloy.js';
import { stableJson } from '../report/json.js';
import { activityRows, linesText, lineRows } from '../report/lines.js';
import { InputError } from '../system/errors.js';
import { checkOutputs, writeOne } from './outputs.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import { displayReference } from '../analysis/points.js';
import { linesComposition } from './lines-composition.js';
import { isElement } from '../chem/elements.js';
import { loadLibrary } from '../data/library.js';
import { catalogEntries, catalogJson, catalogText } from '../report/catalog.js';
import { figureInput, withSecondAxis } from '../figure/compose.js';
import { type FigureOverrides, figureSettings } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';

const DRAW_FORMATS = ['.svg', '.pdf', '.png', '.html', '.json'];

interface DrawOptions extends FigureOverrides, SpecOverrides {
  output: string;
  ref?: string;
  vary?: string;
}


function warn(ws: string[]): void {
  for (const w of ws) process.stderr.write(`warning: ${textForPeople(w)}\n`);
}

export function registerCore(program: Command): void {
  withSpecOptions(program
    .command('draw'))
    .description('compute the diagram of a system file and write it; format by extension: .svg, .pdf, .png, .html (interactive), .json (diagram model)')
    .argument('<file>', 'system file (.json, .yaml, .yml)')
    .requiredOption('-o, --output <path>', 'output file (.svg, .pdf, .png, .html or .json)')
    .option('--width <length>', 'figure width: mm, or e.g. "170mm", "3in", "800px" (a PNG then has 800 pixels across)')
    .option('--dpi <n>', 'PNG resolution in dots per inch (default 300; 96 with a width in px)')
    .option('--height <length>', 'figure height')
    .option('--style <style>', 'color, gray or lines')
    .option('--font <family>', 'font family (SVG/PNG)')
    .option('--font-size <pt>', 'base font size in pt')
    .option('--title <text>', 'figure title')
    .option('--no-caption', 'leave out the caption block')
    .option('--grid', 'draw a light grid')
    .option('--line-width <pt>', 'width of boundary lines in pt')
    .option('--show <list>', 'decorations to show, comma-separated: water, grid, caption, neutral, triplePoints, ligands, legend, title')
    .option('--hide <list>', 'decorations to hide, same names')
    .option('--ref <name>', 'second potential axis against this reference electrode (sce, agcl-sat, cse, ...)')
    .option('--vary <El=x,...>', 'alloy files: also draw the boundaries with this element at each mole fraction, e.g. Cr=0.05,0.12,0.18')
    .action(async (file: string, opts: DrawOptions) => {
      const [dotExt] = checkOutputs([{ path: opts.output, option: '--output', extensions: DRAW_FORMATS }], [{ path: file, option: '<file>' }]);
      const ext = dotExt!.slice(1);
      const alloy = loadAlloyWith(file, opts);
      if (alloy) return drawAlloy(alloy, opts, ext);
      if (opts.vary !== undefined) throw new InputError('command line', '--vary', 'an alloy system file (with elements) for --vary');
      const spec = loadSpecWith(file, opts);
      const fig = figureSettings(spec, opts);
      const c = computeAny(spec);
      if (opts.ref !== undefined) {
        withSecondAxis(c, fig, displayReference(readReference(new Fields('command line'), opts.ref, '--ref'), spec.temperature, 'command line', '--ref'));
      }
      warn(c.model.warnings);
      const data = ext === 'json' ? stableJson(c.model) : await renderFigure(figureInput(c, fig), ext as FigureFormat);
      await writeOne(opts.output, data);
      reportFigureNotes(c.model);
      process.stdout.write(`wrote ${opts.output}\n`);
    });

  withSpecOptions(program
    .command('lines'))
    .description('every boundary reaction and line equation')
    .argument('<file>', 'system file')
    .option('--json', 'machine-readable output')
    .option('--ref <name>', "also give each line against this reference electrode (sce, agcl-sat, cse, ...; default: the file's reference)")
    .action((file: string, opts: { json?: boolean; ref?: string } & SpecOverrides) => {
      const alloy = loadAlloyWith(file, opts);
      if (alloy) return linesAlloy(alloy, opts.json === true, opts.ref);
      const spec = loadSpecWith(file, opts);
      if (spec.composition) return linesComposition(spec, opts);
      const c = compute(spec);
      // --ref, else the file's own `reference:` (as draw and probe do).
      const given = opts.ref !== undefined ? readReference(new Fields('command line'), opts.ref, '--ref') : c.spec.operating.reference;
      const [where, field] = opts.ref !== undefined ? ['command line', '--ref'] : [c.spec.file, 'reference'];
      const ref = given === undefined ? undefined : displayReference(given, c.spec.temperature, where, field);
      const warnings = writeWarnings(c.model.warnings, ref?.warnings ?? []);
      const rows = lineRows(c.model, ref);
      if (opts.json) {
        process.stdout.write(stableJson({ element: c.model.element, temperature: c.model.temperature, units: c.model.units, ...(ref ? { reference: { id: ref.id, label: ref.label, offset: ref.offset } } : {}), lines: rows, waterLines: c.model.waterLines, activities: activityRows(c.model), water: c.model.water, warnings }));
      } else process.stdout.write(linesText(c.model, ref));
    });
}

export function registerCatalog(program: Command): void {
  program
    .command('catalog')
    .description('the built-in species, with their data and sources')
    .argument('[element]', 'only species containing this element (e.g. Cu)')
    .option('--json', 'machine-readable output')
    .action((element: string | undefined, opts: { json?: boolean }) => {
      if (element !== undefined && !isElement(element)) throw new InputError('command line', 'element', 'an element symbol such as Cu (case matters)', JSON.stringify(element));
      const entries = catalogEntries(loadLibrary(), element);
      if (opts.json) process.stdout.write(stableJson(catalogJson(entries, element)));
      else process.stdout.write(entries.length ? catalogText(entries) : `no species of ${element} in the library\n`);
    });
}

/**
 * Verb `shares` (composition mode): the share of the element held by each form against pH at a
 * fixed potential (--potential) or against E at a fixed pH (--ph), as a figure (.svg, .pdf, .png)
 * or its data (.json).
 */
import { textForPeople } from '../chem/present.js';
import type { Command } from 'commander';
import { sharesData } from '../analysis/shares.js';
import { figureSettings, type FigureOverrides } from '../figure/options.js';
import { renderShares, sharesCaption, type SharesFormat } from '../figure/shares-output.js';
import { stableJson } from '../report/json.js';
import { displayReference, type GivenPotential } from '../analysis/points.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { numberArg } from './args.js';
import { checkOutputs, writeOne } from './outputs.js';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';

const FORMATS = ['.svg', '.pdf', '.png', '.json'];

interface SharesOpts extends FigureOverrides, SpecOverrides {
  output: string;
  ph?: string;
  potential?: string;
  points?: string;
  ref?: string;
}

export function registerShares(program: Command): void {
  withSpecOptions(program.command('shares'))
    .description('composition mode: share of the element in each form vs pH at a fixed potential (--potential) or vs E at a fixed pH (--ph); format by extension: .svg, .pdf, .png, .json (the data)')
    .argument('<file>', 'system file with a composition key')
    .requiredOption('-o, --output <path>', 'output file (.svg, .pdf, .png or .json)')
    .option('--potential <volts>', "fixed potential, V (vs --ref, else the file's reference:, else SHE): shares along pH")
    .option('--ref <name>', "reference electrode --potential is given against (she, sce, agcl-sat, cse, ...; default: the file's reference)")
    .option('--ph <pH>', 'fixed pH: shares along E')
    .option('--points <n>', 'points along the sweep (default 281)')
    .option('--width <length>', 'figure width: mm, or e.g. "170mm", "800px"')
    .option('--height <length>', 'figure height')
    .option('--style <style>', 'color, gray or lines')
    .option('--font <family>', 'font family (SVG/PNG)')
    .option('--font-size <pt>', 'base font size in pt')
    .option('--line-width <pt>', 'width of the lines in pt')
    .option('--title <text>', 'figure title')
    .option('--no-caption', 'leave out the caption block')
    .option('--grid', 'draw light grid lines')
    .action(async (file: string, opts: SharesOpts) => {
      const [dotExt] = checkOutputs([{ path: opts.output, option: '--output', extensions: FORMATS }], [{ path: file, option: '<file>' }]);
      const ext = dotExt!.slice(1);
      if ((opts.ph === undefined) === (opts.potential === undefined)) throw new InputError('command line', '--potential/--ph', 'exactly one of --potential (shares along pH) or --ph (shares along E)');
      const along = opts.potential !== undefined ? 'pH' : 'E';
      const at = opts.potential !== undefined ? numberArg(opts.potential, '--potential', 'a potential in V vs SHE (number)') : numberArg(opts.ph!, '--ph', 'a pH value (number)');
      const points = opts.points === undefined ? undefined : numberArg(opts.points, '--points', 'a whole number of points from 11 to 2001');
      if (points !== undefined && !(Number.isInteger(points) && points >= 11 && points <= 2001)) throw new InputError('command line', '--points', 'a whole number of points from 11 to 2001', opts.points);
      if (opts.ref !== undefined && along === 'E') throw new InputError('command line', '--ref', 'no --ref with --ph: along E the axis is in V vs SHE (--ref gives the electrode of --potential)', opts.ref);
      const cliRef = opts.ref === undefined ? undefined : readReference(new Fields('command line'), opts.ref, '--ref');
      const spec = loadSpecWith(file, opts);
      const fig = figureSettings(spec, opts);
      const fixed = along === 'pH' ? potentialOnShe(at, cliRef ?? spec.operating.reference, spec, cliRef !== undefined) : { at, warnings: [] };
      const data = sharesData(spec, along, fixed.at, { ...(points === undefined ? {} : { points }), ...(fixed.reference ? { reference: fixed.reference } : {}) });
      for (const w of [...fixed.warnings, ...data.warnings]) process.stderr.write(`warning: ${textForPeople(w)}\n`);
      const out = ext === 'json' ? stableJson(data) : await renderShares({ data, options: fig.options, caption: sharesCaption(data, spec) }, ext as SharesFormat);
      await writeOne(opts.output, out);
      process.stdout.write(`wrote ${opts.output}\n`);
    });
}

/**
 * The fixed potential on the SHE scale at the file's temperature: E_SHE = E + offset of the
 * electrode (--ref, else the file's reference:); the RHE, which moves with pH, is refused along pH.
 */
function potentialOnShe(E: number, ref: string | CustomReference | undefined, spec: SystemSpec, fromCli: boolean): { at: number; reference?: GivenPotential; warnings: string[] } {
  if (ref === undefined || ref === 'she') return { at: E, warnings: [] };
  const [where, field] = fromCli ? ['command line', '--ref'] : [spec.file, 'reference'];
  const d = displayReference(ref, spec.temperature, where, field);
  return { at: E + d.offset, reference: { label: d.label, E, offset: d.offset }, warnings: d.warnings };
}

/**
 * `ephmap window FILE`: the plating pH window of a bath (table, --json, or a figure with -o).
 */
import { extname } from 'node:path';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { figureInput } from '../figure/compose.js';
import { figureSettings } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { compute } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { table } from '../report/table.js';
import { platingWindow, type WindowResult } from '../report/window.js';
import { InputError } from '../system/errors.js';
import { writeAtomic } from './write.js';

export function windowText(r: WindowResult, head: string): string {
  const v = (x: number) => `${x >= 0 ? '+' : ''}${x.toFixed(3)}`;
  if (!r.windows.length) return `${head}\nNo pH range in the diagram where a dissolved form of ${r.element} lies directly above the metal.\n`;
  const rows = r.windows.map((w) => [
    `${w.pH[0].toFixed(2)}–${w.pH[1].toFixed(2)}`,
    w.dissolved.join(', '),
    `${v(w.deposition[0].E)} … ${v(w.deposition[w.deposition.length - 1].E)}`,
    `${v(w.marginToHydrogen.atLowPH)} … ${v(w.marginToHydrogen.atHighPH)}`,
    `${w.boundedBy.low ?? 'edge'} / ${w.boundedBy.high ?? 'edge'}`,
  ]);
  const t = table(['pH range', 'dissolved form', 'E_dep at ends / V vs SHE', 'E_dep − E(H2) / V', 'bounded by (low / high pH)'], rows);
  const fs = r.firstSolid ? `First solid above the window: ${r.firstSolid.species} from pH ${r.firstSolid.pH.toFixed(2)}.` : 'No solid appears above the window within the diagram.';
  return `${head}\n\n${t}\n\n${fs}\n${r.notes.map((n) => `Note: ${n}`).join('\n')}\nEquilibrium thermodynamics only — not kinetics; check against the bath supplier's data and a qualified plating professional.\n`;
}

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
        const ext = extname(opts.output).toLowerCase().slice(1);
        if (!['svg', 'pdf', 'png'].includes(ext)) throw new InputError('command line', '--output', 'a file name ending in .svg, .pdf or .png', JSON.stringify(opts.output));
        fmt = ext as FigureFormat;
      }
      const spec = loadSpecWith(file, opts);
      const fig = figureSettings(spec);
      const c = compute(spec);
      for (const w of c.model.warnings) process.stderr.write(`warning: ${w}\n`);
      const r = platingWindow(c.model);
      if (opts.output && fmt) {
        const input = figureInput(c, fig);
        input.boxes = r.windows.map((w) => ({ label: 'plating window', pH: w.pH, E: c.model.domain.E }));
        writeAtomic(opts.output, await renderFigure(input, fmt));
      }
      const m = c.model;
      const head = `Plating window for ${m.element} at ${m.temperature.celsius} °C (dissolved ${m.element} ${m.activity}${Object.keys(m.ligands).length ? `; ${Object.entries(m.ligands).map(([k, x]) => `${k} ${x}`).join(', ')}` : ''}); potentials in V vs SHE.`;
      if (opts.json) process.stdout.write(stableJson(r));
      else process.stdout.write(windowText(r, head));
      if (opts.output) process.stdout.write(`wrote ${opts.output}\n`);
    });
}

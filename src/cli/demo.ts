/**
 * `ephmap demo`: the main job on built-in data — classic diagrams of iron, copper and zinc at 25 °C
 * (dissolved activity 10⁻⁶, the common corrosion threshold) and iron at 200 °C, drawn into a folder.
 */
import { join } from 'node:path';
import type { Command } from 'commander';
import { figureInput } from '../figure/compose.js';
import { figureSettings } from '../figure/options.js';
import { renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';
import { compute } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { readSpec } from '../system/spec.js';
import { writeAtomic } from '../io/write.js';

export const DEMO_SYSTEMS: { name: string; data: Record<string, unknown> }[] = [
  { name: 'iron-25C', data: { element: 'Fe', activity: 1e-6, E: [-1.2, 1.6], title: 'Iron–water, 25 °C' } },
  { name: 'copper-25C', data: { element: 'Cu', activity: 1e-6, E: [-1.0, 1.6], title: 'Copper–water, 25 °C' } },
  { name: 'zinc-25C', data: { element: 'Zn', activity: 1e-6, E: [-1.8, 1.4], title: 'Zinc–water, 25 °C' } },
  { name: 'iron-200C', data: { element: 'Fe', temperature: 200, activity: 1e-6, E: [-1.4, 1.4], title: 'Iron–water, 200 °C' } },
];

export function registerDemo(program: Command): void {
  program
    .command('demo')
    .description('draw the built-in demonstration diagrams (iron, copper, zinc) into a folder')
    .option('--out <dir>', 'output folder', 'out')
    .action(async (opts: { out: string }) => {
      for (const d of DEMO_SYSTEMS) {
        const spec = readSpec(d.data, `demo ${d.name}`);
        const c = compute(spec);
        for (const w of c.model.warnings) process.stderr.write(`warning (${d.name}): ${w}\n`);
        const fig = figureSettings(spec);
        const input = figureInput(c, fig);
        const written: string[] = [];
        for (const fmt of ['svg', 'pdf'] as const) {
          const p = join(opts.out, `${d.name}.${fmt}`);
          writeAtomic(p, await renderFigure(input, fmt));
          if (fmt === 'svg') reportFigureNotes(c.model, `(${d.name}) `);
          written.push(p);
        }
        const pj = join(opts.out, `${d.name}.json`);
        writeAtomic(pj, stableJson(c.model));
        written.push(pj);
        process.stdout.write(`${d.name}: ${written.join(', ')}\n`);
      }
      process.stdout.write(`Diagrams written to ${opts.out}/ — open the .svg or .pdf files. Equilibrium thermodynamics only, not kinetics.\n`);
    });
}

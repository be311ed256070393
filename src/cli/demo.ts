/**
 * `ephmap demo`: the main job on built-in data — classic diagrams of iron, copper and zinc at 25 °C
 * (dissolved activity 10⁻⁶, the common corrosion threshold) and iron at 200 °C, drawn into a folder.
 *
 * Steps: (1) refuse a file in the way of the folder (OutputError, exit 3); (2) compute and render
 * every diagram; (3) create the folder if missing (`makeOutputDir`: the one place ephmap creates a
 * directory, and it says so on standard output) and commit all files as one set
 * (src/io/safe-write.ts), so a failure leaves the folder's files as they were.
 */
import { textForPeople } from '../chem/present.js';
import { existsSync, statSync } from 'node:fs';
import { OutputError } from '../errors.js';
import { join } from 'node:path';
import type { Command } from 'commander';
import { figureInput } from '../figure/compose.js';
import { figureSettings } from '../figure/options.js';
import { renderFigure } from '../figure/output.js';
import { reportFigureNotes } from './notes.js';
import { compute } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { readSpec } from '../system/spec.js';
import { makeOutputDir, type OutputFile } from '../io/safe-write.js';
import { writeSet } from './outputs.js';

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
      // Step 1: a file in the way of the folder is refused before any compute.
      const existed = existsSync(opts.out);
      if (existed && !statSync(opts.out).isDirectory()) throw new OutputError(opts.out, 'it is a file, not a folder (--out names the folder the diagrams go into)');
      const files: OutputFile[] = [];
      const lines: string[] = [];
      for (const d of DEMO_SYSTEMS) {
        const spec = readSpec(d.data, `demo ${d.name}`);
        const c = compute(spec);
        for (const w of c.model.warnings) process.stderr.write(`warning (${d.name}): ${textForPeople(w)}\n`);
        const input = figureInput(c, figureSettings(spec));
        const mine: OutputFile[] = [];
        for (const fmt of ['svg', 'pdf'] as const) mine.push({ path: join(opts.out, `${d.name}.${fmt}`), data: await renderFigure(input, fmt) });
        mine.push({ path: join(opts.out, `${d.name}.json`), data: stableJson(c.model) });
        reportFigureNotes(c.model, `(${d.name}) `);
        files.push(...mine);
        lines.push(`${d.name}: ${mine.map((f) => f.path).join(', ')}\n`);
      }
      // Step 3: the folder (created only now, so a failed compute leaves nothing), then the set.
      makeOutputDir(opts.out);
      if (!existed) process.stdout.write(`created the folder ${opts.out}/\n`);
      await writeSet(files);
      for (const l of lines) process.stdout.write(l);
      process.stdout.write(`Diagrams written to ${opts.out}/ — open the .svg or .pdf files. Equilibrium thermodynamics only, not kinetics.\n`);
    });
}

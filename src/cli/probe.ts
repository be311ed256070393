/**
 * `ephmap probe FILE --ph X --potential Y [--ref NAME] [--json]` and
 * `ephmap probe FILE --points LOG.csv [-o OUT.csv]`.
 * -o is checked before any compute (src/cli/outputs.ts): .csv with --points, .json for one point
 * (its JSON answer), never the system file or the --points file.
 */
import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { loadAlloyWith, probeAlloy } from './alloy.js';
import { numberArg } from './args.js';
import { stableJson } from '../report/json.js';
import { parsePointsCsv, pointsCsv } from '../report/points-csv.js';
import { probe } from '../analysis/probe.js';
import { toShe } from '../analysis/points.js';
import { pointComputer } from '../analysis/widen.js';
import { probeText } from '../report/probe-text.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import { checkOutputs, writeOne } from './outputs.js';
import { probeComposition } from './probe-composition.js';

const num = numberArg;

interface ProbeOpts extends SpecOverrides {
  ph?: string;
  potential?: string;
  ref?: string;
  points?: string;
  output?: string;
  json?: boolean;
}

export function registerProbe(program: Command): void {
  withSpecOptions(program
    .command('probe'))
    .description('the verdict and predominant species at an operating point (or every row of a logged CSV), evaluated exactly')
    .argument('<file>', 'system file')
    .option('--ph <pH>', 'pH at the point')
    .option('--potential <volts>', 'potential at the point, V (vs SHE unless --ref)')
    .option('--ref <name>', 'reference electrode the potential is measured against: she, rhe, sce, agcl-sat, agcl-3.5m, agcl-1m, agcl-sea, cse, hgo, mse')
    .option('--points <csv>', 'logged series: CSV with columns pH, potential[, temperature]')
    .option('-o, --output <file>', 'with --points: write the results CSV here (.csv; default: standard output); for one point: write its JSON answer here (.json)')
    .option('--json', 'machine-readable output')
    .action(async (file: string, opts: ProbeOpts) => {
      if (opts.output !== undefined) {
        const inputs = [{ path: file, option: '<file>' }, ...(opts.points !== undefined ? [{ path: opts.points, option: '--points' }] : [])];
        checkOutputs([{ path: opts.output, option: '--output', extensions: opts.points !== undefined ? ['.csv'] : ['.json'] }], inputs);
      }
      const alloy = loadAlloyWith(file, opts);
      if (alloy) {
        if (opts.points !== undefined || opts.ref !== undefined) throw new InputError('command line', opts.points !== undefined ? '--points' : '--ref', 'for an alloy file: --ph and --potential (V vs SHE) only, for now');
        if (opts.ph === undefined || opts.potential === undefined) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential');
        return probeAlloy(alloy, num(opts.ph, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 }), num(opts.potential, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 }), opts.json === true);
      }
      const spec = loadSpecWith(file, opts);
      let ref = spec.operating.reference;
      if (opts.ref !== undefined) ref = readReference(new Fields('command line'), opts.ref, '--ref');
      if (opts.points !== undefined && (opts.ph !== undefined || opts.potential !== undefined)) throw new InputError('command line', '--points', 'either --points or --ph with --potential, not both');
      if (opts.points === undefined && (opts.ph === undefined || opts.potential === undefined)) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential (or --points FILE.csv)');
      if (spec.composition) return probeComposition(spec, opts, ref);
      const at = pointComputer(spec);
      if (opts.points !== undefined) {
        let text: string;
        try {
          text = readFileSync(opts.points, 'utf8');
        } catch {
          throw new InputError(opts.points, '', 'a readable CSV file', 'a file that cannot be read');
        }
        const rows = parsePointsCsv(text, opts.points);
        const results = rows.map((row) => {
          const T = row.temperature ?? spec.temperature;
          if (!(T >= 0 && T <= 350)) throw new InputError(opts.points!, `line ${row.line} temperature`, 'a temperature from 0 to 350 °C', String(T));
          const s = toShe(ref, row.potential, T, row.pH, opts.points!, `line ${row.line}`);
          const c = at(T, { pH: row.pH, E: s.E });
          return { row, scale: s.ref?.label ?? 'SHE', result: probe(c, row.pH, s.E, s.ref) };
        });
        const csv = pointsCsv(results);
        if (opts.output) {
          await writeOne(opts.output, csv);
          process.stdout.write(`wrote ${opts.output} (${results.length} rows)\n`);
        } else process.stdout.write(csv);
        return;
      }
      if (opts.ph === undefined || opts.potential === undefined) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential (or --points FILE.csv)');
      const pH = num(opts.ph, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
      const E0 = num(opts.potential, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 });
      const s = toShe(ref, E0, spec.temperature, pH, 'command line', '--ref');
      const c = at(spec.temperature, { pH, E: s.E });
      for (const w of [...c.model.warnings, ...s.warnings]) process.stderr.write(`warning: ${w}\n`);
      const r = probe(c, pH, s.E, s.ref);
      if (opts.output !== undefined) {
        await writeOne(opts.output, stableJson(r));
        process.stdout.write(`wrote ${opts.output}\n`);
      } else process.stdout.write(opts.json ? stableJson(r) : probeText(r));
    });
}

/**
 * `ephmap probe FILE --ph X --potential Y [--ref NAME] [--json]` and
 * `ephmap probe FILE --points LOG.csv [-o OUT.csv]`.
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
import { writeAtomic } from '../io/write.js';

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
    .option('-o, --output <csv>', 'with --points: write the results CSV here (default: standard output)')
    .option('--json', 'machine-readable output')
    .action((file: string, opts: ProbeOpts) => {
      const alloy = loadAlloyWith(file, opts);
      if (alloy) {
        if (opts.points !== undefined || opts.ref !== undefined) throw new InputError('command line', opts.points !== undefined ? '--points' : '--ref', 'for an alloy file: --ph and --potential (V vs SHE) only, for now');
        if (opts.ph === undefined || opts.potential === undefined) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential');
        return probeAlloy(alloy, num(opts.ph, '--ph', 'a pH value (number)'), num(opts.potential, '--potential', 'a potential in V (number)'), opts.json === true);
      }
      const spec = loadSpecWith(file, opts);
      let ref = spec.operating.reference;
      if (opts.ref !== undefined) ref = readReference(new Fields('command line'), opts.ref, '--ref');
      const at = pointComputer(spec);
      if (opts.points !== undefined) {
        if (opts.ph !== undefined || opts.potential !== undefined) throw new InputError('command line', '--points', 'either --points or --ph with --potential, not both');
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
          writeAtomic(opts.output, csv);
          process.stdout.write(`wrote ${opts.output} (${results.length} rows)\n`);
        } else process.stdout.write(csv);
        return;
      }
      if (opts.ph === undefined || opts.potential === undefined) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential (or --points FILE.csv)');
      const pH = num(opts.ph, '--ph', 'a pH value (number)');
      const E0 = num(opts.potential, '--potential', 'a potential in V (number)');
      const s = toShe(ref, E0, spec.temperature, pH, 'command line', '--ref');
      const c = at(spec.temperature, { pH, E: s.E });
      for (const w of [...c.model.warnings, ...s.warnings]) process.stderr.write(`warning: ${w}\n`);
      const r = probe(c, pH, s.E, s.ref);
      process.stdout.write(opts.json ? stableJson(r) : probeText(r));
    });
}

/**
 * `ephmap probe FILE --ph X --potential Y [--ref NAME] [--json]` and
 * `ephmap probe FILE --points LOG.csv|- [-o OUT.csv|-] [--delimiter SEP] [--unit V|mV] [--strict]` (probe-points.ts).
 * -o for one point is checked before any compute (src/cli/outputs.ts): .json (its JSON answer),
 * never the system file; with --points, probe-points.ts checks and writes it.
 */
import { writeWarnings } from './notes.js';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { loadAlloyWith, probeAlloy } from './alloy.js';
import { numberArg } from './args.js';
import { stableJson } from '../report/json.js';
import { probe } from '../analysis/probe.js';
import { toShe } from '../analysis/points.js';
import { pointComputer } from '../analysis/widen.js';
import { probeText } from '../report/probe-text.js';
import { runPoints } from './probe-points.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import { checkOutputs, writeOne } from './outputs.js';
import { compositionRows, probeComposition } from './probe-composition.js';
import { alloyRows } from './alloy-points.js';

const num = numberArg;

interface ProbeOpts extends SpecOverrides {
  ph?: string;
  potential?: string;
  ref?: string;
  points?: string;
  output?: string;
  json?: boolean;
  delimiter?: string;
  unit?: string;
  strict?: boolean;
}

export function registerProbe(program: Command): void {
  withSpecOptions(program
    .command('probe'))
    .description('the verdict and predominant species at an operating point (or every row of a logged CSV), evaluated exactly')
    .argument('<file>', 'system file')
    .option('--ph <pH>', 'pH at the point')
    .option('--potential <volts>', 'potential at the point, V (vs SHE unless --ref)')
    .option('--ref <name>', 'reference electrode the potential is measured against: she, rhe, sce, agcl-sat, agcl-3.5m, agcl-1m, agcl-sea, cse, hgo, mse')
    .option('--points <csv>', 'logged series: CSV with columns pH, potential (or potential_mV)[, temperature, ionic_strength]; - reads standard input')
    .option('-o, --output <csv>', 'with --points: write the results CSV here (default, or -: standard output)')
    .option('--delimiter <sep>', 'with --points: separator of the input and output CSV: auto (default), ",", ";" or tab; with ";" or tab a decimal comma is read')
    .option('--unit <unit>', 'with --points: unit of a potential column named without one: V (default) or mV')
    .option('--strict', 'with --points: stop at the first bad row (exit status 2) instead of marking it and going on')
    .option('--json', 'machine-readable output for one point (--points answers as CSV)')
    .action(async (file: string, opts: ProbeOpts) => {
      if (opts.output !== undefined && opts.points === undefined) {
        checkOutputs([{ path: opts.output, option: '--output', extensions: ['.json'] }], [{ path: file, option: '<file>' }]);
      }
      const alloy = loadAlloyWith(file, opts);
      const spec = alloy ? alloy.base : loadSpecWith(file, opts);
      let ref = spec.operating.reference;
      if (opts.ref !== undefined) ref = readReference(new Fields('command line'), opts.ref, '--ref');
      if (opts.points !== undefined && (opts.ph !== undefined || opts.potential !== undefined)) throw new InputError('command line', '--points', 'either --points or --ph with --potential, not both');
      if (opts.points === undefined && (opts.ph === undefined || opts.potential === undefined)) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential (or --points FILE.csv)');
      if (opts.points !== undefined && opts.json === true) throw new InputError('command line', '--json', 'no --json with --points: a logged series is answered as CSV, one row per input row');
      if (opts.points !== undefined) {
        // A composition file answers each row from the bath as made up, an alloy file with its
        // assemblage; the streaming is the same.
        const rows = alloy ? alloyRows(alloy, ref) : spec.composition ? compositionRows(spec, ref) : undefined;
        await runPoints(file, spec, ref, { points: opts.points, output: opts.output, delimiter: opts.delimiter, unit: opts.unit, strict: opts.strict }, rows);
        return;
      }
      for (const [given, name] of [[opts.delimiter, '--delimiter'], [opts.unit, '--unit'], [opts.strict, '--strict']] as const) {
        if (given !== undefined) throw new InputError('command line', name, `${name} only with --points`);
      }
      if (alloy) {
        const pH = num(opts.ph!, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
        return probeAlloy(alloy, pH, num(opts.potential!, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 }), { json: opts.json === true, ref: opts.ref, output: opts.output });
      }
      if (spec.composition) return probeComposition(spec, opts, ref);
      const at = pointComputer(spec);
      if (opts.ph === undefined || opts.potential === undefined) throw new InputError('command line', '--ph/--potential', 'both --ph and --potential (or --points FILE.csv)');
      const pH = num(opts.ph, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
      const E0 = num(opts.potential, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 });
      const s = toShe(ref, E0, spec.temperature, pH, 'command line', '--ref');
      const c = at(spec.temperature, { pH, E: s.E });
      writeWarnings(c.model.warnings, s.warnings);
      const r = probe(c, pH, s.E, s.ref);
      if (opts.output !== undefined) {
        await writeOne(opts.output, stableJson(r));
        process.stdout.write(`wrote ${opts.output}\n`);
      } else process.stdout.write(opts.json ? stableJson(r) : probeText(r));
    });
}

/**
 * `probe` on a composition-mode file (the bath as made up): the speciation at one point, or the
 * predominant form, verdict and total dissolved element for every row of a logged CSV. Called by
 * cli/probe.ts when the file has a `composition` key. Where the solver fails, the output says
 * `status: failed` and the command ends with exit status 4 (UndeterminedError).
 */
import { readFileSync } from 'node:fs';
import { compositionProbe } from '../analysis/composition-probe.js';
import { toShe } from '../analysis/points.js';
import { compositionSetup, type CompositionSetup } from '../diagram/composition-setup.js';
import { compositionPointsCsv } from '../report/composition-points-csv.js';
import { compositionProbeText } from '../report/composition-probe-text.js';
import { stableJson } from '../report/json.js';
import { parsePointsCsv } from '../report/points-read.js';
import { UndeterminedError } from '../errors.js';
import { InputError } from '../system/errors.js';
import type { CustomReference } from '../thermo/reference.js';
import { numberArg as num } from './args.js';
import { writeOne } from './outputs.js';
import type { SystemSpec } from '../system/spec.js';

export interface CompositionProbeOpts {
  ph?: string;
  potential?: string;
  points?: string;
  output?: string;
  json?: boolean;
}

/** Composition set-ups by temperature (°C), for logged series with a temperature column. */
function setupsByTemperature(spec: SystemSpec, make: (spec: SystemSpec) => CompositionSetup): (celsius: number) => CompositionSetup {
  const cache = new Map<number, CompositionSetup>();
  return (celsius) => {
    let s = cache.get(celsius);
    if (!s) {
      s = make({ ...spec, temperature: celsius });
      if (cache.size < 64) cache.set(celsius, s);
    }
    return s;
  };
}

/** `make` builds the point solver (tests pass a budget-starved one to see the failure path). */
export async function probeComposition(spec: SystemSpec, opts: CompositionProbeOpts, ref: string | CustomReference | undefined, make: (spec: SystemSpec) => CompositionSetup = (s) => compositionSetup(s)): Promise<void> {
  const setupAt = setupsByTemperature(spec, make);
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
      return { row, scale: s.ref?.label ?? 'SHE', result: compositionProbe({ ...spec, temperature: T }, setupAt(T), row.pH, s.E, s.ref) };
    });
    const csv = compositionPointsCsv(results);
    if (opts.output) {
      await writeOne(opts.output, csv);
      process.stdout.write(`wrote ${opts.output} (${results.length} rows)\n`);
    } else process.stdout.write(csv);
    const failed = results.filter((x) => x.result.status !== 'ok');
    if (failed.length) throw new UndeterminedError(`${opts.points}: the speciation could not be solved at ${failed.length} of ${results.length} points (lines ${failed.slice(0, 10).map((x) => x.row.line).join(', ')}${failed.length > 10 ? ', …' : ''}); their rows say status failed, verdict unknown`);
    return;
  }
  const pH = num(opts.ph!, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
  const E0 = num(opts.potential!, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 });
  const s = toShe(ref, E0, spec.temperature, pH, 'command line', '--ref');
  const setup = setupAt(spec.temperature);
  for (const w of [...setup.warnings, ...s.warnings]) process.stderr.write(`warning: ${w}\n`);
  const r = compositionProbe(spec, setup, pH, s.E, s.ref);
  process.stdout.write(opts.json ? stableJson(r) : compositionProbeText(r));
  if (r.status !== 'ok') throw new UndeterminedError(`probe: the speciation could not be solved at pH ${pH}, E ${s.E} V vs SHE (${r.reason}); verdict unknown`);
}

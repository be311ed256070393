/**
 * `ephmap probe FILE --ph X --potential Y [--ref NAME] [--json]` and
 * `ephmap probe FILE --points LOG.csv [-o OUT.csv]`.
 */
import { readFileSync } from 'node:fs';
import type { Command } from 'commander';
import { loadSpecWith, type SpecOverrides, withSpecOptions } from './spec-options.js';
import { numberArg } from './args.js';
import { compute, type Computed } from '../pipeline.js';
import { stableJson } from '../report/json.js';
import { parsePointsCsv, pointsCsv } from '../report/points-csv.js';
import { probe, type ProbeResult } from '../report/probe.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import type { SystemSpec } from '../system/spec.js';
import { referenceOffset } from '../thermo/reference.js';
import type { CustomReference } from '../thermo/reference.js';
import { writeAtomic } from './write.js';

const num = numberArg;

interface ProbeOpts extends SpecOverrides {
  ph?: string;
  potential?: string;
  ref?: string;
  points?: string;
  output?: string;
  json?: boolean;
}

/** Compute on a domain (and at a temperature) that contains the point; cached per temperature. */
function computer(spec: SystemSpec) {
  const cache = new Map<number, Computed>();
  return (celsius: number, pH: number, E: number): Computed => {
    let c = cache.get(celsius);
    const inside = c && pH > c.spec.pH[0] && pH < c.spec.pH[1] && E > c.spec.E[0] && E < c.spec.E[1];
    if (!c || !inside) {
      const s = { ...spec, temperature: celsius };
      s.pH = [Math.min(spec.pH[0], pH - 0.5), Math.max(spec.pH[1], pH + 0.5)];
      s.E = [Math.min(spec.E[0], E - 0.1), Math.max(spec.E[1], E + 0.1)];
      c = compute(s);
      if (cache.size < 64) cache.set(celsius, c);
    }
    return c;
  };
}

function toSHE(ref: string | CustomReference | undefined, E: number, celsius: number, pH: number, file: string, field: string) {
  if (ref === undefined || ref === 'she') return { E, ref: undefined };
  let r;
  try {
    r = referenceOffset(ref, celsius, pH);
  } catch (e) {
    throw new InputError(file, field, (e as Error).message);
  }
  return { E: E + r.offset, ref: { label: r.label, E, offset: r.offset }, warnings: r.warnings };
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
      const spec = loadSpecWith(file, opts);
      let ref = spec.operating.reference;
      if (opts.ref !== undefined) ref = readReference(new Fields('command line'), opts.ref, '--ref');
      const at = computer(spec);
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
          const s = toSHE(ref, row.potential, T, row.pH, opts.points!, `line ${row.line}`);
          const c = at(T, row.pH, s.E);
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
      const s = toSHE(ref, E0, spec.temperature, pH, 'command line', '--ref');
      const c = at(spec.temperature, pH, s.E);
      for (const w of [...c.model.warnings, ...(s.warnings ?? [])]) process.stderr.write(`warning: ${w}\n`);
      const r = probe(c, pH, s.E, s.ref);
      process.stdout.write(opts.json ? stableJson(r) : probeText(r));
    });
}

export function probeText(r: ProbeResult): string {
  const mv = (v: number) => `${v >= 0 ? '+' : ''}${(v * 1000).toFixed(1)} mV`;
  const ph = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(3)} pH`;
  const where = r.reference
    ? `pH ${r.pH}, E ${r.reference.E} V vs ${r.reference.label} (= ${r.E.toFixed(4)} V vs SHE), ${r.temperature.celsius} °C`
    : `pH ${r.pH}, E ${r.E} V vs SHE, ${r.temperature.celsius} °C`;
  const lines = [
    `point: ${where}`,
    `verdict: ${r.verdict.toUpperCase()} — ${r.predominant} predominates (${r.class}; dissolved-species threshold activity ${r.threshold})`,
    `runner-up: ${r.runnerUp ?? 'none'} (margin ${r.margin.kJPerMol.toFixed(3)} kJ per mol of element${r.margin.potentialV !== null ? `, ${mv(r.margin.potentialV)}` : ''})`,
    `distance to the nearest boundary: ${r.distance.mV === null ? 'none along E' : mv(r.distance.mV / 1000)} (at this pH); ${r.distance.pH === null ? 'none along pH' : ph(r.distance.pH)} (at this potential)`,
  ];
  const c = r.crossings;
  for (const [name, x, unit] of [
    ['raise E', c.raiseE, 'V'],
    ['lower E', c.lowerE, 'V'],
    ['lower pH', c.lowerPH, 'pH'],
    ['raise pH', c.raisePH, 'pH'],
  ] as const) {
    if (x) lines.push(`  ${name.padEnd(8)} ${unit === 'V' ? mv(x.shift) : ph(x.shift)} → ${x.to} (${x.verdict}): ${x.reaction}`);
  }
  lines.push(r.advice);
  if (r.nearestBoundary) lines.push(`nearest boundary: ${r.nearestBoundary.between.join(' / ')}: ${r.nearestBoundary.reaction} [${r.nearestBoundary.equation}]`);
  lines.push('Equilibrium thermodynamics only — not kinetics; follow the applicable codes and a qualified corrosion professional.');
  return `${lines.join('\n')}\n`;
}

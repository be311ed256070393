/**
 * Verb `cell`: energies, equilibrium and thermoneutral potentials of one reaction at a temperature
 * or over a range of temperatures.
 */
import { type Command, Option } from 'commander';
import { numberArg } from './args.js';
import { cellReaction, cellTable, temperatureSteps, type CellResult, type SpeciesLookup } from '../thermo/cell.js';
import { ReactionError, type ReactionSubject } from '../chem/reaction-parse.js';
import { cellText } from '../report/cell-format.js';
import { stableJson } from '../report/json.js';
import { InputError } from '../system/errors.js';
import { NUMBER_TEXT } from '../system/fields.js';
import { listReferences } from '../thermo/reference.js';
import { fileLookup } from '../system/lookup.js';
import type { CellExtrapolation } from '../thermo/cell-energies.js';

export interface CellDeps {
  lookup: SpeciesLookup;
  /** Where the report goes (default: standard output). */
  write?: (text: string) => void;
}

interface CellCliOptions {
  temperature?: string;
  range?: string;
  electrons?: string;
  extrapolation: string;
  ref?: string;
  /** Hidden alias of --ref (the name this verb used before). */
  reference?: string;
  ph?: string;
  json?: boolean;
  species?: string;
  activity?: Record<string, number>;
}

const CLI = 'command line';

/** The argument or option a reaction error is about. */
const REACTION_FIELD: Record<ReactionSubject, string> = { reaction: 'REACTION', electrons: '--electrons', reference: '--ref', activity: '--activity' };

/** `--activity SPECIES=VALUE` (repeatable) into a map; the value a positive number. */
function activityOption(value: string, prev: Record<string, number> = {}): Record<string, number> {
  const k = value.lastIndexOf('=');
  const key = k > 0 ? value.slice(0, k).trim() : '';
  const v = k > 0 ? Number(value.slice(k + 1)) : Number.NaN;
  if (!key || !(v > 0) || !Number.isFinite(v)) throw new InputError(CLI, '--activity', 'SPECIES=VALUE with a positive value, e.g. Fe^2+=1e-6 or O2(g)=0.21', JSON.stringify(value));
  return { ...prev, [key]: v };
}

const EXTRAPOLATIONS = ['best', 'cp', 'constant-h-s'];

const num = numberArg;

export function registerCell(program: Command, deps: CellDeps): void {
  program
    .command('cell')
    .description(
      'ΔrG, ΔrH, ΔrS, ΔrCp, log K and, for redox reactions, equilibrium and thermoneutral potentials of a reaction, ' +
        'e.g. "2H2O(l) <=> 2H2(g) + O2(g)", "Cu^2+ + 2e^- <=> Cu(s)" or "H2O(l) <=> H^+ + OH^-" (terms separated by " + "; "e^-" is the electron; Unicode such as "Cu²⁺ + 2e⁻ ⇌ Cu(s)" is read too)',
    )
    .argument('<reaction>', 'balanced reaction, quoted')
    .option('--temperature <C>', 'temperature, °C', '25')
    .option('--range <from:to:step>', 'table over temperatures, °C (e.g. 25:100:25)')
    .option('--electrons <N>', 'electrons transferred (for full reactions whose oxidation states are not decided)')
    .option('--extrapolation <mode>', "best (each species' own model: IAPWS water, HKF for aqueous species, Cp polynomials), cp (constant Cp°) or constant-h-s (ΔH − TΔS)", 'best')
    .option('--activity <species=value>', 'activity of a species (any notation; gases: pressure in bar), e.g. Fe^2+=1e-6; repeatable; others at 1', activityOption)
    .option('--ref <name>', 'also give half-reaction potentials against a reference electrode')
    .addOption(new Option('--reference <name>', 'same as --ref').hideHelp())
    .option('--ph <pH>', 'pH, for --ref rhe')
    .option('--species <file>', 'a system file whose inline species are used first (then the built-in library)')
    .option('--json', 'machine-readable output')
    .addHelpText('after', `\nReference electrodes:\n${listReferences().map((l) => `  ${l}`).join('\n')}\n`)
    .action((reaction: string, opts: CellCliOptions) => {
      const out = deps.write ?? ((s: string) => void process.stdout.write(s));
      const extrapolation = opts.extrapolation as CellExtrapolation;
      if (!EXTRAPOLATIONS.includes(extrapolation)) {
        throw new InputError(CLI, '--extrapolation', '"best", "cp" or "constant-h-s"', JSON.stringify(opts.extrapolation));
      }
      const electrons = opts.electrons === undefined ? undefined : num(opts.electrons, '--electrons', 'a positive number of electrons');
      if (electrons !== undefined && !(electrons > 0)) throw new InputError(CLI, '--electrons', 'a positive number of electrons', opts.electrons);
      const pH = opts.ph === undefined ? undefined : num(opts.ph, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
      if (opts.ref !== undefined && opts.reference !== undefined) throw new InputError(CLI, '--ref', 'one of --ref and --reference (the same option), not both');
      const reference = opts.ref ?? opts.reference;
      if (reference !== undefined && reference.trim().toLowerCase() === 'rhe' && pH === undefined) {
        throw new InputError(CLI, '--ph', 'a pH with --ref rhe (the reversible hydrogen electrode moves with the pH: E_SHE = E_RHE − 0.0592·pH at 25 °C)', 'no --ph');
      }
      let temperatures: number[];
      if (opts.range !== undefined) {
        const parts = opts.range.split(':');
        const bad = () => new InputError(CLI, '--range', 'FROM:TO:STEP in °C with TO ≥ FROM and STEP > 0, at most 1001 rows', JSON.stringify(opts.range));
        if (parts.length !== 3 || parts.some((p) => !NUMBER_TEXT.test(p.trim()) || !Number.isFinite(Number(p)))) throw bad();
        const [a, b, c] = parts.map(Number) as [number, number, number];
        try {
          temperatures = temperatureSteps(a, b, c);
        } catch {
          throw bad();
        }
      } else {
        temperatures = [num(opts.temperature ?? '25', '--temperature', 'a temperature in °C (number)')];
      }
      if (temperatures.some((t) => t <= -273.15)) throw new InputError(CLI, opts.range ? '--range' : '--temperature', 'temperatures above −273.15 °C', opts.range ?? opts.temperature);
      const lookup = opts.species === undefined ? deps.lookup : fileLookup(opts.species, deps.lookup);
      const cellOpts = { lookup, electrons, extrapolation, reference, pH, activities: opts.activity };
      let rows: CellResult[];
      try {
        rows = temperatures.length === 1 && opts.range === undefined
          ? [cellReaction(reaction, { ...cellOpts, celsius: temperatures[0] })]
          : cellTable(reaction, temperatures, cellOpts);
      } catch (e) {
        if (e instanceof ReactionError) throw new InputError(CLI, REACTION_FIELD[e.subject], e.expected, e.got);
        throw e;
      }
      const warnings = [...new Set(rows.flatMap((r) => r.warnings))];
      if (opts.json) out(stableJson(rows.length === 1 && opts.range === undefined ? rows[0] : { reaction: rows[0]!.reaction, rows, warnings }));
      else out(cellText(rows));
    });
}

/**
 * `probe` on a composition-mode file (the bath as made up): the speciation at one point, or — with
 * --points, through the streaming series runner (probe-points.ts) — the predominant form, verdict
 * and total dissolved element for every row of a logged CSV. Called by cli/probe.ts when the file
 * has a `composition` key. Where the solver fails, the output says `status: failed` (verdict
 * unknown) and the command ends with exit status 4 (UndeterminedError, or PartialError for a series).
 */
import { writeWarnings } from './notes.js';
import { compositionProbe } from '../analysis/composition-probe.js';
import { compositionPointsAnswerer } from '../analysis/composition-points-answer.js';
import { toShe } from '../analysis/points.js';
import { compositionSetup, type CompositionSetup } from '../diagram/composition-setup.js';
import { compositionPointsErrorRow, compositionPointsHeader, compositionPointsRow } from '../report/composition-points-csv.js';
import { compositionProbeText } from '../report/composition-probe-text.js';
import { stableJson } from '../report/json.js';
import { InputError, UndeterminedError } from '../errors.js';
import type { CustomReference } from '../thermo/reference.js';
import { numberArg as num } from './args.js';
import { writeOne } from './outputs.js';
import type { RowAnswerer } from './probe-points.js';
import type { SystemSpec } from '../system/spec.js';

export interface CompositionProbeOpts {
  ph?: string;
  potential?: string;
  json?: boolean;
  /** A .json file for the answer (checked by the verb before anything is read). */
  output?: string;
}

type Make = (spec: SystemSpec) => CompositionSetup;

/**
 * The composition-mode row answerer for runPoints: a failed solve is written (status failed,
 * verdict unknown) and counted as not answered. An `ionic_strength` column is refused: in this
 * mode the ionic strength follows from the composition. `make` as for probeComposition.
 */
export function compositionRows(spec: SystemSpec, ref: string | CustomReference | undefined, make?: Make): (name: string) => RowAnswerer {
  return (name) => {
    const answerer = compositionPointsAnswerer(spec, ref, name, make);
    return {
      header(h, sep) {
        if (h.ionicStrength >= 0) throw new InputError(name, 'header', 'no ionic_strength column for a composition file (the ionic strength follows from the composition)', `column ${h.ionicStrength + 1}`);
        return compositionPointsHeader(h, sep);
      },
      row(row, sep) {
        const a = answerer.answer(row);
        if ('error' in a) return a;
        return { text: compositionPointsRow(row, a.scale, a.result, a.warnings, sep), failed: a.result.status !== 'ok' };
      },
      errorRow: compositionPointsErrorRow,
      failedIn: 'error column, or status failed with the reason',
    };
  };
}

/** One point. `make` builds the point solver (tests pass a budget-starved one to see the failure path). */
export async function probeComposition(spec: SystemSpec, opts: CompositionProbeOpts, ref: string | CustomReference | undefined, make: Make = (s) => compositionSetup(s)): Promise<void> {
  const pH = num(opts.ph!, '--ph', 'a pH value from -3 to 17', { min: -3, max: 17 });
  const E0 = num(opts.potential!, '--potential', 'a potential from -5 to 5 V', { min: -5, max: 5 });
  const s = toShe(ref, E0, spec.temperature, pH, 'command line', '--ref');
  const setup = make(spec);
  writeWarnings(setup.warnings, s.warnings);
  const r = compositionProbe(spec, setup, pH, s.E, s.ref);
  if (opts.output !== undefined) {
    await writeOne(opts.output, stableJson(r));
    process.stdout.write(`wrote ${opts.output}\n`);
  } else process.stdout.write(opts.json ? stableJson(r) : compositionProbeText(r));
  if (r.status !== 'ok') throw new UndeterminedError(`probe: the speciation could not be solved at pH ${pH}, E ${s.E} V vs SHE (${r.reason}); verdict unknown`);
}

/**
 * Answers for logged series, one row at a time, each equal to `probe --ph --potential` at the same
 * point and condition.
 *
 * Steps per row:
 *  1. the condition (temperature, ionic strength; the system file's own when the row has none)
 *     picks a diagram from a bounded cache (least recently used dropped beyond MAX_CONDITIONS), so
 *     the diagram is computed once per distinct condition, not once per row;
 *  2. the potential goes to the SHE scale at that temperature (and the row's pH, for the RHE);
 *  3. a point inside the diagram's range is answered on it — predominant species by the exact
 *     argmin of ψ at the point (no grid), distances from the exact boundaries; a point outside is
 *     answered on a diagram widened to hold it (widen.ts: the same rule as a single probe), which
 *     costs one computation for that row.
 * A condition that cannot be computed (e.g. beyond the data's temperature range) is remembered
 * and every row at it gets the same error.
 */
import { compute, type Computed } from '../pipeline.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { conditionCache, orError, rowOnShe } from './row-conditions.js';
import { probe, type ProbeResult } from './probe.js';
import { widenedSpec } from './widen.js';

/** Diagrams kept at once (distinct conditions); each is a few hundred kB at most. */
export { MAX_CONDITIONS } from './row-conditions.js';

export interface PointQuery {
  line: number;
  pH: number;
  /** V on the reference scale of the run. */
  potential: number;
  temperature?: number;
  ionicStrength?: number;
}

export type PointAnswer = { scale: string; result: ProbeResult; warnings: string[] } | { error: string };

interface Condition {
  c?: Computed;
  error?: string;
  warnings: string[];
}

/** The system at a row's condition: its temperature and, when given, its ionic strength. */
function specAt(spec: SystemSpec, celsius: number, I: number | undefined): SystemSpec {
  if (I === undefined) return { ...spec, temperature: celsius };
  const s = spec.solution;
  // An ionic strength given per row means a non-ideal solution, as `ionicStrength` in a file does.
  const model = s.model === 'ideal' && s.ionicStrengthFrom.startsWith('not given') ? 'davies' : s.model;
  return { ...spec, temperature: celsius, solution: { ...s, model, ionicStrength: I, ionicStrengthFrom: 'ionic_strength column' } };
}


/** A row answerer over one system and reference scale (see the module comment). */
export function pointsAnswerer(spec: SystemSpec, ref: string | CustomReference | undefined, file: string): { answer: (q: PointQuery) => PointAnswer; computed: () => number } {
  let computations = 0;
  let lastT = NaN;
  let lastI: number | undefined;
  let last: Condition | undefined;
  const condition = (celsius: number, I: number | undefined): Condition => {
    // Logs hold one condition for long runs of rows: the last one is kept at hand.
    if (last && celsius === lastT && I === lastI) return last;
    lastT = celsius;
    lastI = I;
    last = lookup(celsius, I);
    return last;
  };
  const cached = conditionCache((key: string): Condition => {
    computations++;
    const [T, I] = key.split('|');
    const r = orError(() => compute(specAt(spec, Number(T), I === undefined ? undefined : Number(I))));
    return 'value' in r ? { c: r.value, warnings: r.value.model.warnings } : { error: r.error, warnings: [] };
  });
  const lookup = (celsius: number, I: number | undefined): Condition => cached(I === undefined ? `${celsius}` : `${celsius}|${I}`);
  const answer = (q: PointQuery): PointAnswer => {
    const T = q.temperature ?? spec.temperature;
    const k = condition(T, q.ionicStrength);
    if (!k.c) return { error: `line ${q.line}: ${k.error}` };
    // Step 2: the SHE scale at T.
    const she = rowOnShe(ref, q, T, file);
    if ('error' in she) return she;
    const s = she.value;
    // Step 3: inside the range on the cached diagram (widen.ts holdsAll, inlined: no allocation per
    // row); outside on one widened for this point.
    const point = { pH: q.pH, E: s.E };
    let c = k.c;
    if (!(q.pH > c.spec.pH[0] && q.pH < c.spec.pH[1] && s.E > c.spec.E[0] && s.E < c.spec.E[1])) {
      computations++;
      const w = orError(() => compute(widenedSpec(c.spec, [point])));
      if ('error' in w) return { error: `line ${q.line}: ${w.error}` };
      c = w.value;
    }
    const result = probe(c, q.pH, s.E, s.ref);
    // The probe's own warnings: the model's, plus any about this point (e.g. no verdict in an undetermined
    // field), each once (the model already carries the file's reference-electrode warnings).
    const warnings = s.warnings.length ? [...result.warnings, ...s.warnings.filter((w) => !result.warnings.includes(w))] : result.warnings;
    return { scale: s.ref?.label ?? 'SHE', result, warnings };
  };
  return { answer, computed: () => computations };
}

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
 *
 * One difference from a single probe: a diagram at a condition other than the file's own (a row's
 * temperature or ionic strength) is cross-checked on a ROW_CHECK_GRID² grid instead of the file's
 * `grid` (pipeline.ts; the check only warns, the row is answered by the exact argmin) — a log with
 * a temperature per row computes thousands of diagrams.
 */
import { compute, type Computed } from '../pipeline.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { conditionCache, orError, rowOnShe } from './row-conditions.js';
import { probe, type ProbeResult } from './probe.js';
import { newRowProbe, probeRow, type RowProbe } from './probe-row.js';
import type { GivenPotential } from './points.js';
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

/**
 * A row's printed answer: its scale, potential on the SHE scale, the printed fields of the probe
 * (`fields`: one record reused for every row — read it before the next row) and the warnings about
 * this point beyond the probe's own (`more`, e.g. the reference electrode's).
 */
export type PointRowAnswer = { scale: string; E: number; fields: RowProbe; more: readonly string[] } | { error: string };

/** Nodes per side of the topology cross-check at a row's own condition (see the module comment). */
export const ROW_CHECK_GRID = 50;

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
export function pointsAnswerer(spec: SystemSpec, ref: string | CustomReference | undefined, file: string): { answer: (q: PointQuery) => PointAnswer; row: (q: PointQuery) => PointRowAnswer; computed: () => number } {
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
  const build = (T: number, I: number | undefined): Condition => {
    computations++;
    const own = T === spec.temperature && I === undefined;
    const r = orError(() => compute(specAt(spec, T, I), own ? {} : { checkGrid: ROW_CHECK_GRID }));
    return 'value' in r ? { c: r.value, warnings: r.value.model.warnings } : { error: r.error, warnings: [] };
  };
  // Keyed by the temperature itself when there is no ionic strength (no key text built per row).
  const byT = conditionCache((T: number): Condition => build(T, undefined));
  const byTI = conditionCache((key: string): Condition => {
    const [T, I] = key.split('|');
    return build(Number(T), Number(I));
  });
  const lookup = (celsius: number, I: number | undefined): Condition => (I === undefined ? byT(celsius) : byTI(`${celsius}|${I}`));
  // Steps 1–3 up to the diagram the row is answered on, and the row's potential on the SHE scale.
  const NO_WARNINGS: string[] = [];
  const onShe = (q: PointQuery, T: number) =>
    ref === undefined || ref === 'she' ? { value: { E: q.potential, ref: undefined, warnings: NO_WARNINGS } } : rowOnShe(ref, q, T, file);
  const locate = (q: PointQuery): { c: Computed; s: { E: number; ref: GivenPotential | undefined; warnings: string[] } } | { error: string } => {
    const T = q.temperature ?? spec.temperature;
    const k = condition(T, q.ionicStrength);
    if (!k.c) return { error: `line ${q.line}: ${k.error}` };
    // Step 2: the SHE scale at T.
    const she = onShe(q, T);
    if ('error' in she) return she;
    const s = she.value;
    // Step 3: inside the range on the cached diagram (widen.ts holdsAll, inlined: no allocation per
    // row); outside on one widened for this point.
    let c = k.c;
    if (!(q.pH > c.spec.pH[0] && q.pH < c.spec.pH[1] && s.E > c.spec.E[0] && s.E < c.spec.E[1])) {
      computations++;
      const w = orError(() => compute(widenedSpec(c.spec, [{ pH: q.pH, E: s.E }])));
      if ('error' in w) return { error: `line ${q.line}: ${w.error}` };
      c = w.value;
    }
    return { c, s };
  };
  const answer = (q: PointQuery): PointAnswer => {
    const at = locate(q);
    if ('error' in at) return at;
    const s = at.s;
    const result = probe(at.c, q.pH, s.E, s.ref);
    // The probe's own warnings: the model's, plus any about this point (e.g. no verdict in an undetermined
    // field), each once (the model already carries the file's reference-electrode warnings).
    const warnings = s.warnings.length ? [...result.warnings, ...s.warnings.filter((w) => !result.warnings.includes(w))] : result.warnings;
    return { scale: s.ref?.label ?? 'SHE', result, warnings };
  };
  // The printed fields only (probe-row.ts), into one record reused for every row.
  const fields = newRowProbe();
  const row = (q: PointQuery): PointRowAnswer => {
    const at = locate(q);
    if ('error' in at) return at;
    const s = at.s;
    probeRow(at.c, q.pH, s.E, fields);
    return { scale: s.ref?.label ?? 'SHE', E: s.E, fields, more: s.warnings };
  };
  return { answer, row, computed: () => computations };
}

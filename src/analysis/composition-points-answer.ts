/**
 * Answers for logged series in composition mode (the bath as made up), one row at a time, each
 * equal to `probe --ph --potential` on the same composition file at the same point and temperature.
 *
 * Steps per row:
 *  1. the row's temperature (the file's own when the row has none) picks a point solver
 *     (compositionSetup) from a bounded cache (least recently used dropped beyond
 *     MAX_CONDITIONS), so it is built once per distinct temperature, not once per row; a
 *     temperature at which it cannot be built is remembered and every row at it gets that error;
 *  2. the potential goes to the SHE scale at that temperature (and the row's pH, for the RHE);
 *  3. compositionProbe solves the speciation at the point; a failed solve comes back as status
 *     failed, verdict unknown (the caller writes it and counts it as not answered).
 */
import { compositionSetup, type CompositionSetup } from '../diagram/composition-setup.js';
import type { SystemSpec } from '../system/spec.js';
import type { CustomReference } from '../thermo/reference.js';
import { compositionProbe, type CompositionProbeResult } from './composition-probe.js';
import type { PointQuery } from './points-answer.js';
import { conditionCache, orError, rowOnShe } from './row-conditions.js';

export type CompositionPointAnswer = { scale: string; result: CompositionProbeResult; warnings: string[] } | { error: string };

interface Setup {
  s?: CompositionSetup;
  error?: string;
}

/** `make` builds the point solver (tests pass a budget-starved one to see the failure path). */
export function compositionPointsAnswerer(
  spec: SystemSpec,
  ref: string | CustomReference | undefined,
  file: string,
  make: (spec: SystemSpec) => CompositionSetup = (s) => compositionSetup(s),
): { answer: (q: PointQuery) => CompositionPointAnswer } {
  const setupAt = conditionCache((celsius: number): Setup => {
    const r = orError(() => make({ ...spec, temperature: celsius }));
    return 'value' in r ? { s: r.value } : { error: r.error };
  });
  const answer = (q: PointQuery): CompositionPointAnswer => {
    const T = q.temperature ?? spec.temperature;
    const k = setupAt(T);
    if (!k.s) return { error: `line ${q.line}: ${k.error}` };
    // Step 2: the SHE scale at T.
    const she = rowOnShe(ref, q, T, file);
    if ('error' in she) return she;
    const s = she.value;
    // Step 3: the speciation at the point.
    const result = compositionProbe({ ...spec, temperature: T }, k.s, q.pH, s.E, s.ref);
    const own = k.s.warnings;
    return { scale: s.ref?.label ?? 'SHE', result, warnings: [...own, ...s.warnings.filter((w) => !own.includes(w))] };
  };
  return { answer };
}

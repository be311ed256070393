/**
 * Shared steps of the row answerers for logged series (points-answer.ts for the fixed-activity
 * kind, composition-points-answer.ts for the bath as made up):
 *  - a bounded cache of whatever is built per distinct condition (least recently used dropped
 *    beyond `max`), so a diagram or point solver is built once per condition, not once per row;
 *  - a deliberate error while building or converting turned into that row's message (anything else
 *    is a defect and propagates);
 *  - the row's potential on the SHE scale at its temperature (and pH, for the RHE).
 */
import { EphmapError } from '../errors.js';
import type { CustomReference } from '../thermo/reference.js';
import { toShe } from './points.js';

/** Distinct conditions kept at once. */
export const MAX_CONDITIONS = 64;

/**
 * `build(key)` once per key, the most recently used `max` kept. A hit only stamps its entry (no
 * map change per row); a miss beyond `max` drops the entry with the oldest stamp.
 */
export function conditionCache<K, V>(build: (key: K) => V, max = MAX_CONDITIONS): (key: K) => V {
  const cache = new Map<K, { v: V; used: number }>();
  let clock = 0;
  return (key) => {
    const hit = cache.get(key);
    if (hit !== undefined) {
      hit.used = ++clock;
      return hit.v;
    }
    const v = build(key);
    if (cache.size >= max) {
      let oldest: K | undefined;
      let at = Infinity;
      for (const [k, e] of cache) if (e.used < at) (at = e.used), (oldest = k);
      cache.delete(oldest!);
    }
    cache.set(key, { v, used: ++clock });
    return v;
  };
}

/** `f()`, or the message of the EphmapError it threw. */
export function orError<T>(f: () => T): { value: T } | { error: string } {
  try {
    return { value: f() };
  } catch (e) {
    if (e instanceof EphmapError) return { error: e.message };
    throw e;
  }
}

/** The row's potential on the SHE scale at T (see points.ts toShe), or the row's error. */
export function rowOnShe(ref: string | CustomReference | undefined, q: { line: number; pH: number; potential: number }, celsius: number, file: string) {
  return orError(() => toShe(ref, q.potential, celsius, q.pH, file, `line ${q.line}`));
}

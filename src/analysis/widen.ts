/**
 * Domain widening: the one rule for answering at points outside a diagram's pH and E range. The
 * system is re-solved on the smallest domain that holds the original range and every point with a
 * margin of WIDEN_MARGIN around each point, so that distances to boundaries are measured exactly
 * instead of clipped at the frame.
 */
import { compute, type Computed } from '../pipeline.js';
import type { SystemSpec } from '../system/spec.js';

/** Margin kept around a point outside the domain: 0.5 pH units, 0.1 V. */
export const WIDEN_MARGIN = { pH: 0.5, E: 0.1 } as const;

export interface DomainPoint {
  pH: number;
  /** V vs SHE at the diagram temperature. */
  E: number;
}

/** True when every point lies strictly inside the spec's pH and E range. */
export function holdsAll(spec: SystemSpec, points: readonly DomainPoint[]): boolean {
  return points.every((p) => p.pH > spec.pH[0] && p.pH < spec.pH[1] && p.E > spec.E[0] && p.E < spec.E[1]);
}

/** The spec's range widened to hold every point with WIDEN_MARGIN around it (unchanged otherwise). */
export function widenedSpec(spec: SystemSpec, points: readonly DomainPoint[]): SystemSpec {
  const { pH: mp, E: mE } = WIDEN_MARGIN;
  return {
    ...spec,
    pH: [Math.min(spec.pH[0], ...points.map((p) => p.pH - mp)), Math.max(spec.pH[1], ...points.map((p) => p.pH + mp))],
    E: [Math.min(spec.E[0], ...points.map((p) => p.E - mE)), Math.max(spec.E[1], ...points.map((p) => p.E + mE))],
  };
}

/** The computed diagram itself when it holds every point, else one computation on the widened domain. */
export function computedHolding(c: Computed, points: readonly DomainPoint[]): Computed {
  return holdsAll(c.spec, points) ? c : compute(widenedSpec(c.spec, points));
}

/**
 * A computer for points one at a time (logged series): a diagram at the point's temperature whose
 * domain holds the point; reused while later points stay inside, cached for up to 64 temperatures.
 */
export function pointComputer(spec: SystemSpec): (celsius: number, point: DomainPoint) => Computed {
  const cache = new Map<number, Computed>();
  return (celsius, point) => {
    let c = cache.get(celsius);
    if (!c || !holdsAll(c.spec, [point])) {
      c = compute(widenedSpec({ ...spec, temperature: celsius }, [point]));
      if (cache.size < 64) cache.set(celsius, c);
    }
    return c;
  };
}

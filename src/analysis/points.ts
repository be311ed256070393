/**
 * Operating points probed exactly: each point's potential converted to the SHE scale at the diagram
 * temperature (at the point's own pH for the RHE), then the answer at the point on a domain that
 * holds every point (see widen.ts).
 */
import type { Computed } from '../pipeline.js';
import { InputError } from '../system/errors.js';
import { referenceOffset, type CustomReference } from '../thermo/reference.js';
import { probe, type ProbeResult } from './probe.js';
import { computedHolding } from './widen.js';

/** The potential as given and its scale, when it is not the SHE. */
export interface GivenPotential {
  label: string;
  E: number;
  offset: number;
}

/**
 * E (V vs `ref` at `celsius`, pH) on the SHE scale: E_SHE = E + offset(ref, T, pH).
 * A reference the thermo module refuses is reported as an InputError naming `file` and `field`.
 */
export function toShe(
  ref: string | CustomReference | undefined,
  E: number,
  celsius: number,
  pH: number,
  file: string,
  field: string,
): { E: number; ref: GivenPotential | undefined; warnings: string[] } {
  if (ref === undefined || ref === 'she') return { E, ref: undefined, warnings: [] };
  let r;
  try {
    r = referenceOffset(ref, celsius, pH);
  } catch (e) {
    throw new InputError(file, field, (e as Error).message);
  }
  return { E: E + r.offset, ref: { label: r.label, E, offset: r.offset }, warnings: r.warnings };
}

/** A reference electrode for display (a second axis, line equations): a constant offset at T. */
export interface DisplayedReference {
  id: string;
  label: string;
  /** E_SHE − E_ref at T, V. */
  offset: number;
  warnings: string[];
}

/**
 * The offset of a reference electrode at `celsius` for display. The RHE moves with pH, so it has
 * no single offset: InputError naming `file` and `field`.
 */
export function displayReference(ref: string | CustomReference, celsius: number, file: string, field: string): DisplayedReference {
  if (ref === 'rhe') throw new InputError(file, field, 'an electrode with a fixed potential (the RHE moves with pH; use probe --ref rhe)', 'rhe');
  const r = referenceOffset(ref, celsius);
  return { id: typeof ref === 'string' ? ref : 'custom', label: r.label, offset: r.offset, warnings: r.warnings };
}

export interface ReportPoint {
  label: string;
  pH: number;
  /** Potential as given in the system file and its scale. */
  Egiven: number;
  scale: string;
  /** The same potential on the SHE scale at the diagram temperature, V. */
  Eshe: number;
  result: ProbeResult;
}

/**
 * The system file's operating points, each probed exactly (one wider computation when some point
 * lies outside the diagram). Reference-electrode warnings are appended to `warnings` once each.
 */
export function probeOperatingPoints(c: Computed, warnings: string[]): ReportPoint[] {
  const op = c.spec.operating;
  if (!op.points.length) return [];
  const T = c.spec.temperature;
  // Step 1: every potential on the SHE scale.
  const conv = op.points.map((p) => {
    if (op.reference === undefined || op.reference === 'she') return { p, Eshe: p.E, scale: 'SHE' };
    const r = referenceOffset(op.reference, T, p.pH);
    warnings.push(...r.warnings.filter((w) => !warnings.includes(w)));
    return { p, Eshe: p.E + r.offset, scale: r.label };
  });
  // Step 2: one computation that holds every point, so that distances are measured exactly.
  const at = computedHolding(c, conv.map((x) => ({ pH: x.p.pH, E: x.Eshe })));
  // Step 3: the answer at each point.
  return conv.map(({ p, Eshe, scale }) => ({
    label: p.label,
    pH: p.pH,
    Egiven: p.E,
    scale,
    Eshe,
    result: probe(at, p.pH, Eshe, scale === 'SHE' ? undefined : { label: scale, E: p.E, offset: Eshe - p.E }),
  }));
}

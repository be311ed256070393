/**
 * The system file's envelopes (boxes) and paths, answered at stated sample points: a box at its
 * four corners and its centre, a path at each of its points. Each sample is probed exactly (one
 * wider computation when some sample lies outside the diagram), potentials converted from the
 * file's reference scale at the sample's own pH. Data only; the report writes it.
 */
import type { Computed } from '../pipeline.js';
import type { Operating } from '../system/operating.js';
import { referenceOffset } from '../thermo/reference.js';
import type { PointVerdict as Verdict } from './probe.js';
import { probe } from './probe.js';
import { computedHolding } from './widen.js';

export interface EnvelopeSample {
  /** "corner pH 8.8, E -0.55", "centre", "point 2". */
  where: string;
  pH: number;
  /** Potential as given (file's reference scale) and on the SHE scale, V. */
  Egiven: number;
  Eshe: number;
  predominant: string;
  /** The verdict: a point verdict (fixed and bath kinds), or an alloy's verdict in words. */
  verdict: Verdict | string;
}

export interface EnvelopeResult {
  kind: 'box' | 'path';
  label: string;
  scale: string;
  samples: EnvelopeSample[];
  /** The distinct verdicts found at the samples, in order of first appearance. */
  verdicts: (Verdict | string)[];
}

/** A sample point of a box or path, its potential as given and on the SHE scale. */
interface SamplePoint {
  where: string;
  pH: number;
  E: number;
  Eshe: number;
  scale: string;
}

/** One envelope's samples before they are answered. */
interface EnvelopeSamples {
  kind: 'box' | 'path';
  label: string;
  pts: SamplePoint[];
}

/**
 * Step 1 (both kinds of diagram): the sample points of every box (four corners and centre) and
 * path (each point) of `op`, each potential converted from the file's reference scale at the
 * sample's own pH and temperature `celsius`; the electrode's warnings are appended once each.
 */
export function envelopeSamples(op: Operating, celsius: number, warnings: string[]): EnvelopeSamples[] {
  const toShe = (pH: number, E: number) => {
    if (op.reference === undefined || op.reference === 'she') return { Eshe: E, scale: 'SHE' };
    const r = referenceOffset(op.reference, celsius, pH);
    warnings.push(...r.warnings.filter((w) => !warnings.includes(w)));
    return { Eshe: E + r.offset, scale: r.label };
  };
  const raw: { kind: 'box' | 'path'; label: string; pts: { where: string; pH: number; E: number }[] }[] = [
    ...op.boxes.map((b) => ({
      kind: 'box' as const,
      label: b.label,
      pts: [
        ...[b.pH[0], b.pH[1]].flatMap((x) => [b.E[0], b.E[1]].map((y) => ({ where: `corner pH ${x}, E ${y}`, pH: x, E: y }))),
        { where: 'centre', pH: (b.pH[0] + b.pH[1]) / 2, E: (b.E[0] + b.E[1]) / 2 },
      ],
    })),
    ...op.paths.map((p) => ({ kind: 'path' as const, label: p.label, pts: p.points.map(([x, y], k) => ({ where: `point ${k + 1}`, pH: x, E: y })) })),
  ];
  return raw.map((r) => ({ ...r, pts: r.pts.map((p) => ({ ...p, ...toShe(p.pH, p.E) })) }));
}

/** Step 3 (both kinds): each sample answered by `answer` (predominant form and verdict). */
export function answerEnvelopes(sets: EnvelopeSamples[], answer: (pH: number, Eshe: number) => { predominant: string; verdict: Verdict | string }): EnvelopeResult[] {
  return sets.map((r) => {
    const samples = r.pts.map((p) => ({ where: p.where, pH: p.pH, Egiven: p.E, Eshe: p.Eshe, ...answer(p.pH, p.Eshe) }));
    return { kind: r.kind, label: r.label, scale: r.pts[0]?.scale ?? 'SHE', samples, verdicts: [...new Set(samples.map((s) => s.verdict))] };
  });
}

/** The fixed-activity diagram's envelopes (see the module comment). */
export function probeEnvelopes(c: Computed, warnings: string[]): EnvelopeResult[] {
  // Step 1: the sample points of every box and path.
  const sets = envelopeSamples(c.spec.operating, c.spec.temperature, warnings);
  if (!sets.length) return [];
  // Step 2: one computation holding every sample.
  const at = computedHolding(c, sets.flatMap((r) => r.pts.map((p) => ({ pH: p.pH, E: p.Eshe }))));
  // Step 3: the answer at each sample.
  return answerEnvelopes(sets, (pH, E) => {
    const res = probe(at, pH, E);
    return { predominant: res.predominant, verdict: res.verdict };
  });
}

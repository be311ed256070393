/**
 * The system file's envelopes (boxes) and paths, answered at stated sample points: a box at its
 * four corners and its centre, a path at each of its points. Each sample is probed exactly (one
 * wider computation when some sample lies outside the diagram), potentials converted from the
 * file's reference scale at the sample's own pH. Data only; the report writes it.
 */
import type { Computed } from '../pipeline.js';
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
  verdict: Verdict;
}

export interface EnvelopeResult {
  kind: 'box' | 'path';
  label: string;
  scale: string;
  samples: EnvelopeSample[];
  /** The distinct verdicts found at the samples, in order of first appearance. */
  verdicts: Verdict[];
}

export function probeEnvelopes(c: Computed, warnings: string[]): EnvelopeResult[] {
  const op = c.spec.operating;
  const T = c.spec.temperature;
  const toShe = (pH: number, E: number) => {
    if (op.reference === undefined || op.reference === 'she') return { Eshe: E, scale: 'SHE' };
    const r = referenceOffset(op.reference, T, pH);
    warnings.push(...r.warnings.filter((w) => !warnings.includes(w)));
    return { Eshe: E + r.offset, scale: r.label };
  };
  // Step 1: the sample points of every box and path.
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
  if (!raw.length) return [];
  const conv = raw.map((r) => ({ ...r, pts: r.pts.map((p) => ({ ...p, ...toShe(p.pH, p.E) })) }));
  // Step 2: one computation holding every sample.
  const at = computedHolding(c, conv.flatMap((r) => r.pts.map((p) => ({ pH: p.pH, E: p.Eshe }))));
  // Step 3: the answer at each sample.
  return conv.map((r) => {
    const samples = r.pts.map((p) => {
      const res = probe(at, p.pH, p.Eshe);
      return { where: p.where, pH: p.pH, Egiven: p.E, Eshe: p.Eshe, predominant: res.predominant, verdict: res.verdict };
    });
    return { kind: r.kind, label: r.label, scale: r.pts[0]?.scale ?? 'SHE', samples, verdicts: [...new Set(samples.map((s) => s.verdict))] };
  });
}

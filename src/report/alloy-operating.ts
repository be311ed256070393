/**
 * The alloy report's operating points, envelopes (boxes) and paths, each answered by the alloy
 * point solver (assemblageAt: the exact LP, as `probe` answers), potentials converted from the
 * file's reference scale at each point's own pH and the file's temperature (analysis/envelopes.ts
 * envelopeSamples). Data for the writers (alloy-text.ts, alloy-pdf.ts); draws nothing.
 */
import { answerEnvelopes, type EnvelopeResult, envelopeSamples } from '../analysis/envelopes.js';
import { labelForPeople } from '../chem/present.js';
import { assemblageAt } from '../solve/alloy/assemblage.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { Operating } from '../system/operating.js';

export interface AlloyOperatingPoint {
  label: string;
  pH: number;
  /** Potential as given (file's reference scale, `scale`) and on the SHE scale, V. */
  Egiven: number;
  scale: string;
  Eshe: number;
  /** The assemblage for people ("Cu + ZnO"). */
  assemblage: string;
  verdict: string;
}

export interface AlloyOperating {
  points: AlloyOperatingPoint[];
  envelopes: EnvelopeResult[];
}

/** The assemblage and verdict at one point; partly corroding names the dissolving elements. */
function answer(input: AlloyInput, pH: number, E: number): { predominant: string; verdict: string } {
  const a = assemblageAt(input, pH, E);
  const verdict = a.verdict === 'partly-corroding' ? `partly corroding: ${a.dissolving.join(', ')} dissolving` : a.verdict;
  return { predominant: labelForPeople(a.label), verdict };
}

/** Every point, box and path of `op` answered at `celsius` (°C); electrode warnings appended once. */
export function alloyOperating(op: Operating, celsius: number, input: AlloyInput, warnings: string[]): AlloyOperating {
  // Step 1: the points, converted as one-point paths are.
  const asPaths = envelopeSamples({ ...op, boxes: [], paths: op.points.map((p) => ({ label: p.label, points: [[p.pH, p.E]] })) }, celsius, warnings);
  const points = asPaths.map((s) => {
    const p = s.pts[0]!;
    const a = answer(input, p.pH, p.Eshe);
    return { label: s.label, pH: p.pH, Egiven: p.E, scale: p.scale, Eshe: p.Eshe, assemblage: a.predominant, verdict: a.verdict };
  });
  // Step 2: boxes at their corners and centre, paths at their points.
  const envelopes = answerEnvelopes(envelopeSamples({ ...op, points: [] }, celsius, warnings), (pH, E) => answer(input, pH, E));
  return { points, envelopes };
}

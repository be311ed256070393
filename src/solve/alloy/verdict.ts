/**
 * The verdict of an assemblage (issue 18), from the phases present and each one's share of every
 * main element. The trade's terms (immunity, passivation, corrosion) applied to a bulk alloy:
 *
 *  - immune: every phase is a main element as metal (no compound, nothing dissolved);
 *  - corroding: every phase is a dissolved species (the whole alloy goes into solution);
 *  - passive: nothing dissolves and at least one phase is a compound (oxide, hydroxide, sulfide…);
 *  - partly corroding: some of the alloy dissolves while the rest stays solid — `dissolving` names
 *    the elements with a share in a dissolved species (e.g. Fe goes as Fe²⁺ while Cr stays as Cr2O3).
 *
 * This computes a classification only; no drawing.
 */
export type AlloyVerdict = 'immune' | 'passive' | 'corroding' | 'partly-corroding';

export interface VerdictPhase {
  formula: string;
  phase: 's' | 'l' | 'g' | 'aq';
  elements: Record<string, number>;
  charge: number;
  /** Share of each main element held by this phase (0–1). */
  share: Record<string, number>;
}

/** True for a main element as metal: one element, no charge, solid or liquid. */
export function isMetal(p: Pick<VerdictPhase, 'phase' | 'elements' | 'charge'>): boolean {
  return p.charge === 0 && (p.phase === 's' || p.phase === 'l') && Object.keys(p.elements).length === 1;
}

/** The verdict and the elements that dissolve (in the composition's order). */
export function assemblageVerdict(phases: readonly VerdictPhase[], elements: readonly string[]): { verdict: AlloyVerdict; dissolving: string[] } {
  const dissolving = elements.filter((e) => phases.some((p) => p.phase === 'aq' && (p.share[e] ?? 0) > 0));
  if (phases.every(isMetal)) return { verdict: 'immune', dissolving };
  if (phases.every((p) => p.phase === 'aq')) return { verdict: 'corroding', dissolving };
  if (dissolving.length === 0) return { verdict: 'passive', dissolving };
  return { verdict: 'partly-corroding', dissolving };
}

/**
 * Corrosion verdicts: immunity (the element itself), passivation (solid compounds), corrosion
 * (dissolved species, at the stated threshold activity). A user may reclassify a species, e.g. a
 * porous, non-protective solid as corrosion.
 */
import { formulaMatches } from '../chem/match.js';
import type { RegionClass } from '../model.js';

export type Verdict = 'immunity' | 'passivation' | 'corrosion';

export const VERDICTS: readonly Verdict[] = ['immunity', 'passivation', 'corrosion'];

export function verdictOf(cls: RegionClass, formula: string, overrides: Record<string, Verdict> = {}): Verdict {
  // A `classes` key may spell the formula in any notation (Fe+2, Fe^2+, Fe²⁺): compare parsed formulas.
  const o = overrides[formula] ?? Object.entries(overrides).find(([k]) => formulaMatches(k, formula))?.[1];
  if (o) return o;
  if (cls === 'element') return 'immunity';
  if (cls === 'solid') return 'passivation';
  return 'corrosion'; // dissolved, or a volatile species of the element
}

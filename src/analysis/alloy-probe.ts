/**
 * `probe` for an alloy (issue 18): the assemblage at an operating point, which elements dissolve,
 * and the margins to the neighbouring assemblages.
 *
 * Steps:
 *  1. the assemblage at (pH, E) by the exact LP (assemblageAt): phases and dissolved species with
 *     their amounts (mol per mol of alloy atoms; Σ amount·atoms of each element = its mole fraction),
 *     the verdict and the dissolving elements;
 *  2. margins: along each of the four directions (E up, E down, pH up, pH down) the LP is stepped
 *     (0.01 V or 0.05 pH) until its assemblage changes or the domain edge is reached, then the change
 *     is bracketed by bisection to 1e-4 V (0.1 mV) or 1e-4 pH; the margin is the distance and the
 *     assemblage across. An assemblage thinner than one step between the point and the change can be
 *     stepped over (the one beyond is reported; the distance stays an upper bound).
 * The grand potential gap to the best other assemblage is not reported: it has no unit a reader can
 * act on; the distances do.
 */
import { assemblageAt } from '../solve/alloy/assemblage.js';
import { isDissolved, memberText } from '../solve/alloy/member.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { AlloyVerdict } from '../solve/alloy/verdict.js';
import type { GivenPotential } from './points.js';

export interface AlloyMargin {
  direction: 'E+' | 'E-' | 'pH+' | 'pH-';
  /** Distance to the change (V for E, pH units for pH); null when none within the domain. */
  distance: number | null;
  /** The assemblage across the change. */
  to: string | null;
}

export interface AlloyProbe {
  pH: number;
  E: number;
  label: string;
  /** Each member: `species` the formula, `name` as in the label (a neutral dissolved one tagged
   *  "(aq)"), `dissolved` true for a dissolved species (at its threshold activity). */
  assemblage: { species: string; name: string; phase: string; dissolved: boolean; amount: number; share: Record<string, number> }[];
  verdict: AlloyVerdict;
  dissolving: string[];
  ties: string[];
  margins: AlloyMargin[];
  composition: Record<string, number>;
  /** The potential as given against a reference electrode (E above is on the SHE scale). */
  reference?: GivenPotential;
}

const key = (input: AlloyInput, pH: number, E: number) => assemblageAt(input, pH, E).label;

/** Step 2 for one direction. */
function margin(input: AlloyInput, pH: number, E: number, dir: AlloyMargin['direction']): AlloyMargin {
  const onE = dir.startsWith('E');
  const sign = dir.endsWith('+') ? 1 : -1;
  const range = onE ? input.E : input.pH;
  const x0 = onE ? E : pH;
  const at = (x: number) => (onE ? key(input, pH, x) : key(input, x, E));
  const here = at(x0);
  const step = onE ? 0.01 : 0.05;
  let lo = x0;
  for (;;) {
    let hi = lo + sign * step;
    const edge = sign > 0 ? range[1] : range[0];
    if (sign * (hi - edge) > 0) hi = edge;
    if (hi === lo) return { direction: dir, distance: null, to: null };
    if (at(hi) !== here) {
      let a = lo;
      let b = hi;
      while (Math.abs(b - a) > 1e-4) {
        const m = (a + b) / 2;
        if (at(m) === here) a = m;
        else b = m;
      }
      return { direction: dir, distance: Math.round(Math.abs(b - x0) * 1e4) / 1e4, to: at(b) };
    }
    lo = hi;
  }
}

/** The answer at (pH, E vs SHE); `reference` (the potential as given) is carried into the answer. */
export function alloyProbe(input: AlloyInput, pH: number, E: number, reference?: GivenPotential): AlloyProbe {
  const a = assemblageAt(input, pH, E);
  const sp = (p: { index: number }) => input.species[p.index];
  return {
    pH,
    E,
    label: a.label,
    assemblage: a.phases.map((p) => ({ species: p.formula, name: memberText(sp(p)), phase: p.phase, dissolved: isDissolved(sp(p)), amount: p.amount, share: p.share })),
    verdict: a.verdict,
    dissolving: a.dissolving,
    ties: a.ties,
    margins: (['E+', 'E-', 'pH+', 'pH-'] as const).map((d) => margin(input, pH, E, d)),
    composition: { ...input.composition },
    ...(reference ? { reference } : {}),
  };
}

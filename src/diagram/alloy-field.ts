/**
 * The alloy kind as a TraceField (src/solve/trace/field.ts), so that the generic grid → contour →
 * refine machinery draws assemblage regions (issue 18).
 *
 * For a basis of the LP (assemblage L with amounts n_L = B⁻¹b, which depend on the composition only,
 * never on pH or E) the grand potential per mol of alloy atoms is G_L(pH, E) = Σ_k n_{L,k} ψ'_k(pH, E);
 * the LP optimum at a point is the lowest G_L over the feasible bases. So the score of label L is
 * −G_L: the argmax is the optimal assemblage, and the margin between two labels is a difference of
 * ψ' planes — exactly linear where the ligands' predominant species do not change, so every
 * boundary comes out straight and regula falsi (refine.ts) lands on it in one or two steps.
 *
 * Steps: 1. the assemblages are discovered by the LP point solver (supportAt) at every grid node;
 * 2. the field solves ψ' at a point (psi.ts) and scores each discovered label.
 * A label that wins only between grid nodes is not discovered; computeAlloy checks every boundary
 * against the LP and warns where a lower assemblage exists (raise the grid).
 */
import { supportAt } from '../solve/alloy/assemblage.js';
import { speciesPotentialsAt } from '../solve/alloy/psi.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { TraceField } from '../solve/trace/field.js';
import { gridX, gridY } from '../solve/trace/grid.js';
import type { AssemblageAmounts } from './alloy-reaction.js';

export interface AlloyLabel extends AssemblageAmounts {
  key: string;
}

/** Step 1: every assemblage optimal at a node of the n × n grid, in order of first appearance. */
export function discoverAssemblages(input: AlloyInput, pH: [number, number], E: [number, number], n: number): AlloyLabel[] {
  const seen = new Map<string, AlloyLabel>();
  const g = { nx: n, ny: n, x: pH, y: E };
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const s = supportAt(input, gridX(g, i), gridY(g, j));
      const key = s.indices.join(',');
      if (!seen.has(key)) seen.set(key, { key, indices: s.indices, amounts: s.amounts });
    }
  }
  return [...seen.values()];
}

/** Step 2: the field over the discovered labels; its state is the ψ' vector of a point. */
export function alloyField(input: AlloyInput, labels: readonly AlloyLabel[]): TraceField<number[]> {
  return {
    labels: labels.length,
    solve: (x, y) => speciesPotentialsAt(input, x, y).psi,
    scores(psi, out) {
      for (let l = 0; l < labels.length; l++) {
        const { indices, amounts } = labels[l];
        let G = 0;
        for (let k = 0; k < indices.length; k++) G += amounts[k] * psi[indices[k]];
        out[l] = -G;
      }
      return true;
    },
  };
}

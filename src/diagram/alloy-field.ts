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
 * Steps: 1. the assemblages are discovered by the LP point solver (supportAt) at every grid node and
 * at the midpoint of every grid edge whose two nodes differ;
 * 2. the field solves ψ' at a point (psi.ts) and scores each discovered label.
 * A label that wins only between grid nodes is not discovered; computeAlloy checks every boundary
 * against the LP and warns where a lower assemblage exists (raise the grid).
 */
import { supportAt, type WarmBasis, warmBasis, warmStillOptimal } from '../solve/alloy/assemblage.js';
import { speciesPotentialsAt, speciesPsiInto } from '../solve/alloy/psi.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { TraceField } from '../solve/trace/field.js';
import { type GridSample, gridX, gridY } from '../solve/trace/grid.js';
import type { AssemblageAmounts } from './alloy-reaction.js';

export interface AlloyLabel extends AssemblageAmounts {
  key: string;
}

/** Step 1: every assemblage optimal at a node of the n × n grid (in order of first appearance), the
 *  ψ' vector of every node (the field's state there, kept for the grid sample) and the index of
 *  each node's assemblage (`at`, node i + j·n). */
export function discoverAssemblages(input: AlloyInput, pH: [number, number], E: [number, number], n: number): { labels: AlloyLabel[]; psi: number[][]; at: Int32Array } {
  const g = { nx: n, ny: n, x: pH, y: E };
  const psi: number[][] = new Array(n * n);
  const at = new Int32Array(n * n);
  const index = new Map<string, number>();
  const order: AlloyLabel[] = [];
  const add = (s: { indices: number[]; amounts: number[] }): number => {
    const key = s.indices.join(',');
    let k = index.get(key);
    if (k === undefined) {
      k = index.size;
      index.set(key, k);
      order.push({ key, indices: s.indices, amounts: s.amounts });
    }
    return k;
  };
  // Warm start: a node whose left (else lower) neighbour's full basis is still optimal there by a
  // clear margin has that neighbour's assemblage (warmStillOptimal); only the others run the LP.
  const warm: (WarmBasis | null)[] = [];
  const stillOptimal = (l: number, p: number[]): boolean => {
    if (l < 0) return false;
    if (warm[l] === undefined) warm[l] = warmBasis(input, order[l].indices);
    const w = warm[l];
    return w !== null && warmStillOptimal(input, w, p);
  };
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const k = i + j * n;
      const x = gridX(g, i);
      const y = gridY(g, j);
      const p = new Array<number>(input.species.length);
      speciesPsiInto(input, x, y, p);
      psi[k] = p;
      const left = i > 0 ? at[k - 1] : -1;
      const below = j > 0 ? at[k - n] : -1;
      at[k] = stillOptimal(left, p) ? left : below !== left && stillOptimal(below, p) ? below : add(supportAt(input, x, y));
    }
  }
  // Between two neighbouring nodes of different assemblages, the LP at the midpoint too: an
  // assemblage in a sliver thinner than a cell shows there (one solve per boundary edge, skipped
  // when one end's assemblage is still optimal there: it is known already).
  const mid = new Array<number>(input.species.length);
  const midpoint = (la: number, lb: number, x: number, y: number) => {
    speciesPsiInto(input, x, y, mid);
    if (!stillOptimal(la, mid) && !stillOptimal(lb, mid)) add(supportAt(input, x, y));
  };
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      const k = i + j * n;
      if (i + 1 < n && at[k] !== at[k + 1]) midpoint(at[k], at[k + 1], (gridX(g, i) + gridX(g, i + 1)) / 2, gridY(g, j));
      if (j + 1 < n && at[k] !== at[k + n]) midpoint(at[k], at[k + n], gridX(g, i), (gridY(g, j) + gridY(g, j + 1)) / 2);
    }
  }
  return { labels: order, psi, at };
}

/** The grid sample of the field from the nodes' ψ' vectors (as sampleGrid would compute it: the
 *  same sums in the same order, written straight into the score array; labels flattened into typed
 *  arrays so the 90 000-node loop allocates nothing). */
export function alloyGrid(labels: readonly AlloyLabel[], psi: number[][], pH: [number, number], E: [number, number], n: number): GridSample<number[]> {
  const L = labels.length;
  const label = new Int32Array(n * n);
  const scores = new Float64Array(n * n * L);
  const start = new Int32Array(L + 1);
  labels.forEach((l, k) => (start[k + 1] = start[k] + l.indices.length));
  const idx = new Int32Array(start[L]);
  const amt = new Float64Array(start[L]);
  labels.forEach((l, k) => {
    idx.set(l.indices, start[k]);
    amt.set(l.amounts, start[k]);
  });
  for (let k = 0; k < n * n; k++) {
    const p = psi[k];
    const base = k * L;
    let best = -1;
    let bv = -Infinity;
    for (let l = 0; l < L; l++) {
      let G = 0;
      for (let q = start[l]; q < start[l + 1]; q++) G += amt[q] * p[idx[q]];
      const v = -G;
      scores[base + l] = v;
      // argmax (field.ts): first strictly larger score.
      if (v > bv) {
        bv = v;
        best = l;
      }
    }
    label[k] = best;
  }
  return { nx: n, ny: n, x: pH, y: E, label, scores, value: new Float64Array(n * n).fill(NaN), states: psi, failed: 0 };
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

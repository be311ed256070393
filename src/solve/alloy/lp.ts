/**
 * A small dense linear programme in standard form, solved exactly by the revised simplex method:
 *
 *   minimise  c·n   subject to   A n = b,  n ≥ 0          (A: m × N, m small, b > 0)
 *
 * Used for the assemblage of an alloy (DEVELOPERS.md, "Alloys"): rows are the main elements, columns the species,
 * c the species' grand potentials. m is 1–6, N up to a few hundred, so the basis matrix is
 * factorised afresh (LU with partial pivoting, flat typed arrays) at every step — no drift.
 *
 * Algorithm:
 *  1. start from a feasible basis given by the caller (for an alloy: one single-element species per
 *     element, always feasible since b > 0);
 *  2. duals y from Bᵀy = c_B; reduced costs d_j = c_j − y·a_j;
 *  3. Bland's rule: the entering column is the lowest index with d_j < −ε (ε = `tol`, default 1e-11,
 *     just above the rounding noise of d_j for costs of ~10³); none → optimal;
 *  4. direction w from B w = a_q; ratio test min x_i / w_i over w_i > 1e-12; ties broken by the lowest
 *     column index leaving (Bland), which prevents cycling on degenerate vertices;
 *  5. at the optimum, every non-basic column with |d_j| ≤ `tieTol` (default 1e-9, ≫ ε) is an
 *     alternative optimum: it is reported in `ties` (the assemblage is not unique there), never
 *     silently dropped. Keeping ε ≪ tieTol matters: with one tolerance for both, the optimum reached
 *     within the band |d| ≤ ε depends on the start, and a point just beside a boundary could carry the
 *     other side's basis with its tied column just outside the band — a tie left unreported.
 *
 * Reference: Dantzig G.B. (1963) Linear Programming and Extensions, Princeton; Bland R.G. (1977)
 * New finite pivoting rules for the simplex method, Math. Oper. Res. 2, 103–107.
 * Worked example (tested): A = [[1,0,1],[0,1,2]], b = [1,2], c = [0,0,−1] → n = [0,0,1], c·n = −1.
 */
import { luFactor, luSolve, luSolveT, type PivotTest } from '../linalg.js';

/** A basis pivot at or below 1e-12·max(1, its column's largest entry) makes the basis singular. */
const LP_PIVOT: PivotTest = { tol: 1e-12 };

export interface LpProblem {
  /** Constraint rows, m × N (row-major: A[i][j]). */
  A: readonly (readonly number[])[];
  /** Right-hand side, length m, every entry > 0. */
  b: readonly number[];
  /** Costs, length N. */
  c: readonly number[];
  /** A feasible starting basis: m column indices with B⁻¹b ≥ 0. */
  basis: readonly number[];
  /** Pivot tolerance on reduced costs, in the units of c (default 1e-11). */
  tol?: number;
  /** Tie tolerance: non-basic columns with |reduced cost| ≤ tieTol are reported (default 1e-9). */
  tieTol?: number;
}

export interface LpSolution {
  /** Basic column indices at the optimum, in row order of the factorisation. */
  basis: number[];
  /** Values of the basic columns (same order); may be 0 on a degenerate vertex. */
  values: number[];
  /** c·n at the optimum. */
  objective: number;
  /** Non-basic columns with |reduced cost| ≤ tieTol: alternative optima (sorted). */
  ties: number[];
  /** Reduced costs of all columns at the optimum (0 for basic ones). */
  reduced: number[];
  /** Simplex pivots taken. */
  pivots: number;
}

/** The LP is malformed or its starting basis is singular or infeasible. */
export class LpError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'LpError';
  }
}

/** Minimises c·n subject to A n = b, n ≥ 0 (see module comment). Throws LpError on bad input. */
export function solveLp(lp: LpProblem): LpSolution {
  const m = lp.b.length;
  const N = lp.c.length;
  const tol = lp.tol ?? 1e-11;
  const tieTol = Math.max(lp.tieTol ?? 1e-9, tol);
  const { A, c } = lp;
  if (A.length !== m || A.some((row) => row.length !== N)) throw new LpError('A must be m × N');
  if (lp.basis.length !== m || new Set(lp.basis).size !== m) throw new LpError('the starting basis needs m distinct columns');
  const basis = [...lp.basis];
  const lu = new Float64Array(m * m);
  const perm = new Int32Array(m);
  const x = new Float64Array(m);
  const y = new Float64Array(m);
  const w = new Float64Array(m);
  const tmp = new Float64Array(m);
  const cB = new Float64Array(m);
  const aq = new Float64Array(m);
  const isBasic = new Uint8Array(N);
  const reduced = new Array<number>(N);
  let pivots = 0;
  const maxPivots = 50 * (N + m);
  for (;;) {
    // Step 2: factorise B, basic values x = B⁻¹b, duals Bᵀy = c_B, reduced costs.
    for (let i = 0; i < m; i++) for (let k = 0; k < m; k++) lu[i * m + k] = A[i][basis[k]];
    if (!luFactor(lu, m, perm, LP_PIVOT)) throw new LpError('singular basis');
    luSolve(lu, m, perm, lp.b, x);
    if (pivots === 0) for (let i = 0; i < m; i++) if (x[i] < -1e-12) throw new LpError('the starting basis is infeasible');
    for (let k = 0; k < m; k++) cB[k] = c[basis[k]];
    luSolveT(lu, m, perm, cB, y, tmp);
    isBasic.fill(0);
    for (const j of basis) isBasic[j] = 1;
    let q = -1;
    for (let j = 0; j < N; j++) {
      let d = 0;
      if (!isBasic[j]) {
        d = c[j];
        for (let i = 0; i < m; i++) d -= y[i] * A[i][j];
      }
      reduced[j] = d;
      // Step 3: Bland's entering rule (lowest index).
      if (q < 0 && d < -tol) q = j;
    }
    if (q < 0) {
      const ties: number[] = [];
      for (let j = 0; j < N; j++) if (!isBasic[j] && Math.abs(reduced[j]) <= tieTol) ties.push(j);
      const values = Array.from(x, (v) => Math.max(0, v));
      const objective = basis.reduce((s, j, k) => s + c[j] * values[k], 0);
      return { basis, values, objective, ties, reduced, pivots };
    }
    // Step 4: direction B w = a_q; ratio test, lowest leaving column index among ties.
    for (let i = 0; i < m; i++) aq[i] = A[i][q];
    luSolve(lu, m, perm, aq, w);
    let leave = -1;
    let best = Infinity;
    for (let i = 0; i < m; i++) {
      if (w[i] <= 1e-12) continue;
      const t = Math.max(0, x[i]) / w[i];
      if (leave < 0 || t < best - 1e-15 || (Math.abs(t - best) <= 1e-15 && basis[i] < basis[leave])) {
        best = t;
        leave = i;
      }
    }
    if (leave < 0) throw new LpError('unbounded (a column with no positive entry in the direction)');
    basis[leave] = q;
    if (++pivots > maxPivots) throw new LpError('no convergence (pivot limit)');
  }
}

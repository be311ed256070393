/**
 * A small dense linear programme in standard form, solved exactly by the revised simplex method:
 *
 *   minimise  c·n   subject to   A n = b,  n ≥ 0          (A: m × N, m small, b > 0)
 *
 * Used for the assemblage of an alloy (DESIGN §8): rows are the main elements, columns the species,
 * c the species' grand potentials. m is 1–6, N up to a few hundred, so the basis matrix is
 * factorised afresh (Gaussian elimination with partial pivoting) at every step — no drift.
 *
 * Algorithm:
 *  1. start from a feasible basis given by the caller (for an alloy: one single-element species per
 *     element, always feasible since b > 0);
 *  2. duals y from Bᵀy = c_B; reduced costs d_j = c_j − y·a_j;
 *  3. Bland's rule: the entering column is the lowest index with d_j < −ε (ε = `tol`); none → optimal;
 *  4. direction w from B w = a_q; ratio test min x_i / w_i over w_i > ε; ties broken by the lowest
 *     column index leaving (Bland), which prevents cycling on degenerate vertices;
 *  5. at the optimum, every non-basic column with |d_j| ≤ `tol` is an alternative optimum: it is
 *     reported in `ties` (the assemblage is not unique there), never silently dropped.
 *
 * Reference: Dantzig G.B. (1963) Linear Programming and Extensions, Princeton; Bland R.G. (1977)
 * New finite pivoting rules for the simplex method, Math. Oper. Res. 2, 103–107.
 * Worked example (tested): A = [[1,0,1],[0,1,2]], b = [1,2], c = [0,0,−1] → n = [0,0,1], c·n = −1.
 */

export interface LpProblem {
  /** Constraint rows, m × N (row-major: A[i][j]). */
  A: readonly (readonly number[])[];
  /** Right-hand side, length m, every entry > 0. */
  b: readonly number[];
  /** Costs, length N. */
  c: readonly number[];
  /** A feasible starting basis: m column indices with B⁻¹b ≥ 0. */
  basis: readonly number[];
  /** Tolerance on reduced costs and pivots, in the units of c (default 1e-9). */
  tol?: number;
}

export interface LpSolution {
  /** Basic column indices at the optimum, in row order of the factorisation. */
  basis: number[];
  /** Values of the basic columns (same order); may be 0 on a degenerate vertex. */
  values: number[];
  /** c·n at the optimum. */
  objective: number;
  /** Non-basic columns with |reduced cost| ≤ tol: alternative optima (sorted). */
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

/**
 * Solves M x = r (M square, m × m) by Gaussian elimination with partial pivoting; null if singular
 * (a pivot below 1e-12 of the column scale).
 */
export function solveSquare(M: readonly (readonly number[])[], r: readonly number[]): number[] | null {
  const m = r.length;
  const a = M.map((row, i) => [...row, r[i]]);
  for (let k = 0; k < m; k++) {
    let p = k;
    for (let i = k + 1; i < m; i++) if (Math.abs(a[i][k]) > Math.abs(a[p][k])) p = i;
    const scale = Math.max(...a.map((row) => Math.abs(row[k])), 1);
    if (Math.abs(a[p][k]) <= 1e-12 * scale) return null;
    if (p !== k) [a[p], a[k]] = [a[k], a[p]];
    for (let i = k + 1; i < m; i++) {
      const f = a[i][k] / a[k][k];
      if (f === 0) continue;
      for (let j = k; j <= m; j++) a[i][j] -= f * a[k][j];
    }
  }
  const x = new Array<number>(m).fill(0);
  for (let i = m - 1; i >= 0; i--) {
    let s = a[i][m];
    for (let j = i + 1; j < m; j++) s -= a[i][j] * x[j];
    x[i] = s / a[i][i];
  }
  return x;
}

const column = (A: LpProblem['A'], j: number): number[] => A.map((row) => row[j]);

/** Minimises c·n subject to A n = b, n ≥ 0 (see module comment). Throws LpError on bad input. */
export function solveLp(lp: LpProblem): LpSolution {
  const m = lp.b.length;
  const N = lp.c.length;
  const tol = lp.tol ?? 1e-9;
  if (lp.A.length !== m || lp.A.some((row) => row.length !== N)) throw new LpError('A must be m × N');
  if (lp.basis.length !== m || new Set(lp.basis).size !== m) throw new LpError('the starting basis needs m distinct columns');
  const basis = [...lp.basis];
  let pivots = 0;
  const maxPivots = 50 * (N + m);
  for (;;) {
    // Step 2: basic values, duals and reduced costs.
    const B = lp.A.map((row) => basis.map((j) => row[j]));
    const x = solveSquare(B, lp.b);
    if (!x) throw new LpError('singular basis');
    if (pivots === 0 && x.some((v) => v < -1e-12)) throw new LpError('the starting basis is infeasible');
    const Bt = basis.map((_, k) => B.map((row) => row[k]));
    const y = solveSquare(Bt, basis.map((j) => lp.c[j]));
    if (!y) throw new LpError('singular basis');
    const reduced = lp.c.map((cj, j) => (basis.includes(j) ? 0 : cj - lp.A.reduce((s, row, i) => s + y[i] * row[j], 0)));
    // Step 3: Bland's entering rule.
    const q = reduced.findIndex((d) => d < -tol);
    if (q < 0) {
      const ties = reduced.map((d, j) => (!basis.includes(j) && Math.abs(d) <= tol ? j : -1)).filter((j) => j >= 0);
      const values = x.map((v) => Math.max(0, v));
      const objective = basis.reduce((s, j, k) => s + lp.c[j] * values[k], 0);
      return { basis, values, objective, ties, reduced, pivots };
    }
    // Step 4: ratio test, lowest leaving column index among ties.
    const w = solveSquare(B, column(lp.A, q));
    if (!w) throw new LpError('singular basis');
    let leave = -1;
    let best = Infinity;
    for (let i = 0; i < m; i++) {
      if (w[i] <= 1e-12) continue;
      const t = Math.max(0, x[i]) / w[i];
      if (t < best - 1e-15 || (Math.abs(t - best) <= 1e-15 && basis[i] < basis[leave])) {
        best = t;
        leave = i;
      }
    }
    if (leave < 0) throw new LpError('unbounded (a column with no positive entry in the direction)');
    basis[leave] = q;
    if (++pivots > maxPivots) throw new LpError('no convergence (pivot limit)');
  }
}

/**
 * Dense square linear systems, row-major in flat Float64Arrays: LU factorisation with partial
 * pivoting and the solves that use it (Golub & Van Loan, Matrix Computations, §3.2 and §3.4).
 * One kernel for the whole tree: the speciation Newton step (solveDense, one right-hand side) and
 * the alloy simplex (luFactor once per basis, then luSolve and luSolveT for several right-hand sides).
 *
 * Algorithm (luFactor): for each column k, (1) pick the row with the largest |a_ik|, i ≥ k (the
 * first one on ties); (2) refuse the matrix when that pivot is at or below the singularity
 * threshold; (3) swap it into row k (the stored multipliers move with it, `perm` records the swap);
 * (4) store the multipliers l_ik = a_ik / a_kk below the diagonal and update the trailing block.
 * Afterwards P·A = L·U with L unit lower triangular (below the diagonal of `a`) and U on and above it.
 */

/**
 * How small a pivot may be. `scale` given: |pivot| ≤ tol·scale is singular (a scale fixed for the
 * whole matrix, e.g. its largest |entry|). `scale` left out: |pivot| ≤ tol·max(1, largest |entry|
 * of the pivot column at or below the diagonal).
 */
export interface PivotTest {
  tol: number;
  scale?: number;
}

/** In-place LU factorisation with partial pivoting of the m × m matrix `a`; false if singular. */
export function luFactor(a: Float64Array, m: number, perm: Int32Array, pivot: PivotTest): boolean {
  for (let i = 0; i < m; i++) perm[i] = i;
  for (let k = 0; k < m; k++) {
    // Step 1: pivot row (and the column's largest entry for the relative test).
    let p = k;
    let colMax = 1;
    for (let i = k; i < m; i++) {
      const v = Math.abs(a[i * m + k]);
      if (v > Math.abs(a[p * m + k])) p = i;
      if (v > colMax) colMax = v;
    }
    // Step 2: singularity test.
    if (Math.abs(a[p * m + k]) <= pivot.tol * (pivot.scale ?? colMax)) return false;
    // Step 3: row swap.
    if (p !== k) {
      for (let j = 0; j < m; j++) {
        const t = a[p * m + j];
        a[p * m + j] = a[k * m + j];
        a[k * m + j] = t;
      }
      const t = perm[p];
      perm[p] = perm[k];
      perm[k] = t;
    }
    // Step 4: multipliers and trailing update.
    const piv = a[k * m + k];
    for (let i = k + 1; i < m; i++) {
      const f = (a[i * m + k] /= piv);
      if (f !== 0) for (let j = k + 1; j < m; j++) a[i * m + j] -= f * a[k * m + j];
    }
  }
  return true;
}

/** Solves A x = r with the factors of A (P·A = L·U), into `out` (`out` must not be `r`). */
export function luSolve(a: Float64Array, m: number, perm: Int32Array, r: ArrayLike<number>, out: Float64Array): void {
  for (let i = 0; i < m; i++) {
    let s = r[perm[i]];
    for (let j = 0; j < i; j++) s -= a[i * m + j] * out[j];
    out[i] = s;
  }
  for (let i = m - 1; i >= 0; i--) {
    let s = out[i];
    for (let j = i + 1; j < m; j++) s -= a[i * m + j] * out[j];
    out[i] = s / a[i * m + i];
  }
}

/** Solves Aᵀ y = r with the factors of A (P·A = L·U ⇒ Aᵀ = Uᵀ·Lᵀ·P), into `out`; `tmp` is scratch of length m. */
export function luSolveT(a: Float64Array, m: number, perm: Int32Array, r: ArrayLike<number>, out: Float64Array, tmp: Float64Array): void {
  for (let i = 0; i < m; i++) {
    let s = r[i];
    for (let j = 0; j < i; j++) s -= a[j * m + i] * tmp[j];
    tmp[i] = s / a[i * m + i];
  }
  for (let i = m - 1; i >= 0; i--) {
    let s = tmp[i];
    for (let j = i + 1; j < m; j++) s -= a[j * m + i] * tmp[j];
    tmp[i] = s;
  }
  for (let i = 0; i < m; i++) out[perm[i]] = tmp[i];
}

/** Scratch for solveDense (allocated per call when not given): `perm` and `x` of length ≥ n. */
export interface DenseScratch {
  perm: Int32Array;
  x: Float64Array;
}

/**
 * Dense linear solve: M x = b, `M` n×n row-major (overwritten by its LU factors), the solution
 * overwrites `b`. Returns false when a pivot is at or below `tiny`·(largest |entry| of M)
 * (singular or nearly), or M holds no finite non-zero entry.
 * Worked example: [[2, 1], [1, 3]]·x = [3, 5] → x = [0.8, 1.4].
 */
export function solveDense(M: Float64Array, b: Float64Array, n: number, tiny = 1e-13, scratch?: DenseScratch): boolean {
  let scale = 0;
  for (let k = 0; k < n * n; k++) scale = Math.max(scale, Math.abs(M[k]));
  if (!(scale > 0) || !Number.isFinite(scale)) return false;
  const perm = scratch?.perm ?? new Int32Array(n);
  const x = scratch?.x ?? new Float64Array(n);
  if (!luFactor(M, n, perm, { tol: tiny, scale })) return false;
  luSolve(M, n, perm, b, x);
  for (let i = 0; i < n; i++) b[i] = x[i];
  return true;
}

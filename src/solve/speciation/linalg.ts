/**
 * Dense linear solve in place: Gaussian elimination with partial pivoting (Golub & Van Loan,
 * Matrix Computations, §3.4). `M` is n×n row-major, `b` the right-hand side; the solution
 * overwrites `b`. Returns false when a pivot is below `tiny`·(largest |entry|) (singular or nearly).
 * Worked example: [[2, 1], [1, 3]]·x = [3, 5] → x = [0.8, 1.4].
 */
export function solveDense(M: Float64Array, b: Float64Array, n: number, tiny = 1e-13): boolean {
  let scale = 0;
  for (let k = 0; k < n * n; k++) scale = Math.max(scale, Math.abs(M[k]));
  if (!(scale > 0) || !Number.isFinite(scale)) return false;
  for (let c = 0; c < n; c++) {
    // Step 1: pivot row.
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r * n + c]) > Math.abs(M[p * n + c])) p = r;
    if (Math.abs(M[p * n + c]) <= tiny * scale) return false;
    if (p !== c) {
      for (let k = 0; k < n; k++) {
        const t = M[c * n + k];
        M[c * n + k] = M[p * n + k];
        M[p * n + k] = t;
      }
      const t = b[c];
      b[c] = b[p];
      b[p] = t;
    }
    // Step 2: eliminate below.
    const d = M[c * n + c];
    for (let r = c + 1; r < n; r++) {
      const f = M[r * n + c] / d;
      if (f === 0) continue;
      for (let k = c; k < n; k++) M[r * n + k] -= f * M[c * n + k];
      b[r] -= f * b[c];
    }
  }
  // Step 3: back substitution.
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r];
    for (let k = r + 1; k < n; k++) s -= M[r * n + k] * b[k];
    b[r] = s / M[r * n + r];
  }
  return true;
}

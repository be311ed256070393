/**
 * The phase-assemblage loop (active set) at fixed activity coefficients: Newton for the solids
 * present (newton.ts); drop the solid with the most negative amount; add the most supersaturated
 * absent solid (saturation index per unit of its components); a solid whose components are already
 * fixed by the solids present replaces one of them (the phase rule at fixed T, P, pH and E: never
 * more independent solids than components). Cycles and non-settling are reported, not answered.
 */
import { newtonSolve, type NewtonOptions, type NewtonWork } from './newton.js';
import type { SpeciationProblem } from './problem.js';

/** Step 3: the active-set loop. Returns the final assemblage or the reason for failure. */
export function assemblage(P: SpeciationProblem, lk: Float64Array, u: Float64Array, active0: number[], w: NewtonWork, opt: NewtonOptions): { active: number[]; lambda: Float64Array } | string {
  const nc = P.components.length;
  const ns = P.species.length;
  let active = active0;
  let lam = new Float64Array(nc);
  let seen: Set<string> | undefined;
  for (let round = 0; round < 40; round++) {
    if (round > 0) {
      // Only a changed assemblage can cycle; keys are built then, not on the common first pass.
      seen ??= new Set([active0.slice().sort((a, b) => a - b).join(',')]);
      const key = active.slice().sort((a, b) => a - b).join(',');
      if (seen.has(key)) return 'the phase assemblage cycles';
      seen.add(key);
    }
    const r = newtonSolve(P, lk, active, u, lam, w, opt);
    if (!r.ok) return r.reason!;
    // Drop the solid with the most negative amount.
    let worst = -1;
    let wv = -1e-14 * P.totals[0];
    for (let k = 0; k < active.length; k++) if (lam[k] < wv) {
      wv = lam[k];
      worst = k;
    }
    if (worst >= 0) {
      active = active.filter((_, k) => k !== worst);
      const l2 = new Float64Array(nc);
      let q = 0;
      for (let k = 0; k < lam.length && q < active.length; k++) if (k !== worst) l2[q++] = lam[k];
      lam = l2;
      continue;
    }
    // Add the most supersaturated absent solid (SI per unit of its components).
    let add = -1;
    let sv = 1e-12;
    for (let s = P.nAq; s < ns; s++) {
      if (active.includes(s)) continue;
      let si = lk[s];
      let atoms = 0;
      for (let c = 0; c < nc; c++) {
        si += P.A[s * nc + c] * u[c];
        atoms += P.A[s * nc + c];
      }
      if (si > 1e-12 && si / atoms > sv) {
        sv = si / atoms;
        add = s;
      }
    }
    if (add < 0) {
      const out = new Float64Array(active.length);
      for (let k = 0; k < active.length; k++) out[k] = Math.max(0, lam[k]);
      return { active, lambda: out };
    }
    if (independent(P, [...active, add])) {
      lam[active.length] = 0;
      active = [...active, add];
      continue;
    }
    // Phase rule: the new solid's components are already fixed by the solids present; it replaces
    // the first solid whose removal leaves an independent set (the one it is in equilibrium with).
    const k = active.findIndex((_, q) => independent(P, [...active.filter((__, r) => r !== q), add]));
    if (k < 0) return 'no independent phase assemblage: degenerate point';
    active = active.map((x, q) => (q === k ? add : x));
    lam[k] = 0;
  }
  return 'the phase assemblage did not settle in 40 changes';
}

/** Whether the solids' stoichiometric rows (over the components) are linearly independent. */
function independent(P: SpeciationProblem, rows: number[]): boolean {
  const nc = P.components.length;
  if (rows.length > nc) return false;
  const M = rows.map((r) => Array.from(P.A.subarray(r * nc, r * nc + nc)));
  for (let c = 0, rank = 0; c < nc && rank < M.length; c++) {
    let p = rank;
    for (let r = rank + 1; r < M.length; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
    if (Math.abs(M[p][c]) < 1e-9) continue;
    [M[p], M[rank]] = [M[rank], M[p]];
    for (let r = rank + 1; r < M.length; r++) {
      const f = M[r][c] / M[rank][c];
      for (let q = c; q < nc; q++) M[r][q] -= f * M[rank][q];
    }
    rank++;
    if (rank === M.length) return true;
  }
  return M.length === 0;
}

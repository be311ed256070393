/**
 * Newton's method for one phase assemblage at fixed activity coefficients.
 *
 * Unknowns: u_c (log10 grand potential of each component, see problem.ts) and the amount λ_s of
 * each solid s in the assemblage (mol/kg of water). Equations, scaled to be dimensionless:
 *   mass balance  r_c = (Σ_aq A_ic m_i + Σ_s A_sc λ_s − T_c)/T_c = 0,  m_i = 10^(Σ A_ic u_c + lk_i)
 *   saturation    r_s = Σ_c A_sc u_c + lk_s = 0                       (log10 SI of a solid present)
 * Jacobian: ∂r_c/∂u_d = ln10·Σ_aq A_ic A_id m_i/T_c, ∂r_c/∂λ_s = A_sc/T_c, ∂r_s/∂u_d = A_sd.
 * These are the optimality conditions of the convex dual of Gibbs-energy minimisation (λ are the
 * multipliers of the saturation constraints), so a damped Newton step is a descent direction.
 * Steps: 1. residual and Jacobian; 2. solve (../linalg.ts); 3. cap the step at `maxStep` log units;
 * 4. backtracking line search on the merit ½Σr²; stop at max|r| ≤ tol.
 */
import { type DenseScratch, solveDense } from '../linalg.js';
import type { SpeciationProblem } from './problem.js';

export interface NewtonOptions {
  maxIterations: number;
  tol: number;
  /** Largest change of any u_c in one step, log10 units. */
  maxStep: number;
}

export const NEWTON_DEFAULTS: NewtonOptions = { maxIterations: 60, tol: 1e-11, maxStep: 2 };

export interface NewtonWork {
  m: Float64Array;
  r: Float64Array;
  J: Float64Array;
  d: Float64Array;
  u0: Float64Array;
  l0: Float64Array;
  /** Scratch of the dense solve. */
  solve: DenseScratch;
}

export function newtonWork(P: SpeciationProblem): NewtonWork {
  const n = P.components.length * 2 + 1;
  return { m: new Float64Array(P.species.length), r: new Float64Array(n), J: new Float64Array(n * n), d: new Float64Array(n), u0: new Float64Array(n), l0: new Float64Array(n), solve: { perm: new Int32Array(n), x: new Float64Array(n) } };
}

/** Dissolved molalities for u (into w.m); returns false on overflow. */
export function molalities(P: SpeciationProblem, lk: Float64Array, u: Float64Array, m: Float64Array): boolean {
  const nc = P.components.length;
  for (let i = 0; i < P.nAq; i++) {
    let x = lk[i];
    for (let c = 0; c < nc; c++) x += P.A[i * nc + c] * u[c];
    if (x > 300) return false;
    m[i] = Math.exp(x * Math.LN10);
  }
  return true;
}

/** Residual into w.r; returns ½Σr² (Infinity on overflow). */
function residual(P: SpeciationProblem, lk: Float64Array, active: number[], u: Float64Array, lam: Float64Array, w: NewtonWork): number {
  const nc = P.components.length;
  if (!molalities(P, lk, u, w.m)) return Infinity;
  let f = 0;
  for (let c = 0; c < nc; c++) {
    let s = -P.totals[c];
    for (let i = 0; i < P.nAq; i++) s += P.A[i * nc + c] * w.m[i];
    for (let k = 0; k < active.length; k++) s += P.A[active[k] * nc + c] * lam[k];
    w.r[c] = s / P.totals[c];
    f += w.r[c] * w.r[c];
  }
  for (let k = 0; k < active.length; k++) {
    const sI = active[k];
    let s = lk[sI];
    for (let c = 0; c < nc; c++) s += P.A[sI * nc + c] * u[c];
    w.r[nc + k] = s;
    f += s * s;
  }
  return 0.5 * f;
}

export interface NewtonResult {
  ok: boolean;
  reason?: string;
  iterations: number;
}

/** Solve for u and λ (both updated in place) with the solids `active` present. */
export function newtonSolve(
  P: SpeciationProblem,
  lk: Float64Array,
  active: number[],
  u: Float64Array,
  lam: Float64Array,
  w: NewtonWork,
  opt: NewtonOptions = NEWTON_DEFAULTS,
): NewtonResult {
  const nc = P.components.length;
  const n = nc + active.length;
  let f = residual(P, lk, active, u, lam, w);
  if (!Number.isFinite(f)) return { ok: false, reason: 'overflow at the starting point', iterations: 0 };
  for (let it = 0; it < opt.maxIterations; it++) {
    let rmax = 0;
    for (let k = 0; k < n; k++) rmax = Math.max(rmax, Math.abs(w.r[k]));
    if (rmax <= opt.tol) return { ok: true, iterations: it };
    // Step 1: Jacobian.
    w.J.fill(0, 0, n * n);
    for (let c = 0; c < nc; c++) {
      for (let d = 0; d < nc; d++) {
        let s = 0;
        for (let i = 0; i < P.nAq; i++) s += P.A[i * nc + c] * P.A[i * nc + d] * w.m[i];
        w.J[c * n + d] = (Math.LN10 * s) / P.totals[c];
      }
      for (let k = 0; k < active.length; k++) w.J[c * n + nc + k] = P.A[active[k] * nc + c] / P.totals[c];
    }
    for (let k = 0; k < active.length; k++) for (let d = 0; d < nc; d++) w.J[(nc + k) * n + d] = P.A[active[k] * nc + d];
    // Step 2: Newton direction.
    for (let k = 0; k < n; k++) w.d[k] = -w.r[k];
    if (!solveDense(w.J, w.d, n, undefined, w.solve)) return { ok: false, reason: 'singular Jacobian (the assemblage breaks the phase rule or a component has no species)', iterations: it };
    // Step 3: cap the step in u.
    let big = 0;
    for (let c = 0; c < nc; c++) big = Math.max(big, Math.abs(w.d[c]));
    const cap = big > opt.maxStep ? opt.maxStep / big : 1;
    // Step 4: backtracking line search on the merit.
    for (let c = 0; c < nc; c++) w.u0[c] = u[c];
    for (let k = 0; k < active.length; k++) w.l0[k] = lam[k];
    let a = cap;
    let accepted = false;
    for (let ls = 0; ls < 40; ls++) {
      for (let c = 0; c < nc; c++) u[c] = w.u0[c] + a * w.d[c];
      for (let k = 0; k < active.length; k++) lam[k] = w.l0[k] + a * w.d[nc + k];
      const f1 = residual(P, lk, active, u, lam, w);
      if (f1 <= f * (1 - 1e-4 * a) || (f1 < 1e-24 && f1 <= f)) {
        f = f1;
        accepted = true;
        break;
      }
      a *= 0.5;
    }
    if (!accepted) {
      for (let c = 0; c < nc; c++) u[c] = w.u0[c];
      for (let k = 0; k < active.length; k++) lam[k] = w.l0[k];
      residual(P, lk, active, u, lam, w);
      let r2 = 0;
      for (let k = 0; k < n; k++) r2 = Math.max(r2, Math.abs(w.r[k]));
      if (r2 <= 1e3 * opt.tol) return { ok: true, iterations: it };
      return { ok: false, reason: 'line search found no decrease of the residual', iterations: it };
    }
    for (let c = 0; c < nc; c++) if (Math.abs(u[c]) > 1e4) return { ok: false, reason: 'the potentials diverge: no equilibrium holds these totals with the species given', iterations: it };
  }
  return { ok: false, reason: `no convergence in ${opt.maxIterations} Newton steps`, iterations: opt.maxIterations };
}

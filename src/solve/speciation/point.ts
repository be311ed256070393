/**
 * Speciation at one point (pH, E): the point solver of composition mode, the single source of
 * truth for probe, grid, refinement and iso-solubility lines.
 *
 * Steps: 1. log K of every species at (pH, E) (problem.ts); 2. start from a warm state (the
 * neighbour's u, assemblage and I) or a cold guess (each component's largest species holds its
 * total); 3. phase-assemblage loop (active set): Newton for the current solids (newton.ts), drop
 * a solid whose amount is negative, add the most supersaturated absent solid, never more solids
 * than components (the phase rule at fixed T, P, pH and E); 4. with `ionicStrength: auto`, repeat
 * 3 until I from the speciation (gamma.ts) is steady; 5. on failure, one fallback from the cold
 * guess with short damped steps; a second failure is reported as status 'failed' with the reason —
 * never as an answer.
 */
import { fillLogGamma, type GammaSettings, logGammaAt, speciationIonicStrength } from './gamma.js';
import { NEWTON_DEFAULTS, type NewtonOptions, newtonSolve, newtonWork, type NewtonWork } from './newton.js';
import type { SpeciationProblem } from './problem.js';

export interface PointState {
  u: Float64Array;
  active: number[];
  I: number;
}

export interface PointSolution {
  status: 'ok' | 'failed';
  reason?: string;
  pH: number;
  E: number;
  /** Component potentials (log10 units). */
  u: Float64Array;
  /** Solids present (species indices) and their amounts, mol/kg of water. */
  active: number[];
  lambda: Float64Array;
  /** Molality of each dissolved species (index < nAq), mol/kg. */
  m: Float64Array;
  /** log10 γ of each dissolved species. */
  logGamma: Float64Array;
  /** log10 K of every species at the point (γ not applied). */
  logK: Float64Array;
  ionicStrength: number;
}

export interface PointSolver {
  problem: SpeciationProblem;
  gamma: GammaSettings;
  solve(pH: number, E: number, warm?: PointState): PointSolution;
  /**
   * The grid's fast path: solve and write the shares of the main element (dissolved by molality,
   * solids by amount) into `shares`; returns the state for warm starts and the dissolved total,
   * or null where the point could not be solved.
   */
  solveShares(pH: number, E: number, warm: PointState | undefined, shares: Float64Array): { state: PointState; dissolved: number } | null;
  /** Number of points solved so far (for the bench). */
  readonly solves: number;
}

export interface PointSolverOptions {
  newton?: NewtonOptions;
  /** Skip the fallback (tests of the failure report). */
  noFallback?: boolean;
}

interface Core {
  u: Float64Array;
  active: number[];
  lambda: Float64Array;
  I: number;
}

/** Largest ionic strength considered, mol/kg (far beyond any activity model's range; warned elsewhere). */
const I_MAX = 20;

/** A point solver over a problem; owns its work arrays (not re-entrant). */
export function pointSolver(P: SpeciationProblem, gamma: GammaSettings, opts: PointSolverOptions = {}): PointSolver {
  const ns = P.species.length;
  const nc = P.components.length;
  const w = newtonWork(P);
  const lk = new Float64Array(ns);
  const logK = new Float64Array(ns);
  const lg = new Float64Array(P.nAq);
  const newton = opts.newton ?? NEWTON_DEFAULTS;
  const fallback: NewtonOptions = { maxIterations: 400, tol: newton.tol, maxStep: 0.5 };
  const fixedI = gamma.ionicStrength === 'auto' ? undefined : gamma.ionicStrength;
  if (fixedI !== undefined) fillLogGamma(P, gamma, fixedI, lg);
  let solves = 0;
  let reason = '';

  /** Steps 3–4 from a start; results in w.m, lg; null with `reason` set on failure. */
  const attempt = (pH: number, u: Float64Array, active: number[], I0: number, opt: NewtonOptions): Core | null => {
    if (fixedI !== undefined) {
      for (let i = 0; i < ns; i++) lk[i] = i < P.nAq ? logK[i] - lg[i] : logK[i];
      const r = assemblage(P, lk, u, active, w, opt);
      if (typeof r === 'string') {
        reason = r;
        return null;
      }
      return { u, active: r.active, lambda: r.lambda, I: fixedI };
    }
    // Step 4: I(speciation(I)) = I. Plain iteration first; if it does not settle (the Davies term
    // makes γ rise again at high I), bisection on g(I) = I_new − I over [0, 20], g(0) ≥ 0 ≥ g(20).
    const at = (I: number): { I: number; r: { active: number[]; lambda: Float64Array } } | null => {
      fillLogGamma(P, gamma, I, lg);
      for (let i = 0; i < ns; i++) lk[i] = i < P.nAq ? logK[i] - lg[i] : logK[i];
      const r = assemblage(P, lk, u, active, w, opt);
      if (typeof r === 'string') {
        reason = r;
        return null;
      }
      active = r.active;
      return { I: Math.min(I_MAX, speciationIonicStrength(P, w.m, pH, logGammaAt(gamma, 1, I))), r };
    };
    let I = I0;
    for (let round = 0; round < 12; round++) {
      const q = at(I);
      if (!q) return null;
      if (Math.abs(q.I - I) <= 1e-11 * (1 + I)) return { u, active: q.r.active, lambda: q.r.lambda, I };
      I = q.I;
    }
    let lo = 0;
    let hi = I_MAX;
    for (let k = 0; k < 200; k++) {
      I = 0.5 * (lo + hi);
      const q = at(I);
      if (!q) return null;
      if (Math.abs(q.I - I) <= 1e-11 * (1 + I) || hi - lo <= 1e-13 * (1 + I)) return { u, active: q.r.active, lambda: q.r.lambda, I };
      if (q.I > I) lo = I;
      else hi = I;
    }
    reason = 'the ionic strength did not settle';
    return null;
  };
  /** Steps 1, 2 and 5. */
  const run = (pH: number, E: number, warm?: PointState): Core | null => {
    solves++;
    for (let i = 0; i < ns; i++) logK[i] = P.kg[i] + P.kp[i] * pH + P.ke[i] * E;
    const first = warm ? attempt(pH, Float64Array.from(warm.u), warm.active, warm.I, newton) : attempt(pH, coldStart(P, logK), [], 0, newton);
    if (first || opts.noFallback) return first;
    return attempt(pH, coldStart(P, logK), [], 0, fallback);
  };
  return {
    problem: P,
    gamma,
    get solves() {
      return solves;
    },
    solve(pH, E, warm) {
      const c = run(pH, E, warm);
      if (!c) return { status: 'failed', reason, pH, E, u: new Float64Array(nc).fill(NaN), active: [], lambda: new Float64Array(0), m: new Float64Array(P.nAq).fill(NaN), logGamma: Float64Array.from(lg), logK: Float64Array.from(logK), ionicStrength: NaN };
      return { status: 'ok', pH, E, u: c.u, active: c.active, lambda: c.lambda, m: Float64Array.from(w.m.subarray(0, P.nAq)), logGamma: Float64Array.from(lg), logK: Float64Array.from(logK), ionicStrength: c.I };
    },
    solveShares(pH, E, warm, shares) {
      const c = run(pH, E, warm);
      if (!c) return null;
      const T = P.totals[0];
      let dissolved = 0;
      for (let i = 0; i < P.nAq; i++) {
        const x = P.A[i * nc] * w.m[i];
        shares[i] = x / T;
        dissolved += x;
      }
      for (let i = P.nAq; i < ns; i++) shares[i] = 0;
      for (let k = 0; k < c.active.length; k++) shares[c.active[k]] = (P.A[c.active[k] * nc] * c.lambda[k]) / T;
      return { state: { u: c.u, active: c.active, I: c.I }, dissolved };
    },
  };
}

/** Cold guess: each ligand's largest own species holds its total; then the element's largest species holds its total. */
export function coldStart(P: SpeciationProblem, logK: Float64Array): Float64Array {
  const nc = P.components.length;
  const u = new Float64Array(nc);
  for (let c = 1; c < nc; c++) {
    let best = Infinity;
    for (let i = 0; i < P.nAq; i++) {
      const k = P.A[i * nc + c];
      if (k > 0 && P.A[i * nc] === 0) best = Math.min(best, (Math.log10(P.totals[c]) - logK[i]) / k);
    }
    u[c] = Number.isFinite(best) ? best : Math.log10(P.totals[c]);
  }
  let best = Infinity;
  for (let i = 0; i < P.nAq; i++) {
    const x = P.A[i * nc];
    if (x <= 0) continue;
    let v = Math.log10(P.totals[0]) - logK[i];
    for (let c = 1; c < nc; c++) v -= P.A[i * nc + c] * u[c];
    best = Math.min(best, v / x);
  }
  u[0] = Number.isFinite(best) ? best : 0;
  return u;
}

/** Step 3: the active-set loop. Returns the final assemblage or the reason for failure. */
function assemblage(P: SpeciationProblem, lk: Float64Array, u: Float64Array, active0: number[], w: NewtonWork, opt: NewtonOptions): { active: number[]; lambda: Float64Array } | string {
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

/**
 * Speciation at one point (pH, E): the point solver of composition mode, the single source of
 * truth for probe, grid, refinement and iso-solubility lines.
 *
 * Steps: 1. log K of every species at (pH, E) (problem.ts); 2. start from a warm state (the
 * neighbour's u, assemblage and I) or a cold guess (each component's largest species holds its
 * total); 3. phase-assemblage loop (assemblage.ts): Newton for the current solids (newton.ts), drop
 * a solid whose amount is negative, add the most supersaturated absent solid, never more solids
 * than components (the phase rule at fixed T, P, pH and E); 4. with `ionicStrength: auto`, repeat
 * 3 until I from the speciation is steady (settle.ts); 5. on failure, one fallback from the cold
 * guess with short damped steps; a second failure is reported as status 'failed' with the reason —
 * never as an answer.
 */
import { fillLogGamma, type GammaSettings } from './gamma.js';
import { NEWTON_DEFAULTS, type NewtonOptions, newtonWork } from './newton.js';
import { type Core, type SolveContext, settle } from './settle.js';
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
  const ctx: SolveContext = { P, gamma, w, logK, lk, lg, fixedI, reason: '' };
  const attempt = (pH: number, u: Float64Array, active: number[], I0: number, opt: NewtonOptions) => settle(ctx, pH, u, active, I0, opt);
  let solves = 0;

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
      if (!c) return { status: 'failed', reason: ctx.reason, pH, E, u: new Float64Array(nc).fill(NaN), active: [], lambda: new Float64Array(0), m: new Float64Array(P.nAq).fill(NaN), logGamma: Float64Array.from(lg), logK: Float64Array.from(logK), ionicStrength: NaN };
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


/**
 * Steps 3–4 of the point solver: the phase assemblage at the activity coefficients of an ionic
 * strength, and with `ionicStrength: auto` the ionic strength that the speciation itself produces:
 * I(speciation(I)) = I, plain iteration first; if it does not settle (the Davies term makes γ rise
 * again at high I), bisection on g(I) = I_new − I over [0, I_MAX], where g(0) ≥ 0 ≥ g(I_MAX).
 * Results are left in the context's work arrays (molalities in w.m, log γ in lg).
 */
import { assemblage } from './assemblage.js';
import { fillLogGamma, type GammaSettings, logGammaAt, speciationIonicStrength } from './gamma.js';
import type { NewtonOptions, NewtonWork } from './newton.js';
import type { SpeciationProblem } from './problem.js';

/** Largest ionic strength considered, mol/kg (far beyond any activity model's range; warned elsewhere). */
export const I_MAX = 20;

export interface SolveContext {
  P: SpeciationProblem;
  gamma: GammaSettings;
  w: NewtonWork;
  /** log K at the point (γ not applied), log K − log γ, and log γ of the dissolved species. */
  logK: Float64Array;
  lk: Float64Array;
  lg: Float64Array;
  fixedI?: number;
  /** Why the last attempt failed. */
  reason: string;
}

export interface Core {
  u: Float64Array;
  active: number[];
  lambda: Float64Array;
  I: number;
}

/** From a start (u, solids, I0); null with ctx.reason set on failure. */
export function settle(ctx: SolveContext, pH: number, u: Float64Array, active: number[], I0: number, opt: NewtonOptions): Core | null {
  const { P, gamma, w, lk, logK, lg, fixedI } = ctx;
  const ns = P.species.length;
  const fail = (r: string) => {
    ctx.reason = r;
    return null;
  };
  if (fixedI !== undefined) {
    for (let i = 0; i < ns; i++) lk[i] = i < P.nAq ? logK[i] - lg[i] : logK[i];
    const r = assemblage(P, lk, u, active, w, opt);
    return typeof r === 'string' ? fail(r) : { u, active: r.active, lambda: r.lambda, I: fixedI };
  }
  const at = (I: number): { I: number; r: { active: number[]; lambda: Float64Array } } | null => {
    fillLogGamma(P, gamma, I, lg);
    for (let i = 0; i < ns; i++) lk[i] = i < P.nAq ? logK[i] - lg[i] : logK[i];
    const r = assemblage(P, lk, u, active, w, opt);
    if (typeof r === 'string') return fail(r);
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
  return fail('the ionic strength did not settle');
}

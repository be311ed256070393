/** Speciation (composition mode): the problem, the point solver and the plain-data answer. */
import type { GammaSettings } from './gamma.js';
import { type PointSolver, pointSolver, type PointSolverOptions } from './point.js';
import type { SpeciationProblem } from './problem.js';

export { speciationProblem, type SpeciationProblem } from './problem.js';
export { pointSolver, type PointSolver, type PointSolution, type PointState } from './point.js';
export { describePoint, dissolvedElement, elementShares, predominantIndex, type SpeciationResult } from './describe.js';
export type { GammaSettings } from './gamma.js';

export function solveFor(P: SpeciationProblem, g: GammaSettings, opts: PointSolverOptions = {}): PointSolver {
  return pointSolver(P, g, opts);
}

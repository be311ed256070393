/**
 * Composition mode, set-up: from a spec with a `composition` key to the speciation problem and its
 * point solver. Uses the same species, G(T) and water data as the fixed-activity kind
 * (src/system/build.ts), so that the two kinds agree where they should.
 */
import { InputError } from '../errors.js';
import { describePoint, solveFor, type SpeciationResult } from '../solve/speciation/index.js';
import { type PointSolver, type PointSolverOptions } from '../solve/speciation/point.js';
import { speciationProblem } from '../solve/speciation/problem.js';
import { waterContext } from '../solve/solve.js';
import { type BuiltSystem, buildSystem } from '../system/build.js';
import { molality } from '../system/solution.js';
import type { SystemSpec } from '../system/spec.js';

export interface CompositionSetup {
  built: BuiltSystem;
  solver: PointSolver;
  /** Totals used, mol/kg, by component (the main element first). */
  totals: Record<string, number>;
  warnings: string[];
}

export function compositionSetup(spec: SystemSpec, opts: PointSolverOptions = {}): CompositionSetup {
  const comp = spec.composition;
  if (!comp) throw new InputError(spec.file, 'composition', 'a composition key (totals of the element and ligands) for a composition-mode diagram');
  const built = buildSystem(spec);
  const density = built.solution.water.density;
  const components = [spec.element, ...built.input.ligands.map((L) => L.element)];
  const totals = components.map((c, k) => molality(k === 0 ? comp.element : comp.ligands[c], c, density));
  const species = [...built.input.species, ...built.input.ligands.flatMap((L) => L.species)];
  const problem = speciationProblem(components, totals, species, waterContext(built.input), -built.solution.water.pKw);
  const s = built.solution;
  const solver = solveFor(problem, { model: s.settings.model === 'ideal' && comp.autoIonicStrength ? 'davies' : s.settings.model, A: s.A, B: s.B, ionSize: s.settings.ionSize, ionicStrength: comp.autoIonicStrength ? 'auto' : s.settings.ionicStrength }, opts);
  const warnings = [...built.warnings];
  if (problem.leftOut.length) warnings.push(`composition mode: gases are not part of the bath and are left out: ${problem.leftOut.join(', ')}`);
  return { built, solver, totals: Object.fromEntries(components.map((c, k) => [c, totals[k]])), warnings };
}

/** The answer at one point (probe in composition mode): full speciation, solids, shares, status. */
export function speciationAt(setup: CompositionSetup, pH: number, E: number): SpeciationResult {
  return describePoint(setup.solver.problem, setup.solver.solve(pH, E));
}

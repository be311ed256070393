/**
 * The speciation point solver as a TraceField (src/solve/trace/field.ts): labels are the species
 * of the problem (dissolved and solid), scores their shares of the main element's atoms, the value
 * log10 of the total dissolved element. States are compact (potentials, solids, I) for warm starts.
 */
import type { TraceField } from '../trace/field.js';
import { dissolvedElement, elementShares } from './describe.js';
import type { PointSolver, PointState } from './point.js';

export interface SpeciationNode {
  ok: boolean;
  warm?: PointState;
  shares?: Float64Array;
  dissolved: number;
}

export function speciationField(solver: PointSolver): TraceField<SpeciationNode> {
  const P = solver.problem;
  const work = new Float64Array(P.species.length);
  return {
    labels: P.species.length,
    solve(x, y, warm) {
      const s = solver.solve(x, y, warm?.ok ? warm.warm : undefined);
      if (s.status !== 'ok') return { ok: false, dissolved: NaN };
      return { ok: true, warm: { u: s.u, active: s.active, I: s.ionicStrength }, shares: Float64Array.from(elementShares(P, s, work)), dissolved: dissolvedElement(P, s) };
    },
    scores(s, out) {
      if (!s.ok) return false;
      out.set(s.shares!);
      return true;
    },
    value: (s) => (s.ok && s.dissolved > 0 ? Math.log10(s.dissolved) : NaN),
  };
}

/**
 * The speciation point solver as a TraceField (src/solve/trace/field.ts): labels are the species
 * of the problem (dissolved and solid), scores their shares of the main element's atoms, the value
 * log10 of the total dissolved element. States are compact (potentials, solids, I) for warm starts.
 */
import type { TraceField } from '../trace/field.js';
import type { PointSolver, PointState } from './point.js';

export interface SpeciationNode {
  ok: boolean;
  warm?: PointState;
  shares?: Float64Array;
  dissolved: number;
}

export function speciationField(solver: PointSolver): TraceField<SpeciationNode> {
  const P = solver.problem;
  return {
    labels: P.species.length,
    solve(x, y, warm) {
      const shares = new Float64Array(P.species.length);
      const s = solver.solveShares(x, y, warm?.ok ? warm.warm : undefined, shares);
      if (!s) return { ok: false, dissolved: NaN };
      return { ok: true, warm: s.state, shares, dissolved: s.dissolved };
    },
    scores(s, out) {
      if (!s.ok) return false;
      out.set(s.shares!);
      return true;
    },
    value: (s) => (s.ok && s.dissolved > 0 ? Math.log10(s.dissolved) : NaN),
  };
}

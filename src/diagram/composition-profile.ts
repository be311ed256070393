/**
 * Composition mode, the speciation profile: share of the main element held by each form along pH
 * at a fixed potential (or along E at a fixed pH) — the plot a plater looks at beside the diagram.
 * Each point is the point solver's answer, warm-started from the previous one; a point that cannot
 * be solved carries NaN shares and is listed in `failed` (undetermined, never interpolated).
 */
import type { PointState } from '../solve/speciation/point.js';
import type { CompositionSetup } from './composition-setup.js';

export interface SpeciationProfile {
  along: 'pH' | 'E';
  /** The fixed coordinate (E in V vs SHE, or pH). */
  at: number;
  x: number[];
  /** Forms holding at least `minShare` of the element somewhere on the profile, by share. */
  forms: { species: string; phase: string; share: number[] }[];
  /** Total dissolved main element, mol/kg. */
  dissolved: number[];
  failed: number[];
}

export function speciationProfile(setup: CompositionSetup, along: 'pH' | 'E', at: number, range: [number, number], n = 281, minShare = 1e-3): SpeciationProfile {
  const P = setup.solver.problem;
  const x = Array.from({ length: n }, (_, k) => range[0] + ((range[1] - range[0]) * k) / (n - 1));
  const share = P.species.map(() => new Array<number>(n).fill(NaN));
  const dissolved = new Array<number>(n).fill(NaN);
  const failed: number[] = [];
  const sh = new Float64Array(P.species.length);
  let warm: PointState | undefined;
  x.forEach((v, k) => {
    const r = along === 'pH' ? setup.solver.solveShares(v, at, warm, sh) : setup.solver.solveShares(at, v, warm, sh);
    if (!r) {
      failed.push(k);
      warm = undefined;
      return;
    }
    warm = r.state;
    dissolved[k] = r.dissolved;
    sh.forEach((s, i) => (share[i][k] = s));
  });
  const forms = P.species
    .map((s, i) => ({ species: s.formula, phase: s.phase, share: share[i], peak: Math.max(...share[i].filter(Number.isFinite), 0) }))
    .filter((f) => f.peak >= minShare)
    .sort((a, b) => b.peak - a.peak || (a.species < b.species ? -1 : 1))
    .map(({ peak: _p, ...f }) => f);
  return { along, at, x, forms, dissolved, failed };
}

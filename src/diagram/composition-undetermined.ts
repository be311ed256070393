/**
 * Composition mode: where a species whose G at T is unknown holds part of the element.
 *
 * A species that cannot be carried to the diagram temperature (system/build.ts gAt: an inline
 * species with ΔfG° only, away from 25 °C) is kept with its 25 °C ΔfG° for the geometry only. In
 * the fixed-activity kind only its own field loses its verdict; in composition mode it also takes
 * a share of the element's atoms wherever it is near its stability, and that share moves every
 * other form's share with it. So no verdict is given wherever the undetermined species together
 * hold at least UNDETERMINED_SHARE of the element (a project choice: 1 % of the atoms; below that
 * no error in their G within the usual few kJ/mol can make them hold the largest share).
 *
 * Steps: 1. the undetermined species of the problem that contain the element (undeterminedIndices);
 * 2. at a point, those holding a share at or above the limit (undeterminedHolders); 3. over the
 * traced grid, the area where their summed share reaches the limit (undeterminedShareAreas:
 * marching squares on the summed share minus the limit, resolution of the grid).
 */
import type { SpeciationProblem } from '../solve/speciation/problem.js';
import { contourRings } from '../solve/trace/contour.js';
import type { GridSample } from '../solve/trace/grid.js';
import { dedupe, signedArea } from '../solve/trace/regions.js';

/** Share of the element's atoms (0–1) at or above which undetermined species withhold the verdict. */
export const UNDETERMINED_SHARE = 0.01;

/** Indices into P.species of the undetermined species that contain the main element. */
export function undeterminedIndices(P: SpeciationProblem): number[] {
  const nc = P.components.length;
  const out: number[] = [];
  P.species.forEach((s, k) => {
    if (s.temperatureModel === 'undetermined' && P.A[k * nc] > 0) out.push(k);
  });
  return out;
}

/** The undetermined species (data formula) holding at least `limit` of the element, largest first. */
export function undeterminedHolders(P: SpeciationProblem, shares: ArrayLike<number>, limit = UNDETERMINED_SHARE): { species: string; share: number }[] {
  return undeterminedIndices(P)
    .filter((k) => shares[k] >= limit)
    .map((k) => ({ species: P.species[k].formula, share: shares[k] }))
    .sort((a, b) => b.share - a.share || (a.species < b.species ? -1 : 1));
}

/** Polygons (outer ring counter-clockwise, holes clockwise) where the undetermined species hold ≥ limit. */
export function undeterminedShareAreas<S>(g: GridSample<S>, indices: readonly number[], nLabels: number, limit = UNDETERMINED_SHARE): [number, number][][][] {
  if (!indices.length) return [];
  const n = g.nx * g.ny;
  const v = new Float64Array(n);
  for (let q = 0; q < n; q++) {
    // Unsolved nodes are undetermined already (their own polygons); keep them outside here.
    if (g.label[q] < 0) {
      v[q] = -limit;
      continue;
    }
    let s = 0;
    for (const k of indices) s += g.scores[q * nLabels + k];
    v[q] = s - limit;
  }
  if (!v.some((x) => x >= 0)) return [];
  return contourRings(g, v, 0).map((poly) => poly.map((ring, r) => {
    const pts = dedupe(ring.map((p) => [p.x, p.y] as [number, number]));
    const a = signedArea(pts);
    if ((r === 0 && a < 0) || (r > 0 && a > 0)) pts.reverse();
    return pts;
  }));
}

/**
 * Exact assemblage regions of an alloy without ligands (issue 18). There every ψ'_k is a plane in
 * (pH, E), so each assemblage's grand potential G_L = Σ n_{L,k} ψ'_k is a plane and the diagram is
 * the lower envelope of those planes: the region of L is the convex polygon
 *     { (pH, E) in the domain : G_L − G_M ≤ 0 for every other assemblage M },
 * cut out of the domain rectangle by exact half-plane clipping (src/solve/clip.ts, as for one
 * element). Vertices are exact line intersections (no grid error, corners where four assemblages
 * meet included); each edge is tagged with the neighbour that made it, which gives the boundaries
 * and the triple points. The assemblages are those discovered by the LP (alloy-field.ts).
 */
import type { Plane } from '../solve/plane.js';
import { addScaled, ZERO_PLANE } from '../solve/plane.js';
import { clipHalfPlane, type ConvexPoly, rectangle, signedArea, type Pt } from '../solve/clip.js';
import { speciesPlanesAt } from '../solve/alloy/psi.js';
import type { AlloyInput } from '../solve/alloy/types.js';
import type { AlloyLabel } from './alloy-field.js';

export interface ExactAlloy {
  regions: { label: number; polygons: [number, number][][][]; area: number }[];
  boundaries: { between: [number, number]; points: [number, number][] }[];
  triples: { labels: [number, number, number]; x: number; y: number }[];
}

/** Tolerance of the clipping, J per mol of alloy atoms (values are ~10⁵ J). */
const EPS_J = 1e-7;

export function exactAlloyRegions(input: AlloyInput, labels: readonly AlloyLabel[], pH: [number, number], E: [number, number]): ExactAlloy {
  const { planes } = speciesPlanesAt(input, (pH[0] + pH[1]) / 2, (E[0] + E[1]) / 2);
  const G: Plane[] = labels.map((l) => l.indices.reduce((acc, k, i) => addScaled(acc, planes[k], l.amounts[i]), ZERO_PLANE));
  const regions: ExactAlloy['regions'] = [];
  const polys: (ConvexPoly | null)[] = labels.map((_, f) => {
    let poly: ConvexPoly | null = rectangle(pH, E);
    for (let m = 0; m < labels.length && poly; m++) {
      if (m !== f) poly = clipHalfPlane(poly, { g: G[f].g - G[m].g, p: G[f].p - G[m].p, e: G[f].e - G[m].e }, m, EPS_J);
    }
    return poly;
  });
  const boundaries: ExactAlloy['boundaries'] = [];
  const triples = new Map<string, ExactAlloy['triples'][number]>();
  polys.forEach((poly, f) => {
    if (!poly) return;
    const area = Math.abs(signedArea(poly.pts));
    if (!(area > 1e-12)) return;
    regions.push({ label: f, polygons: [[poly.pts.map((p) => [p[0], p[1]] as [number, number])]], area });
    const n = poly.pts.length;
    for (let k = 0; k < n; k++) {
      const tag = poly.tags[k];
      const a: Pt = poly.pts[k];
      const b: Pt = poly.pts[(k + 1) % n];
      if (tag > f && Math.hypot(b[0] - a[0], b[1] - a[1]) > 1e-12) boundaries.push({ between: [f, tag], points: [[a[0], a[1]], [b[0], b[1]]] });
      const prev = poly.tags[(k + n - 1) % n];
      if (tag >= 0 && prev >= 0 && tag !== prev) {
        const set = [f, tag, prev].sort((x, y) => x - y) as [number, number, number];
        const key = `${set.join()}@${a[0].toFixed(9)},${a[1].toFixed(9)}`;
        if (!triples.has(key)) triples.set(key, { labels: set, x: a[0], y: a[1] });
      }
    }
  });
  return { regions, boundaries, triples: [...triples.values()] };
}

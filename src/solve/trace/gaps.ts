/**
 * The uncovered remainder of a traced diagram: the parts of the domain that lie in no traced polygon
 * (e.g. the sliver left where a wedge thinner than a cell ends near a triple point and the rings of
 * its neighbours do not meet, so junctions.ts could not join them). They are returned as polygons to
 * be drawn as undetermined, so that no part of a figure is ever blank.
 *
 * Steps: 1. a lattice of M × M cells over the domain (M = LATTICE, fixed, so the patches do not
 * depend on the trace grid's coarseness); 2. scanlines along every lattice row and every lattice
 * column: each polygon's edge crossings, sorted, give the intervals inside it (even–odd rule, holes
 * included); the union of all intervals is taken and every stretch of the line left outside it
 * (longer than `tiny` of the span, above the noise of two sides refined onto one boundary) marks
 * the lattice cells it runs through on both sides of the line; 3. the marked cells' union as
 * polygons: their indicator at the cell centres, contoured at ½ without smoothing, runs exactly
 * along the cell edges and the frame. Exact along every scanline; between lines a patch always covers its gap except a gap that
 * crosses no lattice line at all (smaller than one lattice cell). The patches overlap their
 * neighbouring regions by at most a lattice cell.
 */
import { contours } from 'd3-contour';
import type { GridGeometry } from './contour.js';
import { signedArea } from './regions.js';

export type Polygon = [number, number][][];

/** Lattice cells per axis. */
export const LATTICE = 800;

export function uncoveredPolygons(g: Pick<GridGeometry, 'x' | 'y'>, covered: Polygon[], M = LATTICE, tiny = 1e-6): Polygon[] {
  const mark = new Uint8Array(M * M);
  let any = false;
  // Step 2: rows (lines y = const, axis 1) then columns (x = const, axis 0).
  for (const axis of [1, 0] as const) {
    const along = axis === 1 ? g.x : g.y;
    const across = axis === 1 ? g.y : g.x;
    const span = along[1] - along[0];
    for (let j = 0; j <= M; j++) {
      // The frame lines nudged inward so that edges lying on the frame are not half-counted.
      const c = across[0] + ((across[1] - across[0]) * j) / M + (j === 0 ? 1 : j === M ? -1 : 0) * 1e-9 * (across[1] - across[0]);
      for (const [a, b] of openStretches(covered, axis, c, along, tiny * span)) {
        const i0 = Math.max(0, Math.floor(((a - along[0]) / span) * M));
        const i1 = Math.min(M - 1, Math.floor(((b - along[0]) / span) * M));
        for (const jj of [j - 1, j]) {
          if (jj < 0 || jj >= M) continue;
          for (let i = i0; i <= i1; i++) mark[axis === 1 ? i + jj * M : jj + i * M] = 1;
          any = true;
        }
      }
    }
  }
  if (!any) return [];
  // Step 3: the marked cells' union.
  const c = contours().size([M, M]).thresholds([0.5]).smooth(false)(Array.from(mark));
  // d3-contour puts cell k's value at k + ½; unsmoothed, the ½ level runs along integer lines, the cell edges.
  const X = (u: number) => g.x[0] + ((g.x[1] - g.x[0]) * Math.min(M, Math.max(0, u))) / M;
  const Y = (v: number) => g.y[0] + ((g.y[1] - g.y[0]) * Math.min(M, Math.max(0, v))) / M;
  return (c[0]?.coordinates ?? []).map((poly) =>
    poly.map((ring, r) => {
      const pts = ring.slice(0, -1).map(([u, v]) => [X(u), Y(v)] as [number, number]);
      const a = signedArea(pts);
      if ((r === 0 && a < 0) || (r > 0 && a > 0)) pts.reverse();
      return pts;
    }),
  );
}

/** Stretches of the line {coordinate `axis` = c} within `range` that no polygon covers (even–odd per polygon). */
function openStretches(covered: Polygon[], axis: 0 | 1, c: number, range: [number, number], tiny: number): [number, number][] {
  const o = 1 - axis;
  const inside: [number, number][] = [];
  const cuts: number[] = [];
  for (const poly of covered) {
    cuts.length = 0;
    for (const ring of poly) {
      for (let a = 0, b = ring.length - 1; a < ring.length; b = a++) {
        const pa = ring[a];
        const pb = ring[b];
        if (pa[axis] > c !== pb[axis] > c) cuts.push(pa[o] + ((c - pa[axis]) * (pb[o] - pa[o])) / (pb[axis] - pa[axis]));
      }
    }
    cuts.sort((p, q) => p - q);
    for (let k = 0; k + 1 < cuts.length; k += 2) inside.push([cuts[k], cuts[k + 1]]);
  }
  inside.sort((p, q) => p[0] - q[0]);
  const open: [number, number][] = [];
  let reach = range[0];
  for (const [a, b] of inside) {
    if (a - reach > tiny) open.push([reach, a]);
    reach = Math.max(reach, b);
  }
  if (range[1] - reach > tiny) open.push([reach, range[1]]);
  return open;
}

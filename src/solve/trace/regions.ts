/**
 * Regions and boundaries of a TraceField from a grid sample. Steps: 0. per node the best and
 * second-best scores, per label the window of nodes where its margin can be ≥ 0 (one-node margin);
 * 1. for each label present, its margin field (score minus the best other score; −1 where
 * undetermined) over its window; 2. marching squares on it at 0 over the window only
 * (contourRingsWindow: the same rings as the whole grid, at a cost proportional to the region's
 * bounding box rather than the grid); 3. every crossing refined on its grid segment with the point solver
 * (refine.ts) and its neighbour label read just across; 4. rings oriented (outer counter-clockwise,
 * holes clockwise) with their area; 5. boundary polylines: maximal runs of consecutive refined
 * vertices of a ring that share the same neighbour; 6. each pair's boundary taken from the side
 * whose rings give it in fewer pieces (both sides refine onto the same equal-score curve; a region
 * thinner than a cell shows on the grid as islands, while its neighbour's ring runs unbroken along
 * it), ties to the lower label.
 */
import { argmax, marginOf, type TraceField } from './field.js';
import { contourRings, contourRingsWindow, type ContourVertex, type NodeWindow } from './contour.js';
import { gridEdge, type GridSample } from './grid.js';
import { refineCrossing } from './refine.js';

export interface TracedRegion {
  label: number;
  /** Polygons: outer ring then holes, [x, y] vertices, not closed. */
  polygons: [number, number][][][];
  area: number;
}

export interface TracedBoundary {
  between: [number, number];
  points: [number, number][];
}

export interface TraceOptions {
  /** Stop refining when the bracket is shorter than this fraction of a grid cell. */
  tolT: number;
}

export const TRACE_DEFAULTS: TraceOptions = { tolT: 1e-8 };

export function traceRegions<S>(field: TraceField<S>, g: GridSample<S>, opt: TraceOptions = TRACE_DEFAULTS): { regions: TracedRegion[]; boundaries: TracedBoundary[] } {
  const L = field.labels;
  const n = g.nx * g.ny;
  const present = [...new Set(g.label)].filter((k) => k >= 0).sort((a, b) => a - b);
  const sc = new Float64Array(L);
  const regions: TracedRegion[] = [];
  const sides = new Map<string, Map<number, TracedBoundary[]>>();
  // Step 0 (shared by every label): the best and second-best score per node, so that the margin of
  // label f is s_f − best, or best − second where f is the best (the same numbers as marginOf, in
  // O(n·L) for all labels instead of O(n·L²)).
  const best = new Int32Array(n);
  const top = new Float64Array(n);
  const second = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let b = -1;
    let v1 = -Infinity;
    let v2 = -Infinity;
    for (let l = 0; l < L; l++) {
      const v = g.scores[k * L + l];
      if (v > v1) {
        v2 = v1;
        v1 = v;
        b = l;
      } else if (v > v2) v2 = v;
    }
    best[k] = b;
    top[k] = v1;
    second[k] = v2;
  }
  const windows = marginWindows(g, L, best, top, second);
  // One margin buffer for all labels: only each label's window is written and read.
  const m = new Float64Array(n);
  for (const f of present) {
    // Step 1: margin field, in the window of the nodes where it is ≥ 0 (plus a one-node margin);
    // everywhere else it is < 0, so contouring the window gives the rings of the whole grid.
    const win = windows[f];
    const winW = win.i1 - win.i0 + 1;
    const mw = new Float64Array(winW * (win.j1 - win.j0 + 1));
    for (let j = win.j0; j <= win.j1; j++) {
      for (let i = win.i0; i <= win.i1; i++) {
        const k = i + j * g.nx;
        m[k] = g.label[k] < 0 ? -1 : best[k] === f ? top[k] - second[k] : g.scores[k * L + f] - top[k];
        mw[i - win.i0 + (j - win.j0) * winW] = m[k];
      }
    }
    // Steps 2–3: contour and refine.
    const marginAt = (x: number, y: number, warm: S) => {
      const s = field.solve(x, y, warm);
      return field.scores(s, sc) ? marginOf(sc, f) : -1;
    };
    const polys = contourRingsWindow(g, win, mw, 0).map((poly) =>
      poly.map((ring) => ring.map((v) => refineVertex(field, g, f, v, m, marginAt, sc, opt))),
    );
    // Step 4: orientation and area.
    let area = 0;
    const polygons = polys.map((poly) =>
      poly.map((ring, r) => {
        const pts = dedupe(ring.map((v) => [v.x, v.y] as [number, number]));
        const a = signedArea(pts);
        if ((r === 0 && a < 0) || (r > 0 && a > 0)) pts.reverse();
        area += r === 0 ? Math.abs(a) : -Math.abs(a);
        return pts;
      }),
    );
    regions.push({ label: f, polygons, area });
    // Step 5: boundary runs.
    for (const poly of polys) {
      for (const ring of poly) {
        for (const b of runs(ring, f)) {
          const key = b.between.join('/');
          if (!sides.has(key)) sides.set(key, new Map());
          const side = sides.get(key)!;
          if (!side.has(f)) side.set(f, []);
          side.get(f)!.push(b);
        }
      }
    }
  }
  return { regions, boundaries: pickSides(sides) };
}

/** Step 0's windows: per label, the bounding box of the nodes where its margin can be ≥ 0 (it is
 *  the best there, or ties with the best), grown by one node and clipped to the grid. Labels with
 *  no such node get an empty-box window (never contoured: they are not present). */
function marginWindows<S>(g: GridSample<S>, L: number, best: Int32Array, top: Float64Array, second: Float64Array): NodeWindow[] {
  const win: NodeWindow[] = Array.from({ length: L }, () => ({ i0: g.nx, j0: g.ny, i1: -1, j1: -1 }));
  const grow = (f: number, i: number, j: number) => {
    const w = win[f];
    if (i < w.i0) w.i0 = i;
    if (i > w.i1) w.i1 = i;
    if (j < w.j0) w.j0 = j;
    if (j > w.j1) w.j1 = j;
  };
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      const k = i + j * g.nx;
      if (g.label[k] < 0) continue;
      if (best[k] >= 0) grow(best[k], i, j);
      // Another label ties with the best only where the second-best score reaches the top.
      if (second[k] - top[k] >= 0) for (let l = 0; l < L; l++) if (l !== best[k] && g.scores[k * L + l] - top[k] >= 0) grow(l, i, j);
    }
  }
  for (const w of win) {
    if (w.i1 < 0) continue;
    w.i0 = Math.max(0, w.i0 - 1);
    w.j0 = Math.max(0, w.j0 - 1);
    w.i1 = Math.min(g.nx - 1, w.i1 + 1);
    w.j1 = Math.min(g.ny - 1, w.j1 + 1);
  }
  return win;
}

/** Step 6: per pair (in order of first appearance), the runs of the side with fewest pieces. */
function pickSides(sides: Map<string, Map<number, TracedBoundary[]>>): TracedBoundary[] {
  const out: TracedBoundary[] = [];
  for (const side of sides.values()) {
    const [lo, hi] = [...side.keys()].sort((a, b) => a - b);
    const a = side.get(lo)!;
    const b = hi === undefined ? undefined : side.get(hi)!;
    out.push(...(b && b.length < a.length ? b : a));
  }
  return out;
}

interface RefinedVertex { x: number; y: number; nb: number }

function refineVertex<S>(field: TraceField<S>, g: GridSample<S>, f: number, v: ContourVertex, m: Float64Array, marginAt: (x: number, y: number, w: S) => number, sc: Float64Array, opt: TraceOptions): RefinedVertex {
  if (v.frame || v.a === undefined) return { x: v.x, y: v.y, nb: -2 };
  const a = v.a;
  const b = v.b!;
  const { xa, ya, xb, yb, warm } = gridEdge(g, a, b);
  const at = (t: number): [number, number] => [xa + (xb - xa) * t, ya + (yb - ya) * t];
  const c = refineCrossing((t) => marginAt(...at(t), warm), m[a], m[b], opt.tolT);
  const [x, y] = at(c.t);
  // The neighbour: the label just across (scores may jump there, e.g. two solids swapping); where a
  // grid node lies exactly on the boundary that is f again, and the best other label at the
  // crossing (which ties with f there) is taken instead.
  const [xo, yo] = at(c.tOut);
  if (!field.scores(field.solve(xo, yo, warm), sc)) return { x, y, nb: -1 };
  const across = argmax(sc);
  if (across !== f) return { x, y, nb: across };
  if (!field.scores(field.solve(x, y, warm), sc)) return { x, y, nb: -1 };
  sc[f] = -Infinity;
  return { x, y, nb: argmax(sc) };
}

function runs(ring: RefinedVertex[], f: number): TracedBoundary[] {
  const out: TracedBoundary[] = [];
  const N = ring.length;
  // Start after a break so that cyclic runs are not split.
  let start = ring.findIndex((v, k) => v.nb !== ring[(k + N - 1) % N].nb || v.nb < 0);
  if (start < 0) start = 0;
  let cur: RefinedVertex[] = [];
  const flush = () => {
    const nb = cur[0]?.nb;
    if (cur.length >= 2 && nb !== f) out.push({ between: nb > f ? [f, nb] : [nb, f], points: cur.map((v) => [v.x, v.y]) });
    cur = [];
  };
  for (let k = 0; k < N; k++) {
    const v = ring[(start + k) % N];
    if (v.nb < 0) {
      flush();
      continue;
    }
    if (cur.length && cur[0].nb !== v.nb) flush();
    cur.push(v);
  }
  flush();
  return out;
}

export function dedupe(pts: [number, number][]): [number, number][] {
  const out: [number, number][] = [];
  for (const p of pts) {
    const q = out[out.length - 1];
    if (!q || Math.abs(q[0] - p[0]) > 1e-12 || Math.abs(q[1] - p[1]) > 1e-12) out.push(p);
  }
  while (out.length > 1 && Math.abs(out[0][0] - out[out.length - 1][0]) < 1e-12 && Math.abs(out[0][1] - out[out.length - 1][1]) < 1e-12) out.pop();
  return out;
}

/** Shoelace area, positive counter-clockwise. */
export function signedArea(pts: [number, number][]): number {
  let s = 0;
  for (let k = 0; k < pts.length; k++) {
    const [x1, y1] = pts[k];
    const [x2, y2] = pts[(k + 1) % pts.length];
    s += x1 * y2 - x2 * y1;
  }
  return 0.5 * s;
}

/** Polygons (grid resolution) round the nodes where the field could not be solved (label −1). */
export function undeterminedPolygons<S>(g: GridSample<S>): [number, number][][][] {
  const m = Float64Array.from(g.label, (l) => (l < 0 ? 1 : -1));
  if (!m.some((v) => v > 0)) return [];
  return contourRings(g, m, 0).map((poly) => poly.map((ring, r) => {
    const pts = dedupe(ring.map((v) => [v.x, v.y] as [number, number]));
    const a = signedArea(pts);
    if ((r === 0 && a < 0) || (r > 0 && a > 0)) pts.reverse();
    return pts;
  }));
}

/**
 * Triple points of a TraceField and the boundary ends that meet there. Boundary runs stop short of a
 * triple point (the ring's vertices there border a third label). Steps: 1. pair the ends of
 * boundaries whose label pairs share one label and whose ends lie within three cells; 2. solve
 * s_f = s_g = s_h for the three labels by damped Newton in (x, y) with a finite-difference Jacobian,
 * from the ends' midpoint or either end, accepted when converged with no fourth label above; where
 * the scores jump (two solids of one component swap at a line, their shares are discontinuous)
 * Newton cannot converge, and the junction is the intersection of the two ends' last segments
 * (refined vertices; error of order curvature × cell²), accepted only when the point solver finds
 * exactly the three labels round it; 3. extend the two ends to it. Otherwise the ends stay as they
 * are (a gap of a cell or two, e.g. at the tip of a wedge thinner than a cell), never a wrong
 * junction.
 */
import { argmax, type TraceField } from './field.js';
import type { GridSample } from './grid.js';
import type { TracedBoundary } from './regions.js';

export interface TracedTriple {
  labels: [number, number, number];
  x: number;
  y: number;
}

export function joinTriplePoints<S>(field: TraceField<S>, g: GridSample<S>, boundaries: TracedBoundary[]): TracedTriple[] {
  const cx = (g.x[1] - g.x[0]) / (g.nx - 1);
  const cy = (g.y[1] - g.y[0]) / (g.ny - 1);
  const near = (p: [number, number], q: [number, number], cells: number) => Math.abs(p[0] - q[0]) / cx <= cells && Math.abs(p[1] - q[1]) / cy <= cells;
  const ends: { b: TracedBoundary; first: boolean; p: [number, number] }[] = [];
  for (const b of boundaries) {
    ends.push({ b, first: true, p: b.points[0] }, { b, first: false, p: b.points[b.points.length - 1] });
  }
  const triples: TracedTriple[] = [];
  const sc = new Float64Array(field.labels);
  for (let i = 0; i < ends.length; i++) {
    for (let j = i + 1; j < ends.length; j++) {
      const A = ends[i];
      const B = ends[j];
      if (A.b === B.b || !near(A.p, B.p, 3)) continue;
      const set = [...new Set([...A.b.between, ...B.b.between])].sort((a, b) => a - b);
      if (set.length !== 3) continue;
      const start: [number, number] = [(A.p[0] + B.p[0]) / 2, (A.p[1] + B.p[1]) / 2];
      let t = triples.find((q) => q.labels.join() === set.join() && near([q.x, q.y], start, 2));
      if (!t) {
        let at: [number, number] | null = null;
        for (const s0 of [start, A.p, B.p]) {
          at = solveTriple(field, g, set as [number, number, number], s0, cx, cy, sc);
          if (at && near(at, A.p, 3) && near(at, B.p, 3)) break;
          at = null;
        }
        if (!at) {
          at = endIntersection(A, B);
          if (!at || !near(at, A.p, 3) || !near(at, B.p, 3) || !surrounded(field, g, set, at, cx, cy, sc)) continue;
        }
        t = { labels: set as [number, number, number], x: at[0], y: at[1] };
        triples.push(t);
      }
      for (const e of [A, B]) extend(e, t);
    }
  }
  return triples;
}

/** Check: the three labels, and only they, predominate on a small circle (a tenth of a cell) round the point. */
function surrounded<S>(field: TraceField<S>, g: GridSample<S>, set: number[], at: [number, number], cx: number, cy: number, sc: Float64Array): boolean {
  const i = Math.max(0, Math.min(g.nx - 1, Math.round((at[0] - g.x[0]) / cx)));
  const j = Math.max(0, Math.min(g.ny - 1, Math.round((at[1] - g.y[0]) / cy)));
  const warm = g.states[i + j * g.nx];
  const seen = new Set<number>();
  for (let k = 0; k < 16; k++) {
    const a = (2 * Math.PI * k) / 16;
    if (!field.scores(field.solve(at[0] + 0.1 * cx * Math.cos(a), at[1] + 0.1 * cy * Math.sin(a), warm), sc)) return false;
    seen.add(argmax(sc));
  }
  return seen.size === 3 && set.every((l) => seen.has(l));
}

/** Intersection of the lines through the last two points of each end (null when parallel). */
function endIntersection(A: { b: TracedBoundary; first: boolean }, B: { b: TracedBoundary; first: boolean }): [number, number] | null {
  const seg = (e: { b: TracedBoundary; first: boolean }) => {
    const p = e.b.points;
    return e.first ? [p[1] ?? p[0], p[0]] : [p[p.length - 2] ?? p[p.length - 1], p[p.length - 1]];
  };
  const [[x1, y1], [x2, y2]] = seg(A);
  const [[x3, y3], [x4, y4]] = seg(B);
  const d = (x1 - x2) * (y3 - y4) - (y1 - y2) * (x3 - x4);
  if (Math.abs(d) < 1e-15) return null;
  const t = ((x1 - x3) * (y3 - y4) - (y1 - y3) * (x3 - x4)) / d;
  return [x1 + t * (x2 - x1), y1 + t * (y2 - y1)];
}

function extend(e: { b: TracedBoundary; first: boolean }, t: TracedTriple): void {
  const pts = e.b.points;
  const end = e.first ? pts[0] : pts[pts.length - 1];
  if (end[0] === t.x && end[1] === t.y) return;
  if (e.first) pts.unshift([t.x, t.y]);
  else pts.push([t.x, t.y]);
}

/** Step 2: Newton on F = (s_f − s_g, s_f − s_h) = 0. */
function solveTriple<S>(field: TraceField<S>, g: GridSample<S>, [f, a, b]: [number, number, number], start: [number, number], cx: number, cy: number, sc: Float64Array): [number, number] | null {
  const i = Math.max(0, Math.min(g.nx - 1, Math.round((start[0] - g.x[0]) / cx)));
  const j = Math.max(0, Math.min(g.ny - 1, Math.round((start[1] - g.y[0]) / cy)));
  const warm = g.states[i + j * g.nx];
  const F = (x: number, y: number): [number, number] | null => {
    if (!field.scores(field.solve(x, y, warm), sc)) return null;
    return [sc[f] - sc[a], sc[f] - sc[b]];
  };
  let [x, y] = start;
  const hx = cx * 1e-4;
  const hy = cy * 1e-4;
  for (let k = 0; k < 20; k++) {
    const v = F(x, y);
    if (!v) return null;
    if (Math.abs(v[0]) < 1e-10 && Math.abs(v[1]) < 1e-10) return topThree(sc, f) ? [x, y] : null;
    const vx = F(x + hx, y);
    const vy = F(x, y + hy);
    if (!vx || !vy) return null;
    const j11 = (vx[0] - v[0]) / hx;
    const j12 = (vy[0] - v[0]) / hy;
    const j21 = (vx[1] - v[1]) / hx;
    const j22 = (vy[1] - v[1]) / hy;
    const det = j11 * j22 - j12 * j21;
    if (!(Math.abs(det) > 0)) return null;
    // Damped: at most half a cell per step, so that the iterate stays where the scores are smooth.
    let dx = -(v[0] * j22 - v[1] * j12) / det;
    let dy = -(j11 * v[1] - j21 * v[0]) / det;
    const big = Math.max(Math.abs(dx) / cx, Math.abs(dy) / cy);
    if (big > 0.5) {
      dx *= 0.5 / big;
      dy *= 0.5 / big;
    }
    x += dx;
    y += dy;
    if (!Number.isFinite(x) || !Number.isFinite(y) || x < g.x[0] || x > g.x[1] || y < g.y[0] || y > g.y[1]) return null;
  }
  const v = F(x, y);
  return v && Math.abs(v[0]) < 1e-8 && Math.abs(v[1]) < 1e-8 && topThree(sc, f) ? [x, y] : null;
}

/** No other label beats the (equal) three at the point: at most two scores exceed s_f. */
function topThree(sc: Float64Array, f: number): boolean {
  let above = 0;
  for (let k = 0; k < sc.length; k++) if (k !== f && sc[k] > sc[f] + 1e-9) above++;
  return above === 0;
}

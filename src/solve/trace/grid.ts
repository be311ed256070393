/**
 * Sample a TraceField on a regular grid, warm-starting each node from its left neighbour (the first
 * node of a row from the node below). Nodes at x_i = x0 + i·(x1 − x0)/(nx − 1), likewise y.
 * Row-major with x fastest (index i + j·nx), the layout d3-contour expects.
 */
import { argmax, type TraceField } from './field.js';

export interface GridSample<S> {
  nx: number;
  ny: number;
  x: [number, number];
  y: [number, number];
  /** Predominant label per node; −1 where undetermined. */
  label: Int32Array;
  /** Scores, node-major: scores[(i + j·nx)·labels + k]. */
  scores: Float64Array;
  /** field.value per node (NaN where undetermined or no value function). */
  value: Float64Array;
  states: S[];
  failed: number;
}

export function gridX(g: { nx: number; x: [number, number] }, i: number): number {
  return g.x[0] + ((g.x[1] - g.x[0]) * i) / (g.nx - 1);
}
export function gridY(g: { ny: number; y: [number, number] }, j: number): number {
  return g.y[0] + ((g.y[1] - g.y[0]) * j) / (g.ny - 1);
}

/** A grid edge a–b crossed by a contour: both node positions and the warm start (the labelled end's state). */
export interface GridEdge<S> {
  xa: number;
  ya: number;
  xb: number;
  yb: number;
  warm: S;
}

/** The edge between node indices a and b (i + j·nx) of `g`. */
export function gridEdge<S>(g: GridSample<S>, a: number, b: number): GridEdge<S> {
  return {
    xa: gridX(g, a % g.nx),
    ya: gridY(g, Math.floor(a / g.nx)),
    xb: gridX(g, b % g.nx),
    yb: gridY(g, Math.floor(b / g.nx)),
    warm: g.label[a] >= 0 ? g.states[a] : g.states[b],
  };
}

export function sampleGrid<S>(field: TraceField<S>, x: [number, number], y: [number, number], nx: number, ny: number): GridSample<S> {
  const L = field.labels;
  const label = new Int32Array(nx * ny);
  const scores = new Float64Array(nx * ny * L);
  const value = new Float64Array(nx * ny);
  const states: S[] = new Array(nx * ny);
  const g = { nx, ny, x, y };
  const out = new Float64Array(L);
  let failed = 0;
  for (let j = 0; j < ny; j++) {
    const E = gridY(g, j);
    for (let i = 0; i < nx; i++) {
      const warm = i > 0 ? states[i - 1 + j * nx] : j > 0 ? states[(j - 1) * nx] : undefined;
      const s = field.solve(gridX(g, i), E, warm);
      const n = i + j * nx;
      states[n] = s;
      if (field.scores(s, out)) {
        scores.set(out, n * L);
        label[n] = argmax(out);
      } else {
        label[n] = -1;
        failed++;
      }
      value[n] = field.value && label[n] >= 0 ? field.value(s) : NaN;
    }
  }
  return { nx, ny, x, y, label, scores, value, states, failed };
}

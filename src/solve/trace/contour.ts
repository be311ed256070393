/**
 * Marching squares on a node field with d3-contour, mapped back to the domain. d3-contour puts node
 * (i, j) at (i + 0.5, j + 0.5) and closes rings half a cell outside the grid; both are undone here:
 * node coordinates are raw − 0.5, and vertices outside the node range are frame vertices, clamped
 * onto the domain edge. Every other vertex lies on the segment between two neighbouring nodes
 * (linear interpolation), recorded so that it can be refined with the point solver.
 */
import { contours } from 'd3-contour';
import { gridX, gridY } from './grid.js';

export interface ContourVertex {
  x: number;
  y: number;
  /** On the domain frame (not a crossing): not refined, not part of a boundary. */
  frame: boolean;
  /** Crossing on the segment from node a to node b (indices i + j·nx), at fraction t. */
  a?: number;
  b?: number;
  t?: number;
}

export interface GridGeometry {
  nx: number;
  ny: number;
  x: [number, number];
  y: [number, number];
}

/** Rings (polygons of rings: outer, holes) of { v ≥ threshold } over the grid; open rings (no repeated vertex). */
export function contourRings(g: GridGeometry, values: ArrayLike<number>, threshold: number): ContourVertex[][][] {
  const c = contours().size([g.nx, g.ny]).thresholds([threshold]).smooth(true)(Array.from(values));
  const polys = c[0]?.coordinates ?? [];
  return polys.map((poly) => poly.map((ring) => ring.slice(0, -1).map(([X, Y]) => vertexAt(g, X - 0.5, Y - 0.5))));
}

/** A window of grid nodes [i0, i1] × [j0, j1] (inclusive). */
export interface NodeWindow {
  i0: number;
  j0: number;
  i1: number;
  j1: number;
}

/**
 * contourRings restricted to a window of the grid, with the same result as over the whole grid
 * when every node outside the window is below the threshold and the window has a one-node margin
 * below it wherever it stops short of the grid's edge (then marching squares meets the same
 * crossings in the same row-major order, so the rings come out with the same vertices, start
 * points and order). `values` holds the window only, row-major (index (i − i0) + (j − j0)·width).
 * d3-contour smooths in window coordinates; each smoothed coordinate is recomputed here in grid
 * coordinates with d3's own formula (x + d − 0.5, d = (threshold − v0)/(v1 − v0)), so the
 * floating-point values equal those of the whole-grid pass bit for bit.
 */
export function contourRingsWindow(g: GridGeometry, win: NodeWindow, values: ArrayLike<number>, threshold: number): ContourVertex[][][] {
  const w = win.i1 - win.i0 + 1;
  const h = win.j1 - win.j0 + 1;
  const c = contours().size([w, h]).thresholds([threshold]).smooth(true)(Array.from(values));
  const polys = c[0]?.coordinates ?? [];
  const at = (i: number, j: number) => valid(values[j * w + i]);
  const toGrid = (X: number, Y: number): [number, number] => {
    if (!Number.isInteger(2 * X)) {
      // X was smoothed on the vertical cell edge at raw column round(X), row floor(Y).
      const xt = Math.round(X);
      const yt = Math.floor(Y);
      return [smooth1(xt + win.i0, at(xt - 1, yt), at(xt, yt), threshold), Y + win.j0];
    }
    if (!Number.isInteger(2 * Y)) {
      const xt = Math.floor(X);
      const yt = Math.round(Y);
      return [X + win.i0, smooth1(yt + win.j0, at(xt, yt - 1), at(xt, yt), threshold)];
    }
    return [X + win.i0, Y + win.j0];
  };
  return polys.map((poly) =>
    poly.map((ring) =>
      ring.slice(0, -1).map(([X, Y]) => {
        const [gx, gy] = toGrid(X, Y);
        return vertexAt(g, gx - 0.5, gy - 0.5);
      }),
    ),
  );
}

/** d3-contour's reading of a value while smoothing: invalid values are −∞. */
function valid(v: number | undefined): number {
  return v == null || Number.isNaN(+v) ? -Infinity : +v;
}

/** d3-contour's linear smoothing of one coordinate between values v0 and v1 (same arithmetic). */
function smooth1(x: number, v0: number, v1: number, value: number): number {
  const a = value - v0;
  const b = v1 - v0;
  const d = Number.isFinite(a) || Number.isFinite(b) ? a / b : Math.sign(a) / Math.sign(b);
  return Number.isNaN(d) ? x : x + d - 0.5;
}

function vertexAt(g: GridGeometry, ix: number, iy: number): ContourVertex {
  const eps = 1e-9;
  if (ix < -eps || ix > g.nx - 1 + eps || iy < -eps || iy > g.ny - 1 + eps) {
    const cx = Math.min(g.nx - 1, Math.max(0, ix));
    const cy = Math.min(g.ny - 1, Math.max(0, iy));
    return { x: lerp(g.x, cx / (g.nx - 1)), y: lerp(g.y, cy / (g.ny - 1)), frame: true };
  }
  const ry = Math.round(iy);
  if (Math.abs(iy - ry) < 1e-7) {
    const i0 = Math.min(g.nx - 2, Math.max(0, Math.floor(ix)));
    return { x: lerp(g.x, ix / (g.nx - 1)), y: gridY(g, ry), frame: false, a: i0 + ry * g.nx, b: i0 + 1 + ry * g.nx, t: ix - i0 };
  }
  const rx = Math.round(ix);
  const j0 = Math.min(g.ny - 2, Math.max(0, Math.floor(iy)));
  return { x: gridX(g, rx), y: lerp(g.y, iy / (g.ny - 1)), frame: false, a: rx + j0 * g.nx, b: rx + (j0 + 1) * g.nx, t: iy - j0 };
}

const lerp = (r: [number, number], t: number) => r[0] + (r[1] - r[0]) * t;

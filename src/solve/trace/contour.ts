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

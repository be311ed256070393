/**
 * contourRingsWindow (src/solve/trace/contour.ts) is an optimisation of contourRings: over a window
 * holding every node ≥ the threshold plus a one-node margin it must give the very same rings — same
 * vertices (bit for bit), start points, order and holes — as the whole-grid pass. Checked on random
 * blob fields with islands, holes, exact zeros (ties) and regions touching the grid's edges.
 */
import { describe, expect, it } from 'vitest';
import { contourRings, contourRingsWindow, type NodeWindow } from '../../src/solve/trace/contour.js';

function rng(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (1664525 * s + 1013904223) >>> 0) / 2 ** 32);
}

/** A field of a few bumps minus a level, some nodes set to exactly 0 (on the threshold). */
function blobs(nx: number, ny: number, seed: number): number[] {
  const r = rng(seed);
  const bumps = Array.from({ length: 1 + Math.floor(r() * 4) }, () => ({ x: r() * nx, y: r() * ny, s: 1 + r() * nx * 0.2, a: r() < 0.3 ? -0.6 : 1 }));
  const v: number[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      let f = -0.45;
      for (const b of bumps) f += b.a * Math.exp(-((i - b.x) ** 2 + (j - b.y) ** 2) / (2 * b.s * b.s));
      v.push(r() < 0.02 ? 0 : f);
    }
  }
  return v;
}

/** The window of the nodes ≥ 0 grown by one node (as traceRegions builds it), or null if none. */
function windowOf(v: number[], nx: number, ny: number): NodeWindow | null {
  let w: NodeWindow | null = null;
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      if (!(v[i + j * nx] >= 0)) continue;
      if (!w) w = { i0: i, j0: j, i1: i, j1: j };
      w = { i0: Math.min(w.i0, i), j0: Math.min(w.j0, j), i1: Math.max(w.i1, i), j1: Math.max(w.j1, j) };
    }
  }
  return w && { i0: Math.max(0, w.i0 - 1), j0: Math.max(0, w.j0 - 1), i1: Math.min(nx - 1, w.i1 + 1), j1: Math.min(ny - 1, w.j1 + 1) };
}

describe('contourRingsWindow = contourRings where the field is below the threshold outside the window', () => {
  it('60 random fields (27×19 and 40×40 nodes): identical rings', () => {
    let compared = 0;
    for (let seed = 1; seed <= 60; seed++) {
      const [nx, ny] = seed % 2 ? [27, 19] : [40, 40];
      const g = { nx, ny, x: [2, 12] as [number, number], y: [-1.1, 0.9] as [number, number] };
      const v = blobs(nx, ny, seed);
      const w = windowOf(v, nx, ny);
      if (!w) continue;
      const sub: number[] = [];
      for (let j = w.j0; j <= w.j1; j++) for (let i = w.i0; i <= w.i1; i++) sub.push(v[i + j * nx]);
      const full = contourRings(g, v, 0);
      expect(contourRingsWindow(g, w, sub, 0)).toEqual(full);
      if (w.i1 - w.i0 + 1 < nx || w.j1 - w.j0 + 1 < ny) compared++;
    }
    // The check is not vacuous: most fields give a window smaller than the grid.
    expect(compared).toBeGreaterThan(20);
  });

  it('a one-node island in the middle of a 9×7 grid: a window of 3×3 nodes gives the same diamond', () => {
    const v = new Array(63).fill(-1);
    v[4 + 3 * 9] = 0.25;
    const g = { nx: 9, ny: 7, x: [0, 8] as [number, number], y: [0, 6] as [number, number] };
    const sub = [-1, -1, -1, -1, 0.25, -1, -1, -1, -1];
    const got = contourRingsWindow(g, { i0: 3, j0: 2, i1: 5, j1: 4 }, sub, 0);
    expect(got).toEqual(contourRings(g, v, 0));
    // Crossings at 0.2 of a cell from the node (0.25 / 1.25) on its four edges.
    const xs = got[0][0].map((p) => [p.x, p.y]);
    expect(xs).toHaveLength(4);
    for (const [x, y] of xs) expect(Math.abs(x - 4) + Math.abs(y - 3)).toBeCloseTo(0.2, 12);
  });
});

/**
 * trace/gaps.ts on hand-made polygons (pure geometry, values worked by hand): a tiling leaves
 * nothing; a wedge-shaped gap between two regions (the shape left near a triple point) is covered
 * to its tip, by patches no wider than the gap plus a lattice cell on each side.
 */
import { describe, expect, test } from 'vitest';
import { signedArea } from '../../src/solve/trace/regions.js';
import { type Polygon, uncoveredPolygons } from '../../src/solve/trace/gaps.js';

const dom = { x: [0, 14] as [number, number], y: [-2, 2] as [number, number] };
const area = (ps: Polygon[]) => ps.reduce((s, p) => s + p.reduce((t, r, k) => t + (k ? -1 : 1) * Math.abs(signedArea(r)), 0), 0);
function inside(x: number, y: number, poly: Polygon): boolean {
  let c = false;
  for (const ring of poly) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i];
      const [xj, yj] = ring[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
    }
  }
  return c;
}

describe('uncoveredPolygons', () => {
  test('two regions that tile the domain along a slanted shared edge leave nothing', () => {
    const left: Polygon = [[[0, -2], [6, -2], [8, 2], [0, 2]]];
    const right: Polygon = [[[6, -2], [14, -2], [14, 2], [8, 2]]];
    expect(uncoveredPolygons(dom, [left, right])).toEqual([]);
  });

  test('a hole in a region is covered by its island, else reported', () => {
    const outer: Polygon = [[[0, -2], [14, -2], [14, 2], [0, 2]], [[5, -1], [5, 1], [9, 1], [9, -1]]];
    const island: Polygon = [[[5, -1], [9, -1], [9, 1], [5, 1]]];
    expect(uncoveredPolygons(dom, [outer, island])).toEqual([]);
    const hole = uncoveredPolygons(dom, [outer]);
    // The 4 × 2 hole, on a lattice of 14/800 by 4/800 cells: its area within one cell all round.
    expect(Math.abs(area(hole) - 8)).toBeLessThan(2 * (4 * 4 / 800 + 2 * 14 / 800));
  });

  test('a wedge gap thinner than any lattice cell near its tip is covered to the tip', () => {
    // The left region ends on the line x = 7 − 0.1·(y + 2)/4, the right one on x = 7: a wedge of
    // width 0.1 pH at y = 2 closing to nothing at y = −2 (area 0.1 · 4 / 2 = 0.2).
    const left: Polygon = [[[0, -2], [7, -2], [6.9, 2], [0, 2]]];
    const right: Polygon = [[[7, -2], [14, -2], [14, 2], [7, 2]]];
    const gaps = uncoveredPolygons(dom, [left, right]);
    expect(gaps.length).toBe(1);
    for (let k = 1; k < 400; k++) {
      const y = -2 + (4 * k) / 400;
      const x = 7 - (0.1 * (y + 2)) / 4 * 0.5; // the wedge's midline
      expect(inside(x, y, gaps[0]), `(${x}, ${y})`).toBe(true);
    }
    const a = area(gaps);
    expect(a).toBeGreaterThan(0.2);
    expect(a).toBeLessThan(0.2 + 2 * 4 * (14 / 800) + 0.01);
  });
});

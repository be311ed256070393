/**
 * The tracing machinery with fields of our own (no chemistry): boundaries of a known curve come out
 * on the curve, triple points where three labels meet, and nodes that cannot be solved are outlined
 * as undetermined, never silently given to a neighbour.
 */
import { describe, expect, test } from 'vitest';
import type { TraceField } from '../../src/solve/trace/field.js';
import { sampleGrid } from '../../src/solve/trace/grid.js';
import { joinTriplePoints } from '../../src/solve/trace/junctions.js';
import { traceRegions, undeterminedPolygons } from '../../src/solve/trace/regions.js';

type P = { x: number; y: number };
const field = (labels: number, score: (x: number, y: number, out: Float64Array) => boolean): TraceField<P> => ({
  labels,
  solve: (x, y) => ({ x, y }),
  scores: (s, out) => score(s.x, s.y, out),
});

describe('generic tracing', () => {
  test('a parabola y = x² between two labels: every boundary vertex on it within 1e-7', () => {
    const f = field(2, (x, y, out) => {
      out[0] = 0.5 + 0.2 * (y - x * x);
      out[1] = 1 - out[0];
      return true;
    });
    const g = sampleGrid(f, [-1, 1], [-0.5, 1.5], 41, 41);
    const t = traceRegions(f, g);
    expect(t.regions.map((r) => r.label)).toEqual([0, 1]);
    expect(t.boundaries.length).toBe(1);
    for (const [x, y] of t.boundaries[0].points) expect(Math.abs(y - x * x)).toBeLessThan(1e-7);
    // Area above the parabola within the box: 2·1.5 − (2/3) − ... = ∫(1.5 − x²)dx over [−1, 1] = 3 − 2/3.
    expect(t.regions[0].area).toBeCloseTo(3 - 2 / 3, 3);
  });
  test('three sectors meet at (0.3, 0.2): the triple point is found and the boundaries end there', () => {
    const f = field(3, (x, y, out) => {
      const a = Math.atan2(y - 0.2, x - 0.3);
      for (let k = 0; k < 3; k++) out[k] = Math.cos(a - (2 * Math.PI * k) / 3) * Math.hypot(x - 0.3, y - 0.2);
      return true;
    });
    const g = sampleGrid(f, [-1, 1], [-1, 1], 30, 30);
    const t = traceRegions(f, g);
    const triples = joinTriplePoints(f, g, t.boundaries);
    expect(triples.length).toBe(1);
    expect(triples[0].x).toBeCloseTo(0.3, 6);
    expect(triples[0].y).toBeCloseTo(0.2, 6);
    for (const b of t.boundaries) {
      const ends = [b.points[0], b.points[b.points.length - 1]];
      expect(ends.some(([x, y]) => x === triples[0].x && y === triples[0].y)).toBe(true);
    }
  });
  test('nodes that cannot be solved are outlined as undetermined and given no label', () => {
    const f = field(2, (x, y, out) => {
      if (x > 0.5) return false;
      out[0] = y;
      out[1] = -y;
      return true;
    });
    const g = sampleGrid(f, [0, 1], [-1, 1], 21, 21);
    expect(g.failed).toBe(21 * 10);
    const u = undeterminedPolygons(g);
    expect(u.length).toBe(1);
    const xs = u[0][0].map((p) => p[0]);
    expect(Math.min(...xs)).toBeGreaterThan(0.5);
    const t = traceRegions(f, g);
    for (const r of t.regions) for (const ring of r.polygons[0]) for (const [x] of ring) expect(x).toBeLessThanOrEqual(0.55);
  });
});

/**
 * Label layout on real computed diagrams (built-in data): every region labelled, upright labels in
 * tall narrow regions, leader lines that never cross each other or a label, and the fast
 * feasibility search agreeing with the full pole search. Axis ticks match d3-scale's.
 */
import fc from 'fast-check';
import { scaleLinear } from 'd3-scale';
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { linearTicks } from '../../src/render/axes.js';
import { rectPole } from '../../src/render/pole.js';
import { buildScene } from '../../src/render/scene.js';
import type { Point, ScenePath, SceneText } from '../../src/render/scene-types.js';
import { allItems } from './helpers.js';

const all = allItems;

function cross(p: Point, q: Point, r: Point, s: Point): boolean {
  const o = (a: Point, b: Point, c: Point) => (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]);
  return o(r, s, p) * o(r, s, q) < 0 && o(p, q, r) * o(p, q, s) < 0;
}

function segHitsBox(a: Point, b: Point, r: { x: number; y: number; w: number; h: number }): boolean {
  for (let i = 0; i <= 200; i++) {
    const x = a[0] + (i / 200) * (b[0] - a[0]);
    const y = a[1] + (i / 200) * (b[1] - a[1]);
    if (x > r.x && x < r.x + r.w && y > r.y && y < r.y + r.h) return true;
  }
  return false;
}

const systems: { name: string; data: Record<string, unknown> }[] = [
  { name: 'iron', data: { element: 'Fe', activity: 1e-6, E: [-1.2, 1.6] } },
  { name: 'copper', data: { element: 'Cu', activity: 1e-6, E: [-1.0, 1.6] } },
  { name: 'zinc', data: { element: 'Zn', activity: 1e-6, E: [-1.8, 1.4] } },
  { name: 'copper with sulfur', data: { element: 'Cu', ligands: { S: 1e-3 }, E: [-1.0, 1.2] } },
];

describe.each(systems)('labels on the $name diagram', ({ name, data }) => {
  const spec = readSpec(data, `${name}.yaml`);
  const c = compute(spec);
  for (const width of ['85', '170']) {
    it(`labels every region and keeps leaders clear (${width} mm)`, () => {
      const scene = buildScene(figureInput(c, figureSettings(spec, { width })));
      const items = all(scene);
      const labels = items.filter((t): t is SceneText => t.type === 'text' && t.role === 'region-label');
      const labelled = new Set(labels.map((t) => t.data!.species));
      expect([...labelled].sort()).toEqual(c.model.regions.map((r) => r.species).sort());
      for (const t of labels) expect(t.size).toBeGreaterThanOrEqual(6);
      const leaders = items.filter((p): p is ScenePath => p.type === 'path' && p.role === 'leader').map((p) => p.subpaths[0]!.points as [Point, Point]);
      for (let i = 0; i < leaders.length; i++)
        for (let j = i + 1; j < leaders.length; j++) expect(cross(...leaders[i]!, ...leaders[j]!), 'leaders cross').toBe(false);
      // No leader runs through a text box (unrotated texts carry their layout box).
      const boxes = items.filter((t): t is SceneText => t.type === 'text' && t.box !== undefined).map((t) => t.box!);
      for (const [a, b] of leaders) for (const box of boxes) expect(segHitsBox(a, b, box), 'leader crosses a label').toBe(false);
    });
  }
});

describe('upright labels', () => {
  it('turns the label of a tall narrow region to read upwards (zinc, 85 mm: ZnO₂²⁻ and HZnO₂⁻ strips)', () => {
    const spec = readSpec(systems[2]!.data, 'zinc.yaml');
    const scene = buildScene(figureInput(compute(spec), figureSettings(spec)));
    const up = all(scene).filter((t): t is SceneText => t.type === 'text' && t.role === 'region-label' && t.rotate === -90);
    expect(up.length).toBeGreaterThan(0);
    for (const t of up) expect(t.data!.placement).toBe('inside');
  });
});

describe('pole search', () => {
  const ring: Point[] = [
    [0, 0],
    [40, 0],
    [40, 6],
    [0, 6],
  ];
  it('agrees between the feasibility probe and the full search', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 10, noNaN: true }), fc.double({ min: 0.5, max: 5, noNaN: true }), (hx, hy) => {
        const full = rectPole([ring], [], hx, hy, 0.001).scale;
        const probe = rectPole([ring], [], hx, hy, { need: 1, precision: 0.03 }).scale;
        // Exact answer for a 40 × 6 box: min(20/hx, 3/hy).
        expect(full).toBeCloseTo(Math.min(20 / hx, 3 / hy), 2);
        if (full >= 1.04) expect(probe).toBeGreaterThanOrEqual(1);
        if (full < 0.999) expect(probe).toBeLessThan(1);
      }),
      { numRuns: 200 },
    );
  });
  it('prefers the middle of a band once the label has room to spare', () => {
    // A 40 × 6 band, label half-sizes 2 × 1: scale = min(3, x/2, (40 − x)/2) ≥ 1.5 for x ∈ [3, 37];
    // the most central such place is the centroid (20, 3).
    const p = rectPole([ring], [], 2, 1, { cap: 1.5 });
    expect(p.point[0]).toBeCloseTo(20, 0);
    expect(p.point[1]).toBeCloseTo(3, 1);
    expect(p.scale).toBeGreaterThanOrEqual(1.5 - 0.01);
  });
});

describe('axis ticks', () => {
  it('matches d3-scale linear ticks (steps of 1, 2, 5 × 10ⁿ)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ min: 1e-3, max: 2000, noNaN: true }), fc.integer({ min: 2, max: 20 }), (a, span, n) => {
        const b = a + span;
        expect(linearTicks(a, b, n)).toEqual(scaleLinear().domain([a, b]).ticks(n));
      }),
      { numRuns: 500 },
    );
  });
});

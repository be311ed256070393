import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clipPolyline, clipRing } from '../../src/render/clip.js';
import { insideRings, rectRing, scaledChebyshev, segmentHitsRect, simplifyCollinear } from '../../src/render/geometry.js';
import { boxSegments } from '../../src/render/labels.js';
import { rectPole } from '../../src/render/pole.js';
import type { Point } from '../../src/render/scene-types.js';
import { DEFAULT_FIGURE } from '../../src/render/options.js';
import { buildScene } from '../../src/render/scene.js';
import type { SceneItem, SceneText } from '../../src/render/scene-types.js';
import { iron } from './helpers.js';

describe('label geometry', () => {
  it('measures the scaled L∞ distance to a segment (worked by hand)', () => {
    // Point (0,0), segment x = 4 from y = −10 to 10, half-sizes (2, 1): the box reaches x = 4 at s = 2.
    expect(scaledChebyshev(0, 0, [4, -10], [4, 10], 2, 1)).toBeCloseTo(2, 12);
    // Segment y = 3 far to the side: (|x|/1, 3/1) → the vertical gap 3 limits at s = 3 for x ∈ [−3, 3].
    expect(scaledChebyshev(0, 0, [-1, 3], [1, 3], 1, 1)).toBeCloseTo(3, 12);
    // Diagonal segment from (2,0) to (0,2), unit half-sizes: closest in L∞ at (1,1) → 1.
    expect(scaledChebyshev(0, 0, [2, 0], [0, 2], 1, 1)).toBeCloseTo(1, 12);
  });

  it('finds the centre of a rectangle as the pole, with the fitting scale', () => {
    const ring: Point[] = [
      [0, 0],
      [10, 0],
      [10, 4],
      [0, 4],
    ];
    const p = rectPole([ring], [], 1, 1, 0.001);
    // Square labels: any centre with x ∈ [2, 8], y = 2 gives scale 2.
    expect(p.point[1]).toBeCloseTo(2, 2);
    expect(p.scale).toBeCloseTo(2, 2);
    // A 4:1 label (half-sizes 4, 1) fits best at the middle with scale 1.25 (10 / 8 wide limit vs 4 / 2 tall = 2).
    const q = rectPole([ring], [], 4, 1, 0.001);
    expect(q.point[0]).toBeCloseTo(5, 1);
    expect(q.scale).toBeCloseTo(1.25, 2);
  });

  it('keeps the pole out of a hole', () => {
    const outer: Point[] = [
      [0, 0],
      [20, 0],
      [20, 20],
      [0, 20],
    ];
    const hole: Point[] = [
      [5, 5],
      [5, 15],
      [15, 15],
      [15, 5],
    ];
    const p = rectPole([outer, hole], [], 1, 1, 0.001);
    expect(insideRings(p.point, [outer, hole])).toBe(true);
    expect(p.scale).toBeCloseTo(2.5, 2); // the 5-wide frame strip gives a half-size of 2.5
  });

  it('drops collinear vertices but keeps corners and turn-backs', () => {
    expect(
      simplifyCollinear(
        [
          [0, 0],
          [1, 0],
          [2, 0],
          [2, 1],
          [2, 2],
          [0, 2],
        ],
        true,
      ),
    ).toEqual([
      [0, 0],
      [2, 0],
      [2, 2],
      [0, 2],
    ]);
    // A polyline that goes out and comes back keeps its far point.
    expect(
      simplifyCollinear(
        [
          [0, 0],
          [3, 0],
          [1, 0],
        ],
        false,
      ),
    ).toHaveLength(3);
  });

  it('clips rings and polylines to a rectangle', () => {
    const r = { x: 0, y: 0, w: 10, h: 10 };
    const clipped = clipRing(
      [
        [-5, -5],
        [15, -5],
        [15, 5],
        [-5, 5],
      ],
      r,
    );
    const xs = clipped.map((p) => p[0]);
    expect(Math.min(...xs)).toBe(0);
    expect(Math.max(...xs)).toBe(10);
    const pieces = clipPolyline(
      [
        [-5, 5],
        [5, 5],
        [5, 20],
      ],
      r,
    );
    expect(pieces).toEqual([
      [
        [0, 5],
        [5, 5],
        [5, 10],
      ],
    ]);
    expect(segmentHitsRect([-1, -1], [11, 11], r)).toBe(true);
    expect(segmentHitsRect([-1, 12], [12, 11], r)).toBe(false);
  });
});

function textsOf(items: SceneItem[], out: SceneText[] = []): SceneText[] {
  for (const it of items) {
    if (it.type === 'text') out.push(it);
    else if (it.type === 'group') textsOf(it.children, out);
  }
  return out;
}

describe('layout over many sizes (property)', () => {
  it('labels every region, never overlaps label boxes and keeps fonts ≥ 6 pt', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 70, max: 200 }),
        fc.integer({ min: 55, max: 180 }),
        fc.constantFrom(6, 7, 8, 9, 10),
        (width, height, fontSize) => {
          let scene;
          try {
            scene = buildScene({ model: iron(), options: { ...DEFAULT_FIGURE, width, height, fontSize }, caption: ['A caption line.'] });
          } catch (e) {
            // The only acceptable refusal is the explicit "too small" message.
            expect(String(e)).toMatch(/too small/);
            return;
          }
          const t = textsOf(scene.items);
          const labels = t.filter((x) => x.role === 'region-label');
          expect(labels.length).toBe(6);
          for (const x of t) expect(x.size).toBeGreaterThanOrEqual(6 - 1e-9);
          const boxes = t.filter((x) => x.box && x.role !== 'legend-label').map((x) => x.box!);
          for (let i = 0; i < boxes.length; i++)
            for (let j = i + 1; j < boxes.length; j++) {
              const a = boxes[i]!;
              const b = boxes[j]!;
              const overlap = a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
              expect(overlap).toBe(false);
            }
        },
      ),
      { numRuns: 25, seed: 4 },
    );
  });
});

describe('rectangle ring and edges (the one rectangle helper)', () => {
  it('lists the corners clockwise on the page from the top left, and the four edges between them', () => {
    const r = { x: 1, y: 2, w: 3, h: 4 };
    expect(rectRing(r)).toEqual([[1, 2], [4, 2], [4, 6], [1, 6]]);
    expect(boxSegments(r)).toEqual([[[1, 2], [4, 2]], [[4, 2], [4, 6]], [[4, 6], [1, 6]], [[1, 6], [1, 2]]]);
  });
});

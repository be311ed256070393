/**
 * Leader lines (issue 17 item 3): a region label moved outside its region, or a mark's label moved
 * off its mark, is joined to it by a leader. No leader may strike another label's box or a mark
 * (operating point, envelope, arrowhead), and no two leaders cross. Every library element at 25, 150
 * and 300 °C at 85 mm, with two operating points and an envelope so that marks and their labels
 * compete for room.
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { segmentHitsRect, segmentsIntersect } from '../../src/render/geometry.js';
import { buildScene } from '../../src/render/scene.js';
import type { Point, Rect, Scene } from '../../src/render/scene-types.js';
import { readSpec } from '../../src/system/spec.js';
import { leaderProblems } from './leader-helpers.js';

const ELEMENTS = ['Ag', 'Al', 'Au', 'Co', 'Cr', 'Cu', 'Fe', 'Mn', 'Mo', 'Ni', 'Pb', 'Sn', 'Ti', 'Zn'];

function draw(element: string, celsius: number): Scene {
  const c = compute(
    readSpec(
      {
        element,
        temperature: celsius,
        points: [{ label: 'feed', pH: 7, E: 0 }, { label: 'return line', pH: 10.5, E: -0.45 }],
        boxes: [{ label: 'rinse', pH: [4.5, 5.5], E: [0.3, 0.5] }],
        figure: { width: '85mm' },
      },
      `${element}.yaml`,
    ),
  );
  return buildScene(figureInput(c, figureSettings(c.spec)));
}

describe('leader lines never strike other labels or marks, nor cross each other', () => {
  it('the check itself catches a leader through a label, through a mark and across another leader', () => {
    const box: Rect = { x: 10, y: 10, w: 10, h: 4 };
    const lead = (a: Point, b: Point, key?: string) => ({ a, b, ...(key ? { key } : {}) });
    expect(leaderProblems([lead([0, 12], [30, 12])], [{ box, what: 'label' }], []).length).toBe(1);
    expect(leaderProblems([lead([0, 12], [30, 12], 'x')], [], [{ box, what: 'mark', key: 'y' }]).length).toBe(1);
    expect(leaderProblems([lead([0, 0], [10, 10]), lead([0, 10], [10, 0])], [], []).length).toBe(1);
    // Its own label (same key, or touched by a key-less leader's tip) and its own mark do not count.
    expect(leaderProblems([lead([0, 12], [10, 12])], [{ box, what: 'label' }], []).length).toBe(0);
    expect(leaderProblems([lead([15, 12], [40, 12], 'm')], [], [{ box, what: 'mark', key: 'm' }]).length).toBe(0);
    expect(segmentsIntersect([0, 0], [1, 1], [0, 1], [1, 0])).toBe(true);
    expect(segmentHitsRect([0, 0], [1, 1], box)).toBe(false);
  });

  for (const element of ELEMENTS) {
    it(`${element} at 25, 150 and 300 °C, 85 mm`, () => {
      const problems: string[] = [];
      let leaders = 0;
      for (const celsius of [25, 150, 300]) {
        const s = draw(element, celsius);
        const r = leaderProblems.fromScene(s);
        leaders += r.leaders;
        for (const p of r.problems) problems.push(`${celsius} °C: ${p}`);
      }
      expect(problems).toEqual([]);
      expect(leaders).toBeGreaterThanOrEqual(0);
    });
  }
});

/**
 * Alloy figures at 85 mm (issue 17 item 3): assemblage names are long ("Cr₂O₃ + Fe₃O₄ + Ni"), so
 * they go through the same fitting as single-element labels — shrink to the floor, move outside
 * with a leader — and when even that leaves no free place, the region is labelled by a number that
 * the legend keys ("1 Cr₂O₃ + Fe₃O₄ + Ni"). Fe–Cr–Ni and Cu–Zn (the brass valve of the gallery) at
 * 85 and 170 mm, 25 and 200 °C: no two texts overlap, no leader strikes a label or mark or crosses
 * another, and every region is identifiable (its name, with or without a leader, or its number in
 * the key).
 */
import { describe, expect, it } from 'vitest';
import { computeAlloy } from '../../src/diagram/alloy.js';
import { alloyFigureInput } from '../../src/figure/alloy.js';
import { figureSettings } from '../../src/figure/options.js';
import { buildScene } from '../../src/render/scene.js';
import type { Scene, SceneText } from '../../src/render/scene-types.js';
import { readAlloySpec } from '../../src/system/alloy-spec.js';
import { texts } from './helpers.js';
import { leaderProblems } from './leader-helpers.js';
import { overlaps } from './overlap-helpers.js';

const ALLOYS: [string, Record<string, unknown>][] = [
  ['Fe–Cr–Ni', { elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 }, activity: 1e-6 }],
  // As gallery/brass-hot-water-valve.yaml (an invented valve), at the test's temperatures.
  ['Cu–Zn', { elements: { Cu: 0.63, Zn: 0.37 }, activity: 1e-6, pH: [4, 12], E: [-1.2, 1.0], boxes: [{ label: 'hot-water loop', pH: [7.2, 8.4], E: [0.0, 0.3] }] }],
];

/** Regions a reader cannot find: no label naming them, or a number with no key entry. */
function unidentified(s: Scene, species: string[]): string[] {
  const ts = texts(s);
  const labels = ts.filter((t) => t.role === 'region-label');
  const keys = ts.filter((t) => t.role === 'legend-label' && t.data?.number !== undefined);
  return species.filter((sp) => {
    const own = labels.filter((t) => t.data?.species === sp);
    if (!own.length) return true;
    return own.some((t) => t.data?.number !== undefined && !keys.some((k: SceneText) => k.data?.species === sp && k.data?.number === t.data?.number));
  });
}

describe.each(ALLOYS)('alloy figure labels, %s', (name, data) => {
  for (const celsius of [25, 200]) {
    const spec = readAlloySpec({ ...data, temperature: celsius }, 'alloy.yaml');
    const model = computeAlloy(spec).model;
    const species = [...new Set(model.regions.map((r) => r.species))];
    for (const width of ['85mm', '170mm']) {
      it(`${celsius} °C, ${width}: no overlaps, clean leaders, every region named or numbered and keyed`, () => {
        const s = buildScene(alloyFigureInput(model, spec, figureSettings(spec.base, { width })));
        expect(overlaps(s)).toEqual([]);
        expect(leaderProblems.fromScene(s).problems).toEqual([]);
        expect(unidentified(s, species)).toEqual([]);
        // The key lists each numbered region once, numbered 1, 2, … in order.
        const nums = texts(s).filter((t) => t.role === 'legend-label' && t.data?.number !== undefined).map((t) => Number(t.data!.number));
        expect(nums).toEqual(nums.map((_, i) => i + 1));
        if (nums.length) expect(s.notes.some((n) => /numbered/.test(n))).toBe(true);
        expect(name.length).toBeGreaterThan(0);
      });
    }
  }
});

/**
 * Families of lines (issue 17): labels only on lines that move with the dissolved activity (one
 * side a dissolved species), "1" rather than 10⁰, one legend key "a = 1, 10⁻², 10⁻⁴".
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { buildScene } from '../../src/render/scene.js';
import type { SceneText } from '../../src/render/scene-types.js';
import { readSpec } from '../../src/system/spec.js';
import { allItems } from './helpers.js';

const textOf = (t: SceneText): string => t.runs.map((r) => r.text).join('');

describe('family lines', () => {
  const c = compute(readSpec({ element: 'Fe', activity: 1e-6, E: [-1.2, 1.6], figure: { width: '170mm', families: [1, 1e-2, 1e-4] } }, 'fe.yaml'));
  const input = figureInput(c, figureSettings(c.spec));
  const scene = buildScene(input);
  const texts = allItems(scene).filter((t): t is SceneText => t.type === 'text');
  it('labels no more lines than those with a dissolved side (Fe/Fe3O4 and Fe3O4/Fe2O3 do not move)', () => {
    const dissolved = new Set(c.model.species.filter((s) => s.class === 'dissolved').map((s) => s.formula));
    const moving = input.families!.flatMap((f) => f.boundaries.filter((b) => b.between.some((x) => dissolved.has(x)))).length;
    const labels = texts.filter((t) => t.role === 'family-label');
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.length).toBeLessThanOrEqual(moving);
    // Before: 3 labels each on the solid/solid lines beyond pH 8.5 (label centres right of the Fe2+ field).
    const fe3o4Edge = scene.frame.x0 + ((8.6 - scene.frame.pH[0]) / (scene.frame.pH[1] - scene.frame.pH[0])) * (scene.frame.x1 - scene.frame.x0);
    expect(labels.filter((t) => t.x > fe3o4Edge)).toEqual([]);
  });
  it('writes activity 1 as "1" and keys the family once in the legend', () => {
    expect(texts.filter((t) => t.role === 'family-label').map(textOf)).not.toContain('100');
    const legend = texts.filter((t) => t.role === 'legend-label').map(textOf);
    expect(legend).toContain('a = 1, 10\u22122, 10\u22124');
  });
});

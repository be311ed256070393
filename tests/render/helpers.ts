/** Shared fixtures for render tests: the hand-built synthetic iron model and derived inputs. */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BoundaryModel, DiagramModel } from '../../src/model.js';
import { DEFAULT_FIGURE, type FigureOptions } from '../../src/render/options.js';
import type { Scene, SceneItem, SceneText } from '../../src/render/scene-types.js';

const here = dirname(fileURLToPath(import.meta.url));

export function loadModel(name: string): DiagramModel {
  return JSON.parse(readFileSync(join(here, '..', 'fixtures', name), 'utf8')) as DiagramModel;
}

/** The synthetic iron model (a = 10⁻⁶): six regions tiling pH 0–14 × E −1.2…1.6 V. */
export const iron = (): DiagramModel => loadModel('model-iron-synthetic.json');

/**
 * Fe²⁺/Fe lines at other activities: E = −0.44 + 0.02958·log a (V vs SHE), drawn across the
 * Fe²⁺ range only, as a family for the figure (Nernst equation, n = 2, 25 °C).
 */
export function ironFamilies(): { activity: number; boundaries: BoundaryModel[] }[] {
  return [1, 1e-2, 1e-4].map((a) => {
    const E = -0.44 + 0.02958 * Math.log10(a);
    return {
      activity: a,
      boundaries: [
        {
          between: ['Fe+2', 'Fe'] as [string, string],
          ligandSpecies: [],
          reaction: 'Fe+2 + 2e- = Fe',
          equation: `E = ${E.toFixed(3)}`,
          line: { kind: 'E' as const, intercept: E, slope: 0, n: 2, m: 0 },
          points: [
            [0, E],
            [6, E],
          ] as [number, number][],
        },
      ],
    };
  });
}

/** Every scene item, groups walked depth-first. */
export function allItems(scene: Scene): SceneItem[] {
  const out: SceneItem[] = [];
  const walk = (items: SceneItem[]): void => {
    for (const it of items) {
      out.push(it);
      if (it.type === 'group') walk(it.children);
    }
  };
  walk(scene.items);
  return out;
}

/** Every text item of a scene. */
export function texts(scene: Scene): SceneText[] {
  return allItems(scene).filter((it): it is SceneText => it.type === 'text');
}

/** Figure options: the defaults with some overridden (show merged key by key). */
export const opts = (o: Partial<FigureOptions> = {}): FigureOptions => ({ ...DEFAULT_FIGURE, ...o, show: { ...DEFAULT_FIGURE.show, ...(o.show ?? {}) } });

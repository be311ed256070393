/**
 * Figures never fail (issue 17): every library element at 0–300 °C in 25 K steps is drawn through
 * the library API at 85 and 170 mm, with no title / a title / a long title, caption on and off,
 * fonts 7–12 pt and every style. The full product (14 × 13 × 2 × 3 × 2 × 6 × 3) is sampled
 * deterministically: every element × temperature is drawn in 6 variants that together walk every
 * value of every other option. Each must build (no throw) and keep its text boxes apart and inside
 * the figure.
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings, type FigureOverrides } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { buildScene } from '../../src/render/scene.js';
import { readSpec } from '../../src/system/spec.js';
import { overlaps } from './overlap-helpers.js';

const ELEMENTS = ['Ag', 'Al', 'Au', 'Co', 'Cr', 'Cu', 'Fe', 'Mn', 'Mo', 'Ni', 'Pb', 'Sn', 'Ti', 'Zn'];
const TEMPS = Array.from({ length: 13 }, (_, i) => i * 25);
const WIDTHS = ['85mm', '170mm'];
const TITLES = [undefined, 'Corrosion map of the cooling loop', 'A much longer title for the cooling-water loop of the north plant, with its pump casings, valves, condenser tubes and heat-exchanger shells at the design temperature'];
const FONTS = ['7', '8', '9', '10', '11', '12'];
const STYLES = ['color', 'gray', 'lines'];

describe('every library element draws at every temperature and size', () => {
  it('builds with no throw and no overlapping text', () => {
    const problems: string[] = [];
    let drawn = 0;
    ELEMENTS.forEach((element, ei) => {
      TEMPS.forEach((T, ti) => {
        const c = compute(readSpec({ element, temperature: T }, `${element}-${T}.yaml`));
        for (let v = 0; v < 6; v++) {
          const k = ei * 7 + ti * 3 + v;
          const title = TITLES[k % 3];
          const o: FigureOverrides = { width: WIDTHS[v % 2]!, fontSize: FONTS[(k + v) % 6]!, style: STYLES[(k + 2 * v) % 3]!, caption: (k >> 1) % 2 === 0, ...(title !== undefined ? { title } : {}) };
          const what = `${element} ${T} °C ${JSON.stringify(o)}`;
          try {
            const scene = buildScene(figureInput(c, figureSettings(c.spec, o)));
            for (const p of overlaps(scene)) problems.push(`${what}: ${p}`);
            drawn++;
          } catch (e) {
            problems.push(`${what}: ${(e as Error).message}`);
          }
        }
      });
    });
    expect(problems.slice(0, 20)).toEqual([]);
    expect(drawn).toBe(ELEMENTS.length * TEMPS.length * 6);
  });
});

/**
 * The gallery's scenarios (our own invented plants and baths, with operating points, boxes and
 * paths) at 85 and 170 mm, with a long title: every figure builds, no two text boxes overlap, no
 * text covers an operating point's marker, and the plating-window figure's labels keep off the title.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { figureInput, windowFigureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { platingWindow } from '../../src/analysis/window.js';
import { computeAny, loadSpec } from '../../src/pipeline.js';
import { readSystemFile } from '../../src/system/read.js';
import { isAlloyData } from '../../src/system/alloy-spec.js';
import { buildScene } from '../../src/render/scene.js';
import type { SceneCircle } from '../../src/render/scene-types.js';
import { allItems } from './helpers.js';
import { overlaps, textBoxes } from './overlap-helpers.js';

const dir = join(__dirname, '..', '..', 'gallery');
// Alloy scenarios (elements) are drawn by their own kind and checked in tests/cli/alloy.test.ts.
const files = readdirSync(dir).filter((f) => f.endsWith('.yaml') && !isAlloyData(readSystemFile(join(dir, f)))).sort();
const LONG = 'A long title for this invented scenario, naming the plant, the stream, the alloy and the design point in one sentence';

describe('gallery figures fit with their marks', () => {
  it('builds every scenario at 85 and 170 mm with a long title, text clear of text and of point markers', () => {
    const problems: string[] = [];
    for (const f of files) {
      const spec = loadSpec(join(dir, f));
      const c = computeAny(spec);
      for (const width of ['85mm', '170mm']) {
        const fig = figureSettings(spec, { width, title: LONG });
        const scenes = [buildScene(figureInput(c, fig))];
        const win = c.kind === 'fixed-activity' ? platingWindow(c.model) : { windows: [] };
        if (c.kind === 'fixed-activity' && win.windows.length) scenes.push(buildScene(windowFigureInput(c, figureSettings(spec, { width, title: LONG }), win.windows)));
        for (const s of scenes) {
          for (const p of overlaps(s)) problems.push(`${f} ${width}: ${p}`);
          const dots = allItems(s).filter((x): x is SceneCircle => x.type === 'circle' && x.role.startsWith('point'));
          for (const b of textBoxes(s)) {
            for (const d of dots) {
              const inX = d.cx + d.r > b.box.x && d.cx - d.r < b.box.x + b.box.w;
              const inY = d.cy + d.r > b.box.y && d.cy - d.r < b.box.y + b.box.h;
              if (inX && inY) problems.push(`${f} ${width}: ${b.role} "${b.text}" covers a point marker`);
            }
          }
        }
      }
    }
    expect(problems).toEqual([]);
  });
});

/**
 * Writes the synthetic iron figure as SVG, PDF and PNG at 85 mm and 170 mm to
 * <os.tmpdir()>/ephmap-figures/ for a look by eye (`npx vitest run tests/render/eyeball.test.ts`).
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_FIGURE, type FigureOptions } from '../../src/render/options.js';
import { buildScene } from '../../src/render/scene.js';
import { sceneToSvg } from '../../src/render/svg.js';
import { sceneToPdf } from '../../src/render/pdf.js';
import { svgToPng, pngWidthFor } from '../../src/render/png.js';
import { iron, ironFamilies } from './helpers.js';

const out = join(tmpdir(), 'ephmap-figures');

describe('eyeball figures', () => {
  it('writes SVG, PDF and PNG files of the synthetic iron figure', async () => {
    mkdirSync(out, { recursive: true });
    const variants: { name: string; options: FigureOptions; extra?: boolean }[] = [
      { name: 'iron-85mm', options: { ...DEFAULT_FIGURE } },
      { name: 'iron-170mm', options: { ...DEFAULT_FIGURE, width: 170, height: 140, fontSize: 9, lineWidth: 1.2 } },
      {
        name: 'iron-170mm-all',
        extra: true,
        options: {
          ...DEFAULT_FIGURE,
          width: 170,
          height: 150,
          fontSize: 9,
          lineWidth: 1.2,
          show: { ...DEFAULT_FIGURE.show, grid: true, neutral: true, triplePoints: true, title: true },
          secondAxis: { label: 'E / V vs SCE', offset: 0.241 },
        },
      },
      {
        name: 'iron-85mm-all',
        extra: true,
        options: { ...DEFAULT_FIGURE, height: 95, show: { ...DEFAULT_FIGURE.show, neutral: true, triplePoints: true } },
      },
      { name: 'iron-85mm-gray', options: { ...DEFAULT_FIGURE, style: 'gray' } },
      { name: 'iron-85mm-lines', options: { ...DEFAULT_FIGURE, style: 'lines' } },
    ];
    for (const v of variants) {
      const scene = buildScene({
        model: iron(),
        options: v.options,
        caption: ['Synthetic Fe–H2O test figure, 25 °C, dissolved Fe 10^-6; hand-built geometry for layout checks.'],
        ...(v.extra
          ? {
              families: ironFamilies(),
              neutralPH: 7.0,
              points: [{ label: 'P1', pH: 8.2, E: 0.1 }],
              paths: [{ label: 'start-up', points: [[4, -0.3], [6, 0.2], [9.5, 0.3]] }],
              boxes: [{ label: 'service', pH: [10, 12], E: [-0.3, 0.2] }],
            }
          : {}),
      });
      const svg = sceneToSvg(scene);
      writeFileSync(join(out, `${v.name}.svg`), svg);
      writeFileSync(join(out, `${v.name}.pdf`), await sceneToPdf(scene));
      writeFileSync(join(out, `${v.name}.png`), await svgToPng(svg, pngWidthFor(v.options.width, 300)));
      expect(svg.length).toBeGreaterThan(1000);
    }
    console.log(`figures written to ${out}`);
  });
});

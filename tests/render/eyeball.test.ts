/**
 * Writes the synthetic iron figure as SVG, PDF and PNG at 85 mm and 170 mm to
 * <os.tmpdir()>/ephmap-figures/ for a look by eye (`npx vitest run tests/render/eyeball.test.ts`),
 * and checks each one: the SVG (parsed with svgdom) has a filled path for every region of the
 * model and a line for every boundary, the title, tick labels inside the axis ranges at their
 * positions; the PDF and PNG files are what they claim to be.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createSVGWindow } from 'svgdom';
import { describe, expect, it } from 'vitest';
import type { DiagramModel } from '../../src/model.js';
import { DEFAULT_FIGURE, type FigureOptions } from '../../src/render/options.js';
import { buildScene, type Scene } from '../../src/render/scene.js';
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
      const pdf = await sceneToPdf(scene);
      const pngWidth = pngWidthFor(v.options.width, 300);
      const png = await svgToPng(svg, pngWidth);
      writeFileSync(join(out, `${v.name}.svg`), svg);
      writeFileSync(join(out, `${v.name}.pdf`), pdf);
      writeFileSync(join(out, `${v.name}.png`), png);
      checkSvg(v.name, svg, iron(), scene, v.options);
      expect(pdf.subarray(0, 5).toString('latin1'), v.name).toBe('%PDF-');
      // PNG signature, then IHDR width as a big-endian uint32 at byte 16 (W3C PNG Specification, 2nd ed., §11.2.2).
      expect(png.subarray(0, 8).toString('hex'), v.name).toBe('89504e470d0a1a0a');
      expect(png.readUInt32BE(16), v.name).toBe(pngWidth);
    }
    console.log(`figures written to ${out}`);
  });
});

/* eslint-disable @typescript-eslint/no-explicit-any */
function checkSvg(name: string, svgText: string, model: DiagramModel, scene: Scene, o: FigureOptions): void {
  const host = createSVGWindow().document.createElement('div');
  host.innerHTML = svgText;
  const svg: any = host.querySelector('svg');
  const attr = (el: any, k: string): string => el.getAttribute(k) ?? '';
  // Every region of the model has its path, filled unless the style draws lines only.
  const regions = [...svg.querySelectorAll('path.region')];
  for (const r of model.regions) {
    const el = regions.find((p) => attr(p, 'data-species') === r.species);
    expect(el, `${name}: region ${r.species}`).toBeDefined();
    expect(attr(el, 'd'), `${name}: region ${r.species}`).toMatch(/^M[^M]+L/);
    if (o.style !== 'lines') expect(attr(el, 'fill'), `${name}: fill of ${r.species}`).toMatch(/^#[0-9a-f]{6}$/);
  }
  // Every boundary has its line.
  const lines = new Set([...svg.querySelectorAll('path.boundary')].map((p: any) => attr(p, 'data-between')));
  for (const b of model.boundaries) expect(lines.has(b.between.join('|')), `${name}: boundary ${b.between.join(' / ')}`).toBe(true);
  // The title, when shown.
  const title = svg.querySelector('text.title');
  if (o.show.title) expect(title?.textContent.replace(/\s+/g, ''), `${name}: title`).toContain('Fe');
  else expect(title, `${name}: no title`).toBeNull();
  // Tick labels: values inside the axis ranges, placed on their axis and in order (SVG numbers are rounded to 0.1 pt).
  const { pH, E } = model.domain;
  const ticks = [...svg.querySelectorAll('text.tick-label')];
  for (const [axis, [lo, hi], coord] of [['pH', pH, 'x'], ['E', E, 'y']] as const) {
    const mine = ticks.filter((t) => attr(t, 'data-axis') === axis);
    expect(mine.length, `${name}: ${axis} ticks`).toBeGreaterThanOrEqual(3);
    const values = mine.map((t) => Number(attr(t, 'data-value')));
    for (const val of values) expect(val >= lo - 1e-9 && val <= hi + 1e-9, `${name}: ${axis} tick ${val}`).toBe(true);
    const at = mine.map((t) => Number(attr(t, coord)));
    const [a, b] = coord === 'x' ? [scene.plot.x, scene.plot.x + scene.plot.w] : [scene.plot.y - 0.5 * o.fontSize, scene.plot.y + scene.plot.h + 0.5 * o.fontSize];
    for (const c of at) expect(c >= a - 0.06 && c <= b + 0.06, `${name}: ${axis} tick at ${c}`).toBe(true);
    // pH grows to the right, E grows upwards (smaller y).
    for (let i = 1; i < values.length; i++) expect(Math.sign(at[i]! - at[i - 1]!), `${name}: ${axis} tick order`).toBe(coord === 'x' ? Math.sign(values[i]! - values[i - 1]!) : -Math.sign(values[i]! - values[i - 1]!));
  }
}

/**
 * The interactive HTML page in a real browser (Chromium driven by playwright-core): the read-out
 * under the pointer at known (pH, E) points of the iron diagram computed from the built-in data,
 * and the keyboard crosshair. Skipped, with a message, when /usr/bin/chromium is not installed.
 *
 * Expected species: iron at 25 °C, dissolved activity 10⁻⁶ — Fe is stable below the Fe²⁺/Fe line
 * (about −0.62 V vs SHE; Pourbaix, Atlas of Electrochemical Equilibria in Aqueous Solutions, 1974,
 * iron section — recalled from memory), so pH 2, E −0.9 V is immunity; pH 4, E 0 V lies between
 * that line and the Fe₂O₃/Fe²⁺ line (about +0.3 V at pH 4), so Fe²⁺ predominates: corrosion.
 */
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { renderFigure } from '../../src/figure/output.js';

const CHROMIUM = '/usr/bin/chromium';
const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) console.warn(`browser tests: ${CHROMIUM} not found — interactive HTML checks skipped (install the chromium package to run them)`);

/* eslint-disable @typescript-eslint/no-explicit-any */
describe.skipIf(!haveChromium)('interactive HTML in Chromium', () => {
  let browser: any;
  let page: any;
  let dir: string;
  const errors: string[] = [];

  beforeAll(async () => {
    const spec = readSpec({ element: 'Fe', E: [-1.2, 1.6] }, 'fe.yaml');
    const c = compute(spec);
    const html = await renderFigure(figureInput(c, figureSettings(spec)), 'html');
    dir = mkdtempSync(join(tmpdir(), 'ephmap-html-'));
    const file = join(dir, 'fe.html');
    writeFileSync(file, html);
    const { chromium } = await import('playwright-core');
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
    page = await browser.newPage({ viewport: { width: 1000, height: 900 } });
    page.on('pageerror', (e: Error) => errors.push(String(e)));
    page.on('console', (m: any) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    page.on('request', (r: any) => {
      if (!r.url().startsWith('file:')) errors.push(`network request: ${r.url()}`);
    });
    await page.goto(pathToFileURL(file).href);
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  /** Screen position of (pH, E): plot frame from the page data, then the SVG's own screen transform. */
  async function screenAt(pH: number, E: number): Promise<[number, number]> {
    return page.evaluate(([pH, E]: [number, number]) => {
      const f = JSON.parse(document.getElementById('ephmap-data')!.textContent!).frame;
      const x = f.x0 + ((pH - f.pH[0]) * (f.x1 - f.x0)) / (f.pH[1] - f.pH[0]);
      const y = f.y0 + ((E - f.E[0]) * (f.y1 - f.y0)) / (f.E[1] - f.E[0]);
      const svg = document.querySelector('#ephmap-plot svg') as SVGSVGElement;
      const p = new DOMPoint(x, y).matrixTransform(svg.getScreenCTM()!);
      return [p.x, p.y];
    }, [pH, E]);
  }

  const readout = async (): Promise<string> => ((await page.textContent('#ephmap-readout')) as string).replace(/\s+/g, ' ').trim();

  it('reads Fe, immunity, at pH 2 and −0.9 V', async () => {
    const [x, y] = await screenAt(2, -0.9);
    await page.mouse.move(x, y);
    const t = await readout();
    expect(t).toContain('pH 2.00, E = \u22120.900 V vs SHE');
    expect(t).toMatch(/Fe \(iron[^)]*\)\): immunity|Fe: immunity/);
    // Named by its own definition (issue 15, defect 5): nearest as drawn, not probe's Nernst-scaled plane.
    expect(t).toContain('Nearest boundary on the figure: Fe / Fe\u00b2\u207a');
    expect(t).toContain('Fe\u00b2\u207a + 2e\u207b \u21cc Fe(s)');
  });

  it('reads Fe²⁺, corrosion, at pH 4 and 0 V', async () => {
    const [x, y] = await screenAt(4, 0);
    await page.mouse.move(x, y);
    const t = await readout();
    expect(t).toContain('pH 4.00, E = 0.000 V vs SHE');
    expect(t).toContain('Fe\u00b2\u207a (iron(II) ion): corrosion');
    expect(t).toMatch(/Nearest boundary on the figure: Fe\u00b2\u207a \/ Fe\u2082O\u2083: .*; E = [\d.]+ \u2212 [\d.]+ pH V vs SHE/);
  });

  it('moves the crosshair with the arrow keys (0.1 pH, 10 mV; Shift ×10)', async () => {
    await page.focus('#ephmap-plot');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('ephmap-plot');
    const before = await readout();
    await page.keyboard.press('ArrowRight');
    const after = await readout();
    expect(after).not.toBe(before);
    expect(after).toContain('pH 4.10, E = 0.000 V');
    await page.keyboard.press('Shift+ArrowDown');
    expect(await readout()).toContain('pH 4.10, E = \u22120.100 V');
    // The crosshair is drawn where the read-out says.
    const [x] = await screenAt(4.1, -0.1);
    const vx = await page.evaluate(() => {
      const l = document.querySelector('.ephmap-vline') as SVGLineElement;
      const svg = document.querySelector('#ephmap-plot svg') as SVGSVGElement;
      return new DOMPoint(Number(l.getAttribute('x1')), 0).matrixTransform(svg.getScreenCTM()!).x;
    });
    expect(vx).toBeCloseTo(x, 1);
  });

  it('ran without script errors or network requests', () => {
    expect(errors).toEqual([]);
  });
});

describe.skipIf(!haveChromium)('interactive HTML layout: the read-out stays in view', () => {
  let browser: any;
  let dir: string;
  let file: string;

  beforeAll(async () => {
    // A large figure (170 mm × 160 mm, taller than a laptop window at 96 px/in) with a second axis.
    const spec = readSpec({ element: 'Fe', temperature: 90, pH: [4, 12], E: [-1.2, 0.8], reference: 'agcl-sat', figure: { width: '170mm', height: '160mm' } }, 'loop.yaml');
    const html = await renderFigure(figureInput(compute(spec), figureSettings(spec)), 'html');
    dir = mkdtempSync(join(tmpdir(), 'ephmap-layout-'));
    file = join(dir, 'loop.html');
    writeFileSync(file, html);
    const { chromium } = await import('playwright-core');
    browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'] });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  type R = { x: number; y: number; w: number; h: number };
  /** Moves the pointer over the plot (a point at fractions fx, fy of the drawing) and returns the rectangles. */
  async function pointAt(width: number, height: number, fx: number, fy: number): Promise<{ page: any; svg: R; readout: R; vw: number; vh: number; text: string }> {
    const page = await browser.newPage({ viewport: { width, height } });
    await page.goto(pathToFileURL(file).href);
    const rect = (sel: string): Promise<R> =>
      page.evaluate((q: string) => {
        const r = document.querySelector(q)!.getBoundingClientRect();
        return { x: r.x, y: r.y, w: r.width, h: r.height };
      }, sel);
    const s0 = await rect('#ephmap-plot svg');
    await page.mouse.move(s0.x + s0.w * fx, s0.y + s0.h * fy);
    return { page, svg: await rect('#ephmap-plot svg'), readout: await rect('#ephmap-readout'), vw: width, vh: height, text: (await page.textContent('#ephmap-readout')) as string };
  }
  const inView = (r: R, vw: number, vh: number): boolean => r.x >= 0 && r.y >= 0 && r.x + r.w <= vw + 0.5 && r.y + r.h <= vh + 0.5;

  it('on a 1280×720 laptop window: the whole figure and, beside it, the read-out are in view', async () => {
    const { page, svg, readout, vw, vh, text } = await pointAt(1280, 720, 0.55, 0.45);
    expect(text).toMatch(/pH \d+\.\d\d, E = /);
    expect(inView(svg, vw, vh)).toBe(true);
    expect(inView(readout, vw, vh)).toBe(true);
    expect(readout.x).toBeGreaterThanOrEqual(svg.x + svg.w); // beside, not over the figure
    await page.close();
  });

  it('on a narrow window: the figure leaves room for the read-out below it', async () => {
    const { page, svg, readout, vw, vh, text } = await pointAt(600, 420, 0.5, 0.2);
    expect(text).toMatch(/pH \d+\.\d\d, E = /);
    expect(inView(svg, vw, vh)).toBe(true);
    expect(inView(readout, vw, vh)).toBe(true);
    expect(readout.y).toBeGreaterThanOrEqual(svg.y + svg.h);
    // Still a live region for screen readers, with the help text available to them.
    expect(await page.getAttribute('#ephmap-readout', 'aria-live')).toBe('polite');
    expect(await page.evaluate(() => document.getElementById('ephmap-help')!.textContent!.length)).toBeGreaterThan(50);
    await page.close();
  });

  it('on a very short narrow window: the read-out sticks to the bottom of the window over the figure', async () => {
    const { page, svg, readout, vw, vh } = await pointAt(600, 240, 0.5, 0.2);
    expect(svg.y + svg.h).toBeGreaterThan(vh); // the figure runs past the window…
    expect(inView(readout, vw, vh)).toBe(true); // …and the read-out is in view
    await page.close();
  });

  it('prints the figure without the read-out', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 720 } });
    await page.goto(pathToFileURL(file).href);
    await page.emulateMedia({ media: 'print' });
    expect(await page.isVisible('#ephmap-readout')).toBe(false);
    expect(await page.isVisible('#ephmap-plot svg')).toBe(true);
    await page.close();
  });
});

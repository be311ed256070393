/**
 * `ephmap overlay`: several layers in one figure — one system at several temperatures or
 * activities (base with fills, the others as boundaries in their own dash styles), or several
 * elements (lines only, with the plain statement that the layers are separate diagrams).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { createSVGWindow } from 'svgdom';
import { describe, expect, it } from 'vitest';
import { LAYER_INKS, luminance } from '../../src/render/palette.js';
import { SEPARATE_ELEMENTS_NOTE } from '../../src/figure/overlay.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.4]\n');
const cr = writeTmp(dir, 'cr.yaml', 'element: Cr\nactivity: 1.0e-6\nE: [-1.2, 1.4]\n');
const ni = writeTmp(dir, 'ni.yaml', 'element: Ni\nactivity: 1.0e-6\nE: [-1.2, 1.4]\n');

const unescape = (s: string) => s.replace(/<[^>]+>/g, '').replace(/&apos;/g, "'").replace(/&quot;/g, '"').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');

/** The parts of an SVG figure the tests look at. */
function parse(svg: string) {
  const texts = (cls: string) => [...svg.matchAll(new RegExp(`<text class="${cls}"[^>]*>(.*?)</text>`, 'g'))].map((m) => unescape(m[1]));
  const paths = (cls: string) => [...svg.matchAll(new RegExp(`<path class="${cls}"([^>]*)/>`, 'g'))].map((m) => m[1]);
  const attr = (p: string, a: string) => new RegExp(` ${a}="([^"]*)"`).exec(p)?.[1];
  return {
    overlays: paths('overlay').map((p) => ({ label: unescape(attr(p, 'data-label') ?? ''), dash: attr(p, 'stroke-dasharray') })),
    boundaries: paths('boundary'),
    regions: paths('region').map((p) => attr(p, 'fill')),
    legend: texts('legend-label'),
    caption: texts('caption').join(' '),
  };
}

async function overlay(args: string[], out: string) {
  const r = await runCli(['overlay', ...args, '-o', out]);
  return { ...r, out };
}

describe('overlay: one system at several temperatures', () => {
  it('draws the base with fills and one dashed layer per further temperature, each named in the legend', async () => {
    const r = await overlay([fe, '--temperatures', '25,90,150'], join(dir, 't.svg'));
    expect(r.code).toBe(0);
    const f = parse(readFileSync(r.out, 'utf8'));
    expect(f.boundaries.length).toBeGreaterThan(3);
    expect(f.regions.every((fill) => fill !== 'none')).toBe(true);
    expect(f.overlays.map((o) => o.label)).toEqual(['Fe, 90 °C, a = 10⁻⁶', 'Fe, 150 °C, a = 10⁻⁶']);
    expect(new Set(f.overlays.map((o) => o.dash)).size).toBe(2);
    // Three layers → three line entries in the legend: the base boundaries and the two overlays.
    const layerEntries = f.legend.filter((l) => /^Fe, \d+ °C/.test(l));
    expect(layerEntries).toHaveLength(3);
    // The base layer is named in the legend, as filled.
    expect(layerEntries[0]).toMatch(/^Fe, 25 °C, a = 10(⁻⁶|−6) \(filled\)$/);
    expect(f.caption).toMatch(/Layers: Fe, 25 °C, a = 10(⁻⁶|−6) \(base, solid lines, filled fields\); Fe, 90 °C/);
    expect(f.caption).toContain('Water lines are those of the base layer (25 °C).');
  });

  it('several activities work the same way (PDF output)', async () => {
    const r = await overlay([fe, '--activities', '1e-6,1e-4,1'], join(dir, 'a.pdf'));
    expect(r.code).toBe(0);
    expect(readFileSync(r.out).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('the activity layer is drawn where Nernst puts it: Fe/Fe2+ 59 mV higher at 1e-4 than at 1e-6', async () => {
    // Nernst: E = E° + (ln10·RT/2F)·log a(Fe2+), 29.58 mV per decade at 25 °C (n = 2), so two
    // decades raise the horizontal Fe/Fe2+ line by 0.05916 V (CODATA 2018 R and F).
    const r = await overlay([fe, '--activities', '1e-6,1e-4'], join(dir, 'a.svg'));
    expect(r.code).toBe(0);
    const svg = readFileSync(r.out, 'utf8');
    const f = parse(svg);
    expect(f.overlays.map((o) => o.label)).toEqual(['Fe, 25 °C, a = 10⁻⁴']);
    // Scale of the E axis in pt per V, from two tick labels.
    const ticks = [...svg.matchAll(/<text class="tick-label" x="[^"]*" y="([^"]*)"[^>]*data-axis="E" data-value="([^"]*)"/g)].map((m) => ({ y: Number(m[1]), E: Number(m[2]) }));
    expect(ticks.length).toBeGreaterThan(2);
    const perV = (ticks[0].y - ticks[ticks.length - 1].y) / (ticks[ticks.length - 1].E - ticks[0].E);
    const horizontals = (d: string) => {
      const ys: number[] = [];
      for (const sub of d.split('M').filter(Boolean)) {
        const pts = [...sub.matchAll(/([\d.]+) ([\d.]+)/g)].map((m) => Number(m[2]));
        for (let k = 1; k < pts.length; k++) if (Math.abs(pts[k] - pts[k - 1]) < 0.02) ys.push(pts[k]);
      }
      return ys;
    };
    const yBase = horizontals(/<path class="boundary" d="([^"]*)"[^>]*data-between="Fe\|Fe\^2\+"/.exec(svg)![1])[0];
    const expected = yBase - 0.05916 * perV;
    expect(horizontals(/<path class="overlay" d="([^"]*)"/.exec(svg)![1]).some((y) => Math.abs(y - expected) < 0.1)).toBe(true);
  });
});

describe('overlay: several elements', () => {
  it('draws every layer as lines only and says plainly that the layers are separate diagrams', async () => {
    const r = await overlay([fe, cr, ni], join(dir, 'e.svg'));
    expect(r.code).toBe(0);
    const f = parse(readFileSync(r.out, 'utf8'));
    expect(f.regions.every((fill) => fill === 'none')).toBe(true);
    expect(f.overlays.map((o) => o.label)).toEqual(['Cr, 25 °C, a = 10⁻⁶', 'Ni, 25 °C, a = 10⁻⁶']);
    expect(new Set(f.overlays.map((o) => o.dash)).size).toBe(2);
    // The base is named like the other layers, without "(filled)": every layer is lines only.
    expect(f.legend.filter((l) => /^(Fe|Cr|Ni), 25 °C, a = 10(⁻⁶|−6)$/.test(l))).toHaveLength(3);
    expect(f.caption.replace(/\s+/g, ' ')).toContain(SEPARATE_ELEMENTS_NOTE);
    expect(f.caption).toContain("overlaying them does not describe the alloy's thermodynamics");
  });

  it('keeps the statement even when the caption is switched off', async () => {
    const r = await overlay([fe, cr, '--no-caption'], join(dir, 'e2.svg'));
    expect(r.code).toBe(0);
    expect(parse(readFileSync(r.out, 'utf8')).caption).toContain('separate single-element diagram');
  });
});

type Box = { x: number; y: number; w: number; h: number };
type Pt = [number, number];

/* eslint-disable @typescript-eslint/no-explicit-any */
/** The SVG as a DOM (svgdom measures text with its own font data, independent of our metrics). */
function dom(svg: string): any {
  const window = createSVGWindow();
  const host = window.document.createElement('div');
  host.innerHTML = svg;
  return host.querySelector('svg');
}

/**
 * Ink box of a text element from svgdom's bbox: its line box trimmed to the glyph band. svgdom
 * centres a middle-anchored text on its first run only, so such a box is re-centred on the anchor.
 */
function inkBox(el: any): Box {
  const b = el.getBBox();
  const x = el.getAttribute('text-anchor') === 'middle' ? Number(el.getAttribute('x')) - b.width / 2 : b.x;
  return { x, y: b.y + 0.18 * b.height, w: b.width, h: 0.64 * b.height };
}

const overlaps = (a: Box, b: Box): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** Segments of every path of the given class ("M x y L x y …" subpaths). */
function segments(svg: any, cls: string): [Pt, Pt][] {
  const out: [Pt, Pt][] = [];
  for (const p of svg.querySelectorAll(`path.${cls}`)) {
    for (const sub of (p.getAttribute('d') as string).split('M').filter(Boolean)) {
      const pts = sub.replace(/Z$/, '').split('L').map((xy) => xy.trim().split(/\s+/).map(Number) as Pt);
      for (let i = 0; i + 1 < pts.length; i++) out.push([pts[i]!, pts[i + 1]!]);
    }
  }
  return out;
}

/** Whether a segment passes through the inside of a box (sampled finely; independent of the renderer's geometry). */
function crosses([a, b]: [Pt, Pt], r: Box): boolean {
  for (let i = 0; i <= 400; i++) {
    const x = a[0] + (i / 400) * (b[0] - a[0]);
    const y = a[1] + (i / 400) * (b[1] - a[1]);
    if (x > r.x && x < r.x + r.w && y > r.y && y < r.y + r.h) return true;
  }
  return false;
}

describe('overlay: labels of the layers\' fields', () => {
  it('names the fields of every layer (e.g. Cr2O3, NiO) in the layer\'s own colour, and no two labels overlap', async () => {
    const r = await overlay([fe, cr, ni], join(dir, 'labels.svg'));
    expect(r.code).toBe(0);
    const text = readFileSync(r.out, 'utf8');
    const svg = dom(text);
    const labels = [...svg.querySelectorAll('text.overlay-label')];
    const of = (layer: RegExp) => labels.filter((l: any) => layer.test(l.getAttribute('data-layer')));
    const species = (ls: any[]) => ls.map((l) => l.getAttribute('data-species'));
    // Passive films of chromium and nickel at mid pH (Cr2O3, NiO), read in the layer's fields.
    expect(species(of(/^Cr,/))).toContain('Cr2O3');
    expect(species(of(/^Ni,/))).toContain('NiO');
    expect(of(/^Cr,/).length).toBeGreaterThanOrEqual(3);
    expect(of(/^Ni,/).length).toBeGreaterThanOrEqual(3);
    // Typeset: subscripts as tspans, read back as plain text.
    expect(of(/^Cr,/).find((l: any) => l.getAttribute('data-species') === 'Cr2O3').textContent).toBe('Cr2O3');
    // Each layer's labels in the layer's line colour; the two layers' colours differ.
    const stroke = (label: string) => new RegExp(`<path class="overlay"[^>]*stroke="([^"]+)"[^>]*data-label="${label}"`).exec(text)?.[1];
    const crInk = stroke('Cr, 25 °C, a = 10⁻⁶');
    const niInk = stroke('Ni, 25 °C, a = 10⁻⁶');
    expect(crInk).toBeDefined();
    expect(crInk).not.toBe(niInk);
    for (const l of of(/^Cr,/)) expect(luminance(l.getAttribute('fill'))).toBeLessThanOrEqual(luminance(crInk!) + 1e-9);
    // No two labels of any kind overlap (unrotated ones, measured by svgdom).
    const sel = 'text.region-label, text.overlay-label, text.point-label, text.path-label, text.box-label, text.family-tag';
    const boxes = [...svg.querySelectorAll(sel)].map((el: any) => ({ box: inkBox(el), text: `${el.getAttribute('class')} ${el.textContent}` }));
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) expect(overlaps(boxes[i]!.box, boxes[j]!.box), `${boxes[i]!.text} vs ${boxes[j]!.text}`).toBe(false);
    // The small labels keep off every line: the base's boundaries, the layers' lines and the water lines.
    const lines = [...segments(svg, 'boundary'), ...segments(svg, 'overlay'), ...segments(svg, 'water')];
    for (const l of labels) {
      const b = inkBox(l);
      for (const s of lines) expect(crosses(s, b), `${l.getAttribute('data-species')} crosses a line`).toBe(false);
    }
  });

  it('gives layers of different elements their own colours in colour style, in the legend too, and grays with --style lines', async () => {
    const r = await overlay([fe, cr, ni], join(dir, 'colours.svg'));
    const text = readFileSync(r.out, 'utf8');
    const overlayStrokes = [...text.matchAll(/<path class="overlay"[^>]*stroke="([^"]+)"/g)].map((m) => m[1]);
    expect(overlayStrokes).toEqual([LAYER_INKS[1], LAYER_INKS[2]]);
    const legendStrokes = [...text.matchAll(/<path class="legend-line"[^>]*stroke="([^"]+)"/g)].map((m) => m[1]);
    for (const s of overlayStrokes) expect(legendStrokes).toContain(s);
    expect(parse(text).caption).toMatch(/Cr, 25 °C, a = 10(⁻⁶|−6) \(blue longdash, boundaries only\)/);
    const g = await overlay([fe, cr, ni, '--style', 'lines'], join(dir, 'gray.svg'));
    const grays = [...readFileSync(g.out, 'utf8').matchAll(/<path class="overlay"[^>]*stroke="#([0-9a-f]{6})"/g)].map((m) => m[1]!);
    expect(grays).toHaveLength(2);
    for (const h of grays) expect(h.slice(0, 2) === h.slice(2, 4) && h.slice(2, 4) === h.slice(4, 6)).toBe(true);
  });

  it('labels a shifted field of another temperature, but not one whose base label already names it', async () => {
    const r = await overlay([fe, '--temperatures', '25,150'], join(dir, 'tl.svg'));
    expect(r.code).toBe(0);
    const svg = dom(readFileSync(r.out, 'utf8'));
    const labels = [...svg.querySelectorAll('text.overlay-label')].map((l: any) => l.getAttribute('data-species'));
    // The big Fe2O3 field holds its 25 °C label at 150 °C too: no second Fe2O3 label.
    expect(labels).not.toContain('Fe2O3');
    const base = [...svg.querySelectorAll('text.region-label')].map((l: any) => l.getAttribute('data-species'));
    expect(base).toContain('Fe2O3');
  });
});

describe('overlay: bad input (exit 2, nothing written)', () => {
  const cases: [string, string[], string][] = [
    ['a temperature that is not a number', [fe, '--temperatures', '25,warm'], '--temperatures'],
    ['a temperature out of range', [fe, '--temperatures', '25,400'], '--temperatures'],
    ['a negative activity', [fe, '--activities', '1e-6,-1'], '--activities'],
    ['only one layer', [fe], 'layers'],
    ['more layers than dash styles', [fe, '--temperatures', '25,50,75,100,125,150'], 'layers'],
    ['several files and several temperatures', [fe, cr, '--temperatures', '25,90'], '--temperatures'],
    ['a missing system file', [fe, join(dir, 'nope.yaml')], 'nope.yaml'],
  ];
  for (const [name, args, field] of cases) {
    it(name, async () => {
      const out = join(dir, 'bad', `${name.replace(/\W+/g, '-')}.svg`);
      const r = await overlay(args, out);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(field);
      expect(existsSync(out)).toBe(false);
    });
  }

  it('an unsupported output extension', async () => {
    const out = join(dir, 'bad', 'x.gif');
    const r = await overlay([fe, cr], out);
    expect(r.code).toBe(2);
    expect(existsSync(out)).toBe(false);
  });
});

/**
 * `ephmap overlay`: several layers in one figure — one system at several temperatures or
 * activities (base with fills, the others as boundaries in their own dash styles), or several
 * elements (lines only, with the plain statement that the layers are separate diagrams).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { SEPARATE_ELEMENTS_NOTE } from '../../src/report/overlay.js';
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
    const yBase = horizontals(/<path class="boundary" d="([^"]*)"[^>]*data-between="Fe\|Fe\+2"/.exec(svg)![1])[0];
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

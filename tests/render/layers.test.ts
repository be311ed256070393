/**
 * Overlay layers: small labels of each layer's fields (in the layer's ink, never over a line or
 * another label, not repeated where the base's label already names the field) and the layer inks
 * (colour-blind-safe, legible as text).
 */
import { describe, expect, it } from 'vitest';
import type { DiagramModel } from '../../src/model.js';
import { DEFAULT_FIGURE } from '../../src/render/options.js';
import { contrastRatio, LAYER_INKS, textInk } from '../../src/render/palette.js';
import { buildScene, type FigureInput } from '../../src/render/scene.js';
import type { Rect } from '../../src/render/scene-types.js';
import { iron, texts, opts } from './helpers.js';



const overlap = (a: Rect, b: Rect): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** The synthetic iron model moved by dE volts, with its species renamed (a stand-in for another element). */
function shifted(dE: number, rename: (s: string) => string): DiagramModel {
  const m = iron();
  const mv = (p: [number, number]): [number, number] => [p[0], p[1] + dE];
  m.regions = m.regions.map((r) => ({ ...r, species: rename(r.species), polygons: r.polygons.map((poly) => poly.map((ring) => ring.map(mv))) }));
  m.boundaries = m.boundaries.map((b) => ({ ...b, between: [rename(b.between[0]), rename(b.between[1])], points: b.points.map(mv) }));
  return m;
}

describe('overlay layer labels', () => {
  const input = (): FigureInput => ({
    model: iron(),
    options: opts({ width: 160, height: 140 }),
    overlays: [
      { label: 'layer X', model: shifted(0.25, (s) => s.replace(/^Fe/, 'Xa')), dash: 'longdash', color: '#0072b2' },
      { label: 'layer Y', model: shifted(-0.2, (s) => s.replace(/^Fe/, 'Yb')), dash: 'dashdot', color: '#d55e00' },
    ],
  });

  it('names fields of every layer in its ink, and no label overlaps another', () => {
    const scene = buildScene(input());
    const all = texts(scene);
    const ov = all.filter((t) => t.role === 'overlay-label');
    for (const [layer, prefix, ink] of [['layer X', 'Xa', '#0072b2'], ['layer Y', 'Yb', textInk('#d55e00')]] as const) {
      const mine = ov.filter((t) => t.data?.layer === layer);
      expect(mine.length, layer).toBeGreaterThanOrEqual(2);
      for (const t of mine) {
        expect(t.data!.species.startsWith(prefix)).toBe(true);
        expect(t.fill).toBe(ink);
        expect(t.size).toBeLessThan(DEFAULT_FIGURE.fontSize);
      }
    }
    const boxed = all.filter((t) => t.box && t.rotate === 0 && t.role !== 'legend-label' && t.role !== 'tick-label');
    for (let i = 0; i < boxed.length; i++)
      for (let j = i + 1; j < boxed.length; j++) expect(overlap(boxed[i]!.box!, boxed[j]!.box!), `${boxed[i]!.data?.species} vs ${boxed[j]!.data?.species}`).toBe(false);
  });

  it('does not repeat a name where the base label already names the field', () => {
    // The same fields 10 mV higher: every base label lies inside the layer's field of the same species.
    const scene = buildScene({ model: iron(), options: opts({ width: 160, height: 140 }), overlays: [{ label: 'again', model: shifted(0.01, (s) => s), dash: 'dash' }] });
    expect(texts(scene).filter((t) => t.role === 'overlay-label')).toEqual([]);
    // Renamed, the same fields are labelled.
    const other = buildScene({ model: iron(), options: opts({ width: 160, height: 140 }), overlays: [{ label: 'other', model: shifted(0.01, (s) => `${s}Z`), dash: 'dash' }] });
    expect(texts(other).filter((t) => t.role === 'overlay-label').length).toBeGreaterThan(0);
  });

  it('skips a label that has no free place rather than crowding the figure', () => {
    // A tiny figure: fewer layer labels than fields, none over another label.
    const scene = buildScene({ ...input(), options: opts() });
    const ov = texts(scene).filter((t) => t.role === 'overlay-label');
    expect(ov.length).toBeLessThan(2 * iron().regions.length);
  });
});

describe('layer inks', () => {
  /**
   * Colour-vision deficiency simulation, full severity, applied to linear sRGB: Machado, Oliveira &
   * Fernandes, "A physiologically-based model for simulation of color vision deficiency", IEEE
   * TVCG 15 (2009), Table 1 at severity 1.0 (matrices recalled from memory; each row sums to 1, so
   * grays are unchanged).
   */
  const CVD: Record<string, number[][]> = {
    protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
    deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
    tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
  };
  const lin = (c: number): number => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
  const rgb = (h: string): number[] => [1, 3, 5].map((i) => lin(parseInt(h.slice(i, i + 2), 16) / 255));
  /** CIE 1976 L*a*b* (D65) of linear sRGB (IEC 61966-2-1 matrix). */
  const lab = (c: number[]): number[] => {
    const [r, g, b] = c.map((v) => Math.min(1, Math.max(0, v))) as [number, number, number];
    const f = (t: number): number => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
    const X = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
    const Y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
    const Z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
    return [116 * f(Y) - 16, 500 * (f(X) - f(Y)), 200 * (f(Y) - f(Z))];
  };
  const apply = (m: number[][], c: number[]): number[] => m.map((row) => row[0]! * c[0]! + row[1]! * c[1]! + row[2]! * c[2]!);

  it('stay apart for protan, deutan and tritan readers (ΔE*ab ≥ 15 between any two)', () => {
    // Sanity check of the simulation: pure red and a green of equal lightness merge for a deuteranope
    // (the textbook red–green confusion, common practice).
    const dE = (a: number[], b: number[]): number => Math.hypot(a[0]! - b[0]!, a[1]! - b[1]!, a[2]! - b[2]!);
    expect(dE(lab(apply(CVD.deuteranopia!, rgb('#ff0000'))), lab(apply(CVD.deuteranopia!, rgb('#7a8a00'))))).toBeLessThan(15);
    for (const [name, m] of Object.entries(CVD)) {
      for (let i = 0; i < LAYER_INKS.length; i++)
        for (let j = i + 1; j < LAYER_INKS.length; j++) {
          const d = dE(lab(apply(m, rgb(LAYER_INKS[i]!))), lab(apply(m, rgb(LAYER_INKS[j]!))));
          expect(d, `${name}: ${LAYER_INKS[i]} vs ${LAYER_INKS[j]}`).toBeGreaterThanOrEqual(15);
        }
    }
  });

  it('WCAG 2 contrast ratio and text inks of at least 4.5:1 on white', () => {
    // #767676 is the lightest gray with 4.5:1 on white: 4.54 (WebAIM contrast checker; common practice).
    expect(contrastRatio('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6); // the maximum, by the WCAG definition
    for (const c of LAYER_INKS) expect(contrastRatio(textInk(c), '#ffffff'), c).toBeGreaterThanOrEqual(4.5);
    // Dark enough already: unchanged. Too light: darker, same chromaticity (channel ratios kept in linear light).
    expect(textInk('#0072b2')).toBe('#0072b2');
    const d = textInk('#cc79a7');
    expect(d).not.toBe('#cc79a7');
    expect(contrastRatio(d, '#ffffff')).toBeLessThan(4.7);
    const ratio = (h: string): number => rgb(h)[0]! / rgb(h)[2]!;
    expect(ratio(d)).toBeCloseTo(ratio('#cc79a7'), 1);
  });
});

import { describe, expect, it } from 'vitest';
import { DEFAULT_FIGURE, mmToPt, parseLength, resolveOptions } from '../../src/render/options.js';
import { decimalsFor, formatFixed, niceTicks } from '../../src/render/axes.js';
import { formulaRuns, powerOfTenRuns, quantityRuns, richRuns } from '../../src/render/typeset.js';
import { assignFills, CLASS_TINTS, lightness, luminance, toGray } from '../../src/render/palette.js';

describe('parseLength', () => {
  // 1 in = 25.4 mm exactly (international inch); CSS px = 1/96 in and pt = 1/72 in
  // (W3C CSS Values and Units Level 3, §5.2 absolute lengths) — common practice.
  it('reads mm, cm, in, pt, px and plain numbers', () => {
    expect(parseLength('170mm', 'width')).toBe(170);
    expect(parseLength(85, 'width')).toBe(85);
    expect(parseLength('85', 'width')).toBe(85);
    expect(parseLength('17cm', 'width')).toBeCloseTo(170, 12);
    expect(parseLength('3.5in', 'width')).toBeCloseTo(88.9, 12);
    expect(parseLength('800px', 'width')).toBeCloseTo((800 / 96) * 25.4, 12); // 211.67 mm
    expect(parseLength('240pt', 'width')).toBeCloseTo((240 / 72) * 25.4, 12); // 84.67 mm
    expect(mmToPt(25.4)).toBeCloseTo(72, 12);
  });
  it('rejects junk with a message naming the option', () => {
    expect(() => parseLength('wide', 'width')).toThrow(/width: cannot read "wide"/);
    expect(() => parseLength('12 furlongs', 'height')).toThrow(/height/);
    expect(() => parseLength('0mm', 'width')).toThrow(/positive/);
    expect(() => parseLength(-3, 'width')).toThrow(/positive/);
    expect(() => parseLength('5000mm', 'width')).toThrow(/larger than 2 m/);
  });
  it('merges partial options and refuses unreadable sizes', () => {
    const o = resolveOptions({ width: 170, show: { grid: true } });
    expect(o.width).toBe(170);
    expect(o.show.grid).toBe(true);
    expect(o.show.water).toBe(DEFAULT_FIGURE.show.water);
    expect(() => resolveOptions({ fontSize: 5 })).toThrow(/6 pt/);
    expect(() => resolveOptions({ width: 20 })).toThrow(/too small/);
  });
});

describe('axis ticks', () => {
  // Nice ticks follow the 1–2–5 × 10ⁿ rule (common practice; d3-scale linear.ticks).
  it('gives 0, 2, …, 14 for the pH axis 0–14', () => {
    expect(niceTicks(0, 14, 7).map((t) => t.value)).toEqual([0, 2, 4, 6, 8, 10, 12, 14]);
    expect(niceTicks(0, 14, 7).map((t) => t.label)).toEqual(['0', '2', '4', '6', '8', '10', '12', '14']);
  });
  it('gives fixed one-decimal labels with a true minus for E −1.2…1.6 V', () => {
    const t = niceTicks(-1.2, 1.6, 6);
    expect(t.map((x) => x.value)).toEqual([-1, -0.5, 0, 0.5, 1, 1.5]);
    expect(t.map((x) => x.label)).toEqual(['\u22121.0', '\u22120.5', '0.0', '0.5', '1.0', '1.5']);
  });
  it('writes steps with the right number of decimals and no negative zero', () => {
    expect(decimalsFor(0.25)).toBe(2);
    expect(decimalsFor(0.2)).toBe(1);
    expect(decimalsFor(5)).toBe(0);
    expect(formatFixed(-0.00001, 1)).toBe('0.0');
    expect(niceTicks(-0.3, 0.3, 6).map((t) => t.label)).toEqual(['\u22120.3', '\u22120.2', '\u22120.1', '0.0', '0.1', '0.2', '0.3']);
  });
});

describe('formula typesetting', () => {
  // Counts as subscripts, charge number before its sign as superscript
  // (IUPAC, Quantities, Units and Symbols in Physical Chemistry, 3rd ed., §2.10.1).
  it('sets counts as subscripts and charges as superscripts', () => {
    expect(formulaRuns('Fe+2')).toEqual([
      { text: 'Fe', shift: 'normal' },
      { text: '2+', shift: 'sup' },
    ]);
    expect(formulaRuns('Fe3O4')).toEqual([
      { text: 'Fe', shift: 'normal' },
      { text: '3', shift: 'sub' },
      { text: 'O', shift: 'normal' },
      { text: '4', shift: 'sub' },
    ]);
    expect(formulaRuns('HFeO2-')).toEqual([
      { text: 'HFeO', shift: 'normal' },
      { text: '2', shift: 'sub' },
      { text: '\u2212', shift: 'sup' },
    ]);
    expect(formulaRuns('Fe(OH)2+')).toEqual([
      { text: 'Fe(OH)', shift: 'normal' },
      { text: '2', shift: 'sub' },
      { text: '+', shift: 'sup' },
    ]);
  });
  it('keeps phase tags and unknown text readable', () => {
    expect(formulaRuns('Fe(OH)3(s)').map((r) => r.text)).toEqual(['Fe(OH)', '3', '(s)']);
    expect(formulaRuns('not a formula')).toEqual([{ text: 'not a formula', shift: 'normal' }]);
  });
  it('writes powers of ten, italic quantity symbols and inline formulas', () => {
    expect(powerOfTenRuns(1e-2)).toEqual([
      { text: '10', shift: 'normal' },
      { text: '\u22122', shift: 'sup' },
    ]);
    expect(powerOfTenRuns(1).map((r) => r.text)).toEqual(['1']); // "1", not 10⁰ (issue 17)
    expect(quantityRuns('E / V vs SCE')[0]).toEqual({ text: 'E', shift: 'normal', italic: true });
    expect(richRuns('{O2}/{H2O}').map((r) => r.text)).toEqual(['O', '2', '/H', '2', 'O']);
  });
});

describe('palette', () => {
  // CIE 1976 L* of sRGB grays: #777777 → 50.0, #808080 → 53.6 (recalled from memory; the
  // sRGB/L* definitions are IEC 61966-2-1 and CIE 15:2004). Luminance of pure green is the
  // BT.709 coefficient 0.7152 (ITU-R BT.709-6, item 3.3).
  it('computes CIE L* and luminance', () => {
    expect(lightness('#777777')).toBeCloseTo(50.0, 1);
    expect(lightness('#808080')).toBeCloseTo(53.6, 1);
    expect(lightness('#ffffff')).toBeCloseTo(100, 6);
    expect(lightness('#000000')).toBeCloseTo(0, 6);
    expect(luminance('#00ff00')).toBeCloseTo(0.7152, 4);
  });
  it('keeps the main classes apart in lightness (so in grayscale)', () => {
    // The bands hold for the first two tints of each class (the third is for where three regions
    // of one class meet, and is chosen only there).
    const L = (c: keyof typeof CLASS_TINTS): number[] => CLASS_TINTS[c].slice(0, 2).map(lightness);
    const gap = (a: number[], b: number[]): number => Math.min(...a.flatMap((x) => b.map((y) => Math.abs(x - y))));
    // Element darkest, dissolved lightest; every tint of one class ≥ 4.5 L* from every tint of another.
    expect(Math.max(...L('element'))).toBeLessThan(Math.min(...L('solid')));
    expect(Math.max(...L('solid'))).toBeLessThan(Math.min(...L('dissolved')));
    expect(gap(L('element'), L('solid'))).toBeGreaterThanOrEqual(4.5);
    expect(gap(L('solid'), L('dissolved'))).toBeGreaterThanOrEqual(4.5);
    expect(gap(L('element'), L('dissolved'))).toBeGreaterThanOrEqual(15);
    // Any two tints of a class differ by ≥ 4.5 L* so same-class neighbours stay apart in gray too.
    for (const c of ['element', 'solid', 'dissolved', 'gas'] as const) {
      const all = CLASS_TINTS[c].map(lightness);
      expect(all.length).toBeGreaterThanOrEqual(3);
      for (let i = 0; i < all.length; i++) for (let j = i + 1; j < all.length; j++) expect(Math.abs(all[i]! - all[j]!)).toBeGreaterThanOrEqual(4.5);
    }
    // Gas (first tint) sits between solid and dissolved, ≥ 3 L* from each.
    expect(gap([L('gas')[0]!], [...L('solid'), ...L('dissolved')])).toBeGreaterThanOrEqual(3);
  });
  it('gives same-class neighbours different tints, honours overrides, grays keep L*', () => {
    const regions = [
      { species: 'A', class: 'solid' as const, neighbours: [1] },
      { species: 'B', class: 'solid' as const, neighbours: [0, 2] },
      { species: 'C', class: 'dissolved' as const, neighbours: [1] },
    ];
    const f = assignFills(regions, 'color', {});
    expect(f[0]).not.toBe(f[1]);
    expect(assignFills(regions, 'color', { B: '#FF0000' })[1]).toBe('#ff0000');
    expect(assignFills(regions, 'lines', {})).toEqual([null, null, null]);
    for (const c of assignFills(regions, 'gray', {})) {
      expect(c).toMatch(/^#([0-9a-f]{2})\1\1$/);
    }
    expect(lightness(toGray('#a8cdbd'))).toBeCloseTo(lightness('#a8cdbd'), 0);
  });
});

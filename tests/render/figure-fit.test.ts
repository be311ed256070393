/**
 * A figure request that cannot fit is refused with the typed FigureFitError naming the option to
 * change (exit status 2), never a plain Error (which the command line reports as internal, exit 1).
 */
import { describe, expect, it } from 'vitest';
import { EXIT, FigureFitError, exitStatusOf } from '../../src/errors.js';
import { resolveOptions } from '../../src/render/options.js';
import { buildScene } from '../../src/render/scene.js';
import { iron, opts } from './helpers.js';

function caught(f: () => unknown): unknown {
  try {
    f();
  } catch (e) {
    return e;
  }
  throw new Error('expected a throw');
}

describe('figure too small', () => {
  it('names --width for a width under 40 mm', () => {
    const e = caught(() => resolveOptions({ width: 39 }));
    expect(e).toBeInstanceOf(FigureFitError);
    expect((e as FigureFitError).option).toBe('--width');
    expect(exitStatusOf(e)).toBe(EXIT.input);
  });
  it('names --height for a height under 30 mm', () => {
    const e = caught(() => buildScene({ model: iron(), options: opts({ height: 29 }) }));
    expect(e).toBeInstanceOf(FigureFitError);
    expect((e as FigureFitError).option).toBe('--height');
  });
  it('names --font-size for a font below 6 pt or above 24 pt', () => {
    for (const fontSize of [5, 25]) {
      const e = caught(() => resolveOptions({ fontSize }));
      expect(e).toBeInstanceOf(FigureFitError);
      expect((e as FigureFitError).option).toBe('--font-size');
    }
  });
  it('squeezes a caption that leaves no room for the plot: smaller fonts, taller, then caption to metadata', () => {
    const s = buildScene({ model: iron(), options: opts({ width: 85, height: 40 }), caption: ['x '.repeat(2000)] });
    expect(s.notes).toEqual([
      'font size reduced from 8 to 6 pt to fit',
      'height grown from 40 to 170 mm to fit the title, legend and caption',
      'legend folded (smaller type, tighter spacing) to fit',
      'caption moved to the figure metadata (not drawn) to fit',
    ]);
    expect(s.caption).toMatch(/^x x x/);
    expect(s.plot.h).toBeGreaterThanOrEqual(10 * 6);
  });
  it('names --width when the font leaves no room across', () => {
    // 40 mm = 113 pt wide; at 24 pt the plot needs 4 × 4 × 24 = 384 pt.
    const e = caught(() => buildScene({ model: iron(), options: opts({ width: 40, height: 400, fontSize: 24, show: { ...opts().show, caption: false, legend: false } }) }));
    expect(e).toBeInstanceOf(FigureFitError);
    expect((e as FigureFitError).option).toBe('--width');
  });
  it('keeps a plain Error for values that are not a size (line width)', () => {
    const e = caught(() => resolveOptions({ lineWidth: 0 }));
    expect(e).not.toBeInstanceOf(FigureFitError);
  });
  it('never prints a negative plot size in the refusal (was "24×-223 mm")', () => {
    // A long title and caption at a large font on a narrow figure: the plot has no height left at all.
    for (const [width, fontSize] of [[40, 12], [60, 18], [40, 24]] as const) {
      const e = caught(() => buildScene({ model: iron(), options: opts({ width, height: 30, fontSize, title: 'A very long title '.repeat(12) }), caption: ['x '.repeat(800)] }));
      expect(e).toBeInstanceOf(FigureFitError);
      const msg = (e as FigureFitError).message;
      expect(msg).not.toMatch(/[×x]\s*-\d|-\d+(\.\d+)? mm/);
      expect(msg).toMatch(/--width|wide/);
    }
  });
});

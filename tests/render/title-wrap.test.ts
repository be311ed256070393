/** Fitting the title (issue 17): wrapped at spaces, then shrunk, then cut with an ellipsis. */
import { describe, expect, it } from 'vitest';
import { FONT_SAFETY, runsWidth } from '../../src/render/metrics.js';
import { fitTitle, wrapRuns } from '../../src/render/title-wrap.js';
import { plainRuns, richRuns } from '../../src/render/typeset.js';

const text = (ls: { text: string }[][]): string[] => ls.map((l) => l.map((r) => r.text).join(''));

describe('fitTitle', () => {
  it('keeps a title that fits on one line', () => {
    const t = fitTitle(plainRuns('Iron'), 8.8, 200, 6);
    expect(text(t.lines)).toEqual(['Iron']);
    expect(t.steps).toEqual([]);
  });
  it('wraps a long title at spaces, every line within the width, no word lost', () => {
    const title = 'A much longer title for the cooling-water loop of the north plant at its design temperature';
    const t = fitTitle(plainRuns(title), 8.8, 220, 6);
    expect(t.steps).toEqual(['wrapped']);
    expect(t.lines.length).toBeGreaterThan(1);
    expect(text(t.lines).join(' ')).toBe(title);
    for (const l of t.lines) expect(runsWidth(l, t.size, true) * FONT_SAFETY).toBeLessThanOrEqual(220);
  });
  it('keeps scripts inside their word when wrapping', () => {
    const ls = wrapRuns(richRuns('Iron in {H2O} at high temperature and pressure'), 8.8, 60);
    expect(ls.flat().some((r) => r.shift !== 'normal' || r.text.includes('\u2082'))).toBe(true);
  });
  it('shrinks, then cuts with an ellipsis at the floor', () => {
    const t = fitTitle(plainRuns('Supercalifragilisticexpialidocious-unbreakable-word'), 10, 80, 6);
    expect(t.size).toBe(6);
    expect(t.steps).toContain('cut');
    expect(text(t.lines)[0]!.endsWith('\u2026')).toBe(true);
    expect(runsWidth(t.lines[0]!, 6, true) * FONT_SAFETY).toBeLessThanOrEqual(80);
  });
});

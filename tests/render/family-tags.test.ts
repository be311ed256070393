/**
 * Families of lines (issue 17 items 3 and 6): one tag per line that moves with the dissolved
 * activity (one side a dissolved species), its exponent log a ("0" for a = 1) at the line's end on
 * the plot frame, set in the margin outside the plot — never along the line; tags clear of each
 * other, of the tick marks, tick labels and axis titles; one legend key "a = 1, 10⁻², 10⁻⁴" and
 * "tags: log a".
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { spreadTags, tagRuns } from '../../src/render/family-tags.js';
import { segmentHitsRect } from '../../src/render/geometry.js';
import { buildScene } from '../../src/render/scene.js';
import type { Rect, Scene, ScenePath, SceneText } from '../../src/render/scene-types.js';
import { readSpec } from '../../src/system/spec.js';
import { allItems } from './helpers.js';
import { overlaps } from './overlap-helpers.js';

const textOf = (t: SceneText): string => t.runs.map((r) => r.text).join('');

function scene(element: string, celsius: number, width: number, extra: Record<string, unknown> = {}): { s: Scene; input: ReturnType<typeof figureInput>; c: ReturnType<typeof compute> } {
  const c = compute(readSpec({ element, activity: 1e-6, temperature: celsius, E: [-1.2, 1.6], figure: { width: `${width}mm`, families: [1, 1e-2, 1e-4], ...extra } }, 'fam.yaml'));
  const input = figureInput(c, figureSettings(c.spec));
  return { s: buildScene(input), input, c };
}

const tags = (s: Scene): SceneText[] => allItems(s).filter((t): t is SceneText => t.type === 'text' && t.role === 'family-tag');
const inside = (b: Rect, r: Rect): boolean => b.x > r.x + 0.01 && b.y > r.y + 0.01 && b.x + b.w < r.x + r.w - 0.01 && b.y + b.h < r.y + r.h - 0.01;
const meets = (a: Rect, b: Rect): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

describe('family tags', () => {
  it('tag text is log a: "0" for unit activity (not 10⁰), "−2", one decimal when not whole', () => {
    expect(textOf({ runs: tagRuns(1) } as SceneText)).toBe('0');
    expect(textOf({ runs: tagRuns(1e-2) } as SceneText)).toBe('\u22122');
    expect(textOf({ runs: tagRuns(10 ** -2.5) } as SceneText)).toBe('\u22122.5');
  });

  it('spreads crowded tags along a column without overlap, in order, near their line ends', () => {
    const pos = spreadTags([{ at: 50, len: 5, rank: 0 }, { at: 51, len: 5, rank: 1 }, { at: 52, len: 5, rank: 2 }], 0, 100, 1, 20) as number[];
    expect(pos.every((p) => p !== null)).toBe(true);
    for (let k = 1; k < 3; k++) expect(pos[k]! - pos[k - 1]!).toBeGreaterThanOrEqual(6 - 1e-9);
    expect((pos[0]! + pos[1]! + pos[2]!) / 3).toBeCloseTo(51, 9); // centred on the mean of the ends
    // Clamped into the column at its end; a tag that would move too far is left out.
    const edge = spreadTags([{ at: 1, len: 5, rank: 0 }], 0, 100, 1, 20);
    expect(edge[0]).toBeCloseTo(2.5, 9);
    const tight = spreadTags([{ at: 50, len: 5, rank: 0 }, { at: 50, len: 5, rank: 1 }, { at: 50, len: 5, rank: 2 }], 0, 100, 1, 4);
    expect(tight.filter((p) => p === null).length).toBeGreaterThan(0);
  });

  it('Fe, 170 mm: tags only on lines with a dissolved side, in the margin, none along the lines; legend keys the tags', () => {
    const { s, input, c } = scene('Fe', 25, 170);
    const dissolved = new Set(c.model.species.filter((x) => x.class === 'dissolved').map((x) => x.formula));
    const moving = input.families!.flatMap((f) => f.boundaries.filter((b) => b.between.some((x) => dissolved.has(x)))).length;
    const ts = tags(s);
    expect(ts.length).toBeGreaterThan(0);
    expect(ts.length).toBeLessThanOrEqual(moving);
    expect(allItems(s).filter((t) => t.type === 'text' && t.role === 'family-label')).toEqual([]);
    for (const t of ts) {
      expect(['0', '\u22122', '\u22124']).toContain(textOf(t));
      expect(meets(t.box!, s.plot)).toBe(false); // in the margin, outside the plot
    }
    const legend = allItems(s).filter((t): t is SceneText => t.type === 'text' && t.role === 'legend-label').map(textOf);
    expect(legend).toContain('a = 1, 10\u22122, 10\u22124');
    expect(legend).toContain('tags: log a');
  });

  it('each tag sits at (or has a leader to) the end of a family line on the frame side it names', () => {
    const { s } = scene('Fe', 25, 85);
    const fam = allItems(s).filter((p): p is ScenePath => p.type === 'path' && p.role === 'family');
    const ends = fam.flatMap((p) => p.subpaths.flatMap((sp) => [sp.points[0]!, sp.points[sp.points.length - 1]!]));
    const leaders = allItems(s).filter((p): p is ScenePath => p.type === 'path' && p.role === 'family-tag-leader');
    for (const t of tags(s)) {
      const b = t.box!;
      const near = ends.some(([x, y]) => Math.max(b.x - x, x - (b.x + b.w), 0) + Math.max(b.y - y, y - (b.y + b.h), 0) < 0.6 * t.size + 4);
      const led = leaders.some((l) => l.subpaths.some((sp) => segmentHitsRect(sp.points[0]!, sp.points[1]!, { x: b.x - 0.5, y: b.y - 0.5, w: b.w + 1, h: b.h + 1 })));
      expect(near || led, `tag ${textOf(t)} at ${b.x.toFixed(1)},${b.y.toFixed(1)}`).toBe(true);
    }
  });

  it('beside a second E axis the right margin is the axis\'s: tags go elsewhere, still clear of everything', () => {
    for (const width of [85, 170]) {
      const { s } = scene('Fe', 25, width, { fontSize: 11, style: 'lines' });
      const c = compute(readSpec({ element: 'Fe', activity: 1e-6, E: [-1.2, 1.6], reference: 'agcl-sat', figure: { width: `${width}mm`, families: [1, 1e-2, 1e-4] } }, 'fam.yaml'));
      const s2 = buildScene(figureInput(c, figureSettings(c.spec)));
      for (const sc of [s, s2]) expect(overlaps(sc)).toEqual([]);
      expect(tags(s2).length).toBeGreaterThan(0);
      expect(tags(s2).filter((t) => t.data?.side === 'right')).toEqual([]);
    }
  });

  for (const element of ['Ag', 'Al', 'Au', 'Co', 'Cr', 'Cu', 'Fe', 'Mn', 'Mo', 'Ni', 'Pb', 'Sn', 'Ti', 'Zn']) {
    for (const celsius of [25, 300]) {
      for (const width of [40, 85, 170]) {
        it(`${element}, ${celsius} °C, ${width} mm: fits; tags clear of each other, ticks, tick labels, axis titles and the frame`, () => {
          const { s } = scene(element, celsius, width);
          expect(overlaps(s)).toEqual([]);
          const ticks = allItems(s).filter((p): p is ScenePath => p.type === 'path' && (p.role === 'tick' || p.role === 'frame'));
          const rotated = allItems(s).filter((t): t is SceneText => t.type === 'text' && t.rotate !== 0);
          for (const t of tags(s)) {
            const b = t.box!;
            expect(inside(b, { x: 0, y: 0, w: s.widthPt, h: s.heightPt })).toBe(true);
            for (const p of ticks) for (const sp of p.subpaths) {
              const pts = sp.closed ? [...sp.points, sp.points[0]!] : sp.points;
              for (let k = 0; k + 1 < pts.length; k++) expect(segmentHitsRect(pts[k]!, pts[k + 1]!, b), `tag ${textOf(t)} on a ${p.role}`).toBe(false);
            }
            // The rotated E-axis title: its x band lies left of every tag.
            for (const r of rotated.filter((x) => x.role === 'axis-title')) expect(b.x).toBeGreaterThan(r.x);
          }
        });
      }
    }
  }
});

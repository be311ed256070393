/**
 * Composition-mode layers of a figure from a model (no solver): undetermined areas get their own
 * fill and legend entry and read "undetermined" in the HTML read-out (never blank, never a form);
 * iso-solubility levels are labelled 10⁻⁶ / 3×10⁻⁵ / 0.05.
 */
import { describe, expect, it } from 'vitest';
import type { DiagramModel } from '../../src/model.js';
import { pageData } from '../../src/render/html.js';
import { buildScene, type SceneItem } from '../../src/render/scene.js';
import { levelRuns } from '../../src/render/scene-iso.js';
import { iron, opts } from './helpers.js';

const flat = (items: SceneItem[]): SceneItem[] => items.flatMap((i) => (i.type === 'group' ? flat(i.children) : [i]));

/** The iron model dressed as a composition-mode one, with one undetermined square and one iso-line. */
function bathModel(): DiagramModel {
  const m = iron();
  return {
    ...m,
    kind: 'composition',
    composition: { totals: { Fe: 1e-3 }, units: 'mol/kg', ionicStrength: 0, grid: { nx: 40, ny: 40, failed: 3 }, undetermined: [[[[6, 0], [7, 0], [7, 0.2], [6, 0.2]]]] },
    isoSolubility: [{ level: 1e-6, lines: [[[2, -1], [12, 1]]] }],
  };
}

describe('composition layers', () => {
  it('undetermined areas: own fill over the regions, legend entry, HTML reads "Undetermined" there', () => {
    const model = bathModel();
    const scene = buildScene({ model, options: opts({ width: 170 }) });
    const items = flat(scene.items);
    const und = items.filter((i) => i.role === 'undetermined');
    expect(und).toHaveLength(1);
    expect(und[0]!.type === 'path' && und[0]!.fill).toBeTruthy();
    const legend = items.filter((i) => i.type === 'text' && i.role === 'legend-label').map((i) => (i.type === 'text' ? i.runs.map((r) => r.text).join('') : ''));
    expect(legend).toContain('undetermined (not solved)');
    expect(legend).toContain('dissolved Fe total, mol/kg');
    expect(items.filter((i) => i.role === 'iso-solubility')).toHaveLength(1);
    const d = pageData(scene, model);
    expect(d.regions[0]!.label).toBe('Undetermined');
    expect(d.regions[0]!.polygons[0]![0]![0]).toEqual([6, 0]);
    expect(d.regions[1]!.reading).toContain('largest share of Fe');
  });
  it('names the cause of the undetermined areas: failed points, gaps left near junctions (issue 13), or both', () => {
    const legendOf = (model: DiagramModel) => flat(buildScene({ model, options: opts({ width: 170 }) }).items)
      .filter((i) => i.type === 'text' && i.role === 'legend-label').map((i) => (i.type === 'text' ? i.runs.map((r) => r.text).join('') : ''));
    const base = bathModel();
    const gapOnly: DiagramModel = { ...base, composition: { ...base.composition!, grid: { nx: 40, ny: 40, failed: 0 }, unresolved: 1 } };
    expect(legendOf(gapOnly)).toContain('undetermined (not resolved at this grid)');
    expect(pageData(buildScene({ model: gapOnly, options: opts({ width: 170 }) }), gapOnly).regions[0]!.reading).toContain('not resolved at this grid');
    const square = base.composition!.undetermined[0]!;
    const both: DiagramModel = { ...base, composition: { ...base.composition!, undetermined: [square, square], unresolved: 1 } };
    expect(legendOf(both)).toContain('undetermined (not solved or not resolved)');
  });
  it('level labels', () => {
    const txt = (v: number) => levelRuns(v).map((r) => (r.shift === 'sup' ? `^${r.text}` : r.text)).join('');
    expect(txt(1e-6)).toBe('10^\u22126');
    expect(txt(3e-5)).toBe('3\u00d710^\u22125');
    expect(txt(0.05)).toBe('0.05');
    expect(txt(1e-2)).toBe('10^\u22122');
  });
});

describe('HTML share read-out (composition mode)', () => {
  it('the page carries a read-out grid, and its script reads the nearest node: form, share, dissolved total', async () => {
    const { computeAny } = await import('../../src/pipeline.js');
    const { readSpec } = await import('../../src/system/spec.js');
    const { figureInput } = await import('../../src/figure/compose.js');
    const { figureSettings } = await import('../../src/figure/options.js');
    const { renderFigure } = await import('../../src/figure/output.js');
    const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, grid: 41 }, 'bath.yaml');
    const html = String(await renderFigure(figureInput(computeAny(spec), figureSettings(spec)), 'html'));
    const json = /<script type="application\/json" id="ephmap-data">(.*?)<\/script>/s.exec(html)![1]!;
    const data = JSON.parse(json);
    expect(data.grid.nx).toBe(41);
    expect(data.grid.forms).toContain('Ag(CN)\u2082\u207b');
    // The page's own functions, run on its own data (the script is plain ES5 text in the page).
    const fn = (name: string) => new RegExp(`function ${name}\\(.*?\\n  }\\n`, 's').exec(html)![0];
    const reading = new Function('data', `${fn('num')}${fn('gridReading')}return gridReading;`)(data) as (pH: number, E: number) => string;
    // pH 12, E = 0 V vs SHE: the cyanide complexes hold the silver (Ag(CN)2- predominant there).
    expect(reading(12, 0)).toMatch(/^\. Nearest grid node: Ag\(CN\)\u2082\u207b holds \d+\.\d % of Ag; dissolved Ag 10\^\u22120\.\d\d mol\/kg$/);
    // pH 7, E = −1.5 V: metallic silver holds it all (immunity), little dissolved.
    expect(reading(7, -1.5)).toMatch(/Ag holds 100\.0 % of Ag/);
  });
});

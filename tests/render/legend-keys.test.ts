/**
 * Legend keys (issue 17): a swatch for every tint the fills use, and the ligand acid–base lines
 * drawn and keyed apart from the neutral-pH line.
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { buildScene } from '../../src/render/scene.js';
import type { ScenePath, SceneText } from '../../src/render/scene-types.js';
import { readSpec } from '../../src/system/spec.js';
import { allItems } from './helpers.js';

const paths = (s: ReturnType<typeof buildScene>, role: string): ScenePath[] => allItems(s).filter((p): p is ScenePath => p.type === 'path' && p.role === role);
const legendTexts = (s: ReturnType<typeof buildScene>): string[] =>
  allItems(s).filter((t): t is SceneText => t.type === 'text' && t.role === 'legend-label').map((t) => t.runs.map((r) => r.text).join(''));

describe('legend swatches', () => {
  it('shows every tint the region fills use (iron: Fe2+ and Fe3+ in two dissolved tints)', () => {
    const c = compute(readSpec({ element: 'Fe', activity: 1e-6, E: [-1.2, 1.6] }, 'fe.yaml'));
    const s = buildScene(figureInput(c, figureSettings(c.spec)));
    const used = new Set(paths(s, 'region').map((p) => p.fill).filter((f): f is string => f !== null));
    const keyed = new Set(paths(s, 'legend-swatch').map((p) => p.fill));
    expect(used.size).toBeGreaterThan(3); // more tints than classes: the check can fail
    for (const f of used) expect(keyed).toContain(f);
  });
});

describe('ligand acid–base lines', () => {
  it('are dash-dot, keyed in the legend, and differ from the dotted neutral line', () => {
    const c = compute(readSpec({ element: 'Cu', temperature: 60, ligands: { S: 1e-3 }, E: [-1.0, 1.2] }, 'cu.yaml'));
    const s = buildScene(figureInput(c, figureSettings(c.spec, { show: 'ligands,neutral' })));
    const lig = paths(s, 'ligand-boundary');
    const neu = paths(s, 'neutral');
    expect(lig.length).toBeGreaterThan(0);
    expect(neu.length).toBe(1);
    expect(lig[0]!.dash).not.toEqual(neu[0]!.dash);
    expect(lig[0]!.dash!.length).toBe(4); // dash, gap, dot, gap
    expect(legendTexts(s)).toEqual(expect.arrayContaining(['neutral water', 'ligand acid\u2013base boundaries']));
  });
});

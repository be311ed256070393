/**
 * One class→verdict rule (diagram/verdict.ts) behind probe, the fill, the legend and the HTML
 * read-out: `classes: {Fe3O4: corrosion}` (a porous, non-protective magnetite film read as
 * corrosion — common practice) must show in each of them. Before this fix the fill and legend
 * followed the region class and the HTML read-out kept its own copy of the rule.
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { pageData } from '../../src/render/html.js';
import { CLASS_TINTS } from '../../src/render/palette.js';
import { buildScene } from '../../src/render/scene.js';
import { runsUnicode } from '../../src/render/typeset.js';
import { probe } from '../../src/analysis/probe.js';
import { pointsOutputRow } from '../../src/report/points-csv.js';
import { reportData } from '../../src/report/report-data.js';
import { readSpec } from '../../src/system/spec.js';
import { allItems, texts } from './helpers.js';

const base = { element: 'Fe', temperature: 25, pH: [0, 14], E: [-1.2, 1.4] };

function figure(classes?: Record<string, string>) {
  const spec = readSpec(classes ? { ...base, classes } : base, 'fe.yaml');
  const c = compute(spec);
  const scene = buildScene(figureInput(c, figureSettings(spec, { width: '170' })));
  return { c, scene };
}

function regionFill(scene: ReturnType<typeof figure>['scene'], species: string): string | null {
  const p = allItems(scene).find((q) => q.type === 'path' && q.role === 'region' && q.data?.species === species);
  if (p?.type !== 'path') throw new Error(`no region path for ${species}`);
  return p.fill;
}

describe('classes: reclassification', () => {
  const plain = figure();
  const moved = figure({ Fe3O4: 'corrosion' });
  const fe3o4 = moved.c.model.regions.find((r) => r.species === 'Fe3O4');

  it('has a magnetite field to reclassify', () => {
    expect(fe3o4).toBeDefined();
    expect(fe3o4!.class).toBe('solid');
    expect(fe3o4!.verdict).toBe('corrosion');
  });

  it('probe reports the reclassified verdict inside the field', () => {
    const at = fe3o4!.polygons[0]![0]!;
    // A point inside: the mean of the outer ring's vertices (the field is convex).
    const pH = at.reduce((s, p) => s + p[0], 0) / at.length;
    const E = at.reduce((s, p) => s + p[1], 0) / at.length;
    expect(probe(moved.c, pH, E).verdict).toBe('corrosion');
    expect(probe(plain.c, pH, E).verdict).toBe('passivation');
  });

  it('fills the field with a corrosion (dissolved) tint instead of a passivation (solid) tint', () => {
    const before = regionFill(plain.scene, 'Fe3O4');
    const after = regionFill(moved.scene, 'Fe3O4');
    expect(CLASS_TINTS.solid).toContain(before);
    expect(CLASS_TINTS.dissolved).toContain(after);
  });

  it('names the reclassified species with the corrosion swatch in the legend', () => {
    const legend = texts(moved.scene).filter((t) => t.role === 'legend-label').map((t) => runsUnicode(t.runs));
    const corrosion = legend.find((l) => l.startsWith('dissolved (corrosion)'));
    expect(corrosion).toContain('reclassified');
    expect(corrosion).toContain('Fe\u2083O\u2084');
    const legendPlain = texts(plain.scene).filter((t) => t.role === 'legend-label').map((t) => runsUnicode(t.runs));
    expect(legendPlain).toContain('dissolved (corrosion)');
  });

  it('reads the reclassified verdict in the HTML read-out', () => {
    const before = pageData(plain.scene, plain.c.model).regions.find((r) => r.formula === 'Fe3O4')!;
    const after = pageData(moved.scene, moved.c.model).regions.find((r) => r.formula === 'Fe3O4')!;
    expect(before.reading).toBe('passivation');
    expect(after.reading).toBe('corrosion');
  });

  it('shows the reclassified verdict in the report and the points CSV', () => {
    const at = fe3o4!.polygons[0]![0]!;
    const pH = at.reduce((s, p) => s + p[0], 0) / at.length;
    const E = at.reduce((s, p) => s + p[1], 0) / at.length;
    const withPoint = (classes?: Record<string, string>) =>
      compute(readSpec({ ...base, ...(classes ? { classes } : {}), points: [{ label: 'in magnetite', pH, E }] }, 'fe.yaml'));
    expect(reportData(withPoint()).points.map((p) => p.result.verdict)).toEqual(['passivation']);
    expect(reportData(withPoint({ Fe3O4: 'corrosion' })).points.map((p) => p.result.verdict)).toEqual(['corrosion']);
    const row = pointsOutputRow({ line: 2, pH, potential: E, extra: [], given: {}, unit: 'V' }, 'SHE', probe(moved.c, pH, E), [], ',');
    expect(row).toMatch(/,Fe3O4,corrosion,/);
  });
});

/**
 * `ephmap overlay` of one file at other temperatures: the file's operating marks and its reference
 * axis belong to the file's own temperature (where the potentials were measured), not to the base
 * layer's. The electrode here is a custom one with a stated coefficient, so that the expected
 * offsets follow by hand from its linear formula: 0.200 V + (−0.0010 V/K)·(t − 25 °C) —
 * 0.150 V at 75 °C, 0.200 V at 25 °C (invented electrode; the arithmetic is the check).
 */
import { describe, expect, it } from 'vitest';
import { loadSpec } from '../../src/pipeline.js';
import { computeLayers, layerSpecs, overlayFigure, overlaySettings } from '../../src/figure/overlay.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';
import { readFileSync } from 'node:fs';
import { referenceOffset } from '../../src/thermo/reference.js';
import { join } from 'node:path';

const dir = tmpDir();
const file = writeTmp(
  dir,
  'loop.yaml',
  [
    'element: Fe',
    'temperature: 75',
    'activity: 1.0e-6',
    'pH: [4, 12]',
    'E: [-1.2, 0.8]',
    'reference: {name: "loop probe", potential: 0.200, dEdT: -0.0010}',
    'points:',
    '  - {label: supply, pH: 9.8, E: -0.62}',
    'boxes:',
    '  - {label: band, pH: [9, 10], E: [-0.70, -0.60]}',
    '',
  ].join('\n'),
);

function figure(temperatures: number[]) {
  const spec = loadSpec(file);
  const layers = computeLayers(layerSpecs({ specs: [spec], temperatures }));
  const fig = overlaySettings(layers, {});
  return overlayFigure(layers, fig, false, spec).input;
}

describe('overlay: operating marks and reference axis at the file temperature', () => {
  it('converts the point and box at the file temperature (75 °C: offset 0.150 V) when the base layer is at 25 °C', () => {
    const input = figure([25, 150]);
    expect(input.points?.[0].E).toBeCloseTo(-0.62 + 0.15, 9);
    expect(input.boxes?.[0].E[0]).toBeCloseTo(-0.7 + 0.15, 9);
    expect(input.options.secondAxis?.offset).toBeCloseTo(0.15, 9);
  });

  it('says in the caption that marks and second axis use the file temperature when layers differ from it', () => {
    const input = figure([25, 150]);
    const cap = (input.caption ?? []).join(' ');
    expect(cap).toContain("use the file's temperature (75 °C)");
  });

  it('no such note when every layer is at the file temperature', () => {
    const spec = loadSpec(file);
    const layers = computeLayers(layerSpecs({ specs: [spec], activities: [1e-6, 1e-4] }));
    const fig = overlaySettings(layers, {});
    const input = overlayFigure(layers, fig, false, spec).input;
    expect((input.caption ?? []).join(' ')).not.toContain("file's temperature");
    expect(input.options.secondAxis?.offset).toBeCloseTo(0.15, 9);
  });

  it('the --ref axis is at the file temperature too (HTML read-out offset of the SCE at 75 °C, not at 25 °C)', async () => {
    const out = join(dir, 'ov.html');
    const r = await runCli(['overlay', file, '--temperatures', '25,150', '--ref', 'sce', '-o', out]);
    expect(r.code).toBe(0);
    const second = JSON.parse(/"second":(\{[^}]*\})/.exec(readFileSync(out, 'utf8'))![1]) as { name: string; offset: number };
    expect(second.name).toBe('SCE');
    expect(second.offset).toBeCloseTo(referenceOffset('sce', 75).offset, 4);
    expect(Math.abs(second.offset - referenceOffset('sce', 25).offset)).toBeGreaterThan(0.01);
  });
});

describe('overlay legend of long layer labels', () => {
  // 20 mg/L chloride and 120 mg/L bicarbonate make each full layer label ~90 characters, wider than
  // an 85 mm figure's legend row: the legend used to run off the right edge.
  const loop = writeTmp(dir, 'loop-lig.yaml', 'element: Fe\ntemperature: 90\nconcentration: "0.05 mg/L"\nligands: {Cl: "20 mg/L", C: "120 mg/L as HCO3"}\npH: [5, 12]\nE: [-1.4, 0.8]\n');

  it('names the layers by what differs (the temperature) in the legend, in full in the caption', () => {
    const spec = loadSpec(loop);
    const layers = computeLayers(layerSpecs({ specs: [spec], temperatures: [25, 90, 150] }));
    const fig = overlaySettings(layers, { width: '85mm' });
    const input = overlayFigure(layers, fig, false, spec).input;
    expect(input.overlays?.map((o) => o.label)).toEqual(['Fe, 90 °C', 'Fe, 150 °C']);
    expect(input.baseLabel).toBe('Fe, 25 °C (filled)');
    const cap = (input.caption ?? []).join(' ');
    expect(cap).toMatch(/Layers: Fe, 25 °C, 0\.05 mg\/L .*Cl 20 mg\/L .*C 120 mg\/L as HCO₃/); // the formula in Unicode, as text for people
  });

  it('keeps short labels as they are', () => {
    const spec = loadSpec(file);
    const layers = computeLayers(layerSpecs({ specs: [spec], temperatures: [25, 150] }));
    const input = overlayFigure(layers, overlaySettings(layers, {}), false, spec).input;
    expect(input.overlays?.[0].label).toMatch(/^Fe, 150 °C, a = 10/);
  });
});

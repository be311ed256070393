/**
 * A species that cannot be carried to the diagram temperature (an inline species with only ΔfG°)
 * stays in the system as undetermined: its field is placed with its 25 °C ΔfG° (geometry only),
 * drawn with its own fill and legend entry, has no verdict (`probe` says unknown and names it), and
 * every output carries the caveat (probe text/JSON, `probe --points` rows, `lines`, `window`, the
 * caption, the report). Issue 12 item 2. The HZnO2- value (−464.0 kJ/mol, NBS tables, Wagman et
 * al. 1982, recalled) is only a test input here.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { probe } from '../../src/analysis/probe.js';
import { platingWindow } from '../../src/analysis/window.js';
import { computeFile } from '../../src/pipeline.js';
import { renderDiagram } from '../../src/figure/output.js';
import { UNDETERMINED_FILL } from '../../src/render/palette.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const SYSTEM = { element: 'Zn', temperature: 150, species: ['Zn', 'Zn^2+', 'ZnO', { formula: 'HZnO2^-', phase: 'aq', dfG: -464.0 }] };

function setup() {
  const dir = tmpDir();
  const file = writeTmp(dir, 'zn.json', JSON.stringify(SYSTEM));
  const c = computeFile(file);
  const region = c.model.regions.find((r) => r.species === 'HZnO2^-')!;
  // A point inside the undetermined field: the mean of its outer ring's vertices (the field is convex).
  const ring = region.polygons[0]![0]!;
  const pH = ring.reduce((s, p) => s + p[0], 0) / ring.length;
  const E = ring.reduce((s, p) => s + p[1], 0) / ring.length;
  return { dir, file, c, region, pH, E };
}

describe('undetermined species (only ΔfG°, away from 25 °C)', () => {
  it('keeps the field, marks it undetermined and gives it no verdict', () => {
    const { c, region } = setup();
    expect(region.undetermined).toBe(true);
    expect(region.verdict).toBeUndefined();
    expect(c.model.species.find((s) => s.formula === 'HZnO2^-')!.temperatureModel).toBe('undetermined');
    expect(c.model.warnings[0]).toMatch(/^undetermined away from 25 °C.*HZnO2\^-/);
    // The other fields keep their verdicts.
    expect(c.model.regions.find((r) => r.species === 'ZnO')!.verdict).toBe('passivation');
  });

  it('probe inside the field says unknown and names the species; a crossing into it is unknown too', () => {
    const { c, pH, E } = setup();
    const r = probe(c, pH, E);
    expect(r.predominant).toBe('HZnO2^-');
    expect(r.verdict).toBe('unknown');
    expect(r.warnings[0]).toMatch(/no verdict here: HZnO2\^-/);
    const zno = c.model.regions.find((x) => x.species === 'ZnO')!.polygons[0]![0]!;
    const q = probe(c, zno.reduce((s, p) => s + p[0], 0) / zno.length, zno.reduce((s, p) => s + p[1], 0) / zno.length);
    expect(q.verdict).toBe('passivation');
    expect(q.warnings.join(' ')).toMatch(/undetermined.*HZnO2\^-/);
    const into = Object.values(q.crossings).filter((x) => x?.to === 'HZnO2^-');
    expect(into.length).toBeGreaterThan(0);
    for (const x of into) expect(x!.verdict).toBe('unknown');
  });

  it('probe text, probe --json, probe --points rows, lines (text and JSON) and window carry the caveat', async () => {
    const { dir, file, pH, E } = setup();
    const t = await runCli(['probe', file, '--ph', String(pH), '--potential', String(E)]);
    expect(t.code).toBe(0);
    expect(t.stdout).toMatch(/verdict: UNKNOWN/);
    expect(t.stdout).toMatch(/warnings:\n {2}no verdict here: HZnO₂⁻/);
    const j = JSON.parse((await runCli(['probe', file, '--ph', String(pH), '--potential', String(E), '--json'])).stdout);
    expect(j.verdict).toBe('unknown');
    expect(j.warnings[0]).toMatch(/HZnO2\^-/);
    const pts = writeTmp(dir, 'p.csv', `pH,potential\n${pH},${E}\n1,-0.2\n`);
    const csv = (await runCli(['probe', file, '--points', pts])).stdout.trim().split('\n');
    expect(csv[0]!.split(',').slice(-2)).toEqual(['warnings', 'error']);
    expect(csv[1]).toMatch(/unknown/);
    expect(csv[1]).toMatch(/no verdict here: HZnO2\^-/);
    expect(csv[2]).toMatch(/undetermined away from 25 °C/);
    const lt = await runCli(['lines', file]);
    expect(lt.stdout).toMatch(/Warnings:\n {2}undetermined away from 25 °C.*HZnO₂⁻/);
    const lj = JSON.parse((await runCli(['lines', file, '--json'])).stdout);
    expect(lj.warnings[0]).toMatch(/HZnO2\^-/);
    const wj = JSON.parse((await runCli(['window', file, '--json'])).stdout);
    expect(wj.warnings.join(' ')).toMatch(/HZnO2\^-/);
    const wt = await runCli(['window', file]);
    expect(wt.stdout).toMatch(/warnings:/);
  });

  it('the figure fills the field with its own fill and names it in the legend and the caption', async () => {
    const { c } = setup();
    // 85×95 mm: the extra legend entry and caption line need more than the default 80 mm height.
    const svg = String(await renderDiagram(c, 'svg', { height: '95' }));
    expect(svg.toLowerCase()).toContain(UNDETERMINED_FILL);
    expect(svg).toMatch(/>undetermined</);
    // The caption typesets the Unicode formula: subscript 2 and superscript minus as shifted runs.
    expect(svg).toMatch(/Undetermined, no verdict \(ΔfG° only\): HZnO<\/tspan><tspan dy="[\d.]+" font-size="[\d.]+">2<\/tspan><tspan dy="-[\d.]+" font-size="[\d.]+">−<\/tspan>/);
  });

  it('the report lists the caveat', async () => {
    const { dir, file } = setup();
    const out = join(dir, 'r.md');
    const r = await runCli(['report', file, '-o', out]);
    expect(r.code).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/undetermined away from 25 °C.*HZnO₂⁻/);
  });

  it('at 25 °C the same species is an ordinary field with a verdict', () => {
    const dir = tmpDir();
    const c = computeFile(writeTmp(dir, 'z25.json', JSON.stringify({ ...SYSTEM, temperature: 25 })));
    const r = c.model.regions.find((x) => x.species === 'HZnO2^-')!;
    expect(r.undetermined).toBeUndefined();
    expect(r.verdict).toBe('corrosion');
    expect(platingWindow(c.model).warnings.join(' ')).not.toMatch(/undetermined/);
  });
});

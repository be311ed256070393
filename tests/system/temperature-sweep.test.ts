/**
 * Done-when sweep of issue 12: `draw`, `probe`, `lines` and `window` for all 14 library metals at 26,
 * 150 and 300 °C through the library API give an answer (no error, default figure size), keep every
 * library species (none left out, none undetermined: the library has S° or ΔfH° or an estimate for
 * all), and no probe verdict flips between T and T + 1 K at a grid of points unless a boundary
 * legitimately passes through the point: then the point lies within 6 mV (along E) or 0.1 pH (along
 * pH) of a boundary at T — a boundary moves at most about 5–6 mV per kelvin
 * (tests/system/temperature-continuity.test.ts).
 * Physical expectation ("common practice"): standard-state properties are smooth in T, so a 1 K step
 * changes a verdict only next to a boundary.
 */
import { describe, expect, it } from 'vitest';
import { probe } from '../../src/analysis/probe.js';
import { loadLibrary, metastableAt } from '../../src/data/library.js';
import { platingWindow } from '../../src/analysis/window.js';
import { renderDiagram } from '../../src/figure/output.js';
import { compute } from '../../src/pipeline.js';
import { linesText } from '../../src/report/lines.js';
import { readSpec } from '../../src/system/spec.js';

const METALS = ['Fe', 'Cu', 'Zn', 'Ni', 'Cr', 'Al', 'Co', 'Sn', 'Pb', 'Ag', 'Au', 'Ti', 'Mn', 'Mo'];
const TEMPS = [26, 150, 300];
const POINTS: [number, number][] = [];
for (const pH of [1, 4, 7, 10, 13]) for (const E of [-1.2, -0.6, -0.2, 0.2, 0.6, 1.2]) POINTS.push([pH, E]);

const at = (element: string, temperature: number) => compute(readSpec({ element, temperature }, `${element}.json`));

describe.each(METALS)('%s at 26, 150 and 300 °C', (el) => {
  const base = at(el, 25);
  it.each(TEMPS)('%s °C: draw, probe, lines, window answer with every library species kept', async (t) => {
    const c = at(el, t);
    // Every library species kept, the phase choices by temperature (species/Al.json: gibbsite below
    // 100 °C, boehmite above) being the species the library means at t.
    const choice = loadLibrary().filter((s) => s.stableBelow !== undefined || s.stableAbove !== undefined);
    const plain = (list: string[]) => list.filter((f) => !choice.some((s) => s.formula === f)).sort();
    expect(plain(c.model.species.map((s) => s.formula))).toEqual(plain(base.model.species.map((s) => s.formula)));
    for (const s of choice) if (s.elements[el]) expect(c.model.species.some((x) => x.formula === s.formula), `${s.formula} at ${t} °C`).toBe(!metastableAt(s, t));
    expect(c.model.species.filter((s) => s.temperatureModel === 'undetermined')).toEqual([]);
    expect(c.model.warnings.join('\n')).not.toMatch(/left out|dropped|undetermined/i);
    const svg = String(await renderDiagram(c, 'svg'));
    expect(svg).toMatch(/^<svg|<\?xml/);
    expect(linesText(c.model)).toMatch(/Water lines/);
    expect(Array.isArray(platingWindow(c.model).windows)).toBe(true);
    for (const [pH, E] of POINTS) expect(['immunity', 'passivation', 'corrosion']).toContain(probe(c, pH, E).verdict);
  });
  it.each(TEMPS)('%s °C → +1 K: a verdict flips only where a boundary is within the step', (t) => {
    const c0 = at(el, t);
    const c1 = at(el, t + 1);
    for (const [pH, E] of POINTS) {
      const a = probe(c0, pH, E);
      const b = probe(c1, pH, E);
      if (a.verdict === b.verdict) continue;
      const nearE = a.distance.mV !== null && Math.abs(a.distance.mV) <= 6;
      const nearPH = a.distance.pH !== null && Math.abs(a.distance.pH) <= 0.1;
      expect(nearE || nearPH, `${el} pH ${pH}, E ${E}: ${a.verdict} at ${t} °C, ${b.verdict} at ${t + 1} °C, boundary ${a.distance.mV} mV / ${a.distance.pH} pH away`).toBe(true);
    }
  });
});

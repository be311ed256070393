/**
 * Composition mode withholds the verdict where a species whose G at T is unknown (an inline
 * species with only ΔfG°, away from 25 °C) holds part of the element (issue 12, item 5): the probe
 * says `unknown` and names it, the diagram marks that area undetermined, `probe --points` rows say
 * so. Before the fix the probe gave `corrosion` where the undetermined HZnO2- held the zinc and
 * `passivation` where it held a quarter of it. The HZnO2- value (−464.0 kJ/mol, NBS tables, Wagman
 * et al. 1982, recalled) is only a test input here.
 */
import { describe, expect, it } from 'vitest';
import { compositionProbe } from '../../src/analysis/composition-probe.js';
import { computeComposition } from '../../src/diagram/composition.js';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { UNDETERMINED_SHARE } from '../../src/diagram/composition-undetermined.js';
import { bathCaptionLines } from '../../src/figure/compose-bath.js';
import { readSpec } from '../../src/system/spec.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const SYSTEM = { element: 'Zn', temperature: 150, composition: { Zn: 1e-3 }, species: ['Zn', 'Zn+2', 'ZnO', { formula: 'HZnO2-', phase: 'aq', dfG: -464.0 }] };

function inside(polys: [number, number][][][], x: number, y: number): boolean {
  let n = 0;
  for (const poly of polys) for (const ring of poly) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i]!;
      const [xj, yj] = ring[j]!;
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) n++;
    }
  }
  return n % 2 === 1;
}

describe('composition mode: undetermined species holding part of the element', () => {
  const spec = readSpec(SYSTEM, 'zn.json');
  const setup = compositionSetup(spec);

  it('probe: unknown where HZnO2- predominates and where it holds a minor share; a verdict where it holds none', () => {
    const a = compositionProbe(spec, setup, 12, -0.5);
    expect(a.status).toBe('ok');
    expect(a.predominant).toBe('HZnO2-');
    expect(a.verdict).toBe('unknown');
    expect(a.undetermined?.map((x) => x.species)).toEqual(['HZnO2-']);
    expect(a.reason).toMatch(/HZnO2-.*150 °C/);
    // ZnO holds most of the zinc at pH 10, 0 V, HZnO2- the rest (well above 1 %).
    const b = compositionProbe(spec, setup, 10, 0);
    expect(b.predominant).toBe('ZnO');
    expect(b.undetermined![0]!.share).toBeGreaterThan(UNDETERMINED_SHARE);
    expect(b.verdict).toBe('unknown');
    // Acid: Zn2+ and ZnO; HZnO2- holds a few ppm only.
    const c = compositionProbe(spec, setup, 5, 0);
    expect(c.verdict).toBe('corrosion');
    expect(c.undetermined).toBeUndefined();
  });

  it('at 25 °C the same inline species is tabulated: verdicts as usual', () => {
    const s25 = readSpec({ ...SYSTEM, temperature: 25 }, 'zn.json');
    const r = compositionProbe(s25, compositionSetup(s25), 12, -0.5);
    expect(r.verdict).toBe(r.class === 'solid' ? 'passivation' : 'corrosion');
    expect(r.undetermined).toBeUndefined();
  });

  it('the diagram marks the area where HZnO2- holds 1 % or more as undetermined, and says so', () => {
    const m = computeComposition(spec, { grid: 31 }).model;
    expect(m.composition!.heldBy).toEqual(['HZnO2-']);
    const und = m.composition!.undetermined as [number, number][][][];
    expect(inside(und, 12, -0.5)).toBe(true);
    expect(inside(und, 10, 0)).toBe(true);
    expect(inside(und, 5, 0)).toBe(false);
    expect(m.warnings.join(' ')).toMatch(/no verdict where HZnO2- .*hold 1 %/);
    expect(m.species.find((x) => x.formula === 'HZnO2-')!.temperatureModel).toBe('undetermined');
    expect(bathCaptionLines(m).join(' ')).toMatch(/no verdict where HZnO2- .*undetermined/i);
  });

  it('probe text and probe --points rows carry verdict unknown and name the species', async () => {
    const dir = tmpDir();
    const file = writeTmp(dir, 'zn.json', JSON.stringify(SYSTEM));
    const t = await runCli(['probe', file, '--ph', '10', '--potential', '0']);
    expect(t.code, t.stderr).toBe(0);
    expect(t.stdout).toMatch(/verdict: UNKNOWN — HZnO₂⁻/);
    const pts = writeTmp(dir, 'p.csv', 'pH,potential\n10,0\n5,0\n');
    const csv = (await runCli(['probe', file, '--points', pts])).stdout.trim().split('\n');
    const head = csv[0]!.split(',');
    const row = (k: number) => Object.fromEntries(csv[k]!.split(',').map((v, i) => [head[i], v]));
    expect(row(1).verdict).toBe('unknown');
    expect(row(1).reason).toMatch(/HZnO2-/);
    expect(row(2).verdict).toBe('corrosion');
  });
});

describe('iso-solubility levels at the total (found while checking the figure above)', () => {
  it('a bath of 10⁻³ mol/kg Zn draws as SVG: no line at or above its own total, every vertex finite', async () => {
    // Before the fix the 10⁻³ level (= the total) was traced where all zinc is dissolved, giving
    // NaN vertices and "svg: non-finite number" on draw.
    const spec = readSpec({ element: 'Zn', composition: { Zn: 1e-3 }, grid: 60 }, 'zn.json');
    const m = computeComposition(spec).model;
    expect(m.isoSolubility!.map((l) => l.level)).toEqual([1e-8, 1e-7, 1e-6, 1e-5, 1e-4]);
    for (const l of m.isoSolubility!) for (const line of l.lines) for (const p of line) expect(Number.isFinite(p[0]) && Number.isFinite(p[1])).toBe(true);
    const dir = tmpDir();
    const file = writeTmp(dir, 'zn3.json', JSON.stringify({ element: 'Zn', composition: { Zn: 1e-3 } }));
    const r = await runCli(['draw', file, '-o', `${dir}/zn3.svg`]);
    expect(r.code, r.stderr).toBe(0);
  });
});

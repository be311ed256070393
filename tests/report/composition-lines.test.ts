/**
 * `lines` on composition files: each boundary is a curve, given with the exchange reaction at its
 * midpoint and its span — no straight-line equation. Outside check: the reaction at the midpoint
 * is balanced (element, charge) — stoichiometry — and the Cu+2/Cu curve of the copper ammonia
 * bath lies at E°(Cu+2/Cu) + (RT ln10/2F) log10 0.25 (half the 0.5 mol/kg copper dissolved;
 * common practice), ΔfG° from the library.
 */
import { describe, expect, test } from 'vitest';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { F, LN10, R } from '../../src/thermo/constants.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const cu = writeTmp(dir, 'cu.yaml', 'element: Cu\ncomposition: {Cu: 0.5, N: 1}\ngrid: 80\n');

interface Row { between: string[]; shape: string; reaction: string; midpoint: { pH: number; E: number }; pHRange: number[]; ERange: number[]; ERangeRef?: number[]; equation?: string }

describe('lines in composition mode (copper ammonia bath)', () => {
  test('JSON: every boundary a curve with its midpoint reaction and span; the Cu+2/Cu curve at hand Nernst', async () => {
    const r = await runCli(['lines', cu, '--json', '--ref', 'sce']);
    expect(r.code, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout) as { basis: string; totals: Record<string, number>; lines: Row[] };
    expect(j.basis).toBe('the bath as made up');
    expect(j.totals).toEqual({ Cu: 0.5, N: 1 });
    expect(j.lines.length).toBeGreaterThan(3);
    for (const l of j.lines) {
      expect(l.shape).toBe('curve');
      expect(l.equation).toBeUndefined();
      expect(l.pHRange[0]).toBeLessThanOrEqual(l.midpoint.pH);
      expect(l.midpoint.pH).toBeLessThanOrEqual(l.pHRange[1]);
      expect(l.ERange[0]).toBeLessThanOrEqual(l.midpoint.E);
      expect(l.midpoint.E).toBeLessThanOrEqual(l.ERange[1]);
      expect(l.ERangeRef![0]).toBeLessThan(l.ERange[0]); // SCE lies above SHE
    }
    const c = j.lines.find((l) => [...l.between].sort().join('/') === 'Cu/Cu^2+')!;
    expect(c.reaction).toBe('Cu^2+ + 2e^- <=> Cu(s)');
    const lib = loadLibrary();
    const hand = (findSpecies(lib, 'Cu^2+')!.dfG * 1000) / (2 * F) + ((R * 298.15 * LN10) / (2 * F)) * Math.log10(0.25);
    expect(Math.abs(c.midpoint.E - hand)).toBeLessThan(1e-4);
    expect(j.lines.some((l) => l.between.includes('Cu(NH3)4^2+') && l.between.includes('Cu'))).toBe(false);
  });
  test('text says curve and gives the midpoint reaction and spans, no line equations', async () => {
    const r = await runCli(['lines', cu]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('the bath as made up (totals Cu 0.5, N 1 mol/kg)');
    expect(r.stdout).toMatch(/Boundaries are curves/);
    expect(r.stdout).toMatch(/Cu²⁺ \/ Cu\s+curve\s+Cu²⁺ \+ 2e⁻ ⇌ Cu\(s\)/);
    const table = r.stdout.split('Water lines')[0];
    expect(table).not.toMatch(/E = [-\d.]+ [+-] [\d.]+ pH/);
  });
});

/**
 * `draw` on a composition-mode file (issue 13): dispatched by kind in one place (computeAny), the
 * figure carries the iso-solubility lines with their level labels and legend entry, a caption
 * naming the kind and the totals with units, undetermined areas with their own fill; JSON is the
 * model, byte-identical run to run; a figure too small still exits 2 with nothing written.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { computeAny } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { InputError } from '../../src/system/errors.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
/** The caption's text, its wrapped lines joined by spaces, tags dropped. */
const captionText = (svg: string): string => [...svg.matchAll(/<text class="caption"[^>]*>(.*?)<\/text>/g)].map((m) => m[1]!.replace(/<[^>]+>/g, '')).join(' ');
// The silver bath of issue 13 (0.2 mol/kg Ag, 0.6 mol/kg total cyanide), coarse grid for speed.
const bath = writeTmp(dir, 'bath.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\nsolubilityLevels: [3.0e-5]\ngrid: 40\n');

describe('computeAny: one dispatch by kind', () => {
  it('solves a composition file with full speciation and a fixed file as before', () => {
    const c = computeAny(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, grid: 30 }, 'bath.yaml'));
    expect(c.kind).toBe('composition');
    expect(c.model.kind).toBe('composition');
    expect(c.model.composition?.totals).toEqual({ Ag: 0.2, CN: 0.6 });
    expect(c.model.water?.pKw).toBeGreaterThan(13.9);
    const f = computeAny(readSpec({ element: 'Fe', grid: 30 }, 'fe.yaml'));
    expect(f.kind).toBe('fixed-activity');
    expect(f.model.kind).not.toBe('composition');
  });
  it('takes the file’s solubilityLevels as extra iso-solubility levels', () => {
    const c = computeAny(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, grid: 30, solubilityLevels: [3e-5] }, 'bath.yaml'));
    expect(c.model.isoSolubility!.map((l) => l.level)).toEqual([1e-8, 1e-7, 1e-6, 1e-5, 3e-5, 1e-4, 1e-3, 1e-2]);
  });
  it('refuses solubilityLevels outside composition mode and levels out of range, by field', () => {
    expect(() => readSpec({ element: 'Fe', solubilityLevels: [1e-6] }, 'fe.yaml')).toThrow(/solubilityLevels/);
    expect(() => readSpec({ element: 'Ag', composition: { Ag: 0.2 }, solubilityLevels: [0] }, 'b.yaml')).toThrow(/solubilityLevels\[0\]/);
    expect(() => readSpec({ element: 'Ag', composition: { Ag: 0.2 }, solubilityLevels: 1e-6 }, 'b.yaml')).toThrow(InputError);
  });
});

describe('draw, composition mode', () => {
  it('writes the model as JSON: kind, regions, boundaries with reactions, isoSolubility, composition; byte-identical twice', async () => {
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    expect((await runCli(['draw', bath, '-o', a])).code).toBe(0);
    expect((await runCli(['draw', bath, '-o', b])).code).toBe(0);
    const text = readFileSync(a, 'utf8');
    expect(readFileSync(b, 'utf8')).toBe(text);
    const m = JSON.parse(text);
    expect(m.kind).toBe('composition');
    expect(m.regions.map((r: { species: string }) => r.species)).toEqual(expect.arrayContaining(['Ag', 'AgCN', 'Ag(CN)2^-']));
    for (const bd of m.boundaries) expect(bd.reaction).toContain('=');
    expect(m.isoSolubility.map((l: { level: number }) => l.level)).toContain(3e-5);
    expect(m.composition.totals).toEqual({ Ag: 0.2, CN: 0.6 });
  });

  it('draws the iso-solubility lines with their level labels, legend entry and a caption naming kind and totals', async () => {
    const out = join(dir, 'bath.svg');
    const r = await runCli(['draw', bath, '-o', out, '--width', '170']);
    expect(r.code).toBe(0);
    const svg = readFileSync(out, 'utf8');
    expect(svg.match(/class="iso-solubility"/g)?.length ?? 0).toBeGreaterThanOrEqual(5);
    const labels = [...svg.matchAll(/<text[^>]*class="iso-label"[^>]*data-level="([^"]+)"/g)].map((x) => Number(x[1]));
    expect(labels.length).toBeGreaterThanOrEqual(3);
    expect(svg).toContain('dissolved Ag total, mol/kg');
    expect(captionText(svg)).toContain('composition: full speciation; Ag 0.2 mol/kg, CN 0.6 mol/kg total');
  });

  it('SVG and PDF are byte-identical run to run', async () => {
    for (const ext of ['svg', 'pdf']) {
      const a = join(dir, `d1.${ext}`);
      const b = join(dir, `d2.${ext}`);
      expect((await runCli(['draw', bath, '-o', a])).code).toBe(0);
      expect((await runCli(['draw', bath, '-o', b])).code).toBe(0);
      expect(readFileSync(a).equals(readFileSync(b)), ext).toBe(true);
    }
  });

  it('a figure too small for the plot exits 2 and writes nothing', async () => {
    const out = join(dir, 'tiny.svg');
    // The layout shrinks, grows and folds first (issue 17); 40 mm at 24 pt still cannot fit.
    const r = await runCli(['draw', bath, '-o', out, '--width', '40', '--font-size', '24']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--width|figure 40 mm wide/);
    expect(existsSync(out)).toBe(false);
  });

  it('refuses a composition grid over its limit before solving anything, naming grid (exit 2)', async () => {
    const big = writeTmp(dir, 'big.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\ngrid: 4000\n');
    const out = join(dir, 'big.json');
    const r = await runCli(['draw', big, '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('grid');
    expect(existsSync(out)).toBe(false);
  });

  it('refuses activity families in composition mode, naming the key (exit 2)', async () => {
    const fam = writeTmp(dir, 'fam.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\ngrid: 20\nfigure: {families: [1.0e-4]}\n');
    const r = await runCli(['draw', fam, '-o', join(dir, 'fam.svg')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('figure.families');
  });
});

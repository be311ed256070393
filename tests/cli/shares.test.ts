/**
 * The shares plot (composition mode): its data (shares of the element in every form sum to 1 at
 * each solved point — a mass balance of the element's atoms, no outside source needed), the figure
 * (one line per form, legend, axis titles with units and the fixed coordinate, caption with the
 * totals), the verb's refusals (exit 2, nothing written) and deterministic bytes.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sharesData } from '../../src/analysis/shares.js';
import { readSpec } from '../../src/system/spec.js';
import { InputError } from '../../src/system/errors.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
/** The caption's text, its wrapped lines joined by spaces, tags dropped. */
const captionText = (svg: string): string => [...svg.matchAll(/<text class="caption"[^>]*>(.*?)<\/text>/g)].map((m) => m[1]!.replace(/<[^>]+>/g, '')).join(' ');
const bath = writeTmp(dir, 'bath.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\n');
const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'bath.yaml');

describe('shares data', () => {
  it('every form listed (minShare 0): the shares sum to 1 at each pH, at E = −0.2 V vs SHE', () => {
    const d = sharesData(spec, 'pH', -0.2, { points: 57, minShare: 0 });
    expect(d.failed).toEqual([]);
    expect(d.x).toHaveLength(57);
    for (let k = 0; k < d.x.length; k++) {
      const sum = d.forms.reduce((s, f) => s + f.share[k]!, 0);
      expect(Math.abs(sum - 1), `pH ${d.x[k]}`).toBeLessThan(1e-9);
    }
  });
  it('along E at pH 10: metallic silver at the bottom, cyanide complexes above its line', () => {
    const d = sharesData(spec, 'E', 10, { points: 41 });
    const ag = d.forms.find((f) => f.species === 'Ag')!;
    expect(d.along).toBe('E');
    expect(ag.share[0]).toBeGreaterThan(0.999); // E = −2 V: immunity
    expect(ag.share[20]).toBeLessThan(1e-3); // E = 0 V: all dissolved as cyanide complexes
  });
  it('refuses a fixed-activity file, naming composition', () => {
    expect(() => sharesData(readSpec({ element: 'Ag' }, 'ag.yaml'), 'pH', 0)).toThrow(InputError);
  });
});

describe('shares verb', () => {
  it('draws an SVG: a line per form, legend, axes with units and the fixed potential, caption with totals; byte-identical twice', async () => {
    const a = join(dir, 'a.svg');
    const b = join(dir, 'b.svg');
    expect((await runCli(['shares', bath, '--potential', '-0.2', '--points', '101', '-o', a])).code).toBe(0);
    expect((await runCli(['shares', bath, '--potential', '-0.2', '--points', '101', '-o', b])).code).toBe(0);
    const svg = readFileSync(a, 'utf8');
    expect(readFileSync(b, 'utf8')).toBe(svg);
    const lines = [...svg.matchAll(/class="share"[^>]*data-species="([^"]+)"/g)].map((m) => m[1]);
    expect(lines).toEqual(expect.arrayContaining(['Ag', 'Ag(CN)2^-']));
    expect(svg).toMatch(/pH \(at E = \u22120\.20 V vs SHE\)/);
    expect(svg).toContain('share of Ag (mol/mol)');
    expect(captionText(svg)).toContain('composition: full speciation; Ag 0.2 mol/kg, CN 0.6 mol/kg total');
    expect(svg.match(/class="legend-label"/g)?.length).toBe(lines.length);
  });
  it('writes the data as JSON along E with --ph', async () => {
    const out = join(dir, 'e.json');
    expect((await runCli(['shares', bath, '--ph', '10', '--points', '21', '-o', out])).code).toBe(0);
    const j = JSON.parse(readFileSync(out, 'utf8'));
    expect(j.along).toBe('E');
    expect(j.x).toHaveLength(21);
  });
  it('refuses (exit 2, nothing written): both or neither fixed coordinate, a fixed-activity file, a figure too small', async () => {
    const out = join(dir, 'x.svg');
    expect((await runCli(['shares', bath, '-o', out])).code).toBe(2);
    expect((await runCli(['shares', bath, '--ph', '7', '--potential', '0', '-o', out])).code).toBe(2);
    const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\n');
    const r = await runCli(['shares', fe, '--potential', '0', '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('composition');
    expect((await runCli(['shares', bath, '--potential', '0', '--points', '21', '--width', '40', '--height', '30', '-o', out])).code).toBe(2);
    expect(existsSync(out)).toBe(false);
  });

});

describe('shares: the potential on a reference electrode, as every other verb reads it (issue 15, consistency)', () => {
  // SCE: +0.2412 V vs SHE at 25 °C (common practice; the library's SCE formula at 25 °C).
  const sceBath = writeTmp(dir, 'bath-sce.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\nreference: sce\n');
  it("--ref sce: the potential is read vs SCE, converted to SHE, and the figure says both", async () => {
    const out = join(dir, 'ref.json');
    expect((await runCli(['shares', bath, '--potential', '-0.45', '--ref', 'sce', '--points', '21', '-o', out])).code).toBe(0);
    const j = JSON.parse(readFileSync(out, 'utf8'));
    expect(j.at).toBeCloseTo(-0.45 + 0.2412, 3);
    expect(j.reference).toMatchObject({ label: 'SCE', E: -0.45 });
    const svg = join(dir, 'ref.svg');
    expect((await runCli(['shares', bath, '--potential', '-0.45', '--ref', 'sce', '--points', '21', '-o', svg])).code).toBe(0);
    expect(readFileSync(svg, 'utf8')).toMatch(/E = \u22120\.45 V vs SCE \(= \u22120\.21 V vs SHE\)/);
  });
  it("without --ref, the file's reference: applies (as probe)", async () => {
    const out = join(dir, 'file-ref.json');
    expect((await runCli(['shares', sceBath, '--potential', '-0.45', '--points', '21', '-o', out])).code).toBe(0);
    expect(JSON.parse(readFileSync(out, 'utf8')).at).toBeCloseTo(-0.2088, 3);
  });
  it('refuses --ref rhe along pH and --ref with --ph (exit 2, nothing written)', async () => {
    const out = join(dir, 'rhe.svg');
    const a = await runCli(['shares', bath, '--potential', '0', '--ref', 'rhe', '-o', out]);
    expect(a.code).toBe(2);
    expect(a.stderr).toMatch(/--ref.*RHE moves with pH/);
    const b = await runCli(['shares', bath, '--ph', '10', '--ref', 'sce', '-o', out]);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/--ref/);
    expect(existsSync(out)).toBe(false);
  });
});

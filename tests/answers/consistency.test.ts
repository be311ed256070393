/**
 * Issue 15, consistency: one reference option name (--ref) in every verb, the file's reference in
 * `lines`, a clear message for the RHE without a pH, `probe -o` without --points refused, lengths
 * printed as given (3 in = 76.2 mm exactly, by definition of the inch), PNG pixels as asked, and
 * `overlay` with --font, --ref and .html.
 * Check value: SCE +0.241 V vs SHE at 25 °C (common practice; saturated calomel electrode).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';
import { parseLength } from '../../src/render/options.js';

const dir = tmpDir();
const cu = writeTmp(dir, 'cu.yaml', 'element: Cu\n');
const cuSce = writeTmp(dir, 'cu-sce.yaml', 'element: Cu\nreference: sce\n');
const pngSize = (p: string) => {
  const b = readFileSync(p);
  return [b.readUInt32BE(16), b.readUInt32BE(20)];
};

describe('reference electrode options', () => {
  it('cell takes --ref, and --reference as the same option', async () => {
    const a = await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--ref', 'sce', '--json']);
    const b = await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--reference', 'sce', '--json']);
    expect(a.code).toBe(0);
    expect(a.stdout).toBe(b.stdout);
    expect(a.stdout).toMatch(/SCE/);
  });

  it('cell --ref rhe without --ph: a clear message naming --ph, exit 2', async () => {
    const r = await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--ref', 'rhe']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--ph: expected a pH with --ref rhe/);
    expect(r.stdout).toBe('');
  });

  it("lines gives each line against the file's reference: (common practice) SCE +0.241 V", async () => {
    const r = await runCli(['lines', cuSce]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/line vs SCE/);
    const j = JSON.parse((await runCli(['lines', cuSce, '--json'])).stdout);
    expect(j.reference.offset).toBeCloseTo(0.241, 2);
  });
});

describe('probe -o without --points', () => {
  it('a .csv output for one point is refused, naming --output, and writes nothing', async () => {
    const out = join(dir, 'x.csv');
    const r = await runCli(['probe', cu, '--ph', '6', '--potential', '0.5', '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--output/);
    expect(existsSync(out)).toBe(false);
  });
  it('a .json output for one point is written (the --json answer), never ignored', async () => {
    const out = join(dir, 'x.json');
    const r = await runCli(['probe', cu, '--ph', '6', '--potential', '0.5', '-o', out]);
    expect(r.code).toBe(0);
    expect(JSON.parse(readFileSync(out, 'utf8')).predominant).toBeDefined();
  });
});

describe('figure sizes', () => {
  it('3 in is 76.2 mm exactly in every message', async () => {
    expect(parseLength('3in', '--width')).toBeCloseTo(76.2, 12);
    // A request that cannot fit even after the layout's fallbacks (issue 17): 3 in at 20 pt.
    const r = await runCli(['draw', cu, '-o', join(dir, 'n.svg'), '--width', '3in', '--font-size', '20']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/figure 76\.2 mm wide/);
  });

  it('--width 800px gives a PNG 800 pixels across; --dpi sets the resolution otherwise', async () => {
    const a = join(dir, 'a.png');
    expect((await runCli(['draw', cu, '-o', a, '--width', '800px'])).code).toBe(0);
    expect(pngSize(a)[0]).toBe(800);
    const b = join(dir, 'b.png');
    expect((await runCli(['draw', cu, '-o', b, '--width', '800px', '--dpi', '150'])).code).toBe(0);
    expect(pngSize(b)[0]).toBe(800);
    const c = join(dir, 'c.png');
    expect((await runCli(['draw', cu, '-o', c, '--width', '127mm', '--dpi', '100'])).code).toBe(0);
    expect(pngSize(c)[0]).toBe(500); // 127 mm = 5 in
  });
});

describe('overlay options', () => {
  it('takes --font, --ref and writes .html', async () => {
    const out = join(dir, 'o.html');
    const r = await runCli(['overlay', cu, '--activities', '1e-6,1e-4', '-o', out, '--font', 'Georgia', '--ref', 'sce']);
    expect(r.code).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('Georgia');
    expect(html).toContain('vs SCE');
  });
});

describe('probe -o OUT.json for one point writes the JSON answer for every kind of file', () => {
  it('a bath as made up and an alloy as well as one element (never printed and ignored)', async () => {
    const bath = writeTmp(dir, 'bath-o.yaml', 'element: Cu\ncomposition: {Cu: 0.5, N: 1}\n');
    const alloy = writeTmp(dir, 'alloy-o.yaml', 'elements: {Cu: 0.7, Zn: 0.3}\n');
    for (const [f, key] of [[cu, 'predominant'], [bath, 'speciation'], [alloy, 'assemblage']] as const) {
      const out = join(dir, `${key}.json`);
      const r = await runCli(['probe', f, '--ph', '10', '--potential', '0.3', '-o', out]);
      expect(r.code, r.stderr).toBe(0);
      expect(r.stdout).toBe(`wrote ${out}\n`);
      expect(JSON.parse(readFileSync(out, 'utf8'))).toHaveProperty(key);
    }
  });
});

describe('every probe answer carries the same caution', () => {
  it('one element, a bath as made up and an alloy: equilibrium only, not kinetics; codes and a qualified professional', async () => {
    const bath = writeTmp(dir, 'bath.yaml', 'element: Cu\ncomposition: {Cu: 0.5, N: 1}\n');
    const alloy = writeTmp(dir, 'alloy.yaml', 'elements: {Fe: 0.7, Cr: 0.18, Ni: 0.12}\n');
    for (const f of [cu, bath, alloy]) {
      const r = await runCli(['probe', f, '--ph', '8', '--potential', '-0.3']);
      expect(r.code, r.stderr).toBe(0);
      expect(r.stdout, f).toMatch(/Equilibrium thermodynamics only — not kinetics.*; follow the applicable codes and a qualified corrosion professional\.\n$/);
    }
  });
});

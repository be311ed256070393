/**
 * The verbs on alloy files (issue 18), end to end in-process: draw (json, svg, html; --vary), probe
 * (text and --json, whose amounts must hold the bulk composition), lines (every reaction balanced:
 * tests/diagram/alloy.test.ts parses them; here the verb's rows), report (md, html), and the refusals.
 * Data: the built-in library (sources in species/).
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/chem/parse.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const steel = writeTmp(dir, 'steel.yaml', 'title: test stainless\nelements: {Fe: 0.70, Cr: 0.18, Ni: 0.12}\nactivity: 1e-6\ngrid: 60\n');
const brass = writeTmp(dir, 'brass.yaml', 'elements: {Cu: 65, Zn: 35}\ngrid: 60\n');
const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\ngrid: 60\n');

describe.each([['Fe–Cr–Ni', steel], ['Cu–Zn', brass]])('%s', (_n, file) => {
  it('draw → json: regions carry assemblage (species, amount) and verdict', async () => {
    const out = join(dir, `${_n}.json`);
    const r = await runCli(['draw', file, '-o', out]);
    expect(r.code, r.stderr).toBe(0);
    const m = JSON.parse(readFileSync(out, 'utf8'));
    expect(m.kind).toBe('alloy');
    expect(m.regions.length).toBeGreaterThan(4);
    for (const reg of m.regions) {
      expect(reg.assemblage.length).toBeGreaterThan(0);
      expect(['immune', 'passive', 'corroding', 'partly-corroding']).toContain(reg.alloyVerdict);
      expect(['immunity', 'passivation', 'corrosion']).toContain(reg.verdict);
    }
  });

  it('draw → svg and html', async () => {
    for (const ext of ['svg', 'html']) {
      const out = join(dir, `${_n}.${ext}`);
      const r = await runCli(['draw', file, '-o', out, '--width', '170mm', '--height', '150mm']);
      expect(r.code, r.stderr).toBe(0);
      expect(readFileSync(out, 'utf8')).toContain('partly corroding');
    }
  });

  it('probe --json: amounts per mol of alloy atoms sum to the bulk composition', async () => {
    for (const [pH, E] of [[2, 0.3], [7, -0.2], [12, 0.8], [5, -1.5]]) {
      const r = await runCli(['probe', file, '--ph', String(pH), '--potential', String(E), '--json']);
      expect(r.code, r.stderr).toBe(0);
      const p = JSON.parse(r.stdout);
      expect(['immune', 'passive', 'corroding', 'partly-corroding']).toContain(p.verdict);
      for (const [e, x] of Object.entries(p.composition as Record<string, number>)) {
        const held = p.assemblage.reduce((s: number, a: { species: string; amount: number }) => s + a.amount * (parseFormula(a.species).elements[e] ?? 0), 0);
        expect(held).toBeCloseTo(x, 9); // JSON numbers carry 12 significant digits
      }
      expect(p.margins).toHaveLength(4);
    }
  });

  it('probe text names the assemblage, the verdict and the margins', async () => {
    const r = await runCli(['probe', file, '--ph', '5', '--potential', '-0.5']);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/assemblage: /);
    expect(r.stdout).toMatch(/verdict: /);
    expect(r.stdout).toMatch(/more oxidising \(E up\)/);
  });

  it('lines: one row per boundary with a reaction and an equation', async () => {
    const r = await runCli(['lines', file, '--json']);
    expect(r.code, r.stderr).toBe(0);
    const rows = JSON.parse(r.stdout).lines;
    expect(rows.length).toBeGreaterThan(4);
    for (const row of rows) {
      expect(row.reaction).toContain(' <=> ');
      expect(row.equation).toMatch(/^(E|pH) = /);
    }
  });

  it('report → md (with its svg) and html', async () => {
    const md = join(dir, `${_n}.md`);
    let r = await runCli(['report', file, '-o', md]);
    expect(r.code, r.stderr).toBe(0);
    const text = readFileSync(md, 'utf8');
    expect(text).toContain('## Assemblages');
    expect(text).toContain('no solid-solution activities');
    expect(existsSync(join(dir, `${_n}.svg`))).toBe(true);
    r = await runCli(['report', file, '-o', join(dir, `${_n}.html`)]);
    expect(r.code, r.stderr).toBe(0);
  });
});

it('Cu–Zn probe in mildly reducing acid: Cu + Zn+2, zinc dissolves (dezincification; common practice)', async () => {
  const r = await runCli(['probe', brass, '--ph', '5', '--potential', '-0.5', '--json']);
  const p = JSON.parse(r.stdout);
  expect(p.assemblage.map((a: { species: string }) => a.species)).toEqual(['Cu', 'Zn^2+']);
  expect(p.verdict).toBe('partly-corroding');
  expect(p.dissolving).toEqual(['Zn']);
  expect(p.assemblage[1].amount).toBeCloseTo(0.35, 12);
});

describe('--vary', () => {
  it('draws the other compositions as keyed layers and lists them in the JSON', async () => {
    const out = join(dir, 'vary.json');
    const r = await runCli(['draw', steel, '-o', out, '--vary', 'Cr=0.05,0.70']);
    expect(r.code, r.stderr).toBe(0);
    const m = JSON.parse(readFileSync(out, 'utf8'));
    expect(m.sweep).toHaveLength(2);
    // Cr 70 %: more chromium than FeCr2O4 can take up with the iron (Fe:Cr = 1:2), so Cr2O3 joins
    // chromite where the 18 % alloy had iron oxide left over (pure phases: regions change only there);
    // where nickel is oxidised it takes chromium as nickel chromite (NiCr2O4 lies ~4 kJ/mol below
    // NiO + Cr2O3 with the library's data), so NiO no longer appears beside Cr2O3.
    const base = new Set(m.regions.map((x: { species: string }) => x.species));
    const rich = m.sweep[1].regions.map((x: { species: string }) => x.species).filter((x: string) => !base.has(x));
    expect(rich).toContain('Cr2O3 + FeCr2O4 + NiCr2O4');
    expect(rich).not.toContain('Cr2O3 + NiO + FeCr2O4');
    expect(m.sweep[0].composition.Cr).toBeCloseTo(0.05, 12);
    expect(m.sweep[0].composition.Fe / m.sweep[0].composition.Ni).toBeCloseTo(0.7 / 0.12, 9);
    const svg = join(dir, 'vary.svg');
    const r2 = await runCli(['draw', steel, '-o', svg, '--vary', 'Cr=0.05,0.12', '--width', '170mm', '--height', '160mm']);
    expect(r2.code, r2.stderr).toBe(0);
    expect(readFileSync(svg, 'utf8')).toContain('Cr 5.0 %');
  });

  it('refuses a bad --vary and --vary on a one-element file (exit 2, option named, nothing written)', async () => {
    for (const args of [[steel, '--vary', 'Mo=0.1'], [steel, '--vary', 'Cr=1.5'], [steel, '--vary', 'Cr'], [fe, '--vary', 'Cr=0.1']]) {
      const out = join(dir, 'bad.json');
      const r = await runCli(['draw', args[0], '-o', out, ...args.slice(1)]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain('--vary');
      expect(existsSync(out)).toBe(false);
    }
  });
});

/**
 * The verbs draw, probe and lines end to end (in-process), and the bad-input contract:
 * exit code 2, one message naming file and field, no output written.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');

describe('draw', () => {
  it('writes the diagram model as JSON with regions, boundaries, triple points and water lines', async () => {
    const out = join(dir, 'fe.json');
    const r = await runCli(['draw', fe, '-o', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(out);
    const m = JSON.parse(readFileSync(out, 'utf8'));
    expect(m.element).toBe('Fe');
    expect(m.regions.map((x: { species: string }) => x.species)).toEqual(expect.arrayContaining(['Fe', 'Fe^2+', 'Fe2O3', 'Fe3O4']));
    for (const reg of m.regions) {
      expect(Array.isArray(reg.polygons[0][0][0])).toBe(true); // polygon → ring → [pH, E]
    }
    const b = m.boundaries.find((x: { between: string[] }) => x.between.includes('Fe') && x.between.includes('Fe^2+'));
    expect(b.reaction).toMatch(/Fe\^2\+ \+ 2e\^- <=> Fe/);
    expect(b.equation).toMatch(/^E = -0\.\d+ V vs SHE$/);
    expect(m.triplePoints.length).toBeGreaterThan(0);
    expect(m.waterLines.oxygen.points.length).toBe(2);
  });

  it('is deterministic: the same input gives byte-identical JSON', async () => {
    const a = join(dir, 'a.json');
    const b = join(dir, 'b.json');
    await runCli(['draw', fe, '-o', a]);
    await runCli(['draw', fe, '-o', b]);
    expect(readFileSync(a, 'utf8')).toBe(readFileSync(b, 'utf8'));
  });
});

describe('probe', () => {
  it('answers exactly at a point inside the Fe+2 field (pH 4, E −0.3 V vs SHE)', async () => {
    const r = await runCli(['probe', fe, '--ph', '4', '--potential', '-0.3', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.predominant).toBe('Fe^2+');
    expect(j.runnerUp).toBeTruthy();
    expect(j.margin.kJPerMol).toBeGreaterThan(0);
    expect(j.nearestBoundary.reaction).toContain('=');
  });

  it('rejects a non-numeric pH with exit 2 naming the option', async () => {
    const r = await runCli(['probe', fe, '--ph', 'seven', '--potential', '0']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--ph');
  });
});

describe('lines', () => {
  it('prints every boundary reaction in a table and as JSON', async () => {
    const t = await runCli(['lines', fe]);
    expect(t.code).toBe(0);
    expect(t.stdout).toContain('Fe₃O₄(s) + 8H⁺ + 8e⁻ ⇌ 3Fe(s) + 4H₂O(l)');
    const j = JSON.parse((await runCli(['lines', fe, '--json'])).stdout);
    expect(j.lines.length).toBeGreaterThan(5);
    expect(j.lines[0]).toHaveProperty('reaction');
    expect(j.lines[0]).toHaveProperty('equation');
  });
});

describe('bad input: exit 2, a message naming file and field, nothing written', () => {
  const cases: [string, string, RegExp][] = [
    ['no-element.yaml', 'temperature: 25\n', /element/],
    ['unknown-key.yaml', 'element: Fe\ncolour: red\n', /colour/],
    ['bad-type.yaml', 'element: Fe\ntemperature: hot\n', /temperature.*number/],
    ['neg-activity.yaml', 'element: Fe\nactivity: -1\n', /activity/],
    ['reversed.yaml', 'element: Fe\npH: [14, 0]\n', /pH/],
    ['bad-formula.json', JSON.stringify({ element: 'Fe', species: [{ formula: 'Fe(OH', phase: 's', dfG: 1 }] }), /species\[0\]\.formula/],
    ['unknown-element.yaml', 'element: Xy\n', /element/],
    ['foreign.json', JSON.stringify({ element: 'Fe', species: [{ formula: 'Fe', phase: 's', dfG: 0 }, { formula: 'NaCl', phase: 's', dfG: -384 }] }), /species\[1\].*NaCl/],
    ['no-main.json', JSON.stringify({ element: 'Fe', ligands: { S: 1e-3 }, species: [{ formula: 'Fe', phase: 's', dfG: 0 }, { formula: 'H2S', phase: 'aq', dfG: -27.8 }, { formula: 'CuS', phase: 's', dfG: -53.6 }] }), /CuS/],
    ['malformed.json', '{"element": "Fe",', /JSON/],
    ['malformed.yaml', 'element: [Fe\n', /YAML/],
    ['hot.yaml', 'element: Fe\ntemperature: 400\n', /temperature/],
    ['nan.json', '{"element": "Fe", "activity": "NaN"}', /activity/],
  ];
  it.each(cases)('%s', async (name, text, field) => {
    const f = writeTmp(dir, name, text);
    const out = join(dir, `${name}.out.json`);
    const r = await runCli(['draw', f, '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(name);
    expect(r.stderr).toMatch(field);
    expect(r.stderr).toMatch(/expected/);
    expect(r.stderr.trim().split('\n').length).toBe(1);
    expect(existsSync(out)).toBe(false);
  });
});

describe('draw figure options on the command line', () => {
  it('--show ligands draws the ligand underlay; --hide with an unknown name is exit 2', async () => {
    const cus = writeTmp(dir, 'cus.yaml', 'element: Cu\nligands: {S: 1.0e-3}\n');
    const out = join(dir, 'cus.svg');
    expect((await runCli(['draw', cus, '-o', out, '--show', 'ligands', '--hide', 'legend', '--line-width', '0.7'])).code).toBe(0);
    const svg = readFileSync(out, 'utf8');
    expect(svg).toMatch(/HS/); // a ligand species label of the underlay
    const bad = await runCli(['draw', cus, '-o', join(dir, 'bad.svg'), '--hide', 'bogus']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--hide/);
    expect(existsSync(join(dir, 'bad.svg'))).toBe(false);
  });
});

describe('reference electrodes in outputs', () => {
  it('lines --ref sce shifts every E line by −0.241 V (SCE vs SHE at 25 °C, reference-electrodes table)', async () => {
    const j = JSON.parse((await runCli(['lines', fe, '--ref', 'sce', '--json'])).stdout);
    const row = j.lines.find((r: { between: string[] }) => r.between.includes('Fe') && r.between.includes('Fe^2+'));
    const sce = Number(/E = (-?[\d.]+) V vs SCE/.exec(row.equationRef)![1]);
    expect(sce - row.line.intercept).toBeCloseTo(-0.241, 2);
  });

  it('draw --ref cse adds a second axis labelled with the electrode; the RHE is refused for an axis', async () => {
    const out = join(dir, 'cse.svg');
    expect((await runCli(['draw', fe, '-o', out, '--ref', 'cse'])).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/V vs Cu\/CuSO/);
    const r = await runCli(['draw', fe, '-o', join(dir, 'rhe.svg'), '--ref', 'rhe']);
    expect(r.code).toBe(2);
  });
});

describe('what-if options on the command line', () => {
  it('--temperature and --activity override the file; out-of-range values name the option', async () => {
    const a = JSON.parse((await runCli(['lines', fe, '--json', '--activity', '1e-4'])).stdout);
    const b = JSON.parse((await runCli(['lines', fe, '--json'])).stdout);
    const line = (j: { lines: { between: string[]; line: { intercept: number } }[] }) => j.lines.find((r) => r.between.includes('Fe') && r.between.includes('Fe^2+'))!.line.intercept;
    // Nernst, n = 2: two decades of activity move the Fe+2/Fe line by 59.16 mV at 25 °C.
    expect((line(a) - line(b)) * 1000).toBeCloseTo(59.16, 1);
    const hot = JSON.parse((await runCli(['probe', fe, '--ph', '7', '--potential', '0', '--json', '--temperature', '150'])).stdout);
    expect(hot.temperature.celsius).toBe(150);
    const bad = await runCli(['draw', fe, '-o', join(dir, 'hot.svg'), '--temperature', '500']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--temperature/);
  });
});

describe('cell with species from a file', () => {
  it('uses the inline species of a system file before the library (Cu+2/Cu with ΔfG° 65.0 kJ/mol → 0.3368 V)', async () => {
    const f = writeTmp(dir, 'cu.yaml', 'element: Cu\nspecies:\n  - {formula: Cu, phase: s, dfG: 0}\n  - {formula: Cu+2, phase: aq, dfG: 65.0}\n');
    const lib = JSON.parse((await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--json'])).stdout);
    const own = JSON.parse((await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--json', '--species', f])).stdout);
    // E = ΔfG°(Cu+2)/(2F), F = 96485.33212 C/mol (CODATA 2018)
    expect(own.equilibriumPotential).toBeCloseTo(65000 / (2 * 96485.33212), 6);
    expect(lib.equilibriumPotential).not.toBeCloseTo(own.equilibriumPotential, 4);
  });
});

/**
 * The alloy outputs a user expects from the single-element verbs (issue 18), run through the CLI
 * bundled at test time as a child process (as tests/cli/points-stream.test.ts does):
 *  - `--ref` and the file's `reference:` on probe (potential given vs the electrode), draw (second
 *    axis), lines (each line against the electrode) and report;
 *  - `probe --points` on an alloy file: one row per logged point, each the same answer as
 *    `probe --ph --potential`, bad rows marked (exit 4) or, with --strict, refused (exit 2);
 *  - `report x.pdf` for an alloy file;
 *  - a neutral dissolved species (Zn(OH)2(aq)) labelled as dissolved, never as the solid.
 * Check values: reference electrodes from tests/fixtures/reference-electrodes.csv (common practice,
 * as stated there); zinc hydrolysis from Baes & Mesmer (1976), the source (key BM76) of the
 * Zn(OH)2(aq) data in species/Zn.json: log*β2 = −16.9 for Zn+2 + 2H2O = Zn(OH)2(aq) + 2H+, so the
 * Zn+2 | Zn(OH)2(aq) line is at pH 16.9/2 = 8.45, whatever the threshold activity.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseFormula, splitPhase } from '../../src/chem/parse.js';
import { testCli } from '../helpers/bundle.js';
import { tmpDir } from '../helpers/tmp.js';

const root = fileURLToPath(new URL('../..', import.meta.url));
let cli = '';
let dir = '';
let brass = '';
let brassSce = '';

/** SCE vs SHE at 25 °C, V (fixture; common practice). */
const SCE = Number(
  readFileSync(join(root, 'tests', 'fixtures', 'reference-electrodes.csv'), 'utf8')
    .split('\n')
    .find((l) => l.startsWith('saturated calomel'))!
    .split(',')[1],
);

function run(args: string[], input?: string): { code: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [cli, ...args], { encoding: 'utf8', input, cwd: dir });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = tmpDir();
  cli = testCli('alloyout');
  brass = join(dir, 'brass.yaml');
  writeFileSync(brass, 'elements: {Cu: 0.65, Zn: 0.35}\nactivity: 1.0e-6\ngrid: 40\n');
  brassSce = join(dir, 'brass-sce.yaml');
  writeFileSync(brassSce, 'elements: {Cu: 0.65, Zn: 0.35}\nactivity: 1.0e-6\ngrid: 40\nreference: sce\n');
}, 60_000);

afterAll(() => rmSync(cli, { force: true }));

const probeJson = (args: string[]) => {
  const r = run(['probe', ...args, '--json']);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout);
};

describe('--ref and the file\'s reference on an alloy file', () => {
  it('probe: the potential is read vs the electrode and converted to SHE (SCE +0.241 V; common practice)', () => {
    const given = probeJson([brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce']);
    expect(given.reference.label).toBe('SCE');
    expect(given.reference.E).toBe(-0.7);
    expect(given.E).toBeCloseTo(-0.7 + SCE, 2);
    // The same answer as the point given vs SHE.
    const she = probeJson([brass, '--ph', '5', '--potential', String(given.E)]);
    expect(she.label).toBe(given.label);
    expect(she.reference).toBeUndefined();
    // The file's own `reference: sce` reads the potential the same way.
    const own = probeJson([brassSce, '--ph', '5', '--potential', '-0.7']);
    expect(own.E).toBe(given.E);
    expect(own.label).toBe(given.label);
    const text = run(['probe', brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce']).stdout;
    expect(text).toMatch(/E -0\.7 V vs SCE \(= -0\.4\d+ V vs SHE\)/);
  });

  it('probe at 60 °C: the electrode converted at the file\'s temperature, as for one element (SCE drifts by about −0.7 mV/K; common practice)', () => {
    const alloy = probeJson([brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce', '--temperature', '60']);
    const fe = join(dir, 'fe.yaml');
    writeFileSync(fe, 'element: Fe\nactivity: 1.0e-6\n');
    const one = probeJson([fe, '--ph', '5', '--potential', '-0.7', '--ref', 'sce', '--temperature', '60']);
    expect(alloy.reference.offset).toBe(one.reference.offset);
    expect(alloy.E).toBeCloseTo(one.E, 12);
    // Lower than at 25 °C by roughly 35 K × 0.7 mV/K (tolerance: the coefficient varies by source).
    expect(SCE - alloy.reference.offset).toBeGreaterThan(0.01);
    expect(SCE - alloy.reference.offset).toBeLessThan(0.04);
  });

  it('probe -o: the JSON answer written to the file (same as --json), nothing printed but the note; a bad --ref writes nothing', () => {
    const out = join(dir, 'point.json');
    let r = run(['probe', brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce', '-o', out]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toBe(`wrote ${out}\n`);
    expect(JSON.parse(readFileSync(out, 'utf8'))).toEqual(probeJson([brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce']));
    const bad = join(dir, 'point-bad.json');
    r = run(['probe', brass, '--ph', '5', '--potential', '-0.7', '--ref', 'nope', '-o', bad]);
    expect(r.code).toBe(2);
    expect(existsSync(bad)).toBe(false);
  });

  it('draw: a second E axis vs the electrode, and the model names it; the file\'s reference does the same', () => {
    for (const [file, extra] of [[brass, ['--ref', 'sce']], [brassSce, []]] as const) {
      const json = join(dir, `ref-${extra.length}.json`);
      let r = run(['draw', file, '-o', json, ...extra]);
      expect(r.code, r.stderr).toBe(0);
      const m = JSON.parse(readFileSync(json, 'utf8'));
      expect(m.reference.label).toBe('SCE');
      expect(m.reference.offset).toBeCloseTo(SCE, 2);
      const svg = join(dir, `ref-${extra.length}.svg`);
      r = run(['draw', file, '-o', svg, ...extra]);
      expect(r.code, r.stderr).toBe(0);
      expect(readFileSync(svg, 'utf8')).toContain('vs SCE');
    }
  });

  it('lines: every E line against the electrode has its intercept lowered by the offset', () => {
    const r = run(['lines', brass, '--ref', 'sce', '--json']);
    expect(r.code, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.reference.label).toBe('SCE');
    const intercept = (s: string) => Number(/^E = (-?\d+\.\d+)/.exec(s)![1]);
    let checked = 0;
    for (const row of j.lines) {
      if (row.line.kind !== 'E') continue;
      expect(row.equationRef).toContain('SCE');
      expect(intercept(row.equationRef)).toBeCloseTo(intercept(row.equation) - SCE, 2);
      checked++;
    }
    expect(checked).toBeGreaterThan(5);
    expect(run(['lines', brassSce]).stdout).toContain('line vs SCE');
  });

  it('report (md): the reactions table gives each line vs SCE as well', () => {
    const md = join(dir, 'ref-report.md');
    const r = run(['report', brass, '-o', md, '--ref', 'sce']);
    expect(r.code, r.stderr).toBe(0);
    const text = readFileSync(md, 'utf8');
    expect(text).toMatch(/V vs SHE; E = .* V vs SCE/);
    expect(text).toMatch(/E vs SCE = E vs SHE − 0\.24\d+ V at 25 °C/);
    expect(readFileSync(join(dir, 'ref-report.svg'), 'utf8')).toContain('vs SCE');
  });

  it('refuses a bad --ref on every verb (exit 2, --ref named, nothing written)', () => {
    const out = join(dir, 'bad-ref.svg');
    for (const args of [['draw', brass, '-o', out, '--ref', 'nope'], ['probe', brass, '--ph', '5', '--potential', '0', '--ref', 'nope'], ['lines', brass, '--ref', 'nope'], ['report', brass, '-o', join(dir, 'bad-ref.pdf'), '--ref', 'nope'], ['lines', brass, '--ref', 'rhe']]) {
      const r = run(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toContain('--ref');
      expect(r.stderr).not.toMatch(/\n\s+at /);
    }
    expect(existsSync(out)).toBe(false);
    expect(existsSync(join(dir, 'bad-ref.pdf'))).toBe(false);
  });
});

describe('probe --points on an alloy file', () => {
  const log = 'tag,pH,potential_mV,temperature\nacid,5,-700,25\nwarm,10,-200,60\nbad,abc,0,25\nhot,7,0,400\n';

  it('answers each row as probe --ph --potential does (assemblage, verdict, dissolving), bad rows marked, exit 4', () => {
    const csv = join(dir, 'log.csv');
    writeFileSync(csv, log);
    const r = run(['probe', brass, '--points', csv, '--ref', 'sce']);
    expect(r.code, r.stderr).toBe(4);
    expect(r.stderr).toContain('2 of 4 rows');
    const [head, ...rows] = r.stdout.trim().split('\n');
    expect(head).toBe('tag,line,pH,potential_mV,scale,E_SHE_V,temperature_C,assemblage,verdict,dissolving,on_boundary_with,warnings,error');
    const cols = head.split(',');
    const cell = (row: string, name: string) => row.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.map((c) => c.replace(/,$/, ''))[cols.indexOf(name)];
    expect(rows).toHaveLength(4);
    // Row 1 at 25 °C: the same as the single point.
    const one = probeJson([brass, '--ph', '5', '--potential', '-0.7', '--ref', 'sce']);
    expect(cell(rows[0], 'assemblage')).toBe(one.label);
    expect(cell(rows[0], 'verdict')).toBe(one.verdict);
    expect(cell(rows[0], 'dissolving')).toBe(one.dissolving.join(', '));
    expect(Number(cell(rows[0], 'E_SHE_V'))).toBeCloseTo(one.E, 8);
    // Row 2 at 60 °C: the same as the single point on the file at 60 °C.
    const warm = probeJson([brass, '--ph', '10', '--potential', '-0.2', '--ref', 'sce', '--temperature', '60']);
    expect(cell(rows[1], 'assemblage')).toBe(warm.label);
    expect(cell(rows[1], 'verdict')).toBe(warm.verdict);
    expect(Number(cell(rows[1], 'E_SHE_V'))).toBeCloseTo(warm.E, 8);
    // The bad rows: no answer, the reason in the error column, the carried cell kept.
    expect(rows[2]).toMatch(/^bad,4,,/);
    expect(cell(rows[2], 'error')).toContain('column 2 (pH)');
    expect(rows[3]).toMatch(/^hot,5,,/);
    expect(cell(rows[3], 'error')).toContain('temperature');
  });

  it('--strict stops at the first bad row (exit 2) and writes no output file', () => {
    const csv = join(dir, 'log-strict.csv');
    writeFileSync(csv, log);
    const out = join(dir, 'strict-out.csv');
    const r = run(['probe', brass, '--points', csv, '-o', out, '--strict']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('line 4');
    expect(existsSync(out)).toBe(false);
  });

  it('reads standard input, and refuses an ionic_strength column (exit 2, header named)', () => {
    let r = run(['probe', brass, '--points', '-'], 'pH;E\n5;-0,46\n');
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout.split('\n')[1]).toMatch(/^2;5;-0\.46;SHE;-0\.46;25;Cu \+ Zn\^2\+;partly-corroding;Zn;/);
    r = run(['probe', brass, '--points', '-'], 'pH,E,ionic_strength\n5,0,0.1\n');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('ionic_strength');
    expect(r.stderr).toContain('header');
  });

  it('refuses --points together with --ph (exit 2)', () => {
    const r = run(['probe', brass, '--points', '-', '--ph', '5'], 'pH,E\n5,0\n');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--points');
  });
});

describe('report x.pdf on an alloy file', () => {
  it('writes an A4 PDF with the assemblage tables, the same bytes on a second run', () => {
    const a = join(dir, 'alloy-a.pdf');
    const b = join(dir, 'alloy-b.pdf');
    for (const out of [a, b]) {
      const r = run(['report', brassSce, '-o', out]);
      expect(r.code, r.stderr).toBe(0);
    }
    const bytes = readFileSync(a);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    expect(bytes.length).toBeGreaterThan(10_000);
    expect(bytes.equals(readFileSync(b))).toBe(true);
  });
});

describe('a neutral dissolved species in an assemblage (Zn(OH)2(aq) in brass)', () => {
  it('probe: labelled Zn(OH)2(aq), marked dissolved, and the verdict says zinc dissolves', () => {
    const p = probeJson([brass, '--ph', '10', '--potential', '0']);
    const zn = p.assemblage.find((x: { species: string }) => parseFormula(x.species).elements.Zn);
    expect(parseFormula(zn.species).charge).toBe(0);
    expect(zn.phase).toBe('aq');
    expect(zn.dissolved).toBe(true);
    expect(zn.name).toBe('Zn(OH)2(aq)');
    expect(p.label).toContain('Zn(OH)2(aq)');
    expect(p.verdict).toBe('partly-corroding');
    expect(p.dissolving).toEqual(['Zn']);
    const text = run(['probe', brass, '--ph', '10', '--potential', '0']).stdout;
    expect(text).toMatch(/Zn\(OH\)₂\(aq\)\s+0\.350000\s+dissolved, holds 100\.0 % of Zn/);
  });

  it('the zinc member changes from Zn+2 to Zn(OH)2(aq) at pH 8.45 (log*β2 = −16.9; Baes & Mesmer 1976)', () => {
    expect(probeJson([brass, '--ph', '8.40', '--potential', '0']).label).toContain('Zn^2+');
    expect(probeJson([brass, '--ph', '8.50', '--potential', '0']).label).toContain('Zn(OH)2(aq)');
    const j = JSON.parse(run(['lines', brass, '--json']).stdout);
    const rows = j.lines.filter((l: { between: string[] }) => l.between.some((b) => b.includes('Zn^2+')) && l.between.some((b) => b.includes('Zn(OH)2(aq)')));
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) expect(row.line.value).toBeCloseTo(8.45, 2);
  });

  it('draw: the region labels, the JSON model and the HTML read-out name it as dissolved', () => {
    const json = join(dir, 'zn.json');
    let r = run(['draw', brass, '-o', json]);
    expect(r.code, r.stderr).toBe(0);
    const m = JSON.parse(readFileSync(json, 'utf8'));
    const withAq = m.regions.filter((x: { species: string }) => x.species.includes('Zn(OH)2'));
    expect(withAq.length).toBeGreaterThan(0);
    for (const reg of withAq) {
      expect(reg.species).toMatch(/Zn\(OH\)2\(aq\)/);
      const member = reg.assemblage.find((x: { species: string }) => x.species === 'Zn(OH)2');
      expect(member).toMatchObject({ phase: 'aq', dissolved: true });
      expect(reg.alloyVerdict).not.toBe('passive');
      expect(reg.dissolving).toContain('Zn');
    }
    // A member that is a solid carries no phase tag in the label and is not dissolved.
    for (const reg of m.regions) {
      for (const [k, t] of (reg.species as string).split(' + ').entries()) {
        expect(splitPhase(t).phase === 'aq').toBe(reg.assemblage[k].dissolved && parseFormula(reg.assemblage[k].species).charge === 0);
      }
    }
    const svg = join(dir, 'zn.svg');
    r = run(['draw', brass, '-o', svg, '--width', '170mm', '--height', '150mm']);
    expect(r.code, r.stderr).toBe(0);
    const svgText = readFileSync(svg, 'utf8');
    expect(svgText).toContain('Zn(OH)2(aq)');
    // The legend's key of the partly corroding fill says the (aq) members are dissolved.
    expect(svgText).toContain('ions and (aq) species in the label dissolved');
    const html = join(dir, 'zn.html');
    r = run(['draw', brass, '-o', html]);
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(html, 'utf8')).toContain('(aq)');
  });

  it('report (md): the assemblage table marks dissolved members', () => {
    const md = join(dir, 'zn-report.md');
    const r = run(['report', brass, '-o', md]);
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(md, 'utf8')).toContain('Zn(OH)₂ (dissolved) 0.35');
  });
});

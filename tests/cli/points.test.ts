/**
 * `probe --points`: rows carried, refused row by row, streamed; each answer equal to
 * `probe --ph --potential` at the same point (the same exact evaluation, independently invoked).
 */
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { rmSync } from 'node:fs';
import { runCli } from '../helpers/cli.js';
import { CsvRecordReader } from '../../src/io/csv-records.js';

const dir = mkdtempSync(join(tmpdir(), 'ephmap-points-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const fe = join(dir, 'fe.yaml');
writeFileSync(fe, 'element: Fe\nactivity: 1.0e-6\nE: [-1.2, 1.6]\n');

function csv(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

function parse(text: string, sep = ','): Record<string, string>[] {
  const r = new CsvRecordReader(sep, 'out');
  const recs = r.end(r.push(text)).map((x) => x.fields);
  const [head, ...rows] = recs;
  return rows.map((row) => Object.fromEntries(head.map((h, k) => [h, row[k]])));
}

describe('probe --points', () => {
  it('answers each row as probe --ph --potential does at the same point and temperature', async () => {
    const pts: [number, number, number][] = [[4, -0.3, 25], [7, 0, 25], [9.5, -0.65, 25], [12, 0.4, 25], [2, 0.9, 60], [8, -0.5, 90], [6, -0.4, 150]];
    const f = csv('series.csv', `pH,potential,temperature\n${pts.map((p) => p.join(',')).join('\n')}\n`);
    const r = await runCli(['probe', fe, '--points', f]);
    expect(r.code).toBe(0);
    const rows = parse(r.stdout);
    expect(rows.length).toBe(pts.length);
    for (const [k, [pH, E, T]] of pts.entries()) {
      const one = JSON.parse((await runCli(['probe', fe, '--ph', String(pH), '--potential', String(E), '--temperature', String(T), '--json'])).stdout);
      expect(rows[k].predominant).toBe(one.predominant);
      expect(rows[k].verdict).toBe(one.verdict);
      expect(rows[k].runner_up).toBe(one.runnerUp ?? '');
      expect(Number(rows[k].margin_kJ_per_mol)).toBeCloseTo(one.margin.kJPerMol, 5);
      if (one.distance.mV !== null) expect(Number(rows[k].distance_mV)).toBeCloseTo(one.distance.mV, 4);
      expect(rows[k].advice).toBe(one.advice);
      expect(Number(rows[k].temperature_C)).toBe(T);
    }
  });

  it('computes once per distinct temperature: a new temperature per row gives the same answers as separate runs', async () => {
    const temps = [25, 40, 55, 70, 85, 25, 40];
    const f = csv('temps.csv', `pH,potential,temperature\n${temps.map((T) => `8,-0.55,${T}`).join('\n')}\n`);
    const rows = parse((await runCli(['probe', fe, '--points', f])).stdout);
    for (const [k, T] of temps.entries()) {
      const one = parse((await runCli(['probe', fe, '--points', csv(`t${k}.csv`, `pH,potential\n8,-0.55\n`), '--temperature', String(T)])).stdout)[0];
      expect({ ...rows[k], line: '' }).toEqual({ ...one, line: '' });
    }
  });

  it('carries every extra column, quoted fields included, and neutralises formula-like labels', async () => {
    const f = csv('extra.csv', 'time,pH,site,potential,note\n2026-01-01 00:00,7,"tank 3, inlet",0,=cmd()\n');
    const r = await runCli(['probe', fe, '--points', f]);
    const row = parse(r.stdout)[0];
    expect(row.time).toBe('2026-01-01 00:00');
    expect(row.site).toBe('tank 3, inlet');
    expect(row.note).toBe("'=cmd()");
    expect(r.stdout).toContain('"tank 3, inlet"');
  });

  it('carries a negative number as the number it is (no quote), and a signed label neutralised', async () => {
    const f = csv('signed.csv', 'pH;potential;offset_mV;tag\n7;0;-12,5;-spike\n');
    const row = parse((await runCli(['probe', fe, '--points', f])).stdout, ';')[0];
    expect(row.offset_mV).toBe('-12,5');
    expect(row.tag).toBe("'-spike");
  });

  it('-o into a missing directory: exit 3 naming it, and the directory is not created (as every -o)', async () => {
    const f = csv('dir.csv', 'pH,potential\n7,0\n');
    const out = join(dir, 'no-such-dir', 'sub', 'out.csv');
    const r = await runCli(['probe', fe, '--points', f, '-o', out]);
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/does not exist \(create it first: ephmap does not create directories\)/);
    expect(existsSync(join(dir, 'no-such-dir'))).toBe(false);
    // An input error as well: the input error wins (exit 2), as README promises, still nothing made.
    const bad = csv('bad-head.csv', 'foo,bar\n1,2\n');
    const b = await runCli(['probe', fe, '--points', bad, '-o', out]);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/header/);
    expect(existsSync(join(dir, 'no-such-dir'))).toBe(false);
  });

  it("the above-300 °C warning follows each row's own temperature, in its warnings column", async () => {
    const f = csv('hot.csv', 'pH,potential,temperature\n7,-0.5,320\n7,-0.5,25\n');
    const rows = parse((await runCli(['probe', fe, '--points', f])).stdout);
    expect(rows[0].warnings).toMatch(/320 °C is above 300 °C/);
    expect(rows[1].warnings).not.toMatch(/above 300 °C/);
    const hotFile = join(dir, 'fe320.yaml');
    writeFileSync(hotFile, 'element: Fe\ntemperature: 320\n');
    const back = parse((await runCli(['probe', hotFile, '--points', csv('cool.csv', 'pH,potential,temperature\n7,-0.5,25\n')])).stdout);
    expect(back[0].warnings).not.toMatch(/above 300 °C/);
  });

  it('--json with --points is refused (the answer is CSV), not ignored; nothing written', async () => {
    const r = await runCli(['probe', fe, '--points', csv('j.csv', 'pH,potential\n7,0\n'), '--json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--json/);
    expect(r.stdout).toBe('');
  });

  it('marks bad rows in the error column, answers the rest, exit status 4', async () => {
    const f = csv('bad.csv', 'pH,potential\n7,0\n0x7,0\n,0.1\n20,0\n7,1000\n8,-0.5\n');
    const r = await runCli(['probe', fe, '--points', f]);
    expect(r.code).toBe(4);
    const rows = parse(r.stdout);
    expect(rows.map((x) => x.error === '')).toEqual([true, false, false, false, false, true]);
    expect(rows[1].error).toMatch(/line 3, column 1 \(pH\).*decimal number.*0x7/);
    expect(rows[2].error).toMatch(/line 4.*blank/);
    expect(rows[3].error).toMatch(/line 5.*-2 to 16/);
    expect(rows[4].error).toMatch(/line 6.*\|E\| ≤ 5 V/);
    expect(rows[5].predominant).not.toBe('');
    expect(r.stderr).toMatch(/4 of 6 rows/);
  });

  it('--strict stops at the first bad row with exit status 2 naming line and column, and writes no file', async () => {
    const f = csv('strict.csv', 'pH,potential\n7,0\n7,abc\n');
    const out = join(dir, 'strict-out.csv');
    const r = await runCli(['probe', fe, '--points', f, '--strict', '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 3, column 2 \(potential, V\): expected a decimal number, got "abc"/);
    expect(() => readFileSync(out)).toThrow();
  });

  it('refuses a header with two pH columns (the file, exit 2)', async () => {
    const r = await runCli(['probe', fe, '--points', csv('two.csv', 'pH,potential,ph\n7,0,8\n')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/header: expected one pH column, got two/);
  });

  it('reads potentials in mV (a potential_mV column, or --unit mV)', async () => {
    const a = parse((await runCli(['probe', fe, '--points', csv('mv.csv', 'pH,potential_mV\n8,-550\n')])).stdout)[0];
    const b = parse((await runCli(['probe', fe, '--points', csv('mv2.csv', 'pH,E\n8,-550\n'), '--unit', 'mV'])).stdout)[0];
    const v = parse((await runCli(['probe', fe, '--points', csv('v.csv', 'pH,E\n8,-0.55\n')])).stdout)[0];
    expect(a.predominant).toBe(v.predominant);
    expect(a.E_SHE_V).toBe('-0.55');
    expect(b.E_SHE_V).toBe('-0.55');
    const clash = await runCli(['probe', fe, '--points', csv('mv3.csv', 'pH,E_V\n8,-0.55\n'), '--unit', 'mV']);
    expect(clash.code).toBe(2);
  });

  it('reads ; separators with decimal commas and writes ; back', async () => {
    const r = await runCli(['probe', fe, '--points', csv('semi.csv', 'pH;potential;site\n8,5;-0,55;a;b\n'), '--delimiter', ';']);
    const rows = parse(r.stdout, ';');
    expect(rows[0].error).toMatch(/3 cells/); // four cells: the row is refused, not misread
    const ok = await runCli(['probe', fe, '--points', csv('semi2.csv', 'pH;potential\n8,5;-0,55\n')]);
    const row = parse(ok.stdout, ';')[0];
    expect(row.pH).toBe('8.5');
    expect(row.E_SHE_V).toBe('-0.55');
  });
});

describe('probe --points: warnings, streaming', () => {
  it('puts each row’s warnings in its warnings column (a reference outside its range, estimated data)', async () => {
    const r = await runCli(['probe', fe, '--points', csv('warm.csv', 'pH,potential,temperature\n7,0,25\n7,0,150\n'), '--ref', 'sce']);
    const rows = parse(r.stdout);
    expect(rows[0].warnings).toBe('');
    expect(rows[1].warnings).toMatch(/SCE: 150 °C is outside 0–70 °C/);
    expect(rows[1].warnings).toMatch(/estimated data/);
    expect(rows[1].scale).toBe('SCE');
  });
});

describe('probe --points: echoed cells', () => {
  it('echoes pH and potential as written (in mV when given in mV), formats the rest to 8 digits', async () => {
    const r = await runCli(['probe', fe, '--points', csv('echo.csv', 'pH,potential_mV\n8.50,-550.0\n 8.5 ,-5.5e2\n')]);
    const rows = parse(r.stdout);
    expect(r.stdout.split('\n')[0]).toContain(',potential_mV,');
    expect([rows[0].pH, rows[0].potential_mV]).toEqual(['8.50', '-550.0']);
    expect([rows[1].pH, rows[1].potential_mV]).toEqual(['8.5', '-550']);
    expect(rows[1].E_SHE_V).toBe('-0.55');
  });
});

describe('probe --points: nothing dropped silently', () => {
  it('a # line after the header is a row (refused in its error column), not skipped', async () => {
    const r = await runCli(['probe', fe, '--points', csv('hash.csv', '# plant log\npH,potential,tag\n7,0,a\n# pump off\n8,-0.5,b\n')]);
    expect(r.code).toBe(4);
    const rows = parse(r.stdout);
    expect(rows.map((x) => x.line)).toEqual(['3', '4', '5']);
    expect(rows[1].error).toMatch(/line 4.*3 cells/);
  });
});

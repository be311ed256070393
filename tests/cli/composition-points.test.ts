/**
 * `probe --points` on a composition file (the bath as made up) streams like the fixed-activity
 * series (tests/cli/points.test.ts): bad rows marked in their `error` column and the run goes on
 * (exit 4), --strict stops (exit 2), the input's separator kept, carried columns kept one by one,
 * potentials in mV. Outside check: at pH 12, 0 V all 0.2 mol/kg Ag is dissolved (the mass balance
 * of a bath where Ag(CN)2- holds the silver); each row equals `probe --ph --potential --json` at
 * the same point (the same solver, independently invoked).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { CsvRecordReader } from '../../src/io/csv-records.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const ag = writeTmp(dir, 'ag.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\n');

function parse(text: string, sep = ','): Record<string, string>[] {
  const r = new CsvRecordReader(sep, 'out');
  const recs = r.end(r.push(text)).map((x) => x.fields);
  const [head, ...rows] = recs;
  return rows.map((row) => Object.fromEntries(head.map((h, k) => [h, row[k]])));
}

describe('probe --points on a composition file', () => {
  test('a bad row (pH "abc", a short row) is marked in its error column; the run goes on; exit 4', async () => {
    const log = writeTmp(dir, 'bad.csv', 'pH,potential,tag\n12,0,a\nabc,0,b\n12\n12,-0.5,d\n');
    const r = await runCli(['probe', ag, '--points', log]);
    expect(r.code).toBe(4);
    expect(r.stderr).toMatch(/2 of 4 rows/);
    const rows = parse(r.stdout);
    expect(rows).toHaveLength(4);
    expect(rows[0]).toMatchObject({ tag: 'a', line: '2', status: 'ok', predominant: 'Ag(CN)2^-', verdict: 'corrosion', dissolved_mol_per_kg: '0.2', error: '' });
    expect(rows[1]).toMatchObject({ tag: 'b', line: '3', status: '', verdict: '' });
    expect(rows[1].error).toMatch(/line 3, column 1 \(pH\): expected a decimal number, got "abc"/);
    expect(rows[2]).toMatchObject({ line: '4', status: '' });
    expect(rows[2].error).toMatch(/line 4: expected 3 cells as in the header, got 1/);
    expect(rows[3]).toMatchObject({ tag: 'd', line: '5', status: 'ok', predominant: 'Ag', verdict: 'immunity', error: '' });
  });

  test('--strict stops at the first bad row with exit 2 and writes no file', async () => {
    const log = writeTmp(dir, 'strict.csv', 'pH,potential\n12,0\nabc,0\n');
    const out = join(dir, 'strict-out.csv');
    const r = await runCli(['probe', ag, '--points', log, '--strict', '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 3, column 1 \(pH\): expected a decimal number, got "abc"/);
    expect(() => readFileSync(out)).toThrow();
  });

  test('`;` input gives `;` output, decimal commas read', async () => {
    const log = writeTmp(dir, 'semi.csv', 'pH;potential;note\n12,0;-0,5;x, y\n');
    const r = await runCli(['probe', ag, '--points', log]);
    expect(r.code, r.stderr).toBe(0);
    const [head, row] = r.stdout.trim().split('\n');
    expect(head).toBe('note;line;pH;potential;scale;E_SHE_V;temperature_C;status;predominant;verdict;dissolved_mol_per_kg;threshold_mol_per_kg;reason;warnings;error');
    expect(row).toMatch(/^x, y;2;12;-0\.5;SHE;-0\.5;25;ok;Ag;immunity;/);
    expect(r.stdout).not.toMatch(/^[^\n]*,line,/);
  });

  test('carried columns kept one by one, in input order, neutralised; a clashing name renamed in_NAME', async () => {
    const log = writeTmp(dir, 'carry.csv', 'time,pH,operator,potential,status\n08:00,12,=SUM(A1),0,on\n');
    const r = await runCli(['probe', ag, '--points', log]);
    expect(r.code, r.stderr).toBe(0);
    const [row] = parse(r.stdout);
    expect(r.stdout.split('\n')[0]).toMatch(/^time,operator,in_status,line,pH,potential,/);
    expect(row).toMatchObject({ time: '08:00', operator: "'=SUM(A1)", in_status: 'on', status: 'ok', predominant: 'Ag(CN)2^-' });
  });

  test('each row equals probe --ph --potential --json at the same point; mV and temperature columns', async () => {
    const log = writeTmp(dir, 'mv.csv', 'pH,potential_mV,temperature\n12,-500,25\n12,-500,60\n');
    const r = await runCli(['probe', ag, '--points', log]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout.split('\n')[0]).toMatch(/^line,pH,potential_mV,scale,/);
    const rows = parse(r.stdout);
    expect(rows.map((x) => x.temperature_C)).toEqual(['25', '60']);
    const one = await runCli(['probe', ag, '--ph', '12', '--potential', '-0.5', '--json']);
    expect(one.code, one.stderr).toBe(0);
    const j = JSON.parse(one.stdout) as { predominant: string; verdict: string; dissolved: number };
    expect(rows[0]).toMatchObject({ potential_mV: '-500', E_SHE_V: '-0.5', predominant: j.predominant, verdict: j.verdict });
    expect(Number(rows[0].dissolved_mol_per_kg)).toBeCloseTo(j.dissolved, 7);
  });

  test('an ionic_strength column is refused (exit 2): the composition sets the ionic strength', async () => {
    const log = writeTmp(dir, 'ionic.csv', 'pH,potential,ionic_strength\n12,0,0.1\n');
    const r = await runCli(['probe', ag, '--points', log]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/ionic\.csv.*header.*no ionic_strength column/);
  });
});

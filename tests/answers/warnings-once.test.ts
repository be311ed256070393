/**
 * Each warning once: a reference electrode named in the file (`reference:`) away from the range of
 * its temperature formula warns once on stderr and once in the JSON `warnings`, in probe and lines
 * (the model and the displayed reference used to both carry it). The Ag/AgCl (sat. KCl) formula
 * holds over 0–90 °C (src/thermo/reference.ts), so 120 °C is outside it.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const fe = writeTmp(dir, 'fe.yaml', 'element: Fe\ntemperature: 120\nreference: agcl-sat\n');
const count = (text: string) => text.split('\n').filter((l) => /Ag\/AgCl.*outside/.test(l)).length;

describe('reference extrapolation warning once', () => {
  for (const [name, args] of [
    ['probe', ['probe', fe, '--ph', '9', '--potential', '-0.6']],
    ['probe --ref (same electrode)', ['probe', fe, '--ph', '9', '--potential', '-0.6', '--ref', 'agcl-sat']],
    ['lines', ['lines', fe]],
    ['lines --ref (same electrode)', ['lines', fe, '--ref', 'agcl-sat']],
    ['window', ['window', fe]],
  ] as const) {
    it(`${name}: once on stderr, once in JSON`, async () => {
      const text = await runCli([...args]);
      expect(text.code).toBe(0);
      expect(count(text.stderr)).toBe(1);
      const json = await runCli([...args, '--json']);
      expect(count(json.stderr)).toBe(1);
      const ws = (JSON.parse(json.stdout) as { warnings: string[] }).warnings;
      expect(ws.filter((w) => /Ag\/AgCl.*outside/.test(w))).toHaveLength(1);
    });
  }

  it('draw --ref with the file\'s own electrode: once on stderr', async () => {
    const r = await runCli(['draw', fe, '--ref', 'agcl-sat', '-o', `${dir}/fe.svg`]);
    expect(r.code).toBe(0);
    expect(count(r.stderr)).toBe(1);
  });
});

describe('composition lines honour the file reference', () => {
  it('a bath file with reference: sce gets the E span vs SCE column without --ref (SCE +0.241 V vs SHE, common practice)', async () => {
    const bath = writeTmp(dir, 'ag.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\nreference: sce\ngrid: 60\n');
    const r = await runCli(['lines', bath, '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout) as { reference?: { label: string; offset: number } };
    expect(j.reference?.label).toBe('SCE');
    expect(j.reference?.offset).toBeCloseTo(0.241, 2);
  });
});

describe('probe --points: each warning once per row', () => {
  it('the row warnings column names the Ag/AgCl extrapolation once', async () => {
    const log = writeTmp(dir, 'log.csv', 'pH,E\n9,-0.6\n9.5,-0.65\n');
    const out = `${dir}/rows.csv`;
    const r = await runCli(['probe', fe, '--points', log, '-o', out]);
    expect(r.code).toBe(0);
    const { readFileSync } = await import('node:fs');
    const rows = readFileSync(out, 'utf8').trim().split('\n').slice(1);
    expect(rows).toHaveLength(2);
    for (const row of rows) expect(row.split(/Ag\/AgCl \(sat\. KCl\): 120 °C is outside/).length - 1).toBe(1);
  });
});

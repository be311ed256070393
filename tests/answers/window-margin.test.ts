/**
 * Composition `window`: the table's margin to hydrogen and the note's margin are the same figures
 * (the table used to print the margin at the window's two ends, +0.47 … +0.47 V here, beside a note
 * "margin +0.37 V to +0.47 V"). Which is right, by hand: an ammoniacal copper rinse made up with
 * 0.05 mol/kg Cu and 1 mol/kg N deposits from Cu(NH3)2+; at the equal-share boundary 0.025 mol/kg
 * Cu is dissolved and ≈ 0.95 mol/kg N is free, split by NH4+ ⇌ NH3 + H+ (pKa 9.24, Martell & Smith,
 * tests/fixtures/stability-constants.csv). With Cu+ + e- = Cu, E° = 0.521 V (CRC Handbook series,
 * recalled; tests/fixtures/standard-potentials.csv) and log β2(Cu(NH3)2+) = 10.86 (Martell & Smith,
 * recalled from memory):
 *   E_dep(pH) = 0.521 + s·(log 0.025 − 10.86 − 2·log[NH3](pH)),  margin = E_dep + s·pH,
 * which falls by s per pH below the pKa and rises by s per pH above it: least (≈ +0.37 V) near
 * pH 9.2, inside the window, and ≈ +0.47 V at both ends. So the note (least … greatest) is right and
 * the table's column must give the same range.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const s = 0.059159; // ln10·RT/F at 25 °C, V
const nh3 = (pH: number) => 0.95 / (1 + 10 ** (9.24 - pH));
const margin = (pH: number) => 0.521 + s * (Math.log10(0.025) - 10.86 - 2 * Math.log10(nh3(pH))) + s * pH;

const dir = tmpDir();
const bath = writeTmp(dir, 'rinse.yaml', 'element: Cu\ncomposition: {Cu: 0.05, N: 1}\npH: [4, 14]\nE: [-0.8, 1.0]\ngrid: 120\n');

describe('composition window: one margin', () => {
  it('the table gives the least and greatest margin, as the note does, and the least matches the hand value', async () => {
    const r = await runCli(['window', bath]);
    expect(r.code).toBe(0);
    const row = /^(\d+\.\d+)–(\d+\.\d+)\s.*?\s([+-]\d\.\d+) … ([+-]\d\.\d+)\s+([+-]\d\.\d+) … ([+-]\d\.\d+)\s/m.exec(r.stdout)!;
    const [lo, hi] = [Number(row[1]), Number(row[2])];
    const [mMin, mMax] = [Number(row[5]), Number(row[6])];
    const note = /margin ([+-]\d\.\d+) V to ([+-]\d\.\d+) V/.exec(r.stdout)!;
    expect([mMin, mMax]).toEqual([Number(note[1]), Number(note[2])]);
    // Hand minimum over the window's pH span (fine scan).
    let hand = Infinity;
    for (let x = lo; x <= hi; x += 0.01) hand = Math.min(hand, margin(x));
    expect(Math.abs(mMin - hand)).toBeLessThan(0.02);
    expect(Math.abs(mMax - Math.max(margin(lo), margin(hi)))).toBeLessThan(0.02);
    expect(mMax - mMin).toBeGreaterThan(0.05);
  });
});

describe('report: the plating-window section gives the same margin range', () => {
  it('markdown table and note agree (least … greatest)', async () => {
    const f = writeTmp(dir, 'rinse-report.yaml', 'element: Cu\ncomposition: {Cu: 0.05, N: 1}\npH: [4, 14]\nE: [-0.8, 1.0]\ngrid: 120\nplatingWindow: true\n');
    const out = `${dir}/rinse.md`;
    const r = await runCli(['report', f, '-o', out]);
    expect(r.code).toBe(0);
    const { readFileSync } = await import('node:fs');
    const md = readFileSync(out, 'utf8');
    expect(md).toContain('E_dep − E(H₂) min … max / V');
    const row = /^\| \d+\.\d+–\d+\.\d+ \|[^|]*\|[^|]*\| ([+-]\d\.\d+) … ([+-]\d\.\d+) \|/m.exec(md)!;
    const note = /margin ([+-]\d\.\d+) V to ([+-]\d\.\d+) V/.exec(md)!;
    expect([row[1], row[2]]).toEqual([note[1], note[2]]);
    expect(Number(row[2]) - Number(row[1])).toBeGreaterThan(0.05);
  });
});

/**
 * Published high-temperature equilibrium constants through the default temperature model (HKF
 * for the aqueous species, IAPWS for water). Values, tolerances and sources: 
 * tests/fixtures/high-temperature-logk.csv (PSBM82, PBM84, SS97, HM76, DWPM90 — named per row).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseFormula, splitPhase } from '../../src/chem/formula.js';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { carrySpecies } from '../../src/system/carry.js';
import { libraryLookup } from '../../src/system/lookup.js';
import { cellReaction } from '../../src/thermo/cell.js';
import { waterState } from '../../src/thermo/water.js';

const R = 8.314462618; // CODATA 2018
const lib = loadLibrary();

function G(key: string, t: number): number {
  const s = findSpecies(lib, key)!;
  expect(s, key).toBeDefined();
  const r = { formula: s.formula, phase: s.phase, dfG: s.dfG, dfH: s.dfH, S: s.S, Cp: s.Cp, field: key, library: true, f: parseFormula(s.formula), ...(s.hkf ? { hkf: s.hkf } : {}) };
  return carrySpecies(r, { mode: 'best', water: waterState(t), lib, constantG: false }).G!;
}

const side = (text: string): string[] => text.split(' + ').map((x) => x.trim());
const withPhase = (x: string): string => (splitPhase(x).phase ? x : `${x}(aq)`);

const rows = readFileSync(new URL('../fixtures/high-temperature-logk.csv', import.meta.url), 'utf8')
  .split('\n')
  .filter((l) => l.trim() && !l.startsWith('#') && !l.startsWith('reaction,'))
  .map((l) => l.split(','));

describe('published log K at 100–150 °C', () => {
  it.each(rows)('%s at %s °C: log K %s ± %s (%s)', (reaction, t, logK, tol) => {
    const T = Number(t) + 273.15;
    const [left, right] = reaction.split(' = ');
    const sum = (xs: string[]) => xs.reduce((a, x) => a + G(withPhase(x), Number(t)), 0);
    const dG = sum(side(right!)) - sum(side(left!));
    const k = (-dG * 1000) / (R * T * Math.LN10);
    expect(Math.abs(k - Number(logK))).toBeLessThan(Number(tol));
  });
});

describe('the same published log K through `cell` (its default species models)', () => {
  it.each(rows)('%s at %s °C: log K %s ± %s (%s)', (reaction, t, logK, tol) => {
    const text = reaction!.split(' = ').map((x) => side(x).map(withPhase).join(' + ')).join(' = ');
    const r = cellReaction(text, { lookup: libraryLookup, celsius: Number(t) });
    expect(r.kind).toBe('chemical');
    expect(Math.abs(r.logK - Number(logK))).toBeLessThan(Number(tol));
  });
});

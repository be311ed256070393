/**
 * Equilibrium constants at 25 °C from the library's ΔfG°:  log10 K = −ΔrG°/(RT·ln10).
 * Checked against handbook acid constants and solubility products (sources beside each value).
 */
import { describe, it, expect } from 'vitest';
import { loadLibrary } from '../../src/data/library.js';
import { R, T_REF, LN10 } from '../../src/thermo/constants.js';
import { parseReaction, imbalance, missing, reactionGibbs } from './reactions.js';

const lib = loadLibrary();
const logK = (reaction: string): number => {
  const r = parseReaction(reaction);
  expect(imbalance(r), reaction).toEqual({});
  expect(missing(lib, r), reaction).toEqual([]);
  return (-reactionGibbs(lib, r) * 1000) / (R * T_REF * LN10);
};

describe('acid dissociation constants at 25 °C (within 0.1 pK)', () => {
  // pKa values: CRC Handbook of Chemistry and Physics, "Dissociation constants of inorganic acids and
  // bases" — recalled from memory.
  const cases: [string, number][] = [
    ['NH4+ = NH3(aq) + H+', 9.25],
    ['H2S(aq) = HS- + H+', 7.0],
    ['CO2(aq) + H2O(l) = HCO3- + H+', 6.35],
    ['HCO3- = CO3-2 + H+', 10.33],
    ['HSO4- = SO4-2 + H+', 1.99],
    ['HCN(aq) = CN- + H+', 9.21],
  ];
  for (const [reaction, pKa] of cases) {
    it(`${reaction}: pKa ${pKa} (CRC Handbook, recalled from memory)`, () => {
      expect(Math.abs(-logK(reaction) - pKa)).toBeLessThan(0.1);
    });
  }

  it('H2O(l) = H+ + OH-: pKw 13.995 (IAPWS R11-07, Bandura & Lvov 2006, at 25 °C; recalled from memory)', () => {
    expect(Math.abs(-logK('H2O(l) = H+ + OH-') - 13.995)).toBeLessThan(0.01);
  });
});

describe('solubility products at 25 °C (within 0.15 log units)', () => {
  // Ksp values: CRC Handbook of Chemistry and Physics, "Solubility product constants" table
  // (computed there from NBS-type data) — recalled from memory.
  const cases: [string, number, string][] = [
    ['Fe(OH)2(s) = Fe+2 + 2OH-', Math.log10(4.87e-17), 'Fe(OH)2 4.87e-17'],
    // (ZnO is checked against Baes & Mesmer's zincite constant in review-fixes.test.ts: the CRC row
    // "Zn(OH)2 3e-17" is for a hydroxide, not for zincite)
    ['Ni(OH)2(s) = Ni+2 + 2OH-', Math.log10(5.48e-16), 'Ni(OH)2 5.48e-16'],
    ['FeCO3(s) = Fe+2 + CO3-2', Math.log10(3.13e-11), 'FeCO3 3.13e-11'],
    ['ZnCO3(s) = Zn+2 + CO3-2', Math.log10(1.46e-10), 'ZnCO3 1.46e-10'],
    ['NiCO3(s) = Ni+2 + CO3-2', Math.log10(1.42e-7), 'NiCO3 1.42e-7'],
    ['CuCl(s) = Cu+ + Cl-', Math.log10(1.72e-7), 'CuCl 1.72e-7'],
  ];
  for (const [reaction, logKsp, label] of cases) {
    it(`${reaction}: CRC Handbook Ksp ${label} (recalled from memory)`, () => {
      expect(Math.abs(logK(reaction) - logKsp)).toBeLessThan(0.15);
    });
  }

  const hasAg = lib.some((s) => s.formula === 'AgCl' && s.phase === 's') && lib.some((s) => s.formula === 'Ag+');
  const agName = 'AgCl(s) = Ag+ + Cl-: CRC Handbook Ksp 1.77e-10 (recalled from memory)';
  if (hasAg) {
    it(agName, () => {
      expect(Math.abs(logK('AgCl(s) = Ag+ + Cl-') - Math.log10(1.77e-10))).toBeLessThan(0.15);
    });
  } else {
    it.skip(`${agName} — SKIPPED: AgCl(s) or Ag+ absent from the library (species/Ag.json)`, () => {});
  }
});

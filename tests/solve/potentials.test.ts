/**
 * Worked examples of the formation plane Φ and the Nernst slope (CODATA 2018 constants).
 */
import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/chem/formula.js';
import { nernstSlope } from '../../src/thermo/constants.js';
import { formationPlane } from '../../src/solve/potentials.js';

const W = { kelvin: 298.15, G_H2O: -237129, G_H2: 0, logWaterActivity: 0 };
const sp = (formula: string, G: number, logActivity = 0) => {
  const f = parseFormula(formula);
  return { formula, phase: 'aq' as const, elements: f.elements, charge: f.charge, G, logActivity };
};

describe('formation planes Φ(pH, E) = g + p·pH + e·E (J/mol)', () => {
  it('Nernst slope at 25 °C is 0.0591593 V (ln10·RT/F)', () => {
    expect(nernstSlope(298.15)).toBeCloseTo(0.0591593, 7);
  });

  it('Fe+2 at a = 1e-6: Φ = −113148 − 192971·E (ΔfG° −78.90 kJ/mol, NBS 1982 recalled)', () => {
    const pl = formationPlane(sp('Fe+2', -78.9, -6), W);
    expect(pl.g).toBeCloseTo(-78900 + 8.314462618 * 298.15 * Math.log(1e-6), 6);
    expect(pl.g).toBeCloseTo(-113148, 0);
    expect(pl.e).toBeCloseTo(-2 * 96485.33212, 6);
    expect(pl.p).toBeCloseTo(0, 12);
  });

  it('H2O has Φ = 0 everywhere and H+ has Φ = −RT ln10·pH at unit activity (the references)', () => {
    const w = formationPlane({ ...sp('H2O', -237.129), phase: 'l' }, W);
    expect(w.g).toBeCloseTo(0, 9);
    expect(w.p).toBeCloseTo(0, 12);
    expect(w.e).toBeCloseTo(0, 12);
    const h = formationPlane(sp('H+', 0), W);
    expect(h.g).toBeCloseTo(0, 12);
    expect(h.p).toBeCloseTo(8.314462618 * 298.15 * Math.LN10, 6);
    expect(h.e).toBeCloseTo(0, 12);
  });

  it('Fe2O3: 2Fe + 3H2O → Fe2O3 + 6H+ + 6e−, so p = −6·RT ln10 and e = −6F', () => {
    const pl = formationPlane({ ...sp('Fe2O3', -742.2), phase: 's' }, W);
    expect(pl.p).toBeCloseTo(-6 * 8.314462618 * 298.15 * Math.LN10, 6);
    expect(pl.e).toBeCloseTo(-6 * 96485.33212, 6);
    expect(pl.g).toBeCloseTo(-742200 + 3 * 237129, 6);
  });
});

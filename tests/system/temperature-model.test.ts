/**
 * The default temperature model ('best') through the species model: the library's own H2O(l), H+
 * and OH- must reproduce the ionization constant of water from 0 to 300 °C, and every library
 * species must be carried to any temperature in 0–300 °C.
 * Check values: IAPWS R11-07 (2007, revised 2019) pKw along the liquid path, in
 * tests/fixtures/water-properties.csv (sources in its header).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/chem/formula.js';
import { findSpecies, loadLibrary, type LibrarySpecies } from '../../src/data/library.js';
import type { ResolvedSpecies } from '../../src/system/build.js';
import { carrySpecies } from '../../src/system/carry.js';
import { waterState } from '../../src/thermo/water.js';

const R = 8.314462618; // CODATA 2018
const lib = loadLibrary();

function resolved(s: LibrarySpecies): ResolvedSpecies {
  return {
    formula: s.formula, phase: s.phase, dfG: s.dfG, dfH: s.dfH, S: s.S, Cp: s.Cp, field: s.formula, library: true,
    f: parseFormula(s.formula), ...(s.hkf ? { hkf: s.hkf } : {}), ...(s.cpPolynomial ? { cpPolynomial: s.cpPolynomial } : {}),
  };
}

function G(key: string, celsius: number): number {
  const c = carrySpecies(resolved(findSpecies(lib, key)!), { mode: 'best', water: waterState(celsius), lib, constantG: false });
  expect(c.G, key).toBeDefined();
  return c.G!;
}

const rows = readFileSync(new URL('../fixtures/water-properties.csv', import.meta.url), 'utf8')
  .split('\n')
  .filter((l) => l.trim() && !l.startsWith('#') && !l.startsWith('t_'))
  .map((l) => l.split(',').map(Number));

describe('pKw from the library species through the temperature model', () => {
  it.each(rows.map((r) => [r[0]!, r[3]!]))('%s °C: within 0.05 of IAPWS R11-07', (t, pKw) => {
    const T = t + 273.15;
    const dG = G('H^+(aq)', t) + G('OH^-(aq)', t) - G('H2O(l)', t);
    const pk = (dG * 1000) / (R * T * Math.LN10);
    expect(Math.abs(pk - pKw)).toBeLessThan(0.05);
  });
});

describe('every library species is carried to temperature', () => {
  it.each([0, 26, 100, 150, 200, 250, 300])('%s °C: a finite G and a temperature model for each', (t) => {
    const w = waterState(t);
    for (const s of lib) {
      const c = carrySpecies(resolved(s), { mode: 'best', water: w, lib, constantG: false });
      expect(c.model, `${s.formula}(${s.phase})`).not.toBe('undetermined');
      expect(Number.isFinite(c.G), `${s.formula}(${s.phase})`).toBe(true);
      if (s.S === undefined && s.dfH === undefined) expect(c.estimated, s.formula).toBe(true);
    }
  });
  it('H2O(l) is carried by IAPWS, ions with compilation parameters as published, the rest estimated', () => {
    const w = waterState(150);
    const model = (k: string) => carrySpecies(resolved(findSpecies(lib, k)!), { mode: 'best', water: w, lib, constantG: false });
    expect(model('H2O(l)').model).toBe('iapws');
    expect(model('OH^-').model).toBe('published');
    expect(model('Cl^-').model).toBe('published');
    expect(model('ZnOH^+').model).toBe('estimated');
    expect(model('ZnOH^+').estimatedWhat).toEqual(['S°', 'HKF parameters']);
    expect(model('Fe2O3').model).toBe('cp-polynomial');
    expect(model('Fe3O4').model).toBe('constant-cp');
  });
});

describe('catalog data name the temperature model', () => {
  it('ZnOH+ estimated (S° and HKF parameters), OH- published, H2O(l) by IAPWS', async () => {
    const { catalogEntries } = await import('../../src/report/catalog.js');
    const all = catalogEntries(lib);
    const get = (f: string, p: string) => all.find((e) => e.formula === f && e.phase === p)!;
    expect(get('ZnOH^+', 'aq').temperatureModel).toBe('estimated');
    expect(get('ZnOH^+', 'aq').estimated).toEqual(['S°', 'HKF parameters']);
    expect(get('OH^-', 'aq').temperatureModel).toBe('published');
    expect(get('OH^-', 'aq').estimated).toBeUndefined();
    expect(get('H2O', 'l').temperatureModel).toBe('iapws');
  });
});

describe('carryProperties (S, Cp, H from the model, for reaction properties)', () => {
  it('H2O(l) at 25 °C: S° 69.91 (library), Cp 75.3 J/(mol K) (IAPWS: 4.1813 kJ/(kg K)), H = ΔfH°', async () => {
    const { carryProperties } = await import('../../src/system/carry.js');
    const p = carryProperties(resolved(findSpecies(lib, 'H2O(l)')!), { mode: 'best', water: waterState(25), lib, constantG: false });
    expect(p.S!).toBeCloseTo(69.91, 1);
    expect(p.Cp!).toBeCloseTo(4.1813 * 18.015268, 0);
    expect(p.H!).toBeCloseTo(-285.83, 1);
  });
  it('ΔrH of water ionization at 25 °C is 55.8 kJ/mol (NBS82 ΔfH° of OH- and H2O; common practice)', async () => {
    const { carryProperties } = await import('../../src/system/carry.js');
    const ctx = { mode: 'best' as const, water: waterState(25), lib, constantG: false };
    const H = (k: string) => carryProperties(resolved(findSpecies(lib, k)!), ctx).H!;
    expect(H('H^+(aq)') + H('OH^-(aq)') - H('H2O(l)')).toBeCloseTo(-229.994 + 285.83, 1);
  });
});

describe('the HKF estimator against published parameters', () => {
  it('for the library ions with published parameters (SH88) and Cp°, estimated G at 200 °C is within 4 kJ/mol of the published one', async () => {
    const { hkfG } = await import('../../src/thermo/hkf.js');
    const { estimateHkf } = await import('../../src/thermo/hkf-estimate.js');
    const w = waterState(200);
    const st = { kelvin: w.kelvin, pressureMPa: w.pressureMPa, density: w.density };
    const ions = lib.filter((s) => s.hkf && s.charge !== 0 && s.S !== undefined);
    expect(ions.length).toBeGreaterThanOrEqual(8);
    for (const s of ions) {
      const pub = hkfG(s.dfG, s.S!, s.hkf!, s.charge, st);
      const est = hkfG(s.dfG, s.S!, estimateHkf(s.charge, s.S!, s.Cp), s.charge, st);
      expect(Math.abs(est - pub), s.formula).toBeLessThan(4);
    }
  });
});

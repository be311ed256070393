/**
 * Ligand systems and the plating window, checked against hand calculations from the same library
 * data (the library's sources: NBS 1982 tables etc., recalled from memory; see species/).
 */
import { describe, expect, it } from 'vitest';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { compute } from '../../src/pipeline.js';
import { platingWindow } from '../../src/analysis/window.js';
import { psiAt } from '../../src/solve/point.js';
import { readSpec } from '../../src/system/spec.js';

const F = 96485.33212; // CODATA 2018
const R = 8.314462618; // CODATA 2018
const T = 298.15;
const s = (Math.LN10 * R * T) / F;
const lib = loadLibrary();
const G = (key: string) => {
  const sp = findSpecies(lib, key);
  if (!sp) throw new Error(`library lacks ${key}`);
  return sp.dfG * 1000;
};
const winner = (c: ReturnType<typeof compute>, pH: number, E: number) => {
  const { psi } = psiAt(c.built.input, pH, E);
  return c.built.input.species[psi.indexOf(Math.min(...psi))].formula;
};

describe('copper with total dissolved sulfur 1e-3 at 25 °C', () => {
  const c = compute(readSpec({ element: 'Cu', ligands: { S: 1e-3 }, E: [-1.0, 1.2] }, 'cus.yaml'));
  const aS = 1e-3;
  // Hand lines for Cu2S/Cu with the sulfur species predominant on each side of the kinks:
  //   Cu2S + 2H+ + 2e- = 2Cu + H2S(aq):  E = [G(Cu2S) − G(H2S)]/(2F) − s·pH − (s/2)·log a
  //   Cu2S + H+ + 2e- = 2Cu + HS-:        E = [G(Cu2S) − G(HS-)]/(2F) − (s/2)·pH − (s/2)·log a
  const eH2S = (pH: number) => (G('Cu2S(s)') - G('H2S(aq)')) / (2 * F) - s * pH - (s / 2) * Math.log10(aS);
  const eHS = (pH: number) => (G('Cu2S(s)') - G('HS^-')) / (2 * F) - (s / 2) * pH - (s / 2) * Math.log10(aS);
  // Kink where H2S = HS- + H+ at equal activities: pH = pKa = [G(HS-) − G(H2S)]/(RT ln10).
  const pKa = (G('HS^-') - G('H2S(aq)')) / (R * T * Math.LN10);

  it('Cu2S is present', () => {
    expect(c.model.regions.map((r) => r.species)).toContain('Cu2S');
  });

  it('the Cu/Cu2S boundary is written with H2S on one side of the kink and HS- on the other', () => {
    const bs = c.model.boundaries.filter((b) => b.between.includes('Cu') && b.between.includes('Cu2S'));
    const lig = bs.map((b) => b.ligandSpecies.join());
    expect(lig).toEqual(expect.arrayContaining(['H2S', 'HS^-']));
    const h2s = bs.find((b) => b.ligandSpecies[0] === 'H2S')!;
    for (const [pH, E] of h2s.points) expect(Math.abs(E - eH2S(pH))).toBeLessThan(1e-4);
    // The kink vertex: on both hand lines within 0.1 mV, at pH = pKa (H2S) within 0.002.
    const kinkPH = (eH2S(0) - eHS(0)) / (s / 2);
    expect(kinkPH).toBeCloseTo(pKa, 6);
    const pts = bs.flatMap((b) => b.points);
    const kink = pts.find(([pH]) => Math.abs(pH - pKa) < 0.002);
    expect(kink).toBeDefined();
    expect(Math.abs(kink![1] - eH2S(kink![0]))).toBeLessThan(1e-4);
    expect(Math.abs(kink![1] - eHS(kink![0]))).toBeLessThan(1e-4);
  });

  it('probe agrees with the hand lines on both sides of the kink (±5 mV off the line)', () => {
    for (const pH of [pKa - 0.5, pKa + 0.5]) {
      const line = pH < pKa ? eH2S(pH) : eHS(pH);
      expect(winner(c, pH, line + 0.005)).toBe('Cu2S');
      expect(winner(c, pH, line - 0.005)).toBe('Cu');
    }
  });

  it('another boundary switches to sulfate at high potential (S(VI) segment with SO4-2 or HSO4-)', () => {
    const sulfate = c.model.boundaries.filter((b) => b.ligandSpecies.some((x) => x === 'SO4^2-' || x === 'HSO4^-'));
    expect(sulfate.length).toBeGreaterThan(0);
  });
});

describe('ammonia, zincate', () => {
  it('ammonia at 1 mol/kg moves dissolved copper into pH 8–10 (log β4 of Cu(NH3)4+2 ≈ 13, recalled from memory)', () => {
    const logB4 = -(G('Cu(NH3)4^2+') - G('Cu^2+') - 4 * G('NH3(aq)')) / (R * T * Math.LN10);
    expect(Math.abs(logB4 - 13)).toBeLessThan(0.7);
    const plain = compute(readSpec({ element: 'Cu', E: [-1, 1.2] }, 'cu.yaml'));
    const amm = compute(readSpec({ element: 'Cu', ligands: { N: 1 }, E: [-1, 1.2] }, 'cunh3.yaml'));
    for (const pH of [8, 9, 10]) {
      // Inside the water window at this pH (0.3 V above H2, 0.3 V below O2).
      const Es = [0.2, 0.4, 0.6].map((k) => -s * pH + k);
      expect(Es.some((E) => /NH3/.test(winner(amm, pH, E)))).toBe(true);
      expect(Es.every((E) => !/NH3|\+/.test(winner(plain, pH, E)))).toBe(true);
    }
  });

  it('zincate predominates for zinc at high pH (pH 13.8, E −0.5 V vs SHE)', () => {
    const zn = compute(readSpec({ element: 'Zn', E: [-1.8, 1.4] }, 'zn.yaml'));
    const w = winner(zn, 13.8, -0.5);
    expect(['ZnO2^2-', 'Zn(OH)4^2-', 'HZnO2^-']).toContain(w);
  });
});

describe('plating window of an acid copper bath (Cu activity 0.5, sulfate only)', () => {
  it('agrees with a hand calculation: E_dep = E°(Cu+2/Cu) + (s/2)·log a, up to the pH where Cu2O meets the metal', () => {
    const spec = readSpec(
      { element: 'Cu', activity: 0.5, ligands: { S: 1 }, ligandSpecies: { S: ['SO4^2-', 'HSO4^-'] }, exclude: ['CuS', 'Cu2S'], E: [-1, 1.2] },
      'acid-copper.yaml',
    );
    const w = platingWindow(compute(spec).model);
    const Edep = G('Cu^2+') / (2 * F) + (s / 2) * Math.log10(0.5);
    // Cu2O + 2H+ + 2e- = 2Cu + H2O: E = [G(Cu2O) − G(H2O)]/(2F) − s·pH
    const eCu2O = (G('Cu2O(s)') - G('H2O(l)')) / (2 * F);
    const pHmax = (eCu2O - Edep) / s;
    expect(w.windows.length).toBe(1);
    expect(w.windows[0].pH[0]).toBeCloseTo(0, 9);
    expect(w.windows[0].pH[1]).toBeCloseTo(pHmax, 6);
    expect(w.windows[0].deposition[0].E).toBeCloseTo(Edep, 6);
    expect(w.windows[0].marginToHydrogen.atLowPH).toBeCloseTo(Edep, 6); // E(H2) = 0 at pH 0
    expect(w.windows[0].boundedBy.high).toBe('Cu2O');
    expect(w.firstSolid?.species).toBe('Cu2O');
  });
});

import { describe, it, expect } from 'vitest';
import {
  debyeHuckelParameters,
  daviesLogGamma,
  extendedDebyeHuckelLogGamma,
  ionicStrength,
  backgroundElectrolyte,
  activityModel,
  mgPerLitreToMolal,
} from '../../src/thermo/activity.js';
import { waterState } from '../../src/thermo/water.js';

const w25 = waterState(25);
const dh25 = debyeHuckelParameters(w25.kelvin, w25.density, w25.permittivity);

describe('Debye–Hückel parameters', () => {
  it('A ≈ 0.509 kg^½ mol^-½ at 25 °C', () => {
    // Common practice: A = 0.509 (molal, log10) at 25 °C.
    expect(Math.abs(dh25.A - 0.509)).toBeLessThan(0.002);
  });

  it('B ≈ 0.328 Å⁻¹ kg^½ mol^-½ at 25 °C', () => {
    // Common practice: B = 0.328 Å⁻¹ at 25 °C.
    expect(Math.abs(dh25.B - 0.328)).toBeLessThan(0.002);
  });

  it('A from the fixture density and permittivity at 25 °C (997.048 kg/m³, 78.409)', () => {
    // Fixture values (IAPWS-IF97, R8-97); A ≈ 0.509, common practice.
    expect(debyeHuckelParameters(298.15, 997.048, 78.409).A).toBeCloseTo(0.5098, 3);
  });

  it('A rises with temperature (εT falls), e.g. 25 → 200 °C', () => {
    // Common practice: Debye–Hückel A increases with T in liquid water.
    const w = waterState(200);
    expect(debyeHuckelParameters(w.kelvin, w.density, w.permittivity).A).toBeGreaterThan(dh25.A + 0.1);
  });

  it('rejects non-positive inputs', () => {
    expect(() => debyeHuckelParameters(298.15, 0, 78)).toThrow(RangeError);
  });
});

describe('Davies and extended Debye–Hückel', () => {
  it('Davies γ for z = 1 at I = 0.1 mol/kg, 25 °C ≈ 0.78', () => {
    // Recalled from memory: Davies γ± ≈ 0.78 for a 1:1 ion at I = 0.1.
    expect(Math.abs(10 ** daviesLogGamma(1, 0.1, dh25.A) - 0.78)).toBeLessThan(0.005);
  });

  it('extended Debye–Hückel matches Kielland’s table at I = 0.1: H⁺ (9 Å) 0.83, Ca²⁺ (6 Å) 0.405', () => {
    // J. Kielland, J. Am. Chem. Soc. 59, 1675 (1937), table of individual ion activity coefficients — recalled from memory.
    expect(Math.abs(10 ** extendedDebyeHuckelLogGamma(1, 0.1, dh25.A, dh25.B, 9) - 0.83)).toBeLessThan(0.01);
    expect(Math.abs(10 ** extendedDebyeHuckelLogGamma(2, 0.1, dh25.A, dh25.B, 6) - 0.405)).toBeLessThan(0.01);
  });

  it('both reduce to the Debye–Hückel limiting law −A z² √I at very low I', () => {
    // Debye & Hückel (1923) limiting law — common practice.
    const I = 1e-8;
    const ll = -dh25.A * 4 * Math.sqrt(I);
    expect(Math.abs(daviesLogGamma(2, I, dh25.A) / ll - 1)).toBeLessThan(1e-3);
    expect(Math.abs(extendedDebyeHuckelLogGamma(2, I, dh25.A, dh25.B, 6) / ll - 1)).toBeLessThan(1e-3);
  });

  it('Davies goes through a minimum and rises at high I (the 0.3 I term)', () => {
    // Common practice: Davies log γ has its minimum near I ≈ 0.5 and rises beyond.
    expect(daviesLogGamma(1, 2, dh25.A)).toBeGreaterThan(daviesLogGamma(1, 0.5, dh25.A));
  });

  it('rejects negative ionic strength', () => {
    expect(() => daviesLogGamma(1, -0.1, 0.5)).toThrow(RangeError);
    expect(() => extendedDebyeHuckelLogGamma(1, -0.1, 0.5, 0.33, 4)).toThrow(RangeError);
  });
});

describe('ionic strength', () => {
  it('I = ½ Σ m z² (definition, common practice)', () => {
    expect(ionicStrength([{ charge: 2, molality: 0.01 }, { charge: -1, molality: 0.02 }])).toBeCloseTo(0.03, 12);
    expect(ionicStrength([])).toBe(0);
  });

  it('background electrolyte: NaCl 0.5 mol/kg → 0.5; Na2SO4 0.1 → 0.3; MgSO4 0.1 → 0.4', () => {
    // Definition of ionic strength, common practice.
    expect(backgroundElectrolyte([{ charge: 1, count: 1 }, { charge: -1, count: 1 }], 0.5)).toBeCloseTo(0.5, 12);
    expect(backgroundElectrolyte([{ charge: 1, count: 2 }, { charge: -2, count: 1 }], 0.1)).toBeCloseTo(0.3, 12);
    expect(backgroundElectrolyte([{ charge: 2, count: 1 }, { charge: -2, count: 1 }], 0.1)).toBeCloseTo(0.4, 12);
  });

  it('rejects a non-neutral formula unit and negative molality', () => {
    expect(() => backgroundElectrolyte([{ charge: 1, count: 1 }, { charge: -2, count: 1 }], 0.1)).toThrow(/neutral/);
    expect(() => ionicStrength([{ charge: 1, molality: -1 }])).toThrow(RangeError);
  });
});

describe('activityModel', () => {
  it('davies: value, neutral γ = 1, warning beyond I ≈ 0.5', () => {
    const m = activityModel('davies', { ionicStrength: 0.1, A: dh25.A });
    // Recalled from memory: Davies γ ≈ 0.78 for z = 1 at I = 0.1, 25 °C.
    expect(Math.abs(10 ** m.logGamma(1) - 0.78)).toBeLessThan(0.005);
    expect(m.logGamma(0)).toBe(0);
    expect(m.warnings).toEqual([]);
    expect(activityModel('davies', { ionicStrength: 0.4, A: dh25.A }).warnings).toEqual([]);
    const hi = activityModel('davies', { ionicStrength: 0.7, A: dh25.A });
    expect(hi.warnings.length).toBe(1);
    expect(hi.warnings[0]).toMatch(/Davies/);
  });

  it('debye-huckel: ion size default and override, warning beyond I ≈ 0.1', () => {
    const m = activityModel('debye-huckel', { ionicStrength: 0.05, A: dh25.A, B: dh25.B, ionSizeAngstrom: 9 });
    expect(m.warnings).toEqual([]);
    // Kielland (1937), H⁺ 9 Å at I = 0.05: 0.86 — recalled from memory.
    expect(Math.abs(10 ** m.logGamma(1) - 0.86)).toBeLessThan(0.01);
    // Kielland (1937), Ca²⁺ 6 Å at I = 0.05: 0.485 — recalled from memory.
    expect(Math.abs(10 ** m.logGamma(2, 6) - 0.485)).toBeLessThan(0.01);
    expect(m.logGamma(0)).toBe(0);
    const hi = activityModel('debye-huckel', { ionicStrength: 0.3, A: dh25.A, B: dh25.B, ionSizeAngstrom: 4 });
    expect(hi.warnings.length).toBe(1);
    expect(hi.warnings[0]).toMatch(/Debye–Hückel/);
  });

  it('debye-huckel needs B and an ion size', () => {
    expect(() => activityModel('debye-huckel', { ionicStrength: 0.05, A: dh25.A })).toThrow(RangeError);
    const m = activityModel('debye-huckel', { ionicStrength: 0.05, A: dh25.A, B: dh25.B });
    expect(() => m.logGamma(1)).toThrow(/ion-size/);
  });

  it('ideal gives log γ = 0 for every charge', () => {
    const m = activityModel('ideal', { ionicStrength: 3 });
    expect(m.logGamma(2)).toBe(0);
    expect(m.logGamma(-1)).toBe(0);
    expect(m.warnings).toEqual([]);
  });

  it('rejects unknown names and missing A', () => {
    expect(() => activityModel('pitzer' as never, { ionicStrength: 0.1, A: 0.5 })).toThrow(RangeError);
    expect(() => activityModel('davies', { ionicStrength: 0.1 })).toThrow(RangeError);
  });
});

describe('mgPerLitreToMolal', () => {
  it('1 mmol/L of Fe (55.845 mg/L) in water at 25 °C ≈ 1.003e-3 mol/kg', () => {
    // Fe molar mass 55.845 g/mol (IUPAC standard atomic weight — common practice); ρ from IAPWS-IF97 (fixture 997.048).
    expect(mgPerLitreToMolal(55.845, 55.845, 997.048)).toBeCloseTo(1.00296e-3, 7);
  });

  it('rejects invalid input', () => {
    expect(() => mgPerLitreToMolal(-1, 55.845, 997)).toThrow(RangeError);
    expect(() => mgPerLitreToMolal(1, 0, 997)).toThrow(RangeError);
  });
});

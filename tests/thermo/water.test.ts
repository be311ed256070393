import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import {
  saturationPressure,
  saturatedLiquidDensity,
  liquidDensity,
  ionizationConstant,
  relativePermittivity,
  waterState,
} from '../../src/thermo/water.js';
import { if97Region1SpecificVolume } from '../../src/thermo/water-if97.js';

interface Row {
  t: number;
  p: number;
  rho: number;
  pKw: number;
  eps: number;
}

// Fixture: IAPWS-IF97 density and pressure, IAPWS R11-07 pKw, IAPWS R8-97 permittivity, liquid water
// at 0.101325 MPa below 100 °C and at saturation from 100 °C (source and tool in the file header).
const rows: Row[] = readFileSync(new URL('../fixtures/water-properties.csv', import.meta.url), 'utf8')
  .split(/\r?\n/)
  .filter((l) => l.trim() !== '' && !l.startsWith('#') && !l.startsWith('t_celsius'))
  .map((l) => {
    const [t, p, rho, pKw, eps] = l.split(',').map(Number);
    return { t, p, rho, pKw, eps };
  });

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('fixture', () => {
  it('has the 18 rows from 0.01 to 300 °C', () => {
    expect(rows.length).toBe(18);
    expect(rows[0].t).toBe(0.01);
    expect(rows[rows.length - 1].t).toBe(300);
  });
});

describe('IAPWS-IF97 region 1', () => {
  it('reproduces the release check values of specific volume', () => {
    // IAPWS R7-97 (IF97), Table 5, region 1 check values — recalled from memory.
    expect(rel(if97Region1SpecificVolume(300, 3), 0.100215168e-2)).toBeLessThan(1e-7);
    expect(rel(if97Region1SpecificVolume(300, 80), 0.971180894e-3)).toBeLessThan(1e-7);
    expect(rel(if97Region1SpecificVolume(500, 3), 0.1202418e-2)).toBeLessThan(1e-7);
  });

  it('gives 997.05 kg/m³ at 25 °C and 0.101325 MPa', () => {
    // IAPWS-IF97 via fixture row 25 °C: 997.048 kg/m³.
    expect(liquidDensity(298.15, 0.101325)).toBeCloseTo(997.048, 2);
  });

  it('agrees with the fixture density within 0.02 % at every row (0.01–300 °C)', () => {
    for (const r of rows) {
      // Fixture (IAPWS-IF97) density; pressure from the fixture row.
      expect(rel(liquidDensity(r.t + 273.15, r.p), r.rho), `${r.t} °C`).toBeLessThan(2e-4);
    }
  });

  it('shows the compressibility of water: +10 MPa at 25 °C raises density by about 0.45 %', () => {
    // Isothermal compressibility of water at 25 °C ≈ 4.5e-4 MPa⁻¹ — common practice (recalled from memory).
    const d = liquidDensity(298.15, 10.101325) / liquidDensity(298.15, 0.101325) - 1;
    expect(d).toBeGreaterThan(0.0040);
    expect(d).toBeLessThan(0.0050);
  });

  it('rejects states outside region 1', () => {
    expect(() => liquidDensity(250, 0.1)).toThrow(RangeError);
    expect(() => liquidDensity(300, 150)).toThrow(RangeError);
    expect(() => liquidDensity(300, -1)).toThrow(RangeError);
  });
});

describe('saturation line (IAPWS 1992 supplementary release, Wagner & Pruss aux. eqs 1 and 2)', () => {
  it('saturation pressure within 0.1 % of the fixture from 100 °C', () => {
    for (const r of rows.filter((x) => x.t >= 100)) {
      // Fixture (IAPWS-IF97) saturation pressure.
      expect(rel(saturationPressure(r.t + 273.15), r.p), `${r.t} °C`).toBeLessThan(1e-3);
    }
  });

  it('water boils at 100 °C within 0.05 K at one standard atmosphere', () => {
    // ITS-90 normal boiling point of water 99.97 °C — common practice.
    expect(saturationPressure(373.124)).toBeLessThan(0.101325);
    expect(saturationPressure(373.174)).toBeGreaterThan(0.101325);
  });

  it('saturated-liquid density within 0.05 % of the fixture from 100 °C, within 0.01 % below', () => {
    for (const r of rows) {
      // Fixture (IAPWS-IF97) density; water-equations.md: below 100 °C the liquid at 0.101325 MPa
      // differs from the saturated liquid by < 0.01 %.
      const tol = r.t >= 100 ? 5e-4 : 1e-4;
      expect(rel(saturatedLiquidDensity(r.t + 273.15), r.rho), `${r.t} °C`).toBeLessThan(tol);
    }
  });

  it('rejects temperatures above the critical point', () => {
    expect(() => saturationPressure(650)).toThrow(RangeError);
    expect(() => saturatedLiquidDensity(650)).toThrow(RangeError);
  });
});

describe('ionization constant (IAPWS R11-07)', () => {
  it('reproduces the release check value T = 300 K, ρ = 1.000 g/cm³ → 13.906565', () => {
    // IAPWS R11-07 (2007, rev. 2019), Bandura & Lvov, check-value table.
    expect(Math.abs(ionizationConstant(300, 1000) - 13.906565)).toBeLessThan(1e-6);
  });

  it('pKw within 0.01 of the fixture at every listed temperature', () => {
    for (const r of rows) {
      // Fixture (IAPWS R11-07) pKw, with our own density along the path.
      expect(Math.abs(waterState(r.t).pKw - r.pKw), `${r.t} °C`).toBeLessThan(0.01);
    }
  });
});

describe('static permittivity (IAPWS R8-97)', () => {
  it('within 0.2 % of the fixture at every listed temperature', () => {
    for (const r of rows) {
      // Fixture (IAPWS R8-97) dielectric constant.
      expect(rel(waterState(r.t).permittivity, r.eps), `${r.t} °C`).toBeLessThan(2e-3);
      expect(rel(relativePermittivity(r.t + 273.15, r.rho), r.eps), `${r.t} °C`).toBeLessThan(2e-3);
    }
  });
});

describe('waterState', () => {
  it('density within 0.1 % and saturation pressure within 0.1 % of the fixture along the default path', () => {
    for (const r of rows) {
      const s = waterState(r.t);
      // Fixture (IAPWS-IF97) density and pressure.
      expect(rel(s.density, r.rho), `${r.t} °C`).toBeLessThan(1e-3);
      if (r.t >= 100) expect(rel(s.pressureMPa, r.p), `${r.t} °C`).toBeLessThan(1e-3);
    }
  });

  it('neutral pH at 200 °C = 5.65 ± 0.01', () => {
    // IAPWS R11-07 pKw at 200 °C, saturation: 11.3096 (fixture) → pKw/2 = 5.655.
    expect(Math.abs(waterState(200).neutralPH - 5.65)).toBeLessThan(0.01);
  });

  it('neutral pH at 25 °C = 7.00 ± 0.01', () => {
    // Common practice; IAPWS R11-07 pKw 13.9945 (fixture) → 6.997.
    expect(Math.abs(waterState(25).neutralPH - 7.0)).toBeLessThan(0.01);
  });

  it('chooses the pressure path', () => {
    const a = waterState(25);
    expect(a.path).toBe('atmospheric');
    expect(a.pressureMPa).toBe(0.101325);
    expect(a.kelvin).toBeCloseTo(298.15, 10);
    const b = waterState(100);
    expect(b.path).toBe('saturation');
    expect(b.pressureMPa).toBe(b.saturationPressureMPa);
    // Fixture: 0.10142 MPa at 100 °C.
    expect(b.pressureMPa).toBeCloseTo(0.10142, 4);
    const c = waterState(150, 5);
    expect(c.path).toBe('user');
    expect(c.pressureMPa).toBe(5);
    expect(c.density).toBeGreaterThan(waterState(150).density);
  });

  it('accepts a user pressure equal to a tabulated saturation pressure', () => {
    // Fixture 200 °C saturation pressure 1.55467 MPa (rounded in the table).
    expect(() => waterState(200, 1.55467)).not.toThrow();
  });

  it('throws when the user pressure is below the saturation pressure (the water would boil)', () => {
    expect(() => waterState(150, 0.3)).toThrow(RangeError);
    expect(() => waterState(150, 0.3)).toThrow(/boil/);
    // 1 atm at 100 °C: water boils at 99.97 °C (ITS-90, common practice).
    expect(() => waterState(100, 0.101325)).toThrow(/saturation pressure/);
    expect(() => waterState(25, 150)).toThrow(RangeError);
  });

  it('throws RangeError naming the range outside 0–350 °C', () => {
    expect(() => waterState(-1)).toThrow(RangeError);
    expect(() => waterState(-1)).toThrow(/0–350 °C/);
    expect(() => waterState(351)).toThrow(/0–350 °C/);
    expect(() => waterState(Number.NaN)).toThrow(RangeError);
    expect(() => waterState(350)).not.toThrow();
  });

  it('at 350 °C IF97 region 1 agrees with the Wagner & Pruss saturated-liquid density within 0.1 %', () => {
    // Two independent IAPWS formulations (IF97 region 1; 1992 supplementary release aux. eq. 2).
    const s = waterState(350);
    expect(rel(s.density, saturatedLiquidDensity(623.15))).toBeLessThan(1e-3);
  });
});

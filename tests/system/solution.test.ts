/**
 * Water and solution at temperature in the diagram (issue: hot, salty streams).
 */
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const F = 96485.33212; // CODATA 2018
const R = 8.314462618; // CODATA 2018

describe('neutral pH in the model', () => {
  it('iron at 200 °C: neutral line at pH 5.65 ± 0.01 (IAPWS R11-07: pKw = 11.3096 at 200 °C, saturation)', () => {
    const c = compute(readSpec({ element: 'Fe', temperature: 200 }, 'fe200.yaml'));
    expect(Number(c.model.water!.neutralPH)).toBeCloseTo(11.3096 / 2, 2);
    expect(Math.abs(Number(c.model.water!.neutralPH) - 5.65)).toBeLessThan(0.01);
    // Saturation pressure at 200 °C: 1.55467 MPa (IAPWS-IF97 value in the reference table).
    expect(Number(c.model.water!.pressureMPa)).toBeCloseTo(1.5547, 2);
  });
});

describe('activity coefficients at 250 °C, I = 0.1 mol/kg (Davies)', () => {
  // Independent A from IAPWS values at 250 °C (reference table: ρ = 798.890 kg/m³, ε = 26.999):
  // A = 1.82483e6·√ρ/(εT)^1.5, ρ in g/cm³ — standard Debye–Hückel theory (common practice).
  const T = 523.15;
  const A = (1.82483e6 * Math.sqrt(0.79889)) / (26.999 * T) ** 1.5;
  const I = 0.1;
  const davies = (z: number) => -A * z * z * (Math.sqrt(I) / (1 + Math.sqrt(I)) - 0.3 * I);
  const ideal = compute(readSpec({ element: 'Fe', temperature: 250 }, 'ideal.yaml'));
  const salty = compute(readSpec({ element: 'Fe', temperature: 250, ionicStrength: 0.1 }, 'salty.yaml'));

  it('log γ of Fe+2 equals the Davies value with A from IAPWS water at 250 °C', () => {
    const fe2 = salty.model.species.find((s) => s.formula === 'Fe^2+')!;
    expect(fe2.molality).toBe(1e-6);
    expect(fe2.logGamma!).toBeCloseTo(davies(2), 3);
    expect(fe2.activity!).toBeCloseTo(1e-6 * 10 ** davies(2), 9);
  });

  it('the Fe+2/Fe boundary moves by (s/2)·log γ(Fe+2)', () => {
    const pick = (m: typeof ideal.model) => m.boundaries.find((b) => b.between.includes('Fe') && b.between.includes('Fe^2+'))!.line.intercept!;
    const s = (Math.LN10 * R * T) / F;
    expect(pick(salty.model) - pick(ideal.model)).toBeCloseTo((s / 2) * davies(2), 5);
  });

  it('`lines` shows each correction (molality, log γ, activity)', async () => {
    const dir = tmpDir();
    const f = writeTmp(dir, 'fe250.yaml', 'element: Fe\ntemperature: 250\nionicStrength: 0.1\n');
    const r = await runCli(['lines', f]);
    expect(r.stdout).toMatch(/Activities used/);
    expect(r.stdout).toMatch(/Fe²⁺\s+1\.000e-6\s+-0\.8\d+/);
    const j = JSON.parse((await runCli(['lines', f, '--json'])).stdout);
    const row = j.activities.find((a: { formula: string }) => a.formula === 'Fe^2+');
    expect(row.logGamma).toBeCloseTo(davies(2), 3);
  });

  it('an explicit activity is used as given (no γ)', () => {
    const c = compute(readSpec({ element: 'Fe', temperature: 250, ionicStrength: 0.1, activity: 1e-6 }, 'a.yaml'));
    expect(c.model.species.find((s) => s.formula === 'Fe^2+')!.activity).toBe(1e-6);
  });

  it('background electrolyte 0.5 mol/kg NaCl gives I = 0.5; Davies beyond 0.5 warns', () => {
    const c = compute(readSpec({ element: 'Fe', background: { NaCl: 0.5 } }, 'b.yaml'));
    expect(c.model.water!.ionicStrength).toBe(0.5);
    const d = compute(readSpec({ element: 'Fe', ionicStrength: 1.0 }, 'd.yaml'));
    expect(d.model.warnings.join(' ')).toMatch(/Davies/);
  });

  it('a concentration in mg/L converts with the molar mass (55.845 g/mol Fe, IUPAC)', () => {
    const c = compute(readSpec({ element: 'Fe', concentration: '0.055845 mg/L' }, 'c.yaml'));
    const fe2 = c.model.species.find((s) => s.formula === 'Fe^2+')!;
    // 0.055845 mg/L → 1e-6 mol/L → /(ρ/1000) with ρ = 997.05 kg/m³ at 25 °C (IAPWS).
    expect(fe2.molality!).toBeCloseTo(1e-6 / 0.99705, 9);
  });
});

describe('temperature extrapolation choice', () => {
  it('constant-h-s ignores Cp: the O2/H2O line differs from the Cp run at 150 °C', () => {
    const a = compute(readSpec({ element: 'Fe', temperature: 150 }, 'a.yaml'));
    const b = compute(readSpec({ element: 'Fe', temperature: 150, extrapolation: 'constant-h-s' }, 'b.yaml'));
    // ΔH − TΔS for O2 + 4H+ + 4e- = 2H2O with NBS 1982 data (water-facts): E° = [2·285.830 − T·(2·69.91 − 205.138 − 2·130.684)/1000... ]
    const T = 423.15;
    const dH = -2 * 285.83; // kJ, 2H2O(l) formed
    const dS = 2 * 69.91 - 205.138 - 2 * 130.684; // J/K
    const E0 = -((dH - (T * dS) / 1000) * 1000) / (4 * F);
    expect(b.model.waterLines.oxygen.line.E0!).toBeCloseTo(E0, 3);
    expect(Math.abs(a.model.waterLines.oxygen.line.E0! - b.model.waterLines.oxygen.line.E0!)).toBeGreaterThan(1e-4);
  });
});

describe('activity families', () => {
  it('a family at 1e-4 puts the Fe/Fe+2 line (s/2)·2 = 59.16 mV above the 1e-6 line (Nernst, n = 2)', async () => {
    const { figureInput } = await import('../../src/figure/compose.js');
    const { figureSettings } = await import('../../src/figure/options.js');
    const spec = readSpec({ element: 'Fe', figure: { families: [1e-4] } }, 'fam.yaml');
    const c = compute(spec);
    const input = figureInput(c, figureSettings(spec));
    const line = (bs: typeof c.model.boundaries) => bs.find((b) => b.between.includes('Fe') && b.between.includes('Fe^2+'))!.line.intercept!;
    expect((line(input.families![0].boundaries) - line(c.model.boundaries)) * 1000).toBeCloseTo(59.16, 1);
  });
});

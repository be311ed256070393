/**
 * Regression (issue 15 item 3, found again in an alloy trial): an alloy file with a ligand given in
 * mg/L was captioned "ligand totals Cl 200" and its model carried `ligands: {Cl: 200}` — the number
 * as written, without its unit, where the single-element model carries the molality. The alloy model
 * and caption now state the amount exactly as the single-element ones do.
 * Check value: 200 mg/L Cl⁻ → 0.200 g/L ÷ 35.453 g/mol ÷ ~0.97 kg/L (water at 80 °C) ≈ 5.8e-3 mol/kg
 * (molar mass of Cl from the IUPAC standard atomic weights; density of water, common practice).
 */
import { describe, expect, it } from 'vitest';
import { computeAlloy } from '../../src/diagram/alloy.js';
import { alloyCaption } from '../../src/figure/alloy.js';
import { readAlloySpec } from '../../src/system/alloy-spec.js';

describe('alloy caption and model state the ligand amounts with units', () => {
  const m = computeAlloy(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, ligands: { Cl: '200 mg/L' }, temperature: 80 }, 'plant.yaml'), { grid: 60 }).model;

  it('model ligands carry the molality, not the number as written', () => {
    expect(m.ligands.Cl).toBeGreaterThan(5.5e-3);
    expect(m.ligands.Cl).toBeLessThan(5.9e-3);
    expect(m.amounts?.ligands.Cl.value).toBe(200);
  });

  it('caption names the unit and the molality, and the temperature caveats', () => {
    const cap = alloyCaption(m).join('\n');
    expect(cap).toMatch(/Cl 200 mg\/L \(0\.005\d* mol\/kg\)/);
    expect(cap).not.toMatch(/Cl 200[.;]/);
    expect(cap).toMatch(/Estimated T data/);
  });
});

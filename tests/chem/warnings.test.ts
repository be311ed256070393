/**
 * Warnings for formula text that reads like a mistyped charge: advice in the new notation
 * (number before sign after a caret) that never contradicts the reading it warns about.
 */
import { describe, expect, it } from 'vitest';
import { formulaWarnings, parseFormula } from '../../src/chem/index.js';

describe('formulaWarnings in the new notation', () => {
  it.each<[string, string, string, string]>([
    ['Fe2+', 'Fe₂⁺', 'Fe^2+', 'Fe+2'],
    ['SO42-', 'SO₄₂⁻', 'SO4^2-', 'SO4-2'],
    ['Cu(NH3)42+', 'Cu(NH₃)₄₂⁺', 'Cu(NH3)4^2+', 'Cu(NH3)4+2'],
    ['Hg22+', 'Hg₂₂⁺', 'Hg2^2+', 'Hg2+2'],
    ['Fe2⁺', 'Fe₂⁺', 'Fe^2+', 'Fe+2'], // a digit on the line, only the sign raised
    ['Fe3\u2212', 'Fe₃⁻', 'Fe^3-', 'Fe-3'],
    ['Fe12+', 'Fe₁₂⁺', 'Fe^2+', 'Fe+2'], // the count 1 left over is dropped, not written "Fe1"
  ])('%s: reads as %s, suggests %s (older %s)', (text, reading, suggestion, older) => {
    const w = formulaWarnings(text);
    expect(w).toHaveLength(1);
    expect(w[0]).toContain(`reads as ${reading} `);
    expect(w[0]).toContain(`write "${suggestion}"`);
    expect(w[0]).not.toContain(`"${older}"`); // the older form is read but never suggested
    expect(w[0]).not.toContain('sign then a number'); // the older advice contradicted the new notation
    // The suggestion really is the other reading: a different charge, and it parses.
    expect(parseFormula(suggestion).charge).not.toBe(parseFormula(text).charge);
    expect(parseFormula(suggestion).charge).toBe(parseFormula(older).charge);
  });

  it('says nothing when moving the digit keeps the charge (regression: Fe8O19H21- advised charge -1 for a charge -1 ion)', () => {
    expect(formulaWarnings('Fe8O19H21-')).toEqual([]);
    expect(formulaWarnings('Fe21+')).toEqual([]);
  });

  it.each(['Fe^2+', 'Fe²⁺', 'Fe2^+', 'Fe₂⁺', 'SO4^2-', 'SO₄²⁻', 'HFeO2^-', 'HFeO₂⁻', 'Fe(OH)2^+', 'Fe₂O₃', 'Fe^'])('%s gives none', (t) => {
    expect(formulaWarnings(t)).toEqual([]);
  });
});

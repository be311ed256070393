/**
 * Members of an alloy assemblage: a neutral dissolved species is named and judged as dissolved
 * (issue 18). Before, "Cu + Zn(OH)2" read like two solids; the verdict logic is checked here too, so
 * that a neutral (charge 0) dissolved species can never pass for a metal or a passive solid.
 */
import { describe, expect, it } from 'vitest';
import { isDissolved, memberText } from '../../../src/solve/alloy/member.js';
import { assemblageVerdict, isMetal } from '../../../src/solve/alloy/verdict.js';
import { assemblageAt } from '../../../src/solve/alloy/assemblage.js';
import { buildAlloySystem } from '../../../src/system/alloy-build.js';
import { readAlloySpec } from '../../../src/system/alloy-spec.js';

describe('memberText', () => {
  it('tags a neutral dissolved species "(aq)", never an ion, a solid or a formula already tagged', () => {
    expect(memberText({ formula: 'Zn(OH)2', phase: 'aq', charge: 0 })).toBe('Zn(OH)2(aq)');
    expect(memberText({ formula: 'Zn(OH)2', phase: 's', charge: 0 })).toBe('Zn(OH)2');
    expect(memberText({ formula: 'Zn+2', phase: 'aq', charge: 2 })).toBe('Zn+2');
    expect(memberText({ formula: 'CO2(aq)', phase: 'aq', charge: 0 })).toBe('CO2(aq)');
    expect(isDissolved({ phase: 'aq' })).toBe(true);
    expect(isDissolved({ phase: 's' })).toBe(false);
  });
});

describe('verdict with a neutral dissolved species', () => {
  const cu = { formula: 'Cu', phase: 's' as const, elements: { Cu: 1 }, charge: 0, share: { Cu: 1, Zn: 0 } };
  const znAq = { formula: 'Zn(OH)2', phase: 'aq' as const, elements: { Zn: 1, O: 2, H: 2 }, charge: 0, share: { Cu: 0, Zn: 1 } };
  const znS = { ...znAq, phase: 's' as const };
  it('is dissolving (partly corroding), where the solid of the same formula is passive', () => {
    expect(isMetal(znAq)).toBe(false);
    expect(assemblageVerdict([cu, znAq], ['Cu', 'Zn'])).toEqual({ verdict: 'partly-corroding', dissolving: ['Zn'] });
    expect(assemblageVerdict([cu, znS], ['Cu', 'Zn'])).toEqual({ verdict: 'passive', dissolving: [] });
    expect(assemblageVerdict([znAq], ['Zn'])).toEqual({ verdict: 'corroding', dissolving: ['Zn'] });
  });

  it('brass at pH 10, 0 V vs SHE, thresholds 1e-6: "CuO + Zn(OH)2(aq)", zinc dissolving (ZnO + H2O = Zn(OH)2(aq), log K = −5.71 > −6; Baes & Mesmer 1976 as in species/Zn.json)', () => {
    const input = buildAlloySystem(readAlloySpec({ elements: { Cu: 0.65, Zn: 0.35 }, activity: 1e-6 }, 'brass.yaml')).input;
    const a = assemblageAt(input, 10, 0);
    expect(a.label).toMatch(/ \+ Zn\(OH\)2\(aq\)$/);
    expect(a.verdict).toBe('partly-corroding');
    expect(a.dissolving).toEqual(['Zn']);
  });
});

/**
 * Issue 15, defects 2 and 5: the runner-up margin when no electron is exchanged, and one definition
 * per distance in `probe`.
 *
 * Check values (NBS 1982 tables, recalled): ΔfG°(Cu2+, aq) = 65.49, ΔfG°(CuO, s) = −129.7,
 * ΔfG°(H2O, l) = −237.129 kJ/mol, so for CuO + 2H+ = Cu2+ + H2O log K = 41.94/5.708 = 7.347 and the
 * Cu2+/CuO line at a(Cu2+) = 1e-6 is pH = (7.347 + 6)/2 = 6.674. Nernst slope at 25 °C: 59.16 mV.
 */
import { describe, expect, it } from 'vitest';
import { probe } from '../../src/analysis/probe.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { probeText } from '../../src/report/probe-text.js';

const cu = compute(readSpec({ element: 'Cu' }, 'cu.yaml'));

describe('runner-up reached without electron transfer', () => {
  const r = probe(cu, 6, 0.5);
  it('gives no potential shift, says why, and gives the pH shift (NBS 1982: Cu2+/CuO at pH 6.674)', () => {
    expect(r.runnerUp).toBe('CuO');
    expect(r.margin.potentialV).toBeNull();
    expect(r.margin.note).toMatch(/without electron transfer/);
    expect(r.margin.pH).toBeCloseTo(0.674, 1);
  });
  it('never prints an absurd shift in mV', () => {
    const t = probeText(r);
    expect(t).not.toMatch(/\d{6,}(\.\d+)? mV/);
    expect(t).toMatch(/runner-up: CuO .*no change of potential reaches it/);
  });
});

describe('runner-up that no change of conditions reaches', () => {
  // NBS 1982 (recalled): ΔfG°(NiO, s) = −211.7, ΔfG°(Ni(OH)2, s) = −447.2, ΔfG°(H2O, l) = −237.129 kJ/mol,
  // so NiO + H2O = Ni(OH)2 has ΔrG° = +1.629 kJ/mol at 25 °C, whatever the pH, E or activities.
  const r = probe(compute(readSpec({ element: 'Ni', activity: 1 }, 'ni.yaml')), 9, 0);
  it('two pure solids: the margin is fixed, and the note does not blame activities', () => {
    expect(r.predominant).toBe('NiO');
    expect(r.runnerUp).toBe('Ni(OH)2');
    expect(r.margin.kJPerMol).toBeCloseTo(1.629, 3);
    expect(r.margin.potentialV).toBeNull();
    expect(r.margin.pH).toBeNull();
    expect(r.margin.note).not.toMatch(/ligand or dissolved activities/);
    expect(r.margin.note).toMatch(/only with temperature/);
  });
  it('a dissolved runner-up still points at the activities (Zn(OH)2(aq) vs ZnO at 60 °C)', () => {
    const zn = probe(compute(readSpec({ element: 'Zn', temperature: 60 }, 'zn.yaml')), 9, -0.7841);
    expect(zn.margin.potentialV).toBeNull();
    expect(zn.margin.pH).toBeNull();
    expect(zn.margin.note).toMatch(/dissolved activities/);
  });
});

describe('probe distances: one definition per name', () => {
  const r = probe(cu, 6, 0.5);
  it('nearest boundary: plane distance on the Nernst scale, with the point reached, not mislabelled', () => {
    const nb = r.nearestBoundary!;
    expect(nb).not.toHaveProperty('distanceMV');
    expect(nb.between.slice().sort()).toEqual(['CuO', 'Cu^2+']);
    expect(nb.at.pH).toBeCloseTo(6.674, 1);
    // Horizontal offset 0.674 pH × 59.16 mV per pH (the Nernst slope at 25 °C).
    expect(nb.distance.value).toBeCloseTo((nb.at.pH - 6) * 59.16, 0);
    expect(nb.distance.metric).toMatch(/59\.16 mV/);
  });
  it('names the same boundary the same way in the distance lines, the crossings and the nearest boundary', () => {
    const t = probeText(r);
    expect(t).toMatch(/horizontal distance \(change of pH at this potential\): \+0\.674 pH to the boundary at higher pH \(Cu²⁺ \/ CuO\)/);
    expect(t).toMatch(/raise pH .* across Cu²⁺ \/ CuO/);
    expect(t).toMatch(/nearest boundary in the plane: Cu²⁺ \/ CuO/);
    expect(r.crossings.raisePH!.between.slice().sort()).toEqual(['CuO', 'Cu^2+']);
  });
  it('the JSON distance states its definition beside the figures, as nearestBoundary.distance does', () => {
    const r = probe(cu, 6, 0.5);
    expect(r.distance.definition).toMatch(/^mV: vertical distance \(change of E at this pH\).*; pH: horizontal distance \(change of pH at this potential\)/);
    expect(r.nearestBoundary!.distance.metric).toMatch(/shortest distance in the \(pH, E\) plane/);
  });

  it('the vertical distance is the nearer of the boundaries above and below', () => {
    const fe = probe(compute(readSpec({ element: 'Fe' }, 'fe.yaml')), 8, 0.016);
    const v = [fe.crossings.raiseE, fe.crossings.lowerE].filter((x) => x !== null).map((x) => x!.shift * 1000);
    const nearest = v.reduce((a, b) => (Math.abs(b) < Math.abs(a) ? b : a));
    expect(fe.distance.mV).toBeCloseTo(nearest, 9);
    expect(probeText(fe)).toContain(`vertical distance (change of E at this pH): ${nearest > 0 ? '+' : ''}${nearest.toFixed(1)} mV`);
  });
});

/**
 * Issue 15, defect 6: the plating window's notes state what is true of the result.
 * Check value: Zn2+/Zn E° = −0.762 V (NBS 1982 ΔfG°(Zn2+) = −147.06 kJ/mol, recalled), so at
 * a(Zn2+) = 1e-6 E_dep = −0.762 − 0.02958·6 = −0.940 V, i.e. 0.940 V below the hydrogen line at pH 0.
 */
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { platingWindow } from '../../src/analysis/window.js';
import { windowHeading, windowText } from '../../src/report/window-text.js';

describe('window notes', () => {
  it('zinc: every margin negative, and the note says hydrogen evolves first (not "deposits above")', () => {
    const c = compute(readSpec({ element: 'Zn' }, 'zn.yaml'));
    const r = platingWindow(c.model);
    expect(r.windows[0].marginToHydrogen.atLowPH).toBeCloseTo(-0.94, 2);
    expect(r.windows[0].marginToHydrogen.max).toBeLessThan(0);
    const text = r.notes.join('\n');
    expect(text).not.toMatch(/marginToHydrogen > 0|deposits before hydrogen|above the hydrogen line \(/);
    expect(text).toMatch(/below the hydrogen line everywhere .*hydrogen evolves first/);
    // Text for people in Unicode throughout (README "Notation"): the hydrogen couple too.
    const printed = windowText(r, windowHeading(c.model));
    expect(printed).toContain('E(H₂(g)/H⁺)');
    expect(printed).not.toMatch(/H2\//);
  });

  it('copper in acid: every margin positive, and the note says so', () => {
    const r = platingWindow(compute(readSpec({ element: 'Cu', activity: 0.5, pH: [0, 6] }, 'cu.yaml')).model);
    expect(r.windows[0].marginToHydrogen.min).toBeGreaterThan(0);
    expect(r.notes.join('\n')).toMatch(/above the hydrogen line .*deposits before hydrogen evolves/);
  });

  it('no window: gives the reason (CuCl(s) between Cu and Cu2+ with 60 mg/L chloride)', () => {
    const c = compute(readSpec({ element: 'Cu', activity: 0.1, ligands: { Cl: '60 mg/L' }, pH: [0, 6] }, 'cu.yaml'));
    const r = platingWindow(c.model);
    expect(r.windows).toEqual([]);
    const t = windowText(r, windowHeading(c.model));
    expect(t).toMatch(/Why: directly above Cu lies CuCl \(solid\) at pH 0\.00–/);
  });
});

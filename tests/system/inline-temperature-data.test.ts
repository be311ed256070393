/**
 * Inline species may carry revised-HKF parameters or a Maier–Kelley Cp polynomial; the built
 * system records each species' temperature model. Cl- parameters: Shock & Helgeson (1988), GCA 52,
 * 2009 (recalled); the polynomial is invented (a made-up solid for the test).
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { buildSystem } from '../../src/system/build.js';
import { readSpec } from '../../src/system/spec.js';

const CL = { a1: 4.032, a2: 4.801, a3: 5.563, a4: -2.847, c1: -4.4, c2: -5.714, omega: 1.456 };
const sys = (extra: Record<string, unknown>, species: unknown[]) =>
  readSpec({ element: 'Zn', temperature: 200, species: ['Zn', 'Zn+2', ...species], ...extra }, 'inline.json');

describe('inline temperature data', () => {
  it('hkf on an aqueous species is used as published; without it the parameters are estimated', () => {
    const b = buildSystem(sys({ ligands: { Cl: 0.1 } }, [{ formula: 'Cl-', phase: 'aq', dfG: -131.228, S: 56.5, hkf: CL }, { formula: 'ZnCl+', phase: 'aq', dfG: -275.3, S: 10 }]));
    const cl = b.input.ligands[0]!.species.find((s) => s.formula === 'Cl-')!;
    expect(cl.temperatureModel).toBe('published');
    expect(cl.estimated).toBeUndefined();
    const zncl = b.input.species.find((s) => s.formula === 'ZnCl+')!;
    expect(zncl.temperatureModel).toBe('estimated');
    expect(zncl.estimated).toBe(true);
    expect(b.warnings.join(' ')).toMatch(/estimated data.*ZnCl\+/);
  });
  it('cpPolynomial on a solid gives the cp-polynomial model', () => {
    const b = buildSystem(sys({}, [{ formula: 'ZnO', phase: 's', dfG: -320.5, S: 43.6, cpPolynomial: { a: 45, b: 0.0073, c: -570000 } }]));
    expect(b.input.species.find((s) => s.formula === 'ZnO')!.temperatureModel).toBe('cp-polynomial');
  });
  it('hkf on a solid, or hkf without S°, is refused naming the field', () => {
    expect(() => sys({}, [{ formula: 'ZnO', phase: 's', dfG: -320.5, S: 43.6, hkf: CL }])).toThrow(InputError);
    expect(() => sys({}, [{ formula: 'ZnO', phase: 's', dfG: -320.5, S: 43.6, hkf: CL }])).toThrow(/species\[2\] \(ZnO\)\.hkf/);
    expect(() => sys({}, [{ formula: 'ZnOH+', phase: 'aq', dfG: -330, hkf: CL }])).toThrow(/ZnOH\+\)\.S/);
  });
  it('an inline species with only ΔfG° stays in the system away from 25 °C, undetermined (no estimate for inline data)', () => {
    const b = buildSystem(sys({}, [{ formula: 'ZnOH+', phase: 'aq', dfG: -330 }]));
    const s = b.input.species.find((x) => x.formula === 'ZnOH+')!;
    expect(s.temperatureModel).toBe('undetermined');
    expect(s.G).toBe(-330);
    expect(b.warnings.join(' ')).toMatch(/undetermined away from 25 °C.*ZnOH\+/);
  });
  it('the explicit extrapolations label every species constant-cp or constant-h-s', () => {
    const b = buildSystem(sys({ extrapolation: 'cp' }, []));
    for (const s of b.input.species) expect(['constant-cp', 'constant-h-s'], s.formula).toContain(s.temperatureModel);
    const h = buildSystem(sys({ extrapolation: 'constant-h-s' }, []));
    for (const s of h.input.species) expect(s.temperatureModel, s.formula).toBe('constant-h-s');
  });
});


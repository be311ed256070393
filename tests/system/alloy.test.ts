/** System files with several main elements: the `elements` key, its checks and the built species set (issue 18). */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { buildAlloySystem } from '../../src/system/alloy-build.js';
import { isAlloyData, readAlloySpec } from '../../src/system/alloy-spec.js';
import { buildSystem } from '../../src/system/build.js';
import { readSpec } from '../../src/system/spec.js';
import { type Schema, validate } from '../helpers/json-schema.js';

const fail = (data: unknown): InputError => {
  try {
    readAlloySpec(data, 'alloy.yaml');
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('accepted');
};

describe('reading elements', () => {
  it('mole fractions summing to 1 need no note; one activity applies to every element', () => {
    const s = readAlloySpec({ elements: { Fe: 0.7, Cr: 0.18, Ni: 0.12 }, activity: 1e-5, temperature: 60 }, 'a.yaml');
    expect(Object.keys(s.composition)).toEqual(['Fe', 'Cr', 'Ni']);
    expect(s.composition.Fe).toBeCloseTo(0.7, 14);
    expect(s.composition.Ni).toBeCloseTo(0.12, 14);
    expect(s.activities).toEqual({ Fe: 1e-5, Cr: 1e-5, Ni: 1e-5 });
    expect(s.base.temperature).toBe(60);
    expect(s.warnings).toEqual([]);
    expect(isAlloyData({ elements: {} })).toBe(true);
    expect(isAlloyData({ element: 'Fe' })).toBe(false);
  });

  it('atom percent are normalised with a note; the default threshold is 1e-6', () => {
    const s = readAlloySpec({ elements: { Cu: 70, Zn: 30 } }, 'a.yaml');
    expect(s.composition.Cu).toBeCloseTo(0.7, 15);
    expect(s.composition.Zn).toBeCloseTo(0.3, 15);
    expect(s.warnings.join('\n')).toMatch(/sum to 100.*normalised/);
    expect(s.activities).toEqual({ Cu: 1e-6, Zn: 1e-6 });
    expect(s.activityIsDefault).toBe(true);
  });

  it('an activity per element', () => {
    expect(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, activity: { Fe: 1e-6, Cr: 1e-8 } }, 'a.yaml').activities).toEqual({ Fe: 1e-6, Cr: 1e-8 });
  });

  it.each([
    [{ elements: { Fe: 0.5, Xx: 0.5 } }, 'elements.Xx'],
    [{ elements: { Fe: 0.5, O: 0.5 } }, 'elements.O'],
    [{ elements: { Fe: 0, Cr: 1 } }, 'elements.Fe'],
    [{ elements: { Fe: -0.2, Cr: 1.2 } }, 'elements.Fe'],
    [{ elements: { Fe: '0.5', Cr: 0.5 } }, 'elements.Fe'],
    [{ elements: {} }, 'elements'],
    [{ elements: ['Fe', 'Cr'] }, 'elements'],
    [{ elements: { Fe: 1, Cr: 1, Ni: 1, Mo: 1, Mn: 1, Cu: 1, Zn: 1 } }, 'elements'],
    [{ element: 'Fe', elements: { Fe: 1 } }, 'element'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, activity: { Fe: 1e-6 } }, 'activity.Cr'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, activity: { Fe: 1e-6, Cr: 1e-6, Ni: 1e-6 } }, 'activity.Ni'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, activity: { Fe: 1e-6, Cr: 0 } }, 'activity.Cr'],
    [{ elements: { Fe: 0.5, Ni: 0.5 }, ligands: { Ni: 1e-3 } }, 'ligands.Ni'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, species: ['Fe'] }, 'species'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, concentration: 1e-4 }, 'concentration'],
    [{ elements: { Fe: 0.5, Cr: 0.5 }, temperature: 500 }, 'temperature'],
  ])('refuses %j naming %s', (data, field) => {
    const e = fail(data);
    expect(e.field).toBe(field);
    expect(e.file).toBe('alloy.yaml');
  });

  it('the one-element reader refuses elements with a message naming the key', () => {
    expect(() => readSpec({ elements: { Fe: 1 } }, 'a.yaml')).toThrow(/a\.yaml: elements: expected one main element \(element\): .*not yet drawn/);
  });
});

describe('building an alloy system', () => {
  it('each element keeps exactly its one-element species and G(T); chromite added once (60 °C, with S)', () => {
    const alloy = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, temperature: 60, ligands: { S: 1e-3 } }, 'a.yaml'));
    for (const el of ['Fe', 'Cr']) {
      const one = buildSystem(readSpec({ element: el, temperature: 60, ligands: { S: 1e-3 } }, 'b.yaml')).input;
      const mine = alloy.input.species.filter((s) => s.elements[el] && Object.keys(s.elements).every((e) => e === el || !['Fe', 'Cr'].includes(e)));
      expect(mine).toEqual(one.species);
      expect(alloy.input.ligands).toEqual(one.ligands);
    }
    expect(alloy.input.species.filter((s) => s.formula === 'FeCr2O4')).toHaveLength(1);
    expect(alloy.sources.join('\n')).toMatch(/Robie/);
  });

  it('exclude works over all elements and the mixed compounds; an unknown name is refused', () => {
    const a = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, exclude: ['FeCr2O4', 'Fe3O4'] }, 'a.yaml'));
    expect(a.input.species.map((s) => s.formula)).not.toContain('FeCr2O4');
    expect(a.input.species.map((s) => s.formula)).not.toContain('Fe3O4');
    expect(() => buildAlloySystem(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, exclude: ['Unobtainium'] }, 'a.yaml'))).toThrow(InputError);
  });

  it('metastable and pick names go to the element whose species they are (Cr(OH)3 and FeO; Ni+2 BR89)', () => {
    const a = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.7, Cr: 0.2, Ni: 0.1 }, metastable: ['Cr(OH)3', 'FeO'], pick: { 'Ni^2+': 'BR89' } }, 'a.yaml'));
    const f = a.input.species.map((s) => s.formula);
    expect(f).toEqual(expect.arrayContaining(['Cr(OH)3', 'FeO', 'FeCr2O4', 'NiFe2O4']));
    const ni = buildSystem(readSpec({ element: 'Ni', pick: { 'Ni^2+': 'BR89' } }, 'n.yaml')).input.species.find((s) => s.formula === 'Ni^2+')!;
    expect(a.input.species.find((s) => s.formula === 'Ni^2+')!.G).toBe(ni.G);
    expect(() => buildAlloySystem(readAlloySpec({ elements: { Fe: 0.7, Cr: 0.3 }, pick: { FeCr2O4: 'XX' } }, 'a.yaml'))).toThrow(/pick\.FeCr2O4/);
    expect(() => buildAlloySystem(readAlloySpec({ elements: { Fe: 0.7, Cr: 0.3 }, metastable: ['Unobtainium'] }, 'a.yaml'))).toThrow(InputError);
  });

  it('an activity per element reaches that element\'s dissolved species only', () => {
    const a = buildAlloySystem(readAlloySpec({ elements: { Fe: 0.8, Cr: 0.2 }, activity: { Fe: 1e-6, Cr: 1e-8 } }, 'a.yaml'));
    expect(a.input.species.find((s) => s.formula === 'Fe^2+')!.logActivity).toBeCloseTo(-6, 12);
    expect(a.input.species.find((s) => s.formula === 'Cr^3+')!.logActivity).toBeCloseTo(-8, 12);
  });
});

describe('schema/system.schema.json knows elements', () => {
  const root = fileURLToPath(new URL('../../', import.meta.url));
  const schema = JSON.parse(readFileSync(join(root, 'schema/system.schema.json'), 'utf8')) as Schema;
  it('accepts an alloy file and refuses element + elements or neither', () => {
    expect(validate({ elements: { Fe: 0.7, Cr: 0.3 }, activity: { Fe: 1e-6, Cr: 1e-6 } }, schema, '$', schema)).toEqual([]);
    expect(validate({ element: 'Fe', elements: { Fe: 1 } }, schema, '$', schema)).not.toEqual([]);
    expect(validate({ elements: { Fe: 'a lot' } }, schema, '$', schema)).not.toEqual([]);
    expect(validate({ activity: 1e-6 }, schema, '$', schema)).not.toEqual([]);
  });
});

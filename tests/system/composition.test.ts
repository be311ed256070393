/** The composition key: totals as written, composition mode's refusals, ionicStrength: auto. */
import { describe, expect, test } from 'vitest';
import { InputError } from '../../src/errors.js';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { readSpec } from '../../src/system/spec.js';

const refuse = (o: Record<string, unknown>, field: string) => {
  try {
    readSpec(o, 'bath.yaml');
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe(field);
    expect((e as InputError).message).toContain('bath.yaml');
    return;
  }
  throw new Error('not refused');
};

describe('composition key', () => {
  test('totals: numbers are mol/kg, strings carry their unit; the ligands come from the keys', () => {
    const s = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: '15.6 g/L' } }, 'bath.yaml');
    expect(s.composition!.element).toEqual({ kind: 'molality', value: 0.2 });
    expect(s.composition!.ligands.CN).toEqual({ kind: 'mg/L', value: 15600, as: undefined });
    expect(s.ligandGroups.CN).toEqual({ C: 1, N: 1 });
    // 15.6 g/L of CN (26.017 g/mol; common practice) at 997.05 kg/m³ → 0.6014 mol/kg.
    const S = compositionSetup(s);
    expect(S.totals.CN).toBeCloseTo(15.6 / 26.0174 / 0.99705, 3);
    expect(S.totals.Ag).toBe(0.2);
  });
  test('a file without the key stays in fixed-activity mode', () => {
    expect(readSpec({ element: 'Ag', ligands: { CN: 0.6 } }, 'x.yaml').composition).toBeUndefined();
  });
  test('activity, concentration and ligands are refused beside it, each by name', () => {
    refuse({ element: 'Ag', composition: { Ag: 0.2 }, activity: 1e-6 }, 'activity');
    refuse({ element: 'Ag', composition: { Ag: 0.2 }, concentration: 0.1 }, 'concentration');
    refuse({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, ligands: { CN: 0.6 } }, 'ligands');
  });
  test('bad totals and keys name the field', () => {
    refuse({ element: 'Ag', composition: { CN: 0.6 } }, 'composition.Ag');
    refuse({ element: 'Ag', composition: [0.2] }, 'composition');
    refuse({ element: 'Ag', composition: { Ag: -1 } }, 'composition.Ag');
    refuse({ element: 'Ag', composition: { Ag: 0.2, CN: 'lots' } }, 'composition.CN');
    refuse({ element: 'Ag', composition: { Ag: 0.2, Xy: 1 } }, 'composition.Xy');
    refuse({ element: 'Ag', composition: { Ag: 0.2, AgCN: 1 } }, 'composition.AgCN');
    refuse({ element: 'Ag', composition: { Ag: 0.2 }, ionicStrength: 'auto', background: { NaCl: 0.1 } }, 'background');
  });
  test('ionicStrength: auto only in composition mode', () => {
    expect(readSpec({ element: 'Ag', composition: { Ag: 0.2 }, ionicStrength: 'auto' }, 'b.yaml').composition!.autoIonicStrength).toBe(true);
    refuse({ element: 'Ag', ionicStrength: 'auto' }, 'ionicStrength');
  });
});

describe('composition files and the fixed-activity pipeline', () => {
  test('compute() refuses a composition file instead of taking totals as activities', async () => {
    const { compute } = await import('../../src/pipeline.js');
    const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'bath.yaml');
    expect(() => compute(spec)).toThrow(InputError);
    try {
      compute(spec);
    } catch (e) {
      expect((e as InputError).field).toBe('composition');
    }
  });
});

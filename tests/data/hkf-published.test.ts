/**
 * Every published (recalled) revised-HKF parameter set in species/*.json gives back, at 25 °C and
 * 1 bar, the Cp° and V° its compilation lists beside it (tests/fixtures/hkf-reference-properties.csv,
 * sources SH88 and SHS89 named per row) within 1 J/(mol·K) and 0.5 cm³/mol: a mistyped or
 * mis-recalled parameter shows up here. Sets whose recalled Cp°/V° disagree with the recalled
 * parameters (which of the two is wrong is not known without the printed table) are listed in
 * UNVERIFIED with the gap, and must still disagree (remove them once resolved); species/README.md
 * names them.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/data/library.js';
import { hkfReferenceProperties } from '../../src/thermo/hkf-reference.js';

const CAL = 4.184;
const TOL_CP = 1; // J/(mol·K)
const TOL_V = 0.5; // cm³/mol

interface Row { species: string; phase: string; source: string; Cp: number; V: number }

function fixture(): Row[] {
  const text = readFileSync(new URL('../fixtures/hkf-reference-properties.csv', import.meta.url), 'utf8');
  const lines = text.split('\n').filter((l) => l.trim() && !l.startsWith('#'));
  return lines.slice(1).map((l) => {
    const [species, phase, source, cp, v] = l.split(',');
    return { species: species!, phase: phase!, source: source!, Cp: Number(cp) * CAL, V: Number(v) };
  });
}

/**
 * Recalled parameter sets that do not give back the recalled Cp° or V° (gap at the time of writing),
 * by species and property.
 */
const UNVERIFIED: Record<string, string> = {
  'Al^3+ Cp': '1.6 J/(mol·K) off',
  'HS^- Cp': '2.5 J/(mol·K) off',
  'SO4^2- Cp': '1.9 J/(mol·K) off',
  'SO4^2- V': '1.0 cm³/mol off',
  'CO3^2- V': '1.0 cm³/mol off',
  'NH4^+ Cp': '2.0 J/(mol·K) off',
  'NH3 Cp': '2.2 J/(mol·K) off',
  'O2 Cp': '8.5 J/(mol·K) off',
  'H2S V': '2.2 cm³/mol off',
};

describe('published HKF parameter sets reproduce their compilation’s Cp° and V° at 25 °C', () => {
  const rows = fixture();
  const withHkf = loadLibrary().filter((s) => s.hkf);

  it('every library set has its check values in the fixture, from the same source', () => {
    for (const s of withHkf) {
      const r = rows.find((x) => x.species === s.formula && x.phase === s.phase);
      expect(r, `${s.formula}(${s.phase}) lacks a fixture row`).toBeDefined();
      expect(r!.source, s.formula).toBe(s.hkf!.source);
    }
  });

  for (const s of loadLibrary().filter((x) => x.hkf)) {
    it(`${s.formula}(${s.phase}), ${s.hkf!.source}`, () => {
      const r = fixture().find((x) => x.species === s.formula && x.phase === s.phase)!;
      const got = hkfReferenceProperties(s.hkf!);
      const cpOk = Math.abs(got.Cp - r.Cp) <= TOL_CP;
      const vOk = Math.abs(got.V - r.V) <= TOL_V;
      expect(cpOk, `Cp° ${got.Cp.toFixed(2)} vs ${r.Cp.toFixed(2)} J/(mol·K)`).toBe(!(`${s.formula} Cp` in UNVERIFIED));
      expect(vOk, `V° ${got.V.toFixed(2)} vs ${r.V.toFixed(2)} cm³/mol`).toBe(!(`${s.formula} V` in UNVERIFIED));
    });
  }

  it('the worked example of hkf-reference.ts: Cl- gives −29.43 cal/(mol·K) and 17.79 cm³/mol (SH88 list −29.44 and 17.79)', () => {
    const cl = hkfReferenceProperties({ a1: 4.032, a2: 4.801, a3: 5.563, a4: -2.847, c1: -4.4, c2: -5.714, omega: 1.456 });
    // Hand arithmetic (T_r − Θ = 70.15 K): c1 + c2·10⁴/70.15² + ω·10⁵·298.15·X_r
    // = −4.4 − 11.611 − 13.414 = −29.425 cal/(mol·K).
    expect(cl.Cp / CAL).toBeCloseTo(-4.4 - 5.714e4 / 70.15 ** 2 + 1.456e5 * 298.15 * -3.09e-7, 9);
    expect(Math.abs(cl.Cp / CAL - -29.44)).toBeLessThan(0.1);
    expect(cl.V).toBeCloseTo(17.79, 1);
  });
});

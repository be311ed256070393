/**
 * "g/L as SALT": the amount of a component made up from a salt counts every unit of the component
 * the salt holds. Zinc cyanide, Zn(CN)2: M = 65.38 + 2·(12.011 + 14.007) = 117.42 g/mol (IUPAC
 * standard atomic weights, recalled), so 60 g/L is 0.5110 mol/L of Zn and 1.0220 mol/L of CN; in
 * mol/kg divide by the density of water at 25 °C, 0.99705 kg/L (IAPWS-95, recalled): 0.5125 and
 * 1.0250 mol/kg. The file used to give CN the salt's moles (0.5125), half the cyanide.
 */
import { describe, expect, it } from 'vitest';
import { molality, unitsPerFormula } from '../../src/system/solution.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

describe('amount as a salt', () => {
  it('counts the units of the component in the salt', () => {
    expect(unitsPerFormula('Zn(CN)2', 'CN')).toBe(2);
    expect(unitsPerFormula('Zn(CN)2', 'Zn')).toBe(1);
    expect(unitsPerFormula('HCO3', 'C')).toBe(1);
    expect(unitsPerFormula('NH4NO3', 'N')).toBe(2);
    // A species' concentration "as Fe": one species per Fe (unchanged).
    expect(unitsPerFormula('Fe', 'HFeO2-')).toBe(1);
  });

  it('60 g/L as Zn(CN)2: 0.5125 mol/kg Zn and 1.0250 mol/kg CN at 25 °C', () => {
    const a = { kind: 'mg/L' as const, value: 60000, as: 'Zn(CN)2' };
    expect(molality(a, 'Zn', 997.05)).toBeCloseTo(0.5125, 3);
    expect(molality(a, 'CN', 997.05)).toBeCloseTo(1.025, 3);
  });

  it('the bath as made up states those totals (window heading)', async () => {
    const dir = tmpDir();
    const f = writeTmp(dir, 'zn.yaml', 'element: Zn\ncomposition: {Zn: "60 g/L as Zn(CN)2", CN: "60 g/L as Zn(CN)2"}\npH: [8, 14]\nE: [-2, 0.5]\ngrid: 40\n');
    const r = await runCli(['window', f]);
    expect(r.code).toBe(0);
    const m = /totals Zn ([\d.]+), CN ([\d.]+) mol\/kg/.exec(r.stdout)!;
    expect(Number(m[1])).toBeCloseTo(0.5125, 3);
    expect(Number(m[2])).toBeCloseTo(1.025, 3);
  });
});

describe('a hydrate after "as"', () => {
  it('200 g/L as CuSO4·5H2O (M = 249.69 g/mol, IUPAC atomic weights recalled): 0.8034 mol/kg Cu at 25 °C, as CuSO4(H2O)5', async () => {
    const dir = tmpDir();
    for (const salt of ['CuSO4·5H2O', 'CuSO4.5H2O', 'CuSO4(H2O)5']) {
      const f = writeTmp(dir, 'cu.yaml', `element: Cu\ncomposition: {Cu: "200 g/L as ${salt}"}\npH: [0, 3]\nE: [-0.5, 1]\ngrid: 40\n`);
      const r = await runCli(['window', f]);
      expect(r.code).toBe(0);
      expect(Number(/totals Cu ([\d.]+)/.exec(r.stdout)![1])).toBeCloseTo(0.8034, 3);
    }
  });
});

describe('"as" a formula that holds none of the component', () => {
  const dir = tmpDir();
  for (const [name, text, field] of [
    ['a ligand', 'element: Fe\nligands: {Cl: "20 mg/L as Fe"}\n', 'ligands.Cl'],
    ['the element', 'element: Fe\nconcentration: "1 mg/L as Cu"\n', 'concentration'],
    ['a bath total', 'element: Cu\ncomposition: {Cu: 0.1, CN: "10 g/L as NaCl"}\n', 'composition.CN'],
  ] as const) {
    it(`is refused for ${name}, naming the field (exit 2)`, async () => {
      const f = writeTmp(dir, 'bad.yaml', text);
      const r = await runCli(['lines', f]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(field);
      expect(r.stderr).toMatch(/a formula holding \w+ after "as"/);
    });
  }

  it('accepts the usual forms (C as HCO3 or CaCO3, S as SO4, N as NH4)', async () => {
    const f = writeTmp(dir, 'ok.yaml', 'element: Fe\nligands: {C: "120 mg/L as CaCO3", S: "10 mg/L as SO4"}\n');
    expect((await runCli(['lines', f])).code).toBe(0);
    const g = writeTmp(dir, 'ok2.yaml', 'element: Cu\nligands: {N: "18 mg/L as NH4"}\n');
    expect((await runCli(['lines', g])).code).toBe(0);
  });
});

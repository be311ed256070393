/**
 * `window` on composition files (the bath as made up). Outside checks: hand Nernst with the
 * element split from the mass balance — Cu²⁺ + 2e⁻ = Cu at 0.25 mol/kg Cu²⁺ (half of the 0.5 mol/kg
 * dissolved at the equal-share boundary; ammonia all protonated at pH 1), and Ag(CN)₃²⁻ + e⁻ =
 * Ag + 3 CN⁻ at pH 12 with free cyanide from bisection on its balance (tests/helpers/stability.ts)
 * — ΔfG° from the library's own files, so that the check is of the window read-out (common practice).
 */
import { describe, expect, test } from 'vitest';
import { compositionWindow } from '../../src/analysis/composition-window.js';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { readSpec } from '../../src/system/spec.js';
import { F, LN10, R } from '../../src/thermo/constants.js';
import { runCli } from '../helpers/cli.js';
import { bisectionSpeciation, type Row } from '../helpers/stability.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const lib = loadLibrary();
const G = (f: string) => findSpecies(lib, f)!.dfG * 1000;
const rt = R * 298.15 * LN10;
const s = rt / F;
/** E_dep at pH x: linear between the window's refined deposition points. */
const depAt = (pts: { pH: number; E: number }[], x: number) => {
  const k = pts.findIndex((p, i) => i > 0 && p.pH >= x);
  const [a, b] = [pts[k - 1], pts[k]];
  return a.E + ((x - a.pH) / (b.pH - a.pH)) * (b.E - a.E);
};

describe('silver cyanide bath (0.2 mol/kg Ag, 0.6 mol/kg CN)', () => {
  const { result: r } = compositionWindow(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 }, grid: 120 }, 'ag.yaml'));
  test('one window from where AgCN(s) gives way to the cyanide complexes up to pH 14', () => {
    expect(r.basis).toBe('the bath as made up');
    expect(r.windows).toHaveLength(1);
    const w = r.windows[0];
    expect(w.dissolved).toEqual(['Ag(CN)2^-', 'Ag(CN)3^2-']);
    expect(w.boundedBy.low).toBe('AgCN');
    expect(w.pH[0]).toBeGreaterThan(4);
    expect(w.pH[0]).toBeLessThan(4.6);
    expect(w.pH[1]).toBe(14);
  });
  test('E_dep at pH 12 is the hand Nernst of Ag(CN)3-2/Ag with the free cyanide of the mass balance, within 0.5 mV', () => {
    const rows: Row[] = [
      { system: 'Ag-CN', complex: 'HCN', metal: 'H^+', ligand: 'CN^-', n: 1, j: 0, logbeta: (G('CN^-') - G('HCN')) / rt },
      { system: 'Ag-CN', complex: 'Ag(CN)2^-', metal: 'Ag^+', ligand: 'CN^-', n: 2, j: 0, logbeta: (G('Ag^+') + 2 * G('CN^-') - G('Ag(CN)2^-')) / rt },
      { system: 'Ag-CN', complex: 'Ag(CN)3^2-', metal: 'Ag^+', ligand: 'CN^-', n: 3, j: 0, logbeta: (G('Ag^+') + 3 * G('CN^-') - G('Ag(CN)3^2-')) / rt },
    ];
    // Equal shares of metal and Ag(CN)3-2: dissolved D with D·(1 + s3(D)) = 0.2.
    let lo = 0.1;
    let hi = 0.2;
    for (let k = 0; k < 100; k++) {
      const D = 0.5 * (lo + hi);
      if (D * (1 + bisectionSpeciation(rows, D, 0.6, 12).shares['Ag(CN)3^2-']) > 0.2) hi = D;
      else lo = D;
    }
    const ref = bisectionSpeciation(rows, lo, 0.6, 12);
    const hand = -(3 * G('CN^-') - G('Ag(CN)3^2-')) / F + s * Math.log10((lo * ref.shares['Ag(CN)3^2-']) / ref.L ** 3);
    expect(Math.abs(depAt(r.windows[0].deposition, 12) - hand)).toBeLessThan(5e-4);
  });
});

describe('copper ammonia bath (0.5 mol/kg Cu, 1 mol/kg NH3)', () => {
  const { result: r } = compositionWindow(readSpec({ element: 'Cu', composition: { Cu: 0.5, N: 1 } }, 'cu.yaml'));
  test('Cu(NH3)4+2 is in no window: it cannot hold the copper (1 mol/kg NH3 binds at most 0.25 mol/kg of it)', () => {
    for (const w of r.windows) expect(w.dissolved).not.toContain('Cu(NH3)4^2+');
  });
  test('acid window: E_dep = E°(Cu+2/Cu) + (RT ln10 / 2F) log10 0.25 (half the copper dissolved), within 0.5 mV', () => {
    const w = r.windows[0];
    expect(w.dissolved).toEqual(['Cu^2+']);
    expect(w.pH[0]).toBe(0);
    const hand = G('Cu^2+') / (2 * F) + (s / 2) * Math.log10(0.25);
    expect(Math.abs(depAt(w.deposition, 1) - hand)).toBeLessThan(5e-4);
  });
});

describe('CLI', () => {
  const dir = tmpDir();
  const ag = writeTmp(dir, 'ag.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\n');
  test('the table states the bath as made up; --json carries the basis and totals; -o is refused clearly', async () => {
    const t = await runCli(['window', ag]);
    expect(t.code, t.stderr).toBe(0);
    expect(t.stdout).toMatch(/^Plating window for Ag at 25 °C, the bath as made up \(totals Ag 0\.2, CN 0\.6 mol\/kg\)/);
    expect(t.stdout).toContain('Ag(CN)₂⁻, Ag(CN)₃²⁻');
    const j = JSON.parse((await runCli(['window', ag, '--json'])).stdout);
    expect(j.basis).toBe('the bath as made up');
    expect(j.totals).toEqual({ Ag: 0.2, CN: 0.6 });
    const o = await runCli(['window', ag, '-o', `${dir}/w.svg`]);
    expect(o.code).toBe(2);
    expect(o.stderr).toMatch(/--output/);
  });
});

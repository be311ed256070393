/**
 * Test helper: speciation problems built from overall stability constants (tests/fixtures/
 * stability-constants.csv, Martell & Smith, recalled; formulas read in the canonical form), and an independent solver for one metal and
 * one ligand — plain bisection on the free-ligand balance, ideal solution:
 *   [M] = M_T / (1 + Σ β_nj [L]ⁿ[OH]ʲ),  L_T = [L](1 + K_H[H]) + [M] Σ n β_nj [L]ⁿ[OH]ʲ,
 * L_T is increasing in [L], so bisection on log[L] converges to the unique root.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { SolverSpecies } from '../../src/solve/types.js';
import { formulaAscii } from '../../src/chem/formula.js';

export interface Row { system: string; complex: string; metal: string; ligand: string; n: number; j: number; logbeta: number }

export function stabilityRows(system: string): Row[] {
  const text = readFileSync(join(__dirname, '..', 'fixtures', 'stability-constants.csv'), 'utf8');
  const lines = text.split('\n').filter((l) => l && !l.startsWith('#')).slice(1);
  return lines.map((l) => l.split(',')).map(([s, c, m, L, n, j, b]) => ({ system: s, complex: formulaAscii(c), metal: formulaAscii(m), ligand: formulaAscii(L), n: +n, j: +j, logbeta: +b })).filter((r) => r.system === system);
}

/** 25 °C, kJ/mol. */
export const RTLN10 = (8.314462618 * 298.15 * Math.LN10) / 1000;
export const G_H2O = -237.14;
export const PKW = 14.0;

export interface LigandDef { comp: string; free: string; z: number; H: number; elements: Record<string, number> }
export const CYANIDE: LigandDef = { comp: 'CN', free: 'CN^-', z: -1, H: 0, elements: { CN: 1 } };
export const AMMONIA: LigandDef = { comp: 'N', free: 'NH3', z: 0, H: 3, elements: { N: 1 } };

/** Species of one metal ion (charge zM) and one ligand with G from the constants (G of M and L arbitrary). */
export function speciesFromConstants(rows: Row[], metal: string, zM: number, L: LigandDef, GM: number, GL: number): SolverSpecies[] {
  const GOH = G_H2O + RTLN10 * PKW;
  const sp = (formula: string, elements: Record<string, number>, charge: number, G: number): SolverSpecies => ({ formula, phase: 'aq', elements, charge, G, logActivity: 0 });
  const out = [sp(`${metal}^${zM === 1 ? '' : zM}+`, { [metal]: 1 }, zM, GM), sp(L.free, { ...L.elements, ...(L.H ? { H: L.H } : {}) }, L.z, GL)];
  for (const r of rows) {
    if (r.metal === 'H^+') {
      out.push(sp(r.complex, { ...L.elements, H: L.H + 1 }, L.z + 1, GL - RTLN10 * r.logbeta));
      continue;
    }
    const el: Record<string, number> = { [metal]: 1 };
    if (r.n) el[L.comp] = r.n;
    const H = r.j + r.n * L.H;
    if (H) el.H = H;
    if (r.j) el.O = r.j;
    out.push(sp(r.complex, el, zM + r.n * L.z - r.j, GM + r.n * GL + r.j * GOH - RTLN10 * r.logbeta));
  }
  return out;
}

/** The independent answer: free ligand [L] (its free, unprotonated form), shares of M by complex. */
export function bisectionSpeciation(rows: Row[], MT: number, LT: number, pH: number): { L: number; freeTotal: number; shares: Record<string, number> } {
  const H = 10 ** -pH;
  const OH = 10 ** (pH - PKW);
  const prot = rows.find((r) => r.metal === 'H^+')!;
  const cx = rows.filter((r) => r.metal !== 'H^+');
  const terms = (x: number) => cx.map((r) => 10 ** r.logbeta * x ** r.n * OH ** r.j);
  const lt = (x: number) => {
    const t = terms(x);
    const M = MT / (1 + t.reduce((a, b) => a + b, 0));
    return x * (1 + 10 ** prot.logbeta * H) + M * cx.reduce((s, r, k) => s + r.n * t[k], 0);
  };
  let lo = -40;
  let hi = Math.log10(LT);
  for (let k = 0; k < 200; k++) {
    const mid = 0.5 * (lo + hi);
    if (lt(10 ** mid) > LT) hi = mid;
    else lo = mid;
  }
  const x = 10 ** (0.5 * (lo + hi));
  const t = terms(x);
  const den = 1 + t.reduce((a, b) => a + b, 0);
  const shares: Record<string, number> = { free: 1 / den };
  cx.forEach((r, k) => (shares[r.complex] = t[k] / den));
  return { L: x, freeTotal: x * (1 + 10 ** prot.logbeta * H), shares };
}

/**
 * `cell` for any reaction (issue 12 item 3): reactions without electron transfer give ΔrG°, ΔrH°,
 * ΔrS°, ΔrCp° and log K at each temperature from the species model (IAPWS water, HKF for aqueous
 * species), and `--activity` gives ΔrG and E at the stated activities.
 * Check values: IAPWS R11-07 pKw along the liquid path (tests/fixtures/water-properties.csv, sources
 * in its header); ΔrH° of water ionisation at 25 °C 55.84 kJ/mol from the NBS tables (Wagman et al.
 * 1982: ΔfH° H2O(l) −285.830, OH⁻ −230.015 kJ/mol; recalled); Nernst equation (any physical-chemistry
 * text).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cellReaction } from '../../src/thermo/cell.js';
import { libraryLookup } from '../../src/system/lookup.js';
import { runCli } from '../helpers/cli.js';

const rows = readFileSync(new URL('../fixtures/water-properties.csv', import.meta.url), 'utf8')
  .split('\n')
  .filter((l) => l && !l.startsWith('#') && !l.startsWith('t_'))
  .map((l) => l.split(',').map(Number));

describe('cell "H2O(l) = H+ + OH-": log K = −pKw', () => {
  it.each(rows.map((r) => [r[0]!, r[3]!]))('%s °C: within 0.05 of IAPWS R11-07 (via the CLI, --json)', async (t, pKw) => {
    const r = await runCli(['cell', 'H2O(l) = H+ + OH-', '--temperature', String(t), '--json']);
    expect(r.code, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.kind).toBe('chemical');
    expect(j.equilibriumPotential).toBeNull();
    expect(Array.isArray(j.warnings)).toBe(true);
    expect(Math.abs(j.logK + pKw)).toBeLessThan(0.05);
  });

  it('ΔrH° at 25 °C is 55.84 kJ/mol (NBS tables) and ΔrCp° is negative and smooth over 0–300 °C', () => {
    const r25 = cellReaction('H2O(l) = H+ + OH-', { lookup: libraryLookup, celsius: 25 });
    expect(r25.deltaH!).toBeCloseTo(55.84, 1);
    // ΔrCp° from the species model, not constant: it changes with T (constant-Cp would keep it fixed).
    const cps = [0.01, 25, 50, 100, 150, 200, 250, 300].map((t) => cellReaction('H2O(l) = H+ + OH-', { lookup: libraryLookup, celsius: t }).deltaCp!);
    for (const c of cps) expect(c).toBeLessThan(0);
    expect(Math.abs(cps[7]! - cps[1]!)).toBeGreaterThan(100);
    // Consistency: d(log K)/dT = ΔrH°/(R T² ln 10) (van 't Hoff) at 150 °C, from the model's own values.
    const f = (t: number) => cellReaction('H2O(l) = H+ + OH-', { lookup: libraryLookup, celsius: t });
    const slope = (f(151).logK - f(149).logK) / 2;
    const T = 423.15;
    expect(slope).toBeCloseTo((f(150).deltaH! * 1000) / (8.314462618 * T * T * Math.log(10)), 4);
  });
});

describe('cell at stated activities', () => {
  it('Cu+2 + 2e- = Cu(s) at a(Cu2+) = 1e-6 is E° − (RT ln10/2F)·6 (Nernst), via --activity', async () => {
    const r = JSON.parse((await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--temperature', '80', '--activity', 'Cu+2=1e-6', '--json'])).stdout);
    const s = (8.314462618 * 353.15 * Math.log(10)) / 96485.33212;
    expect(r.atConditions.logQ).toBeCloseTo(6, 12);
    expect(r.atConditions.potential).toBeCloseTo(r.equilibriumPotential - (s / 2) * 6, 10);
  });

  it('a hydrolysis reaction at activities gives ΔrG = ΔrG° + RT ln Q; unknown species and bad values exit 2', async () => {
    const r = cellReaction('Fe+3 + H2O(l) = FeOH+2 + H+', { lookup: libraryLookup, celsius: 25, activities: { 'H+': 1e-3, 'Fe^3+': 1e-2 } });
    expect(r.kind).toBe('chemical');
    const RT = (8.314462618 * 298.15) / 1000;
    expect(r.atConditions!.deltaG).toBeCloseTo(r.deltaG + RT * Math.log(10) * (-3 - -2), 10);
    expect((await runCli(['cell', 'Fe+3 + H2O(l) = FeOH+2 + H+', '--activity', 'Cu+2=1e-6'])).code).toBe(2);
    const bad = await runCli(['cell', 'Fe+3 + H2O(l) = FeOH+2 + H+', '--activity', 'Fe+3=-1']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--activity/);
  });

  it('the text report of a no-electron reaction has log K and ΔrCp° columns and no potentials', async () => {
    const r = await runCli(['cell', 'H2O(l) = H+ + OH-', '--range', '25:75:50']);
    expect(r.stdout).toMatch(/ΔrCp°\/\(J\/\(mol·K\)\) +log K\n/);
    expect(r.stdout).not.toMatch(/E°\//);
    expect(r.stdout).toMatch(/-13\.995/);
  });
});

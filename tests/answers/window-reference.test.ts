/**
 * `window` honours the file's `reference:` as probe and lines do (deposition potentials printed
 * against that electrode, labelled with its scale), and --ref overrides it.
 * Check values: Zn2+ + 2e- = Zn(s), E° = −0.7618 V (CRC Handbook electrochemical series, recalled;
 * tests/fixtures/standard-potentials.csv), so at a(Zn2+) = 0.1 E_dep = −0.7618 − 0.02958 = −0.791 V
 * vs SHE; the SCE is +0.241 V vs SHE at 25 °C (common practice; tests/fixtures/reference-electrodes.csv),
 * so E_dep = −1.032 V vs SCE; the Cu/CuSO4 electrode is +0.316 V (buried-structure practice, 0.30–0.32
 * quoted), so E_dep ≈ −1.107 V vs CSE. The margin to hydrogen does not depend on the scale.
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const zn = writeTmp(dir, 'zn.yaml', 'element: Zn\nactivity: 0.1\nreference: sce\n');

/** The first window's E_dep at the low-pH end, from the text table. */
const depText = (t: string) => Number(/^0\.00–\S+\s+\S+\s+(-?\d\.\d+) …/m.exec(t)![1]);

describe('window on the file reference scale', () => {
  it('prints E_dep vs SCE, labelled, when the file says reference: sce', async () => {
    const r = await runCli(['window', zn]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('potentials in V vs SCE, which lies at +0.241 V vs SHE at 25 °C.');
    expect(r.stdout).toContain('E_dep at ends / V vs SCE');
    expect(depText(r.stdout)).toBeCloseTo(-1.032, 2);
  });

  it('--ref overrides the file reference (cse), and --ref she gives SHE', async () => {
    const cse = await runCli(['window', zn, '--ref', 'cse']);
    expect(cse.stdout).toContain('V vs Cu/CuSO₄ (sat.)'); // text for people in Unicode (README "Notation")
    expect(Math.abs(depText(cse.stdout) - -1.107)).toBeLessThan(0.01);
    const she = await runCli(['window', zn, '--ref', 'she']);
    expect(she.stdout).toContain('potentials in V vs SHE.');
    expect(depText(she.stdout)).toBeCloseTo(-0.791, 2);
  });

  it('JSON keeps E vs SHE and adds Eref and the reference, margins unchanged', async () => {
    const r = JSON.parse((await runCli(['window', zn, '--json'])).stdout);
    expect(r.reference.label).toBe('SCE');
    const d = r.windows[0].deposition[0];
    expect(d.E).toBeCloseTo(-0.791, 2);
    expect(d.Eref - d.E).toBeCloseTo(-0.241, 2);
    expect(r.windows[0].marginToHydrogen.atLowPH).toBeCloseTo(-0.791, 2);
  });

  it('the RHE is taken at each point’s own pH', async () => {
    const r = JSON.parse((await runCli(['window', zn, '--ref', 'rhe', '--json'])).stdout);
    for (const d of r.windows[0].deposition) expect(d.Eref - d.E).toBeCloseTo(0.05916 * d.pH, 3);
  });
});

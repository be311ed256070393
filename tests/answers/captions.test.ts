/**
 * Issue 15, defect 3: captions, headers and report lines state exactly what was computed, with
 * units. Check value: 60 mg/L chloride → 60e-3 g/L / 35.453 g/mol (IUPAC atomic weight of Cl) /
 * 0.99705 kg/L (density of water at 25 °C, IAPWS-95) = 1.697e-3 mol/kg.
 */
import { compositionProbe } from '../../src/analysis/composition-probe.js';
import { compositionSetup } from '../../src/diagram/composition-setup.js';
import { compositionProbeText } from '../../src/report/composition-probe-text.js';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { captionLines } from '../../src/figure/compose.js';
import { linesText } from '../../src/report/lines.js';
import { probe } from '../../src/analysis/probe.js';
import { probeText } from '../../src/report/probe-text.js';
import { windowHeading } from '../../src/report/window-text.js';
import { layerLabel } from '../../src/figure/overlay.js';

describe('the element amount as computed', () => {
  const c = compute(readSpec({ element: 'Ni', concentration: 1.3 }, 'ni.yaml'));
  it('uses 1.3 mol/kg and says so everywhere (not the default 1e-6)', () => {
    expect(c.model.species.find((s) => s.formula === 'Ni^2+')!.molality).toBe(1.3);
    expect(c.model.activity).toBe(1.3);
    expect(captionLines(c)[0]).toContain('dissolved Ni 1.3 mol/kg');
    expect(captionLines(c).join(' ')).not.toMatch(/10⁻⁶|1e-6/);
    expect(linesText(c.model)).toContain('dissolved Ni 1.3 mol/kg');
    expect(probeText(probe(c, 5, 0))).toContain('threshold 1.3 mol/kg');
    expect(layerLabel(c, true)).toContain('1.3 mol/kg');
  });
});

describe('ligand totals keep their units', () => {
  const c = compute(readSpec({ element: 'Cu', ligands: { Cl: '60 mg/L', C: '100 mg/L' } }, 'cu.yaml'));
  it('records the amounts as given with their molality (60 mg/L Cl = 1.697e-3 mol/kg)', () => {
    expect(c.model.amounts!.ligands.Cl).toMatchObject({ kind: 'mg/L', value: 60 });
    expect(c.model.amounts!.ligands.Cl.molality!).toBeCloseTo(1.697e-3, 5);
    expect(c.model.ligands.Cl).toBeCloseTo(1.697e-3, 5);
  });
  it('captions, line list and window header say "Cl 60 mg/L" and "C 100 mg/L", never "Cl 60.0" or "C 10²"', () => {
    const texts = [captionLines(c)[0], linesText(c.model).split('\n')[0], windowHeading(c.model)];
    for (const t of texts) {
      expect(t).toContain('Cl 60 mg/L (0.0017 mol/kg)');
      expect(t).toContain('C 100 mg/L');
      expect(t).not.toMatch(/Cl 60\.0|C 10²/);
    }
  });
  it('keeps activities as activities', () => {
    const s = compute(readSpec({ element: 'Cu', ligands: { S: 1e-3 } }, 'cu.yaml'));
    expect(captionLines(s)[0]).toContain('dissolved Cu activity 10⁻⁶; ligand totals S activity 10⁻³');
  });
});

describe('amounts given in g/L keep a readable unit', () => {
  // 30 g/L Zn(CN)2 (117.44 g/mol, IUPAC atomic weights) / 0.99705 kg/L (IAPWS-95, 25 °C) = 0.256 mol/kg.
  it('"30 g/L as Zn(CN)2" is printed 30 g/L as Zn(CN)₂, never "3e+4 mg/L"', () => {
    const c = compute(readSpec({ element: 'Zn', concentration: '30 g/L as Zn(CN)2', ligands: { CN: '60 g/L as NaCN' } }, 'zn.yaml'));
    const text = [linesText(c.model).split('\n')[0], probeText(probe(c, 12, -1.4)), ...captionLines(c)].join('\n');
    expect(text).not.toMatch(/e\+\d+ mg\/L/);
    expect(text).toContain('30 g/L as Zn(CN)₂ (0.256 mol/kg)');
    expect(text).toContain('CN 60 g/L as NaCN (1.23 mol/kg)');
  });
});

describe('composition probe: the ionic strength and how it was taken', () => {
  const text = (extra: Record<string, unknown>): string => {
    const spec = readSpec({ element: 'Cu', composition: { Cu: 0.5, N: 1 }, ...extra }, 'bath-cu.yaml');
    return compositionProbeText(compositionProbe(spec, compositionSetup(spec), 10, 0.3));
  };
  it('none given: says the solution is taken as ideal, not just "0 mol/kg"', () => {
    expect(text({})).toMatch(/^ionic strength: 0 mol\/kg, not given \(ideal solution\); activity model: ideal$/m);
  });
  it('auto: from the speciation at the point, with the activity model used', () => {
    expect(text({ ionicStrength: 'auto' })).toMatch(/^ionic strength: 0\.\d{4} mol\/kg, from the speciation at this point \(ionicStrength: auto\); activity model: davies$/m);
  });
  it('given: as given, with the activity model used', () => {
    expect(text({ ionicStrength: 0.3 })).toMatch(/^ionic strength: 0\.3000 mol\/kg, given; activity model: davies$/m);
  });
  it('the bath report says the same in its conditions table', async () => {
    const dir = tmpDir();
    const f = writeTmp(dir, 'bath.yaml', 'element: Cu\ncomposition: {Cu: 0.5, N: 1}\n');
    const out = join(dir, 'bath.md');
    expect((await runCli(['report', f, '-o', out])).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toContain('| Ionic strength | 0 mol/kg, not given (ideal solution); activity model: ideal |');
  });
});

/**
 * `probe` on composition files (the bath as made up), end to end through the CLI and the library.
 * Outside checks: mass balances of the totals (stoichiometry); the silver bath's free cyanide and
 * shares against the independent bisection solver (tests/helpers/stability.ts) with the library's
 * own constants (the check is of the solver and its read-out); 1 mol/kg NH₃ can hold at most
 * 0.25 mol/kg as Cu(NH₃)₄²⁺ (stoichiometry), so CuO precipitates where the fixed-activity diagram
 * shows the complex (issue 13; Martell & Smith log β4 = 11.75 in tests/fixtures/stability-constants.csv).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { compositionProbe } from '../../src/analysis/composition-probe.js';
import { compositionSetup, speciationAt } from '../../src/diagram/composition-setup.js';
import { compositionRows, probeComposition } from '../../src/cli/probe-composition.js';
import { runPoints } from '../../src/cli/probe-points.js';
import { EXIT, exitStatusOf, PartialError, UndeterminedError } from '../../src/errors.js';
import { findSpecies, loadLibrary } from '../../src/data/library.js';
import { readSpec } from '../../src/system/spec.js';
import { LN10, R } from '../../src/thermo/constants.js';
import { runCli } from '../helpers/cli.js';
import { bisectionSpeciation, type Row } from '../helpers/stability.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const ag = writeTmp(dir, 'ag.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\n');
const cu = writeTmp(dir, 'cu.yaml', 'element: Cu\ncomposition: {Cu: 0.5, N: 1}\n');

interface Json {
  status: string;
  predominant: string | null;
  verdict: string;
  dissolved: number;
  speciation: { species: string; molality: number; activity: number }[];
  solids: { species: string; amount: number }[];
  freeLigand: Record<string, { molality: number }>;
  saturation: { species: string; logSI: number }[];
}
const probeJson = async (file: string, pH: number, E: number): Promise<Json> => {
  const r = await runCli(['probe', file, '--ph', String(pH), '--potential', String(E), '--json']);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout) as Json;
};
const m = (j: Json, sp: string) => j.speciation.find((s) => s.species === sp)?.molality ?? 0;

describe('copper ammonia bath: 0.5 mol/kg Cu, 1 mol/kg NH3', () => {
  test('pH 10, +0.3 V (Cu(NH3)4+2 territory of the fixed-activity diagram): CuO precipitates, the complex cannot hold the copper', async () => {
    const j = await probeJson(cu, 10, 0.3);
    expect(j.status).toBe('ok');
    expect(j.predominant).toBe('CuO');
    expect(j.verdict).toBe('passivation');
    expect(j.solids.map((s) => s.species)).toEqual(['CuO']);
    expect(m(j, 'Cu(NH3)4^2+')).toBeLessThanOrEqual(0.25);
    // Mass balances: copper in solution and solid = 0.5, nitrogen = 1 (stoichiometry).
    const cuIn = (f: string) => (f.includes('Cu') ? 1 : 0); // one Cu atom in every dissolved form
    const nIn = (f: string) => (f === 'NH3' || f === 'NH4^+' ? 1 : Number(/\(NH3\)(\d?)/.exec(f)?.[1] || (f.includes('NH3') ? 1 : 0)));
    const cuTotal = j.speciation.reduce((a, s) => a + cuIn(s.species) * s.molality, 0) + j.solids[0].amount;
    const nTotal = j.speciation.reduce((a, s) => a + nIn(s.species) * s.molality, 0);
    expect(cuTotal).toBeCloseTo(0.5, 9);
    expect(nTotal).toBeCloseTo(1, 9);
    expect(Math.abs(j.dissolved - (cuTotal - j.solids[0].amount))).toBeLessThan(1e-12);
    // Solids not formed are not supersaturated.
    expect(j.saturation.every((s) => s.logSI <= 1e-9)).toBe(true);
  });
  test('the text read-out names the form, the verdict, the dissolved total against the threshold, and every species', async () => {
    const r = await runCli(['probe', cu, '--ph', '10', '--potential', '0.3']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/verdict: PASSIVATION — CuO holds the largest share/);
    expect(r.stdout).toMatch(/total dissolved 0\.07\d+ mol\/kg, above the corrosion threshold 1\.000e-6 mol\/kg/);
    expect(r.stdout).toContain('the bath as made up');
    for (const sp of ['Cu(NH₃)₄²⁺', 'NH₃', 'NH₄⁺', 'CuO (solid)']) expect(r.stdout).toContain(sp);
    expect(r.stdout).toMatch(/share of Cu\s+share of N/);
    expect(r.stdout).toMatch(/free N \(not bound to the element\): /);
    expect(r.stdout).toMatch(/saturation indices of solids not formed .*Cu₂O\(s\) -/);
  });
});

describe('silver cyanide bath: 0.2 mol/kg Ag, 0.6 mol/kg CN', () => {
  const lib = loadLibrary();
  const G = (f: string) => findSpecies(lib, f)!.dfG * 1000;
  const rt = R * 298.15 * LN10;
  const rows: Row[] = [
    { system: 'Ag-CN', complex: 'HCN', metal: 'H^+', ligand: 'CN^-', n: 1, j: 0, logbeta: (G('CN^-') - G('HCN')) / rt },
    { system: 'Ag-CN', complex: 'Ag(CN)2^-', metal: 'Ag^+', ligand: 'CN^-', n: 2, j: 0, logbeta: (G('Ag^+') + 2 * G('CN^-') - G('Ag(CN)2^-')) / rt },
    { system: 'Ag-CN', complex: 'Ag(CN)3^2-', metal: 'Ag^+', ligand: 'CN^-', n: 3, j: 0, logbeta: (G('Ag^+') + 3 * G('CN^-') - G('Ag(CN)3^2-')) / rt },
  ];
  test('pH 12, E = 0: JSON speciation equals the bisection solver (free CN-, both complexes); no solids; corrosion', async () => {
    const j = await probeJson(ag, 12, 0);
    const ref = bisectionSpeciation(rows, 0.2, 0.6, 12);
    expect(j.predominant).toBe('Ag(CN)2^-');
    expect(j.verdict).toBe('corrosion');
    expect(j.solids).toEqual([]);
    expect(Math.abs(m(j, 'CN^-') / ref.L - 1)).toBeLessThan(1e-6);
    expect(Math.abs(m(j, 'Ag(CN)2^-') / (0.2 * ref.shares['Ag(CN)2^-']) - 1)).toBeLessThan(1e-6);
    expect(Math.abs(m(j, 'Ag(CN)3^2-') / (0.2 * ref.shares['Ag(CN)3^2-']) - 1)).toBeLessThan(1e-6);
    expect(j.dissolved).toBeCloseTo(0.2, 12);
    // Ideal solution (the default): activity = molality for every species.
    for (const s of j.speciation) expect(s.activity).toBe(s.molality);
    // Every dissolved species of the problem is listed.
    expect(j.speciation.map((s) => s.species).sort()).toEqual(['Ag(CN)2^-', 'Ag(CN)3^2-', 'Ag(OH)2^-', 'Ag^+', 'AgOH', 'CN^-', 'HCN'].sort());
  });
  test('pH 12, −0.5 V: the metal holds most of the silver (immunity) and is listed as a solid with its amount', async () => {
    const j = await probeJson(ag, 12, -0.5);
    expect(j.predominant).toBe('Ag');
    expect(j.verdict).toBe('immunity');
    expect(j.solids.map((s) => s.species)).toEqual(['Ag']);
    expect(j.solids[0].amount + j.dissolved).toBeCloseTo(0.2, 12);
    expect(j.solids[0].amount).toBeGreaterThan(0.1);
  });
  test('JSON equals the library read-out (speciationAt) at the same point', async () => {
    const j = await probeJson(ag, 9.5, -0.2);
    const r = speciationAt(compositionSetup(readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'x.yaml')), 9.5, -0.2);
    for (const s of r.speciation) expect(m(j, s.species)).toBeCloseTo(s.molality, 12);
  });
});

describe('a failed solve is reported, never answered', () => {
  test('status failed, verdict unknown, no predominant form, no speciation', () => {
    const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'b.yaml');
    const starved = compositionSetup(spec, { newton: { maxIterations: 1, tol: 1e-11, maxStep: 2 }, noFallback: true });
    const r = compositionProbe(spec, starved, 12, 0);
    expect(r.status).toBe('failed');
    expect(r.reason).toMatch(/no convergence/);
    expect(r.verdict).toBe('unknown');
    expect(r.predominant).toBeNull();
    expect(r.speciation).toEqual([]);
    expect(r.solids).toEqual([]);
    expect(r.dissolved).toBeNull();
  });
});

describe('probe --points in composition mode', () => {
  test('one row per logged point: predominant form, verdict and total dissolved element', async () => {
    const log = writeTmp(dir, 'log.csv', 'time,pH,potential\n=cmd,12,0\nt2,12,-0.5\nt3,10,0.3\n');
    const out = join(dir, 'out.csv');
    const r = await runCli(['probe', ag, '--points', log, '-o', out]);
    expect(r.code, r.stderr).toBe(0);
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    // The carried column first (neutralised), then ours, the error column last.
    expect(lines[0]).toBe('time,line,pH,potential,scale,E_SHE_V,temperature_C,status,predominant,verdict,dissolved_mol_per_kg,threshold_mol_per_kg,reason,warnings,error');
    // All 0.2 mol/kg Ag dissolved as Ag(CN)2- at pH 12, 0 V (the mass balance); the default threshold 1e-6.
    expect(lines[1]).toMatch(/^'=cmd,2,12,0,SHE,0,25,ok,Ag\(CN\)2\^-,corrosion,0\.2,0\.000001,,[^,]*,$/);
    expect(lines[2]).toMatch(/^t2,3,12,-0\.5,SHE,-0\.5,25,ok,Ag,immunity,0\.035\d*,0\.000001,,[^,]*,$/);
    expect(lines).toHaveLength(4);
  });
});

describe('a failed solve on the command line: printed as failed, exit status 4', () => {
  const spec = readSpec({ element: 'Ag', composition: { Ag: 0.2, CN: 0.6 } }, 'b.yaml');
  const starved = (s: typeof spec) => compositionSetup(s, { newton: { maxIterations: 1, tol: 1e-11, maxStep: 2 }, noFallback: true });
  const capture = async (f: () => Promise<void>) => {
    let out = '';
    const ow = process.stdout.write.bind(process.stdout);
    process.stdout.write = ((s: string) => {
      out += s;
      return true;
    }) as typeof process.stdout.write;
    let err: unknown;
    try {
      await f();
    } catch (e) {
      err = e;
    } finally {
      process.stdout.write = ow;
    }
    return { out, err };
  };
  test('text: status failed, verdict unknown, no table; UndeterminedError (exit 4) after the output', async () => {
    const { out, err } = await capture(() => probeComposition(spec, { ph: '12', potential: '0' }, undefined, starved));
    expect(out).toMatch(/status: failed — the speciation could not be solved at this point; verdict unknown/);
    expect(out).not.toMatch(/verdict: [A-Z]/);
    expect(out).not.toContain('molality');
    expect(err).toBeInstanceOf(UndeterminedError);
    expect(exitStatusOf(err)).toBe(EXIT.partial);
  });
  test('JSON: status failed with the reason, predominant null', async () => {
    const { out, err } = await capture(() => probeComposition(spec, { ph: '12', potential: '0', json: true }, undefined, starved));
    const j = JSON.parse(out);
    expect(j.status).toBe('failed');
    expect(j.verdict).toBe('unknown');
    expect(j.predominant).toBeNull();
    expect(j.reason).toMatch(/no convergence/);
    expect(exitStatusOf(err)).toBe(EXIT.partial);
  });
  test('--points: every row written, failed rows say status failed; PartialError (exit 4)', async () => {
    const log = writeTmp(dir, 'log2.csv', 'pH,potential\n12,0\n10,0.3\n');
    const out = join(dir, 'out2.csv');
    const { err } = await capture(() => runPoints(ag, spec, undefined, { points: log, output: out }, compositionRows(spec, undefined, starved)));
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    expect(lines).toHaveLength(3);
    for (const l of lines.slice(1)) expect(l).toMatch(/,failed,,unknown,,0\.000001,"?no convergence[^,]*"?,[^,]*,$/);
    expect(err).toBeInstanceOf(PartialError);
    expect(exitStatusOf(err)).toBe(EXIT.partial);
    expect((err as Error).message).toMatch(/2 of 2 rows .* status failed/);
  });
});

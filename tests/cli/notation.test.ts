/**
 * The project's notation end to end (issue 17 item 1): every formula is read in the canonical ASCII
 * form (Fe^2+), in Unicode (Fe²⁺) and in the older form (Fe+2) — in files (`exclude`, `pick`,
 * `classes`, inline species) and on the command line (`cell`, `--activity`); text for people prints
 * Unicode and never the older charge form; JSON prints the canonical ASCII form (reactions with
 * "<=>"), which parses back to the same species; a formula a user's file gives is echoed unchanged
 * in `predominant`.
 * Check values: E°(Fe²⁺/Fe) from the NBS 1982 ΔfG° (−78.90 kJ/mol) and its PB66 alternative
 * (−84.94 kJ/mol), both in species/Fe.json (recalled from memory).
 */
import { describe, expect, it } from 'vitest';
import { formulaAscii, parseFormula } from '../../src/chem/formula.js';
import { parseReaction } from '../../src/chem/reaction-parse.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const F = 96485.33212; // CODATA 2018
const dir = tmpDir();
const file = (name: string, data: unknown) => writeTmp(dir, name, JSON.stringify(data));
const SPELLINGS = ['Fe+2', 'Fe^2+', 'Fe²⁺'];

/** A formula written in the older charge form (Fe+2, HFeO2-, OH-) anywhere in a text for people. */
function oldFormulas(text: string): string[] {
  const out: string[] = [];
  for (const m of text.matchAll(/(?<![\w^.])[A-Z][A-Za-z0-9()[\]]*[+-]\d*(?![\w(^])/g)) {
    try {
      if (parseFormula(m[0]).charge !== 0) out.push(m[0]);
    } catch {
      // not a formula
    }
  }
  return out;
}

async function json(args: string[]): Promise<any> {
  const r = await runCli([...args, '--json']);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout);
}

describe('every spelling is read', () => {
  it.each(SPELLINGS)('exclude: [%s] leaves Fe²⁺ out', async (x) => {
    const j = await json(['lines', file(`ex${SPELLINGS.indexOf(x)}.json`, { element: 'Fe', activity: 1e-6, exclude: [x] })]);
    expect(j.lines.some((l: { between: string[] }) => l.between.includes('Fe^2+'))).toBe(false);
    expect(j.lines.length).toBeGreaterThan(3);
  });

  it.each(SPELLINGS)('pick: {%s: PB66} moves the Fe²⁺/Fe line to the PB66 value', async (x) => {
    const j = await json(['lines', file(`pick${SPELLINGS.indexOf(x)}.json`, { element: 'Fe', activity: 1, pick: { [x]: 'PB66' } })]);
    const l = j.lines.find((r: { between: string[] }) => r.between.includes('Fe^2+') && r.between.includes('Fe'));
    // E° = ΔfG°(Fe²⁺)/(2F) at unit activity: PB66 −84.94 kJ/mol → −0.4402 V.
    expect(l.line.E0).toBeCloseTo((-84.94 * 1000) / (2 * F), 3);
  });

  it.each(SPELLINGS)('classes: {%s: passivation} reclassifies Fe²⁺ in probe', async (x) => {
    const f = file(`cls${SPELLINGS.indexOf(x)}.json`, { element: 'Fe', activity: 1e-6, classes: { [x]: 'passivation' } });
    const j = await json(['probe', f, '--ph', '4', '--potential', '-0.3']);
    expect(j.predominant).toBe('Fe^2+');
    expect(j.verdict).toBe('passivation');
  });

  it.each([
    'Fe+2 + 2e- = Fe(s)',
    'Fe^2+ + 2e^- <=> Fe(s)',
    'Fe²⁺ + 2e⁻ ⇌ Fe(s)',
  ])('cell "%s": E° from the NBS 1982 ΔfG°, with --activity in each spelling', async (reaction) => {
    const j = await json(['cell', reaction]);
    const row = Array.isArray(j) ? j[0] : j.rows?.[0] ?? j;
    expect(row.equilibriumPotential).toBeCloseTo((-78.9 * 1000) / (2 * F), 3);
    expect(row.reaction).toBe('Fe^2+ + 2e^- <=> Fe(s)');
    for (const a of SPELLINGS) {
      const k = await json(['cell', reaction, '--activity', `${a}=1e-6`]);
      const r = Array.isArray(k) ? k[0] : k.rows?.[0] ?? k;
      // Nernst: E = E° + (RT ln10 / 2F) log a, 25 °C.
      expect(r.atConditions.potential - row.equilibriumPotential).toBeCloseTo(((8.314462618 * 298.15 * Math.LN10) / (2 * F)) * -6, 4);
    }
  });
});

describe('warnings name neutral species with their phase', () => {
  it('Zn(OH)₂(aq) and Ni(OH)₂(s) in text, Zn(OH)2(aq) in JSON: never a bare ASCII "Zn(OH)2" for people', async () => {
    const zn = writeTmp(dir, 'zn60.yaml', 'element: Zn\ntemperature: 60\n');
    const ni = writeTmp(dir, 'ni150.yaml', 'element: Ni\ntemperature: 150\n');
    const t = await runCli(['probe', zn, '--ph', '9', '--potential', '-0.8']);
    expect(t.stdout).toContain('Zn(OH)₂(aq)');
    expect(t.stdout + t.stderr).not.toMatch(/Zn\(OH\)2(?!\()/);
    const u = await runCli(['probe', ni, '--ph', '10', '--potential', '-0.2']);
    expect(u.stdout).toMatch(/without Cp°.*Ni\(OH\)₂\(s\)/);
    const j = await json(['probe', zn, '--ph', '9', '--potential', '-0.8', '--json']);
    expect((j.warnings as string[]).join(' ')).toContain('Zn(OH)2(aq)');
  });
});

describe('alloy warnings on standard error are text for people', () => {
  it('Cu²⁺ and Zn(OH)₂(aq), never Cu^2+ or Zn(OH)2(aq)', async () => {
    const f = writeTmp(dir, 'brass60.yaml', 'elements: {Cu: 0.7, Zn: 0.3}\ntemperature: 60\n');
    const r = await runCli(['probe', f, '--ph', '8', '--potential', '-0.1']);
    expect(r.code).toBe(0);
    expect(r.stderr).toContain('Cu²⁺');
    expect(r.stderr).toContain('Zn(OH)₂(aq)');
    expect(r.stderr).not.toMatch(/\^|Zn\(OH\)2/);
  });
});

describe('cell --json lists its species in the canonical form', () => {
  it('the electron and H+ too (e^-, H^+), every formula parsing back', async () => {
    for (const reaction of ['Fe^2+ + 2e^- <=> Fe(s)', 'Fe+2 + 2e- = Fe(s)', 'Fe²⁺ + 2e⁻ ⇌ Fe(s)', 'H2O(l) <=> H^+ + OH^-']) {
      const j = await json(['cell', reaction]);
      const formulas = (j.species as { formula: string }[]).map((s) => s.formula);
      expect(formulas).not.toContain('e-');
      expect(formulas).not.toContain('H+');
      for (const f of formulas) if (f !== 'e^-') expect(formulaAscii(parseFormula(f)), f).toBe(f);
      if (reaction.startsWith('Fe')) expect(formulas).toContain('Fe^2+');
    }
    for (const a of SPELLINGS) {
      const k = await json(['cell', 'Fe^2+ + 2e^- <=> Fe(s)', '--activity', `${a}=1e-6`]);
      expect(Object.keys(k.atConditions.activities)).toEqual(['Fe^2+']);
    }
  });
});

describe('predominant echoes a file’s own spelling', () => {
  it('an inline species written Fe+2 stays Fe+2 in probe --json and in the points CSV', async () => {
    const f = file('inline.json', {
      element: 'Fe', activity: 1e-6,
      species: ['Fe', { formula: 'Fe+2', phase: 'aq', dfG: -78.9 }, 'Fe3O4', 'Fe2O3'],
    });
    const j = await json(['probe', f, '--ph', '4', '--potential', '-0.3']);
    expect(j.predominant).toBe('Fe+2');
    const pts = writeTmp(dir, 'pts.csv', 'pH,potential\n4,-0.3\n');
    const r = await runCli(['probe', f, '--points', pts]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout.split('\n')[1]).toContain(',Fe+2,');
    // The text for people prints it in Unicode, the advice's species too.
    const t = await runCli(['probe', f, '--ph', '4', '--potential', '-0.3']);
    expect(t.stdout).toContain('Fe²⁺ predominates');
    const s = await runCli(['probe', f, '--ph', '8.5', '--potential', '-0.5']);
    expect(s.stdout).toMatch(/Nearest change: .* reaches (Fe₃O₄|Fe₂O₃|Fe²⁺|Fe) \(/);
    expect(s.stdout).not.toMatch(/reaches Fe[23]O[34] /);
  });
});

const ELEMENTS = ['Ag', 'Al', 'Au', 'Co', 'Cr', 'Cu', 'Fe', 'Mn', 'Mo', 'Ni', 'Pb', 'Sn', 'Ti', 'Zn'];

describe.each(ELEMENTS)('%s: text in Unicode, JSON canonical', (el) => {
  const f = file(`sweep-${el}.json`, { element: el, activity: 1e-6 });
  it('lines and probe text carry no formula in the older charge form, and use ⇌', async () => {
    const lines = await runCli(['lines', f]);
    expect(lines.code).toBe(0);
    expect(oldFormulas(lines.stdout)).toEqual([]);
    expect(lines.stdout).toContain('\u21cc');
    for (const [pH, E] of [[2, 0], [7, -0.5], [12, 0.5]]) {
      const p = await runCli(['probe', f, '--ph', String(pH), '--potential', String(E)]);
      expect(p.code).toBe(0);
      expect(oldFormulas(p.stdout)).toEqual([]);
    }
  });
  it('lines --json and probe --json: every formula canonical and parsed back, reactions with <=>', async () => {
    const j = await json(['lines', f]);
    for (const l of j.lines) {
      for (const s of l.between) expect(formulaAscii(s), s).toBe(s);
      expect(l.reaction).toContain(' <=> ');
      const parsed = parseReaction(l.reaction);
      expect(parsed.text).toBe(l.reaction);
    }
    const p = await json(['probe', f, '--ph', '7', '--potential', '0']);
    expect(formulaAscii(p.predominant)).toBe(p.predominant);
    if (p.runnerUp) expect(formulaAscii(p.runnerUp)).toBe(p.runnerUp);
  });
});

describe('catalog', () => {
  it('prints Unicode for people and the canonical form in JSON, with hydroxido names', async () => {
    const t = await runCli(['catalog', 'Fe']);
    expect(oldFormulas(t.stdout)).toEqual([]);
    expect(t.stdout).toMatch(/HFeO₂⁻\s+aq\s+trihydroxidoferrate\(II\)/);
    const j = await json(['catalog', 'Fe']);
    const h = j.species.find((s: { formula: string }) => s.formula === 'HFeO2^-');
    expect(h.name).toBe('trihydroxidoferrate(II)');
    for (const s of j.species) expect(formulaAscii(s.formula)).toBe(s.formula);
  });
});

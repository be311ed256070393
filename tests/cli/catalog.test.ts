/**
 * `catalog`, metastable phases, picking alternatives and library species by name (species library issue).
 */
import { describe, expect, it } from 'vitest';
import { compute } from '../../src/pipeline.js';
import { readSpec } from '../../src/system/spec.js';
import { runCli } from '../helpers/cli.js';

describe('catalog', () => {
  it('lists copper species with data and sources, as JSON objects with the contract keys', async () => {
    const r = await runCli(['catalog', 'Cu', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Array.isArray(out.warnings)).toBe(true);
    const list = out.species;
    expect(list.length).toBeGreaterThan(10);
    for (const e of list) {
      for (const k of ['formula', 'phase', 'dfG', 'dfH', 'S', 'Cp', 'source', 'sourceText']) expect(e).toHaveProperty(k);
    }
    expect(list.map((e: { formula: string }) => e.formula)).toContain('Cu2O');
  });

  it('prints a table with units in the headers', async () => {
    const r = await runCli(['catalog', 'Zn']);
    expect(r.stdout).toMatch(/ΔfG°\/\(kJ\/mol\)/);
    expect(r.stdout).toMatch(/Sources:/);
  });

  it('rejects an unknown element with exit 2', async () => {
    const r = await runCli(['catalog', 'Qq']);
    expect(r.code).toBe(2);
  });
});

describe('library use in system files', () => {
  it('metastable Fe(OH)3 is excluded by default and included on request', () => {
    const a = compute(readSpec({ element: 'Fe' }, 'a.yaml'));
    expect(a.model.species.map((s) => s.formula)).not.toContain('Fe(OH)3');
    const b = compute(readSpec({ element: 'Fe', metastable: ['Fe(OH)3'] }, 'b.yaml'));
    expect(b.model.species.map((s) => s.formula)).toContain('Fe(OH)3');
  });

  it('picking another compilation for Fe+2 moves the Fe+2/Fe line (alternatives keep their source)', async () => {
    const list = JSON.parse((await runCli(['catalog', 'Fe', '--json'])).stdout).species;
    const fe2 = list.find((e: { formula: string }) => e.formula === 'Fe^2+');
    expect(fe2.alternatives.length).toBeGreaterThan(0);
    const alt = fe2.alternatives[0];
    const a = compute(readSpec({ element: 'Fe' }, 'a.yaml'));
    const b = compute(readSpec({ element: 'Fe', pick: { 'Fe^2+': alt.id } }, 'b.yaml'));
    const line = (m: typeof a.model) => m.boundaries.find((x) => x.between.includes('Fe') && x.between.includes('Fe^2+'))!.line.intercept!;
    // E shift = ΔΔfG°/(2F), F = 96485.33212 C/mol (CODATA 2018).
    expect(line(b.model) - line(a.model)).toBeCloseTo(((alt.dfG - fe2.dfG) * 1000) / (2 * 96485.33212), 6);
  });

  it('library species by formula and by name mix with inline ones', () => {
    const c = compute(readSpec({ element: 'Fe', species: ['Fe', 'magnetite', { formula: 'Fe^2+', phase: 'aq', dfG: -78.9 }, 'Fe2O3(s)'] }, 'm.yaml'));
    expect(c.model.regions.map((r) => r.species).sort()).toEqual(['Fe', 'Fe2O3', 'Fe3O4', 'Fe^2+']);
  });
});

/**
 * IUPAC 2005 additive names of mononuclear hydroxido/oxido species (Nomenclature of Inorganic
 * Chemistry, IUPAC Recommendations 2005, IR-9.2, Tables VII and X; recalled from memory).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { hydroxoName, parseFormula } from '../../src/chem/index.js';

describe('hydroxoName: worked examples', () => {
  it.each<[string, string, number]>([
    ['FeOH^+', 'hydroxidoiron(II)', 2],
    ['FeOH^2+', 'hydroxidoiron(III)', 3],
    ['Fe(OH)2^+', 'dihydroxidoiron(III)', 3],
    ['Fe(OH)3^-', 'trihydroxidoferrate(II)', 2],
    ['Zn(OH)4^2-', 'tetrahydroxidozincate(II)', 2],
    ['Al(OH)₄⁻', 'tetrahydroxidoaluminate(III)', 3],
    ['Sn(OH)6-2', 'hexahydroxidostannate(IV)', 4],
    ['HFeO2^-', 'hydroxidooxidoferrate(II)', 2],
    ['CuO2^2-', 'dioxidocuprate(II)', 2],
    ['MnO4^-', 'tetraoxidomanganate(VII)', 7],
    ['CrO4^2-', 'tetraoxidochromate(VI)', 6],
    ['HCrO4^-', 'hydroxidotrioxidochromate(VI)', 6], // hydroxido before oxido: alphabetical
    ['TiO^2+', 'oxidotitanium(IV)', 4],
    ['AgOH', 'hydroxidosilver(I)', 1],
    ['AgOH(aq)', 'hydroxidosilver(I)', 1],
  ])('%s → %s', (formula, name, N) => {
    const r = hydroxoName(formula);
    expect(r?.name).toBe(name);
    expect(r?.oxidationState).toBe(N);
    expect(r?.hydrated).toBe(false);
  });

  it('names the hydrated equivalent on request (differs by water only)', () => {
    expect(hydroxoName('HFeO2^-', { hydrated: true })).toEqual({
      name: 'trihydroxidoferrate(II)', metal: 'Fe', oxidationState: 2, hydroxido: 3, oxido: 0, charge: -1, hydrated: true,
    });
    expect(hydroxoName('ZnO₂²⁻', { hydrated: true })?.name).toBe('tetrahydroxidozincate(II)');
    expect(hydroxoName('HCuO2-', { hydrated: true })?.name).toBe('trihydroxidocuprate(II)');
    expect(hydroxoName('SnO3-2', { hydrated: true })?.name).toBe('hexahydroxidostannate(IV)');
    // Already fully hydroxylated: nothing to add, named as written.
    expect(hydroxoName('FeOH+', { hydrated: true })).toMatchObject({ name: 'hydroxidoiron(II)', hydrated: false });
    // More than six hydroxido ligands would be absurd (Mn(OH)8⁻): named as written.
    expect(hydroxoName('MnO4-', { hydrated: true })).toMatchObject({ name: 'tetraoxidomanganate(VII)', hydrated: false });
  });

  it('accepts a parsed Formula', () => {
    expect(hydroxoName(parseFormula('Zn(OH)4-2'))?.name).toBe('tetrahydroxidozincate(II)');
  });

  it.each([
    'Fe^2+', // no O: not a hydroxido/oxido species
    'Cr2O7^2-', // two metal atoms
    'HSO4^-', // S: non-metal, has its own accepted name
    'CuCl^+', // other ligand
    'NaOH', // metal without an -ate entry (out of scope, not guessed)
    'Fe(OH)3(s)', // solid: compositional name
    'H2O2',
    'OH^-',
    'Fe(H2O)6^2+', // more H than O: aqua ligands, out of scope
    'AuO^3-', // oxidation state −I
    'Fe0.5OH', // non-integer count
    'not a formula',
  ])('%s is out of scope (undefined)', (t) => {
    expect(hydroxoName(t)).toBeUndefined();
  });
});

describe('hydroxoName over the species library', () => {
  const root = fileURLToPath(new URL('../../', import.meta.url));
  const rows: { formula: string; name: string; aliases?: string[] }[] = [];
  for (const file of readdirSync(join(root, 'species')).filter((f) => f.endsWith('.json')).sort()) {
    const data = JSON.parse(readFileSync(join(root, 'species', file), 'utf8')) as { species: { formula: string; phase: string; name: string; aliases?: string[] }[] };
    for (const s of data.species) if (s.phase === 'aq') rows.push(s);
  }
  const ROMAN: Record<string, number> = { I: 1, II: 2, III: 3, IV: 4, V: 5, VI: 6, VII: 7, VIII: 8 };

  it('agrees with the oxidation state the library name states, where it states one', () => {
    let checked = 0;
    for (const s of rows) {
      const r = hydroxoName(s.formula);
      const stated = /\((I|II|III|IV|V|VI|VII|VIII)\)/.exec(s.name)?.[1];
      if (!r || !stated) continue;
      expect(r.oxidationState, `${s.formula} "${s.name}"`).toBe(ROMAN[stated]);
      checked++;
    }
    expect(checked).toBeGreaterThan(15);
  });

  it('gives every library hydroxo species carrying an old name its IUPAC hydroxido name, the old name kept as an alias', () => {
    // Metal "-ite"/"-ate" anion names and "hydroxo complex" names (non-metal oxoanions such as
    // chlorite, and accepted oxoanion names such as chromate or permanganate, keep their names).
    const OLD = /^(?:hydrogen )?(?:dihypo)?(?:cobalt|cupr|mangan|nickel|plumb|stann|ferr)ite\b|^(?:hydrogen )?(?:zincate|stannate)\b|hydroxo/;
    const old = rows.filter((s) => (s.aliases ?? []).some((a) => OLD.test(a)));
    expect(old.length).toBeGreaterThanOrEqual(20);
    for (const s of old) {
      expect(OLD.test(s.name), `${s.formula} "${s.name}"`).toBe(false);
      expect(s.name, s.formula).toBe(hydroxoName(s.formula, { hydrated: true })!.name);
    }
    // By hand (IUPAC 2005, IR-9.2; the species is named as its fully hydroxylated form in water):
    const named = (f: string) => rows.find((s) => s.formula === f)?.name;
    expect(named('HFeO2^-')).toBe('trihydroxidoferrate(II)');
    expect(named('ZnO2^2-')).toBe('tetrahydroxidozincate(II)');
    expect(named('CuO2^2-')).toBe('tetrahydroxidocuprate(II)');
    expect(named('FeOH^+')).toBe('hydroxidoiron(II)');
    expect(rows.some((s) => /ite ion|hydroxo\b/.test(s.name) && /^[A-Z][a-z]?O/.test(s.formula) && !/^(Cl|N|S|C)/.test(s.formula))).toBe(false);
  });
});

/**
 * Every species/*.json validates against schema/species.schema.json (checked by a small validator of
 * the JSON Schema keywords our schema uses — it refuses any other keyword, so it cannot silently pass),
 * every formula parses, sources resolve, and the loader accepts the files.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseFormula } from '../../src/chem/formula.js';
import { validateSpeciesFile, LibraryError } from '../../src/data/library.js';
import { type Schema, validate } from '../helpers/json-schema.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const schema = JSON.parse(readFileSync(join(root, 'schema/species.schema.json'), 'utf8')) as Schema;
const speciesDir = join(root, 'species');
const files = readdirSync(speciesDir).filter((f) => f.endsWith('.json')).sort();

describe('the schema itself', () => {
  it('is draft 2020-12 and strict', () => {
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    expect(schema.additionalProperties).toBe(false);
    const defs = schema.$defs as Record<string, Schema>;
    expect(defs.species!.additionalProperties).toBe(false);
    expect(defs.alternative!.additionalProperties).toBe(false);
  });

  it('rejects malformed entries (the validator can fail)', () => {
    const good = {
      element: 'Fe',
      sources: { NBS82: 'citation' },
      species: [{ formula: 'Fe^2+', phase: 'aq', name: 'iron(II) ion', dfG: -78.9, source: 'NBS82' }],
    };
    expect(validate(good, schema, '$', schema)).toEqual([]);
    const bad = (patch: Record<string, unknown>) =>
      validate({ ...good, species: [{ ...good.species[0], ...patch }] }, schema, '$', schema);
    expect(bad({ dfG: '−78.9' })).not.toEqual([]);
    expect(bad({ phase: 'solid' })).not.toEqual([]);
    expect(bad({ formula: 'Fe^2+(aq)' })).not.toEqual([]);
    // The library writes the canonical caret form only (the reader still takes the older Fe+2).
    expect(bad({ formula: 'Fe+2' })).not.toEqual([]);
    expect(bad({ formula: 'Fe²⁺' })).not.toEqual([]);
    expect(bad({ formula: 'Fe 2+' })).not.toEqual([]);
    expect(bad({ dG: 1 })).not.toEqual([]);
    expect(bad({ uncertainty: { dfG: -1 } })).not.toEqual([]);
    expect(bad({ alternatives: [{ id: 'X', dfG: 1 }] })).not.toEqual([]);
    expect(validate({ ...good, extra: 1 }, schema, '$', schema)).not.toEqual([]);
  });
});

describe.each(files)('species/%s', (file) => {
  const data = JSON.parse(readFileSync(join(speciesDir, file), 'utf8')) as {
    $schema?: string;
    sources: Record<string, string>;
    species: { formula: string; phase: string; source: string; sources?: Record<string, string>; alternatives?: { source: string; sources?: Record<string, string> }[] }[];
  };

  it('validates against the schema', () => {
    expect(validate(data, schema, '$', schema)).toEqual([]);
  });

  it('points editors at the schema', () => {
    expect(data.$schema).toBe('../schema/species.schema.json');
  });

  it('has formulas that parse, and charged species only in solution', () => {
    for (const sp of data.species) {
      const f = parseFormula(sp.formula);
      if (f.charge !== 0) expect(sp.phase, sp.formula).toBe('aq');
    }
  });

  it('names only sources of its own map', () => {
    const keys = Object.keys(data.sources);
    for (const sp of data.species) {
      for (const entry of [sp, ...(sp.alternatives ?? [])]) {
        expect(keys, sp.formula).toContain(entry.source);
        for (const k of Object.values(entry.sources ?? {})) expect(keys, sp.formula).toContain(k);
      }
    }
  });

  it('is accepted by the loader', () => {
    expect(validateSpeciesFile(file, data).length).toBe(data.species.length);
  });
});

describe('loader validation errors name the file and the field', () => {
  const base = {
    element: 'Fe',
    sources: { NBS82: 'citation' },
    species: [{ formula: 'Fe^2+', phase: 'aq', name: 'iron(II) ion', dfG: -78.9, source: 'NBS82' }],
  };
  const withSpecies = (patch: Record<string, unknown>) => ({ ...base, species: [{ ...base.species[0], ...patch }] });
  const cases: [string, unknown, RegExp][] = [
    ['missing dfG', withSpecies({ dfG: undefined }), /x\.json.*species\[0\] \(Fe\^2\+\)\.dfG/],
    ['unknown source key', withSpecies({ source: 'CRC' }), /x\.json.*\.source.*"CRC"/],
    ['bad formula', withSpecies({ formula: 'Fe2+x' }), /x\.json.*\.formula/],
    ['phase tag in formula', withSpecies({ formula: 'Fe+2(aq)' }), /x\.json.*\.formula.*phase/],
    ['charged solid', withSpecies({ phase: 's' }), /x\.json.*\.phase/],
    ['unknown field', withSpecies({ dG: 3 }), /x\.json.*\.dG.*unknown field/],
    ['alternative without source', withSpecies({ alternatives: [{ id: 'A', dfG: 1 }] }), /alternatives\[0\]\.source/],
    ['empty sources', { ...base, sources: {} }, /x\.json: sources/],
    ['phase-choice temperature out of range', withSpecies({ stableAbove: 400 }), /x\.json.*\.stableAbove.*0 to 350/],
    ['phase-choice temperature not a number', withSpecies({ stableBelow: '100' }), /x\.json.*\.stableBelow/],
    ['phase choice and metastable together', withSpecies({ stableBelow: 100, metastable: true }), /x\.json.*\.metastable.*stableBelow/],
  ];
  for (const [label, data, re] of cases) {
    it(label, () => {
      expect(() => validateSpeciesFile('x.json', data)).toThrow(LibraryError);
      expect(() => validateSpeciesFile('x.json', data)).toThrow(re);
    });
  }
});

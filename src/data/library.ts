/**
 * The built-in species library: loading, validation and look-up of the JSON files in species/.
 *
 * File format (one file per element, see species/README.md and schema/species.schema.json):
 *   { "$schema"?, "element", "sources": { key: citation }, "species": [ SpeciesRecord, ... ] }
 * A file whose `element` is "mixed" (species/mixed.json) holds compounds of two or more elements
 * other than H and O (spinels such as FeCr2O4, delafossite CuFeO2): they are marked `mixed` and enter
 * only systems with several main elements (speciesForElements), never a one-element system.
 * Units: ΔfG°, ΔfH° in kJ/mol; S°, Cp° in J/(mol·K); 298.15 K, 1 bar; aqueous ions on the
 * conventional scale (H+(aq): ΔfG° = ΔfH° = S° = Cp° = 0).
 *
 * Every file is validated when loaded; any problem throws a LibraryError naming the file and field.
 * This module reads the folder (loadLibrary, cached per folder) and re-exports the library's other
 * parts, so callers import from here: the types (library-types.ts), the validation of one file
 * (library-validate.ts) and the look-ups (library-lookup.ts). It computes no thermodynamics.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { LibraryError, type LibrarySpecies } from './library-types.js';
import { validateSpeciesFile } from './library-validate.js';
export type { CpPolynomialRecord, HkfRecord } from './parameter-blocks.js';
export * from './library-types.js';
export { validateSpeciesFile } from './library-validate.js';
export * from './library-lookup.js';

function deepFreeze<T>(o: T): T {
  if (typeof o === 'object' && o !== null && !Object.isFrozen(o)) {
    Object.freeze(o);
    for (const v of Object.values(o as Record<string, unknown>)) deepFreeze(v);
  }
  return o;
}

/** The package's species/ folder, found relative to this module (works from src/ and dist/). */
export function defaultSpeciesDir(): string {
  return fileURLToPath(new URL('../../species/', import.meta.url));
}

const cache = new Map<string, readonly LibrarySpecies[]>();

/**
 * Loads and validates every *.json file of `dir` (default: the package's species/ folder), pooling
 * their species. The result is cached per folder; species objects are frozen (use pickAlternative
 * for a modified copy). Throws LibraryError on any invalid file, on a formula+phase present twice,
 * or when the folder holds no species file.
 */
export function loadLibrary(dir?: string): LibrarySpecies[] {
  const folder = resolve(dir ?? defaultSpeciesDir());
  const hit = cache.get(folder);
  if (hit) return [...hit];
  let names: string[];
  try {
    names = readdirSync(folder).filter((n) => n.endsWith('.json')).sort();
  } catch (e) {
    throw new LibraryError(folder, '(folder)', `cannot read: ${(e as Error).message}`);
  }
  if (names.length === 0) throw new LibraryError(folder, '(folder)', 'holds no species file (*.json)');
  const all: LibrarySpecies[] = [];
  const seen = new Map<string, string>();
  for (const name of names) {
    const file = basename(name);
    let data: unknown;
    try {
      data = JSON.parse(readFileSync(join(folder, name), 'utf8'));
    } catch (e) {
      throw new LibraryError(file, '(file)', `not valid JSON: ${(e as Error).message}`);
    }
    for (const sp of validateSpeciesFile(file, data)) {
      const key = `${sp.formula}(${sp.phase})`;
      const prev = seen.get(key);
      if (prev !== undefined) {
        throw new LibraryError(file, `species ${key}`, `already defined in ${prev}; give other compilations as "alternatives"`);
      }
      seen.set(key, file);
      all.push(deepFreeze(sp));
    }
  }
  cache.set(folder, all);
  return [...all];
}

/** Forgets cached libraries (for tests and for tools that edit species files). */
export function clearLibraryCache(): void {
  cache.clear();
}

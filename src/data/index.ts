/** Species data: the built-in library (species/*.json) and standard entropies of the elements. */
export {
  loadLibrary,
  clearLibraryCache,
  defaultSpeciesDir,
  validateSpeciesFile,
  findSpecies,
  findAllSpecies,
  speciesFor,
  pickAlternative,
  speciesCitations,
  LibraryError,
  VALUE_KEYS,
} from './library.js';
export type {
  SpeciesValues,
  ValueKey,
  SpeciesAlternative,
  SpeciesRecord,
  SpeciesFile,
  LibrarySpecies,
  SpeciesForOptions,
} from './library.js';
export { speciesForElements } from './alloy-species.js';
export { elementEntropy, elementsWithEntropy, ELEMENT_ENTROPY_SOURCE } from './element-entropies.js';

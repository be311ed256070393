/**
 * The species library's types: a species file as written (SpeciesFile, SpeciesRecord, alternatives,
 * the value keys) and a species as loaded (LibrarySpecies, with provenance and composition), plus
 * the error a broken file raises. Units: ΔfG°, ΔfH° in kJ/mol; S°, Cp° in J/(mol·K); 298.15 K, 1 bar.
 * File format: see species/README.md and schema/species.schema.json; loading is in library.ts.
 */
import { EXIT, EphmapError, type ExitStatus } from '../errors.js';
import type { Phase } from '../model.js';
import type { CpPolynomialRecord, HkfRecord } from './parameter-blocks.js';

/** The thermodynamic values one compilation gives for a species. */
export interface SpeciesValues {
  /** Standard Gibbs energy of formation, kJ/mol (required). */
  dfG: number;
  /** Standard enthalpy of formation, kJ/mol. */
  dfH?: number;
  /** Standard (or conventional partial molar, for ions) entropy, J/(mol·K). */
  S?: number;
  /** Standard heat capacity, J/(mol·K). */
  Cp?: number;
}

export type ValueKey = keyof SpeciesValues;
export const VALUE_KEYS: readonly ValueKey[] = ['dfG', 'dfH', 'S', 'Cp'];

/** Another compilation's values for the same species (the main entry is the default). */
export interface SpeciesAlternative extends SpeciesValues {
  id: string;
  /** Key of the file's `sources` map. */
  source: string;
  sources?: Partial<Record<ValueKey, string>>;
  recalled?: boolean;
  uncertainty?: Partial<Record<ValueKey, number>>;
  note?: string;
}

/** One species entry exactly as written in a species file. */
export interface SpeciesRecord extends SpeciesValues {
  /** Formula in the canonical ASCII notation without phase tag, e.g. `Fe^2+`, `Fe(OH)2^+`, `HFeO2^-`. */
  formula: string;
  phase: Phase;
  name: string;
  /** Key of the file's `sources` map. */
  source: string;
  /** Per-value source overrides, e.g. { "Cp": "CODATA89" }. */
  sources?: Partial<Record<ValueKey, string>>;
  /** True where the values were recalled rather than read from the source. */
  recalled?: boolean;
  /** Standard uncertainties where the source gives them (kJ/mol or J/(mol·K)). */
  uncertainty?: Partial<Record<ValueKey, number>>;
  /** Excluded from systems unless metastable phases are asked for. */
  metastable?: boolean;
  /** Phase choice: enters a system only below this temperature (°C); treated as metastable at and above it. */
  stableBelow?: number;
  /** Phase choice: enters a system only at and above this temperature (°C); treated as metastable below it. */
  stableAbove?: number;
  alternatives?: SpeciesAlternative[];
  note?: string;
  aliases?: string[];
  /** Revised HKF parameters (aqueous species), tabulated units (see src/thermo/hkf.ts). */
  hkf?: HkfRecord;
  /** Maier–Kelley heat capacity a + bT + cT⁻², J/(mol·K) (solids, liquids, gases). */
  cpPolynomial?: CpPolynomialRecord;
}

/** A whole species file. */
export interface SpeciesFile {
  $schema?: string;
  element: string;
  sources: Record<string, string>;
  species: SpeciesRecord[];
}

/** A species of the loaded library: the file's fields plus where it came from and its composition. */
export interface LibrarySpecies extends SpeciesRecord {
  /** Basename of the file it came from, e.g. `Fe.json`. */
  file: string;
  /** Full citation of `source`, resolved from the file's `sources` map. */
  sourceText: string;
  /** Citation per value where `sources` overrides the main source. */
  valueSourceText?: Partial<Record<ValueKey, string>>;
  /** The file's whole `sources` map (used to resolve alternatives). */
  sourceMap: Readonly<Record<string, string>>;
  /** Element → atom count, from parseFormula. */
  elements: Record<string, number>;
  /** Charge number, from parseFormula. */
  charge: number;
  /** Id of the alternative whose values this copy carries (set by pickAlternative). */
  alternative?: string;
  /** From a file whose `element` is "mixed": enters only systems with several main elements. */
  mixed?: true;
}

/** A species file (or the library as a whole) breaks the format (input error, exit status 2). */
export class LibraryError extends EphmapError {
  readonly code = 'library';
  readonly exitStatus: ExitStatus = EXIT.input;
  readonly file: string;
  readonly field: string;
  constructor(file: string, field: string, message: string) {
    super(`species library ${file}: ${field}: ${message}`);
    this.name = 'LibraryError';
    this.file = file;
    this.field = field;
  }
}

/** The `element` of a file of compounds of several elements (see library.ts). */
export const MIXED_FILE_ELEMENT = 'mixed';

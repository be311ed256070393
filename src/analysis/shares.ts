/**
 * Data of the shares plot (composition mode): the share of the main element held by each form —
 * dissolved species and solids — along pH at a fixed potential, or along E at a fixed pH, from the
 * point solver (speciationProfile). share_i = ν_i·n_i / Σ_j ν_j·n_j, with ν the number of atoms
 * of the element in form i and n its amount (mol per kg of water); at a solved point the shares of
 * all forms sum to 1. Points the solver could not solve carry NaN shares and are listed in
 * `failed` (drawn as undetermined, never interpolated). Deterministic.
 */
import { compositionSetup } from '../diagram/composition-setup.js';
import { speciationProfile } from '../diagram/composition-profile.js';
import type { SystemSpec } from '../system/spec.js';
import { InputError } from '../system/errors.js';
import { KELVIN } from '../thermo/constants.js';
import type { GivenPotential } from './points.js';

export interface SharesData {
  element: string;
  along: 'pH' | 'E';
  /** The fixed coordinate: E in V vs SHE (along pH), or pH (along E). */
  at: number;
  /** The range swept (the file's pH or E domain). */
  range: [number, number];
  temperature: { celsius: number };
  /** The bath's totals, mol/kg of water, by component (element first). */
  totals: Record<string, number>;
  x: number[];
  /** Forms holding at least `minShare` of the element somewhere, largest peak first. */
  forms: { species: string; phase: string; share: number[] }[];
  /** Total dissolved element, mol/kg. */
  dissolved: number[];
  /** Indices of x where the point solver failed (shares NaN there). */
  failed: number[];
  warnings: string[];
  /** Along pH: the fixed potential as given against a reference electrode (`at` is its SHE value). */
  reference?: GivenPotential;
}

export interface SharesOptions {
  /** Points along the sweep (default 281: 0.05 pH steps over 0…14). */
  points?: number;
  /** Smallest peak share for a form to be listed (default 1e-3; 0 lists every form). */
  minShare?: number;
  /** The fixed potential as given against a reference electrode (kept with the data; `at` stays V vs SHE). */
  reference?: GivenPotential;
}

/**
 * Shares along pH at potential `at` (V vs SHE) or along E at pH `at`, over the file's domain.
 * Refuses a fixed-activity file (InputError naming `composition`): shares need the bath's totals.
 */
export function sharesData(spec: SystemSpec, along: 'pH' | 'E', at: number, opts: SharesOptions = {}): SharesData {
  if (!spec.composition) {
    throw new InputError(spec.file, 'composition', 'a composition-mode file (the shares of the element come from the totals of a bath: give composition, e.g. {Ag: 0.2, CN: 0.6})');
  }
  const setup = compositionSetup(spec);
  const range: [number, number] = along === 'pH' ? spec.pH : spec.E;
  const p = speciationProfile(setup, along, at, range, opts.points ?? 281, opts.minShare ?? 1e-3);
  const warnings = [...setup.warnings];
  if (p.failed.length) warnings.push(`shares: ${p.failed.length} of ${p.x.length} points could not be solved; they are undetermined (a gap in every line)`);
  return {
    element: spec.element,
    along,
    at,
    range,
    temperature: { celsius: Math.round((setup.built.input.kelvin - KELVIN) * 1e6) / 1e6 },
    totals: setup.totals,
    x: p.x,
    forms: p.forms,
    dissolved: p.dissolved,
    failed: p.failed,
    warnings,
    ...(opts.reference && along === 'pH' ? { reference: opts.reference } : {}),
  };
}

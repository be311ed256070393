/**
 * Solver input: everything already reduced to numbers at one temperature. Built by the system
 * loader (src/system/) from a system file and the species library; consumed by the solver only.
 */
import type { Phase } from '../model.js';

export interface SolverSpecies {
  /** Formula exactly as given by the user or the library. */
  formula: string;
  phase: Phase;
  name?: string;
  elements: Record<string, number>;
  charge: number;
  /** Apparent Gibbs energy at T, kJ/mol. */
  G: number;
  /** log10 of the activity (aq) or fugacity in bar (g); 0 for pure solids and liquids. */
  logActivity: number;
  /** Activity (aq) or pressure (g) as used, for reports. */
  activity?: number;
  /** log10 γ applied (aq), for reports. */
  logGamma?: number;
  /** Molality (mol/kg) where the amount was given as a concentration. */
  molality?: number;
  source?: string;
  /** How G was carried from 25 °C to T (see src/system/carry.ts). */
  temperatureModel?: TemperatureModel;
  /** True where S° or the equation-of-state parameters were estimated rather than published. */
  estimated?: boolean;
}

/**
 * How a species' G was carried to T: 'iapws' (water), 'published' or 'estimated' (HKF parameters),
 * 'cp-polynomial', 'constant-cp', 'constant-h-s', 'constant-g' (user override), 'tabulated' (only
 * ΔfG° given, used as is at 25 °C, 1 atm), 'undetermined' (only ΔfG° given, away from 25 °C).
 */
export type TemperatureModel = 'iapws' | 'published' | 'estimated' | 'cp-polynomial' | 'constant-cp' | 'constant-h-s' | 'constant-g' | 'tabulated' | 'undetermined';

export interface LigandInput {
  element: string;
  /** Total activity of the ligand's dissolved species. */
  activity: number;
  /** The ligand's own species (contain the ligand, not the main element). */
  species: SolverSpecies[];
}

export interface SolverInput {
  element: string;
  kelvin: number;
  /** Main-element species. */
  species: SolverSpecies[];
  /** Ligands in solving order: a ligand's species may contain earlier ligands. */
  ligands: LigandInput[];
  /** Apparent G at T (kJ/mol) of H2O(l), H2(g), O2(g). */
  water: { H2O: number; H2: number; O2: number };
  /** Gas pressures for the water lines, bar. */
  pressures: { H2: number; O2: number };
  /** log10 activity of water (0 for pure water). */
  logWaterActivity?: number;
  pH: [number, number];
  E: [number, number];
}

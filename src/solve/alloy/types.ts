/**
 * Input of the alloy point solver (DEVELOPERS.md, "Alloys"; issue 18): like the single-element SolverInput, but
 * with several main elements and the bulk composition (mole fractions) of the alloy. Built by
 * src/system/alloy-build.ts; consumed by src/solve/alloy only.
 */
import type { LigandInput, SolverInput, SolverSpecies } from '../types.js';

export interface AlloyInput {
  /** Main element → mole fraction in the alloy (> 0, summing to 1), in the order given. */
  composition: Record<string, number>;
  kelvin: number;
  /** Every species holding at least one main element (single-element and mixed compounds). */
  species: SolverSpecies[];
  /** Ligands in solving order, as for one element. */
  ligands: LigandInput[];
  water: SolverInput['water'];
  pressures: SolverInput['pressures'];
  logWaterActivity?: number;
  pH: [number, number];
  E: [number, number];
}

/** The main elements in the order of the composition. */
export function mainElements(input: Pick<AlloyInput, 'composition'>): string[] {
  return Object.keys(input.composition);
}

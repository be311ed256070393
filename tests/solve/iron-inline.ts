/**
 * Seven iron species with inline data, shared by the solver tests.
 * Source: Wagman D.D. et al. (1982) The NBS tables of chemical thermodynamic properties, J. Phys.
 * Chem. Ref. Data 11, Suppl. 2 — values recalled from memory (not read from the tables).
 * ΔfG°, ΔfH° in kJ/mol; S°, Cp° in J/(mol·K).
 */
export const IRON = [
  { formula: 'Fe', phase: 's', dfG: 0, dfH: 0, S: 27.28, Cp: 25.1 },
  { formula: 'Fe+2', phase: 'aq', dfG: -78.9, dfH: -89.1, S: -137.7 },
  { formula: 'Fe+3', phase: 'aq', dfG: -4.7, dfH: -48.5, S: -315.9 },
  { formula: 'Fe3O4', phase: 's', dfG: -1015.4, dfH: -1118.4, S: 146.4, Cp: 143.43 },
  { formula: 'Fe2O3', phase: 's', dfG: -742.2, dfH: -824.2, S: 87.4, Cp: 103.85 },
  { formula: 'HFeO2-', phase: 'aq', dfG: -377.7 }, // ΔfG° only: usable at 25 °C only
  { formula: 'FeOH+2', phase: 'aq', dfG: -229.41, dfH: -290.8, S: -142.0 },
] as const;

/** Water data: same source (recalled from memory); see also the project's water-facts. */
export const WATER = {
  H2O: { dfG: -237.129, dfH: -285.83, S: 69.91, Cp: 75.291 },
  H2: { dfG: 0, dfH: 0, S: 130.684, Cp: 28.824 },
  O2: { dfG: 0, dfH: 0, S: 205.138, Cp: 29.355 },
};

/**
 * Default species of a ligand when the library supplies them.
 *
 * Ammonia and cyanide are thermodynamically unstable against N2, nitrate, CO2 across most of the
 * water window, yet they persist in baths and streams for the life of the process (their redox
 * reactions are slow). Common practice is to draw complexant diagrams with the ligand confined to its
 * acid–base family; ephmap does the same by default. Sulfur and chlorine keep their redox species,
 * since sulfide/sulfate and chloride/hypochlorite changes are part of what users need to see.
 * A system file may set `ligandSpecies: {N: all}` or list formulas to override.
 */
export const LIGAND_DEFAULTS: Record<string, { species: string[]; why: string }> = {
  N: { species: ['NH4^+', 'NH3'], why: 'ammonia family only (oxidation to N2 or nitrate is slow); set ligandSpecies.N: all to include them' },
  C: { species: ['CO2', 'HCO3^-', 'CO3^2-'], why: 'carbonate family only (reduction to carbon or methane is slow); set ligandSpecies.C: all to include them' },
  CN: { species: ['HCN', 'CN^-'], why: 'cyanide family only (oxidation to cyanate, CO2 and N2 is slow); set ligandSpecies.CN: all to include them' },
};

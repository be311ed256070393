/**
 * `window` in composition mode (the bath as made up): the plating window read off the
 * composition diagram — pH ranges where a dissolved form holding the element lies directly above
 * the metal's region, the metal/dissolved boundary (the refined curve, equal shares of metal and
 * that form) as the deposition potential, and its margin to the hydrogen line. Steps: 1. the
 * composition model (computeComposition: grid, traced regions, refined boundaries); 2. the window
 * rule of analysis/window.ts on its regions (E_dep linear between refined vertices, each within
 * 0.1 mV of the true boundary; within two cells of a triple point, where region rings stop short,
 * the metal's ring top); 3. the basis stated in the
 * notes. Example (tests/analysis/composition-window.test.ts): 0.2 mol/kg Ag with 0.6 mol/kg CN
 * plates from Ag(CN)₂⁻/Ag(CN)₃²⁻ over pH 4.3–14 with E_dep ≈ −0.36 V at pH 12.
 */
import { computeComposition, type ComputedComposition } from '../diagram/composition.js';
import type { SystemSpec } from '../system/spec.js';
import { platingWindow, type WindowResult } from './window.js';

export interface CompositionWindowResult extends WindowResult {
  mode: 'composition';
  basis: 'the bath as made up';
  /** Totals of the file, mol/kg, by component (the element first). */
  totals: Record<string, number>;
}

export function compositionWindow(spec: SystemSpec): { computed: ComputedComposition; result: CompositionWindowResult } {
  // Step 1: the composition diagram.
  const computed = computeComposition(spec);
  // Step 2: the window on its regions.
  // Region rings stop up to a cell or two short of a triple point (trace/junctions.ts), so the
  // metal's top and the next region's lower edge may lie that far apart there.
  const cellE = (spec.E[1] - spec.E[0]) / (computed.grid.ny - 1);
  const w = platingWindow(computed.model, 2 * cellE);
  // Step 3: the basis.
  const notes = [
    'The bath as made up: regions from the full speciation of the totals (free ligand from the mass balances, solids allowed to precipitate); E_dep is where the metal and the dissolved form hold equal shares of the element.',
    `Composition mode: window ends are read from the traced regions, to within one grid cell (${((spec.pH[1] - spec.pH[0]) / (computed.grid.nx - 1)).toPrecision(2)} pH); raise grid for finer ends.`,
    ...w.notes,
  ];
  return { computed, result: { ...w, notes, mode: 'composition', basis: 'the bath as made up', totals: computed.setup.totals } };
}

/**
 * The amounts a system file gives (the element's and each ligand's), as given and as molality, so
 * that captions, headers and reports can state exactly what was computed with its unit.
 * Conversion: mg/L → mol/kg by m = c / (1000·M) · (1000 / ρ) with M the molar mass (g/mol) of the
 * element, the ligand or the "as" formula and ρ the density of water at T (kg/m³)
 * (`molality` in ./solution.ts); e.g. 60 mg/L Cl at 25 °C → 1.695e-3 mol/kg.
 */
import type { GivenAmount } from '../model.js';
import { type Amount, molality } from './solution.js';
import type { SystemSpec } from './spec.js';

function given(a: Amount & { isDefault?: boolean }, formula: string, density: number): GivenAmount {
  const out: GivenAmount = { kind: a.kind, value: a.value };
  if (a.as) out.as = a.as;
  if (a.kind !== 'activity') out.molality = molality(a, formula, density);
  if (a.isDefault) out.isDefault = true;
  return out;
}

export function givenAmounts(spec: SystemSpec, densityKgM3: number): { element: GivenAmount; ligands: Record<string, GivenAmount> } {
  const ligands: Record<string, GivenAmount> = {};
  for (const [k, a] of Object.entries(spec.ligandAmounts)) ligands[k] = given(a, k, densityKgM3);
  return { element: given(spec.amount, spec.element, densityKgM3), ligands };
}

/** The number a model's `activity` / `ligands` carries: the activity, or the molality. */
export function amountNumber(a: GivenAmount): number {
  return a.molality ?? a.value;
}

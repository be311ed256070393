/**
 * The `solubilityLevels` key (composition mode): the user's own iso-solubility levels, total
 * dissolved main element in mol/kg of water, drawn besides the default decades 10⁻⁸ … 10⁻².
 * At most 12 levels, each from 10⁻¹² to 10 mol/kg; refused outside composition mode, where the
 * dissolved amount is fixed by the file and there is nothing to contour.
 */
import type { Fields } from './fields.js';

/** Most user levels a file may give (each is one more traced contour set). */
export const MAX_SOLUBILITY_LEVELS = 12;

export function readSolubilityLevels(f: Fields, v: unknown, compositionMode: boolean): number[] | undefined {
  if (v === undefined) return undefined;
  if (!compositionMode) f.fail('solubilityLevels', 'no solubilityLevels outside composition mode (iso-solubility lines are drawn for a bath given by its composition key)');
  const items = f.list(v, 'solubilityLevels', MAX_SOLUBILITY_LEVELS);
  return items.map((x, k) => f.number(x, `solubilityLevels[${k}]`, { min: 1e-12, max: 10 }));
}

/**
 * Heading of the plating window in composition mode: the totals, stated as the bath as made up.
 * Computes nothing.
 */
import type { CompositionWindowResult } from '../analysis/composition-window.js';
import type { ScaledWindowResult } from '../analysis/window-scale.js';
import { windowScaleText } from './window-text.js';

/** "Plating window for Ag at 25 °C, the bath as made up (totals Ag 0.2, CN 0.6 mol/kg); potentials in V vs SHE." */
export function compositionWindowHeading(r: CompositionWindowResult, ref?: ScaledWindowResult['reference']): string {
  const totals = Object.entries(r.totals).map(([c, v]) => `${c} ${Number(v.toPrecision(6))}`).join(', ');
  return `Plating window for ${r.element} at ${r.temperature.celsius} °C, the bath as made up (totals ${totals} mol/kg); ${windowScaleText(ref, r.temperature.celsius)}`;
}

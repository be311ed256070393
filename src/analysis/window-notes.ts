/**
 * The plating window's notes, each true of the result it is given: the margin to hydrogen as it is
 * (positive, negative or changing sign, with the pH where it does), and, where there is no window,
 * why — what lies directly above the metal across the pH range, or that the metal has no field.
 */
import type { PlatingWindow } from './window.js';

/** What lies directly above the metal over a pH run (species null: nothing, metal at the top). */
export interface AboveRun {
  pH: [number, number];
  species: string | null;
  class: string | null;
}

const f2 = (x: number) => x.toFixed(2);
const v3 = (x: number) => `${x >= 0 ? '+' : ''}${x.toFixed(3)} V`;

/** pH values where the margin E_dep − E(H2) changes sign (linear between the deposition points). */
export function marginZeros(w: PlatingWindow, eH2: (pH: number) => number): number[] {
  const m = w.deposition.map((p) => p.E - eH2(p.pH));
  const out: number[] = [];
  for (let k = 0; k + 1 < m.length; k++) {
    if ((m[k] < 0 && m[k + 1] > 0) || (m[k] > 0 && m[k + 1] < 0)) {
      const t = m[k] / (m[k] - m[k + 1]);
      out.push(w.deposition[k].pH + t * (w.deposition[k + 1].pH - w.deposition[k].pH));
    }
  }
  return out;
}

/** One note per window on its margin to the hydrogen line, stating what is true of it. */
export function marginNote(w: PlatingWindow, zeros: number[]): string {
  const span = `pH ${f2(w.pH[0])}–${f2(w.pH[1])}`;
  const { min, max } = w.marginToHydrogen;
  if (min > 0) return `${span}: E_dep lies above the hydrogen line (margin ${v3(min)} to ${v3(max)}): the metal deposits before hydrogen evolves at equilibrium.`;
  if (max < 0) {
    return `${span}: E_dep lies below the hydrogen line everywhere (margin ${v3(min)} to ${v3(max)}): hydrogen evolves first at equilibrium; deposition relies on the hydrogen overpotential on the metal (not included).`;
  }
  return `${span}: E_dep crosses the hydrogen line at pH ${zeros.map(f2).join(', ')} (margin ${v3(min)} to ${v3(max)}): the metal deposits before hydrogen only where the margin is positive.`;
}

/** Why there is no window: what borders the metal from above across the diagram. */
export function noWindowNote(element: string, runs: AboveRun[]): string {
  if (!runs.length) return `No window: ${element} has no field in the diagram (the metal is stable nowhere in this pH and E range), so there is nothing to deposit onto.`;
  const parts = runs.map((r) => `${r.species ? `${r.species} (${r.class})` : 'nothing (the metal reaches the top of the diagram)'} at pH ${f2(r.pH[0])}–${f2(r.pH[1])}`);
  return `No window: directly above ${element} lies ${parts.join('; ')} — no dissolved form of ${element} borders the metal, so the metal would not stay dissolved down to its deposition potential.`;
}

export const WINDOW_DEFINITION =
  'Window: a dissolved species of the element lies directly above the metal, so the bath keeps the metal in solution and deposits it below E_dep; margin = E_dep − E(H2(g)/H+) at the same pH, overpotentials not included.';

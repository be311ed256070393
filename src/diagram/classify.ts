/**
 * Region classes: the element itself (immunity), solid compounds (passivation), dissolved species
 * (corrosion), and gases.
 */
import type { Phase, RegionClass } from '../model.js';

export function classify(element: string, sp: { elements: Record<string, number>; charge: number; phase: Phase }): RegionClass {
  if (sp.phase === 'aq') return 'dissolved';
  if (sp.phase === 'g') return 'gas';
  const els = Object.keys(sp.elements);
  if (els.length === 1 && els[0] === element && sp.charge === 0) return 'element';
  return 'solid';
}

/**
 * Test helper: the predominant main-element species of a library system at one (pH, E), 25 °C,
 * evaluated exactly from the ψ planes (src/solve/probe.ts). Not a test file itself.
 */
import { computeFile } from '../../src/pipeline.js';
import { psiAt } from '../../src/solve/point.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const cache = new Map<string, ReturnType<typeof computeFile>>();

/**
 * Formula of the predominant species; a neutral dissolved species gets "(aq)" appended so that it
 * cannot be mistaken for the solid of the same formula. `extra` adds system-file keys (ligands, ...).
 */
export function predominantAt(element: string, activity: number, pH: number, E: number, extra: Record<string, unknown> = {}): string {
  const spec = { element, activity, pH: [0, 14], E: [-2, 2.2], ...extra };
  const key = JSON.stringify(spec);
  let c = cache.get(key);
  if (!c) {
    c = computeFile(writeTmp(tmpDir(), `${element}.json`, key));
    cache.set(key, c);
  }
  const { psi } = psiAt(c.built.input, pH, E);
  const k = psi.indexOf(Math.min(...psi));
  const sp = c.built.input.species[k]!;
  return sp.phase === 'aq' && sp.charge === 0 ? `${sp.formula}(aq)` : sp.formula;
}

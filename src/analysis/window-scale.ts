/**
 * The plating window on a reference electrode's scale: the deposition potentials of a
 * WindowResult (V vs SHE at the diagram temperature) also given against the electrode the user
 * measures with — the file's `reference:` or `--ref` — as E_ref = E_SHE − offset(T, pH), the offset
 * taken at each deposition point's own pH (only the reversible hydrogen electrode depends on it).
 * Margins to the hydrogen line are differences of potentials and do not change. Data, no text.
 * Example (tests/answers/window-reference.test.ts): E_dep = −0.500 V vs SHE at 25 °C is
 * −0.741 V vs SCE (offset +0.241 V, common practice).
 */
import type { CustomReference } from '../thermo/reference.js';
import { referenceOffset } from '../thermo/reference.js';
import { InputError } from '../system/errors.js';
import type { PlatingWindow, WindowResult } from './window.js';

/** A deposition point with its potential on the reference scale too. */
export interface ScaledDeposition {
  pH: number;
  /** V vs SHE. */
  E: number;
  /** V vs the reference electrode. */
  Eref: number;
}

export interface ScaledWindow extends Omit<PlatingWindow, 'deposition'> {
  deposition: ScaledDeposition[];
}

/** The window result with the scale it is also printed on. */
export interface ScaledWindowResult extends Omit<WindowResult, 'windows'> {
  windows: ScaledWindow[];
  /** The electrode (label e.g. "SCE"); offset E_SHE − E_ref in V, absent for the RHE (pH-dependent). */
  reference: { id: string; label: string; offset?: number };
}

/**
 * `r` with every deposition potential also against `ref` at `celsius`; the electrode's warnings
 * (e.g. outside the range of its temperature formula) are added to r.warnings, each once. `file`
 * and `field` name where the electrode came from, for the InputError of an unusable one.
 */
export function windowOnScale<R extends WindowResult>(r: R, ref: string | CustomReference, celsius: number, file: string, field: string): Omit<R, 'windows'> & ScaledWindowResult {
  const at = (pH: number) => {
    try {
      return referenceOffset(ref, celsius, pH);
    } catch (e) {
      throw new InputError(file, field, (e as Error).message);
    }
  };
  const id = typeof ref === 'string' ? ref : 'custom';
  // Step 1: the electrode at a neutral pH gives the label, offset and warnings (pH matters for the RHE only).
  const probe = at(7);
  const warnings = [...r.warnings];
  for (const w of probe.warnings) if (!warnings.includes(w)) warnings.push(w);
  // Step 2: each deposition point on the electrode's scale at its own pH.
  const windows = r.windows.map((w) => ({ ...w, deposition: w.deposition.map((p) => ({ pH: p.pH, E: p.E, Eref: p.E - at(p.pH).offset })) }));
  const reference = id === 'rhe' ? { id, label: 'RHE' } : { id, label: probe.label, offset: probe.offset };
  return { ...r, windows, warnings, reference };
}

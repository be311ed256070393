/**
 * Answers for logged series on an alloy file (issue 18), one row at a time, each equal to the
 * assemblage, verdict and dissolving elements of `probe --ph --potential` on the same alloy file
 * at the same point and temperature (margins are left out: a row answers where the point is, not
 * how far the next assemblage lies).
 *
 * Steps per row:
 *  1. the row's temperature (the file's own when the row has none) picks the alloy input
 *     (buildAlloySystem) from a bounded cache, so it is built once per distinct temperature; a
 *     temperature at which it cannot be built is remembered and every row at it gets that error;
 *  2. the potential goes to the SHE scale at that temperature (and the row's pH, for the RHE);
 *  3. the assemblage at the point by the exact LP (assemblageAt).
 */
import { type Assemblage, assemblageAt } from '../solve/alloy/assemblage.js';
import { isDissolved, memberText } from '../solve/alloy/member.js';
import type { AlloySpec } from '../system/alloy-spec.js';
import { type BuiltAlloy, buildAlloySystem } from '../system/alloy-build.js';
import type { CustomReference } from '../thermo/reference.js';
import type { PointQuery } from './points-answer.js';
import { conditionCache, orError, rowOnShe } from './row-conditions.js';

export interface AlloyPointResult {
  /** On the SHE scale at the row's temperature, V. */
  E: number;
  celsius: number;
  /** The members as in the figure's labels (a neutral dissolved one tagged "(aq)"), in label order. */
  members: { name: string; dissolved: boolean; amount: number }[];
  label: string;
  verdict: Assemblage['verdict'];
  dissolving: string[];
  /** Species that tie with the assemblage here (the point lies on a boundary). */
  ties: string[];
}

export type AlloyPointAnswer = { scale: string; result: AlloyPointResult; warnings: string[] } | { error: string };

type Built = { built: BuiltAlloy } | { error: string };

export function alloyPointsAnswerer(spec: AlloySpec, ref: string | CustomReference | undefined, file: string): { answer: (q: PointQuery) => AlloyPointAnswer } {
  // Step 1.
  const builtAt = conditionCache((celsius: number): Built => {
    const r = orError(() => buildAlloySystem({ ...spec, base: { ...spec.base, temperature: celsius } }));
    return 'value' in r ? { built: r.value } : r;
  });
  const answer = (q: PointQuery): AlloyPointAnswer => {
    const T = q.temperature ?? spec.base.temperature;
    const b = builtAt(T);
    if ('error' in b) return { error: `line ${q.line}: ${b.error}` };
    // Step 2.
    const she = rowOnShe(ref, q, T, file);
    if ('error' in she) return she;
    const s = she.value;
    // Step 3.
    const input = b.built.input;
    const a = assemblageAt(input, q.pH, s.E);
    const members = a.phases.map((p) => ({ name: memberText(input.species[p.index]), dissolved: isDissolved(input.species[p.index]), amount: p.amount }));
    const result: AlloyPointResult = { E: s.E, celsius: T, members, label: a.label, verdict: a.verdict, dissolving: a.dissolving, ties: a.ties };
    return { scale: s.ref?.label ?? 'SHE', result, warnings: [...b.built.warnings, ...s.warnings] };
  };
  return { answer };
}

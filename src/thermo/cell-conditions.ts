/**
 * The `cell` reaction at given activities (and gas pressures): the reaction quotient and the
 * resulting ΔrG and potential.
 *
 *   log Q = Σ ν_i log10 a_i   over the species as written (products positive; electrons excluded;
 *           pure solids and liquids, and species not given, at a = 1; gases: fugacity in bar)
 *   ΔrG = ΔrG° + R·T·ln10·log Q                     (kJ/mol)
 *   half-reaction (SHE completion at unit activities): E = −ΔrG_red/(nF) (Nernst equation)
 *   full reaction: signed voltage −ΔrG/(nF); no-electron reaction: ΔrG only.
 * Worked example (test): Cu²⁺ + 2e⁻ = Cu(s) at a(Cu²⁺) = 1e-6, 25 °C: E = E° − (0.05916/2)·6
 * = E° − 0.1775 V. Reference: the Nernst equation, any physical-chemistry text.
 */
import { formulaForJson } from '../chem/present.js';
import { parseFormula } from '../chem/formula.js';
import { ReactionError, type Term } from '../chem/reaction-parse.js';
import { F, KELVIN, LN10, R } from './constants.js';

export interface AtConditions {
  /** The activities (pressures, bar, for gases) used, by species in the canonical form (Fe^2+). */
  activities: Record<string, number>;
  logQ: number;
  /** kJ/mol, the reaction as written. */
  deltaG: number;
  /** V: electrode potential vs SHE (half-reaction, reduction direction), signed voltage −ΔrG/(nF) (full), null (no electrons). */
  potential: number | null;
}

const PHASE_TAG = /^(.*?)\((s|l|g|aq)\)$/;

/** Does the user's key (formula with an optional phase tag, any accepted notation) name this term? */
function names(key: string, t: Term): boolean {
  const m = key.trim().match(PHASE_TAG);
  const formula = m ? m[1]! : key.trim();
  const phase = m ? m[2] : undefined;
  let f;
  try {
    f = parseFormula(formula);
  } catch {
    return false;
  }
  if (f.charge !== t.charge) return false;
  const a = Object.entries(f.elements).filter(([, n]) => n).sort();
  const b = Object.entries(t.elements).filter(([, n]) => n).sort();
  if (JSON.stringify(a) !== JSON.stringify(b)) return false;
  return phase === undefined || t.phase === undefined || phase === t.phase;
}

/**
 * The reaction at the given activities (see module comment). `dG0` is ΔrG° at T of the reaction as
 * written (half-reactions completed with the SHE); `sense` +1 for a reduction as written, −1 for an
 * oxidation; n = 0 for a reaction without electron transfer.
 */
export function atConditions(
  reaction: string,
  terms: readonly Term[],
  given: Readonly<Record<string, number>>,
  dG0: number,
  celsius: number,
  kind: 'half' | 'full' | 'chemical',
  n: number,
  sense: 1 | -1,
): AtConditions {
  const used: Record<string, number> = {};
  let logQ = 0;
  for (const [key, a] of Object.entries(given)) {
    if (!(a > 0) || !Number.isFinite(a)) throw new ReactionError(reaction, 'a positive activity or pressure (bar)', `${key}=${a}`, 'activity');
    const hit = terms.filter((t) => !t.electron && names(key, t));
    if (!hit.length) throw new ReactionError(reaction, 'a species of the reaction', JSON.stringify(key), 'activity');
    for (const t of hit) logQ += t.side * t.coefficient * Math.log10(a);
    used[formulaForJson(key)] = a;
  }
  const T = celsius + KELVIN;
  const deltaG = dG0 + (R * T * LN10 * logQ) / 1000;
  const nF = (n * F) / 1000;
  const potential = kind === 'half' ? (-sense * deltaG) / nF : kind === 'full' ? -deltaG / nF : null;
  return { activities: used, logQ, deltaG, potential };
}

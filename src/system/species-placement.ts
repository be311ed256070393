/**
 * Where a species stands in a system being built (build.ts): its element counts with ligand groups
 * as whole units, the checks that it belongs to the system, which component it carries (the main
 * element or a ligand), and its activity from the amount the system file gives for it.
 */
import { InputError } from './errors.js';
import type { ResolvedSpecies } from './build.js';
import type { SystemSpec } from './spec.js';
import type { Amount } from './solution.js';

/**
 * Element counts with each group ligand (e.g. CN → {C: 1, N: 1}) replaced by its own count, or null
 * when a species holds a group's elements in other proportions (not whole units of the group).
 */
export function groupElements(elements: Record<string, number>, groups: Record<string, Record<string, number>>): Record<string, number> | null {
  const out: Record<string, number> = { ...elements };
  for (const [key, comp] of Object.entries(groups)) {
    const els = Object.keys(comp);
    if (els.length === 1 && els[0] === key) continue;
    const present = els.filter((e) => (out[e] ?? 0) > 0);
    if (present.length === 0) continue;
    const k = (out[els[0]] ?? 0) / comp[els[0]];
    if (!(k > 0) || !els.every((e) => Math.abs((out[e] ?? 0) - k * comp[e]) < 1e-9)) return null;
    for (const e of els) delete out[e];
    out[key] = k;
  }
  return out;
}

/**
 * Checks that a species belongs to the system (only the main element, the ligands, H and O; ligand
 * groups in whole units; the main element or a ligand present) and tells which it carries: the main
 * element, else the last ligand it contains.
 */
export function placeSpecies(spec: SystemSpec, s0: ResolvedSpecies, allowed: Set<string>, groupEls: Set<string>, ligandEls: string[]): { s: ResolvedSpecies; hasMain: boolean; lig: string | undefined } {
  const grouped = groupElements(s0.f.elements, spec.ligandGroups);
  if (!grouped) {
    const g = Object.keys(spec.ligandGroups).find((k) => Object.keys(spec.ligandGroups[k]).some((e) => s0.f.elements[e]));
    throw new InputError(spec.file, `${s0.field} (${s0.formula})`, `whole units of the ligand group ${g}`);
  }
  const s: ResolvedSpecies = { ...s0, f: { ...s0.f, elements: grouped } };
  const els = Object.keys(s.f.elements);
  const bad = els.find((e) => !allowed.has(e));
  if (bad && groupEls.has(bad)) {
    throw new InputError(spec.file, `${s.field} (${s.formula})`, `whole units of a ligand group (${Object.keys(spec.ligandGroups).filter((k) => spec.ligandGroups[k][bad]).join(', ')})`);
  }
  if (bad) {
    throw new InputError(spec.file, `${s.field} (${s.formula})`, `only ${[...allowed].join(', ')} (add ${bad} under ligands to use it)`, `element ${bad}`);
  }
  const hasMain = (s.f.elements[spec.element] ?? 0) > 0;
  const lig = [...ligandEls].reverse().find((L) => (s.f.elements[L] ?? 0) > 0);
  if (!hasMain && !lig) {
    throw new InputError(spec.file, `${s.field} (${s.formula})`, `a species containing ${spec.element}${ligandEls.length ? ` or a ligand (${ligandEls.join(', ')})` : ''}`);
  }
  return { s, hasMain, lig };
}

/** Activity (log10 too) and, where dissolved, log γ and molality of a species from the amount given for it. */
export function speciesActivity(
  spec: SystemSpec,
  s: ResolvedSpecies,
  hasMain: boolean,
  lig: string | undefined,
  dissolved: (a: Amount & { isDefault?: boolean }, z: number, asFormula: string) => { act: number; logGamma: number; molality: number | undefined },
): { act: number | undefined; logA: number; lg: number | undefined; mol: number | undefined } {
  let act: number | undefined;
  let logA = 0;
  let lg: number | undefined;
  let mol: number | undefined;
  if (s.phase === 'aq') {
    const given: Amount & { isDefault?: boolean } =
      s.activity !== undefined
        ? { kind: 'activity', value: s.activity }
        : s.concentration ?? (hasMain ? spec.amount : spec.ligandAmounts[lig!]);
    const d = dissolved(given, s.f.charge, s.concentration ? s.formula : hasMain ? spec.element : lig!);
    act = d.act;
    lg = d.logGamma;
    mol = d.molality;
    logA = Math.log10(act);
  } else if (s.phase === 'g') {
    act = s.pressure ?? 1;
    logA = Math.log10(act);
  }
  return { act, logA, lg, mol };
}

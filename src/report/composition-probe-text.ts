/**
 * The composition-mode `probe` answer as plain text: the point, the verdict with the dissolved
 * total against the threshold, then the speciation table (molality, activity, share of the element
 * and of each ligand), the solids present, the free ligand and the saturation indices of the solids
 * not formed. A failed solve prints `status: failed` and no verdict. Computes nothing.
 */
import { formulaForPeople as fp, textForPeople } from '../chem/present.js';
import type { CompositionProbeResult } from '../analysis/composition-probe.js';

const g = (v: number) => (v === 0 ? '0' : Math.abs(v) >= 1e-3 && Math.abs(v) < 1e4 ? v.toPrecision(4) : v.toExponential(3));
const pct = (v: number | undefined) => (v === undefined ? '' : v < 1e-6 ? '< 0.0001 %' : `${(100 * v).toPrecision(4)} %`);

export function compositionProbeText(r: CompositionProbeResult): string {
  const where = r.reference
    ? `pH ${r.pH}, E ${r.reference.E} V vs ${r.reference.label} (= ${r.E.toFixed(4)} V vs SHE), ${r.temperature.celsius} °C`
    : `pH ${r.pH}, E ${r.E} V vs SHE, ${r.temperature.celsius} °C`;
  const totals = Object.entries(r.totals).map(([c, v]) => `${c} ${g(v)}`).join(', ');
  const lines = [`point: ${where}`, `composition (totals, mol/kg): ${totals} — the bath as made up`];
  if (r.status !== 'ok') {
    lines.push('status: failed — the speciation could not be solved at this point; verdict unknown');
    lines.push(`reason: ${textForPeople(r.reason ?? '')}`);
    return `${lines.join('\n')}\n`;
  }
  const side = r.dissolvedVsThreshold === 'above' ? 'above' : 'at or below';
  if (r.undetermined?.length) {
    lines.push(`verdict: UNKNOWN — ${textForPeople(r.reason ?? '')}`);
    lines.push(`largest share: ${fp(r.predominant ?? '')} (${r.class}); total dissolved ${g(r.dissolved!)} mol/kg, ${side} the corrosion threshold ${g(r.threshold)} mol/kg`);
  } else lines.push(`verdict: ${r.verdict.toUpperCase()} — ${fp(r.predominant ?? '')} holds the largest share of the element (${r.class}); total dissolved ${g(r.dissolved!)} mol/kg, ${side} the corrosion threshold ${g(r.threshold)} mol/kg`);
  // The speciation table: one row per dissolved species, then the solids.
  const comps = Object.keys(r.shares);
  // Shares label solids as 'formula(phase)', dissolved species by their formula.
  const shareOf = (c: string, label: string) => r.shares[c]?.find((x) => x.species === label)?.share;
  const head = ['species', 'molality', 'activity', ...comps.map((c) => `share of ${c}`)];
  const rows: string[][] = r.speciation.map((s) => [fp(s.species), g(s.molality), g(s.activity), ...comps.map((c) => pct(shareOf(c, s.species)))]);
  for (const s of r.solids) rows.push([`${fp(s.species)} (solid)`, `${g(s.amount)} mol/kg water`, '', ...comps.map((c) => pct(shareOf(c, `${s.species}(s)`) ?? shareOf(c, `${s.species}(l)`)))]);
  const w = head.map((h, k) => Math.max(h.length, ...rows.map((row) => row[k].length)));
  const fmt = (row: string[]) => row.map((v, k) => (k === 0 ? v.padEnd(w[k]) : v.padStart(w[k]))).join('  ').trimEnd();
  lines.push('', fmt(head), ...rows.map(fmt), '');
  lines.push(`solids present: ${r.solids.length ? r.solids.map((s) => fp(s.species)).join(', ') : 'none'}`);
  for (const [c, f] of Object.entries(r.freeLigand)) lines.push(`free ${c} (not bound to the element): ${g(f.molality)} mol/kg, mostly ${fp(f.form)}`);
  if (r.saturation.length) lines.push(`saturation indices of solids not formed (log10 SI): ${r.saturation.map((s) => `${fp(s.species)} ${s.logSI.toFixed(2)}`).join(', ')}`);
  lines.push(`ionic strength: ${g(r.ionicStrength!)} mol/kg, ${r.ionicStrengthFrom}; activity model: ${r.activityModel}`);
  lines.push('Equilibrium thermodynamics only — not kinetics; follow the applicable codes and a qualified corrosion professional.');
  return `${lines.join('\n')}\n`;
}

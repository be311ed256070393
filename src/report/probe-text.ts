/**
 * The `probe` answer as plain text for people: the point, the verdict, the runner-up and margin,
 * the distances (each with its definition) and each crossing. Computes nothing.
 */
import type { Crossing, ProbeResult } from '../analysis/probe.js';
import { formulaForPeople as fp, reactionForPeople, textForPeople } from '../chem/present.js';
import { adviceForPeople } from './people.js';
import { amountLabel } from './format.js';

const mv = (v: number) => `${v >= 0 ? '+' : ''}${(v * 1000).toFixed(1)} mV`;
const ph = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(3)} pH`;
const pair = (x: { between: [string, string] }) => x.between.map(fp).join(' / ');

/**
 * The runner-up for people: its formula, the margin, and the shift of E and of pH that closes it
 * (or why there is none) — "CuO (margin 7.691 kJ per mol of element; +0.674 pH at this potential; …)".
 * Also the reports' operating-point lines.
 */
export function runnerUpText(r: ProbeResult): string {
  if (!r.runnerUp) return 'none';
  const m = r.margin;
  const parts = [`margin ${m.kJPerMol.toFixed(3)} kJ per mol of element`];
  if (m.potentialV !== null) parts.push(`${mv(m.potentialV)} at this pH`);
  if (m.pH !== null) parts.push(`${ph(m.pH)} at this potential`);
  if (m.note) parts.push(m.note);
  return `${fp(r.runnerUp)} (${parts.map(textForPeople).join('; ')})`;
}

/** The runner-up line of the probe answer. */
function runnerUpLine(r: ProbeResult): string {
  return `runner-up: ${runnerUpText(r)}`;
}

/** The nearer of two crossings in one direction, named by its boundary. */
function nearer(a: Crossing | null, b: Crossing | null, fmt: (v: number) => string, dirA: string, dirB: string): string {
  const pick = a && b ? (Math.abs(a.shift) <= Math.abs(b.shift) ? a : b) : a ?? b;
  if (!pick) return 'no boundary in the diagram';
  return `${fmt(pick.shift)} to the boundary ${pick === a ? dirA : dirB} (${pair(pick)})`;
}

export function probeText(r: ProbeResult): string {
  const where = r.reference
    ? `pH ${r.pH}, E ${r.reference.E} V vs ${r.reference.label} (= ${r.E.toFixed(4)} V vs SHE), ${r.temperature.celsius} °C`
    : `pH ${r.pH}, E ${r.E} V vs SHE, ${r.temperature.celsius} °C`;
  const c = r.crossings;
  const lines = [
    `point: ${where}`,
    `verdict: ${r.verdict.toUpperCase()} — ${fp(r.predominant)} predominates (${r.class}; dissolved-species threshold ${amountLabel(r.amount, r.threshold, { ascii: true })})`,
    runnerUpLine(r),
    `vertical distance (change of E at this pH): ${nearer(c.raiseE, c.lowerE, mv, 'above', 'below')}`,
    `horizontal distance (change of pH at this potential): ${nearer(c.lowerPH, c.raisePH, ph, 'at lower pH', 'at higher pH')}`,
  ];
  for (const [name, x, unit] of [
    ['raise E', c.raiseE, 'V'],
    ['lower E', c.lowerE, 'V'],
    ['lower pH', c.lowerPH, 'pH'],
    ['raise pH', c.raisePH, 'pH'],
  ] as const) {
    if (x) lines.push(`  ${name.padEnd(8)} ${unit === 'V' ? mv(x.shift) : ph(x.shift)} → ${fp(x.to)} (${x.verdict}), across ${pair(x)}: ${reactionForPeople(x.reaction)}`);
  }
  lines.push(adviceForPeople(r));
  const nb = r.nearestBoundary;
  if (nb) {
    lines.push(
      `nearest boundary in the plane: ${pair(nb)}, ${nb.distance.value.toFixed(1)} mV away at pH ${nb.at.pH.toFixed(3)}, E ${nb.at.E.toFixed(4)} V vs SHE (${nb.distance.metric}): ${reactionForPeople(nb.reaction)} [${nb.equation}]`,
    );
  }
  if (r.warnings.length) lines.push('warnings:', ...r.warnings.map((w) => `  ${textForPeople(w)}`));
  lines.push('Equilibrium thermodynamics only — not kinetics; follow the applicable codes and a qualified corrosion professional.');
  return `${lines.join('\n')}\n`;
}

/**
 * The `probe` answer as plain text for people: the point, the verdict, the runner-up and margin,
 * the distances to the nearest boundary and each crossing. Computes nothing.
 */
import type { ProbeResult } from '../analysis/probe.js';

export function probeText(r: ProbeResult): string {
  const mv = (v: number) => `${v >= 0 ? '+' : ''}${(v * 1000).toFixed(1)} mV`;
  const ph = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(3)} pH`;
  const where = r.reference
    ? `pH ${r.pH}, E ${r.reference.E} V vs ${r.reference.label} (= ${r.E.toFixed(4)} V vs SHE), ${r.temperature.celsius} °C`
    : `pH ${r.pH}, E ${r.E} V vs SHE, ${r.temperature.celsius} °C`;
  const lines = [
    `point: ${where}`,
    `verdict: ${r.verdict.toUpperCase()} — ${r.predominant} predominates (${r.class}; dissolved-species threshold activity ${r.threshold})`,
    `runner-up: ${r.runnerUp ?? 'none'} (margin ${r.margin.kJPerMol.toFixed(3)} kJ per mol of element${r.margin.potentialV !== null ? `, ${mv(r.margin.potentialV)}` : ''})`,
    `distance to the nearest boundary: ${r.distance.mV === null ? 'none along E' : mv(r.distance.mV / 1000)} (at this pH); ${r.distance.pH === null ? 'none along pH' : ph(r.distance.pH)} (at this potential)`,
  ];
  const c = r.crossings;
  for (const [name, x, unit] of [
    ['raise E', c.raiseE, 'V'],
    ['lower E', c.lowerE, 'V'],
    ['lower pH', c.lowerPH, 'pH'],
    ['raise pH', c.raisePH, 'pH'],
  ] as const) {
    if (x) lines.push(`  ${name.padEnd(8)} ${unit === 'V' ? mv(x.shift) : ph(x.shift)} → ${x.to} (${x.verdict}): ${x.reaction}`);
  }
  lines.push(r.advice);
  if (r.nearestBoundary) lines.push(`nearest boundary: ${r.nearestBoundary.between.join(' / ')}: ${r.nearestBoundary.reaction} [${r.nearestBoundary.equation}]`);
  if (r.warnings.length) lines.push('warnings:', ...r.warnings.map((w) => `  ${w}`));
  lines.push('Equilibrium thermodynamics only — not kinetics; follow the applicable codes and a qualified corrosion professional.');
  return `${lines.join('\n')}\n`;
}

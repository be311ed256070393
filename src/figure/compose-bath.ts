/**
 * Caption of a composition-mode figure: the kind of diagram, the bath's totals with their units,
 * the ionic strength, gas pressures other than 1 bar, unsolved points and the data sources — so that a figure read without its
 * file still says that its regions come from full speciation of a bath as made up.
 */
import type { DiagramModel } from '../model.js';
import { fmtCelsius, shortSource } from '../report/format.js';

/** A total in mol/kg, three significant digits without trailing zeros: 0.2, 0.6, 1.5e-5. */
export function fmtTotal(v: number): string {
  return String(Number(v.toPrecision(3)));
}

/** Caption lines of a composition-mode model (kind, totals, water, sources). */
export function bathCaptionLines(m: DiagramModel): string[] {
  const comp = m.composition!;
  const names = Object.keys(comp.totals);
  const totals = names.map((k) => `${k} ${fmtTotal(comp.totals[k]!)} mol/kg`).join(', ');
  const ligands = names.filter((k) => k !== m.element);
  const p = m.waterLines.pressures;
  const gas = p.H2 !== 1 || p.O2 !== 1 ? `; p(H\u2082) = ${p.H2} bar, p(O\u2082) = ${p.O2} bar` : '';
  const lines = [`${m.element}\u2013H\u2082O${ligands.length ? `\u2013${ligands.join('\u2013')}` : ''}, ${fmtCelsius(m.temperature.celsius)} °C; composition: full speciation; ${totals} total${gas}.`];
  const bits: string[] = [];
  if (comp.ionicStrength === 'auto') bits.push('ionic strength from the speciation');
  else if (comp.ionicStrength > 0) bits.push(`ionic strength ${comp.ionicStrength.toPrecision(3)} mol/kg`);
  const w = m.water;
  if (w && (Number(w.temperatureC) >= 100 || w.pressurePath === 'user')) bits.push(`liquid water at ${Number(w.pressureMPa).toPrecision(3)} MPa`);
  if (w && m.temperature.celsius !== 25) bits.push(`neutral pH ${Number(w.neutralPH).toFixed(2)}`);
  if (comp.grid.failed > 0) bits.push(`${comp.grid.failed} of ${comp.grid.nx * comp.grid.ny} grid points unsolved (undetermined)`);
  if (bits.length) lines.push(`${bits.join('; ')}.`.replace(/^./, (ch) => ch.toUpperCase()));
  const short = m.sources.map(shortSource).filter((s, k, a) => a.indexOf(s) === k);
  if (short.length) lines.push(`Data: ${short.join('; ')}.`);
  return lines;
}

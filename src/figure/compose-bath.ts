/**
 * Caption of a composition-mode figure: the kind of diagram, the bath's totals with their units,
 * the ionic strength, gas pressures other than 1 bar, unsolved points and the data sources; and the
 * HTML page's share read-out grid — so that a figure read without its
 * file still says that its regions come from full speciation of a bath as made up.
 */
import type { ComputedComposition } from '../diagram/composition.js';
import type { DiagramModel } from '../model.js';
import type { ShareGrid } from '../render/share-grid.js';
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
  if (comp.heldBy?.length) bits.push(`no verdict where ${comp.heldBy.join(', ')} (ΔfG° only, G unknown at T) hold 1 % or more of ${m.element} (undetermined)`);
  if (comp.grid.failed > 0) bits.push(`${comp.grid.failed} of ${comp.grid.nx * comp.grid.ny} grid points unsolved (undetermined)`);
  if (bits.length) lines.push(`${bits.join('; ')}.`.replace(/^./, (ch) => ch.toUpperCase()));
  const short = m.sources.map(shortSource).filter((s, k, a) => a.indexOf(s) === k);
  if (short.length) lines.push(`Data: ${short.join('; ')}.`);
  return lines;
}

/**
 * The HTML read-out grid from the traced grid: every `step`-th node (step so that at most 81 nodes
 * lie along each axis; the range ends at the last node taken, so node positions are exact grid
 * nodes), with the predominant form, its share and log10 of the dissolved total.
 */
export function shareGrid(c: ComputedComposition): ShareGrid {
  const g = c.grid;
  const P = c.setup.solver.problem;
  const L = P.species.length;
  const step = Math.max(1, Math.ceil((Math.max(g.nx, g.ny) - 1) / 80));
  const nx = Math.floor((g.nx - 1) / step) + 1;
  const ny = Math.floor((g.ny - 1) / step) + 1;
  const r = (v: number, d: number): number => Number(v.toFixed(d));
  const label: number[] = [];
  const share: number[] = [];
  const logDissolved: (number | null)[] = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = i * step + j * step * g.nx;
      const lab = g.label[k]!;
      label.push(lab);
      share.push(lab < 0 ? 0 : r(g.scores[k * L + lab]!, 3));
      const v = g.value[k]!;
      logDissolved.push(lab < 0 || !Number.isFinite(v) ? null : r(v, 2));
    }
  }
  const dx = (g.x[1] - g.x[0]) / (g.nx - 1);
  const dy = (g.y[1] - g.y[0]) / (g.ny - 1);
  return {
    element: c.model.element,
    nx,
    ny,
    x: [g.x[0], r(g.x[0] + (nx - 1) * step * dx, 9)],
    y: [g.y[0], r(g.y[0] + (ny - 1) * step * dy, 9)],
    forms: P.species.map((s) => s.formula),
    label,
    share,
    logDissolved,
  };
}

/**
 * The shares plot as one output: its caption (kind, totals with units, the fixed coordinate, data
 * sources) and the scene rendered to SVG, PDF or PNG (PDF and PNG modules load lazily).
 */
import type { SharesData } from '../analysis/shares.js';
import { mmToPx } from '../render/options.js';
import { buildSharesScene, fixedPotentialText, type SharesFigureInput } from '../render/shares-scene.js';
import { sceneToSvg } from '../render/svg.js';
import { fmtCelsius } from '../report/format.js';
import type { SystemSpec } from '../system/spec.js';
import { fmtTotal } from './compose-bath.js';

export type SharesFormat = 'svg' | 'pdf' | 'png';

/** "Ag–H₂O–CN, 25 °C; composition: full speciation; Ag 0.2 mol/kg, CN 0.6 mol/kg total; E = −0.20 V vs SHE." */
export function sharesCaption(d: SharesData, spec: SystemSpec): string[] {
  const names = Object.keys(d.totals);
  const ligands = names.filter((k) => k !== d.element);
  const totals = names.map((k) => `${k} ${fmtTotal(d.totals[k]!)} mol/kg`).join(', ');
  const fixed = d.along === 'pH' ? `E = ${fixedPotentialText(d)}` : `pH ${d.at.toFixed(2)}`;
  const lines = [
    `${d.element}\u2013H\u2082O${ligands.length ? `\u2013${ligands.join('\u2013')}` : ''}, ${fmtCelsius(d.temperature.celsius)} °C; composition: full speciation; ${totals} total; ${fixed}. ` +
      `Share: fraction of all ${d.element} atoms held by each form, dissolved or solid.`,
  ];
  if (spec.composition?.autoIonicStrength) lines.push('Ionic strength from the speciation at each point.');
  return lines;
}

export async function renderShares(input: SharesFigureInput, format: SharesFormat): Promise<string | Uint8Array> {
  const scene = buildSharesScene(input);
  if (format === 'svg') return sceneToSvg(scene);
  if (format === 'pdf') {
    const { sceneToPdf } = await import('../render/pdf.js');
    return sceneToPdf(scene);
  }
  const { svgToPng } = await import('../render/png.js');
  return svgToPng(sceneToSvg(scene), Math.round(mmToPx(input.options.width, 300)));
}

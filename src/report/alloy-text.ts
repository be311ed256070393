/**
 * Text of the alloy outputs (issue 18): the probe read-out and the report (Markdown; HTML wraps the
 * same sections). Formulas are printed for people in Unicode (Fe²⁺, Fe₃O₄; chem/present.ts); an
 * assemblage label is a list of formulas joined by " + ".
 */
import type { AlloyOperating } from './alloy-operating.js';
import { envelopeText, REPORT_CAUTIONS, REPORT_CLOSING } from './report-data.js';
import type { AlloyProbe } from '../analysis/alloy-probe.js';
import type { DiagramModel } from '../model.js';
import { labelForPeople as fp, reactionForPeople, textForPeople } from '../chem/present.js';
import { fmtCelsius, fmtNum, mdCode, mdEsc, mdTable } from './format.js';
import { type LineRow, lineRows } from './lines.js';

export const VERDICT_WORDS: Record<AlloyProbe['verdict'], string> = {
  immune: 'immune (every element stays metal)',
  passive: 'passive (solid compounds, nothing dissolves)',
  corroding: 'corroding (the whole alloy dissolves)',
  'partly-corroding': 'partly corroding',
};

/** The verdict in words, naming the dissolving elements when some dissolve and some do not. */
export function verdictText(verdict: AlloyProbe['verdict'], dissolving: readonly string[]): string {
  if (verdict !== 'partly-corroding') return VERDICT_WORDS[verdict];
  return `partly corroding: ${dissolving.join(', ')} ${dissolving.length > 1 ? 'dissolve' : 'dissolves'}, the rest stays solid`;
}

/** "Cu 0.65, Zn(OH)2 (dissolved) 0.35": each member of a region's assemblage with its amount. */
export function memberAmounts(r: Pick<DiagramModel['regions'][number], 'assemblage'>): string {
  return (r.assemblage ?? []).map((p) => `${fp(p.species)}${p.dissolved ? ' (dissolved)' : ''} ${fmtNum(p.amount)}`).join(', ');
}

/** The sentence naming the reference electrode potentials are also given against. */
export function referenceNote(model: DiagramModel): string {
  const r = model.reference!;
  return `Potentials are also given against ${r.label} (E vs ${r.label} = E vs SHE − ${r.offset.toFixed(4)} V at ${fmtCelsius(model.temperature.celsius)} °C).`;
}

/** A line's equation vs SHE, and against the reference electrode when one is set. */
export function lineText(r: LineRow): string {
  return r.equationRef && r.equationRef !== r.equation ? `${r.equation}; ${r.equationRef}` : r.equation;
}

const DIR: Record<string, string> = { 'E+': 'more oxidising (E up)', 'E-': 'more reducing (E down)', 'pH+': 'more alkaline (pH up)', 'pH-': 'more acid (pH down)' };

export function alloyProbeText(r: AlloyProbe): string {
  const out = [
    r.reference ? `pH ${fmtNum(r.pH)}, E ${fmtNum(r.reference.E)} V vs ${r.reference.label} (= ${r.E.toFixed(4)} V vs SHE)` : `pH ${fmtNum(r.pH)}, E ${fmtNum(r.E)} V vs SHE`,
    `assemblage: ${fp(r.label)}${r.ties.length ? ` (on a boundary: ${r.ties.map(fp).join(', ')} could replace part of it)` : ''}`,
    `verdict: ${verdictText(r.verdict, r.dissolving)}`,
    'amounts (mol per mol of alloy atoms):',
    ...r.assemblage.map((p) => `  ${fp(p.name).padEnd(14)} ${p.amount.toFixed(6)}   ${p.dissolved ? 'dissolved, ' : ''}holds ${Object.entries(p.share).filter(([, v]) => v > 0).map(([e, v]) => `${(100 * v).toFixed(1)} % of ${e}`).join(', ')}`),
    'margins to the neighbouring assemblages:',
    ...r.margins.map((m) => `  ${DIR[m.direction].padEnd(24)} ${m.distance === null ? 'none within the diagram' : `${m.distance.toFixed(4)} ${m.direction.startsWith('E') ? 'V' : 'pH'} to ${fp(m.to ?? "")}`}`),
    'Equilibrium thermodynamics only — not kinetics or film quality, and pure phases (no solid-solution activities); follow the applicable codes and a qualified corrosion professional.',
  ];
  return `${out.join('\n')}\n`;
}

/** How envelopes and paths are answered (as in the one-element report). */
export const ENVELOPE_NOTE =
  'Each envelope is answered at its four corners and its centre, each path at its points (exactly, as for operating points); an assemblage crossed between samples is not reported here — see the figure.';

/** The report's sections as Markdown (the figure referenced by `svgName`). */
export function alloyReportMarkdown(model: DiagramModel, svgName: string | null, caption: string[], operating?: AlloyOperating): string {
  const a = model.alloy!;
  const parts: string[] = [`# Alloy ${mdEsc(model.element)} at ${fmtCelsius(model.temperature.celsius)} °C`, ''];
  if (svgName) parts.push(`![diagram](${svgName})`, '');
  parts.push(...caption.map(mdEsc), '');
  parts.push('## Composition', '', mdTable(['element', 'mole fraction', 'threshold activity of its dissolved species'], Object.keys(a.composition).map((e) => [e, fmtNum(a.composition[e]), fmtNum(a.activities[e])])), '');
  if (model.reference) parts.push(mdEsc(referenceNote(model)), '');
  parts.push('## Assemblages', '', mdTable(['assemblage', 'verdict', 'amounts (mol per mol of alloy atoms)', 'area (pH·V)'], model.regions.map((r) => [
    mdCode(fp(r.species)),
    mdEsc(verdictText(r.alloyVerdict!, r.dissolving ?? [])),
    mdEsc(memberAmounts(r)),
    fmtNum(r.area, 3),
  ])), '');
  if (operating?.points.length) {
    parts.push('## Operating points', '', mdTable(['point', 'pH', 'E as given', 'E / V vs SHE', 'assemblage', 'verdict'], operating.points.map((p) => [
      mdEsc(p.label), fmtNum(p.pH), `${fmtNum(p.Egiven)} V vs ${mdEsc(p.scale)}`, p.Eshe.toFixed(4), mdCode(p.assemblage), mdEsc(p.verdict),
    ])), '');
  }
  if (operating?.envelopes.length) parts.push('## Envelopes and paths', '', ENVELOPE_NOTE, '', ...operating.envelopes.map((e) => `- ${mdEsc(envelopeText(e))}`), '');
  parts.push('## Reactions between neighbouring assemblages', '', mdTable(['between', 'reaction', 'line'], lineRows(model, model.reference).map((r) => [mdEsc(r.between.map(fp).join(' | ')), mdCode(reactionForPeople(r.reaction)), mdCode(lineText(r))])), '');
  if (model.warnings.length) parts.push('## Warnings', '', ...model.warnings.map((w) => `- ${mdEsc(textForPeople(w))}`), '');
  parts.push('## What this diagram does not say', '',
    '- Phases are pure compounds: no solid-solution activities (a chromium-rich spinel film is not an ideal mixture of FeCr₂O₄ and Fe₃O₄), no alloy-metal activities below one.',
    '- Equilibrium only: no kinetics, film quality, breakdown or localized attack; a passive assemblage is a thermodynamic possibility, not a guarantee.',
    '', '## Cautions', '', ...REPORT_CAUTIONS.map(mdEsc), '', `**${mdEsc(REPORT_CLOSING)}**`,
    '', '## Sources', '', ...model.sources.map((s) => `- ${mdEsc(s)}`), '');
  return parts.join('\n');
}

/** The same report as one self-contained HTML page with the SVG inline. */
export function alloyReportHtml(model: DiagramModel, svg: string, caption: string[], operating?: AlloyOperating): string {
  const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
  const a = model.alloy!;
  const row = (cells: string[]) => `<tr>${cells.map((c) => `<td>${esc(c)}</td>`).join('')}</tr>`;
  return [
    '<!DOCTYPE html>', '<html lang="en"><head><meta charset="utf-8">', `<title>Alloy ${esc(model.element)}</title>`,
    '<style>body{font-family:sans-serif;max-width:60em;margin:auto}td{border-bottom:1px solid #ccc;padding:2px 6px}code{font-size:95%}</style></head><body>',
    `<h1>Alloy ${esc(model.element)} at ${fmtCelsius(model.temperature.celsius)} °C</h1>`, svg, ...caption.map((c) => `<p>${esc(c)}</p>`),
    '<h2>Composition</h2><table>', ...Object.keys(a.composition).map((e) => row([e, fmtNum(a.composition[e]), fmtNum(a.activities[e])])), '</table>', ...(model.reference ? [`<p>${esc(referenceNote(model))}</p>`] : []),
    '<h2>Assemblages</h2><table>', ...model.regions.map((r) => row([fp(r.species), verdictText(r.alloyVerdict!, r.dissolving ?? []), memberAmounts(r)])), '</table>',
    ...(operating?.points.length ? ['<h2>Operating points</h2><table>', row(['point', 'pH', 'E as given', 'E / V vs SHE', 'assemblage', 'verdict']), ...operating.points.map((p) => row([p.label, fmtNum(p.pH), `${fmtNum(p.Egiven)} V vs ${p.scale}`, p.Eshe.toFixed(4), p.assemblage, p.verdict])), '</table>'] : []),
    ...(operating?.envelopes.length ? ['<h2>Envelopes and paths</h2>', `<p>${esc(ENVELOPE_NOTE)}</p><ul>`, ...operating.envelopes.map((e) => `<li>${esc(envelopeText(e))}</li>`), '</ul>'] : []),
    '<h2>Reactions between neighbouring assemblages</h2><table>', ...lineRows(model, model.reference).map((r) => row([r.between.map(fp).join(' | '), reactionForPeople(r.reaction), lineText(r)])), '</table>',
    ...(model.warnings.length ? ['<h2>Warnings</h2><ul>', ...model.warnings.map((w) => `<li>${esc(textForPeople(w))}</li>`), '</ul>'] : []),
    '<h2>What this diagram does not say</h2><ul><li>Phases are pure compounds: no solid-solution activities.</li><li>Equilibrium only: no kinetics, film quality or localized attack.</li></ul>',
    '<h2>Cautions</h2>', ...REPORT_CAUTIONS.map((c) => `<p>${esc(c)}</p>`), `<p><strong>${esc(REPORT_CLOSING)}</strong></p>`,
    '<h2>Sources</h2><ul>', ...model.sources.map((s) => `<li>${esc(s)}</li>`), '</ul></body></html>', '',
  ].join('\n');
}

/**
 * The report as Markdown (GitHub-flavoured tables). The figure is a separate SVG file written next
 * to the document and linked by its bare file name. All user text is escaped.
 */
import { reportForPeople } from './people.js';
import { shortSource } from './format.js';
import type { ReportData } from './report-data.js';
import { crossingTexts, envelopeText } from './report-data.js';
import { runnerUpText } from './probe-text.js';
import { fmtCelsius, fmtNum, fmtSigned, mdCode, mdEsc, mdTable } from './format.js';

export function reportMarkdown(data: ReportData, figureFile: string, caption: string[]): string {
  const d = reportForPeople(data);
  const out: string[] = [];
  const para = (s: string) => out.push(s, '');
  para(`# ${mdEsc(d.title)}`);
  para(`*${mdEsc(d.cautions[0].split(':')[0])}: a screening aid. See the cautions at the end.*`);

  para('## Conditions');
  para(mdTable(['quantity', 'value'], d.conditions.map(([k, v]) => [mdEsc(k), mdEsc(v)])));
  if (d.activities.length) {
    para('Activities used (a = \u03b3\u00b7m where a concentration m was given):');
    para(mdTable(['species', 'role', 'm / (mol/kg)', 'log \u03b3', 'activity a'], d.activities.map((r) => [
      mdCode(r.formula),
      r.role,
      r.molality === undefined ? 'as given' : fmtNum(r.molality),
      r.logGamma === undefined ? '0' : r.logGamma.toFixed(4),
      fmtNum(r.activity),
    ])));
  }

  para('## Diagram');
  para(`![${mdEsc(d.title)}](${encodeURI(figureFile).replace(/[()]/g, (ch) => `%${ch.charCodeAt(0).toString(16).toUpperCase()}`)})`);
  para(caption.map((l) => mdEsc(l)).join('  \n'));

  para('## Reactions and lines');
  para(`Each boundary\u2019s balanced reaction and its line at ${fmtCelsius(d.celsius)} \u00b0C; E in V vs SHE at that temperature.`);
  para(mdTable(['boundary', 'reaction', 'E\u00b0 / V or log K', 'line', 'pH range'], d.lines.map((r) => [
    mdCode(r.between.join(' / ')),
    mdCode(r.reaction),
    r.line.kind === 'E' ? `E\u00b0 = ${r.line.E0!.toFixed(4)}` : `log K = ${r.line.logK!.toFixed(3)}`,
    mdEsc(r.equation),
    `${r.pHRange[0].toFixed(2)}\u2013${r.pHRange[1].toFixed(2)}`,
  ])));
  para(mdTable(['water line', 'reaction', 'line'], d.waterLines.map((w) => [w.couple, mdCode(w.reaction), mdEsc(w.equation)])));

  pointsSection(d, out);

  if (d.envelopes.length) {
    para('## Envelopes and paths');
    para('Each envelope is answered at its four corners and its centre, each path at its points (exactly, as for operating points); a field crossed between samples is not reported here — see the figure.');
    for (const e of d.envelopes) out.push(`- ${mdEsc(envelopeText(e))}`);
    out.push('');
  }

  windowSection(d, out);

  para('## Data sources');
  for (const s of d.sources) out.push(`- ${mdEsc(s)}`);
  out.push('');
  para(mdTable(['species', 'phase', 'name', 'role', 'from', 'recalled from memory', 'source (full citations above)'], d.species.map((s) => [
    mdCode(s.formula),
    s.phase,
    mdEsc(s.name),
    s.role,
    s.origin,
    s.recalled === null ? 'not stated' : s.recalled ? 'yes' : 'no',
    mdEsc(shortSource(s.source)),
  ])));
  para('\u201cRecalled from memory\u201d: the library marks these values as recalled rather than read from the cited table just now; check them against the source before relying on them.');

  para('## Warnings');
  if (!d.warnings.length) para('None.');
  else {
    for (const w of d.warnings) out.push(`- ${mdEsc(w)}`);
    out.push('');
  }

  para('## Cautions');
  for (const c of d.cautions) para(mdEsc(c));
  para(`**${mdEsc(d.closing)}**`);
  return `${out.join('\n').replace(/\n+$/, '')}\n`;
}

/** The "Operating points" section: speciation tables, or the verdict table with one line per point. */
function pointsSection(d: ReportData, out: string[]): void {
  const para = (s: string) => out.push(s, '');
  para('## Operating points');
  if (d.speciation) {
    para(mdEsc(d.speciation.intro));
    para(mdTable(d.speciation.header.map(mdEsc), d.speciation.rows.map((r) => r.map(mdEsc))));
    for (const x of d.speciation.details) {
      para(`**${mdEsc(x.label)}**`);
      para(mdTable(x.header.map(mdEsc), x.rows.map((r) => r.map(mdEsc))));
    }
  } else if (!d.points.length) para('The system file names no operating points (key `points`).');
  else {
    para(mdEsc(d.verdictBasis));
    para(mdTable(['point', 'pH', 'E as given', 'E / V vs SHE', 'predominant', 'verdict', 'E shift to runner-up / mV', 'to nearest line along E / mV', 'along pH'], d.points.map((p) => [
      mdEsc(p.label),
      fmtNum(p.pH),
      `${fmtNum(p.Egiven)} V vs ${mdEsc(p.scale)}`,
      p.Eshe.toFixed(4),
      mdCode(p.result.predominant),
      `**${p.result.verdict}**`,
      p.result.margin.potentialV === null ? '\u2014' : fmtSigned(p.result.margin.potentialV * 1000, 1),
      p.result.distance.mV === null ? '\u2014' : fmtSigned(p.result.distance.mV, 1),
      p.result.distance.pH === null ? '\u2014' : fmtSigned(p.result.distance.pH, 3),
    ])));
    for (const p of d.points) {
      const cr = crossingTexts(p.result);
      out.push(`- **${mdEsc(p.label)}**: ${mdEsc(p.result.advice)}${cr.length ? ` Crossings: ${cr.map(mdEsc).join('; ')}.` : ''}`);
      out.push(`  Runner-up: ${mdEsc(runnerUpText(p.result))}.`);
      if (p.result.nearestBoundary) out.push(`  Nearest boundary: ${mdCode(p.result.nearestBoundary.reaction)} (${mdEsc(p.result.nearestBoundary.equation)}).`);
    }
    out.push('');
  }
}

/** The "Plating window" section, where the system asks for it. */
function windowSection(d: ReportData, out: string[]): void {
  const para = (s: string) => out.push(s, '');
  if (d.window) {
    const w = d.window;
    para('## Plating window');
    para(mdTable(['pH range', 'dissolved form', 'E_dep at the ends / V vs SHE', 'E_dep \u2212 E(H\u2082) min \u2026 max / V', 'bounded by (low / high pH)'], w.windows.map((x) => [
      `${x.pH[0].toFixed(2)}\u2013${x.pH[1].toFixed(2)}`,
      x.dissolved.map(mdCode).join(', '),
      `${fmtSigned(x.deposition[0].E, 3)} \u2026 ${fmtSigned(x.deposition[x.deposition.length - 1].E, 3)}`,
      `${fmtSigned(x.marginToHydrogen.min, 3)} \u2026 ${fmtSigned(x.marginToHydrogen.max, 3)}`,
      `${x.boundedBy.low ?? 'edge'} / ${x.boundedBy.high ?? 'edge'}`,
    ])));
    para(w.firstSolid ? `First solid above the window: ${mdCode(w.firstSolid.species)} from pH ${w.firstSolid.pH.toFixed(2)}.` : (d.window.windows.length ? 'No solid appears above the window within the diagram.' : 'No plating window in the diagram (see the note below for why).'));
    for (const n of w.notes) out.push(`- ${mdEsc(n)}`);
    out.push('');
  }
}

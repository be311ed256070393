/**
 * The report as one self-contained HTML file: the SVG figure inlined, styles inline, no scripts and
 * no external resources (a Content-Security-Policy forbids loading any). All text is escaped.
 */
import { reportForPeople } from './people.js';
import { esc } from '../render/svg.js';
import { shortSource } from './format.js';
import type { ReportData } from './report-data.js';
import { crossingTexts, envelopeText } from './report-data.js';
import { runnerUpText } from './probe-text.js';
import { fmtCelsius, fmtNum, fmtSigned } from './format.js';

const STYLE = [
  'body{font-family:Helvetica,Arial,sans-serif;max-width:60em;margin:2em auto;padding:0 1em;color:#111;line-height:1.4}',
  'table{border-collapse:collapse;margin:0.6em 0 1em}',
  'th,td{border:1px solid #bbb;padding:0.2em 0.5em;text-align:left;vertical-align:top}',
  'th{background:#eee}',
  'code{font-family:Menlo,Consolas,monospace;font-size:0.92em}',
  'figure{margin:1em 0}',
  'figure svg{max-width:100%;height:auto}',
  '.caution{border-left:4px solid #b2182b;padding:0.3em 0.8em;background:#fbf3f3}',
  '.corrosion{color:#b2182b;font-weight:bold}.passivation{color:#1b5e20;font-weight:bold}.immunity{color:#0d47a1;font-weight:bold}',
].join('\n');

const code = (s: string) => `<code>${esc(s)}</code>`;

function table(header: string[], rows: string[][]): string {
  const head = `<tr>${header.map((h) => `<th>${esc(h)}</th>`).join('')}</tr>`;
  // Cells are already HTML (escaped by the caller).
  const body = rows.map((r) => `<tr>${r.map((c) => `<td>${c}</td>`).join('')}</tr>`).join('\n');
  return `<table>\n${head}\n${body}\n</table>`;
}

/** Inline SVG for HTML: the XML namespace declaration is implied by the HTML parser and dropped. */
export function inlineSvg(svg: string): string {
  return svg.replace(/^<\?xml[^>]*>\s*/, '').replace(/ xmlns="http:\/\/www\.w3\.org\/2000\/svg"/, '').trim();
}

export function reportHtml(data: ReportData, svg: string, caption: string[]): string {
  const d = reportForPeople(data);
  const o: string[] = [];
  o.push('<!DOCTYPE html>');
  o.push('<html lang="en">');
  o.push('<head>');
  o.push('<meta charset="utf-8">');
  o.push('<meta http-equiv="Content-Security-Policy" content="default-src \'none\'; style-src \'unsafe-inline\'">');
  o.push('<meta name="viewport" content="width=device-width, initial-scale=1">');
  o.push(`<title>${esc(d.title)}</title>`);
  o.push(`<style>\n${STYLE}\n</style>`);
  o.push('</head>');
  o.push('<body>');
  o.push(`<h1>${esc(d.title)}</h1>`);

  o.push('<h2>Conditions</h2>');
  o.push(table(['quantity', 'value'], d.conditions.map(([k, v]) => [esc(k), esc(v)])));
  if (d.activities.length) {
    o.push('<p>Activities used (<i>a</i> = \u03b3\u00b7<i>m</i> where a concentration <i>m</i> was given):</p>');
    o.push(table(['species', 'role', 'm / (mol/kg)', 'log \u03b3', 'activity a'], d.activities.map((r) => [
      code(r.formula),
      esc(r.role),
      r.molality === undefined ? 'as given' : esc(fmtNum(r.molality)),
      r.logGamma === undefined ? '0' : esc(r.logGamma.toFixed(4)),
      esc(fmtNum(r.activity)),
    ])));
  }

  o.push('<h2>Diagram</h2>');
  o.push('<figure>');
  o.push(inlineSvg(svg));
  o.push(`<figcaption>${caption.map(esc).join('<br>\n')}</figcaption>`);
  o.push('</figure>');

  o.push('<h2>Reactions and lines</h2>');
  o.push(`<p>Each boundary\u2019s balanced reaction and its line at ${esc(fmtCelsius(d.celsius))} \u00b0C; <i>E</i> in V vs SHE at that temperature.</p>`);
  o.push(table(['boundary', 'reaction', 'E\u00b0 / V or log K', 'line', 'pH range'], d.lines.map((r) => [
    code(r.between.join(' / ')),
    code(r.reaction),
    esc(r.line.kind === 'E' ? `E\u00b0 = ${r.line.E0!.toFixed(4)}` : `log K = ${r.line.logK!.toFixed(3)}`),
    esc(r.equation),
    esc(`${r.pHRange[0].toFixed(2)}\u2013${r.pHRange[1].toFixed(2)}`),
  ])));
  o.push(table(['water line', 'reaction', 'line'], d.waterLines.map((w) => [esc(w.couple), code(w.reaction), esc(w.equation)])));

  pointsSection(d, o);

  if (d.envelopes.length) {
    o.push('<h2>Envelopes and paths</h2>');
    o.push('<p>Each envelope is answered at its four corners and its centre, each path at its points (exactly, as for operating points); a field crossed between samples is not reported here — see the figure.</p>');
    o.push(`<ul>${d.envelopes.map((e) => `<li>${esc(envelopeText(e))}</li>`).join('')}</ul>`);
  }

  windowSection(d, o);

  o.push('<h2>Data sources</h2>');
  o.push(`<ul>\n${d.sources.map((s) => `<li>${esc(s)}</li>`).join('\n')}\n</ul>`);
  o.push(table(['species', 'phase', 'name', 'role', 'from', 'recalled from memory', 'source (full citations above)'], d.species.map((s) => [
    code(s.formula),
    esc(s.phase),
    esc(s.name),
    esc(s.role),
    esc(s.origin),
    s.recalled === null ? 'not stated' : s.recalled ? 'yes' : 'no',
    esc(shortSource(s.source)),
  ])));
  o.push('<p>\u201cRecalled from memory\u201d: the library marks these values as recalled rather than read from the cited table just now; check them against the source before relying on them.</p>');

  o.push('<h2>Warnings</h2>');
  o.push(d.warnings.length ? `<ul>\n${d.warnings.map((w) => `<li>${esc(w)}</li>`).join('\n')}\n</ul>` : '<p>None.</p>');

  o.push('<h2>Cautions</h2>');
  for (const c of d.cautions) o.push(`<p class="caution">${esc(c)}</p>`);
  o.push(`<p><b>${esc(d.closing)}</b></p>`);
  o.push('</body>');
  o.push('</html>');
  return `${o.join('\n')}\n`;
}

/** The "Operating points" section: speciation tables, or the verdict table with one item per point. */
function pointsSection(d: ReportData, o: string[]): void {
  o.push('<h2>Operating points</h2>');
  if (d.speciation) {
    o.push(`<p>${esc(d.speciation.intro)}</p>`);
    o.push(table(d.speciation.header, d.speciation.rows.map((r) => r.map(esc))));
    for (const x of d.speciation.details) {
      o.push(`<p><b>${esc(x.label)}</b></p>`);
      o.push(table(x.header, x.rows.map((r) => r.map(esc))));
    }
  } else if (!d.points.length) o.push('<p>The system file names no operating points (key <code>points</code>).</p>');
  else {
    o.push(`<p>${esc(d.verdictBasis)}</p>`);
    o.push(table(['point', 'pH', 'E as given', 'E / V vs SHE', 'predominant', 'verdict', 'E shift to runner-up / mV', 'to nearest line along E / mV', 'along pH'], d.points.map((p) => [
      esc(p.label),
      esc(fmtNum(p.pH)),
      esc(`${fmtNum(p.Egiven)} V vs ${p.scale}`),
      esc(p.Eshe.toFixed(4)),
      code(p.result.predominant),
      `<span class="${esc(p.result.verdict)}">${esc(p.result.verdict)}</span>`,
      p.result.margin.potentialV === null ? '\u2014' : esc(fmtSigned(p.result.margin.potentialV * 1000, 1)),
      p.result.distance.mV === null ? '\u2014' : esc(fmtSigned(p.result.distance.mV, 1)),
      p.result.distance.pH === null ? '\u2014' : esc(fmtSigned(p.result.distance.pH, 3)),
    ])));
    o.push('<ul>');
    for (const p of d.points) {
      const cr = crossingTexts(p.result);
      let li = `<li><b>${esc(p.label)}</b>: ${esc(p.result.advice)}`;
      if (cr.length) li += ` Crossings: ${esc(cr.join('; '))}.`;
      li += `<br>Runner-up: ${esc(runnerUpText(p.result))}.`;
      if (p.result.nearestBoundary) li += `<br>Nearest boundary: ${code(p.result.nearestBoundary.reaction)} (${esc(p.result.nearestBoundary.equation)}).`;
      o.push(`${li}</li>`);
    }
    o.push('</ul>');
  }
}

/** The "Plating window" section, where the system asks for it. */
function windowSection(d: ReportData, o: string[]): void {
  if (d.window) {
    const w = d.window;
    o.push('<h2>Plating window</h2>');
    o.push(table(['pH range', 'dissolved form', 'E_dep at the ends / V vs SHE', 'E_dep \u2212 E(H\u2082) min \u2026 max / V', 'bounded by (low / high pH)'], w.windows.map((x) => [
      esc(`${x.pH[0].toFixed(2)}\u2013${x.pH[1].toFixed(2)}`),
      x.dissolved.map(code).join(', '),
      esc(`${fmtSigned(x.deposition[0].E, 3)} \u2026 ${fmtSigned(x.deposition[x.deposition.length - 1].E, 3)}`),
      esc(`${fmtSigned(x.marginToHydrogen.min, 3)} \u2026 ${fmtSigned(x.marginToHydrogen.max, 3)}`),
      esc(`${x.boundedBy.low ?? 'edge'} / ${x.boundedBy.high ?? 'edge'}`),
    ])));
    o.push(`<p>${w.firstSolid ? `First solid above the window: ${code(w.firstSolid.species)} from pH ${esc(w.firstSolid.pH.toFixed(2))}.` : (d.window.windows.length ? 'No solid appears above the window within the diagram.' : 'No plating window in the diagram (see the note below for why).')}</p>`);
    o.push(`<ul>${w.notes.map((n) => `<li>${esc(n)}</li>`).join('')}</ul>`);
  }
}

/**
 * Scene → one self-contained interactive HTML page: the figure as inline SVG, a small inline
 * script (no network, no external files, no eval) and a read-out of the point under the pointer
 * or the keyboard crosshair: pH and E (in the SHE scale and, when the figure has a second axis,
 * in that reference scale too), the predominant species with its usual reading (immunity,
 * passivation, corrosion) found by point-in-polygon on the model's exact region polygons, and the
 * nearest boundary (distance in figure space) with its reaction and line equation.
 *
 * Deterministic: the same scene and model give the same bytes. All user text is escaped; the
 * embedded data is JSON in a non-executed script block with "<", ">" and "&" escaped, and a
 * Content-Security-Policy with hashes allows only this page's own script and style.
 */
import { createHash } from 'node:crypto';
import { formulaForPeople, reactionForPeople } from '../chem/present.js';
import { lineEquationText } from '../diagram/line-text.js';
import { verdictOf } from '../diagram/verdict.js';
import type { ShareGrid } from './share-grid.js';
import type { DiagramModel, LineCoefficients } from '../model.js';
import type { FigureOptions } from './options.js';
import type { Scene } from './scene-types.js';
import { undeterminedCause } from './scene-iso.js';
import { esc, sceneToSvg } from './svg.js';

/** A formula for people (chem/present.ts): "Fe^2+" or "Fe+2" → "Fe²⁺", "Fe3O4(s)" → "Fe₃O₄(s)", "e-" → "e⁻". */
export function formulaUnicode(formula: string): string {
  return formulaForPeople(formula);
}

/** A reaction for people (chem/present.ts): "Fe^2+ + 2e^- <=> Fe(s)" → "Fe²⁺ + 2e⁻ ⇌ Fe(s)". */
export function reactionUnicode(reaction: string): string {
  return reactionForPeople(reaction);
}

/** Hyphen-minus used as a sign or operator → U+2212 minus ("E = -0.08 - 0.06 pH" → "E = −0.08 − 0.06 pH"). */
export function signMinus(s: string): string {
  return s.replace(/(^|[\s=(])-(?=[\d.\s])/g, '$1\u2212');
}

/** Reference-electrode name from a second-axis label: "E / V vs SCE" → "SCE". */
export function referenceName(label: string): string {
  const m = /\bvs\.?\s+(.+?)\s*$/.exec(label);
  return m ? m[1]! : label;
}


/** A potential line moved to another reference scale: E_ref = E_SHE − offset. Null for pH lines. */
export function equationInScale(line: LineCoefficients, offset: number, name: string): string | null {
  if (line.kind !== 'E' || line.intercept === undefined) return null;
  return lineEquationText(line, { scale: name, offset, minus: '\u2212' });
}

const r6 = (v: number): number => {
  const x = Number(v.toFixed(6));
  return Object.is(x, -0) ? 0 : x;
};

interface PageData {
  frame: Scene['frame'];
  scale: string;
  second: { name: string; offset: number } | null;
  regions: { label: string; formula: string; name: string; reading: string; polygons: [number, number][][][] }[];
  boundaries: { between: string; reaction: string; equation: string; equation2: string | null; points: [number, number][] }[];
  /** Composition mode: the share read-out grid (nearest node to the pointer). */
  grid?: ShareGrid;
}

/** The compact data the page's script works on (coordinates rounded to 1e-6). */
export function pageData(scene: Scene, model: DiagramModel, options: Pick<FigureOptions, 'secondAxis'> = {}, grid?: ShareGrid): PageData {
  const second = options.secondAxis ? { name: referenceName(options.secondAxis.label), offset: options.secondAxis.offset } : null;
  const pt = (p: readonly [number, number]): [number, number] => [r6(p[0]), r6(p[1])];
  return {
    frame: {
      x0: r6(scene.frame.x0),
      x1: r6(scene.frame.x1),
      y0: r6(scene.frame.y0),
      y1: r6(scene.frame.y1),
      pH: [r6(scene.frame.pH[0]), r6(scene.frame.pH[1])],
      E: [r6(scene.frame.E[0]), r6(scene.frame.E[1])],
    },
    scale: 'SHE',
    second,
    regions: [
      // Composition mode: where the point solver failed, first (it is drawn over the fills).
      ...(model.composition?.undetermined.length ? [{ label: 'Undetermined', formula: '', name: '', reading: undeterminedReading(model), polygons: model.composition.undetermined.map((poly) => poly.map((ring) => ring.map(pt))) }] : []),
      ...model.regions.map((r) => ({
        label: unicodeLabel(r.species),
        formula: r.species,
        name: r.name ?? '',
        reading: (r.undetermined ? 'unknown' : r.alloyVerdict ? alloyReading(r.alloyVerdict, r.dissolving ?? []) : r.verdict ?? verdictOf(r.class, r.species)) + (model.kind === 'composition' ? ` (the form holding the largest share of ${model.element})` : ''),
        polygons: r.polygons.map((poly) => poly.map((ring) => ring.map(pt))),
      })),
    ],
    boundaries: model.boundaries.map((b) => ({
      between: b.between.map(unicodeLabel).join(' / '),
      reaction: reactionUnicode(b.reaction),
      equation: signMinus(b.equation),
      equation2: second ? equationInScale(b.line, second.offset, second.name) : null,
      points: b.points.map(pt),
    })),
    ...(grid ? { grid: { ...grid, forms: grid.forms.map(formulaUnicode) } } : {}),
  };
}

/** A formula, or an alloy assemblage "Fe2O3 + Cr2O3 + Ni+2" term by term, in Unicode. */
function unicodeLabel(text: string): string {
  return text.split(' + ').map(formulaUnicode).join(' + ');
}

/** The read-out of an alloy region's verdict, naming the dissolving elements. */
/** The HTML reading of the undetermined areas, by their cause (scene-iso.ts undeterminedCause). */
function undeterminedReading(model: DiagramModel): string {
  const cause = undeterminedCause(model);
  if (cause === 'not solved') return 'the speciation could not be solved here';
  if (cause === 'not resolved at this grid') return 'a gap between traced regions, not resolved at this grid (a finer grid shrinks it)';
  return 'the speciation could not be solved here, or a gap between traced regions not resolved at this grid';
}

function alloyReading(v: NonNullable<DiagramModel['regions'][number]['alloyVerdict']>, dissolving: readonly string[]): string {
  if (v === 'partly-corroding') return `partly corroding: ${dissolving.join(', ')} ${dissolving.length > 1 ? 'dissolve' : 'dissolves'}, the rest stays solid`;
  return v === 'immune' ? 'immune (metals only)' : v === 'passive' ? 'passive (solids only, nothing dissolves)' : 'corroding (everything dissolves)';
}

/** JSON safe inside an HTML script element (no "</script>", no "<!--"). */
function scriptJson(v: unknown): string {
  return JSON.stringify(v)
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

/** Width (rem) from which the read-out sits in a panel beside the figure; below it, at the bottom of the window. */
const WIDE_REM = 52;

/**
 * The page's style sheet. The figure is sized to fit the window's height (`ratio` = its width /
 * height), so that on a laptop screen the whole plot and the read-out are in view together: on
 * wide windows the read-out is a panel beside the figure (sticky at the top), on narrow ones a
 * compact bar stuck to the bottom of the window while the figure is on screen (the help text is
 * then visually hidden but still read by assistive technology). Print shows the figure alone.
 */
function pageStyle(ratio: number): string {
  const r = Number(ratio.toFixed(4));
  return `
:root { color-scheme: light; }
body { margin: 0; padding: 1rem; background: #fff; color: #111;
  font-family: system-ui, -apple-system, "Segoe UI", Roboto, "Helvetica Neue", Arial, sans-serif; line-height: 1.4; }
main { max-width: 60rem; margin: 0 auto; }
figure.ephmap { margin: 0; }
.ephmap-plot { display: block; cursor: crosshair; touch-action: manipulation; border-radius: 2px; }
.ephmap-plot svg { display: block; width: 100%; height: auto; }
.ephmap-plot:focus { outline: 3px solid #1a5fb4; outline-offset: 3px; }
.ephmap-plot:focus:not(:focus-visible) { outline: none; }
.ephmap-controls { margin-top: 0.5rem; }
.ephmap-help { margin: 0.5rem 0 0; color: #444; font-size: 0.9rem; }
.ephmap-readout { min-height: 4.6em; padding: 0.3rem 0.75rem; border-left: 3px solid #1a5fb4; background: #f4f6f8;
  font-variant-numeric: tabular-nums; }
.ephmap-readout p { margin: 0.1rem 0; }
.ephmap-species { font-weight: 600; }
@media screen {
  .ephmap-plot { width: min(100%, max(18rem, calc((100vh - 10rem) * ${r}))); margin: 0 auto; }
}
@media screen and (min-width: ${WIDE_REM}rem) {
  main { max-width: 84rem; }
  figure.ephmap { display: flex; gap: 1rem; align-items: flex-start; justify-content: center; }
  .ephmap-plot { flex: 0 1 max(18rem, calc((100vh - 2rem) * ${r})); width: auto; min-width: 0; margin: 0; }
  .ephmap-controls { flex: 0 0 18rem; margin-top: 0; position: sticky; top: 1rem; max-height: calc(100vh - 2rem); overflow-y: auto; }
  .ephmap-readout { min-height: 9em; font-size: 0.95rem; }
}
@media screen and (max-width: ${WIDE_REM - 0.01}rem) {
  .ephmap-controls { position: sticky; bottom: 0; z-index: 1; margin-top: 0.4rem; padding: 0.4rem 0 0.2rem; background: #fff;
    box-shadow: 0 -1px 0 #d0d4d8; }
  .ephmap-help { position: absolute; width: 1px; height: 1px; margin: -1px; padding: 0; overflow: hidden;
    clip: rect(0 0 0 0); white-space: nowrap; border: 0; }
  .ephmap-readout { min-height: 0; font-size: 0.85rem; }
}
@media print {
  body { padding: 0; }
  main { max-width: none; }
  .ephmap-controls, .ephmap-overlay { display: none !important; }
  .ephmap-plot { outline: none !important; }
  .ephmap-plot svg { width: 100%; }
}
`;
}

const SCRIPT = `
(function () {
  'use strict';
  var data = JSON.parse(document.getElementById('ephmap-data').textContent);
  var plot = document.getElementById('ephmap-plot');
  var svg = plot.querySelector('svg');
  var overlay = svg.querySelector('.ephmap-overlay');
  var near = svg.querySelector('.ephmap-near');
  var vline = svg.querySelector('.ephmap-vline');
  var hline = svg.querySelector('.ephmap-hline');
  var dot = svg.querySelector('.ephmap-dot');
  var outPoint = document.getElementById('ephmap-point');
  var outSpecies = document.getElementById('ephmap-species');
  var outLine = document.getElementById('ephmap-line');
  var f = data.frame;
  var kx = (f.x1 - f.x0) / (f.pH[1] - f.pH[0]);
  var ky = (f.y1 - f.y0) / (f.E[1] - f.E[0]);
  function fx(pH) { return f.x0 + (pH - f.pH[0]) * kx; }
  function fy(E) { return f.y0 + (E - f.E[0]) * ky; }
  var lines = data.boundaries.map(function (b) {
    return { b: b, pts: b.points.map(function (p) { return [fx(p[0]), fy(p[1])]; }) };
  });
  function num(v, d) {
    var s = v.toFixed(d);
    if (Number(s) === 0) s = (0).toFixed(d);
    return s.replace('-', '\\u2212');
  }
  function inPolygon(poly, x, y) {
    var c = false;
    for (var k = 0; k < poly.length; k++) {
      var ring = poly[k];
      for (var i = 0, j = ring.length - 1; i < ring.length; j = i++) {
        var xi = ring[i][0], yi = ring[i][1], xj = ring[j][0], yj = ring[j][1];
        if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) c = !c;
      }
    }
    return c;
  }
  function regionAt(pH, E) {
    for (var i = 0; i < data.regions.length; i++) {
      var r = data.regions[i];
      for (var k = 0; k < r.polygons.length; k++) if (inPolygon(r.polygons[k], pH, E)) return r;
    }
    return null;
  }
  function segDist(px, py, a, b) {
    var dx = b[0] - a[0], dy = b[1] - a[1], l2 = dx * dx + dy * dy;
    var t = l2 === 0 ? 0 : ((px - a[0]) * dx + (py - a[1]) * dy) / l2;
    t = Math.max(0, Math.min(1, t));
    return Math.hypot(px - (a[0] + t * dx), py - (a[1] + t * dy));
  }
  function nearest(x, y) {
    var best = null, bd = Infinity;
    for (var i = 0; i < lines.length; i++) {
      var p = lines[i].pts;
      for (var k = 0; k + 1 < p.length; k++) {
        var d = segDist(x, y, p[k], p[k + 1]);
        if (d < bd) { bd = d; best = lines[i]; }
      }
    }
    return best;
  }
  var state = null;
  function clamp(v, a, b) { return Math.max(Math.min(a, b), Math.min(Math.max(a, b), v)); }
  function show(pH, E) {
    pH = clamp(pH, f.pH[0], f.pH[1]);
    E = clamp(E, f.E[0], f.E[1]);
    state = { pH: pH, E: E };
    var x = fx(pH), y = fy(E);
    vline.setAttribute('x1', x); vline.setAttribute('x2', x);
    vline.setAttribute('y1', f.y0); vline.setAttribute('y2', f.y1);
    hline.setAttribute('y1', y); hline.setAttribute('y2', y);
    hline.setAttribute('x1', f.x0); hline.setAttribute('x2', f.x1);
    dot.setAttribute('cx', x); dot.setAttribute('cy', y);
    var t = 'pH ' + num(pH, 2) + ', E = ' + num(E, 3) + ' V vs ' + data.scale;
    if (data.second) t += ' (' + num(E - data.second.offset, 3) + ' V vs ' + data.second.name + ')';
    outPoint.textContent = t;
    var r = regionAt(pH, E);
    outSpecies.textContent = (r ? r.label + (r.name ? ' (' + r.name + ')' : '') + ': ' + r.reading : 'On a boundary') + gridReading(pH, E);
    var n = nearest(x, y);
    if (n) {
      outLine.textContent = 'Nearest boundary on the figure: ' + n.b.between + ': ' + n.b.reaction + '; ' + n.b.equation +
        (n.b.equation2 ? ' (' + n.b.equation2 + ')' : '');
      near.setAttribute('d', 'M' + n.pts.map(function (p) { return p[0].toFixed(2) + ' ' + p[1].toFixed(2); }).join('L'));
    } else {
      outLine.textContent = '';
      near.setAttribute('d', '');
    }
    overlay.setAttribute('visibility', 'visible');
  }
  function gridReading(pH, E) {
    var g = data.grid;
    if (!g) return '';
    var i = Math.round(((pH - g.x[0]) / (g.x[1] - g.x[0])) * (g.nx - 1)), j = Math.round(((E - g.y[0]) / (g.y[1] - g.y[0])) * (g.ny - 1));
    if (i < 0 || j < 0 || i >= g.nx || j >= g.ny) return '';
    var k = i + j * g.nx;
    if (g.label[k] < 0) return '. Nearest grid node: undetermined (not solved)';
    var d = g.logDissolved[k];
    return '. Nearest grid node: ' + g.forms[g.label[k]] + ' holds ' + num(100 * g.share[k], 1) + ' % of ' + g.element +
      (d === null ? '' : '; dissolved ' + g.element + ' 10^' + num(d, 2) + ' mol/kg');
  }
  function fromEvent(e) {
    var m = svg.getScreenCTM();
    if (!m) return null;
    var p = new DOMPoint(e.clientX, e.clientY).matrixTransform(m.inverse());
    if (p.x < Math.min(f.x0, f.x1) || p.x > Math.max(f.x0, f.x1) || p.y < Math.min(f.y0, f.y1) || p.y > Math.max(f.y0, f.y1)) return null;
    return [f.pH[0] + (p.x - f.x0) / kx, f.E[0] + (p.y - f.y0) / ky];
  }
  function onPointer(e) {
    var d = fromEvent(e);
    if (d) show(d[0], d[1]);
  }
  svg.addEventListener('pointermove', onPointer);
  svg.addEventListener('pointerdown', onPointer);
  plot.addEventListener('focus', function () {
    if (!state) show((f.pH[0] + f.pH[1]) / 2, (f.E[0] + f.E[1]) / 2);
  });
  plot.addEventListener('keydown', function (e) {
    var k = e.shiftKey ? 10 : 1, dpH = 0, dE = 0;
    if (e.key === 'ArrowLeft') dpH = -0.1 * k;
    else if (e.key === 'ArrowRight') dpH = 0.1 * k;
    else if (e.key === 'ArrowUp') dE = 0.01 * k;
    else if (e.key === 'ArrowDown') dE = -0.01 * k;
    else return;
    e.preventDefault();
    var s = state || { pH: (f.pH[0] + f.pH[1]) / 2, E: (f.E[0] + f.E[1]) / 2 };
    show(Math.round((s.pH + dpH) * 1e6) / 1e6, Math.round((s.E + dE) * 1e6) / 1e6);
  });
})();
`;

function cspHash(s: string): string {
  return `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`;
}

/** The overlay drawn by the script: nearest-boundary highlight, crosshair and dot (hidden until used). */
function overlaySvg(scene: Scene): string {
  const k = Math.max(0.5, scene.widthPt / 600);
  return [
    `  <g class="ephmap-overlay" visibility="hidden" pointer-events="none">`,
    `    <path class="ephmap-near" d="" fill="none" stroke="#c2185b" stroke-width="${(2.4 * k).toFixed(2)}" stroke-opacity="0.7" stroke-linecap="round" stroke-linejoin="round"/>`,
    `    <line class="ephmap-vline" x1="0" y1="0" x2="0" y2="0" stroke="#111111" stroke-width="${(0.6 * k).toFixed(2)}" stroke-dasharray="${(2.5 * k).toFixed(2)} ${(1.5 * k).toFixed(2)}"/>`,
    `    <line class="ephmap-hline" x1="0" y1="0" x2="0" y2="0" stroke="#111111" stroke-width="${(0.6 * k).toFixed(2)}" stroke-dasharray="${(2.5 * k).toFixed(2)} ${(1.5 * k).toFixed(2)}"/>`,
    `    <circle class="ephmap-dot" cx="0" cy="0" r="${(1.8 * k).toFixed(2)}" fill="#111111" stroke="#ffffff" stroke-width="${(0.7 * k).toFixed(2)}"/>`,
    `  </g>`,
  ].join('\n');
}

/**
 * Renders the interactive page. `options.secondAxis` (the figure's second potential axis) adds the
 * potential and line equations in that reference scale to the read-out.
 */
export function sceneToHtml(scene: Scene, model: DiagramModel, options: Pick<FigureOptions, 'secondAxis'> = {}, grid?: ShareGrid): string {
  const svg = sceneToSvg(scene)
    .replace(/^<svg /, '<svg aria-hidden="true" focusable="false" ')
    .replace(/<\/svg>\n$/, `${overlaySvg(scene)}\n</svg>`);
  const data = pageData(scene, model, options, grid);
  const style = pageStyle(scene.widthPt / scene.heightPt);
  const csp = `default-src 'none'; script-src ${cspHash(SCRIPT)}; style-src ${cspHash(style)}; base-uri 'none'; form-action 'none'`;
  const title = esc(scene.title);
  const ref = data.second ? ` and ${esc(data.second.name)}` : '';
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta http-equiv="Content-Security-Policy" content="${csp}">`,
    '<meta name="generator" content="ephmap">',
    `<title>${title}</title>`,
    `<style>${style}</style>`,
    '</head>',
    '<body>',
    '<main>',
    '<figure class="ephmap">',
    `<div class="ephmap-plot" id="ephmap-plot" tabindex="0" role="application" aria-label="${title}: potential\u2013pH diagram; arrow keys move a crosshair" aria-describedby="ephmap-help">`,
    svg,
    '</div>',
    '<div class="ephmap-controls">',
    '<div class="ephmap-readout" id="ephmap-readout" role="status" aria-live="polite" aria-atomic="true">',
    '<p class="ephmap-point" id="ephmap-point">No point chosen yet: point at or tap the diagram, or focus it and use the arrow keys.</p>',
    '<p class="ephmap-species" id="ephmap-species"></p>',
    '<p class="ephmap-line" id="ephmap-line"></p>',
    '</div>',
    `<p class="ephmap-help" id="ephmap-help">Point at the diagram or tap it to read pH, potential (V vs SHE${ref}), the predominant species and the boundary nearest the pointer on the figure (as drawn; probe measures its own nearest boundary on the Nernst scale). With the keyboard, focus the diagram and use the arrow keys: 0.1 pH or 10 mV per step, ten times more with Shift.</p>`,
    '</div>',
    '</figure>',
    '</main>',
    `<script type="application/json" id="ephmap-data">${scriptJson(data)}</script>`,
    `<script>${SCRIPT}</script>`,
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

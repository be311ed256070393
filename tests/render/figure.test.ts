/**
 * Whole-figure checks on the synthetic iron model: the SVG is parsed with svgdom (its own font
 * measurement, independent of our Helvetica metrics) to check labels, overlaps and ticks.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createSVGWindow } from 'svgdom';
import { describe, expect, it } from 'vitest';
import { type FigureOptions } from '../../src/render/options.js';
import { buildScene, type FigureInput } from '../../src/render/scene.js';
import { sceneToSvg } from '../../src/render/svg.js';
import { sceneToPdf } from '../../src/render/pdf.js';
import { svgToPng } from '../../src/render/png.js';
import { iron, ironFamilies, texts, opts } from './helpers.js';

type Box = { x: number; y: number; w: number; h: number };
type Pt = [number, number];

/* eslint-disable @typescript-eslint/no-explicit-any */
function parseSvg(svg: string): any {
  const window = createSVGWindow();
  const host = window.document.createElement('div');
  host.innerHTML = svg;
  return host.querySelector('svg');
}

/** Ink box of a text element from svgdom's bbox: its line box trimmed to the glyph band. */
function inkBox(el: any): Box {
  const b = el.getBBox();
  return { x: b.x, y: b.y + 0.18 * b.height, w: b.width, h: 0.64 * b.height };
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

/** Segments of every "M…L…Z" path with the given class. */
function pathSegments(svg: any, cls: string): [Pt, Pt][] {
  const out: [Pt, Pt][] = [];
  for (const p of svg.querySelectorAll(`path.${cls}`)) {
    const d: string = p.getAttribute('d');
    for (const sub of d.split('M').filter(Boolean)) {
      const pts = sub
        .replace(/Z$/, '')
        .split('L')
        .map((xy) => xy.trim().split(/\s+/).map(Number) as Pt);
      for (let i = 0; i + 1 < pts.length; i++) out.push([pts[i]!, pts[i + 1]!]);
    }
  }
  return out;
}

function segHitsBox([a, b]: [Pt, Pt], r: Box): boolean {
  // Sample the segment finely: exact enough for a test and independent of the renderer's geometry code.
  const n = 400;
  for (let i = 0; i <= n; i++) {
    const t = i / n;
    const x = a[0] + t * (b[0] - a[0]);
    const y = a[1] + t * (b[1] - a[1]);
    if (x > r.x && x < r.x + r.w && y > r.y && y < r.y + r.h) return true;
  }
  return false;
}



const full = (o: Partial<FigureOptions> = {}): FigureInput => ({
  model: iron(),
  options: opts(o),
  families: ironFamilies(),
  neutralPH: 7,
  caption: ['Fe–H2O at 25 °C, dissolved iron activity 10^-6.'],
  points: [{ label: 'P1', pH: 8.2, E: 0.1 }],
  paths: [{ label: 'start-up', points: [[4, -0.3], [6, 0.2], [9.5, 0.3]] }],
  boxes: [{ label: 'service', pH: [10, 12], E: [-0.3, 0.2] }],
});

const sizes: { name: string; input: () => FigureInput }[] = [
  { name: '85 mm default', input: () => ({ model: iron(), options: opts() }) },
  { name: '85 mm with everything', input: () => full({ height: 90, show: { neutral: true, grid: true, triplePoints: true } as any }) },
  { name: '170 mm with everything', input: () => full({ width: 170, height: 140, fontSize: 9, lineWidth: 1.2, secondAxis: { label: 'E / V vs SCE', offset: 0.241 }, show: { neutral: true, triplePoints: true, title: true } as any }) },
];

describe.each(sizes)('SVG figure, $name', ({ input }) => {
  const inp = input();
  const svgText = sceneToSvg(buildScene(inp));
  const svg = parseSvg(svgText);

  it('labels every region once, with its species', () => {
    const labels = [...svg.querySelectorAll('text.region-label')];
    const species = labels.map((l: any) => l.getAttribute('data-species')).sort();
    expect(species).toEqual(inp.model.regions.map((r) => r.species).sort());
    // Typeset text: HFeO2- reads HFeO₂⁻ (subscript 2, superscript minus U+2212).
    const h = labels.find((l: any) => l.getAttribute('data-species') === 'HFeO2-');
    expect(h.textContent).toBe('HFeO2\u2212');
  });

  it('keeps unrotated labels from overlapping each other', () => {
    const sel = 'text.region-label, text.point-label, text.path-label, text.box-label, text.family-tag';
    const boxes = [...svg.querySelectorAll(sel)].map((el: any) => ({ box: inkBox(el), text: el.textContent }));
    expect(boxes.length).toBeGreaterThan(0);
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        expect(overlaps(boxes[i]!.box, boxes[j]!.box), `${boxes[i]!.text} vs ${boxes[j]!.text}`).toBe(false);
      }
  });

  it('keeps region labels off the boundary lines', () => {
    const segs = pathSegments(svg, 'boundary');
    expect(segs.length).toBeGreaterThanOrEqual(inp.model.boundaries.length);
    for (const el of svg.querySelectorAll('text.region-label')) {
      const b = inkBox(el);
      for (const s of segs) expect(segHitsBox(s, b), `${el.textContent} crosses a boundary`).toBe(false);
    }
  });

  it('keeps every text at 6 pt or more', () => {
    for (const el of svg.querySelectorAll('text')) {
      const size = Number(el.getAttribute('font-size'));
      expect(size).toBeGreaterThanOrEqual(6);
      // Sub/superscripts: 6 pt whenever that is at most 85 % of their text, else 85 % of it.
      for (const ts of el.querySelectorAll('tspan[font-size]')) {
        expect(Number(ts.getAttribute('font-size'))).toBeGreaterThanOrEqual(Math.min(6, 0.85 * size) - 0.01);
      }
    }
  });
});

describe('SVG figure details', () => {
  it('puts pH and E ticks at the right values and places them linearly', () => {
    const scene = buildScene({ model: iron(), options: opts() });
    const svg = parseSvg(sceneToSvg(scene));
    const ph = [...svg.querySelectorAll('text.tick-label[data-axis="pH"]')];
    expect(ph.map((t: any) => t.textContent)).toEqual(['0', '2', '4', '6', '8', '10', '12', '14']);
    const e = [...svg.querySelectorAll('text.tick-label[data-axis="E"]')];
    expect(e.map((t: any) => t.textContent)).toEqual(['\u22121.0', '\u22120.5', '0.0', '0.5', '1.0', '1.5']);
    // pH 0 at the frame's left edge, pH 14 at its right edge, pH 7 half-way.
    const frame = pathSegments(svg, 'frame');
    const xs = frame.flatMap(([a, b]) => [a[0], b[0]]);
    const ys = frame.flatMap(([a, b]) => [a[1], b[1]]);
    const [x0, x1] = [Math.min(...xs), Math.max(...xs)];
    const [y0, y1] = [Math.min(...ys), Math.max(...ys)];
    const xAt = (i: number): number => Number(ph[i].getAttribute('x'));
    expect(xAt(0)).toBeCloseTo(x0, 1);
    expect(xAt(7)).toBeCloseTo(x1, 1);
    expect((xAt(0) + xAt(7)) / 2).toBeCloseTo(xAt(4) - (xAt(4) - (x0 + x1) / 2), 1);
    // E = 0.0 V sits at 1.2/2.8 of the height up from the bottom (domain −1.2…1.6 V).
    const zero = e[2];
    const y = Number(zero.getAttribute('y'));
    const size = Number(zero.getAttribute('font-size'));
    expect(y - 0.359 * size).toBeCloseTo(y1 - ((0 - -1.2) / 2.8) * (y1 - y0), 0);
  });

  it('is byte-identical when built twice', () => {
    const a = sceneToSvg(buildScene(full()));
    const b = sceneToSvg(buildScene(full()));
    expect(a).toBe(b);
    expect(a).not.toMatch(/NaN|undefined|Infinity/);
  });

  it('moves a label that cannot fit out of its region with a leader line', () => {
    const svg = parseSvg(sceneToSvg(buildScene({ model: iron(), options: opts() })));
    const h = svg.querySelector('text.region-label[data-species="HFeO2-"]');
    expect(h.getAttribute('data-placement')).toBe('outside');
    expect(svg.querySelectorAll('path.leader[data-species="HFeO2-"]').length).toBe(1);
    // Big regions keep an inside label at full size (8 pt default).
    const fe = svg.querySelector('text.region-label[data-species="Fe"]');
    expect(fe.getAttribute('data-placement')).toBe('inside');
    expect(Number(fe.getAttribute('font-size'))).toBe(8);
  });

  it('draws water lines dashed and labels O₂ above and H₂ below', () => {
    const svg = parseSvg(sceneToSvg(buildScene({ model: iron(), options: opts() })));
    const water = [...svg.querySelectorAll('path.water')];
    expect(water.length).toBe(2);
    for (const w of water) expect(w.getAttribute('stroke-dasharray')).toBeTruthy();
    const labels = [...svg.querySelectorAll('text.water-label')].map((t: any) => t.textContent);
    expect(labels.sort()).toEqual(['H2', 'O2']);
  });

  it('always adds the caution line to the caption, and drops the caption on request', () => {
    const on = sceneToSvg(buildScene({ model: iron(), options: opts(), caption: ['My caption.'] }));
    expect(on).toContain('My caption.');
    expect(on).toMatch(/Equilibrium thermodynamics only/);
    const off = sceneToSvg(buildScene({ model: iron(), options: opts({ show: { caption: false } as any }), caption: ['My caption.'] }));
    expect(off).not.toContain('My caption.');
    expect(off).not.toMatch(/Equilibrium thermodynamics only/);
  });

  it('wraps the caption inside the figure width', () => {
    const long = Array.from({ length: 40 }, (_, i) => `word${i}`).join(' ');
    const scene = buildScene({ model: iron(), options: opts(), caption: [long] });
    const caps = texts(scene).filter((t) => t.role === 'caption');
    expect(caps.length).toBeGreaterThan(3);
    const svg = parseSvg(sceneToSvg(scene));
    for (const el of svg.querySelectorAll('text.caption')) {
      const b = el.getBBox();
      expect(b.x + b.width).toBeLessThanOrEqual(scene.widthPt);
    }
  });

  it('applies styles: gray fills are neutral, lines has no fill, overrides win', () => {
    const gray = parseSvg(sceneToSvg(buildScene({ model: iron(), options: opts({ style: 'gray' }) })));
    for (const p of gray.querySelectorAll('path.region')) expect(p.getAttribute('fill')).toMatch(/^#([0-9a-f]{2})\1\1$/);
    const lines = parseSvg(sceneToSvg(buildScene({ model: iron(), options: opts({ style: 'lines' }) })));
    for (const p of lines.querySelectorAll('path.region')) expect(p.getAttribute('fill')).toBe('none');
    const over = parseSvg(sceneToSvg(buildScene({ model: iron(), options: opts({ colors: { Fe: '#D62728' } }) })));
    expect(over.querySelector('path.region[data-species="Fe"]').getAttribute('fill')).toBe('#d62728');
  });

  it('draws the second axis with shifted ticks and its own title', () => {
    const scene = buildScene({ model: iron(), options: opts({ secondAxis: { label: 'E / V vs SCE', offset: 0.241 } }) });
    const t = texts(scene);
    const right = t.filter((x) => x.role === 'tick-label' && x.data?.axis === 'E2');
    // E_SCE = E_SHE − 0.241 V over −1.2…1.6 V vs SHE → −1.441…1.359 V vs SCE.
    expect(right.map((x) => Number(x.data!.value))).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(t.some((x) => x.role === 'axis-title' && x.runs.map((r) => r.text).join('') === 'E / V vs SCE')).toBe(true);
  });

  it('fits a figure too small for its plot by squeezing it, and says how', () => {
    const s = buildScene({ model: iron(), options: opts({ width: 40, height: 30 }), caption: ['x '.repeat(200)] });
    expect(s.notes.join('; ')).toMatch(/height grown from 30 to \d+ mm/);
    expect(s.plot.h).toBeGreaterThan(0);
  });
});

function hasTool(name: string): boolean {
  try {
    execFileSync('which', [name], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}
const poppler = hasTool('pdftotext') && hasTool('pdftoppm');
if (!poppler) console.warn('render tests: pdftotext/pdftoppm (poppler-utils) not installed — PDF text and raster checks skipped');

function pngSize(png: Buffer): { w: number; h: number } {
  // PNG signature then the IHDR chunk: width and height are big-endian uint32 at bytes 16 and 20
  // (W3C PNG Specification, 2nd ed., §11.2.2).
  expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return { w: png.readUInt32BE(16), h: png.readUInt32BE(20) };
}

describe('PDF', () => {
  it('is a reproducible one-page vector PDF', async () => {
    const a = await sceneToPdf(buildScene(full()));
    const b = await sceneToPdf(buildScene(full()));
    expect(a.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(a.equals(b)).toBe(true);
  });

  it.skipIf(!poppler)('holds every label as text and renders with pdftoppm', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'ephmap-pdf-'));
    const file = join(dir, 'fig.pdf');
    const scene = buildScene(full({ width: 170, height: 140, fontSize: 9 }));
    writeFileSync(file, await sceneToPdf(scene));
    const txt = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, '');
    // Minus signs print as U+2212 in the embedded font.
    for (const s of ['Fe', 'Fe2+', 'Fe3+', 'Fe2O3', 'Fe3O4', 'HFeO2\u2212', 'O2', 'H2', 'P1', 'service', 'start-up', 'pH', 'E/VvsSHE', 'Equilibriumthermodynamicsonly']) {
      expect(txt, s).toContain(s);
    }
    // 170 mm at 72 dpi → 482 px wide.
    execFileSync('pdftoppm', ['-r', '72', '-png', '-singlefile', file, join(dir, 'page')]);
    const png = readFileSync(join(dir, 'page.png'));
    const { w, h } = pngSize(png);
    expect(w).toBe(Math.round((170 / 25.4) * 72));
    expect(h).toBe(Math.round((140 / 25.4) * 72));
    expect(readdirSync(dir)).toContain('page.png');
  });
});

describe('PNG', () => {
  it('decodes at the requested width with the figure aspect ratio', async () => {
    const scene = buildScene({ model: iron(), options: opts() });
    const png = await svgToPng(sceneToSvg(scene), 1004);
    const { w, h } = pngSize(png);
    expect(w).toBe(1004);
    expect(h).toBe(Math.round((1004 * 80) / 85));
  });
  it('refuses a silly width', async () => {
    await expect(svgToPng('<svg xmlns="http://www.w3.org/2000/svg"/>', 0)).rejects.toThrow(/whole number of pixels/);
  });
});

describe('extra layers', () => {
  it('draws overlays in their dash style with a legend entry', () => {
    const other = iron();
    // Shift the overlay's boundaries by +0.1 V so it is visibly a second layer.
    for (const b of other.boundaries) b.points = b.points.map(([p, e]) => [p, e + 0.1] as [number, number]);
    const svgText = sceneToSvg(buildScene({ model: iron(), options: opts(), overlays: [{ label: '60 °C', model: other, dash: 'dash' }] }));
    const svg = parseSvg(svgText);
    const ov = [...svg.querySelectorAll('path.overlay')];
    expect(ov.length).toBe(1);
    expect(ov[0].getAttribute('stroke-dasharray')).toBeTruthy();
    expect([...svg.querySelectorAll('text.legend-label')].map((t: any) => t.textContent)).toContain('60 °C');
    expect(() => buildScene({ model: iron(), options: opts(), overlays: [{ label: 'x', model: other, dash: 'wiggly' }] })).toThrow(/dash "wiggly"/);
  });

  it('draws a ligand underlay when asked', () => {
    const m = iron();
    m.ligandRegions = {
      S: [
        { species: 'H2S', phase: 'aq', class: 'dissolved', area: 0, polygons: [[[[0, -1.2], [7, -1.2], [7, 1.6], [0, 1.6]]]] },
        { species: 'HS-', phase: 'aq', class: 'dissolved', area: 0, polygons: [[[[7, -1.2], [14, -1.2], [14, 1.6], [7, 1.6]]]] },
      ],
    };
    const scene = buildScene({ model: m, options: opts({ width: 170, height: 140, show: { ligands: true } as any }) });
    const svg = parseSvg(sceneToSvg(scene));
    expect(svg.querySelectorAll('path.ligand-boundary').length).toBeGreaterThan(0);
    const off = parseSvg(sceneToSvg(buildScene({ model: m, options: opts() })));
    expect(off.querySelectorAll('path.ligand-boundary').length).toBe(0);
  });
});

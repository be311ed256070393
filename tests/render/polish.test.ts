/**
 * Figure polish: dotted overlay patterns stay visible (round caps), touching regions of one class
 * get different tints, operating labels keep clear of each other and of the lines, and the figure
 * can be drawn as vectors into another PDF document (the report).
 */
import { describe, expect, it } from 'vitest';
import { figureInput } from '../../src/figure/compose.js';
import { figureSettings } from '../../src/figure/options.js';
import { compute } from '../../src/pipeline.js';
import { assignFills, CLASS_TINTS, lightness } from '../../src/render/palette.js';
import { drawSceneOnPdf, sceneToPdf } from '../../src/render/pdf.js';
import { buildScene, dashStroke, parseDash, type FigureInput } from '../../src/render/scene.js';
import type { Point, Rect, ScenePath, SceneText } from '../../src/render/scene-types.js';
import { sceneToSvg } from '../../src/render/svg.js';
import { DEFAULT_FIGURE } from '../../src/render/options.js';
import { reportData } from '../../src/report/report-data.js';
import { reportPdf } from '../../src/report/report-pdf.js';
import { readSpec } from '../../src/system/spec.js';
import { iron, allItems } from './helpers.js';

const all = allItems;

const overlap = (a: Rect, b: Rect): boolean => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

function segHitsBox(a: Point, b: Point, r: Rect): boolean {
  // Fine sampling, independent of the renderer's geometry code.
  for (let i = 0; i <= 400; i++) {
    const x = a[0] + (i / 400) * (b[0] - a[0]);
    const y = a[1] + (i / 400) * (b[1] - a[1]);
    if (x > r.x && x < r.x + r.w && y > r.y && y < r.y + r.h) return true;
  }
  return false;
}

const segments = (p: ScenePath): [Point, Point][] => p.subpaths.flatMap((sp) => sp.points.slice(1).map((q, k) => [sp.points[k]!, q] as [Point, Point]));

describe('dotted dash patterns', () => {
  const input = (): FigureInput => ({
    model: iron(),
    options: { ...DEFAULT_FIGURE, show: { ...DEFAULT_FIGURE.show } },
    overlays: [
      { label: 'dotted layer', model: iron(), dash: 'dot' },
      { label: 'dash-dot layer', model: iron(), dash: 'dashdot' },
      { label: 'dashed layer', model: iron(), dash: 'dash' },
    ],
  });

  it('draws dot and dashdot overlays (lines and legend samples) with round caps, plain dashes with butt caps', () => {
    const svg = sceneToSvg(buildScene(input()));
    const overlays = [...svg.matchAll(/<path class="overlay"([^>]*)\/>/g)].map((m) => m[1]!);
    expect(overlays).toHaveLength(3);
    const cap = (attrs: string): string | undefined => / stroke-linecap="([^"]*)"/.exec(attrs)?.[1];
    const label = (attrs: string): string | undefined => / data-label="([^"]*)"/.exec(attrs)?.[1];
    for (const o of overlays) expect(cap(o), label(o)).toBe(label(o) === 'dashed layer' ? undefined : 'round');
    // The legend samples of the two dotted layers have round caps too.
    const legendLines = [...svg.matchAll(/<path class="legend-line"([^>]*)\/>/g)].map((m) => m[1]!);
    expect(legendLines.filter((l) => cap(l) === 'round')).toHaveLength(2);
  });

  it('keeps the visible gaps when round caps lengthen every dash (gaps widened by the line width)', () => {
    const d = parseDash('dashdot', 1)!;
    const st = dashStroke(d, 0.8);
    expect(st.lineCap).toBe('round');
    // Dashes unchanged, gaps + 0.8 pt, so dash + caps + gap spans the same as before plus nothing hidden.
    expect(st.dash).toEqual([d[0], d[1]! + 0.8, d[2], d[3]! + 0.8]);
    expect(dashStroke(parseDash('dash', 1), 0.8)).toEqual({ dash: parseDash('dash', 1), lineCap: 'butt' });
    expect(dashStroke(null, 1)).toEqual({ dash: null, lineCap: 'butt' });
  });

  it('tells the PDF writer to use round caps (pdfkit draws from the same scene paths)', () => {
    const paths = all(buildScene(input())).filter((p): p is ScenePath => p.type === 'path' && p.role === 'overlay');
    expect(paths.map((p) => p.lineCap)).toEqual(['round', 'round', 'butt']);
  });
});

describe('tints of touching regions', () => {
  // Iron–sulfur at 120 °C, S 10⁻²: FeS, FeS₂ and Fe₃O₄ touch each other pairwise (a triangle), and
  // Fe₂O₃ touches FeS₂ and Fe₃O₄; two tints per class cannot tell them apart.
  const species = ['Fe', 'Fe+2', 'Fe3O4', 'Fe2O3', 'FeS', 'FeS2'];
  const cls = ['element', 'dissolved', 'solid', 'solid', 'solid', 'solid'] as const;
  const edges: [string, string][] = [
    ['Fe', 'Fe+2'], ['Fe', 'Fe3O4'], ['Fe', 'FeS'], ['Fe+2', 'Fe2O3'], ['Fe+2', 'FeS'], ['Fe+2', 'FeS2'],
    ['Fe2O3', 'FeS2'], ['Fe3O4', 'Fe2O3'], ['Fe3O4', 'FeS'], ['Fe3O4', 'FeS2'], ['FeS', 'FeS2'],
  ];
  const requests = species.map((s, i) => ({
    species: s,
    class: cls[i]!,
    neighbours: edges.filter((e) => e.includes(s)).map((e) => species.indexOf(e[0] === s ? e[1] : e[0])),
  }));

  it('colours the same-class adjacency graph properly, in colour and in gray (≥ 4.5 L* apart)', () => {
    for (const style of ['color', 'gray'] as const) {
      const f = assignFills(requests, style, {});
      for (const [a, b] of edges) {
        const i = species.indexOf(a);
        const j = species.indexOf(b);
        expect(f[i], `${a} vs ${b} (${style})`).not.toBe(f[j]);
        if (cls[i] === cls[j]) expect(Math.abs(lightness(f[i]!) - lightness(f[j]!)), `${a} vs ${b} (${style})`).toBeGreaterThanOrEqual(4.5);
      }
      expect(assignFills(requests, style, {})).toEqual(f);
    }
  });

  it('gives the largest region of a class its first tint (the legend swatch) when it can', () => {
    const withArea = requests.map((r) => ({ ...r, area: r.species === 'Fe2O3' ? 100 : 1 }));
    expect(assignFills(withArea, 'color', {})[species.indexOf('Fe2O3')]).toBe(CLASS_TINTS.solid[0]);
  });

  it('falls back to the fewest clashes when a class has more mutually touching regions than tints', () => {
    // Four dissolved regions all touching each other (K4) with three tints: exactly one clash.
    const k4 = [0, 1, 2, 3].map((i) => ({ species: `X${i}`, class: 'dissolved' as const, neighbours: [0, 1, 2, 3].filter((j) => j !== i) }));
    const f = assignFills(k4, 'color', {});
    let clashes = 0;
    for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) if (f[i] === f[j]) clashes++;
    expect(clashes).toBe(1);
  });

  it('on the computed iron–sulfur diagram, no two touching regions share a fill', () => {
    const spec = readSpec({ element: 'Fe', temperature: 120, ligands: { S: 1e-2 }, pH: [2, 12], E: [-1.2, 0.8] }, 'sour.yaml');
    const c = compute(spec);
    for (const style of ['color', 'gray']) {
      const scene = buildScene(figureInput(c, figureSettings(spec, { width: '170', style })));
      const fill = new Map<string, string>();
      for (const p of all(scene)) if (p.type === 'path' && p.role === 'region') fill.set(p.data!.species!, p.fill!);
      const solids = c.model.regions.filter((r) => r.class === 'solid').map((r) => r.species);
      expect(solids.length).toBeGreaterThanOrEqual(3);
      for (const b of c.model.boundaries) {
        const [x, y] = b.between;
        if (!fill.has(x) || !fill.has(y) || x === y) continue;
        expect(fill.get(x), `${x} | ${y} (${style})`).not.toBe(fill.get(y));
      }
    }
  }, 30000);
});

describe('operating labels', () => {
  // A box and two points close together, a path ending next to them (the case where "normal
  // operation" and "outlet" used to collide).
  const spec = readSpec(
    {
      element: 'Fe',
      activity: 1e-6,
      pH: [4, 12],
      E: [-1.2, 0.8],
      points: [
        { label: 'outlet', pH: 8.2, E: -0.35 },
        { label: 'inlet', pH: 7.9, E: -0.45 },
        { label: 'supply, steady', pH: 9.8, E: -0.62 },
      ],
      boxes: [{ label: 'normal operation', pH: [7.5, 8.5], E: [-0.5, -0.3] }],
      paths: [
        { label: 'start-up', points: [[6.5, -0.1], [7.6, -0.3]] },
        { label: 'heat-up', points: [[10.5, 0.2], [9.8, -0.62]] },
      ],
    },
    'close.yaml',
  );
  const c = compute(spec);
  for (const width of ['85', '170']) {
    it(`keeps point, box and path labels off each other, the region labels and the boundaries (${width} mm)`, () => {
      const scene = buildScene(figureInput(c, figureSettings(spec, { width })));
      const items = all(scene);
      const texts = items.filter((t): t is SceneText => t.type === 'text' && t.box !== undefined && t.rotate === 0);
      const marks = texts.filter((t) => ['point-label', 'box-label', 'path-label'].includes(t.role));
      expect(marks.map((t) => t.data!.label).sort()).toEqual(['heat-up', 'inlet', 'normal operation', 'outlet', 'start-up', 'supply, steady']);
      for (const m of marks) {
        for (const t of texts) if (t !== m) expect(overlap(m.box!, t.box!), `${m.data!.label} vs ${t.data?.label ?? t.data?.species ?? t.role}`).toBe(false);
        for (const b of items.filter((p): p is ScenePath => p.type === 'path' && p.role === 'boundary'))
          for (const [p, q] of segments(b)) expect(segHitsBox(p, q, m.box!), `${m.data!.label} crosses ${b.data!.between}`).toBe(false);
        // Inside the plot.
        const r = scene.plot;
        expect(m.box!.x >= r.x && m.box!.y >= r.y && m.box!.x + m.box!.w <= r.x + r.w && m.box!.y + m.box!.h <= r.y + r.h).toBe(true);
      }
      // Leaders of mark labels never run through a text.
      for (const l of items.filter((p): p is ScenePath => p.type === 'path' && p.role === 'leader' && p.data?.label !== undefined)) {
        const [a, b] = l.subpaths[0]!.points as [Point, Point];
        for (const t of texts) if (t.data?.label !== l.data!.label) expect(segHitsBox(a, b, t.box!), `leader of ${l.data!.label} through ${t.role}`).toBe(false);
      }
    });
  }

  it('stops a path that ends on an operating point at the marker, so the arrowhead shows', () => {
    const scene = buildScene(figureInput(c, figureSettings(spec, { width: '170' })));
    const items = all(scene);
    const point = items.find((p) => p.type === 'circle' && p.role === 'point' && p.data!.label === 'supply, steady');
    const path = items.find((p): p is ScenePath => p.type === 'path' && p.role === 'path' && p.data!.label === 'heat-up')!;
    expect(point?.type).toBe('circle');
    if (point?.type !== 'circle') return;
    const pts = path.subpaths[path.subpaths.length - 1]!.points;
    const end = pts[pts.length - 1]!;
    expect(Math.hypot(end[0] - point.cx, end[1] - point.cy)).toBeGreaterThanOrEqual(point.r);
  });
});

describe('vector figure inside another PDF', () => {
  const scene = buildScene({ model: iron(), options: { ...DEFAULT_FIGURE, show: { ...DEFAULT_FIGURE.show } } });

  it('draws the scene at an offset and scale into an existing pdfkit document', async () => {
    const { default: PDFDocument } = await import('pdfkit');
    const doc = new PDFDocument({ size: 'A4', compress: false, info: { CreationDate: new Date(Date.UTC(2000, 0, 1)) } });
    const chunks: Buffer[] = [];
    const done = new Promise<Buffer>((resolve) => {
      doc.on('data', (b: Buffer) => chunks.push(b));
      doc.on('end', () => resolve(Buffer.concat(chunks)));
    });
    doc.y = 300;
    const size = drawSceneOnPdf(doc, scene, { x: 100, y: 120, width: scene.widthPt / 2 });
    expect(size.width).toBeCloseTo(scene.widthPt / 2, 9);
    expect(size.height).toBeCloseTo(scene.heightPt / 2, 9);
    // The text cursor is put back.
    expect(doc.y).toBe(300);
    doc.end();
    const pdf = (await done).toString('latin1');
    expect(pdf.match(/\/Type \/Page\b/g)).toHaveLength(1);
    // pdfkit flips y (its user space has y down): translate(100, 120) then scale(0.5) gives the
    // matrix [0.5 0 0 -0.5 100 page_height-120] relative to the page, written as "cm" operators.
    expect(pdf).toMatch(/1 0 0 1 100 120 cm/);
    expect(pdf).toMatch(/0\.5 0 0 0\.5 0 0 cm/);
    expect(pdf).not.toMatch(/\/Subtype \/Image/);
    // The bundled font, embedded (a TrueType font file stream), not a standard font.
    expect(pdf).toMatch(/DejaVuSans/);
    expect(pdf).toMatch(/\/FontFile2/);
    expect(pdf).not.toMatch(/Helvetica/);
  });

  it('keeps sceneToPdf deterministic', async () => {
    const a = await sceneToPdf(scene);
    const b = await sceneToPdf(scene);
    expect(a.equals(b)).toBe(true);
  });

  it('embeds the report figure as vectors (no image), deterministically', async () => {
    const spec = readSpec({ element: 'Fe', activity: 1e-6, E: [-1.2, 1.6] }, 'fe.yaml');
    const c = compute(spec);
    const fig = figureSettings(spec, { width: '160' });
    const s = buildScene(figureInput(c, fig));
    const make = () => reportPdf(reportData(c), s, { width: fig.options.width, height: fig.options.height }, ['caption']);
    const a = await make();
    const b = await make();
    expect(a.equals(b)).toBe(true);
    expect(a.toString('latin1')).not.toMatch(/\/Subtype \/Image/);
  }, 30000);
});

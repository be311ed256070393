/**
 * Interactive HTML page (no browser): self-contained, escaped, deterministic, and its embedded
 * data maps figure ↔ (pH, E) consistently with the drawn plot frame. The behaviour in a real
 * browser is in tests/browser/html.test.ts.
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { type FigureOptions } from '../../src/render/options.js';
import { buildScene } from '../../src/render/scene.js';
import { equationInScale, formulaUnicode, pageData, reactionUnicode, referenceName, sceneToHtml, signMinus } from '../../src/render/html.js';
import { iron, opts } from './helpers.js';


function page(o: Partial<FigureOptions> = {}): string {
  const model = iron();
  const options = opts(o);
  return sceneToHtml(buildScene({ model, options }), model, options);
}

describe('HTML page', () => {
  it('is one self-contained file: no external resources, no eval, a CSP that admits only its own script and style', () => {
    const html = page();
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    // The only URL is the SVG namespace name (an identifier, never fetched).
    const urls = html.match(/\b(?:https?|ftp):\/\/[^\s"'<>)]+/g) ?? [];
    expect(new Set(urls)).toEqual(new Set(['http://www.w3.org/2000/svg']));
    expect(html).not.toMatch(/<(?:link|img|iframe|object|embed)\b/i);
    expect(html).not.toMatch(/\bsrc\s*=/i);
    expect(html).not.toMatch(/\beval\s*\(|new Function|setTimeout\s*\(\s*['"]/);
    expect(html).not.toMatch(/@import|url\((?!#)/);
    // CSP hashes match the inline script and style exactly (CSP Level 2 hash sources).
    const script = /<script>([\s\S]*?)<\/script>/.exec(html)![1]!;
    const style = /<style>([\s\S]*?)<\/style>/.exec(html)![1]!;
    const h = (s: string) => createHash('sha256').update(s, 'utf8').digest('base64');
    expect(html).toContain(`script-src 'sha256-${h(script)}'`);
    expect(html).toContain(`style-src 'sha256-${h(style)}'`);
    expect(html).toContain("default-src 'none'");
  });

  it('is keyboard accessible and prints without the read-out', () => {
    const html = page();
    expect(html).toMatch(/<div class="ephmap-plot" id="ephmap-plot" tabindex="0"/);
    expect(html).toMatch(/id="ephmap-readout" role="status" aria-live="polite"/);
    expect(html).toMatch(/\.ephmap-plot:focus \{ outline: 3px solid/);
    expect(html).toMatch(/@media print \{[\s\S]*\.ephmap-controls, \.ephmap-overlay \{ display: none !important; \}/);
  });

  it('gives the same bytes for the same input', () => {
    expect(page()).toBe(page());
  });

  it('escapes user text everywhere', () => {
    const evil = '</script><script>alert(1)</script> & "q" <b>';
    const model = iron();
    model.regions[0]!.name = evil;
    const options = opts({ title: evil, show: { title: true } as FigureOptions['show'] });
    const html = sceneToHtml(buildScene({ model, options }), model, options);
    expect(html).not.toContain('<script>alert(1)');
    expect(html).not.toContain('<b>');
    // Exactly two script elements: the JSON data block and the page script.
    expect(html.match(/<script\b/g)).toHaveLength(2);
    expect(html.match(/<\/script>/g)).toHaveLength(2);
    expect(html).toContain('&lt;/script&gt;');
    // The data block parses back to the original text.
    const json = /<script type="application\/json" id="ephmap-data">([\s\S]*?)<\/script>/.exec(html)![1]!;
    expect(JSON.parse(json).regions[0].name).toBe(evil);
  });

  it('embeds a frame that maps the domain corners onto the plot corners', () => {
    const model = iron();
    const scene = buildScene({ model, options: opts() });
    const d = pageData(scene, model);
    const p = scene.plot;
    expect(d.frame.pH).toEqual(model.domain.pH);
    expect(d.frame.E).toEqual(model.domain.E);
    expect(d.frame.x0).toBeCloseTo(p.x, 5);
    expect(d.frame.x1).toBeCloseTo(p.x + p.w, 5);
    expect(d.frame.y0).toBeCloseTo(p.y + p.h, 5); // lowest E at the bottom edge
    expect(d.frame.y1).toBeCloseTo(p.y, 5);
    // The read-out words for the region classes (trade terms, common practice).
    expect(d.regions.find((r) => r.formula === 'Fe')!.reading).toBe('immunity');
    expect(d.regions.find((r) => r.formula === 'Fe+2')!.reading).toBe('corrosion');
    expect(d.regions.find((r) => r.formula === 'Fe2O3')!.reading).toBe('passivation');
  });

  it('typesets formulas and reactions in Unicode for the read-out', () => {
    expect(formulaUnicode('Fe^2+')).toBe('Fe\u00b2\u207a');
    expect(formulaUnicode('HFeO2^-')).toBe('HFeO\u2082\u207b');
    expect(formulaUnicode('Fe3O4')).toBe('Fe\u2083O\u2084');
    expect(reactionUnicode('Fe2O3(s) + 6H+ + 2e- = 2Fe+2 + 3H2O(l)')).toBe('Fe\u2082O\u2083(s) + 6H\u207a + 2e\u207b \u21cc 2Fe\u00b2\u207a + 3H\u2082O(l)');
    expect(reactionUnicode('Fe2O3(s) + 6H^+ + 2e^- <=> 2Fe^2+ + 3H2O(l)')).toBe('Fe\u2082O\u2083(s) + 6H\u207a + 2e\u207b \u21cc 2Fe\u00b2\u207a + 3H\u2082O(l)');
    expect(signMinus('E = -0.0867 - 0.0592 pH V vs SHE')).toBe('E = \u22120.0867 \u2212 0.0592 pH V vs SHE');
  });

  it('restates a line in the second reference scale: E_ref = E_SHE − offset', () => {
    // Saturated calomel electrode +0.241 V vs SHE at 25 °C (common practice; Bard & Faulkner,
    // Electrochemical Methods, 2nd ed., Table C.1 — recalled from memory).
    expect(referenceName('E / V vs SCE')).toBe('SCE');
    expect(equationInScale({ kind: 'E', intercept: -0.44, slope: 0, n: 2, m: 0 }, 0.241, 'SCE')).toBe('E = \u22120.6810 V vs SCE');
    expect(equationInScale({ kind: 'E', intercept: 1.013, slope: -0.1775, n: 2, m: 6 }, 0.241, 'SCE')).toBe('E = 0.7720 \u2212 0.1775 pH V vs SCE');
    expect(equationInScale({ kind: 'pH', value: 1.375, n: 0, m: 6 }, 0.241, 'SCE')).toBeNull();
    const html = page({ secondAxis: { label: 'E / V vs SCE', offset: 0.241 } });
    expect(html).toContain('"second":{"name":"SCE","offset":0.241}');
    expect(html).toContain('V vs SHE and SCE');
  });
});

/**
 * Unicode super/subscripts in figure text become sup/sub runs (so SVG, PDF and PNG typeset them
 * alike), and the PDF backend maps what the standard fonts cannot show to safe equivalents.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sceneToPdf } from '../../src/render/pdf.js';
import { buildScene } from '../../src/render/scene.js';
import { sceneToSvg } from '../../src/render/svg.js';
import { expandScripts, plainRuns, richRuns, runsUnicode, scriptRuns } from '../../src/render/typeset.js';
import { iron, texts, opts } from './helpers.js';



function hasTool(name: string): boolean {
  try {
    execFileSync('which', [name], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

describe('Unicode scripts as runs', () => {
  it('splits superscript and subscript characters into sup/sub runs', () => {
    expect(scriptRuns('10\u207b\u2076')).toEqual([
      { text: '10', shift: 'normal' },
      { text: '\u22126', shift: 'sup' },
    ]);
    expect(scriptRuns('p(O\u2082)')).toEqual([
      { text: 'p(O', shift: 'normal' },
      { text: '2', shift: 'sub' },
      { text: ')', shift: 'normal' },
    ]);
    expect(plainRuns('H\u2082O', true)).toEqual([
      { text: 'H', shift: 'normal', italic: true },
      { text: '2', shift: 'sub', italic: true },
      { text: 'O', shift: 'normal', italic: true },
    ]);
    expect(plainRuns('no scripts here')).toEqual([{ text: 'no scripts here', shift: 'normal' }]);
    expect(richRuns('{O2} at 10\u207b\u00b3 bar').map((r) => `${r.shift}:${r.text}`)).toEqual(['normal:O', 'sub:2', 'normal: at 10', 'sup:\u22123', 'normal: bar']);
    // Round trip to Unicode for the HTML read-out.
    expect(runsUnicode(expandScripts([{ text: 'Fe\u00b2\u207a', shift: 'normal' }]))).toBe('Fe\u00b2\u207a');
  });

  it('typesets a caption with 10⁻⁶, H₂O and p(O₂) as scripts in the scene and the SVG', () => {
    const scene = buildScene({ model: iron(), options: opts(), caption: ['Fe\u2013H\u2082O; activity 10\u207b\u2076; p(O\u2082) = 1 bar.'] });
    const cap = texts(scene).filter((t) => t.role === 'caption');
    const runs = cap.flatMap((t) => t.runs);
    expect(runs.some((r) => r.shift === 'sup' && r.text === '\u22126')).toBe(true);
    expect(runs.filter((r) => r.shift === 'sub' && r.text === '2')).toHaveLength(2);
    for (const t of texts(scene)) for (const r of t.runs) expect(r.text).not.toMatch(/[\u2070-\u208e\u00b2\u00b3\u00b9]/);
    const svg = sceneToSvg(scene);
    expect(svg).toMatch(/<tspan dy="-?[\d.]+" font-size="[\d.]+">\u22126<\/tspan>/);
  });
});

describe('PDF text in the bundled font', () => {
  it.skipIf(!hasTool('pdftotext'))('prints a caption with 10⁻⁶, H₂O and p(O₂) without "?"', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'ephmap-pdf-unicode-'));
    const file = join(dir, 'fig.pdf');
    const scene = buildScene({ model: iron(), options: opts({ width: 170, height: 140 }), caption: ['Fe\u2013H\u2082O at 25 \u00b0C; dissolved Fe activity 10\u207b\u2076; p(O\u2082) = 1 bar, iron (\u03b1).'] });
    writeFileSync(file, await sceneToPdf(scene));
    const txt = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
    expect(txt).not.toContain('?');
    const flat = txt.replace(/\s+/g, '');
    // Scripts are separate text runs at a raised/lowered baseline: the digits are all there.
    expect(flat).toContain('activity10');
    expect(flat).toContain('10\u22126'); // the real minus sign, as a raised run
    expect(flat).toContain('H2O');
    expect(flat).toContain('p(O2)=1bar');
    expect(flat).toContain('iron(\u03b1)'); // Greek prints as itself (embedded font)
  });
});

/**
 * The bundled font (issue 17): metrics from DejaVu Sans, the PDF embeds it (pdffonts lists every
 * font as embedded, where pdffonts exists), Unicode text prints as itself (Σ, ⇌, Greek, arrows, °,
 * ±, −), PNG is drawn from the bundled files only, --font other than DejaVu Sans is refused for
 * PDF and PNG.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { renderFigure } from '../../src/figure/output.js';
import { charWidth, stringWidth } from '../../src/render/metrics.js';
import { iron, opts } from './helpers.js';

function hasTool(name: string): boolean {
  try {
    execFileSync('which', [name], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

describe('metrics of the bundled font', () => {
  it('uses DejaVu Sans advance widths', () => {
    // DejaVu Sans: "H" advance 1540/2048 em = 0.752 em, bold 1716/2048 = 0.838 em; digits 1303/2048 = 0.636 em.
    expect(charWidth('H')).toBeCloseTo(0.752, 3);
    expect(charWidth('H', true)).toBeGreaterThan(0.83);
    expect(stringWidth('10', 10)).toBeCloseTo(12.72, 1);
    // Characters the tool prints are in the table (not the 0.6 em guess).
    for (const ch of ['\u03a3', '\u21cc', '\u2192', '\u00b0', '\u00b1', '\u2212', '\u03b2', '\u0394', '\u207b', '\u2082']) expect(charWidth(ch)).not.toBe(0.6);
  });
});

describe('figure PDF fonts', () => {
  const title = 'Σ β Δ → ⇌ ° ± − 10⁻⁶ H₂O';
  it('prints every glyph as itself and embeds the font', async () => {
    const pdf = (await renderFigure({ model: iron(), options: opts({ title, show: { ...opts().show, title: true } }) }, 'pdf')) as Uint8Array;
    const s = Buffer.from(pdf).toString('latin1');
    expect(s).toMatch(/DejaVuSans/);
    expect(s).not.toMatch(/Helvetica/);
    if (!hasTool('pdffonts')) return;
    const dir = mkdtempSync(join(tmpdir(), 'ephmap-fonts-'));
    const f = join(dir, 'f.pdf');
    writeFileSync(f, pdf);
    const rows = execFileSync('pdffonts', [f], { encoding: 'utf8' }).split('\n').slice(2).filter((l) => l.trim());
    expect(rows.length).toBeGreaterThan(0);
    // Columns: name type encoding emb sub uni object ID; every font embedded and subset.
    for (const r of rows) expect(r).toMatch(/DejaVuSans\S*\s+CID TrueType\s+\S+\s+yes\s+yes/);
    if (hasTool('pdftotext')) {
      const txt = execFileSync('pdftotext', [f, '-'], { encoding: 'utf8' });
      for (const ch of ['Σ', 'β', 'Δ', '→', '⇌', '±', '−']) expect(txt).toContain(ch);
    }
  });
});

describe('--font', () => {
  it('is refused clearly for PDF and PNG unless it names the bundled family', async () => {
    for (const fmt of ['pdf', 'png'] as const) {
      await expect(renderFigure({ model: iron(), options: opts({ fontFamily: 'Times' }) }, fmt)).rejects.toBeInstanceOf(InputError);
      await expect(renderFigure({ model: iron(), options: opts({ fontFamily: 'Times' }) }, fmt)).rejects.toThrow(/DejaVu Sans for/);
    }
    expect(await renderFigure({ model: iron(), options: opts({ fontFamily: "'DejaVu Sans', sans-serif" }) }, 'pdf')).toBeInstanceOf(Uint8Array);
  });
  it('sets the SVG font-family', async () => {
    const svg = (await renderFigure({ model: iron(), options: opts({ fontFamily: 'Times' }) }, 'svg')) as string;
    expect(svg).toMatch(/font-family="Times"/);
  });
});

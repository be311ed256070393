/**
 * PDF: a scene path with neither fill nor stroke (every region in the 'lines' style) paints
 * nothing. It used to be built and left current, so the next fill (in composition figures the grey
 * of the undetermined areas) painted the whole plot grey. Checked by rasterising with pdftoppm
 * (poppler-utils; skipped where missing) and reading the pixel at the unpainted square's centre.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sceneToPdf } from '../../src/render/pdf.js';
import type { Scene, ScenePath } from '../../src/render/scene-types.js';
import { tmpDir } from '../helpers/tmp.js';

function hasTool(name: string): boolean {
  try {
    execFileSync('which', [name], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}
const poppler = hasTool('pdftoppm');
if (!poppler) console.warn('pdf-unpainted: pdftoppm (poppler-utils) not installed — raster check skipped');

const square = (x: number, y: number, s: number, fill: string | null): ScenePath => ({
  type: 'path',
  role: 'region',
  subpaths: [{ points: [[x, y], [x + s, y], [x + s, y + s], [x, y + s]], closed: true }],
  fill,
  stroke: null,
  strokeWidth: 0,
  dash: null,
});

/** The RGB of pixel (x, y) of a binary PPM (P6, maxval 255). */
function ppmPixel(buf: Buffer, x: number, y: number): number[] {
  const head = buf.toString('latin1', 0, 64).match(/^P6\s+(\d+)\s+(\d+)\s+(\d+)\s/)!;
  const w = Number(head[1]);
  const off = head[0].length + (y * w + x) * 3;
  return [buf[off], buf[off + 1], buf[off + 2]];
}

describe('PDF: unpainted paths', () => {
  it.skipIf(!poppler)('leave the page white where a later fill does not reach', async () => {
    const scene = {
      widthPt: 100,
      heightPt: 100,
      widthMm: 35.28,
      heightMm: 35.28,
      fontFamily: 'DejaVu Sans',
      background: '#ffffff',
      plot: { x: 0, y: 0, w: 100, h: 100 },
      items: [square(10, 10, 60, null), square(80, 80, 10, '#404040')],
      title: 't',
      notes: [],
    } as unknown as Scene;
    const dir = tmpDir();
    const file = join(dir, 'u.pdf');
    writeFileSync(file, await sceneToPdf(scene));
    execFileSync('pdftoppm', ['-r', '72', '-singlefile', file, join(dir, 'u')]);
    const ppm = readFileSync(join(dir, 'u.ppm'));
    expect(ppmPixel(ppm, 40, 40)).toEqual([255, 255, 255]);
    expect(ppmPixel(ppm, 85, 85)).toEqual([64, 64, 64]);
  });
});

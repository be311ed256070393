/** The one PDF text mapping shared by the figure and the report (standard Helvetica, WinAnsi). */
import { describe, expect, it } from 'vitest';
import { pdfText, winAnsi } from '../../src/render/pdf-text.js';

describe('pdf text', () => {
  it('gives the figure and the report the same characters', () => {
    // The report once mapped − to "-" and knew fewer Greek letters than the figure.
    for (const s of ['\u22120.44 V', '\u03b8 = 25 \u00b0C', 'constant \u0394H and \u0394S', 'a \u2264 1 \u2192 b']) expect(pdfText(s)).toBe(winAnsi(s));
    expect(pdfText('constant \u0394H')).toBe('constant Delta H');
    expect(pdfText('\u03b8, \u03c9')).toBe('theta, omega');
  });
  it('marks superscript runs outside Latin-1 with ^ in running text only', () => {
    expect(pdfText('10\u207b\u2076 mol/kg')).toBe('10^-6 mol/kg');
    expect(pdfText('Fe\u00b2\u207a')).toBe('Fe^2+');
    expect(pdfText('m\u00b2')).toBe('m\u00b2'); // ² is in WinAnsi
    expect(winAnsi('10\u207b\u2076')).toBe('10-6'); // figure runs are raised already
  });
});

/**
 * The one line-equation text. Values: Fe²⁺ + 2e⁻ = Fe(s) at a = 10⁻⁶, E° = −0.447 V (Bard, Parsons &
 * Jordan, Standard Potentials in Aqueous Solution, 1985), 25 °C Nernst slope 0.05916 V per decade:
 * E = −0.447 + 0.02958·(−6) = −0.6245 V; SCE offset 0.241 V (common practice).
 */
import { describe, expect, it } from 'vitest';
import { lineEquationText } from '../../src/diagram/line-text.js';
import { equationInScale } from '../../src/render/html.js';
import { equationAgainst } from '../../src/report/lines.js';

describe('line equation text', () => {
  const fe = { kind: 'E' as const, intercept: -0.447 + (0.05916 / 2) * -6, slope: 0, n: 2, m: 0 };
  const sloped = { kind: 'E' as const, intercept: 1.013, slope: -0.1775, n: 2, m: 6 };
  const ph = { kind: 'pH' as const, value: 9.3, n: 0, m: 2 };
  it('writes potential and pH lines in the SHE scale', () => {
    expect(lineEquationText(fe)).toBe('E = -0.6245 V vs SHE');
    expect(lineEquationText(sloped)).toBe('E = 1.0130 - 0.1775 pH V vs SHE');
    expect(lineEquationText({ ...sloped, slope: 0.0591 })).toBe('E = 1.0130 + 0.0591 pH V vs SHE');
    expect(lineEquationText(ph)).toBe('pH = 9.300');
  });
  it('never prints a negative zero', () => {
    expect(lineEquationText({ ...fe, intercept: -0.00001 })).toBe('E = 0.0000 V vs SHE');
    expect(lineEquationText({ ...ph, value: -0.0001 })).toBe('pH = 0.000');
  });
  it('moves the intercept to another scale, with the chosen minus sign', () => {
    expect(lineEquationText(fe, { scale: 'SCE', offset: 0.241 })).toBe('E = -0.8655 V vs SCE');
    expect(lineEquationText(sloped, { scale: 'SCE', offset: 0.241, minus: '\u2212' })).toBe('E = 0.7720 \u2212 0.1775 pH V vs SCE');
  });
  it('is the text of the report table and the HTML read-out', () => {
    expect(equationAgainst(sloped, { label: 'SCE', offset: 0.241 })).toBe('E = 0.7720 - 0.1775 pH V vs SCE');
    expect(equationInScale(fe, 0.241, 'SCE')).toBe('E = \u22120.8655 V vs SCE');
    expect(equationAgainst(ph, { label: 'SCE', offset: 0.241 })).toBe('pH = 9.300');
  });
});

/**
 * Region fills. Each class has two tints whose CIE L* (lightness) differ; the classes sit at
 * separate lightness bands (element darkest, dissolved lightest) so that a grayscale copy or a
 * reader with a red–green colour-vision deficiency still tells classes and neighbours apart:
 *
 *   element   (immunity)     blue-grey     L* ≈ 65 / 71
 *   solid     (passivation)  teal / olive  L* ≈ 76.5 / 82.5
 *   gas                      mauve         L* ≈ 87.5 / 58 (second tint only for gas next to gas)
 *   dissolved (corrosion)    cream / peach L* ≈ 97.5 / 92.5
 *
 * Chroma is low (C* 12–18) so that black text and lines keep full contrast.
 *
 * Neighbouring regions of the same class get different tints (greedy colouring in a fixed order).
 */
import type { RegionClass } from '../model.js';

export const CLASS_TINTS: Record<RegionClass, readonly string[]> = {
  element: ['#89a1b6', '#96b2bf'],
  solid: ['#a0c5b5', '#c9d1b3'],
  dissolved: ['#fff6dd', '#ffe4c9'],
  gas: ['#e7d6ea', '#90889f'],
};

/** Words for the class legend (trade terms for the usual reading of a region class). */
export const CLASS_NAMES: Record<RegionClass, string> = {
  element: 'metal (immunity)',
  solid: 'solid (passivation)',
  dissolved: 'dissolved (corrosion)',
  gas: 'gas',
};

/** Parses "#rgb" or "#rrggbb" into 0…255 channels; throws Error on anything else. */
export function parseHex(color: string): [number, number, number] {
  const m = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(color.trim());
  if (!m) throw new Error(`colour "${color}" must be #rgb or #rrggbb`);
  let h = m[1]!;
  if (h.length === 3) h = h[0]! + h[0]! + h[1]! + h[1]! + h[2]! + h[2]!;
  return [parseInt(h.slice(0, 2), 16), parseInt(h.slice(2, 4), 16), parseInt(h.slice(4, 6), 16)];
}

function toLinear(c8: number): number {
  const c = c8 / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function fromLinear(c: number): number {
  const v = c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
  return Math.round(Math.min(1, Math.max(0, v)) * 255);
}

/**
 * Relative luminance Y (0…1) of an sRGB colour: Y = 0.2126 R + 0.7152 G + 0.0722 B on linear
 * channels (IEC 61966-2-1 sRGB transfer function, ITU-R BT.709 primaries, D65).
 */
export function luminance(color: string): number {
  const [r, g, b] = parseHex(color);
  return 0.2126 * toLinear(r) + 0.7152 * toLinear(g) + 0.0722 * toLinear(b);
}

/**
 * CIE 1976 lightness L* (0…100) of an sRGB colour: L* = 116·f(Y) − 16 with f(t) = t^(1/3) for
 * t > (6/29)³, else t/(3·(6/29)²) + 4/29. Example: #777777 → L* ≈ 50.0.
 */
export function lightness(color: string): number {
  const y = luminance(color);
  const e = (6 / 29) ** 3;
  const f = y > e ? Math.cbrt(y) : y / (3 * (6 / 29) ** 2) + 4 / 29;
  return 116 * f - 16;
}

/** The neutral gray with the same L* (and so the same relative luminance) as `color`. */
export function toGray(color: string): string {
  const v = fromLinear(luminance(color));
  const h = v.toString(16).padStart(2, '0');
  return `#${h}${h}${h}`;
}

/** Normalises a CSS colour for output: hex lower-cased; named colours and rgb() passed through. */
export function normColor(color: string): string {
  const c = color.trim();
  return /^#[0-9a-f]{3,6}$/i.test(c) ? c.toLowerCase() : c;
}

export interface FillRequest {
  species: string;
  class: RegionClass;
  /** Indices of neighbouring regions (sharing a boundary). */
  neighbours: number[];
}

/**
 * Assigns a fill to every region: a per-species override wins; otherwise the tint of its class
 * that differs most in L* from the neighbours coloured so far (ties → first tint). Regions are
 * visited in the given order, so the result is deterministic. In 'gray' style the tints are
 * converted to grays of equal L*; in 'lines' style there is no fill (null).
 */
export function assignFills(
  regions: readonly FillRequest[],
  style: 'color' | 'gray' | 'lines',
  overrides: Record<string, string>,
): (string | null)[] {
  const out: (string | null)[] = regions.map(() => null);
  if (style === 'lines') return out;
  const chosen: (string | null)[] = regions.map(() => null);
  regions.forEach((r, i) => {
    const override = overrides[r.species];
    if (override !== undefined) {
      chosen[i] = normColor(override);
      return;
    }
    const tints = CLASS_TINTS[r.class] ?? CLASS_TINTS.solid;
    let best = tints[0]!;
    let bestScore = -Infinity;
    for (const t of tints) {
      let score = Infinity;
      let sameTint = false;
      for (const n of r.neighbours) {
        const c = chosen[n];
        if (c === null || c === undefined) continue;
        if (c === t) sameTint = true;
        if (c.startsWith('#')) score = Math.min(score, Math.abs(lightness(c) - lightness(t)));
      }
      if (sameTint) score = -1;
      if (score > bestScore + 1e-9) {
        best = t;
        bestScore = score;
      }
    }
    chosen[i] = best;
  });
  chosen.forEach((c, i) => {
    out[i] = c === null ? null : style === 'gray' && c.startsWith('#') ? toGray(c) : c;
  });
  return out;
}

/** Ink colours per style: boundaries, water lines, families, grid, operating marks. */
export function inks(style: 'color' | 'gray' | 'lines'): {
  boundary: string;
  water: string;
  family: string;
  grid: string;
  frame: string;
  text: string;
  mark: string;
  overlay: readonly string[];
  ligand: string;
} {
  if (style === 'color') {
    return {
      boundary: '#1a1a1a',
      water: '#2166ac',
      family: '#4d4d4d',
      grid: '#d0d0d0',
      frame: '#000000',
      text: '#000000',
      mark: '#b2182b',
      overlay: ['#762a83', '#1b7837', '#8c510a', '#01665e'],
      ligand: '#7f7f7f',
    };
  }
  return {
    boundary: '#000000',
    water: '#333333',
    family: '#4d4d4d',
    grid: '#d0d0d0',
    frame: '#000000',
    text: '#000000',
    mark: '#000000',
    overlay: ['#333333', '#555555', '#222222', '#444444'],
    ligand: '#808080',
  };
}

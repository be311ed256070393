/**
 * Region fills. Each class has three tints whose CIE L* (lightness) differ; the first two tints of
 * the classes sit at separate lightness bands (element darkest, dissolved lightest) so that a
 * grayscale copy or a reader with a red–green colour-vision deficiency still tells classes and
 * neighbours apart:
 *
 *   element   (immunity)     blue-grey     L* ≈ 65 / 71 / 59
 *   solid     (passivation)  teal / olive / sage   L* ≈ 76.5 / 82.5 / 71
 *   gas                      mauve         L* ≈ 87.5 / 58 / 73
 *   dissolved (corrosion)    cream / peach / rose  L* ≈ 97 / 92 / 87
 *
 * The third tint is only needed where three regions of one class touch each other (e.g. FeS, FeS₂
 * and Fe₃O₄ in iron–sulfur), and sits ≥ 4.5 L* from the other two of its class.
 * Chroma is low (C* 12–18) so that black text and lines keep full contrast.
 *
 * Neighbouring regions of the same class get different tints: a proper colouring of the
 * same-class adjacency graph (depth-first search in a fixed order), see assignFills.
 */
import { type Verdict, verdictOf } from '../diagram/verdict.js';
import type { RegionClass } from '../model.js';

export const CLASS_TINTS: Record<RegionClass, readonly string[]> = {
  element: ['#89a1b6', '#96b2bf', '#7b91a1'],
  solid: ['#a0c5b5', '#c9d1b3', '#a1b399'],
  dissolved: ['#fff6dd', '#ffe4c9', '#f6d1d1'],
  gas: ['#e7d6ea', '#90889f', '#beaec1'],
};

/**
 * Fill of a region whose species could not be carried to the diagram temperature (undetermined: no
 * verdict). A neutral grey (no chroma, L* ≈ 79), unlike every class tint; its legend entry says so.
 */
export const UNDETERMINED_FILL = '#c4c4c4';

/** The tint group that shows each verdict when a region is reclassified away from its class's own. */
const VERDICT_GROUP: Record<Verdict, RegionClass> = { immunity: 'element', passivation: 'solid', corrosion: 'dissolved' };

/**
 * The tint group (and legend swatch) of a region: its class, unless its verdict (the model's, with
 * the file's `classes:` applied; the rule is diagram/verdict.ts) differs from the verdict of its
 * class — then the group of that verdict, e.g. Fe₃O₄ reclassified as corrosion is tinted and keyed
 * with the dissolved (corrosion) regions.
 */
export function fillGroup(cls: RegionClass, verdict?: Verdict): RegionClass {
  if (verdict === undefined || verdict === verdictOf(cls, '')) return cls;
  return VERDICT_GROUP[verdict];
}

const GROUP_NOUN: Record<RegionClass, string> = { element: 'metal', solid: 'solid', dissolved: 'dissolved', gas: 'gas' };

/** Words for the class legend: the group and its verdict (trade terms), "gas" alone. */
export const CLASS_NAMES: Record<RegionClass, string> = {
  element: `${GROUP_NOUN.element} (${verdictOf('element', '')})`,
  solid: `${GROUP_NOUN.solid} (${verdictOf('solid', '')})`,
  dissolved: `${GROUP_NOUN.dissolved} (${verdictOf('dissolved', '')})`,
  gas: GROUP_NOUN.gas,
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

/** L* difference from every neighbour beyond which a tint counts as contrasting enough. */
const ENOUGH_CONTRAST = 10;

export interface FillRequest {
  species: string;
  class: RegionClass;
  /** Indices of neighbouring regions (sharing a boundary). */
  neighbours: number[];
  /** Area (any unit): larger regions are coloured first and so get the first tints. */
  area?: number;
}

/**
 * Assigns a fill to every region: a per-species override wins; otherwise a tint of its class such
 * that no two neighbouring regions get the same colour (a proper colouring of the adjacency graph,
 * found by depth-first search with backtracking, largest region first, else in the given order). At each
 * region the class's first two tints are tried before its third, each group in order of decreasing
 * L* difference from the neighbours coloured so far (differences of ENOUGH_CONTRAST or more count
 * as equal; ties → the earlier tint), so the third tint appears only where needed. When no proper colouring exists with the class's tints
 * (or the search exceeds its step budget), the remaining regions are coloured greedily with the
 * fewest same-colour neighbours. Deterministic. In 'gray' style the tints are converted to grays of
 * equal L*; in 'lines' style there is no fill (null).
 */
export function assignFills(
  regions: readonly FillRequest[],
  style: 'color' | 'gray' | 'lines',
  overrides: Record<string, string>,
): (string | null)[] {
  if (style === 'lines') return regions.map(() => null);
  // (1) Overrides first; (2) symmetric neighbour lists; (3) order: largest regions first (they get
  // the class's first tint, the one shown in the legend), ties and regions without an area keep
  // the given order; (4) proper colouring by search, else (5) greedy; (6) grays for 'gray'.
  const chosen: (string | null)[] = regions.map((r) => {
    const o = overrides[r.species];
    return o === undefined ? null : normColor(o);
  });
  const g: Colouring = { regions, nb: symmetricNeighbours(regions), chosen, L: lightnessCache() };
  const order = regions
    .map((_, i) => i)
    .filter((i) => chosen[i] === null)
    .sort((a, b) => (regions[b]!.area ?? 0) - (regions[a]!.area ?? 0) || a - b);
  if (!properColouring(g, order)) greedyColouring(g, order);
  return chosen.map((c) => (c === null ? null : style === 'gray' && c.startsWith('#') ? toGray(c) : c));
}

/** The state of a colouring: requests, neighbour sets, the tint chosen so far, cached L*. */
interface Colouring {
  regions: readonly FillRequest[];
  nb: Set<number>[];
  chosen: (string | null)[];
  L: (c: string) => number;
}

/** Symmetric neighbour sets (a request may list a neighbour only on one side). */
function symmetricNeighbours(regions: readonly FillRequest[]): Set<number>[] {
  const nb: Set<number>[] = regions.map(() => new Set<number>());
  regions.forEach((r, i) =>
    r.neighbours.forEach((j) => {
      if (j !== i && j >= 0 && j < regions.length) {
        nb[i]!.add(j);
        nb[j]!.add(i);
      }
    }),
  );
  return nb;
}

/** L* of a colour, memoised (NaN for anything that is not #hex). */
function lightnessCache(): (c: string) => number {
  const cache = new Map<string, number>();
  return (c) => {
    let v = cache.get(c);
    if (v === undefined) {
      v = c.startsWith('#') ? lightness(c) : NaN;
      cache.set(c, v);
    }
    return v;
  };
}

const tintsOf = (g: Colouring, i: number): readonly string[] => CLASS_TINTS[g.regions[i]!.class] ?? CLASS_TINTS.solid;

/** Tints of region i not used by a coloured neighbour, most contrast first. */
function tintCandidates(g: Colouring, i: number): string[] {
  const scored: { t: string; k: number; score: number }[] = [];
  tintsOf(g, i).forEach((t, k) => {
    let score = Infinity;
    for (const n of g.nb[i]!) {
      const c = g.chosen[n];
      if (c === null || c === undefined) continue;
      if (c === t) return;
      const d = Math.abs(g.L(c) - g.L(t));
      if (Number.isFinite(d)) score = Math.min(score, d);
    }
    scored.push({ t, k, score });
  });
  // The first two tints before the third (kept for where three regions of a class meet); then
  // more contrast, counting ENOUGH_CONTRAST L* or more as equal; ties → the earlier tint.
  const key = (x: { k: number; score: number }): [number, number] => [x.k >= 2 ? 1 : 0, Math.min(x.score, ENOUGH_CONTRAST)];
  scored.sort((a, b) => {
    const [ta, sa] = key(a);
    const [tb, sb] = key(b);
    if (ta !== tb) return ta - tb;
    if (Math.abs(sa - sb) > 1e-9) return sb - sa;
    return a.k - b.k;
  });
  return scored.map((x) => x.t);
}

/** Depth-first search with backtracking for a proper colouring, within a step budget. */
function properColouring(g: Colouring, order: readonly number[]): boolean {
  let steps = 0;
  const BUDGET = 20000;
  const search = (pos: number): boolean => {
    if (pos === order.length) return true;
    if (++steps > BUDGET) return false;
    const i = order[pos]!;
    for (const t of tintCandidates(g, i)) {
      g.chosen[i] = t;
      if (search(pos + 1)) return true;
    }
    g.chosen[i] = null;
    return false;
  };
  return search(0);
}

/** No proper colouring within the tints: greedy, fewest same-colour neighbours, then contrast. */
function greedyColouring(g: Colouring, order: readonly number[]): void {
  for (const i of order) {
    if (g.chosen[i] !== null) continue;
    const tints = tintsOf(g, i);
    let best = tints[0]!;
    let bestKey: [number, number] = [Infinity, -Infinity];
    for (const t of tints) {
      let same = 0;
      let score = Infinity;
      for (const n of g.nb[i]!) {
        const c = g.chosen[n];
        if (c === null || c === undefined) continue;
        if (c === t) same++;
        const d = Math.abs(g.L(c) - g.L(t));
        if (Number.isFinite(d)) score = Math.min(score, d);
      }
      if (same < bestKey[0] || (same === bestKey[0] && score > bestKey[1] + 1e-9)) {
        best = t;
        bestKey = [same, score];
      }
    }
    g.chosen[i] = best;
  }
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
  /** Iso-solubility lines and their labels (composition mode). */
  iso: string;
  /** Fill of undetermined areas (composition mode: points the solver could not solve). */
  undetermined: string;
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
      iso: '#8c510a',
      undetermined: '#8f8f8f',
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
    iso: '#555555',
    undetermined: style === 'lines' ? '#d9d9d9' : '#8f8f8f',
  };
}

/**
 * Line inks of overlaid layers of different elements ('color' style), base first: black, then
 * blue, vermillion, bluish green and reddish purple from the Okabe–Ito palette (Okabe & Ito,
 * "Color Universal Design", 2008), chosen to stay apart for readers with protan, deutan or tritan
 * colour-vision deficiencies. Each layer also has its own dash pattern, so a gray copy still tells
 * them apart.
 */
export const LAYER_INKS: readonly string[] = ['#000000', '#0072b2', '#d55e00', '#009e73', '#cc79a7'];

/** Plain names of LAYER_INKS, in the same order (for captions). */
export const LAYER_INK_NAMES: readonly string[] = ['black', 'blue', 'vermillion', 'bluish green', 'reddish purple'];

/**
 * WCAG 2 contrast ratio of two sRGB colours: (Y₁ + 0.05) / (Y₂ + 0.05) with Y₁ ≥ Y₂ their relative
 * luminances (W3C, Web Content Accessibility Guidelines 2.1, "contrast ratio"). Ranges 1…21;
 * 4.5 is the minimum for normal-size text (success criterion 1.4.3). Example: #767676 on white ≈ 4.54.
 */
export function contrastRatio(a: string, b: string): number {
  const ya = luminance(a);
  const yb = luminance(b);
  return (Math.max(ya, yb) + 0.05) / (Math.min(ya, yb) + 0.05);
}

/**
 * Ink for text in a line's colour: the colour itself when it has at least `min` contrast on white
 * (WCAG 2 ratio, default 4.5), else the same chromaticity darkened (linear RGB channels scaled by
 * one factor) to relative luminance Y = 1.05 / min − 0.05, i.e. exactly `min` on white. Colours
 * that are not hex (named CSS colours) are returned unchanged.
 */
export function textInk(color: string, min = 4.5): string {
  if (!/^#([0-9a-f]{3}|[0-9a-f]{6})$/i.test(color.trim())) return color;
  const y = luminance(color);
  const target = 1.05 / min - 0.05;
  if (y <= target) return normColor(color);
  const rgb = parseHex(color).map(toLinear);
  const shade = (k: number): string => `#${rgb.map((c) => fromLinear(c * k).toString(16).padStart(2, '0')).join('')}`;
  // Rounding to 8 bits may land a hair above the target luminance: step down until it passes.
  let k = target / y;
  let out = shade(k);
  while (contrastRatio(out, '#ffffff') < min && k > 0) {
    k -= 0.002;
    out = shade(Math.max(0, k));
  }
  return out;
}

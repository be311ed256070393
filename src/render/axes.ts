/**
 * Axis ticks: "nice" linear ticks (steps of 1, 2 or 5 × 10ⁿ) inside the given domain, formatted
 * with a fixed number of decimals shared by the whole axis so that output is byte-identical and
 * the labels line up. Tick values come from d3-scale.
 */
import { scaleLinear } from 'd3-scale';

export interface Tick {
  value: number;
  label: string;
}

/** Smallest number of decimals (0…8) that writes `step` exactly. */
export function decimalsFor(step: number): number {
  for (let d = 0; d <= 8; d++) {
    const v = step * 10 ** d;
    if (Math.abs(v - Math.round(v)) < 1e-7 * Math.max(1, Math.abs(v))) return d;
  }
  return 8;
}

/** Fixed-decimal number with a U+2212 minus; "−0.0" becomes "0.0". */
export function formatFixed(value: number, decimals: number): string {
  let s = value.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(s)) s = s.slice(1);
  return s.replace('-', '\u2212');
}

/**
 * About `count` ticks inside [lo, hi] (either order) at a nice step, with labels of equal decimals.
 * Example: [0, 14] with count 7 → 0, 2, 4, …, 14; [−1.2, 1.6] with count 6 → −1.0, −0.5, …, 1.5.
 */
export function niceTicks(lo: number, hi: number, count: number): Tick[] {
  const a = Math.min(lo, hi);
  const b = Math.max(lo, hi);
  const values = linearTicks(a, b, Math.max(2, Math.round(count)));
  const step = values.length > 1 ? values[1]! - values[0]! : 1;
  const d = decimalsFor(Math.abs(step));
  return values.map((v) => {
    // Snap floating noise (0.30000000000000004) to the decimal grid.
    const value = Number(v.toFixed(Math.min(12, d + 6)));
    return { value, label: formatFixed(value, d) };
  });
}

/**
 * About `count` evenly spaced round values in [a, b] (a < b): d3-scale's linear ticks (steps of
 * 1, 2 or 5 × 10ⁿ, whole multiples of the step, computed without floating-point noise).
 */
export function linearTicks(a: number, b: number, count: number): number[] {
  if (!(count > 0) || !(b >= a)) return [];
  if (a === b) return [a];
  return scaleLinear().domain([a, b]).ticks(count);
}

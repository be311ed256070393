/**
 * A plane in (pH, E): value = g + p·pH + e·E. Used for grand potentials ψ (J/mol) and their
 * differences. Plain data so that solver loops stay allocation-light.
 */
export interface Plane {
  g: number;
  p: number;
  e: number;
}

export const ZERO_PLANE: Plane = { g: 0, p: 0, e: 0 };

export function planeAt(pl: Plane, pH: number, E: number): number {
  return pl.g + pl.p * pH + pl.e * E;
}

export function subPlane(a: Plane, b: Plane): Plane {
  return { g: a.g - b.g, p: a.p - b.p, e: a.e - b.e };
}

export function addScaled(a: Plane, b: Plane, k: number): Plane {
  return { g: a.g + k * b.g, p: a.p + k * b.p, e: a.e + k * b.e };
}

export function scalePlane(a: Plane, k: number): Plane {
  return { g: a.g * k, p: a.p * k, e: a.e * k };
}

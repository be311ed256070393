/**
 * Solver invariants on random and degenerate systems (src/solve/solve.ts), checked with this file's
 * own geometry (point-in-polygon, shoelace areas, distances) and the exact ψ of src/solve/probe.ts:
 *   1. every sample point away from a boundary lies in exactly one region (no gaps, no overlaps),
 *      and that region's species is the argmin of ψ there;
 *   2. the region areas add up to the domain area (relative 1e-9);
 *   3. every boundary vertex is on the lower envelope with both its species tied, and every triple
 *      point ties all its species at the minimum.
 * Random systems: 3–12 made-up species Fe_x O_o H_h (S_k) with charge z and random G, solid or
 * dissolved, on a random domain; with and without sulfur as a ligand at fixed total activity.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatFormula } from '../../src/chem/formula.js';
import type { Polygon, Ring } from '../../src/model.js';
import { psiAt } from '../../src/solve/point.js';
import { type Solution, solve } from '../../src/solve/solve.js';
import type { LigandInput, SolverInput, SolverSpecies } from '../../src/solve/types.js';

const F = 96485.33212; // C/mol, CODATA 2018
const R = 8.314462618; // J/(mol·K), CODATA 2018
const T25 = 298.15;
const G_H2O = -237.129; // kJ/mol, ΔfG°(H2O, l): Wagman et al. (1982) NBS tables — recalled from memory

/** Distance (pH or V units) under which a sample point counts as on a boundary. */
const NEAR = 1e-6;
/** ψ tolerance, kJ per mol of Fe. */
const PSI_TOL = 1e-6;

// ---------- independent geometry ----------

function inRing(ring: Ring, x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!;
    const [xj, yj] = ring[j]!;
    if (yi > y !== yj > y && x < xi + ((y - yi) * (xj - xi)) / (yj - yi)) inside = !inside;
  }
  return inside;
}

function inPolygon(poly: Polygon, x: number, y: number): boolean {
  return inRing(poly[0]!, x, y) && !poly.slice(1).some((h) => inRing(h, x, y));
}

function ringArea(ring: Ring): number {
  let s = 0;
  for (let k = 0; k < ring.length; k++) {
    const [x1, y1] = ring[k]!;
    const [x2, y2] = ring[(k + 1) % ring.length]!;
    s += x1 * y2 - x2 * y1;
  }
  return Math.abs(s) / 2;
}

function polygonArea(poly: Polygon): number {
  return ringArea(poly[0]!) - poly.slice(1).reduce((s, h) => s + ringArea(h), 0);
}

function segDist(px: number, py: number, a: [number, number], b: [number, number]): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  const t = l2 > 0 ? Math.max(0, Math.min(1, ((px - a[0]) * dx + (py - a[1]) * dy) / l2)) : 0;
  return Math.hypot(px - (a[0] + t * dx), py - (a[1] + t * dy));
}

/** Distance from a point to the nearest edge of any region ring. */
function distToEdges(sol: Solution, x: number, y: number): number {
  let d = Infinity;
  for (const r of sol.regions) {
    for (const poly of r.polygons) {
      for (const ring of poly) {
        for (let k = 0; k < ring.length; k++) d = Math.min(d, segDist(x, y, ring[k]!, ring[(k + 1) % ring.length]!));
      }
    }
  }
  return d;
}

// ---------- the invariants ----------

function samplePoints(input: SolverInput, n: number, extra: [number, number][] = []): [number, number][] {
  const [p0, p1] = input.pH;
  const [e0, e1] = input.E;
  const pts: [number, number][] = [...extra];
  // A slightly irrational lattice, so that points do not sit on boundaries built from round numbers.
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      pts.push([p0 + ((i + 0.5 + 0.1234567 * ((j * 7) % 5)) / (n + 1)) * (p1 - p0), e0 + ((j + 0.5 + 0.0765432 * ((i * 3) % 7)) / (n + 1)) * (e1 - e0)]);
    }
  }
  return pts;
}

function checkInvariants(input: SolverInput, sol: Solution, extra: [number, number][] = []): void {
  const domain = (input.pH[1] - input.pH[0]) * (input.E[1] - input.E[0]);
  // 2. Areas tile the domain.
  let total = 0;
  for (const r of sol.regions) {
    expect(r.index).toBeGreaterThanOrEqual(0);
    expect(r.index).toBeLessThan(input.species.length);
    for (const poly of r.polygons) {
      const a = polygonArea(poly);
      expect(a).toBeGreaterThan(0);
      total += a;
    }
  }
  expect(Math.abs(total - domain) / domain).toBeLessThan(1e-9);
  // Each species has at most one region entry.
  expect(new Set(sol.regions.map((r) => r.index)).size).toBe(sol.regions.length);

  // 1. Sample points: exactly one region, and it is the argmin of ψ.
  for (const [x, y] of samplePoints(input, 11, extra)) {
    if (distToEdges(sol, x, y) < NEAR) continue;
    const owners = sol.regions.filter((r) => r.polygons.some((p) => inPolygon(p, x, y))).map((r) => r.index);
    expect(owners, `point (${x}, ${y})`).toHaveLength(1);
    const { psi } = psiAt(input, x, y);
    const min = Math.min(...psi);
    expect(psi[owners[0]!]! - min, `point (${x}, ${y}): region ${owners[0]} vs argmin ${psi.indexOf(min)}`).toBeLessThanOrEqual(PSI_TOL);
  }

  // 3. Boundaries and triple points lie on the envelope.
  const indexOf = new Map(input.species.map((s, k) => [s.formula, k]));
  for (const b of sol.boundaries) {
    const [i, j] = b.indices;
    expect(i).not.toBe(j);
    for (const [x, y] of b.points) {
      const { psi } = psiAt(input, x, y);
      const min = Math.min(...psi);
      expect(Math.abs(psi[i]! - psi[j]!), `boundary ${b.between.join('/')} at (${x}, ${y})`).toBeLessThanOrEqual(PSI_TOL);
      expect(psi[i]! - min).toBeLessThanOrEqual(PSI_TOL);
    }
  }
  for (const tp of sol.triplePoints) {
    expect(tp.species.length).toBeGreaterThanOrEqual(3);
    const { psi } = psiAt(input, tp.pH, tp.E);
    const min = Math.min(...psi);
    // Formulas may repeat in random systems; check through the boundary indices instead then.
    if (new Set(input.species.map((s) => s.formula)).size === input.species.length) {
      for (const f of tp.species) expect(psi[indexOf.get(f)!]! - min).toBeLessThanOrEqual(PSI_TOL);
    }
  }
}

// ---------- random systems ----------

const RT25 = R * T25;

interface SpeciesSpec {
  x: number;
  o: number;
  h: number;
  k: number;
  z: number;
  solid: boolean;
  u: number;
  logA: number;
}

function mainSpecies(s: SpeciesSpec, withS: boolean): SolverSpecies {
  const elements: Record<string, number> = { Fe: s.x };
  if (s.o) elements.O = s.o;
  if (s.h) elements.H = s.h;
  if (withS && s.k) elements.S = s.k;
  const solid = s.solid && s.z === 0;
  return {
    formula: formatFormula(elements, s.z),
    phase: solid ? 's' : 'aq',
    elements,
    charge: s.z,
    // G relative to the oxide/hydroxide's water content, so lines fall in a plottable window.
    G: G_H2O * s.o + s.u,
    logActivity: solid ? 0 : s.logA,
  };
}

const speciesSpec: fc.Arbitrary<SpeciesSpec> = fc.record({
  x: fc.integer({ min: 1, max: 3 }),
  o: fc.integer({ min: 0, max: 4 }),
  h: fc.integer({ min: 0, max: 4 }),
  k: fc.constantFrom(0, 0, 1, 2),
  z: fc.integer({ min: -3, max: 3 }),
  solid: fc.boolean(),
  u: fc.double({ min: -300, max: 300, noNaN: true }),
  logA: fc.double({ min: -8, max: 0, noNaN: true }),
});

const domainArb = fc
  .record({
    p0: fc.double({ min: -3, max: 14, noNaN: true }),
    pw: fc.double({ min: 0.5, max: 20, noNaN: true }),
    e0: fc.double({ min: -5, max: 4, noNaN: true }),
    ew: fc.double({ min: 0.1, max: 10, noNaN: true }),
  })
  .map(({ p0, pw, e0, ew }) => ({ pH: [p0, Math.min(17, p0 + pw)] as [number, number], E: [e0, Math.min(5, e0 + ew)] as [number, number] }));

/**
 * Sulfur's own species, ΔfG° (kJ/mol) from Wagman et al. (1982) NBS tables — recalled from memory —
 * each shifted by a random amount: only the shape of the problem matters here.
 */
const SULFUR = [
  { formula: 'H2S', phase: 'aq', elements: { H: 2, S: 1 }, charge: 0, G: -27.83 },
  { formula: 'HS-', phase: 'aq', elements: { H: 1, S: 1 }, charge: -1, G: 12.08 },
  { formula: 'SO4-2', phase: 'aq', elements: { S: 1, O: 4 }, charge: -2, G: -744.53 },
  { formula: 'HSO4-', phase: 'aq', elements: { H: 1, S: 1, O: 4 }, charge: -1, G: -755.91 },
  { formula: 'S', phase: 's', elements: { S: 1 }, charge: 0, G: 0 },
] as const;

const ligandArb = fc
  .record({
    logA: fc.double({ min: -6, max: 0, noNaN: true }),
    shifts: fc.array(fc.double({ min: -40, max: 40, noNaN: true }), { minLength: SULFUR.length, maxLength: SULFUR.length }),
    keep: fc.array(fc.boolean(), { minLength: SULFUR.length, maxLength: SULFUR.length }),
  })
  .map(({ logA, shifts, keep }): LigandInput => {
    const species = SULFUR.map((s, k) => ({
      formula: s.formula,
      phase: s.phase,
      elements: { ...s.elements } as Record<string, number>,
      charge: s.charge,
      G: s.G + shifts[k]!,
      logActivity: s.phase === 'aq' ? logA : 0,
    })).filter((_, k) => keep[k] || k === 0);
    return { element: 'S', activity: 10 ** logA, species };
  });

function systemArb(withLigand: boolean): fc.Arbitrary<SolverInput> {
  return fc
    .record({
      species: fc.array(speciesSpec, { minLength: 3, maxLength: 12 }),
      domain: domainArb,
      ligand: withLigand ? ligandArb.map((l) => [l]) : fc.constant([] as LigandInput[]),
    })
    .map(({ species, domain, ligand }) => ({
      element: 'Fe',
      kelvin: T25,
      species: species.map((s) => mainSpecies(s, withLigand)),
      ligands: ligand,
      water: { H2O: G_H2O, H2: 0, O2: 0 },
      pressures: { H2: 1, O2: 1 },
      pH: domain.pH,
      E: domain.E,
    }));
}

const RUNS = { numRuns: 200, seed: 31337 } as const;

describe('random systems: regions tile the domain and follow argmin ψ', () => {
  it('Fe–O–H species, no ligand', () => {
    fc.assert(
      fc.property(systemArb(false), (input) => {
        checkInvariants(input, solve(input));
      }),
      RUNS,
    );
  });

  it('Fe–S–O–H species with sulfur at fixed total activity (piecewise-linear μ_S)', () => {
    fc.assert(
      fc.property(systemArb(true), (input) => {
        checkInvariants(input, solve(input));
      }),
      RUNS,
    );
  });

  it('many planes through one point (multi-way vertices, coincident lines)', () => {
    // Every species is tied at P = (pH*, E*); the gradients are random, some repeated.
    const arb = fc
      .record({
        sp: fc.array(speciesSpec, { minLength: 3, maxLength: 10 }),
        lift: fc.array(fc.constantFrom(0, 0, 0, 5, 20), { minLength: 10, maxLength: 10 }),
        P: fc.record({ pH: fc.double({ min: 1, max: 13, noNaN: true }), E: fc.double({ min: -1, max: 1, noNaN: true }) }),
      })
      .map(({ sp, lift, P }): SolverInput => {
        const species = sp.map((s, k) => {
          const m = mainSpecies(s, false);
          // Choose G so that ψ(P) = lift (kJ per mol of Fe) for every species.
          const o = m.elements.O ?? 0;
          const h = m.elements.H ?? 0;
          const nH = 2 * o - h;
          const nE = nH + m.charge;
          const phiNoG = (RT25 * Math.LN10 * m.logActivity - o * G_H2O * 1000 - nH * RT25 * Math.LN10 * P.pH - nE * F * P.E) / 1000;
          return { ...m, G: lift[k]! * s.x - phiNoG };
        });
        return {
          element: 'Fe',
          kelvin: T25,
          species,
          ligands: [],
          water: { H2O: G_H2O, H2: 0, O2: 0 },
          pressures: { H2: 1, O2: 1 },
          pH: [0, 14],
          E: [-2, 2],
        };
      });
    fc.assert(
      fc.property(arb, (input) => {
        checkInvariants(input, solve(input));
      }),
      { numRuns: 150, seed: 7 },
    );
  });
});

// ---------- degenerate systems ----------

function sp(formula: string, elements: Record<string, number>, charge: number, G: number, phase: 's' | 'aq' = 's', logActivity = phase === 'aq' ? -6 : 0): SolverSpecies {
  return { formula, phase, elements, charge, G, logActivity };
}

function system(species: SolverSpecies[], pH: [number, number] = [0, 14], E: [number, number] = [-2, 2]): SolverInput {
  return { element: 'Fe', kelvin: T25, species, ligands: [], water: { H2O: G_H2O, H2: 0, O2: 0 }, pressures: { H2: 1, O2: 1 }, pH, E };
}

/**
 * Iron species with ΔfG° from Wagman et al. (1982) NBS tables (recalled from memory); used as a
 * realistic starting point for the degenerate cases.
 */
const FE = sp('Fe', { Fe: 1 }, 0, 0);
const FE2 = sp('Fe+2', { Fe: 1 }, 2, -78.9, 'aq');
const FE3 = sp('Fe+3', { Fe: 1 }, 3, -4.7, 'aq');
const MAGNETITE = sp('Fe3O4', { Fe: 3, O: 4 }, 0, -1015.4);
const HEMATITE = sp('Fe2O3', { Fe: 2, O: 3 }, 0, -742.2);
const HFEO2 = sp('HFeO2-', { H: 1, Fe: 1, O: 2 }, -1, -377.7, 'aq');

/** ψ per Fe atom at (pH, E), kJ — by hand from the formation-plane formula of src/solve/potentials.ts, for building exact coincidences. */
function psiHand(s: SolverSpecies, pH: number, E: number): number {
  const o = s.elements.O ?? 0;
  const h = s.elements.H ?? 0;
  const nH = 2 * o - h;
  const nE = nH + s.charge;
  return ((s.G - o * G_H2O) * 1000 + RT25 * Math.LN10 * s.logActivity - nH * RT25 * Math.LN10 * pH - nE * F * E) / 1000 / s.elements.Fe!;
}

describe('degenerate systems: correct output, never a crash', () => {
  it('one species: one region over the whole domain, no boundaries, no triple points', () => {
    const input = system([FE2]);
    const sol = solve(input);
    expect(sol.regions).toHaveLength(1);
    expect(sol.regions[0]!.index).toBe(0);
    expect(sol.boundaries).toHaveLength(0);
    expect(sol.triplePoints).toHaveLength(0);
    checkInvariants(input, sol);
  });

  it('all species dissolved', () => {
    const input = system([FE2, FE3, HFEO2, sp('FeOH+2', { Fe: 1, O: 1, H: 1 }, 2, -229.41, 'aq')]);
    const sol = solve(input);
    expect(sol.regions.length).toBeGreaterThanOrEqual(2);
    checkInvariants(input, sol);
  });

  it('two species with identical data: one region for the pair, no boundary between them', () => {
    const twin = { ...FE2, formula: 'Fe+2' };
    const input = system([FE, FE2, twin, MAGNETITE, HEMATITE, HFEO2]);
    const sol = solve(input);
    const idx = sol.regions.map((r) => r.index);
    expect(idx.includes(1) && idx.includes(2)).toBe(false);
    expect(idx.includes(1) || idx.includes(2)).toBe(true);
    expect(sol.boundaries.some((b) => b.indices.includes(1) && b.indices.includes(2))).toBe(false);
    checkInvariants(input, sol);
  });

  it('the twin placed first: still one region for the pair', () => {
    const input = system([FE2, FE, { ...FE2 }]);
    const sol = solve(input);
    expect(sol.regions.filter((r) => r.index === 0 || r.index === 2)).toHaveLength(1);
    checkInvariants(input, sol);
  });

  it('a species never stable has no region and takes part in no boundary', () => {
    const never = sp('FeO2', { Fe: 1, O: 2 }, 0, +500);
    const input = system([FE, FE2, never, MAGNETITE, HEMATITE]);
    const sol = solve(input);
    expect(sol.regions.some((r) => r.index === 2)).toBe(false);
    expect(sol.boundaries.some((b) => b.indices.includes(2))).toBe(false);
    checkInvariants(input, sol);
  });

  it('every species but one never stable (the others far above)', () => {
    const input = system([sp('Fe', { Fe: 1 }, 0, 1e5 - 1), FE2, sp('Fe2O3', { Fe: 2, O: 3 }, 0, 1e5)]);
    const sol = solve(input);
    expect(sol.regions.map((r) => r.index)).toEqual([1]);
    checkInvariants(input, sol);
  });

  it('three species whose lines meet in one point: an exact triple point there', () => {
    // Fe / Fe+2 / Fe(OH)2 tied at P = (8, −0.5 V): G of Fe+2 and Fe(OH)2 chosen for that.
    const P = { pH: 8, E: -0.5 };
    const fe2 = { ...FE2, G: FE2.G - psiHand(FE2, P.pH, P.E) };
    const hyd0 = sp('Fe(OH)2', { Fe: 1, O: 2, H: 2 }, 0, 0);
    const hyd = { ...hyd0, G: -psiHand(hyd0, P.pH, P.E) };
    const input = system([FE, fe2, hyd]);
    const sol = solve(input);
    expect(sol.regions).toHaveLength(3);
    expect(sol.triplePoints).toHaveLength(1);
    expect(sol.triplePoints[0]!.pH).toBeCloseTo(P.pH, 9);
    expect(sol.triplePoints[0]!.E).toBeCloseTo(P.E, 9);
    checkInvariants(input, sol, [[P.pH + 1e-3, P.E + 1e-3]]);
  });

  it('four species meeting in one point: one vertex, all four regions touch it', () => {
    const P = { pH: 6, E: -0.2 };
    const tie = (s: SolverSpecies) => ({ ...s, G: s.G - psiHand(s, P.pH, P.E) * s.elements.Fe! });
    const input = system([FE, tie(FE2), tie(sp('Fe(OH)2', { Fe: 1, O: 2, H: 2 }, 0, 0)), tie(sp('FeOH+', { Fe: 1, O: 1, H: 1 }, 1, 0, 'aq'))]);
    const sol = solve(input);
    checkInvariants(input, sol);
    const at = sol.triplePoints.filter((t) => Math.abs(t.pH - P.pH) < 1e-9 && Math.abs(t.E - P.E) < 1e-9);
    expect(at).toHaveLength(1);
    expect(at[0]!.species.length).toBeGreaterThanOrEqual(3);
  });

  it('a zero-width region: Fe3O4 exactly on the Fe/Fe2O3 line (ψ = ⅑·Fe + ⁸⁄₉·Fe2O3)', () => {
    // Per Fe atom, Fe3O4 carries 8/3 electrons, Fe 0 and Fe2O3 3: 8/3 = (1 − λ)·3 gives λ = 1/9.
    // ψ(Fe3O4) = (G + 4·237.129)/3 must equal (8/9)·(G(Fe2O3) + 3·237.129)/2 at every point.
    const G = 3 * (8 / 9) * ((HEMATITE.G - 3 * G_H2O) / 2) + 4 * G_H2O;
    const input = system([FE, { ...MAGNETITE, G }, HEMATITE, FE2]);
    const sol = solve(input);
    checkInvariants(input, sol);
    const m = sol.regions.find((r) => r.index === 1);
    // Either no region or a sliver of zero area (rounding): never a visible field.
    expect(m === undefined || m.polygons.reduce((s, p) => s + polygonArea(p), 0) < 1e-9).toBe(true);
  });

  it('a boundary lying exactly on the domain edge', () => {
    // Fe/Fe+2 at a = 1e-6 is E = −0.5864 V (from the library's data); put the domain's lower edge there.
    const E0 = psiHand(FE2, 0, 0) / (2 * F / 1000);
    const input = system([FE, FE2, HFEO2], [0, 14], [E0, E0 + 1]);
    checkInvariants(input, solve(input));
  });

  it('a tiny domain (0.002 pH × 1 mV) around a triple point', () => {
    const P = { pH: 8, E: -0.5 };
    const fe2 = { ...FE2, G: FE2.G - psiHand(FE2, P.pH, P.E) };
    const hyd0 = sp('Fe(OH)2', { Fe: 1, O: 2, H: 2 }, 0, 0);
    const input = system([FE, fe2, { ...hyd0, G: -psiHand(hyd0, P.pH, P.E) }], [P.pH - 0.001, P.pH + 0.001], [P.E - 0.0005, P.E + 0.0005]);
    const sol = solve(input);
    expect(sol.regions).toHaveLength(3);
    checkInvariants(input, sol);
  });

  it('a huge domain with extreme free energies', () => {
    const input = system([FE, sp('Fe+2', { Fe: 1 }, 2, -1e5, 'aq', -300), sp('Fe2O3', { Fe: 2, O: 3 }, 0, 1e5), HFEO2], [-3, 17], [-5, 5]);
    checkInvariants(input, solve(input));
  });

  it('a ligand with a single species, and a main species without the ligand only', () => {
    const input: SolverInput = {
      ...system([FE, FE2]),
      ligands: [{ element: 'S', activity: 1e-3, species: [sp('H2S', { H: 2, S: 1 }, 0, -27.83, 'aq', -3)] }],
    };
    checkInvariants(input, solve(input));
  });
});

describe('the checker itself', () => {
  const input = system([FE, FE2, FE3, MAGNETITE, HEMATITE, HFEO2], [0, 14], [-1.2, 1.6]);
  const good = solve(input);

  it('passes the real solution', () => {
    checkInvariants(input, good);
  });

  it('catches swapped species labels (argmin check)', () => {
    const [a, b] = [good.regions[0]!.index, good.regions[1]!.index];
    const bad = { ...good, regions: good.regions.map((r) => (r.index === a ? { ...r, index: b } : r.index === b ? { ...r, index: a } : r)) };
    expect(() => checkInvariants(input, bad)).toThrow();
  });

  it('catches a missing region (tiling check)', () => {
    const bad = { ...good, regions: good.regions.slice(1) };
    expect(() => checkInvariants(input, bad)).toThrow();
  });

  it('catches a boundary vertex off the envelope', () => {
    const b0 = good.boundaries[0]!;
    const moved = { ...b0, points: b0.points.map(([x, y]) => [x + 0.01, y + 0.01] as [number, number]) };
    expect(() => checkInvariants(input, { ...good, boundaries: [moved, ...good.boundaries.slice(1)] })).toThrow();
  });
});

describe('known issues found by the properties above', () => {
  // BUG: src/solve/merge.ts welds vertices closer than its weld tolerance (about 1e-9 here). A line
  // 1.9e-10 V above the domain's lower edge makes a sliver whose vertices are welded away, so the
  // regions miss 1.9e-9 of the domain (limit 1e-9 relative). Physically negligible (0.2 nV), but the
  // tiling is not exact; a weld tolerance relative to the domain size would keep it. Reproduction:
  // solve() on the input below (found by the random Fe–O–H property with another seed).
  it('a sliver thinner than the weld tolerance keeps its area', () => {
    const input = system(
      [sp('Fe', { Fe: 1 }, 0, 0, 'aq', 0), sp('Fe-', { Fe: 1 }, -1, 0, 'aq', -3.21433646444264e-9), sp('Fe', { Fe: 1 }, 0, 0, 'aq', 0)],
      [0, 0.5],
      [0, 0.1],
    );
    checkInvariants(input, solve(input));
  });
});

/**
 * The work budget of one run: the grid cross-check evaluates every species' plane at every node
 * of a grid × grid map, and each activity family repeats the whole computation, so the work grows
 * as grid² × species × (1 + families). Measured on the 2-core development machine: about 5 ns per
 * unit (100 species at grid 1000: 1 s; 2000 species at grid 4000 with 8 families — each within its
 * own limit — would take about 20 minutes). The budget keeps one run to seconds:
 *
 *   grid² × species × (1 + families) ≤ WORK_BUDGET = 1e9
 *
 * A request over the budget is refused (InputError on `grid`, exit 2) with the largest grid that
 * fits; nothing is computed. The exact solver itself does not depend on the grid.
 */
import { InputError } from './errors.js';

export const WORK_BUDGET = 1e9;

export interface WorkRequest {
  grid: number;
  /** Species of the main element and of the ligands. */
  species: number;
  /** Extra activity families drawn (each repeats the computation). */
  families: number;
}

/** The work units of a request: grid² × species × (1 + families). Example: 200² × 50 × 1 = 2e6. */
export function workUnits(r: WorkRequest): number {
  return r.grid * r.grid * r.species * (1 + r.families);
}

/** The largest grid that keeps the request within the budget (at least 10, the smallest grid allowed). */
export function largestGrid(species: number, families: number): number {
  return Math.max(10, Math.floor(Math.sqrt(WORK_BUDGET / (Math.max(1, species) * (1 + families)))));
}

/** Throws InputError naming `grid` when the request is over the budget. */
export function checkWorkBudget(r: WorkRequest, file: string): void {
  const w = workUnits(r);
  if (w <= WORK_BUDGET) return;
  throw new InputError(
    file,
    'grid',
    `grid² × species × (1 + families) of at most ${WORK_BUDGET.toExponential(0)} (the work budget); with ${r.species} species and ${r.families} families use grid ≤ ${largestGrid(r.species, r.families)}`,
    `${r.grid}² × ${r.species} × ${1 + r.families} = ${w.toExponential(1)}`,
  );
}

/** The number of activity families a system file asks for (figure.families, else families). */
export function familiesRequested(extra: Record<string, unknown>): number {
  const fig = extra.figure;
  const raw = fig && typeof fig === 'object' && !Array.isArray(fig) && 'families' in fig ? (fig as Record<string, unknown>).families : extra.families;
  return Array.isArray(raw) ? raw.length : 0;
}

/**
 * Composition mode's own limit: every grid node is a full speciation solve (Newton with a phase
 * loop, about 60 000 nodes per second on the development machine, each node's state kept for the
 * refinement), so the grid is capped at COMPOSITION_MAX_GRID per axis (600² nodes: about 6 s).
 */
export const COMPOSITION_MAX_GRID = 600;

/** Throws InputError naming `grid` when a composition-mode grid is over its limit. */
export function checkCompositionGrid(grid: number, file: string): void {
  if (grid <= COMPOSITION_MAX_GRID) return;
  throw new InputError(file, 'grid', `a grid of at most ${COMPOSITION_MAX_GRID} in composition mode (each node is a full speciation solve)`, String(grid));
}

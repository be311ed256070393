/**
 * The read-out grid of a composition-mode figure's HTML page: at each node of a coarse regular grid
 * (at most 81 × 81), the predominant form (index into `forms`, −1 where the solver failed), its
 * share of the element's atoms (3 decimals) and log10 of the total dissolved element (2 decimals),
 * so that the page can show the form and its share at the pointer (nearest node).
 */
export interface ShareGrid {
  element: string;
  nx: number;
  ny: number;
  /** pH range and E range (V vs SHE) of the nodes; node (i, j) at x[0] + i·(x[1] − x[0])/(nx − 1), likewise y. */
  x: [number, number];
  y: [number, number];
  /** Formulas as in the model (the page shows them in Unicode). */
  forms: string[];
  label: number[];
  share: number[];
  logDissolved: (number | null)[];
}

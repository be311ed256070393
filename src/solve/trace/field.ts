/**
 * The contract between a point solver and the generic tracing machinery (grid → contour → refine):
 * any kind of diagram whose answer at a point is a set of scores, one per label (e.g. the share of
 * the element held by each form), with the predominant label the one of largest score.
 */
export interface TraceField<S> {
  /** Number of labels (forms); scores have this length. */
  labels: number;
  /** Solve at (x, y) = (pH, E), warm-started from a neighbour's state when given. Never throws. */
  solve(x: number, y: number, warm?: S): S;
  /** Fill the scores of every label; false when the point could not be solved (undetermined). */
  scores(s: S, out: Float64Array): boolean;
  /** A scalar for iso-lines (e.g. log10 of the total dissolved element), NaN where undetermined. */
  value?(s: S): number;
}

/** Index of the largest score (ties: lower index), −1 for an empty list. */
export function argmax(scores: Float64Array): number {
  let best = -1;
  let bv = -Infinity;
  for (let k = 0; k < scores.length; k++) if (scores[k] > bv) {
    bv = scores[k];
    best = k;
  }
  return best;
}

/** Margin of label f: its score minus the largest other score (≥ 0 where f predominates). */
export function marginOf(scores: Float64Array, f: number): number {
  let other = -Infinity;
  for (let k = 0; k < scores.length; k++) if (k !== f && scores[k] > other) other = scores[k];
  return scores[f] - other;
}

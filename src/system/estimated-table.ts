/**
 * The table of estimated temperature data in species/README.md: every library species whose S° or
 * revised-HKF parameters are estimated (carry.ts), with the values the code uses. Generated here so
 * a test can keep the README in step with the code.
 */
import { elementEntropy } from '../data/element-entropies.js';
import { libraryEntropyEstimator } from '../data/entropy-estimate.js';
import type { LibrarySpecies } from '../data/library.js';
import { entropyFromFormation } from '../thermo/gibbs.js';
import { estimateHkf } from '../thermo/hkf-estimate.js';
import { libraryEntropy } from './carry.js';

export const TABLE_BEGIN = '<!-- estimated-parameters:begin (generated; see tests/data/estimated-table.test.ts) -->';
export const TABLE_END = '<!-- estimated-parameters:end -->';

const fmt = (x: number, d: number): string => (Math.abs(x) < 0.5 * 10 ** -d ? (0).toFixed(d) : x.toFixed(d));

/** Markdown table rows (header included) of the estimated data, in library order. */
export function estimatedParameterTable(lib: readonly LibrarySpecies[]): string {
  const est = libraryEntropyEstimator(lib, libraryEntropy);
  const rows = [
    '| species | file | S° J/(mol·K) | S° from | ω ×10⁻⁵ cal/mol | c1 cal/(mol·K) | c2 ×10⁻⁴ cal·K/mol |',
    '|---|---|---|---|---|---|---|',
  ];
  for (const s of lib) {
    const isWater = s.phase === 'l' && s.formula === 'H2O';
    let S = s.S;
    let from = 'data';
    if (S === undefined && s.dfH !== undefined) {
      S = entropyFromFormation(s.dfG, s.dfH, s.elements, s.charge, elementEntropy);
      from = 'third law (ΔfH°)';
    }
    let estimatedS = false;
    if (S === undefined) {
      const e = est.estimate({ elements: s.elements, charge: s.charge, phase: s.phase });
      if (!e) continue;
      S = e.S;
      estimatedS = true;
      from = e.parent ? `estimate (parent ${e.parent})` : 'estimate (additive)';
    }
    const hkfEstimated = s.phase === 'aq' && !s.hkf && !isWater;
    if (!estimatedS && !hkfEstimated) continue;
    const cells = [`${s.formula}(${s.phase})`, s.file, fmt(S, 1), from];
    if (hkfEstimated) {
      const p = estimateHkf(s.charge, S, s.Cp);
      cells.push(fmt(p.omega, 4), fmt(p.c1, 2), fmt(p.c2, 4));
    } else cells.push('—', '—', '—');
    rows.push(`| ${cells.join(' | ')} |`);
  }
  return rows.join('\n');
}

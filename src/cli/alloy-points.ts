/**
 * The RowAnswerer of `probe --points` for an alloy file (issue 18): the streaming of
 * probe-points.ts, each row answered by analysis/alloy-points-answer.ts and written by
 * report/alloy-points-csv.ts. An ionic_strength column is refused at the header (the alloy's
 * dissolved species are at threshold activities, not concentrations).
 */
import { alloyPointsAnswerer } from '../analysis/alloy-points-answer.js';
import { alloyPointsErrorRow, alloyPointsHeader, alloyPointsRow } from '../report/alloy-points-csv.js';
import type { AlloySpec } from '../system/alloy-spec.js';
import { InputError } from '../system/errors.js';
import type { CustomReference } from '../thermo/reference.js';
import type { RowAnswerer } from './probe-points.js';

export function alloyRows(spec: AlloySpec, ref: string | CustomReference | undefined): (name: string) => RowAnswerer {
  return (name) => {
    const answerer = alloyPointsAnswerer(spec, ref, name);
    return {
      header(h, sep) {
        if (h.ionicStrength >= 0) throw new InputError(name, 'header', 'no ionic_strength column for an alloy file (its dissolved species are at threshold activities)', `column ${h.ionicStrength + 1}`);
        return alloyPointsHeader(h, sep);
      },
      row(row, sep) {
        const a = answerer.answer(row);
        return 'error' in a ? a : { text: alloyPointsRow(row, a.scale, a.result, a.warnings, sep) };
      },
      errorRow: alloyPointsErrorRow,
    };
  };
}

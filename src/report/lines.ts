/**
 * The `lines` report: every boundary's balanced reaction and its line equation at T.
 */
import { formulaForPeople, reactionForPeople, textForPeople } from '../chem/present.js';
import { lineEquationText } from '../diagram/line-text.js';
import type { BoundaryModel, DiagramModel } from '../model.js';
import { elementAmountText, ligandAmountTexts } from './format.js';
import { table } from './table.js';

export interface LineRow {
  between: [string, string];
  ligandSpecies: string[];
  reaction: string;
  equation: string;
  line: BoundaryModel['line'];
  /** Extent of the segment(s) in the diagram: pH and E ranges. */
  pHRange: [number, number];
  ERange: [number, number];
  /** The same line against a reference electrode, when one is asked for. */
  equationRef?: string;
}

/** A reference electrode for display: E_ref = E_SHE − offset. */
export interface DisplayReference {
  label: string;
  offset: number;
}

/** The line equation against a reference electrode (no-electron pH lines are unchanged). */
export function equationAgainst(line: BoundaryModel['line'], ref: DisplayReference): string {
  return lineEquationText(line, { scale: ref.label, offset: ref.offset });
}

/**
 * One row per connected segment of each reaction: boundary pieces with the same reaction that meet
 * end to end are combined; pieces that do not touch (e.g. Cu/Cu2O on either side of a Cu(NH3)2+
 * field) are separate rows, each with its own span.
 */
export function lineRows(model: DiagramModel, ref?: DisplayReference): LineRow[] {
  const groups = new Map<string, BoundaryModel[]>();
  for (const b of model.boundaries) {
    const key = `${b.between.join('|')}|${b.reaction}`;
    const g = groups.get(key);
    if (g) g.push(b);
    else groups.set(key, [b]);
  }
  const rows: LineRow[] = [];
  for (const pieces of groups.values()) {
    for (const part of connected(pieces)) {
      const xs = part.flatMap((b) => b.points.map((p) => p[0]));
      const ys = part.flatMap((b) => b.points.map((p) => p[1]));
      const b = part[0];
      rows.push({
        between: b.between,
        ligandSpecies: b.ligandSpecies,
        reaction: b.reaction,
        equation: b.equation,
        line: b.line,
        pHRange: [Math.min(...xs), Math.max(...xs)],
        ERange: [Math.min(...ys), Math.max(...ys)],
        ...(ref ? { equationRef: equationAgainst(b.line, ref) } : {}),
      });
    }
  }
  return rows;
}

/** Pieces grouped by shared end points (within 1e-7 in pH and V), in order of lowest pH. */
function connected(pieces: BoundaryModel[]): BoundaryModel[][] {
  const parent = pieces.map((_, k) => k);
  const find = (k: number): number => (parent[k] === k ? k : (parent[k] = find(parent[k])));
  const ends = (b: BoundaryModel) => [b.points[0], b.points[b.points.length - 1]];
  const near = (p: [number, number], q: [number, number]) => Math.abs(p[0] - q[0]) < 1e-7 && Math.abs(p[1] - q[1]) < 1e-7;
  for (let i = 0; i < pieces.length; i++) {
    for (let j = i + 1; j < pieces.length; j++) {
      if (ends(pieces[i]).some((p) => ends(pieces[j]).some((q) => near(p, q)))) parent[find(i)] = find(j);
    }
  }
  const out = new Map<number, BoundaryModel[]>();
  pieces.forEach((b, k) => {
    const r = find(k);
    const g = out.get(r);
    if (g) g.push(b);
    else out.set(r, [b]);
  });
  const minPH = (g: BoundaryModel[]) => Math.min(...g.flatMap((b) => b.points.map((p) => p[0])));
  return [...out.values()].sort((a, b) => minPH(a) - minPH(b));
}

export function linesText(model: DiagramModel, ref?: DisplayReference): string {
  const rows = lineRows(model, ref);
  const corrected = model.species.some((x) => x.role === 'main' && x.molality !== undefined);
  const head = `${model.element} at ${model.temperature.celsius} °C; dissolved ${model.element} ${elementAmountText(model, true)}${corrected ? ' (activities below)' : ''}` +
    (Object.keys(model.ligands).length ? `; ligand totals ${ligandAmountTexts(model, true).join(', ')}` : '') +
    '\nPotentials in V vs SHE at the diagram temperature.';
  const body = table(
    ['boundary', 'reaction', 'E°/V or log K', 'line', ...(ref ? [`line vs ${ref.label}`] : []), 'pH range'],
    rows.map((r) => [
      r.between.map(formulaForPeople).join(' / '),
      reactionForPeople(r.reaction),
      r.line.kind === 'E' ? `E° = ${r.line.E0!.toFixed(4)}` : `log K = ${r.line.logK!.toFixed(3)}`,
      r.equation,
      ...(ref ? [r.equationRef!] : []),
      `${r.pHRange[0].toFixed(2)}–${r.pHRange[1].toFixed(2)}`,
    ]),
  );
  const acts = activityRows(model);
  const actText = acts.length
    ? `\nActivities used (a = γ·m where a concentration m was given${model.water ? `; ionic strength ${fmtNum(Number(model.water.ionicStrength))} mol/kg, ${model.water.activityModel} model at ${model.temperature.celsius} °C` : ''}):\n` +
      table(
        ['species', 'm / (mol/kg)', 'log γ', 'γ', 'activity a'],
        acts.map((r) => [formulaForPeople(r.formula), r.molality === undefined ? 'as given' : fmtNum(r.molality), r.logGamma === undefined ? '0' : r.logGamma.toFixed(4), r.logGamma === undefined ? '1' : (10 ** r.logGamma).toFixed(4), fmtNum(r.activity)]),
        [false, true, true, true, true],
      ) + '\n'
    : '';
  const water = [model.waterLines.hydrogen, model.waterLines.oxygen].map((w) => `  ${reactionForPeople(w.reaction)}: ${w.equation}`).join('\n');
  const warn = model.warnings.length ? `\nWarnings:\n${model.warnings.map((w) => `  ${textForPeople(w)}`).join('\n')}\n` : '';
  return `${head}\n\n${body}\n${actText}\nWater lines (H₂ ${model.waterLines.pressures.H2} bar, O₂ ${model.waterLines.pressures.O2} bar):\n${water}\n${warn}`;
}

export interface ActivityRow {
  formula: string;
  role: 'main' | 'ligand';
  molality?: number;
  logGamma?: number;
  activity: number;
}

/** Dissolved species with the activities actually used (and the γ correction where applied). */
export function activityRows(model: DiagramModel): ActivityRow[] {
  return model.species
    .filter((s) => s.phase === 'aq' && s.activity !== undefined)
    .map((s) => {
      const r: ActivityRow = { formula: s.formula, role: s.role, activity: s.activity! };
      if (s.molality !== undefined) r.molality = s.molality;
      if (s.logGamma !== undefined) r.logGamma = s.logGamma;
      return r;
    });
}

function fmtNum(v: number): string {
  if (v === 0) return '0';
  const a = Math.abs(v);
  return a >= 1e-3 && a < 1e4 ? String(Number(v.toPrecision(4))) : v.toExponential(3);
}

/**
 * Compose the renderer's FigureInput from a computed diagram: caption lines, activity families
 * (the same system re-solved at other activities), and the neutral-pH line at T.
 */
import { formulaForPeople } from '../chem/present.js';
import type { Computed, ComputedAny } from '../pipeline.js';
import type { DiagramModel } from '../model.js';
import { InputError } from '../system/errors.js';
import { bathCaptionLines, shareGrid } from './compose-bath.js';
import type { SystemSpec } from '../system/spec.js';
import { familyBoundaries } from '../pipeline.js';
import type { FigureInput } from '../render/scene.js';
import type { FigureSettings } from './options.js';
import type { DisplayedReference } from '../analysis/points.js';
import { placeOperatingMarks } from './operating-marks.js';
import { elementAmountText, fmtCelsius, ligandAmountTexts, shortSource } from '../report/format.js';

/** What a figure is composed from: a computed diagram of either kind (the fixed kind may carry its solver state). */
export type Drawn = Computed | ComputedAny;

export function captionLines(c: Pick<Computed, 'model'>): string[] {
  const m = c.model;
  if (m.kind === 'composition') return bathCaptionLines(m);
  const lig = ligandAmountTexts(m);
  const lines = [
    `${m.element}–H\u2082O${lig.length ? `–${Object.keys(m.ligands).join('–')}` : ''} at ${fmtCelsius(m.temperature.celsius)} °C; dissolved ${m.element} ${elementAmountText(m)}` +
      (lig.length ? `; ligand totals ${lig.join(', ')}` : '') +
      `; p(H\u2082) = ${m.waterLines.pressures.H2} bar, p(O\u2082) = ${m.waterLines.pressures.O2} bar.`,
  ];
  const w = m.water;
  if (w) {
    const bits: string[] = [];
    if (Number(w.temperatureC) >= 100 || w.pressurePath === 'user') bits.push(`${w.pressurePath === 'saturation' ? 'saturated ' : ''}liquid water at ${Number(w.pressureMPa).toPrecision(3)} MPa`);
    if (Number(w.ionicStrength) > 0) bits.push(`ionic strength ${Number(w.ionicStrength).toPrecision(3)} mol/kg (${w.activityModel})`);
    if (m.temperature.celsius !== 25) bits.push(`neutral pH ${Number(w.neutralPH).toFixed(2)}`);
    if (bits.length) lines.push(`${bits.join('; ')}.`.replace(/^./, (ch) => ch.toUpperCase()));
  }
  lines.push(...temperatureCaveats(m));
  const short = m.sources.map(shortSource).filter((s, k, a) => a.indexOf(s) === k);
  if (short.length) lines.push(`Data: ${short.join('; ')}.`);
  return lines;
}

/** Names joined with ', ' up to about `budget` characters, then "+N more" (the warnings list all). */
function someNames(names: readonly string[], budget: number): string {
  const shown: string[] = [];
  let used = 0;
  for (const n of names) {
    if (shown.length && used + n.length + 2 > budget) break;
    shown.push(n);
    used += n.length + 2;
  }
  const more = names.length - shown.length;
  return `${shown.join(', ')}${more ? ` +${more} more` : ''}`;
}

/**
 * Caption caveats on how species were carried to T, kept short so the default figure still fits:
 * the undetermined species (only ΔfG°: placed with the 25 °C value, no verdict), every one named,
 * and the estimated ones (S° or HKF parameters estimated), named up to about 30 characters (the
 * warnings name them all). Nothing at 25 °C.
 */
export function temperatureCaveats(m: DiagramModel): string[] {
  const und = [...new Set(m.species.filter((s) => s.temperatureModel === 'undetermined').map((s) => formulaForPeople(s.formula)))];
  const est = m.temperature.celsius === 25 ? [] : [...new Set(m.species.filter((s) => s.estimated).map((s) => formulaForPeople(s.formula)))];
  const out: string[] = [];
  if (und.length) out.push(`Undetermined, no verdict (ΔfG° only): ${und.join(', ')}.`);
  if (est.length) out.push(`Estimated T data: ${someNames(est, 30)}.`);
  return out;
}

/** The same system with every dissolved species of the element at activity a (as an activity, no γ). */
export function atActivity(spec: SystemSpec, a: number): SystemSpec {
  return { ...spec, activity: a, amount: { kind: 'activity', value: a, isDefault: false } };
}

export function figureInput(c: Drawn, fig: FigureSettings): FigureInput {
  const input: FigureInput = { model: c.model, options: fig.options };
  if (fig.options.show.caption) input.caption = captionLines(c);
  if (fig.options.show.neutral && c.model.water) input.neutralPH = Number(c.model.water.neutralPH);
  placeOperatingMarks(input, c.spec.operating, c.spec.temperature);
  if (c.model.reference && !fig.options.secondAxis) {
    fig.options.secondAxis = { label: `E / V vs ${c.model.reference.label}`, offset: c.model.reference.offset };
    input.options = fig.options;
  }
  if (fig.families.length && 'kind' in c && c.kind === 'composition') {
    throw new InputError(c.spec.file, 'figure.families', 'no families in composition mode (the bath fixes the dissolved amount; iso-solubility lines show other amounts — give extra levels with solubilityLevels)');
  }
  if ('kind' in c && c.kind === 'composition') input.readout = shareGrid(c.composition);
  if (fig.families.length && 'built' in c) {
    input.families = fig.families.map((a) => ({ activity: a, boundaries: familyBoundaries(c, a) }));
  }
  return input;
}

/**
 * A second potential axis against a reference electrode: on the figure, and named in the model
 * (its `reference` key) with the electrode's warnings.
 */
export function withSecondAxis(c: Pick<Computed, 'model'>, fig: FigureSettings, r: DisplayedReference): void {
  fig.options.secondAxis = { label: `E / V vs ${r.label}`, offset: r.offset };
  c.model.reference = { id: r.id, label: r.label, offset: r.offset };
  c.model.warnings.push(...r.warnings.filter((w) => !c.model.warnings.includes(w)));
}

/** Figure input with the plating windows drawn as boxes over the full potential range. */
export function windowFigureInput(c: Drawn, fig: FigureSettings, windows: readonly { pH: [number, number] }[]): FigureInput {
  const input = figureInput(c, fig);
  input.boxes = windows.map((w) => ({ label: 'plating window', pH: w.pH, E: c.model.domain.E }));
  return input;
}

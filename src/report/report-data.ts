/**
 * The content of the `report` document as plain data, independent of the output format: title,
 * conditions, activities used, reactions and lines, operating points with their verdicts, the
 * plating window, data sources (with the values recalled from memory marked), warnings and the
 * cautions (REPORT_CAUTIONS). The writers (report-md, report-html, report-pdf) only lay
 * it out. Deterministic: no dates, no machine paths.
 */
import { type EnvelopeResult, probeEnvelopes } from '../analysis/envelopes.js';
import { findReference, referenceOffset } from '../thermo/reference.js';
import { loadLibrary } from '../data/library.js';
import type { Computed } from '../pipeline.js';
import { activityRows, type ActivityRow, lineRows, type LineRow } from './lines.js';
import type { ProbeResult } from '../analysis/probe.js';
import { probeOperatingPoints, type ReportPoint } from '../analysis/points.js';
import { platingWindow, type WindowResult } from '../analysis/window.js';
import { fmtAmount, fmtCelsius, fmtNum } from './format.js';

/** The cautions printed in every report, in full. */
export const REPORT_CAUTIONS: readonly string[] = [
  'An E\u2013pH diagram is equilibrium thermodynamics only: it says nothing about rates, passive-film quality, localized attack (pitting, crevice, stress-corrosion, microbially influenced), galvanic coupling, or mixed potentials. It is a screening aid; design decisions follow the applicable codes and standards and the judgement of a qualified corrosion or plating professional.',
];

/** The closing line of every report. */
export const REPORT_CLOSING =
  'This diagram and report are a screening aid. Decisions follow the applicable codes and standards and the judgement of qualified professionals.';

/** How verdicts are assigned (printed with the operating points). */
export const VERDICT_BASIS =
  'Verdicts: immunity where the element itself predominates, passivation where a solid compound predominates, corrosion where a dissolved species predominates at the stated threshold activity (reclassifications from the system file applied).';

export interface ReportSpecies {
  formula: string;
  phase: string;
  name: string;
  role: 'main' | 'ligand' | 'water';
  source: string;
  /** Where the values come from. */
  origin: 'library' | 'system file';
  /** True when the library marks the values as recalled from memory; null when unknown (user data). */
  recalled: boolean | null;
}

/** Plain-text tables of the speciation at the operating points (composition mode). */
export interface SpeciationSection {
  intro: string;
  header: string[];
  rows: string[][];
  /** Per point: a heading line and its species table. */
  details: { label: string; header: string[]; rows: string[][] }[];
}

export interface ReportData {
  title: string;
  element: string;
  celsius: number;
  /** Label → value, plain text (Unicode). */
  conditions: [string, string][];
  activities: ActivityRow[];
  lines: LineRow[];
  waterLines: { couple: string; reaction: string; equation: string }[];
  points: ReportPoint[];
  /**
   * Composition mode: the speciation at the operating points, as plain-text tables (in place of
   * `points`, which is then empty); see report/composition-report-data.ts.
   */
  speciation?: SpeciationSection;
  /** Envelopes (boxes) and paths of the system file, answered at their sample points. */
  envelopes: EnvelopeResult[];
  /** The plating window, when the system file asks for it (`platingWindow: true`). */
  window: WindowResult | null;
  sources: string[];
  species: ReportSpecies[];
  warnings: string[];
  cautions: readonly string[];
  closing: string;
  verdictBasis: string;
}

/** Default title: "Fe–H₂O at 90 °C", with ligands "Cu–H₂O–S at 25 °C". */
export function defaultTitle(c: Computed): string {
  const m = c.model;
  const lig = Object.keys(m.ligands);
  return `${m.element}\u2013H\u2082O${lig.map((l) => `\u2013${l}`).join('')} at ${fmtCelsius(m.temperature.celsius)} \u00b0C`;
}

function amountText(a: { kind: string; value: number; as?: string }): string {
  if (a.kind === 'activity') return `activity ${fmtAmount(a.value)}`;
  if (a.kind === 'molality') return `${fmtAmount(a.value)} mol/kg`;
  return `${fmtNum(a.value)} mg/L${a.as ? ` as ${a.as}` : ''}`;
}

function conditions(c: Computed): [string, string][] {
  const { spec, model: m } = c;
  const out: [string, string][] = [];
  out.push(['Element', m.element]);
  out.push(['Temperature', `${fmtCelsius(m.temperature.celsius)} \u00b0C (${m.temperature.kelvin.toFixed(2)} K)`]);
  const amt = spec.amount;
  out.push([
    `Dissolved ${m.element}`,
    `${amountText(amt)}${amt.isDefault ? ' (default threshold)' : ''} for every dissolved ${m.element} species unless a species sets its own; activities used are listed below`,
  ]);
  const lig = Object.keys(spec.ligandAmounts);
  out.push(['Ligands', lig.length ? lig.map((k) => `${k}: total ${amountText(spec.ligandAmounts[k])}`).join('; ') : 'none']);
  const w = m.water;
  if (w) {
    out.push(['Ionic strength', `${fmtNum(Number(w.ionicStrength))} mol/kg, ${w.ionicStrengthFrom}; activity model: ${w.activityModel}`]);
    const path = w.pressurePath === 'saturation' ? 'saturation pressure' : w.pressurePath === 'user' ? 'as given' : 'atmospheric';
    out.push(['Water pressure', `${fmtNum(Number(w.pressureMPa))} MPa (${path}); saturation pressure at T ${fmtNum(Number(w.saturationPressureMPa))} MPa`]);
    out.push(['Water properties', `density ${fmtNum(Number(w.densityKgM3))} kg/m\u00b3, relative permittivity ${fmtNum(Number(w.permittivity))}, pKw ${Number(w.pKw).toFixed(3)}`]);
    out.push(['Neutral pH', `${Number(w.neutralPH).toFixed(2)} at ${fmtCelsius(m.temperature.celsius)} \u00b0C`]);
  }
  out.push(['Gas pressures (water lines)', `p(H\u2082) = ${fmtNum(m.waterLines.pressures.H2)} bar, p(O\u2082) = ${fmtNum(m.waterLines.pressures.O2)} bar`]);
  out.push(['Reference electrode', referenceText(c)]);
  out.push(['Diagram range', `pH ${fmtNum(m.domain.pH[0])} to ${fmtNum(m.domain.pH[1])}; E ${fmtNum(m.domain.E[0])} to ${fmtNum(m.domain.E[1])} V vs SHE`]);
  out.push(['Temperature extrapolation', spec.extrapolation === 'best' ? 'best per species (HKF for aqueous species, IAPWS for water, Cp for solids and gases)' : spec.extrapolation === 'cp' ? 'constant heat capacity (Cp)' : 'constant \u0394H and \u0394S']);
  return out;
}

function referenceText(c: Computed): string {
  const ref = c.spec.operating.reference;
  const T = c.model.temperature.celsius;
  if (ref === undefined || ref === 'she') return 'SHE (all potentials in V vs SHE at the diagram temperature)';
  if (ref === 'rhe') return 'RHE: point potentials are converted to SHE at each point\u2019s pH (E_SHE = E_RHE \u2212 (ln10\u00b7RT/F)\u00b7pH)';
  const r = c.model.reference ?? { label: typeof ref === 'string' ? ref : ref.name, offset: referenceOffset(ref, T).offset };
  const src = typeof ref === 'string' ? `; source: ${findReference(ref).source}` : '; user-defined in the system file';
  return `${r.label}: E_SHE = E_${r.label} ${r.offset >= 0 ? '+' : '\u2212'} ${Math.abs(r.offset).toFixed(4)} V at ${fmtCelsius(T)} \u00b0C${src}. Diagram potentials are vs SHE; operating points are given vs ${r.label}`;
}

/** Every species used with its citation and whether the library marks its values as recalled. */
export function speciesSources(c: Pick<Computed, 'spec' | 'model' | 'built'>): ReportSpecies[] {
  const lib = loadLibrary();
  const inline = c.spec.species ?? [];
  const one = (formula: string, phase: string, name: string | undefined, role: ReportSpecies['role'], source: string | undefined): ReportSpecies => {
    const own = inline.find((s) => !s.fromLibrary && s.formula === formula && s.phase === phase);
    if (own) return { formula, phase, name: name ?? '', role, source: source ?? 'no source given', origin: 'system file', recalled: null };
    const entry = lib.find((s) => s.formula === formula && s.phase === phase);
    let recalled: boolean | null = null;
    if (entry) {
      const picked = c.spec.pick[formula] ?? c.spec.pick[`${formula}(${phase})`];
      const alt = picked ? entry.alternatives?.find((a) => a.id === picked) : undefined;
      recalled = (alt ? alt.recalled : entry.recalled) === true;
    }
    return { formula, phase, name: name ?? entry?.name ?? '', role, source: source ?? entry?.sourceText ?? 'no source given', origin: entry ? 'library' : 'system file', recalled };
  };
  const out = c.model.species.map((s) => one(s.formula, s.phase, s.name, s.role, s.source));
  for (const w of [c.built.water.H2O, c.built.water.H2, c.built.water.O2]) {
    const r = one(w.formula, w.phase, w.name, 'water', w.source);
    if (w.recalled !== undefined && r.origin === 'library') r.recalled = w.recalled === true;
    out.push(r);
  }
  return out;
}

/** Builds the report content from a computed diagram. */
export function reportData(c: Computed): ReportData {
  const m = c.model;
  const warnings = [...m.warnings];
  const pts = probeOperatingPoints(c, warnings);
  const envelopes = probeEnvelopes(c, warnings);
  const win = c.spec.extra.platingWindow === true ? platingWindow(m) : null;
  const species = speciesSources(c);
  const sources = [...m.sources];
  const ref = c.spec.operating.reference;
  if (typeof ref === 'string' && ref !== 'she') {
    const s = `Reference electrode ${findReference(ref).label}: ${findReference(ref).source}`;
    if (!sources.includes(s)) sources.push(s);
  }
  return {
    title: c.spec.title ?? defaultTitle(c),
    element: m.element,
    celsius: m.temperature.celsius,
    conditions: conditions(c),
    activities: activityRows(m),
    lines: lineRows(m),
    waterLines: [
      { couple: 'H\u2082/H\u2082O', reaction: m.waterLines.hydrogen.reaction, equation: m.waterLines.hydrogen.equation },
      { couple: 'O\u2082/H\u2082O', reaction: m.waterLines.oxygen.reaction, equation: m.waterLines.oxygen.equation },
    ],
    points: pts,
    envelopes,
    window: win,
    sources,
    species,
    warnings,
    cautions: REPORT_CAUTIONS,
    closing: REPORT_CLOSING,
    verdictBasis: VERDICT_BASIS,
  };
}

/** One envelope or path as plain text: its verdicts, then each sample's answer. */
export function envelopeText(e: EnvelopeResult): string {
  const head = `${e.label} (${e.kind === 'box' ? 'envelope' : 'path'}, E vs ${e.scale}): ${e.verdicts.length === 1 ? `${e.verdicts[0]} at every sample` : `mixed: ${e.verdicts.join(', ')}`}`;
  const at = e.samples.map((s) => `${s.where === 'centre' || s.where.startsWith('point') ? `${s.where} (pH ${fmtNum(s.pH)}, E ${fmtNum(s.Egiven)})` : s.where}: ${s.predominant} (${s.verdict})`);
  return `${head}. ${e.kind === 'box' ? 'Corners and centre' : 'Points'}: ${at.join('; ')}.`;
}

/** Crossing lines of a point, in a fixed order, as plain text. */
export function crossingTexts(r: ProbeResult): string[] {
  const out: string[] = [];
  const c = r.crossings;
  const mv = (v: number) => `${v >= 0 ? '+' : '\u2212'}${Math.abs(v * 1000).toFixed(0)} mV`;
  const ph = (v: number) => `${v >= 0 ? '+' : '\u2212'}${Math.abs(v).toFixed(2)} pH`;
  if (c.raiseE) out.push(`raise E ${mv(c.raiseE.shift)} \u2192 ${c.raiseE.to} (${c.raiseE.verdict})`);
  if (c.lowerE) out.push(`lower E ${mv(c.lowerE.shift)} \u2192 ${c.lowerE.to} (${c.lowerE.verdict})`);
  if (c.lowerPH) out.push(`lower pH ${ph(c.lowerPH.shift)} \u2192 ${c.lowerPH.to} (${c.lowerPH.verdict})`);
  if (c.raisePH) out.push(`raise pH ${ph(c.raisePH.shift)} \u2192 ${c.raisePH.to} (${c.raisePH.verdict})`);
  return out;
}

/**
 * The `report` content for a composition-mode file (the bath as made up), in the shape the
 * writers lay out (ReportData): conditions with the totals, the boundaries as curves with the
 * reaction at each midpoint, the plating window of the composition diagram (when the file sets
 * platingWindow: true), and — in place of the fixed-activity operating-point table — the
 * speciation at each operating point as plain tables (`speciation`: predominant form, verdict,
 * dissolved total; then each point's species). Steps:
 * 1. operating points to SHE; 2. each probed with the point solver (compositionProbe); 3. tables.
 * Computes nothing itself beyond laying the results out.
 */
import { answerEnvelopes, envelopeSamples } from '../analysis/envelopes.js';
import { compositionProbe, type CompositionProbeResult } from '../analysis/composition-probe.js';
import type { CompositionWindowResult } from '../analysis/composition-window.js';
import type { ComputedComposition } from '../diagram/composition.js';
import type { SystemSpec } from '../system/spec.js';
import { referenceOffset } from '../thermo/reference.js';
import { fmtCelsius, fmtNum } from './format.js';
import { compositionLineRows } from './composition-lines.js';
import type { LineRow } from './lines.js';
import { REPORT_CAUTIONS, REPORT_CLOSING, type ReportData, type SpeciationSection } from './report-data.js';

export interface CompositionPoint {
  label: string;
  pH: number;
  Egiven: number;
  scale: string;
  Eshe: number;
  result: CompositionProbeResult;
}

const VERDICT_BASIS_COMPOSITION =
  'Verdicts (the bath as made up): immunity where the metal holds the largest share of the element, passivation where a solid compound does, corrosion where a dissolved form does; the total dissolved element is stated beside each verdict against the corrosion threshold.';

/** Step 1–2: the file's operating points, each on SHE and probed with the point solver. */
export function compositionPoints(spec: SystemSpec, cc: ComputedComposition, warnings: string[]): CompositionPoint[] {
  const op = spec.operating;
  return op.points.map((p) => {
    let Eshe = p.E;
    let scale = 'SHE';
    if (op.reference !== undefined && op.reference !== 'she') {
      const r = referenceOffset(op.reference, spec.temperature, p.pH);
      warnings.push(...r.warnings.filter((w) => !warnings.includes(w)));
      Eshe = p.E + r.offset;
      scale = r.label;
    }
    const ref = scale === 'SHE' ? undefined : { label: scale, E: p.E, offset: Eshe - p.E };
    return { label: p.label, pH: p.pH, Egiven: p.E, scale, Eshe, result: compositionProbe(spec, cc.setup, p.pH, Eshe, ref) };
  });
}

/** Step 3: the speciation tables (plain text cells; the writers escape and lay them out). */
export function speciationSection(points: CompositionPoint[]): SpeciationSection {
  const g = (v: number) => (v === 0 ? '0' : Math.abs(v) >= 1e-3 && Math.abs(v) < 1e4 ? v.toPrecision(4) : v.toExponential(3));
  const rows = points.map((p) => {
    const r = p.result;
    if (r.status !== 'ok') return [p.label, fmtNum(p.pH), `${fmtNum(p.Egiven)} V vs ${p.scale}`, p.Eshe.toFixed(4), 'status: failed', 'unknown', '\u2014', r.reason ?? ''];
    return [p.label, fmtNum(p.pH), `${fmtNum(p.Egiven)} V vs ${p.scale}`, p.Eshe.toFixed(4), r.predominant!, r.verdict, g(r.dissolved!), `${r.dissolvedVsThreshold} ${g(r.threshold)}`];
  });
  const details = points.filter((p) => p.result.status === 'ok').map((p) => {
    const r = p.result;
    const share = (label: string) => r.shares[Object.keys(r.shares)[0]]?.find((x) => x.species === label)?.share;
    const pct = (v: number | undefined) => (v === undefined ? '' : `${(100 * v).toFixed(2)} %`);
    const aq = r.speciation.filter((s) => (share(s.species) ?? 0) >= 1e-4 || s.molality >= 1e-6).map((s) => [s.species, 'dissolved', g(s.molality), g(s.activity), pct(share(s.species))]);
    const solids = r.solids.map((s) => [s.species, 'solid', `${g(s.amount)} mol/kg water`, '', pct(share(`${s.species}(s)`) ?? share(`${s.species}(l)`))]);
    const free = Object.entries(r.freeLigand).map(([c, f]) => `free ${c} ${g(f.molality)} mol/kg (mostly ${f.form})`);
    const si = r.saturation.map((s) => `${s.species} ${s.logSI.toFixed(2)}`).join(', ');
    return {
      label: `${p.label} (pH ${fmtNum(p.pH)}, ${p.Eshe.toFixed(4)} V vs SHE): ${[...free, si ? `log10 saturation index of solids not formed: ${si}` : ''].filter(Boolean).join('; ')}`,
      header: ['species', 'phase', 'molality', 'activity', `share of ${Object.keys(r.shares)[0] ?? 'element'}`],
      rows: [...aq, ...solids],
    };
  });
  return {
    intro: VERDICT_BASIS_COMPOSITION,
    header: ['point', 'pH', 'E as given', 'E / V vs SHE', 'predominant form', 'verdict', 'dissolved element / (mol/kg)', 'vs threshold'],
    rows,
    details,
  };
}

/** Lines as curves in the writers' LineRow shape: the line column says "curve" and where. */
function curveRows(cc: ComputedComposition): LineRow[] {
  return compositionLineRows(cc.model).map((r, k) => ({
    between: r.between,
    ligandSpecies: cc.model.boundaries[k].ligandSpecies,
    reaction: r.reaction,
    equation: `curve (reaction at its midpoint pH ${r.midpoint.pH.toFixed(2)}, E ${r.midpoint.E.toFixed(3)} V; E ${r.ERange[0].toFixed(3)} to ${r.ERange[1].toFixed(3)} V)`,
    line: cc.model.boundaries[k].line,
    pHRange: r.pHRange,
    ERange: r.ERange,
  }));
}

export function compositionReportData(spec: SystemSpec, cc: ComputedComposition, win: CompositionWindowResult, species: ReportData['species']): ReportData {
  const m = cc.model;
  const warnings = [...m.warnings];
  const points = compositionPoints(spec, cc, warnings);
  const totals = Object.entries(cc.setup.totals).map(([c, v]) => `${c} ${fmtNum(v)} mol/kg`).join(', ');
  const ligands = Object.keys(cc.setup.totals).slice(1);
  const gamma = cc.setup.solver.gamma;
  // Boxes and paths: each sample answered by the point solver, as the operating points are.
  const envelopes = answerEnvelopes(envelopeSamples(spec.operating, spec.temperature, warnings), (pH, E) => {
    const r = compositionProbe(spec, cc.setup, pH, E);
    return { predominant: r.predominant ?? 'speciation not solved', verdict: r.verdict };
  });
  return {
    envelopes,
    title: spec.title ?? `${m.element}\u2013H\u2082O${ligands.map((l) => `\u2013${l}`).join('')} at ${fmtCelsius(m.temperature.celsius)} \u00b0C, the bath as made up`,
    element: m.element,
    celsius: m.temperature.celsius,
    conditions: [
      ['Element', m.element],
      ['Temperature', `${fmtCelsius(m.temperature.celsius)} \u00b0C (${m.temperature.kelvin.toFixed(2)} K)`],
      ['Kind of diagram', 'composition mode \u2014 the bath as made up: totals, full speciation at every point (free ligand from the mass balances, solids precipitate when saturated); boundaries where two forms hold equal shares of the element'],
      ['Totals', totals],
      ['Ionic strength', `${gamma.ionicStrength === 'auto' ? 'from the speciation at each point (ionicStrength: auto)' : `${fmtNum(gamma.ionicStrength)} mol/kg, ${cc.setup.built.solution.settings.ionicStrengthFrom}`}; activity model: ${gamma.model}`],
      ['Corrosion threshold', `${fmtNum(spec.activity)} mol/kg of dissolved element`],
      ['Gas pressures (water lines)', `p(H\u2082) = ${fmtNum(m.waterLines.pressures.H2)} bar, p(O\u2082) = ${fmtNum(m.waterLines.pressures.O2)} bar`],
      ['Diagram range', `pH ${fmtNum(m.domain.pH[0])} to ${fmtNum(m.domain.pH[1])}; E ${fmtNum(m.domain.E[0])} to ${fmtNum(m.domain.E[1])} V vs SHE`],
    ],
    activities: [],
    lines: curveRows(cc),
    waterLines: [
      { couple: 'H\u2082/H\u2082O', reaction: m.waterLines.hydrogen.reaction, equation: m.waterLines.hydrogen.equation },
      { couple: 'O\u2082/H\u2082O', reaction: m.waterLines.oxygen.reaction, equation: m.waterLines.oxygen.equation },
    ],
    points: [],
    speciation: points.length ? speciationSection(points) : undefined,
    window: spec.extra.platingWindow === true ? win : null, // only when the file asks for it, as for the fixed kind
    sources: [...m.sources],
    species,
    warnings,
    cautions: REPORT_CAUTIONS,
    closing: REPORT_CLOSING,
    verdictBasis: VERDICT_BASIS_COMPOSITION,
  };
}

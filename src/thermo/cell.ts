/**
 * The `cell` calculator: reaction energies and potentials of one reaction at a temperature.
 *
 * Input (parsed by chem/reaction-parse.ts): a reaction text such as "2H2O(l) = 2H2(g) + O2(g)" (full reaction) or
 * "Cu+2 + 2e- = Cu(s)" (half-reaction). Terms are separated by " + " (spaces around the plus,
 * since "+" also writes charges), sides by "=" (also "->", "→", "⇌"); a term is an optional
 * coefficient (2, 0.5, 1/2) then a formula with an optional phase tag; "e-" is the electron.
 *
 * Thermodynamics (apparent-G convention of thermo/gibbs.ts; kJ/mol, J/(mol·K)):
 *   ΔrG(T) = Σν·G_i(T),  ΔrH(T) = Σν·H_i(T),  ΔrS(T) = Σν·S_i(T)
 * with H⁺ and e⁻ zero on the conventional scale. A half-reaction is completed with the SHE at the
 * same T: each electron is replaced by ½H2(g) − H⁺ (from ½H2 = H⁺ + e⁻), so
 *   ΔrG(ox + n e⁻ = red) = ΔrG(ox + n/2 H2 = red + n H⁺).
 * Potentials (F = 96485.33212 C/mol):
 *   half-reaction (as a reduction): E = −ΔrG/(nF) vs SHE at T, E_tn = −ΔrH/(nF), dE/dT = ΔrS/(nF);
 *   full reaction: voltage |ΔrG|/(nF) ('electrolytic' when ΔrG > 0, else 'galvanic'), thermoneutral
 *   voltage ΔrH/(nF) (electrolytic) or −ΔrH/(nF) (galvanic), dE/dT the slope of that voltage; the
 *   signed values −ΔrG/(nF), −ΔrH/(nF), ΔrS/(nF) are given under `signed`.
 * Worked example (NBS 1982 data, Wagman et al.): 2H2O(l) = 2H2(g) + O2(g) at 25 °C:
 *   ΔrG = 474.258 kJ/mol, n = 4 → 1.2288 V; ΔrH = 571.660 kJ/mol → 1.4812 V.
 * Energies at T come from cell-energies.ts: by default ('best') each species' own model (IAPWS
 * water, revised HKF for aqueous species, Cp polynomials; system/carry.ts through the resolver's
 * `propertiesAt`), else constant Cp° or constant ΔH/ΔS. A reaction without electron transfer
 * (hydrolysis, solubility, ionisation) gives ΔrG°, ΔrH°, ΔrS°, ΔrCp° and log K = −ΔrG°/(RT ln 10)
 * only; `activities` adds ΔrG and E at those activities (cell-conditions.ts).
 * Validity: 0–300 °C on the liquid-water path for the species models; constant ΔH/ΔS over some
 * tens of K around 25 °C. Standard states: unit activity for dissolved species, 1 bar for gases.
 * Reference: any physical-chemistry text (ΔG = −nFE; Gibbs–Helmholtz); H.C. Helgeson et al.,
 * Am. J. Sci. 281 (1981) 1249 for the apparent convention.
 */
import { F, KELVIN, LN10, R } from './constants.js';
import { type CellExtrapolation, reactionEnergies, type SpeciesAtT } from './cell-energies.js';
import { type AtConditions, atConditions } from './cell-conditions.js';
import type { Phase } from '../chem/formula.js';
import { electronsTransferred } from '../chem/oxidation.js';
import { formulaForJson } from '../chem/present.js';
import { parseReaction, ReactionError, type ParsedReaction, type Term } from '../chem/reaction-parse.js';
import { referenceOffset, type CustomReference } from './reference.js';

/** Thermodynamic data of one species as returned by the resolver. */
export interface SpeciesData {
  /** ΔfG° at 25 °C, kJ/mol. */
  dfG: number;
  /** ΔfH° at 25 °C, kJ/mol. */
  dfH?: number;
  /** S° at 25 °C, J/(mol·K). */
  S?: number;
  /** Cp° at 25 °C, J/(mol·K). */
  Cp?: number;
  elements: Record<string, number>;
  charge: number;
  /** Phase the resolver chose (when the reaction text gave none). */
  phase?: Phase;
  /** Where the values come from. */
  source?: string;
  /** G, H, S, Cp at a temperature (°C) by the species' own model (system/carry.ts), for the 'best' mode. */
  propertiesAt?: (celsius: number) => SpeciesAtT;
}

/** Finds a species by formula and phase (phase undefined when the reaction text gives no tag). */
export type SpeciesLookup = (formula: string, phase: Phase | undefined) => SpeciesData | undefined;

export interface CellOptions {
  lookup: SpeciesLookup;
  /** Temperature, °C (default 25). */
  celsius?: number;
  /** Electrons transferred; overrides the oxidation-state count of a full reaction. */
  electrons?: number;
  /** 'best' (default: each species' own model), 'cp' or 'constant-h-s' (cell-energies.ts). */
  extrapolation?: CellExtrapolation;
  /** Activities (gases: pressures in bar) by species as written, e.g. {"Fe^2+": 1e-6} (any notation); others at 1. */
  activities?: Record<string, number>;
  /** Also give the half-reaction potentials against this reference electrode. */
  reference?: string | CustomReference;
  /** pH for the RHE. */
  pH?: number;
}

/**
 * H2(g) at 25 °C, used to complete a half-reaction with the SHE when the resolver has no H2(g):
 * ΔfG° = ΔfH° = 0, S° = 130.684, Cp° = 28.824 J/(mol·K) — NBS Tables of Chemical Thermodynamic
 * Properties (Wagman et al., 1982), recalled from memory.
 */
const H2_FALLBACK: SpeciesData = {
  dfG: 0,
  dfH: 0,
  S: 130.684,
  Cp: 28.824,
  elements: { H: 2 },
  charge: 0,
  phase: 'g',
  source: 'NBS Tables (Wagman et al., 1982), recalled from memory',
};

/** 'none': a reaction without electron transfer (hydrolysis, solubility, ionisation). */
export type CellDirection = 'reduction' | 'oxidation' | 'electrolytic' | 'galvanic' | 'none';

export interface CellResult {
  reaction: string;
  /** 'chemical': no electron transfer (n = 0, no potentials). */
  kind: 'half' | 'full' | 'chemical';
  temperature: { celsius: number; kelvin: number };
  n: number;
  /** How n was found: the electrons written, the oxidation-state count, or given by the user. */
  nFrom: 'written' | 'oxidation states' | 'given';
  /** kJ/mol (half-reactions: completed with the SHE, as written). */
  deltaG: number;
  deltaH: number | null;
  /** J/(mol·K). */
  deltaS: number | null;
  /** J/(mol·K). */
  deltaCp: number | null;
  /** log10 K = −ΔrG°/(R·T·ln10) of the reaction as written (half-reactions: completed with the SHE). */
  logK: number;
  /** V: electrode potential vs SHE (half) or cell voltage magnitude (full); null without electrons. */
  equilibriumPotential: number | null;
  thermoneutralPotential: number | null;
  /** V/K: slope of `equilibriumPotential`. */
  dEdT: number | null;
  direction: CellDirection;
  scale: string;
  convention: string;
  signed: { equilibriumPotential: number | null; thermoneutralPotential: number | null; dEdT: number | null };
  /** At the activities given (`activities` option): log Q, ΔrG and the potential. */
  atConditions?: AtConditions;
  /** Half-reactions with `reference`: the same potentials against that electrode. */
  reference?: { label: string; offset: number; equilibriumPotential: number; thermoneutralPotential: number | null; atConditions?: number };
  species: { formula: string; phase: Phase | null; coefficient: number; source: string }[];
  warnings: string[];
}

const HALF_CONVENTION =
  'Electrode potential of the couple written as a reduction (ox + n e⁻ ⇌ red), on the SHE scale at the same temperature: ' +
  'E = -ΔrG/(nF) with the electrons supplied by the SHE (n/2 H₂ ⇌ n H⁺ + n e⁻); thermoneutral potential -ΔrH/(nF); ' +
  'dE/dT = ΔrS/(nF). Unit activities, gases at 1 bar.';
const CHEMICAL_CONVENTION =
  'Reaction without electron transfer: ΔrG°, ΔrH°, ΔrS°, ΔrCp° and log K = -ΔrG°/(RT ln 10) of the reaction as written. ' +
  'Unit activities, gases at 1 bar.';
const FULL_CONVENTION =
  'Cell voltage |ΔrG|/(nF) of the reaction as written: electrolytic when ΔrG > 0 (must be driven), galvanic when ΔrG < 0 ' +
  '(delivers work); thermoneutral voltage ΔrH/(nF) if electrolytic, -ΔrH/(nF) if galvanic; dEdT is the slope of the reported ' +
  'voltage; "signed" gives -ΔrG/(nF), -ΔrH/(nF) and ΔrS/(nF). Unit activities, gases at 1 bar.';

interface Resolved {
  nu: number; // net coefficient, products positive
  data: SpeciesData;
  name: string;
}

interface Prepared {
  parsed: ParsedReaction;
  kind: CellResult['kind'];
  n: number;
  nFrom: CellResult['nFrom'];
  /** Sign of the reaction as written relative to the reduction (half-reactions): +1 reduction, −1 oxidation. */
  sense: 1 | -1;
  resolved: Resolved[];
  species: CellResult['species'];
  warnings: string[];
}

const isProton = (t: Term) => !t.electron && t.charge === 1 && Object.keys(t.elements).length === 1 && t.elements.H === 1 && (t.phase === undefined || t.phase === 'aq');

/** Parses, balances, counts electrons and resolves species once; evaluate with `evaluateCell`. */
export function prepareCell(text: string, opts: CellOptions): Prepared {
  const parsed = parseReaction(text);
  const warnings = [...parsed.warnings];
  const src = parsed.text;
  const nuE = parsed.terms.filter((t) => t.electron).reduce((a, t) => a + t.side * t.coefficient, 0);
  let kind: CellResult['kind'];
  let n: number;
  let nFrom: CellResult['nFrom'];
  let sense: 1 | -1 = 1;
  if (opts.electrons !== undefined && !(opts.electrons > 0 && Number.isFinite(opts.electrons))) {
    throw new ReactionError(src, 'a positive number of electrons', String(opts.electrons), 'electrons');
  }
  if (Math.abs(nuE) > 1e-12) {
    kind = 'half';
    n = Math.abs(nuE);
    nFrom = 'written';
    sense = nuE < 0 ? 1 : -1;
    if (opts.electrons !== undefined && Math.abs(opts.electrons - n) > 1e-9) {
      throw new ReactionError(src, `the ${n} electron(s) written in the half-reaction (or no electrons option)`, `${opts.electrons} electrons`, 'electrons');
    }
    if (sense < 0) warnings.push('half-reaction written as an oxidation: the potentials given are those of the couple (reduction direction)');
  } else {
    kind = 'full';
    const found = electronsTransferred(parsed.terms.filter((t) => !t.electron));
    if (opts.electrons !== undefined) {
      n = opts.electrons;
      nFrom = 'given';
      if (found !== undefined && found > 0 && Math.abs(found - n) > 1e-9) {
        warnings.push(`the oxidation-state count gives n = ${found}; the given n = ${n} is used`);
      }
    } else if (found === undefined) {
      throw new ReactionError(src, 'species whose oxidation states follow from the usual rules', 'an undecided oxidation state; give the number of electrons transferred (--electrons N)');
    } else if (!(found > 1e-9)) {
      // No electron transfer: hydrolysis, solubility, ionisation — energies and log K only.
      kind = 'chemical';
      n = 0;
      nFrom = 'oxidation states';
    } else {
      n = found;
      nFrom = 'oxidation states';
    }
  }

  // Net coefficients by species (electrons replaced by ½H2(g) − H⁺, H⁺ zero on the conventional scale).
  const net = new Map<string, { term: Term; nu: number }>();
  const species: CellResult['species'] = [];
  for (const t of parsed.terms) {
    if (t.electron || isProton(t)) {
      species.push({
        formula: t.electron ? 'e^-' : 'H^+',
        phase: t.electron ? null : 'aq',
        coefficient: t.side * t.coefficient,
        source: t.electron ? 'SHE at the same temperature (½H₂ ⇌ H⁺ + e⁻)' : 'conventional scale: zero at every temperature',
      });
      continue;
    }
    const key = `${t.formula}|${t.phase ?? ''}`;
    const e = net.get(key) ?? { term: t, nu: 0 };
    e.nu += t.side * t.coefficient;
    net.set(key, e);
  }
  const resolved: Resolved[] = [];
  for (const { term, nu } of net.values()) {
    const name = term.formula + (term.phase ? `(${term.phase})` : '');
    const data = opts.lookup(term.formula, term.phase);
    if (!data) throw new ReactionError(src, 'species known to the built-in library or the system file', JSON.stringify(name));
    species.push({ formula: formulaForJson(term.formula), phase: data.phase ?? term.phase ?? null, coefficient: nu, source: data.source ?? 'not given' });
    if (Math.abs(nu) > 1e-12) resolved.push({ nu, data, name });
  }
  if (kind === 'half') {
    const h2 = opts.lookup('H2', 'g') ?? H2_FALLBACK;
    resolved.push({ nu: nuE / 2, data: h2, name: 'H2(g) (SHE)' });
    species.push({ formula: 'H2', phase: 'g', coefficient: nuE / 2, source: `SHE completion; ${h2.source ?? 'not given'}` });
  }
  return { parsed, kind, n, nFrom, sense, resolved, species, warnings };
}

type Potentials = Pick<CellResult, 'equilibriumPotential' | 'thermoneutralPotential' | 'dEdT' | 'signed' | 'direction'>;

/** Step 2: potentials from the energies (module comment: half-reaction vs full reaction; none without electrons). */
function potentials(p: Prepared, dG: number, dH: number | null, dS: number | null): Potentials {
  if (p.kind === 'chemical') {
    const none = { equilibriumPotential: null, thermoneutralPotential: null, dEdT: null };
    return { ...none, signed: none, direction: 'none' };
  }
  const nF = (p.n * F) / 1000; // kJ/(mol·V)
  if (p.kind === 'half') {
    // Reduction direction: ΔG_red = sense·ΔG.
    const E = (-p.sense * dG) / nF;
    const Etn = dH === null ? null : (-p.sense * dH) / nF;
    const slope = dS === null ? null : (p.sense * dS) / (p.n * F);
    return {
      equilibriumPotential: E,
      thermoneutralPotential: Etn,
      dEdT: slope,
      signed: { equilibriumPotential: E, thermoneutralPotential: Etn, dEdT: slope },
      direction: p.sense > 0 ? 'reduction' : 'oxidation',
    };
  }
  const direction: CellDirection = dG > 0 ? 'electrolytic' : 'galvanic';
  const s = direction === 'electrolytic' ? 1 : -1;
  return {
    equilibriumPotential: (s * dG) / nF,
    thermoneutralPotential: dH === null ? null : (s * dH) / nF,
    dEdT: dS === null ? null : (-s * dS) / (p.n * F),
    signed: {
      equilibriumPotential: -dG / nF,
      thermoneutralPotential: dH === null ? null : -dH / nF,
      dEdT: dS === null ? null : dS / (p.n * F),
    },
    direction,
  };
}

/** Step 3: half-reaction potentials against a reference electrode (E_ref = E_SHE − offset). */
function againstReference(p: Prepared, result: CellResult, celsius: number, opts: Pick<CellOptions, 'reference' | 'pH'>): void {
  if (opts.reference === undefined) return;
  if (p.kind !== 'half') {
    result.warnings.push('a reference electrode applies to half-reactions only; the cell voltage does not depend on it');
    return;
  }
  let ref;
  try {
    ref = referenceOffset(opts.reference, celsius, opts.pH);
  } catch (e) {
    throw new ReactionError(p.parsed.text, 'a known reference electrode (and the pH for RHE)', (e as Error).message, 'reference');
  }
  result.warnings.push(...ref.warnings);
  const Etn = result.thermoneutralPotential;
  result.reference = {
    label: ref.label,
    offset: ref.offset,
    equilibriumPotential: result.equilibriumPotential! - ref.offset,
    thermoneutralPotential: Etn === null ? null : Etn - ref.offset,
  };
  if (result.atConditions?.potential != null) result.reference.atConditions = result.atConditions.potential - ref.offset;
}

/** Evaluates a prepared reaction at `celsius` (see module comment for the formulas). */
export function evaluateCell(p: Prepared, celsius: number, opts: Pick<CellOptions, 'extrapolation' | 'reference' | 'pH' | 'activities'> = {}): CellResult {
  if (!Number.isFinite(celsius) || celsius <= -KELVIN) throw new ReactionError(p.parsed.text, 'a temperature in °C above −273.15', String(celsius));
  const mode = opts.extrapolation ?? 'best';
  const warnings = [...p.warnings];
  if (celsius < 0 || celsius > 300) warnings.push(`${celsius} °C is outside 0–300 °C, where the data extrapolation is meant to hold`);
  const { dG, dH, dS, dCp } = reactionEnergies(p.resolved, p.parsed.text, celsius, mode, warnings);
  const pot = potentials(p, dG, dH, dS);
  const result: CellResult = {
    reaction: p.parsed.text,
    kind: p.kind,
    temperature: { celsius, kelvin: celsius + KELVIN },
    n: p.n,
    nFrom: p.nFrom,
    deltaG: dG,
    deltaH: dH,
    deltaS: dS,
    deltaCp: dCp,
    logK: (-dG * 1000) / (R * (celsius + KELVIN) * LN10),
    equilibriumPotential: pot.equilibriumPotential,
    thermoneutralPotential: pot.thermoneutralPotential,
    dEdT: pot.dEdT,
    direction: pot.direction,
    scale: p.kind === 'half' ? 'V vs SHE' : p.kind === 'full' ? 'V (cell voltage)' : 'none (no electron transfer)',
    convention: p.kind === 'half' ? HALF_CONVENTION : p.kind === 'full' ? FULL_CONVENTION : CHEMICAL_CONVENTION,
    signed: pot.signed,
    species: p.species,
    warnings,
  };
  if (opts.activities && Object.keys(opts.activities).length) {
    result.atConditions = atConditions(p.parsed.text, p.parsed.terms, opts.activities, dG, celsius, p.kind, p.n, p.sense);
  }
  againstReference(p, result, celsius, opts);
  return result;
}

/** One reaction at one temperature (default 25 °C); see module comment. */
export function cellReaction(text: string, opts: CellOptions): CellResult {
  return evaluateCell(prepareCell(text, opts), opts.celsius ?? 25, opts);
}

/** Temperatures from `from` to `to` (°C) in steps of `step`, `to` included when reached; at most 1001. */
export function temperatureSteps(from: number, to: number, step: number): number[] {
  if (![from, to, step].every(Number.isFinite)) throw new RangeError('temperature range: numbers expected');
  if (!(step > 0)) throw new RangeError('temperature range: the step must be greater than 0');
  if (to < from) throw new RangeError('temperature range: the end must not be below the start');
  const count = Math.floor((to - from) / step + 1e-9) + 1;
  if (count > 1001) throw new RangeError(`temperature range: ${count} rows, at most 1001`);
  return Array.from({ length: count }, (_, k) => Number((from + k * step).toPrecision(12)));
}

/** The reaction over a range of temperatures (°C): one result per row. */
export function cellTable(text: string, temperatures: readonly number[], opts: CellOptions): CellResult[] {
  const p = prepareCell(text, opts);
  return temperatures.map((t) => evaluateCell(p, t, opts));
}

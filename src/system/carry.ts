/**
 * Carrying one species' Gibbs energy from 25 °C, 1 bar to the system's temperature and pressure,
 * and recording how it was done (the species' temperature model) so outputs can say so.
 *
 * Models ('best', the default extrapolation, picks per species the best one its data allow):
 *   'iapws'          H2O(l): IAPWS-IF97 Gibbs function (thermo/water-gibbs.ts)
 *   'published'      aqueous species with published revised-HKF parameters (thermo/hkf.ts)
 *   'estimated'      aqueous species with HKF parameters estimated from charge, S°, Cp°
 *                    (thermo/hkf-estimate.ts); also any species whose S° had to be estimated
 *   'cp-polynomial'  solids, liquids, gases with a Maier–Kelley Cp(T) (thermo/cp-poly.ts)
 *   'constant-cp'    constant Cp° (thermo/gibbs.ts)
 *   'constant-h-s'   no Cp°: constant ΔH and ΔS
 *   'constant-g'     the user's assumeConstantG override
 *   'tabulated'      only ΔfG° given, at 25 °C, 1 atm (used as is)
 *   'undetermined'   only ΔfG° given, elsewhere: G undefined (system/build.ts keeps it for geometry)
 * The explicit extrapolations 'cp' and 'constant-h-s' use the constant-Cp forms for every species.
 * S° comes from the data, else third-law from ΔfH°, else (library species only) the additive
 * estimate of data/entropy-estimate.ts, which flags the species estimated.
 */
import { parseFormula } from '../chem/formula.js';
import { elementEntropy } from '../data/element-entropies.js';
import { libraryEntropyEstimator } from '../data/entropy-estimate.js';
import type { LibrarySpecies } from '../data/library.js';
import type { TemperatureModel } from '../solve/types.js';
import { polynomialG } from '../thermo/cp-poly.js';
import { apparentG, entropyFromFormation } from '../thermo/gibbs.js';
import { hkfG } from '../thermo/hkf.js';
import { estimateHkf } from '../thermo/hkf-estimate.js';
import { type WaterState, waterState } from '../thermo/water.js';
import { waterApparentG } from '../thermo/water-gibbs.js';
import type { ResolvedSpecies } from './build.js';

export type ExtrapolationMode = 'best' | 'cp' | 'constant-h-s';

export interface CarryContext {
  mode: ExtrapolationMode;
  water: WaterState;
  lib: readonly LibrarySpecies[];
  /** The user's assumeConstantG choice for this species. */
  constantG: boolean;
}

export interface Carried {
  /** Apparent G at T, P, kJ/mol; undefined when the species cannot be carried ('undetermined'). */
  G: number | undefined;
  model: TemperatureModel;
  estimated: boolean;
  /** What was estimated, for the record ('S°', 'HKF parameters'). */
  estimatedWhat: string[];
}

/** S° of a library species (given or third-law), for the estimator's fit. */
export function libraryEntropy(s: LibrarySpecies): number | undefined {
  if (s.S !== undefined) return s.S;
  if (s.dfH === undefined) return undefined;
  return entropyFromFormation(s.dfG, s.dfH, s.elements, s.charge, elementEntropy);
}

/**
 * The species' composition in chemical elements. The build step may have grouped a ligand (e.g. CN
 * counted as one unit under the key "CN"); entropies are per element, so the formula is read again.
 */
function chemicalElements(s: ResolvedSpecies): Record<string, number> {
  return parseFormula(s.formula).elements;
}

/** S° of a resolved species and whether it was estimated; undefined where no route exists. */
function entropyOf(s: ResolvedSpecies, ctx: CarryContext, atRef: boolean): { S: number; estimated: boolean } | undefined {
  if (s.S !== undefined) return { S: s.S, estimated: false };
  if (s.dfH !== undefined) return { S: entropyFromFormation(s.dfG, s.dfH, chemicalElements(s), s.f.charge, elementEntropy), estimated: false };
  if (!s.library) return undefined;
  // At the reference state the value is not used: only that it would be estimated.
  if (atRef) return { S: Number.NaN, estimated: true };
  const est = libraryEntropyEstimator(ctx.lib, libraryEntropy).estimate({ elements: chemicalElements(s), charge: s.f.charge, phase: s.phase });
  return est ? { S: est.S, estimated: true } : undefined;
}

/** Carries `s` to the water state's T and P (see the module comment). */
export function carrySpecies(s: ResolvedSpecies, ctx: CarryContext): Carried {
  const st = ctx.water;
  const atRef = Math.abs(st.celsius - 25) < 1e-9 && st.path === 'atmospheric';
  const isWater = s.phase === 'l' && s.formula === 'H2O';
  const ent = entropyOf(s, ctx, atRef);
  if (!ent) {
    if (ctx.constantG) return { G: s.dfG, model: 'constant-g', estimated: false, estimatedWhat: [] };
    return atRef ? { G: s.dfG, model: 'tabulated', estimated: false, estimatedWhat: [] } : { G: undefined, model: 'undetermined', estimated: false, estimatedWhat: [] };
  }
  const estimatedWhat = ent.estimated ? ['S°'] : [];
  // At 25 °C, 1 atm the tabulated ΔfG° is used as is: only the label is worked out (no model run).
  const done = (G: () => number, model: TemperatureModel): Carried => ({
    G: atRef ? s.dfG : G(),
    model,
    estimated: estimatedWhat.length > 0,
    estimatedWhat,
  });
  const d = { dfG: s.dfG, S: ent.S, Cp: s.Cp };
  if (ctx.mode !== 'best') {
    const mode = ctx.mode;
    const model = mode === 'cp' && s.Cp !== undefined ? 'constant-cp' : 'constant-h-s';
    return done(() => apparentG(d, st.kelvin, mode), model);
  }
  if (isWater) return done(() => waterApparentG(s.dfG, ent.S, st.kelvin, st.pressureMPa), 'iapws');
  if (s.phase === 'aq') {
    const solvent = { kelvin: st.kelvin, pressureMPa: Math.max(st.pressureMPa, st.saturationPressureMPa), density: st.density };
    const published = s.hkf;
    if (published) return done(() => hkfG(s.dfG, ent.S, published, s.f.charge, solvent), 'published');
    estimatedWhat.push('HKF parameters');
    return done(() => hkfG(s.dfG, ent.S, estimateHkf(s.f.charge, ent.S, s.Cp), s.f.charge, solvent), 'estimated');
  }
  const poly = s.cpPolynomial;
  if (poly) return done(() => polynomialG(s.dfG, ent.S, poly, st.kelvin), 'cp-polynomial');
  return done(() => apparentG(d, st.kelvin, 'cp'), s.Cp !== undefined ? 'constant-cp' : 'constant-h-s');
}

/**
 * How a library species is carried to temperature by the default model (for `catalog`): its
 * temperature model and what is estimated. Evaluated at 100 °C (the labels do not depend on T).
 */
export function libraryTemperatureModel(s: LibrarySpecies, lib: readonly LibrarySpecies[]): { model: TemperatureModel; estimated: boolean; estimatedWhat: string[] } {
  const r: ResolvedSpecies = {
    formula: s.formula, phase: s.phase, dfG: s.dfG, dfH: s.dfH, S: s.S, Cp: s.Cp, field: s.formula, library: true,
    f: { text: s.formula, elements: s.elements, charge: s.charge },
    ...(s.hkf ? { hkf: s.hkf } : {}),
    ...(s.cpPolynomial ? { cpPolynomial: s.cpPolynomial } : {}),
  };
  const c = carrySpecies(r, { mode: 'best', water: waterAt100(), lib, constantG: false });
  return { model: c.model, estimated: c.estimated, estimatedWhat: c.estimatedWhat };
}

let state100: WaterState | undefined;
function waterAt100(): WaterState {
  state100 ??= waterState(100);
  return state100;
}

export interface CarriedProperties extends Carried {
  /** Entropy at T, J/(mol·K): −(∂G/∂T)_P. */
  S?: number;
  /** Heat capacity at T, J/(mol·K): −T(∂²G/∂T²)_P. */
  Cp?: number;
  /** Apparent enthalpy at T, kJ/mol: ΔfH° + [G(T) − ΔfG°] + T·S(T) − T_r·S°; where ΔfH° is known. */
  H?: number;
}

/**
 * G, S, Cp and H of a species at the context's T and P by the same model as carrySpecies, the
 * derivatives taken at constant pressure by central differences (step 0.02 K) of the model's own G —
 * for reaction properties (ΔrH, ΔrS, ΔrCp, log K) at any temperature.
 * Worked example: H2O(l) at 25 °C, 1 bar → S = 69.91, Cp = 75.3 J/(mol·K) (IAPWS; test).
 */
export function carryProperties(s: ResolvedSpecies, ctx: CarryContext): CarriedProperties {
  const c = carrySpecies(s, ctx);
  if (c.G === undefined) return c;
  const h = 0.02;
  const st = ctx.water;
  // One pressure for the three points, at or above saturation at T + 2h, so that every point is
  // liquid and the solvent pressure does not jump between them (a jump would swamp the second
  // difference: ΔrCp of water ionisation came out at +16 000 J/(mol·K) at 200 °C; test).
  // The stencil's centre stays ≥ h above 0 °C (the water model's lower end): at 0.01 °C the
  // derivatives are taken at 0.02 °C (a 0.01 K shift, far below their precision).
  const centre = Math.max(st.celsius, h);
  const P = Math.max(st.pressureMPa, st.saturationPressureMPa, waterState(centre + 2 * h).saturationPressureMPa);
  const at = (dT: number): number => {
    const w = waterState(centre + dT, Math.max(P, 0.1));
    return carrySpecies(s, { ...ctx, water: { ...w, path: 'user' } }).G!;
  };
  const lo = at(-h);
  const mid = at(0);
  const hi = at(h);
  const S = (-(hi - lo) / (2 * h)) * 1000;
  const Cp = -st.kelvin * ((hi - 2 * mid + lo) / (h * h)) * 1000;
  const out: CarriedProperties = { ...c, S, Cp };
  if (s.dfH !== undefined) {
    const Sref = s.S ?? entropyFromFormation(s.dfG, s.dfH, chemicalElements(s), s.f.charge, elementEntropy);
    out.H = s.dfH + (c.G - s.dfG) + (st.kelvin * S - 298.15 * Sref) / 1000;
  }
  return out;
}

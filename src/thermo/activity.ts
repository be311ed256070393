/**
 * Activity coefficients of aqueous ions on the molal scale (base-10 logarithms): Debye–Hückel
 * parameters at temperature, the Davies and extended Debye–Hückel equations, ionic strength,
 * and a dilute-solution unit conversion.
 *
 * Neutral aqueous species are given γ = 1 (log10 γ = 0) by every model here: no salting-out term.
 */

/** Debye–Hückel parameters, molal scale, base-10. */
export interface DebyeHuckelParameters {
  /** A, kg^½ mol^-½. */
  A: number;
  /** B, Å⁻¹ kg^½ mol^-½. */
  B: number;
}

/**
 * Debye–Hückel A and B at temperature (standard Debye–Hückel theory, common practice):
 * A = 1.82483e6·√ρ/(εT)^1.5 (kg^½ mol^-½), B = 50.2916·√ρ/(εT)^0.5 (Å⁻¹ kg^½ mol^-½),
 * with ρ in g/cm³ (converted here from kg/m³), ε the relative permittivity, T in K.
 * Valid wherever ρ and ε are (e.g. from `waterState`). Worked example: 25 °C, 997.05 kg/m³,
 * ε = 78.41 → A = 0.5098, B = 0.3284 Å⁻¹.
 */
export function debyeHuckelParameters(kelvin: number, densityKgM3: number, permittivity: number): DebyeHuckelParameters {
  for (const [v, name] of [[kelvin, 'temperature'], [densityKgM3, 'density'], [permittivity, 'permittivity']] as const) {
    if (!Number.isFinite(v) || v <= 0) throw new RangeError(`debyeHuckelParameters: ${name} must be a positive number, got ${v}`);
  }
  const rho = densityKgM3 / 1000;
  const eT = permittivity * kelvin;
  return { A: (1.82483e6 * Math.sqrt(rho)) / eT ** 1.5, B: (50.2916 * Math.sqrt(rho)) / Math.sqrt(eT) };
}

/**
 * Davies equation: log10 γ = −A z² (√I/(1 + √I) − 0.3 I), I in mol/kg.
 * Reference: C. W. Davies, Ion Association (Butterworths, 1962). Reasonable up to I ≈ 0.5 mol/kg.
 * Worked example: z = 1, I = 0.1, A = 0.5098 → log10 γ = −0.1072 (γ = 0.781).
 */
export function daviesLogGamma(z: number, I: number, A: number): number {
  checkI(I);
  const s = Math.sqrt(I);
  return -A * z * z * (s / (1 + s) - 0.3 * I);
}

/**
 * Extended Debye–Hückel equation: log10 γ = −A z² √I / (1 + B å √I), å the ion-size parameter
 * in Å, I in mol/kg. Reference: Debye & Hückel (1923); standard form, common practice.
 * Reasonable up to I ≈ 0.1 mol/kg. Worked example: z = 2, I = 0.01, A = 0.5098, B = 0.3284,
 * å = 6 Å → log10 γ = −0.1704.
 */
export function extendedDebyeHuckelLogGamma(z: number, I: number, A: number, B: number, aAngstrom: number): number {
  checkI(I);
  if (!Number.isFinite(aAngstrom) || aAngstrom < 0) throw new RangeError(`ion-size parameter must be a non-negative number of Å, got ${aAngstrom}`);
  const s = Math.sqrt(I);
  return (-A * z * z * s) / (1 + B * aAngstrom * s);
}

/** Ionic strength I = ½ Σ m_i z_i², mol/kg. Example: 0.1 mol/kg Na⁺ + 0.1 mol/kg Cl⁻ → 0.1. */
export function ionicStrength(ions: ReadonlyArray<{ charge: number; molality: number }>): number {
  let s = 0;
  for (const { charge, molality } of ions) {
    if (!Number.isFinite(molality) || molality < 0) throw new RangeError(`molality must be a non-negative number, got ${molality}`);
    if (!Number.isFinite(charge)) throw new RangeError(`charge must be a finite number, got ${charge}`);
    s += molality * charge * charge;
  }
  return 0.5 * s;
}

/**
 * Ionic strength of a fully dissociated salt dissolved at `molality` (mol of salt per kg water),
 * given the ions of one formula unit: I = ½ m Σ count_i z_i².
 * The formula unit must be electrically neutral (Σ count·z = 0), else RangeError.
 * Examples: NaCl [{+1,1},{−1,1}] at 0.5 → 0.5; Na2SO4 [{+1,2},{−2,1}] at 0.1 → 0.3.
 * Ion pairing is ignored (an upper bound on I for 2:2 salts).
 */
export function backgroundElectrolyte(ions: ReadonlyArray<{ charge: number; count: number }>, molality: number): number {
  if (!Number.isFinite(molality) || molality < 0) throw new RangeError(`molality must be a non-negative number, got ${molality}`);
  let net = 0;
  for (const { charge, count } of ions) {
    if (!Number.isFinite(count) || count <= 0) throw new RangeError(`ion count must be positive, got ${count}`);
    net += charge * count;
  }
  if (Math.abs(net) > 1e-9) throw new RangeError(`background electrolyte is not electrically neutral (net charge ${net} per formula unit)`);
  return ionicStrength(ions.map(({ charge, count }) => ({ charge, molality: count * molality })));
}

export type ActivityModelName = 'davies' | 'debye-huckel' | 'ideal';

export interface ActivityModelOptions {
  /** Ionic strength, mol/kg. */
  ionicStrength: number;
  /** Debye–Hückel A (kg^½ mol^-½); required except for 'ideal'. */
  A?: number;
  /** Debye–Hückel B (Å⁻¹ kg^½ mol^-½); required for 'debye-huckel'. */
  B?: number;
  /** Default ion-size parameter å in Å for 'debye-huckel'; may be overridden per call of logGamma. */
  ionSizeAngstrom?: number;
}

export interface ActivityModel {
  /** log10 γ of an ion of charge z (0 for neutral species). `ionSizeAngstrom` overrides å for 'debye-huckel'. */
  logGamma(z: number, ionSizeAngstrom?: number): number;
  /** Range warnings (e.g. ionic strength beyond the model's usual range). */
  warnings: string[];
}

/** Davies: usual upper limit of ionic strength, mol/kg. */
export const DAVIES_MAX_I = 0.5;
/** Extended Debye–Hückel: usual upper limit of ionic strength, mol/kg. */
export const DEBYE_HUCKEL_MAX_I = 0.1;

/**
 * An activity-coefficient model at fixed ionic strength.
 * - 'davies': `daviesLogGamma`; warns beyond I ≈ 0.5 mol/kg.
 * - 'debye-huckel': `extendedDebyeHuckelLogGamma`; needs A, B and an ion size (option or per call);
 *   warns beyond I ≈ 0.1 mol/kg.
 * - 'ideal': log10 γ = 0 for every species.
 * Neutral species (z = 0) get γ = 1 in every model.
 */
export function activityModel(name: ActivityModelName, options: ActivityModelOptions): ActivityModel {
  const I = options.ionicStrength;
  checkI(I);
  const warnings: string[] = [];
  if (name === 'ideal') return { logGamma: () => 0, warnings };
  const A = options.A;
  if (A === undefined || !Number.isFinite(A) || A <= 0) throw new RangeError(`activity model '${name}' needs a positive Debye–Hückel A`);
  if (name === 'davies') {
    if (I > DAVIES_MAX_I) {
      warnings.push(`ionic strength ${I} mol/kg is beyond the usual range of the Davies equation (about ${DAVIES_MAX_I} mol/kg); activity coefficients are rough`);
    }
    return { logGamma: (z) => (z === 0 ? 0 : daviesLogGamma(z, I, A)), warnings };
  }
  if (name === 'debye-huckel') {
    const B = options.B;
    if (B === undefined || !Number.isFinite(B) || B <= 0) throw new RangeError(`activity model 'debye-huckel' needs a positive Debye–Hückel B`);
    if (I > DEBYE_HUCKEL_MAX_I) {
      warnings.push(`ionic strength ${I} mol/kg is beyond the usual range of the extended Debye–Hückel equation (about ${DEBYE_HUCKEL_MAX_I} mol/kg); activity coefficients are rough`);
    }
    const defaultSize = options.ionSizeAngstrom;
    return {
      logGamma: (z, size) => {
        if (z === 0) return 0;
        const a = size ?? defaultSize;
        if (a === undefined) throw new RangeError(`activity model 'debye-huckel' needs an ion-size parameter (Å) for charge ${z}`);
        return extendedDebyeHuckelLogGamma(z, I, A, B, a);
      },
      warnings,
    };
  }
  throw new RangeError(`unknown activity model '${String(name)}' (use 'davies', 'debye-huckel' or 'ideal')`);
}

/**
 * Convert a mass concentration (mg per litre of solution) to molality (mol per kg of water),
 * dilute-solution approximation: m ≈ (mg/L)/(1000·M) / (ρ/1000), M in g/mol, ρ the solution
 * (≈ water) density in kg/m³. It treats the kilogram of solution as a kilogram of water, which is
 * good while the dissolved mass is small (error ≈ mass fraction of solutes, <0.1 % below
 * ~1000 mg/L total). Example: 55.845 mg/L Fe at ρ = 997.05 → 1.00296e-3 mol/kg.
 */
export function mgPerLitreToMolal(mgPerL: number, molarMassGPerMol: number, densityKgM3: number): number {
  if (!Number.isFinite(mgPerL) || mgPerL < 0) throw new RangeError(`concentration must be a non-negative number of mg/L, got ${mgPerL}`);
  if (!Number.isFinite(molarMassGPerMol) || molarMassGPerMol <= 0) throw new RangeError(`molar mass must be positive, got ${molarMassGPerMol}`);
  if (!Number.isFinite(densityKgM3) || densityKgM3 <= 0) throw new RangeError(`density must be positive, got ${densityKgM3}`);
  return mgPerL / (1000 * molarMassGPerMol) / (densityKgM3 / 1000);
}

function checkI(I: number): void {
  if (!Number.isFinite(I) || I < 0) throw new RangeError(`ionic strength must be a non-negative number of mol/kg, got ${I}`);
}

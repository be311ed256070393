/**
 * Physical constants, CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys. 93, 025010, 2021).
 */
/** Molar gas constant R, J mol⁻¹ K⁻¹ (exact in the 2019 SI). */
export const R = 8.314462618;
/** Faraday constant F, C mol⁻¹ (exact in the 2019 SI). */
export const F = 96485.33212;
/** Reference temperature T_r of tabulated standard data, K. */
export const T_REF = 298.15;
/** 0 °C in kelvin. */
export const KELVIN = 273.15;
/** ln 10. */
export const LN10 = Math.log(10);

/**
 * Nernst slope s = ln(10)·R·T/F, in V per decade.
 * Worked value: T = 298.15 K → 0.0591593 V (59.16 mV per pH unit).
 * Valid at any T > 0 K.
 */
export function nernstSlope(kelvin: number): number {
  return (LN10 * R * kelvin) / F;
}

/**
 * The solvent function g of Shock, Oelkers, Johnson, Sverjensky & Helgeson (1992), J. Chem. Soc.
 * Faraday Trans. 88, 803: the change with T and P of the effective electrostatic radius of a
 * charged aqueous species, r_e = r_e,ref + |z|·g.
 *
 *   g = a_g (1 − ρ̂)^b_g − f(T, P),        ρ̂ = ρ / (1 g cm⁻³), T in °C, P in bar
 *   a_g = −2.037662 + 5.747000e-3 T − 6.557892e-6 T²
 *   b_g =  6.107361 − 1.074377e-2 T + 1.268348e-5 T²
 *   f   = [((T − 155)/300)^4.8 + 36.66666 ((T − 155)/300)^16]
 *         × [−1.504956e-10 (1000 − P)³ + 5.01799e-14 (1000 − P)⁴]   (155 < T < 355 °C, P < 1000 bar; else 0)
 * g in Å; g = 0 where ρ ≥ 1 g cm⁻³ (it is negligible below about 150 °C). Coefficients recalled
 * from the paper (Table 3 and eqs. 25, 32–33), not read from it just now.
 * Worked example: 300 °C, ρ = 0.7125 g cm⁻³, P = 85.9 bar → g = −0.00352 Å (see the test).
 */

/** g in Å from T (°C), P (bar) and water density (kg/m³). */
export function gFunction(celsius: number, pressureBar: number, densityKgM3: number): number {
  const rho = densityKgM3 / 1000;
  if (rho >= 1) return 0;
  const T = celsius;
  const ag = -2.037662 + 5.747e-3 * T - 6.557892e-6 * T * T;
  const bg = 6.107361 - 1.074377e-2 * T + 1.268348e-5 * T * T;
  let g = ag * (1 - rho) ** bg;
  if (T > 155 && T < 355 && pressureBar < 1000) {
    const u = (T - 155) / 300;
    const dp = 1000 - pressureBar;
    g -= (u ** 4.8 + 36.66666 * u ** 16) * (-1.504956e-10 * dp ** 3 + 5.01799e-14 * dp ** 4);
  }
  return g;
}

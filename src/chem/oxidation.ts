/**
 * Oxidation states by the usual textbook rules, and the number of electrons a full reaction
 * transfers (used by the `cell` calculator when the reaction text writes no electrons).
 */
const ALKALI = new Set(['Li', 'Na', 'K', 'Rb', 'Cs', 'Fr']);
const ALKALINE_EARTH = new Set(['Be', 'Mg', 'Ca', 'Sr', 'Ba', 'Ra']);
const HALOGENS = new Set(['Cl', 'Br', 'I', 'At']);
/** Non-metals and metalloids (for the metal-hydride rule). */
const NON_METALS = new Set(['H', 'He', 'B', 'C', 'N', 'O', 'F', 'Ne', 'Si', 'P', 'S', 'Cl', 'Ar', 'Ge', 'As', 'Se', 'Br', 'Kr', 'Sb', 'Te', 'I', 'Xe', 'At', 'Rn']);

/**
 * Oxidation state of every element of a species by the usual textbook rules, or undefined when
 * the rules do not decide it. Rules in order: an element alone has charge/count; F −1; alkali +1;
 * alkaline-earth +2; H +1 (−1 when every other element is a metal: metal hydrides); O −2, or by
 * difference when O is the only element left (peroxides H2O2, HO2⁻: −1; superoxides −½);
 * Cl/Br/I −1 when the species has no O; the one element left (S, N, C, a metal…) by difference
 * from the charge; if two or more are left and some are halogens, the halogens are taken as −1.
 * Results outside −4…+8 are rejected as undecided.
 * Worked examples: H2O → H +1, O −2; MnO4⁻ → Mn +7; H2O2 → O −1; Fe3O4 → Fe +8/3.
 */
export function oxidationStates(elements: Record<string, number>, charge: number): Record<string, number> | undefined {
  const els = Object.keys(elements);
  if (els.length === 0) return undefined;
  if (els.length === 1) return { [els[0]!]: charge / elements[els[0]!]! };
  const st: Record<string, number> = {};
  const set = (el: string, v: number) => {
    if (el in elements && st[el] === undefined) st[el] = v;
  };
  set('F', -1);
  for (const el of els) {
    if (ALKALI.has(el)) set(el, 1);
    if (ALKALINE_EARTH.has(el)) set(el, 2);
  }
  if ('H' in elements) set('H', els.every((e) => e === 'H' || !NON_METALS.has(e)) ? -1 : 1);
  const open = () => els.filter((e) => st[e] === undefined);
  const byDifference = (el: string) => {
    let sum = 0;
    for (const e of els) if (e !== el) sum += st[e]! * elements[e]!;
    st[el] = (charge - sum) / elements[el]!;
  };
  if ('O' in elements && st.O === undefined) {
    const rest = open();
    if (rest.length === 1) byDifference('O');
    else set('O', -2);
  }
  if (!('O' in elements)) for (const el of els) if (HALOGENS.has(el)) set(el, -1);
  let rest = open();
  if (rest.length > 1 && rest.some((e) => HALOGENS.has(e))) {
    for (const el of rest) if (HALOGENS.has(el)) set(el, -1);
    rest = open();
  }
  if (rest.length === 1) byDifference(rest[0]!);
  else if (rest.length > 1) return undefined;
  if (Object.values(st).some((v) => !Number.isFinite(v) || v > 8 + 1e-9 || v < -4 - 1e-9)) return undefined;
  return st;
}

/**
 * Electrons transferred in a full reaction: for each element, the amount of oxidation-number
 * decrease from the left side to the right side, moving atoms as little as possible (so a
 * disproportionation 2Cu⁺ = Cu + Cu²⁺ counts 1), summed over elements:
 *   down_el = (W_el + D_el)/2,  W = Σ|CDF_left − CDF_right|·Δs (1-D transport distance),
 *   D = Σ a_left·s − Σ a_right·s (net decrease).
 * Returns undefined when an oxidation state cannot be decided. Example: 2H2O = 2H2 + O2 → 4.
 */
export function electronsTransferred(terms: readonly { side: -1 | 1; coefficient: number; elements: Record<string, number>; charge: number }[]): number | undefined {
  const perElement = new Map<string, Map<number, number>>(); // el → state → (left − right) amount
  for (const t of terms) {
    const ox = oxidationStates(t.elements, t.charge);
    if (!ox) return undefined;
    for (const [el, c] of Object.entries(t.elements)) {
      const s = Number(ox[el]!.toPrecision(12));
      const m = perElement.get(el) ?? new Map<number, number>();
      m.set(s, (m.get(s) ?? 0) - t.side * c * t.coefficient);
      perElement.set(el, m);
    }
  }
  let n = 0;
  for (const m of perElement.values()) {
    const states = [...m.keys()].sort((a, b) => a - b);
    let cdf = 0;
    let w = 0;
    let d = 0;
    states.forEach((s, k) => {
      const a = m.get(s)!;
      d += a * s;
      cdf += a;
      if (k + 1 < states.length) w += Math.abs(cdf) * (states[k + 1]! - s);
    });
    n += (w + d) / 2;
  }
  return Number(n.toPrecision(10));
}

// ---------------------------------------------------------------------------------------------
// Energies and potentials

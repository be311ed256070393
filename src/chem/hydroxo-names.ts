/**
 * Systematic (additive) names of mononuclear hydroxido/oxido species, after the IUPAC
 * Recommendations 2005 ("Red Book", Nomenclature of Inorganic Chemistry, IR-9.2: additive names of
 * coordination entities; IR-7.1.3 and Table VII: anionic ligands ending in -ide take the ending
 * -ido, so OH⁻ is "hydroxido" and O²⁻ "oxido"; Table X: "-ate" names of central atoms in anions;
 * recalled from memory). We use the 2005 form (hydroxido, oxido); the 1990 form "hydroxo", "oxo"
 * is the one it replaced.
 *
 * Scope: a species of one metal atom M (one of the ATE table below) with only O and H besides, M O_o H_h with charge z, read as
 * h hydroxido and (o − h) oxido ligands (needs o ≥ 1 and h ≤ o). Species with other elements, two
 * or more metal atoms, no O, more H than O, or an undetermined or non-integer oxidation state give
 * undefined — never a guess.
 *
 * Steps:
 *   1. oxidation state of M from the charge balance with O −II and H +I: N = z + 2o − h
 *      (HFeO2⁻: −1 + 4 − 1 = +II; ZnO2²⁻: −2 + 4 = +II; MnO4⁻: −1 + 8 = +VII);
 *   2. with `hydrated`, the species is named as its fully hydroxylated equivalent, which differs by
 *      water only (a = 1 in dilute solution, so it is the same species thermodynamically): add
 *      o − h H2O, giving 2o − h hydroxido ligands (HFeO2⁻ → Fe(OH)3⁻, ZnO2²⁻ → Zn(OH)4²⁻,
 *      SnO3²⁻ → Sn(OH)6²⁻) — where that exceeds six ligands (MnO4⁻ would be Mn(OH)8⁻) the
 *      species is named as written;
 *   3. ligands in alphabetical order (hydroxido before oxido), each with its multiplying prefix
 *      (di, tri, tetra, penta, hexa, hepta, octa; none for one), written together without spaces;
 *   4. the central atom: its element name for a cation or neutral species ("iron", "copper"), its
 *      "-ate" name for an anion ("ferrate", "cuprate", "zincate");
 *   5. the oxidation state as a Stock number in Roman numerals: "(II)".
 * Worked examples: FeOH⁺ → hydroxidoiron(II); Zn(OH)4²⁻ → tetrahydroxidozincate(II);
 * Fe(OH)3⁻ → trihydroxidoferrate(II); HFeO2⁻ → hydroxidooxidoferrate(II) (hydrated:
 * trihydroxidoferrate(II)); TiO²⁺ → oxidotitanium(IV); MnO4⁻ → tetraoxidomanganate(VII).
 */
import { ELEMENTS } from './elements.js';
import { type Formula, parseFormula, splitPhase } from './parse.js';

/**
 * "-ate" names of central atoms in anions (IUPAC 2005, Table X; recalled from memory). This table
 * is also the scope: a central atom missing here (non-metals such as S, N, C, Cl, whose oxo species
 * have their own accepted names) gives undefined rather than a made-up name.
 */
const ATE: Readonly<Record<string, string>> = {
  Ag: 'argentate', Al: 'aluminate', Au: 'aurate', Be: 'beryllate', Bi: 'bismuthate', Cd: 'cadmate',
  Co: 'cobaltate', Cr: 'chromate', Cu: 'cuprate', Fe: 'ferrate', Ga: 'gallate', Ge: 'germanate',
  Hg: 'mercurate', In: 'indate', Mn: 'manganate', Mo: 'molybdate', Nb: 'niobate', Ni: 'nickelate',
  Pb: 'plumbate', Pd: 'palladate', Pt: 'platinate', Sn: 'stannate', Ti: 'titanate', Tl: 'thallate',
  U: 'uranate', V: 'vanadate', W: 'tungstate', Zn: 'zincate', Zr: 'zirconate',
};

const PREFIX = ['', '', 'di', 'tri', 'tetra', 'penta', 'hexa', 'hepta', 'octa'] as const;
const ROMAN = ['', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII'] as const;
/** Most hydroxido ligands of a hydrated name (octahedral coordination). */
const MAX_HYDRATED = 6;

export interface HydroxoName {
  /** The systematic name, e.g. "trihydroxidoferrate(II)". */
  name: string;
  /** The metal's element symbol. */
  metal: string;
  /** Oxidation state of the metal (integer 1–8). */
  oxidationState: number;
  /** Hydroxido and oxido ligands of the species named (after hydration when asked and done). */
  hydroxido: number;
  oxido: number;
  /** Charge of the species. */
  charge: number;
  /** True when the name is that of the hydrated equivalent (step 2), not of the formula as written. */
  hydrated: boolean;
}

/** The metal, and its O and H counts, of an M O_o H_h species; undefined out of scope. */
function composition(f: Formula): { metal: string; o: number; h: number } | undefined {
  const others = Object.keys(f.elements).filter((el) => el !== 'O' && el !== 'H');
  if (others.length !== 1) return undefined;
  const metal = others[0]!;
  const o = f.elements.O ?? 0;
  const h = f.elements.H ?? 0;
  const counts = [f.elements[metal]!, o, h];
  if (f.elements[metal] !== 1 || !counts.every(Number.isInteger) || o < 1 || h > o) return undefined;
  if (!(metal in ATE)) return undefined;
  return { metal, o, h };
}

/**
 * The IUPAC 2005 additive name of a mononuclear hydroxido/oxido species (steps in the module
 * comment), or undefined out of scope. `formula` is text in any notation (a phase tag is allowed;
 * solids, liquids and gases give undefined: their names are compositional, not additive) or a
 * parsed Formula. With `hydrated: true` the fully hydroxylated equivalent is named.
 */
export function hydroxoName(formula: string | Formula, options: { hydrated?: boolean } = {}): HydroxoName | undefined {
  let f: Formula;
  if (typeof formula === 'string') {
    const { formula: body, phase } = splitPhase(formula);
    if (phase !== undefined && phase !== 'aq') return undefined;
    try {
      f = parseFormula(body);
    } catch {
      return undefined;
    }
  } else {
    f = formula;
  }
  const c = composition(f);
  if (!c) return undefined;
  // Step 1: oxidation state.
  const N = f.charge + 2 * c.o - c.h;
  if (!(N >= 1 && N < ROMAN.length)) return undefined;
  // Step 2: ligands, hydrated when asked and sensible.
  let hydroxido = c.h;
  let oxido = c.o - c.h;
  const hydrated = options.hydrated === true && oxido > 0 && 2 * c.o - c.h <= MAX_HYDRATED;
  if (hydrated) {
    hydroxido = 2 * c.o - c.h;
    oxido = 0;
  }
  if (hydroxido + oxido >= PREFIX.length) return undefined;
  // Steps 3–5.
  const ligand = (n: number, stem: string): string => (n === 0 ? '' : PREFIX[n] + stem);
  const centre = f.charge < 0 ? ATE[c.metal]! : ELEMENTS.get(c.metal)!.name;
  const name = `${ligand(hydroxido, 'hydroxido')}${ligand(oxido, 'oxido')}${centre}(${ROMAN[N]})`;
  return { name, metal: c.metal, oxidationState: N, hydroxido, oxido, charge: f.charge, hydrated };
}

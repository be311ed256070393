/**
 * The 118 chemical elements with their standard atomic weights.
 *
 * Source of `weight`: IUPAC Commission on Isotopic Abundances and Atomic Weights, Standard atomic
 * weights 2021 (abridged/conventional values), recalled from memory. Abridged values are given to
 * five significant figures; elements whose standard atomic weight is an interval (H, Li, B, C, N, O,
 * Mg, Si, S, Cl, Ar, Br, Tl, Pb) carry the IUPAC conventional value. The 2021 revisions of Zr, Gd and
 * Lu are included. `weight` is null for elements with no stable isotope and no characteristic
 * terrestrial isotopic composition (IUPAC gives no standard atomic weight).
 *
 * Units: g/mol (numerically equal to the relative atomic mass A_r).
 */

export interface ElementInfo {
  /** Atomic number. */
  Z: number;
  /** Element symbol, case-sensitive (e.g. "Fe"). */
  symbol: string;
  /** English name, IUPAC spelling. */
  name: string;
  /** Standard atomic weight (abridged/conventional), g/mol; null where IUPAC gives none. */
  weight: number | null;
}

// [symbol, name, weight] in order of atomic number.
const TABLE: ReadonlyArray<readonly [string, string, number | null]> = [
  ['H', 'hydrogen', 1.008],
  ['He', 'helium', 4.0026],
  ['Li', 'lithium', 6.94],
  ['Be', 'beryllium', 9.0122],
  ['B', 'boron', 10.81],
  ['C', 'carbon', 12.011],
  ['N', 'nitrogen', 14.007],
  ['O', 'oxygen', 15.999],
  ['F', 'fluorine', 18.998],
  ['Ne', 'neon', 20.18],
  ['Na', 'sodium', 22.99],
  ['Mg', 'magnesium', 24.305],
  ['Al', 'aluminium', 26.982],
  ['Si', 'silicon', 28.085],
  ['P', 'phosphorus', 30.974],
  ['S', 'sulfur', 32.06],
  ['Cl', 'chlorine', 35.45],
  ['Ar', 'argon', 39.95],
  ['K', 'potassium', 39.098],
  ['Ca', 'calcium', 40.078],
  ['Sc', 'scandium', 44.956],
  ['Ti', 'titanium', 47.867],
  ['V', 'vanadium', 50.942],
  ['Cr', 'chromium', 51.996],
  ['Mn', 'manganese', 54.938],
  ['Fe', 'iron', 55.845],
  ['Co', 'cobalt', 58.933],
  ['Ni', 'nickel', 58.693],
  ['Cu', 'copper', 63.546],
  ['Zn', 'zinc', 65.38],
  ['Ga', 'gallium', 69.723],
  ['Ge', 'germanium', 72.63],
  ['As', 'arsenic', 74.922],
  ['Se', 'selenium', 78.971],
  ['Br', 'bromine', 79.904],
  ['Kr', 'krypton', 83.798],
  ['Rb', 'rubidium', 85.468],
  ['Sr', 'strontium', 87.62],
  ['Y', 'yttrium', 88.906],
  ['Zr', 'zirconium', 91.222],
  ['Nb', 'niobium', 92.906],
  ['Mo', 'molybdenum', 95.95],
  ['Tc', 'technetium', null],
  ['Ru', 'ruthenium', 101.07],
  ['Rh', 'rhodium', 102.91],
  ['Pd', 'palladium', 106.42],
  ['Ag', 'silver', 107.87],
  ['Cd', 'cadmium', 112.41],
  ['In', 'indium', 114.82],
  ['Sn', 'tin', 118.71],
  ['Sb', 'antimony', 121.76],
  ['Te', 'tellurium', 127.6],
  ['I', 'iodine', 126.9],
  ['Xe', 'xenon', 131.29],
  ['Cs', 'caesium', 132.91],
  ['Ba', 'barium', 137.33],
  ['La', 'lanthanum', 138.91],
  ['Ce', 'cerium', 140.12],
  ['Pr', 'praseodymium', 140.91],
  ['Nd', 'neodymium', 144.24],
  ['Pm', 'promethium', null],
  ['Sm', 'samarium', 150.36],
  ['Eu', 'europium', 151.96],
  ['Gd', 'gadolinium', 157.25],
  ['Tb', 'terbium', 158.93],
  ['Dy', 'dysprosium', 162.5],
  ['Ho', 'holmium', 164.93],
  ['Er', 'erbium', 167.26],
  ['Tm', 'thulium', 168.93],
  ['Yb', 'ytterbium', 173.05],
  ['Lu', 'lutetium', 174.97],
  ['Hf', 'hafnium', 178.49],
  ['Ta', 'tantalum', 180.95],
  ['W', 'tungsten', 183.84],
  ['Re', 'rhenium', 186.21],
  ['Os', 'osmium', 190.23],
  ['Ir', 'iridium', 192.22],
  ['Pt', 'platinum', 195.08],
  ['Au', 'gold', 196.97],
  ['Hg', 'mercury', 200.59],
  ['Tl', 'thallium', 204.38],
  ['Pb', 'lead', 207.2],
  ['Bi', 'bismuth', 208.98],
  ['Po', 'polonium', null],
  ['At', 'astatine', null],
  ['Rn', 'radon', null],
  ['Fr', 'francium', null],
  ['Ra', 'radium', null],
  ['Ac', 'actinium', null],
  ['Th', 'thorium', 232.04],
  ['Pa', 'protactinium', 231.04],
  ['U', 'uranium', 238.03],
  ['Np', 'neptunium', null],
  ['Pu', 'plutonium', null],
  ['Am', 'americium', null],
  ['Cm', 'curium', null],
  ['Bk', 'berkelium', null],
  ['Cf', 'californium', null],
  ['Es', 'einsteinium', null],
  ['Fm', 'fermium', null],
  ['Md', 'mendelevium', null],
  ['No', 'nobelium', null],
  ['Lr', 'lawrencium', null],
  ['Rf', 'rutherfordium', null],
  ['Db', 'dubnium', null],
  ['Sg', 'seaborgium', null],
  ['Bh', 'bohrium', null],
  ['Hs', 'hassium', null],
  ['Mt', 'meitnerium', null],
  ['Ds', 'darmstadtium', null],
  ['Rg', 'roentgenium', null],
  ['Cn', 'copernicium', null],
  ['Nh', 'nihonium', null],
  ['Fl', 'flerovium', null],
  ['Mc', 'moscovium', null],
  ['Lv', 'livermorium', null],
  ['Ts', 'tennessine', null],
  ['Og', 'oganesson', null],
];

/** All 118 elements keyed by symbol (case-sensitive), in order of atomic number. */
export const ELEMENTS: ReadonlyMap<string, ElementInfo> = new Map(
  TABLE.map(([symbol, name, weight], i) => [symbol, Object.freeze({ Z: i + 1, symbol, name, weight })]),
);

/** True when `symbol` is exactly (case-sensitively) the symbol of one of the 118 elements. */
export function isElement(symbol: string): boolean {
  return ELEMENTS.has(symbol);
}

/**
 * Reference electrodes: converting potentials between the standard hydrogen electrode (SHE) scale
 * and the scales of common laboratory and field reference electrodes.
 *
 * Convention: the offset of an electrode is its own potential on the SHE scale at the same
 * temperature, offset = E_SHE − E_ref (a potential read against the electrode plus the offset gives
 * the SHE value):  E_SHE = E_ref + offset,  E_ref = E_SHE − offset.
 *
 * Temperature: where a source gives a temperature coefficient the offset is
 *   offset(t) = E25 + a1·(t − 25) + a2·(t − 25)² + a3·(t − 25)³      (t in °C, V)
 * otherwise the 25 °C value is used with a warning when t ≠ 25 °C.
 * The reversible hydrogen electrode is computed: E_SHE = E_RHE − s(T)·pH, s = ln10·RT/F.
 *
 * Sources of the 25 °C values: common practice in corrosion and electrochemistry laboratories,
 * recalled from memory (a few mV spread between compilations is normal; liquid-junction potentials
 * are not included). Sources of the temperature coefficients are given per electrode.
 */
import { KELVIN, nernstSlope } from './constants.js';

export interface ReferenceElectrode {
  /** Our short name, lower case (e.g. "sce"). */
  id: string;
  /** Label for output, e.g. "SCE", "Ag/AgCl (sat. KCl)". */
  label: string;
  /** Potential vs SHE at 25 °C, V. */
  E25: number;
  /** First-order temperature coefficient around 25 °C, V/K. */
  dEdT?: number;
  /** Coefficients of (t − 25)² and (t − 25)³, V/K² and V/K³, where the source gives them. */
  higherOrder?: readonly number[];
  /** Range of temperature (°C) over which the temperature formula holds. */
  validRange?: readonly [number, number];
  /** Source of E25 and of the temperature dependence. */
  source: string;
  /** Other accepted names (lower case). */
  aliases: readonly string[];
}

/** A user-defined reference electrode. */
export interface CustomReference {
  name: string;
  /** Potential vs SHE at 25 °C, V. */
  potential: number;
  /** Temperature coefficient, V/K. */
  dEdT?: number;
}

const PRACTICE = 'common laboratory practice, recalled from memory';

/** The built-in electrodes (SHE and RHE first; RHE is computed from the pH). */
export const REFERENCE_ELECTRODES: readonly ReferenceElectrode[] = [
  { id: 'she', label: 'SHE', E25: 0, source: 'definition (0 V at every temperature)', aliases: ['standard-hydrogen'] },
  {
    id: 'rhe',
    label: 'RHE',
    E25: 0,
    source: 'computed: E_SHE = E_RHE − (ln10·RT/F)·pH',
    aliases: ['reversible-hydrogen'],
  },
  {
    id: 'sce',
    label: 'SCE',
    E25: 0.2412,
    dEdT: -6.61e-4,
    higherOrder: [-1.75e-6, -9.0e-10],
    validRange: [0, 70],
    source:
      'saturated calomel, Hg/Hg2Cl2/KCl(sat.): E = 0.2412 − 6.61e-4(t−25) − 1.75e-6(t−25)² − 9.0e-10(t−25)³ V; ' +
      'D.T. Sawyer, A. Sobkowiak, J.L. Roberts, Electrochemistry for Chemists, 2nd ed. (Wiley 1995), ch. 5, recalled from memory',
    aliases: ['calomel', 'sce-sat', 'hg/hg2cl2'],
  },
  {
    id: 'agcl-sat',
    label: 'Ag/AgCl (sat. KCl)',
    E25: 0.197,
    dEdT: -1.01e-3,
    validRange: [0, 90],
    source:
      `${PRACTICE}; temperature coefficient −1.01 mV/K: Sawyer, Sobkowiak & Roberts, Electrochemistry for Chemists, 2nd ed. (1995), recalled from memory`,
    aliases: ['agcl', 'ag/agcl', 'ag/agcl-sat'],
  },
  { id: 'agcl-3.5m', label: 'Ag/AgCl (3.5 mol/L KCl)', E25: 0.205, source: PRACTICE, aliases: ['ag/agcl-3.5m', 'agcl-3.5'] },
  { id: 'agcl-1m', label: 'Ag/AgCl (1 mol/L KCl)', E25: 0.235, source: PRACTICE, aliases: ['ag/agcl-1m', 'agcl-1'] },
  {
    id: 'agcl-sea',
    label: 'Ag/AgCl (seawater)',
    E25: 0.25,
    source: 'cathodic-protection practice, recalled from memory (depends on salinity)',
    aliases: ['ag/agcl-sea', 'agcl-seawater', 'ag/agcl/seawater'],
  },
  {
    id: 'cse',
    label: 'Cu/CuSO₄ (sat.)',
    E25: 0.316,
    dEdT: 9.0e-4,
    validRange: [0, 60],
    source:
      'buried-structure cathodic-protection practice (0.30–0.32 V quoted; temperature coefficient about +0.9 mV/K), recalled from memory',
    aliases: ['cu/cuso4', 'csce', 'copper-sulfate'],
  },
  { id: 'hgo', label: 'Hg/HgO (1 mol/L NaOH)', E25: 0.14, source: PRACTICE, aliases: ['hg/hgo'] },
  { id: 'mse', label: 'Hg/Hg₂SO₄ (sat. K₂SO₄)', E25: 0.64, source: PRACTICE, aliases: ['hg/hg2so4'] },
];

const BY_NAME = new Map<string, ReferenceElectrode>();
for (const r of REFERENCE_ELECTRODES) {
  BY_NAME.set(r.id, r);
  for (const a of r.aliases) BY_NAME.set(a, r);
}

/** The electrode for a name or alias (case-insensitive, spaces ignored); throws listing the known names. */
export function findReference(name: string): ReferenceElectrode {
  const key = name.trim().toLowerCase().replace(/\s+/g, '');
  const r = BY_NAME.get(key);
  if (!r) {
    throw new Error(
      `unknown reference electrode "${name}"; known: ${REFERENCE_ELECTRODES.map((e) => e.id).join(', ')} ` +
        '(or a user-defined electrode with its potential vs SHE)',
    );
  }
  return r;
}

/** One line per electrode, for help text: "sce  SCE  +0.241 V vs SHE at 25 °C (aliases …)". */
export function listReferences(): string[] {
  const w = Math.max(...REFERENCE_ELECTRODES.map((r) => r.id.length));
  return REFERENCE_ELECTRODES.map((r) => {
    const value = r.id === 'rhe' ? '−0.0592·pH V vs SHE at 25 °C' : `${r.E25 >= 0 ? '+' : ''}${r.E25.toFixed(3)} V vs SHE at 25 °C`;
    return `${r.id.padEnd(w)}  ${r.label}: ${value}${r.aliases.length ? ` (also: ${r.aliases.join(', ')})` : ''}`;
  });
}

export interface ReferenceOffset {
  /** E_SHE − E_ref at the temperature, V. */
  offset: number;
  /** Label of the scale, e.g. "SCE", "RHE (pH 7)". */
  label: string;
  warnings: string[];
}

const isCustom = (r: unknown): r is CustomReference => typeof r === 'object' && r !== null && 'potential' in r;

/**
 * Offset E_SHE − E_ref (V) of a reference electrode at `celsius` (see module comment for the
 * formulas). `pH` is required for the RHE (offset = −ln10·RT/F·pH) and ignored otherwise.
 * Worked examples: SCE at 25 °C → +0.2412 V; RHE at pH 7, 25 °C → −0.41412 V.
 * Throws an Error for an unknown name (listing the known ones), for the RHE without a pH, and for
 * a non-finite temperature or potential.
 */
export function referenceOffset(ref: string | CustomReference, celsius = 25, pH?: number): ReferenceOffset {
  if (!Number.isFinite(celsius) || celsius <= -KELVIN) throw new Error(`temperature ${celsius} °C is not valid`);
  const warnings: string[] = [];
  const dt = celsius - 25;
  const at25 = Math.abs(dt) < 1e-9;
  if (isCustom(ref)) {
    if (!Number.isFinite(ref.potential)) throw new Error(`reference "${ref.name}": potential must be a finite number (V vs SHE)`);
    let offset = ref.potential;
    if (ref.dEdT !== undefined) offset += ref.dEdT * dt;
    else if (!at25) warnings.push(`reference "${ref.name}": no temperature coefficient given; its 25 °C potential is used at ${celsius} °C`);
    return { offset, label: ref.name, warnings };
  }
  const r = findReference(ref);
  if (r.id === 'rhe') {
    if (pH === undefined || !Number.isFinite(pH)) throw new Error('the reversible hydrogen electrode (RHE) needs the pH');
    return { offset: -nernstSlope(celsius + KELVIN) * pH, label: `RHE (pH ${pH})`, warnings };
  }
  let offset = r.E25;
  if (!at25) {
    if (r.dEdT === undefined) {
      if (r.id !== 'she') warnings.push(`${r.label}: no temperature coefficient known; its 25 °C potential (${r.E25.toFixed(3)} V vs SHE) is used at ${celsius} °C`);
    } else {
      offset += r.dEdT * dt;
      (r.higherOrder ?? []).forEach((a, k) => {
        offset += a * dt ** (k + 2);
      });
      if (r.validRange && (celsius < r.validRange[0] || celsius > r.validRange[1])) {
        warnings.push(`${r.label}: ${celsius} °C is outside ${r.validRange[0]}–${r.validRange[1]} °C, where its temperature formula holds`);
      }
    }
  }
  return { offset, label: r.label, warnings };
}

/** Potential on the SHE scale from one read against `ref`: E_SHE = E + offset (V). */
export function toSHE(E: number, ref: string | CustomReference, celsius = 25, pH?: number): number {
  return E + referenceOffset(ref, celsius, pH).offset;
}

/** Potential against `ref` from one on the SHE scale: E_ref = E_SHE − offset (V). */
export function fromSHE(E: number, ref: string | CustomReference, celsius = 25, pH?: number): number {
  return E - referenceOffset(ref, celsius, pH).offset;
}

/**
 * The diagram model: plain data produced by the solver and consumed by renderers and reports.
 * Everything here is JSON-serialisable. Potentials are in V on the SHE scale at the diagram's
 * temperature; pH is on the molal activity scale; energies are kJ/mol unless stated.
 */

export type Phase = 's' | 'l' | 'g' | 'aq';

/** Class of a region for colouring and verdicts. */
export type RegionClass = 'element' | 'solid' | 'dissolved' | 'gas';

/** A closed ring of [pH, E] vertices, not repeating the first vertex at the end. */
export type Ring = [number, number][];
/** A polygon: outer ring (counter-clockwise in pH→right, E→up) then holes (clockwise). */
export type Polygon = Ring[];

export interface RegionModel {
  species: string;          // formula exactly as in the input
  phase: Phase;
  class: RegionClass;
  /** Corrosion verdict of the region (reclassifications applied). */
  verdict?: 'immunity' | 'passivation' | 'corrosion';
  /**
   * True where the species could not be carried to the diagram temperature (only ΔfG° given): the
   * region is placed with its 25 °C ΔfG° (geometry only) and has no verdict.
   */
  undetermined?: boolean;
  name?: string;
  polygons: Polygon[];
  /** Area in pH·V. */
  area: number;
  /** Alloy kind: the phases and dissolved species, mol per mol of alloy atoms. */
  assemblage?: { species: string; phase: Phase; amount: number; dissolved: boolean }[];
  /** Alloy kind: immune, passive, corroding, or partly corroding (some elements dissolve). */
  alloyVerdict?: 'immune' | 'passive' | 'corroding' | 'partly-corroding';
  /** Alloy kind: the main elements with a share in a dissolved species. */
  dissolving?: string[];
}

/** Alloy kind: the bulk composition (mole fractions) and each element's threshold activity. */
export interface AlloyModel {
  composition: Record<string, number>;
  activities: Record<string, number>;
  grid: { nx: number; ny: number };
}

export interface LineCoefficients {
  /** 'E' lines: E = intercept + slope·pH (V vs SHE); 'pH' lines: pH = value. */
  kind: 'E' | 'pH';
  intercept?: number;
  slope?: number;
  value?: number;
  /** Standard potential at T of the reaction (all activities 1), V vs SHE; absent for no-electron lines. */
  E0?: number;
  /** log10 K at T for no-electron lines. */
  logK?: number;
  /** Electrons n and protons m in the reduction direction as written. */
  n: number;
  m: number;
}

export interface BoundaryModel {
  between: [string, string];
  /** Ligand species that take part in this segment's reaction. */
  ligandSpecies: string[];
  reaction: string;
  equation: string;
  line: LineCoefficients;
  /** Polyline along the boundary, [pH, E] pairs. */
  points: [number, number][];
}

export interface TriplePoint {
  species: string[];
  pH: number;
  E: number;
}

export interface WaterLine {
  reaction: string;
  equation: string;
  line: LineCoefficients;
  points: [number, number][];
}

/** An iso-solubility line (composition mode): total dissolved main element = level, mol/kg. */
export interface IsoSolubilityLine {
  level: number;
  /** Polylines of [pH, E]; closed ones repeat no vertex. */
  lines: [number, number][][];
}

/** The bath as made up (composition mode): totals in mol/kg of water, by component. */
export interface CompositionModel {
  totals: Record<string, number>;
  units: 'mol/kg';
  /** How the ionic strength was set: a number (mol/kg) or 'auto' (from the speciation). */
  ionicStrength: number | 'auto';
  /** Grid the regions were traced on, and points that could not be solved (undetermined). */
  grid: { nx: number; ny: number; failed: number };
  /**
   * Polygons to show as undetermined: first where species without G at T (`heldBy`) hold 1 % or more
   * of the element (diagram/composition-undetermined.ts), then where the point solver failed (grid
   * resolution, not refined), then, last, the `unresolved` patches the traced regions left
   * uncovered near their junctions.
   */
  undetermined: Polygon[];
  /** The species without G at T that hold part of the element somewhere on the diagram (absent: none). */
  heldBy?: string[];
  /** How many of the last `undetermined` polygons are unresolved gaps rather than failed points (absent: none). */
  unresolved?: number;
}

export interface DiagramModel {
  /** Kind of diagram (absent in older models: 'fixed-activity'). */
  kind?: 'fixed-activity' | 'composition' | 'alloy';
  ephmap: string;
  element: string;
  temperature: { celsius: number; kelvin: number };
  units: Record<string, string>;
  domain: { pH: [number, number]; E: [number, number] };
  /**
   * The dissolved-element amount every dissolved species of the element follows: the activity when
   * the file gives one, else the molality (mol/kg) of the concentration given (see `amounts`).
   */
  activity: number;
  /** Each ligand's total: its activity, or the molality (mol/kg) of the concentration given. */
  ligands: Record<string, number>;
  /** The amounts as the file gives them (value and unit) with their molality, for captions and reports. */
  amounts?: { element: GivenAmount; ligands: Record<string, GivenAmount> };
  species: SpeciesSummary[];
  regions: RegionModel[];
  boundaries: BoundaryModel[];
  triplePoints: TriplePoint[];
  waterLines: { hydrogen: WaterLine; oxygen: WaterLine; pressures: { H2: number; O2: number } };
  /** Ligand predominance underlay (ligand element → its own regions). */
  ligandRegions?: Record<string, RegionModel[]>;
  water?: Record<string, number | string>;
  /** The scale potentials are shown in, besides SHE (reference electrode), when one is set. */
  reference?: { id: string; label: string; offset: number };
  warnings: string[];
  /** What the figure layout did to fit the requested size (set when a figure is drawn; none: absent). */
  figureNotes?: string[];
  sources: string[];
  /** Composition mode: the totals, and the iso-solubility lines of the dissolved element. */
  composition?: CompositionModel;
  isoSolubility?: IsoSolubilityLine[];
  /** Alloy kind: composition and threshold activities. */
  alloy?: AlloyModel;
}

/** An amount as given in the system file, with the molality it converts to (absent for an activity). */
export interface GivenAmount {
  kind: 'activity' | 'molality' | 'mg/L';
  value: number;
  /** For mg/L: the formula whose molar mass converts it. */
  as?: string;
  molality?: number;
  /** True for the default threshold (no activity or concentration in the file). */
  isDefault?: boolean;
}

export interface SpeciesSummary {
  formula: string;
  phase: Phase;
  class: RegionClass;
  role: 'main' | 'ligand';
  name?: string;
  activity?: number;
  /** Molality (mol/kg) where a concentration was given; activity = γ·molality. */
  molality?: number;
  /** log10 γ applied. */
  logGamma?: number;
  /** How G was carried from 25 °C to T ('iapws', 'published', 'estimated', 'cp-polynomial', 'constant-cp', 'constant-h-s', 'constant-g', 'tabulated' (only ΔfG°, at 25 °C), 'undetermined' (only ΔfG°, elsewhere: no verdict). */
  temperatureModel?: string;
  /** True where S° or equation-of-state parameters were estimated. */
  estimated?: boolean;
  pressure?: number;
  G: number;       // apparent G at T, kJ/mol
  source?: string;
}

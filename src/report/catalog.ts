/**
 * The `catalog` report: the built-in species with their data and sources.
 */
import { formulaForPeople } from '../chem/present.js';
import type { LibrarySpecies } from '../data/library.js';
import { libraryTemperatureModel } from '../system/carry.js';
import { table } from './table.js';

export interface CatalogEntry {
  formula: string;
  phase: string;
  name: string;
  dfG: number;
  dfH: number | null;
  S: number | null;
  Cp: number | null;
  source: string;
  sourceText: string;
  valueSources?: Record<string, string>;
  recalled: boolean;
  metastable: boolean;
  /** Phase choice by temperature (°C): used only below / from this temperature (absent: always). */
  stableBelow?: number;
  stableAbove?: number;
  uncertainty?: Record<string, number>;
  alternatives?: { id: string; dfG: number; dfH: number | null; S: number | null; Cp: number | null; source: string; sourceText: string; note?: string }[];
  note?: string;
  file: string;
  /** How the default model carries it to temperature (src/system/carry.ts). */
  temperatureModel: string;
  /** What of its temperature data is estimated (S°, HKF parameters); absent when nothing is. */
  estimated?: string[];
}

export function catalogEntries(lib: readonly LibrarySpecies[], element?: string): CatalogEntry[] {
  const sel = element ? lib.filter((s) => (s.elements[element] ?? 0) > 0) : lib;
  return sel.map((s) => {
    const e: CatalogEntry = {
      formula: s.formula,
      phase: s.phase,
      name: s.name,
      dfG: s.dfG,
      dfH: s.dfH ?? null,
      S: s.S ?? null,
      Cp: s.Cp ?? null,
      source: s.source,
      sourceText: s.sourceText,
      recalled: s.recalled === true,
      metastable: s.metastable === true,
      file: s.file,
      temperatureModel: '',
    };
    const tm = libraryTemperatureModel(s, lib);
    e.temperatureModel = tm.model;
    if (tm.estimated) e.estimated = tm.estimatedWhat;
    if (s.stableBelow !== undefined) e.stableBelow = s.stableBelow;
    if (s.stableAbove !== undefined) e.stableAbove = s.stableAbove;
    if (s.valueSourceText) e.valueSources = { ...s.valueSourceText } as Record<string, string>;
    if (s.uncertainty) e.uncertainty = { ...s.uncertainty } as Record<string, number>;
    if (s.note) e.note = s.note;
    if (s.alternatives?.length) {
      e.alternatives = s.alternatives.map((a) => ({
        id: a.id,
        dfG: a.dfG,
        dfH: a.dfH ?? null,
        S: a.S ?? null,
        Cp: a.Cp ?? null,
        source: a.source,
        sourceText: s.sourceMap[a.source] ?? a.source,
        ...(a.note ? { note: a.note } : {}),
      }));
    }
    return e;
  });
}

export function catalogText(entries: CatalogEntry[]): string {
  const n = (v: number | null, d: number) => (v === null ? '—' : v.toFixed(d));
  const rows = entries.map((e) => [
    formulaForPeople(e.formula),
    e.phase,
    e.name,
    n(e.dfG, 2),
    n(e.dfH, 2),
    n(e.S, 2),
    n(e.Cp, 2),
    `${e.temperatureModel}${e.estimated ? ` (estimated: ${e.estimated.join(', ')})` : ''}`,
    `${e.source}${e.recalled ? '*' : ''}${e.metastable ? ' (metastable)' : ''}${e.stableBelow !== undefined ? ` (used below ${e.stableBelow} °C)` : ''}${e.stableAbove !== undefined ? ` (used from ${e.stableAbove} °C)` : ''}${e.alternatives ? ` [alt: ${e.alternatives.map((a) => a.id).join(', ')}]` : ''}`,
  ]);
  const sources = new Map<string, string>();
  for (const e of entries) {
    sources.set(e.source, e.sourceText);
    for (const a of e.alternatives ?? []) sources.set(a.source, a.sourceText);
  }
  const body = table(['formula', 'phase', 'name', 'ΔfG°/(kJ/mol)', 'ΔfH°/(kJ/mol)', 'S°/(J/(mol·K))', 'Cp°/(J/(mol·K))', 'temperature model', 'source'], rows, [false, false, false, true, true, true, true, false, false]);
  const refs = [...sources.entries()].sort().map(([k, v]) => `  ${k}: ${v}`).join('\n');
  const est = entries.some((e) => e.estimated)
    ? 'temperature model "estimated": S° or HKF parameters estimated by published correlations (species/README.md lists them).\n'
    : '';
  return `${body}\n\n* recalled from memory, not read from the source.\n${est}Sources:\n${refs}\n`;
}

/**
 * The catalogue as JSON: `{species, warnings}` — every JSON output of ephmap carries a `warnings`
 * array; here it names the species whose temperature data are estimated and the recalled values.
 */
export function catalogJson(entries: CatalogEntry[], element?: string): { species: CatalogEntry[]; warnings: string[] } {
  const warnings: string[] = [];
  if (!entries.length) warnings.push(`no species of ${element ?? 'any element'} in the library`);
  const est = entries.filter((e) => e.estimated?.length).map((e) => e.formula);
  if (est.length) warnings.push(`temperature data estimated away from 25 °C (see species/README.md): ${est.join(', ')}`);
  if (entries.some((e) => e.recalled)) warnings.push('values marked recalled were written from memory, not read from the source just now: check them against the printed tables before design use');
  return { species: entries, warnings };
}

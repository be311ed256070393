/**
 * ephmap as a library: the typed public API (what `import … from 'ephmap'` gives).
 *
 *   load a system   readSpec(data, name) or loadSpec(path)        → SystemSpec
 *   compute         compute(spec)                                 → Computed ({ spec, model, … })
 *                   computeAny(spec): either kind (composition files with full speciation) → ComputedAny
 *   shares          sharesData(spec, 'pH' | 'E', at)              → SharesData (composition mode)
 *   probe           probe(computed, pH, E)                        → ProbeResult (verdict, margins)
 *   render          renderDiagram(computed, 'svg' | 'pdf' | 'png' | 'html') → text or bytes
 *   lines           lineRows(computed.model), linesText(computed.model)
 *   window          platingWindow(computed.model)                 → WindowResult
 *   cell            cellReaction(text, { lookup: libraryLookup }) → CellResult
 *
 * Potentials are V vs SHE at the diagram temperature; every error ephmap raises on purpose is an
 * EphmapError with a `code` and an `exitStatus`.
 */
export type { BoundaryModel, DiagramModel, Phase, RegionClass, RegionModel, SpeciesSummary, TriplePoint, WaterLine } from './model.js';
export { EXIT, EphmapError, FigureFitError, InputError, OutputError, exitStatusOf, type ExitStatus } from './errors.js';
export { readSpec, type SystemSpec } from './system/spec.js';
export { compute, computeAny, computeFile, loadSpec, type Computed, type ComputedAny, type ComputedBath } from './pipeline.js';
export { sharesData, type SharesData } from './analysis/shares.js';
export { probe, type Crossing, type ProbeResult } from './analysis/probe.js';
export { platingWindow, type PlatingWindow, type WindowResult } from './analysis/window.js';
export { renderDiagram, type FigureFormat } from './figure/output.js';
export type { FigureOverrides } from './figure/options.js';
export { lineRows, linesText, type LineRow } from './report/lines.js';
export { cellReaction, cellTable, type CellOptions, type CellResult, type SpeciesData, type SpeciesLookup } from './thermo/cell.js';
export { fileLookup, libraryLookup } from './system/lookup.js';
export { FormulaError } from './chem/formula.js';
export { ReactionError } from './chem/reaction-parse.js';
export { LibraryError } from './data/library.js';
export { VERSION } from './version.js';

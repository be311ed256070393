export { ELEMENTS, isElement } from './elements.js';
export type { ElementInfo } from './elements.js';
export {
  FormulaError,
  parseFormula,
  tokenizeFormula,
  splitPhase,
  formulaWarnings,
  molarMass,
  formatFormula,
  formatNumber,
  formulaAscii,
  formulaUnicode,
  chargeLabel,
  sameFormula,
} from './formula.js';
export type { Formula, FormulaToken, FormulaTokenKind, Phase } from './formula.js';
export {
  ELECTRON_ASCII,
  ELECTRON_UNICODE,
  EQUILIBRIUM_ASCII,
  EQUILIBRIUM_UNICODE,
  equilibriumText,
  isElectron,
  reactionAscii,
  reactionUnicode,
} from './reaction-text.js';
export type { EquationTerm, Notation, SpeciesTerm } from './reaction-text.js';
export { hydroxoName } from './hydroxo-names.js';
export type { HydroxoName } from './hydroxo-names.js';
export { formulaMatches } from './match.js';
export { chargesForPeople, formulaForJson, formulaForPeople, reactionForJson, reactionForPeople, textForPeople, labelForPeople } from './present.js';

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

/**
 * Reaction text for the `cell` calculator: "2H2O(l) <=> 2H2(g) + O2(g)" or "Cu^2+ + 2e^- <=> Cu(s)"
 * (also with Unicode, "Cu²⁺ + 2e⁻ ⇌ Cu(s)", and in the older form "Cu+2 + 2e- = Cu(s)").
 * Terms are separated by " + " (spaces around the plus, since "+" also writes charges), sides by
 * "<=>", "⇌" or "=" (also "->", "→"); a term is an optional coefficient (2, 0.5, 1/2) then a formula
 * with an optional phase tag; "e^-", "e⁻" or "e-" is the electron. Parsing checks element and
 * charge balance. The parsed text is returned in the canonical ASCII notation.
 */
import { EXIT, EphmapError, type ExitStatus } from '../errors.js';
import { formulaWarnings, parseFormula, splitPhase, FormulaError, type Phase } from './formula.js';
import { ELECTRON_ASCII, EQUILIBRIUM_ASCII, isElectron } from './reaction-text.js';
import { formulaAscii } from './write.js';

/** What a ReactionError is about: the reaction text, the electron count, or the reference electrode. */
export type ReactionSubject = 'reaction' | 'electrons' | 'reference' | 'activity';

/**
 * A reaction the calculator cannot use (input error, exit status 2); `subject`, `expected` and
 * `got` let a caller name the option at fault.
 */
export class ReactionError extends EphmapError {
  readonly code = 'reaction';
  readonly exitStatus: ExitStatus = EXIT.input;
  readonly expected: string;
  readonly got: string;
  readonly subject: ReactionSubject;
  constructor(reaction: string, expected: string, got: string, subject: ReactionSubject = 'reaction') {
    super(`reaction "${reaction}": expected ${expected}, got ${got}`);
    this.name = 'ReactionError';
    this.expected = expected;
    this.got = got;
    this.subject = subject;
  }
}

export interface Term {
  /** −1 left, +1 right. */
  side: -1 | 1;
  coefficient: number;
  coefficientText: string;
  electron: boolean;
  formula: string;
  phase?: Phase;
  elements: Record<string, number>;
  charge: number;
}

export interface ParsedReaction {
  text: string;
  terms: Term[];
  warnings: string[];
}

const ARROW = /\s*(?:<=>|<->|⇌|⇄|->|→|=)\s*/;
const TERM = /^(\d+(?:\.\d+)?(?:\/\d+(?:\.\d+)?)?)?\s*(\S.*)$/;

function coefficientValue(t: string): number {
  const [a, b] = t.split('/');
  return b === undefined ? Number(a) : Number(a) / Number(b);
}

/**
 * Parses a reaction text (see module comment) and checks element and charge balance.
 * Throws ReactionError on syntax errors and on an unbalanced reaction (naming what is unbalanced).
 */
export function parseReaction(text: string): ParsedReaction {
  const src = text.trim();
  const sides = src.split(ARROW);
  if (sides.length !== 2 || sides.some((s) => s.trim() === '')) {
    throw new ReactionError(src, 'two sides separated by "<=>", "⇌" or "=" (e.g. "Cu^2+ + 2e^- <=> Cu(s)")', JSON.stringify(text));
  }
  const terms: Term[] = [];
  const warnings: string[] = [];
  sides.forEach((sideText, k) => {
    for (const raw of sideText.trim().split(/\s+\+\s+/)) {
      const m = TERM.exec(raw.trim());
      if (!m) throw new ReactionError(src, 'a term: coefficient then formula', JSON.stringify(raw));
      const coefficientText = m[1] ?? '1';
      const coefficient = coefficientValue(coefficientText);
      if (!(coefficient > 0 && Number.isFinite(coefficient))) {
        throw new ReactionError(src, 'a positive coefficient', JSON.stringify(coefficientText));
      }
      const body = m[2]!.trim().replace(/\u2212/g, '-');
      const side = k === 0 ? -1 : 1;
      if (body === 'e' || isElectron(body)) {
        terms.push({ side, coefficient, coefficientText, electron: true, formula: 'e-', elements: {}, charge: -1 });
        continue;
      }
      const { formula, phase } = splitPhase(body);
      let parsed;
      try {
        parsed = parseFormula(formula);
      } catch (e) {
        const hint = /\S\+\S/.test(body) && e instanceof FormulaError ? ' (separate terms with " + ", spaces around the plus)' : '';
        throw new ReactionError(src, `a formula${hint}`, `${JSON.stringify(body)}: ${(e as Error).message}`);
      }
      warnings.push(...formulaWarnings(body));
      terms.push({ side, coefficient, coefficientText, electron: false, formula, phase, elements: parsed.elements, charge: parsed.charge });
    }
  });
  checkBalance(src, terms, warnings);
  return { text: formatReaction(terms), terms, warnings };
}

function checkBalance(src: string, terms: Term[], warnings: string[]): void {
  const left = new Map<string, number>();
  const right = new Map<string, number>();
  let qL = 0;
  let qR = 0;
  for (const t of terms) {
    const into = t.side < 0 ? left : right;
    for (const [el, c] of Object.entries(t.elements)) into.set(el, (into.get(el) ?? 0) + c * t.coefficient);
    if (t.side < 0) qL += t.charge * t.coefficient;
    else qR += t.charge * t.coefficient;
  }
  const fmt = (x: number) => String(Number(x.toPrecision(10)));
  const problems: string[] = [];
  for (const el of new Set([...left.keys(), ...right.keys()])) {
    const a = left.get(el) ?? 0;
    const b = right.get(el) ?? 0;
    if (Math.abs(a - b) > 1e-9) problems.push(`${el} ${fmt(a)} on the left, ${fmt(b)} on the right`);
  }
  if (Math.abs(qL - qR) > 1e-9) {
    const q = (x: number) => (x > 0 ? `+${fmt(x)}` : fmt(x));
    problems.push(`charge ${q(qL)} on the left, ${q(qR)} on the right`);
  }
  if (problems.length > 0) {
    const hint = warnings.length > 0 ? ` (${warnings.join('; ')})` : '';
    throw new ReactionError(src, 'a balanced reaction', `unbalanced ${problems.join('; ')}${hint}`);
  }
}

/** The parsed reaction in the canonical ASCII notation (JSON's form): "Cu^2+ + 2e^- <=> Cu(s)". */
function formatReaction(terms: Term[]): string {
  const side = (s: -1 | 1) =>
    terms
      .filter((t) => t.side === s)
      .map((t) => `${t.coefficientText === '1' ? '' : t.coefficientText}${t.electron ? ELECTRON_ASCII : formulaAscii(t.formula) + (t.phase ? `(${t.phase})` : '')}`)
      .join(' + ');
  return `${side(-1)} ${EQUILIBRIUM_ASCII} ${side(1)}`;
}

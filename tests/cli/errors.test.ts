/**
 * The command line classifies errors by class, never by message text: every typed error carries a
 * code and an exit status (src/errors.ts), and `reportError` prints its message and returns it.
 */
import { describe, expect, it } from 'vitest';
import { reportError } from '../../src/cli/program.js';
import { EXIT, FigureFitError, InputError, OutputError } from '../../src/errors.js';
import { FormulaError, parseFormula } from '../../src/chem/formula.js';
import { ReactionError, parseReaction } from '../../src/chem/reaction-parse.js';
import { LibraryError } from '../../src/data/library.js';
import { readSpec } from '../../src/system/spec.js';
import { figureSettings } from '../../src/figure/options.js';
import { runCli } from '../helpers/cli.js';

function report(e: unknown): { status: number; text: string } {
  let text = '';
  const status = reportError(e, (s) => void (text += s));
  return { status, text };
}

describe('typed errors and exit statuses', () => {
  it('maps each class to its own status, whatever the message says', () => {
    // The message deliberately reads like another class's: only the class decides.
    expect(report(new FigureFitError('--width', 'an internal error happened')).status).toBe(EXIT.input);
    expect(report(new OutputError('out.svg', 'figure too small')).status).toBe(EXIT.output);
    expect(report(new InputError('a.yaml', 'pH', 'a range')).status).toBe(EXIT.input);
    expect(report(new Error('figure too small')).status).toBe(EXIT.internal);
  });

  it('prints the message of a typed error once, and marks anything else as internal', () => {
    const fit = report(new FigureFitError('--width', 'figure 40×30 mm is too small for the plot'));
    expect(fit.text).toBe('ephmap: figure 40×30 mm is too small for the plot\n');
    expect(report(new TypeError('x is undefined')).text).toMatch(/^ephmap: internal error: x is undefined/);
  });

  it('gives formula, reaction and library errors a code and the input status', () => {
    let fe: unknown;
    try {
      parseFormula('Fe((');
    } catch (e) {
      fe = e;
    }
    expect(fe).toBeInstanceOf(FormulaError);
    expect((fe as FormulaError).code).toBe('formula');
    expect(report(fe).status).toBe(EXIT.input);
    let re: unknown;
    try {
      parseReaction('Cu+2 + e- = Cu(s)');
    } catch (e) {
      re = e;
    }
    expect(re).toBeInstanceOf(ReactionError);
    expect((re as ReactionError).code).toBe('reaction');
    expect((re as ReactionError).subject).toBe('reaction');
    expect(report(re).status).toBe(EXIT.input);
    const le = new LibraryError('species/Xx.json', 'species[0].dfG', 'a number');
    expect(le.code).toBe('library');
    expect(report(le).status).toBe(EXIT.input);
  });

  it('names --electrons when the electron count contradicts the half-reaction', async () => {
    const r = await runCli(['cell', 'Cu+2 + 2e- = Cu(s)', '--electrons', '1']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/command line: --electrons:/);
  });

  it('refuses a figure narrower than the 40 mm the renderer needs, naming the key or option', async () => {
    const spec = readSpec({ element: 'Fe', figure: { width: 35 } }, 'narrow.yaml');
    expect(() => figureSettings(spec)).toThrow(InputError);
    expect(() => figureSettings(spec)).toThrow(/narrow\.yaml: figure\.width: expected a length from 40 mm to 1000 mm/);
    const ok = readSpec({ element: 'Fe' }, 'ok.yaml');
    expect(() => figureSettings(ok, { width: '35mm' })).toThrow(/--width: expected a length from 40 mm/);
    expect(figureSettings(ok, { width: '40mm' }).options.width).toBe(40);
  });
});

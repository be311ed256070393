/**
 * ephmap command line: verbs over the pipeline. User mistakes (InputError) print one message and
 * exit 2 without writing anything; anything else is an internal error (exit 1).
 */
import { Command, CommanderError } from 'commander';
import { InputError } from '../system/errors.js';
import { registerCatalog, registerCore } from './core.js';
import { registerDemo } from './demo.js';
import { registerWindow } from './window.js';
import { registerProbe } from './probe.js';
import { registerCell } from './cell.js';
import { registerReport } from './report.js';
import { registerOverlay } from './overlay.js';
import { findAllSpecies, loadLibrary } from '../data/library.js';
import type { SpeciesLookup } from '../report/cell.js';

/** Species for `cell` from the built-in library: by formula and phase (a default phase when none is given). */
const libraryLookup: SpeciesLookup = (formula, phase) => {
  const key = phase ? `${formula}(${phase})` : formula;
  const hits = findAllSpecies(loadLibrary(), key);
  const pref = ['s', 'l', 'aq', 'g'];
  const hit = [...hits].sort((a, b) => pref.indexOf(a.phase) - pref.indexOf(b.phase))[0];
  if (!hit) return undefined;
  return { dfG: hit.dfG, dfH: hit.dfH, S: hit.S, Cp: hit.Cp, elements: hit.elements, charge: hit.charge, phase: hit.phase, source: hit.sourceText };
};

export function makeProgram(): Command {
  const program = new Command();
  program
    .name('ephmap')
    .description('Potential–pH stability diagrams: exact regions, balanced reactions, answers at a point.\nEquilibrium thermodynamics only — not kinetics.')
    .version('0.1.0')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });
  registerCore(program);
  registerProbe(program);
  registerDemo(program);
  registerCatalog(program);
  registerWindow(program);
  registerCell(program, { lookup: libraryLookup });
  registerReport(program);
  registerOverlay(program);
  return program;
}

export async function run(argv: string[]): Promise<number> {
  const program = makeProgram();
  try {
    await program.parseAsync(argv, { from: 'user' });
    return 0;
  } catch (e) {
    if (e instanceof CommanderError) {
      if (e.code === 'commander.helpDisplayed' || e.code === 'commander.version' || e.exitCode === 0) return 0;
      return 2;
    }
    if (e instanceof InputError) {
      process.stderr.write(`ephmap: ${e.message}\n`);
      return 2;
    }
    process.stderr.write(`ephmap: internal error: ${(e as Error)?.message ?? String(e)}\n`);
    if (process.env.EPHMAP_DEBUG) process.stderr.write(`${(e as Error)?.stack}\n`);
    return 1;
  }
}


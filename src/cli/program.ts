/**
 * ephmap command line: verbs over the pipeline. Typed errors (src/errors.ts) print one message and
 * exit with their class's status (input 2, output 3) without writing anything; anything else is an
 * internal error (exit 1).
 */
import { Command, CommanderError } from 'commander';
import { EphmapError, exitStatusOf, type ExitStatus } from '../errors.js';
import { registerCatalog, registerCore } from './core.js';
import { registerDemo } from './demo.js';
import { registerWindow } from './window.js';
import { registerProbe } from './probe.js';
import { registerCell } from './cell.js';
import { registerReport } from './report.js';
import { registerOverlay } from './overlay.js';
import { registerShares } from './shares.js';
import { libraryLookup } from '../system/lookup.js';
import { VERSION } from '../version.js';

export function makeProgram(): Command {
  const program = new Command();
  program
    .name('ephmap')
    .description('Potential–pH stability diagrams: exact regions, balanced reactions, answers at a point.\nEquilibrium thermodynamics only — not kinetics.')
    .version(VERSION)
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
  registerShares(program);
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
    return reportError(e);
  }
}

/**
 * Prints a thrown value and returns the exit status: any EphmapError by its class (its message,
 * its own exit status — input 2, output 3, …); anything else is an internal error (exit 1, stack
 * with EPHMAP_DEBUG set). Never looks at message text.
 */
export function reportError(e: unknown, write: (s: string) => void = (s) => void process.stderr.write(s)): ExitStatus {
  const status = exitStatusOf(e);
  if (e instanceof EphmapError) {
    write(`ephmap: ${e.message}\n`);
    return status;
  }
  write(`ephmap: internal error: ${(e as Error)?.message ?? String(e)}\n`);
  if (process.env.EPHMAP_DEBUG) write(`${(e as Error)?.stack}\n`);
  return status;
}


/**
 * ephmap command line: verbs over the pipeline. User mistakes (InputError) print one message and
 * exit 2 without writing anything; anything else is an internal error (exit 1).
 */
import { Command, CommanderError } from 'commander';
import { InputError } from '../system/errors.js';
import { registerCatalog, registerCore } from './core.js';
import { registerDemo } from './demo.js';

export function makeProgram(): Command {
  const program = new Command();
  program
    .name('ephmap')
    .description('Potential–pH stability diagrams: exact regions, balanced reactions, answers at a point.\nEquilibrium thermodynamics only — not kinetics.')
    .version('0.1.0')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(s) });
  registerCore(program);
  registerDemo(program);
  registerCatalog(program);
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


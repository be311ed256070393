/**
 * Path safety before anything is written: an output must not be any input of the run (compared
 * by device and inode, so a symlink, a hard link, `./x` or `../dir/x` naming an input is caught),
 * and its extension must match what is written. Both refusals are bad input (InputError, exit 2),
 * raised before any output is opened, so nothing is written.
 */
import { statSync } from 'node:fs';
import { extname } from 'node:path';
import { InputError } from '../errors.js';

export interface NamedPath {
  /** The path as the user gave it. */
  path: string;
  /** The option or argument that gave it, e.g. "--output", "--points", "<file>". */
  option: string;
}

/** Device and inode of an existing file (following links), or undefined when it does not exist. */
function identity(path: string): string | undefined {
  try {
    const st = statSync(path);
    return `${st.dev}:${st.ino}`;
  } catch {
    return undefined;
  }
}

/**
 * Throws InputError when an output names the same file as an input (by device and inode after
 * following links), or when two outputs name the same file. Outputs that do not exist yet cannot
 * be an input; inputs that do not exist are left to the reader's own message.
 */
export function refuseInputsAsOutputs(outputs: NamedPath[], inputs: NamedPath[]): void {
  const seen = new Map<string, NamedPath>();
  for (const i of inputs) {
    const id = identity(i.path);
    if (id !== undefined && !seen.has(id)) seen.set(id, i);
  }
  const outs = new Map<string, NamedPath>();
  for (const o of outputs) {
    const id = identity(o.path);
    if (id === undefined) continue;
    const input = seen.get(id);
    if (input) {
      throw new InputError('command line', o.option, `an output file that is not an input of the run`, `${quote(o.path)}, which is the ${input.option} input ${quote(input.path)}`);
    }
    const other = outs.get(id);
    if (other) throw new InputError('command line', o.option, 'a different file for each output', `${quote(o.path)}, the same file as ${other.option}`);
    outs.set(id, o);
  }
}

/**
 * Throws InputError unless `path` ends in one of `extensions` (lower-case, with the dot, e.g.
 * ".csv"); the comparison ignores case. Returns the matched extension.
 */
export function requireExtension(path: string, extensions: readonly string[], option: string): string {
  const ext = extname(path).toLowerCase();
  if (!extensions.includes(ext)) {
    throw new InputError('command line', option, `a file name ending in ${extensions.join(', ')}`, quote(path));
  }
  return ext;
}

/** A path in messages: JSON-quoted and capped at 120 characters. */
function quote(path: string): string {
  const q = JSON.stringify(path);
  return q.length > 120 ? `${q.slice(0, 80)}…${q.slice(-30)}` : q;
}

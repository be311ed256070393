/**
 * Output rules shared by every verb that writes files (draw, probe -o, window -o, report, overlay,
 * demo): checked before any compute, written through the safe writer (src/io/safe-write.ts).
 *
 * Steps of a run that writes:
 *  1. `checkOutputs` before anything is read or computed: the extension of each -o matches what is
 *     written, and no output is (by device and inode, so through a symlink or a hard link too) any
 *     input of the run — both InputError, exit 2;
 *  2. read the inputs and compute (bad input: exit 2, nothing written);
 *  3. `writeOne` / `writeSet`: the directory of each output must exist and be a directory
 *     (OutputError, exit 3, naming the directory — ephmap never creates a directory for -o; `demo
 *     --out` is a folder and is created, see demo.ts); temporary files created exclusively without
 *     following links, fsynced, renamed over the targets (a set: dependents first, the referencing
 *     file last, under the directory's commit lock). Any I/O failure is an OutputError naming the
 *     path (exit 3).
 * Every exit-2 refusal thus comes before any exit-3 one, and neither leaves anything written.
 */
import { requireOutputDirectory } from '../io/output-errors.js';
import { type NamedPath, refuseInputsAsOutputs, requireExtension } from '../io/path-safety.js';
import { commitOutputs, type OutputFile, writeOutput } from '../io/safe-write.js';

/** One output of a run: its path, the option that named it and the extensions it may have. */
export interface PlannedOutput extends NamedPath {
  extensions: readonly string[];
}

/**
 * The checks of step 1 (see the module comment), in order: extensions, then outputs against
 * inputs. Returns the matched extension of each output (lower case, with the dot).
 */
export function checkOutputs(outputs: PlannedOutput[], inputs: NamedPath[]): string[] {
  const exts = outputs.map((o) => requireExtension(o.path, o.extensions, o.option));
  refuseInputsAsOutputs(outputs, inputs);
  return exts;
}

/** OutputError (exit 3) unless the directory that would hold `path` exists and is a directory. */
export const requireDirectory = requireOutputDirectory;

/** Writes one output file safely; never creates directories. */
export async function writeOne(path: string, data: string | Uint8Array): Promise<void> {
  requireDirectory(path);
  await writeOutput(path, data, { makeDirs: false });
}

/** Writes a set of files safely (dependents first, the referencing file last); never creates directories. */
export async function writeSet(files: OutputFile[]): Promise<void> {
  for (const f of files) requireDirectory(f.path);
  await commitOutputs(files, { makeDirs: false });
}

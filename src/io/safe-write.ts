/**
 * Safe output: files are written so that a reader never sees a half-written file, a planted link
 * is never followed, and pre-existing files stay byte-for-byte unchanged unless the whole write
 * succeeds.
 *
 * Steps for one file or a set (`commitOutputs`):
 *  1. refuse a target that is a directory; create missing directories (optional);
 *  2. remove stale temporary files of ours from each output directory (temp-files.ts), and a
 *     commit lock left by a killed run (its pid dead, or older than 30 s);
 *  3. write every file to a fresh temporary file in its own directory, opened with
 *     O_CREAT|O_EXCL|O_NOFOLLOW (exclusive: an existing file or link of that name is an error,
 *     never followed), then fsync and close it;
 *  4. for a set, take the directory's commit lock (`.ephmap-commit.lock`, exclusive create) so
 *     that concurrent runs do not interleave their renames;
 *  5. rename the temporary files over the targets in the order given, then fsync the directories.
 *
 * Guarantee for a set (e.g. a report and the figure it references): list the dependent files
 * first and the file that references them last. A full disk, a bad path or any failure in steps
 * 1–4 leaves every target unchanged; once step 5 starts, each rename is atomic, so at every moment
 * the referencing file is either the old one (beside old or already new dependents) or the new one
 * beside its own new dependents. Concurrent runs commit one after the other, so when they have all
 * finished the set comes from one run. A rename replaces a link at the target by the new file; it
 * never writes through it.
 *
 * Temporary files are removed on any exception, and on SIGINT/SIGTERM/SIGHUP (temp-files.ts);
 * after SIGKILL they stay with a recognisable name and the next run into the directory removes
 * them. Every I/O failure becomes an OutputError (exit status 3) naming the output path.
 */
import { constants, lstatSync, mkdirSync } from 'node:fs';
import { lstat, open, readFile, rename, rm, unlink } from 'node:fs/promises';
import { basename, dirname, join, resolve } from 'node:path';
import { OutputError } from '../errors.js';
import { errnoCode, toOutputError } from './output-errors.js';
import { pidAlive, registerTemp, sweepStaleTemps, tempName, unregisterTemp } from './temp-files.js';

export interface OutputFile {
  path: string;
  data: string | Uint8Array;
}

export interface CommitOptions {
  /** Create missing directories on the way to each output (default true). */
  makeDirs?: boolean;
  /** Called after every temporary file is written and synced, before the lock and the renames (tests). */
  beforeRename?: () => void | Promise<void>;
  /** Called after each rename but the last (tests: widens the window a concurrent run could use). */
  betweenRenames?: () => void | Promise<void>;
  /** Longest wait for another run's commit lock, ms (default 10 000). */
  lockWaitMs?: number;
  /** Source of temporary names (default tempName(): random); tests plant links at a known name. */
  tempName?: () => string;
}

/** O_NOFOLLOW where the platform has it (not on Windows). */
const NOFOLLOW = constants.O_NOFOLLOW ?? 0;
/** Flags of every temporary file: exclusive create, never through a link (also streamed outputs). */
export const TEMP_FLAGS = constants.O_WRONLY | constants.O_CREAT | constants.O_EXCL | NOFOLLOW;
export const LOCK_NAME = '.ephmap-commit.lock';
/** A lock older than this (ms) is taken to be left by a killed run. */
const LOCK_STALE_MS = 30_000;

/** Writes one file safely (see the module comment). */
export async function writeOutput(path: string, data: string | Uint8Array, options: CommitOptions = {}): Promise<void> {
  await commitOutputs([{ path, data }], options);
}

/** Writes a set of files safely, dependents first and the referencing file last. */
export async function commitOutputs(files: OutputFile[], options: CommitOptions = {}): Promise<void> {
  const seen = new Set<string>();
  for (const f of files) {
    const abs = resolve(f.path);
    if (seen.has(abs)) throw new OutputError(f.path, 'the same file is named twice among the outputs');
    seen.add(abs);
  }
  // Step 1: targets and their directories.
  for (const f of files) prepareTarget(f.path, options.makeDirs ?? true);
  // Step 2: stale temps and a stale commit lock of ours (left by a killed run).
  for (const dir of new Set(files.map((f) => dirname(resolve(f.path))))) {
    sweepStaleTemps(dir);
    const lock = join(dir, LOCK_NAME);
    if (await lockIsStale(lock)) await unlink(lock).catch(() => undefined);
  }
  const temps: { tmp: string; path: string }[] = [];
  let lock: string | undefined;
  try {
    // Step 3: every temp written and synced.
    for (const f of files) {
      const tmp = join(dirname(resolve(f.path)), (options.tempName ?? tempName)());
      // only a file we created ourselves is ever removed (never a planted one at that name)
      await writeTemp(tmp, f.path, f.data, () => temps.push({ tmp, path: f.path }));
    }
    await options.beforeRename?.();
    // Step 4: the commit lock for a set.
    if (files.length > 1) lock = await takeLock(dirname(resolve(files[files.length - 1]!.path)), files[files.length - 1]!.path, options.lockWaitMs ?? 10_000);
    // Step 5: renames in order, then the directories synced.
    while (temps.length > 0) {
      const t = temps[0]!;
      try {
        await rename(t.tmp, t.path);
      } catch (e) {
        throw toOutputError(t.path, e);
      }
      unregisterTemp(t.tmp);
      temps.shift();
      if (temps.length > 0) await options.betweenRenames?.();
    }
    for (const dir of new Set(files.map((f) => dirname(resolve(f.path))))) await syncDir(dir);
  } finally {
    for (const t of temps) {
      await rm(t.tmp, { force: true }).catch(() => undefined);
      unregisterTemp(t.tmp);
    }
    if (lock !== undefined) {
      await unlink(lock).catch(() => undefined);
      unregisterTemp(lock);
    }
  }
}

/**
 * Creates an output directory (and its parents) for a verb that writes several files into one
 * (e.g. a demo folder); a file in the way, permissions, a read-only disk become OutputError.
 */
export function makeOutputDir(dir: string): void {
  try {
    mkdirSync(dir, { recursive: true });
    if (!lstatSync(dir).isDirectory()) throw new OutputError(dir, 'it is not a directory');
  } catch (e) {
    throw toOutputError(dir, e);
  }
}

/** Refuses a directory as the target; creates missing parent directories when asked. */
function prepareTarget(path: string, makeDirs: boolean): void {
  try {
    if (makeDirs) mkdirSync(dirname(resolve(path)), { recursive: true });
    const st = lstatSync(path, { throwIfNoEntry: false });
    if (st?.isDirectory()) throw new OutputError(path, 'it is a directory, not a file');
  } catch (e) {
    throw toOutputError(path, e);
  }
}

/** Creates `tmp` exclusively (never following a link), writes, fsyncs and closes it. */
async function writeTemp(tmp: string, target: string, data: string | Uint8Array, created: () => void): Promise<void> {
  let fh;
  // Registered before the open: the file exists on disk as soon as the system call returns, before
  // this function resumes, and a signal in between must still remove it. A signal while the open
  // is pending removes the name if it exists — with a random 64-bit name, only our own file can be
  // there (an exclusive create never opens anything planted).
  registerTemp(tmp);
  try {
    fh = await open(tmp, TEMP_FLAGS, 0o666);
  } catch (e) {
    unregisterTemp(tmp);
    // With a random name this only happens when something was planted there: never follow it.
    if (errnoCode(e) === 'EEXIST' || errnoCode(e) === 'ELOOP') {
      throw new OutputError(target, `something already exists at the temporary name ${basename(tmp)} (not followed, not removed)`, { cause: e });
    }
    throw toOutputError(target, e);
  }
  created();
  try {
    await fh.writeFile(data);
    await fh.sync();
  } catch (e) {
    throw toOutputError(target, e);
  } finally {
    await fh.close().catch(() => undefined);
  }
}

/** fsync of a directory so that the renames survive a crash (best effort: not every system allows it). */
async function syncDir(dir: string): Promise<void> {
  try {
    const fh = await open(dir, constants.O_RDONLY);
    try {
      await fh.sync();
    } finally {
      await fh.close();
    }
  } catch {
    // some file systems refuse fsync on a directory; the renames are done all the same
  }
}

/**
 * Takes the commit lock of `dir` (exclusive create of LOCK_NAME holding our pid); waits for
 * another run's lock, removing it when its run is dead or it is older than LOCK_STALE_MS.
 */
async function takeLock(dir: string, target: string, waitMs: number): Promise<string> {
  const lock = join(dir, LOCK_NAME);
  const start = Date.now();
  for (;;) {
    try {
      const fh = await open(lock, TEMP_FLAGS, 0o644);
      registerTemp(lock);
      await fh.writeFile(String(process.pid)).finally(() => fh.close());
      return lock;
    } catch (e) {
      if (errnoCode(e) !== 'EEXIST') throw toOutputError(target, e);
    }
    if (await lockIsStale(lock)) {
      await unlink(lock).catch(() => undefined);
      continue;
    }
    if (Date.now() - start > waitMs) {
      throw new OutputError(target, `another run holds the commit lock ${lock} (remove it if no ephmap is running)`);
    }
    await new Promise((r) => setTimeout(r, 5 + Math.floor(Math.random() * 15)));
  }
}

/** A lock is stale when it is a regular file whose pid is dead, or older than LOCK_STALE_MS. */
async function lockIsStale(lock: string): Promise<boolean> {
  try {
    const st = await lstat(lock);
    if (!st.isFile()) return false;
    if (Date.now() - st.mtimeMs > LOCK_STALE_MS) return true;
    const pid = Number((await readFile(lock, 'utf8')).trim());
    return Number.isInteger(pid) && pid > 0 && pid !== process.pid && !pidAlive(pid);
  } catch {
    return false;
  }
}

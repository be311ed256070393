/**
 * Temporary files of ours: their names, the registry of the ones this process has open (removed
 * on exceptions, on SIGINT/SIGTERM/SIGHUP and on exit), and the sweep of stale ones left by a
 * killed run (SIGKILL cannot be caught).
 *
 * Name pattern: `.ephmap-<pid>-<16 hex digits>.tmp` in the output's own directory. The random part
 * (64 bits from the system's random source) makes the name unpredictable, so a planted file or
 * link cannot be guessed; the pid lets a later run tell whether the writer is still alive.
 */
import { randomBytes } from 'node:crypto';
import { lstatSync, readdirSync, rmSync, unlinkSync } from 'node:fs';
import { join } from 'node:path';

export const TEMP_PATTERN = /^\.ephmap-(\d{1,10})-([0-9a-f]{16})\.tmp$/;

/** A fresh temporary name (no directory) for this process. */
export function tempName(): string {
  return `.ephmap-${process.pid}-${randomBytes(8).toString('hex')}.tmp`;
}

// ---- registry and signal clean-up ----------------------------------------------------------

const live = new Set<string>();
const SIGNALS: NodeJS.Signals[] = ['SIGINT', 'SIGTERM', 'SIGHUP'];
let installed = false;

/** Removes every registered temporary file now (synchronously; errors ignored). */
export function removeAllTemps(): void {
  for (const p of live) {
    try {
      unlinkSync(p);
    } catch {
      // already gone (renamed or removed): nothing to do
    }
  }
  live.clear();
}

function onSignal(sig: NodeJS.Signals): void {
  removeAllTemps();
  // Step 1: take our handlers off; step 2: if nobody else handles the signal, die of it as the
  // default action would (exit status 128 + n seen by the parent).
  for (const s of SIGNALS) process.removeListener(s, onSignal);
  process.removeListener('exit', removeAllTemps);
  installed = false;
  if (process.listenerCount(sig) === 0) process.kill(process.pid, sig);
}

function install(): void {
  if (installed) return;
  installed = true;
  for (const s of SIGNALS) process.on(s, onSignal);
  process.on('exit', removeAllTemps);
}

/** Registers a temporary file for removal on signals and exit. */
export function registerTemp(path: string): void {
  install();
  live.add(path);
}

/** Forgets a temporary file (renamed into place or removed). */
export function unregisterTemp(path: string): void {
  live.delete(path);
}

/** The temporary files this process has registered (for tests). */
export function liveTemps(): string[] {
  return [...live];
}

// ---- stale temporary files -----------------------------------------------------------------

/** A temp file whose writer is dead is stale after this long (ms); any is stale after a day. */
export const STALE_DEAD_MS = 60_000;
export const STALE_ANY_MS = 24 * 3600_000;

/** True when a process with this id exists (EPERM: it exists but is someone else's). */
export function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes stale temporary files of ours from `dir`; returns the names removed. A file is removed
 * only when all hold: its name matches TEMP_PATTERN, it is a regular file (never a link or a
 * directory), it belongs to this user, and either its writer's pid is dead and it is older than
 * STALE_DEAD_MS or it is older than STALE_ANY_MS. Anything else — someone else's file, a live
 * writer's temp — is left alone. Failures (unreadable directory) are ignored: the sweep is a tidy-up.
 */
export function sweepStaleTemps(dir: string, now: number = Date.now()): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return [];
  }
  const uid = typeof process.getuid === 'function' ? process.getuid() : undefined;
  const removed: string[] = [];
  for (const name of names) {
    const m = TEMP_PATTERN.exec(name);
    if (!m) continue;
    const pid = Number(m[1]);
    const p = join(dir, name);
    try {
      const st = lstatSync(p);
      if (!st.isFile()) continue;
      if (uid !== undefined && st.uid !== uid) continue;
      if (live.has(p)) continue;
      const age = now - st.mtimeMs;
      const stale = age > STALE_ANY_MS || (pid !== process.pid && !pidAlive(pid) && age > STALE_DEAD_MS);
      if (!stale) continue;
      rmSync(p, { force: true });
      removed.push(name);
    } catch {
      // vanished meanwhile or not removable: leave it
    }
  }
  return removed;
}

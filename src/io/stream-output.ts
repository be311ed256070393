/**
 * Streamed output (a result written while its input is still being read): to standard output, or
 * to a file by the rules of safe-write.ts — a fresh temporary file of ours in the target's own
 * directory, created exclusively without following links, written as rows come, then synced and
 * renamed over the target only when the whole run succeeded (`commit`). On failure (`abort`, an
 * exception, SIGINT/SIGTERM) the temporary file is removed and any existing target is unchanged.
 * Writes wait for the stream to drain, so memory stays bounded however long the output.
 */
import { lstatSync } from 'node:fs';
import { open, rename, rm, type FileHandle } from 'node:fs/promises';
import { dirname, join, resolve } from 'node:path';
import { OutputError } from '../errors.js';
import { requireOutputDirectory, toOutputError } from './output-errors.js';
import { TEMP_FLAGS } from './safe-write.js';
import { registerTemp, sweepStaleTemps, tempName, unregisterTemp } from './temp-files.js';

export interface OutputSink {
  /** Text, or bytes (UTF-8) that the caller may reuse once the promise is settled. */
  write(text: string | Uint8Array): Promise<void>;
  /** Everything written: make it visible (a file: sync and rename over the target). */
  commit(): Promise<void>;
  /** Failure: drop what was written (a file: remove the temporary; the target is unchanged). */
  abort(): Promise<void>;
}

/** Standard output, waiting for 'drain' when the reader is slower than we are. */
export function stdoutSink(out: NodeJS.WritableStream = process.stdout): OutputSink {
  return {
    // Bytes are copied: the stream may hold a chunk after write() returns, the caller reuses its.
    write: (text) => (out.write(typeof text === 'string' ? text : Buffer.from(text)) ? Promise.resolve() : new Promise<void>((r) => out.once('drain', () => r()))),
    commit: async () => undefined,
    abort: async () => undefined,
  };
}

/**
 * A file written through a temporary of ours and renamed at `commit` (see the module comment).
 * Nothing is touched before the first write (or the commit of an empty output): the target's
 * directory is checked and the temporary created then, so that an input error found first (a bad
 * header) wins over an output error, and a failed run before any output leaves no trace.
 */
export async function fileSink(path: string): Promise<OutputSink> {
  let opened: Promise<{ fh: FileHandle; tmp: string }> | undefined;
  let state: { fh: FileHandle; tmp: string } | undefined;
  let closed = false;
  const ensure = () => (opened ??= openTemp(path).then((x) => (state = x)));
  const drop = async (): Promise<void> => {
    if (opened) await opened.catch(() => undefined);
    if (!state) return;
    if (!closed) await state.fh.close().catch(() => undefined);
    closed = true;
    await rm(state.tmp, { force: true }).catch(() => undefined);
    unregisterTemp(state.tmp);
  };
  return {
    async write(text) {
      const { fh } = await ensure();
      try {
        if (typeof text === 'string') await fh.write(text);
        else for (let at = 0; at < text.length; ) at += (await fh.write(text, at, text.length - at)).bytesWritten;
      } catch (e) {
        await drop();
        throw toOutputError(path, e);
      }
    },
    async commit() {
      const { fh, tmp } = await ensure();
      try {
        await fh.sync();
        await fh.close();
        closed = true;
        await rename(tmp, path);
        unregisterTemp(tmp);
      } catch (e) {
        await drop();
        throw toOutputError(path, e);
      }
    },
    abort: drop,
  };
}

/** The checks on the target and its exclusive temporary beside it (fileSink, at the first write). */
async function openTemp(path: string): Promise<{ fh: FileHandle; tmp: string }> {
  const dir = dirname(resolve(path));
  try {
    // Never a directory made for an output: a missing one is refused (exit 3), as by every -o.
    requireOutputDirectory(path);
    if (lstatSync(path, { throwIfNoEntry: false })?.isDirectory()) throw new OutputError(path, 'it is a directory, not a file');
  } catch (e) {
    throw toOutputError(path, e);
  }
  sweepStaleTemps(dir);
  const tmp = join(dir, tempName());
  let fh: FileHandle;
  try {
    fh = await open(tmp, TEMP_FLAGS, 0o666);
  } catch (e) {
    throw toOutputError(path, e);
  }
  registerTemp(tmp);
  return { fh, tmp };
}

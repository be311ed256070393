/**
 * Translation of the operating system's I/O failures into `OutputError` (exit status 3): a plain
 * message naming the output path and the cause, with the system error kept as `cause` for logs.
 * Classification is by the error's `code` (EISDIR, ENOSPC, ...), never by its message text.
 */
import { statSync } from 'node:fs';
import { dirname } from 'node:path';
import { OutputError } from '../errors.js';

/** Plain-words cause for each system error code an output can meet. */
const CAUSES: Record<string, string> = {
  EISDIR: 'it is a directory, not a file',
  ENOTDIR: 'a part of the path is a file, not a directory',
  EACCES: 'permission denied',
  EPERM: 'the operation is not permitted',
  EROFS: 'the file system is read-only',
  ENAMETOOLONG: 'the name is too long for the file system',
  ENOSPC: 'no space left on the device',
  EDQUOT: 'the disk quota is exceeded',
  EEXIST: 'a file is in the way where a directory is needed',
  ENOENT: 'a directory on the way does not exist',
  ELOOP: 'too many symbolic links on the way',
  EMFILE: 'too many open files',
  ENFILE: 'too many open files in the system',
  EIO: 'an input/output error on the device',
  EFBIG: 'the file is too large for the file system',
  EBUSY: 'the file or directory is busy',
  ETXTBSY: 'the file is busy',
  EXDEV: 'the temporary file and the output are on different devices',
};

/** The system error code of a thrown value, or undefined. */
export function errnoCode(e: unknown): string | undefined {
  const code = (e as NodeJS.ErrnoException | null)?.code;
  return typeof code === 'string' ? code : undefined;
}

/** The plain-words cause for a system error code (a generic phrase naming the code if unknown). */
export function causeOf(code: string | undefined): string {
  if (code === undefined) return 'the system could not write it';
  return CAUSES[code] ?? `the system reported ${code}`;
}

/**
 * An OutputError for `path` from a failed file-system call. Errors that are already ephmap errors
 * (OutputError or other EphmapError) pass through unchanged; anything without a system error code
 * is re-thrown as is (it is a defect, not an I/O failure).
 */
export function toOutputError(path: string, e: unknown): Error {
  if (e instanceof OutputError) return e;
  const code = errnoCode(e);
  if (code === undefined) return e instanceof Error ? e : new Error(String(e));
  return new OutputError(path, causeOf(code), { cause: e });
}

/**
 * OutputError (exit 3) unless the directory that would hold `path` exists and is a directory:
 * ephmap never creates a directory for an output (only `demo --out`, through makeOutputDir).
 */
export function requireOutputDirectory(path: string): void {
  const dir = dirname(path);
  let isDir: boolean;
  try {
    isDir = statSync(dir).isDirectory();
  } catch (e) {
    const code = errnoCode(e);
    if (code === 'ENOENT') throw new OutputError(path, `the directory ${dir} does not exist (create it first: ephmap does not create directories)`, { cause: e });
    throw new OutputError(path, causeOf(code), { cause: e });
  }
  if (!isDir) throw new OutputError(path, causeOf('ENOTDIR'));
}

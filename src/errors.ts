/**
 * Typed errors shared by every layer. Each class carries a stable `code` and the process exit
 * status the command line uses for it; callers classify errors by class (or `code`), never by
 * message text. This module imports nothing, so any layer may throw these.
 *
 * Exit statuses (documented in the README):
 *   0  success
 *   1  internal error (a defect in ephmap: please report it)
 *   2  the input cannot be used: a system file, a species file, an option, or a figure request
 *      that cannot fit — nothing is written
 *   3  an output could not be written (the path, a directory on the way, permissions, disk space)
 *      — nothing is left half-written, pre-existing files are unchanged
 *   4  a row-by-row run finished, but some rows could not be answered (each row says why)
 */

export const EXIT = {
  ok: 0,
  internal: 1,
  input: 2,
  output: 3,
  partial: 4,
} as const;

export type ExitStatus = (typeof EXIT)[keyof typeof EXIT];

/**
 * Text echoed from the user into a message, capped: at most `max` characters, the rest replaced
 * by "…" (so a 200 000-character key gives a one-line message, not a 200 KB one).
 */
export function capText(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max)}…` : text;
}

/** Base class: every error ephmap raises on purpose. */
export abstract class EphmapError extends Error {
  abstract readonly code: string;
  abstract readonly exitStatus: ExitStatus;
}

/**
 * Bad user input: names the file (or "command line"), the field or option, and what is expected.
 * Exit status 2.
 */
export class InputError extends EphmapError {
  readonly code: string = 'input';
  readonly exitStatus: ExitStatus = EXIT.input;
  readonly file: string;
  readonly field: string;
  readonly expected: string;
  /** What was found instead, as given (the message caps its length). */
  readonly got: string | undefined;

  constructor(file: string, field: string, expected: string, got?: string) {
    const where = field ? `${capText(file, 200)}: ${capText(field, 100)}` : capText(file, 200);
    super(`${where}: expected ${expected}${got !== undefined ? `, got ${capText(got, 120)}` : ''}`);
    this.name = 'InputError';
    this.file = file;
    this.field = field;
    this.expected = expected;
    this.got = got;
  }
}

/**
 * A figure request that cannot be laid out (too narrow, too short for the plot, legend and
 * caption even after every fallback). Names the option to change. Exit status 2.
 */
export class FigureFitError extends EphmapError {
  readonly code = 'figure-fit';
  readonly exitStatus: ExitStatus = EXIT.input;
  /** The option (or file key) the user should change, e.g. "--width". */
  readonly option: string;
  constructor(option: string, message: string) {
    super(message);
    this.name = 'FigureFitError';
    this.option = option;
  }
}

/**
 * An output could not be written: names the output path and the cause in plain words (the
 * system's error code is kept in `cause` for logs). Exit status 3.
 */
export class OutputError extends EphmapError {
  readonly code = 'output';
  readonly exitStatus: ExitStatus = EXIT.output;
  readonly path: string;
  readonly reason: string;
  constructor(path: string, reason: string, options?: { cause?: unknown }) {
    super(`cannot write ${path}: ${reason}`, options);
    this.name = 'OutputError';
    this.path = path;
    this.reason = reason;
  }
}

/**
 * The output was written but holds answers that could not be determined (e.g. the composition
 * point solver failed at a probed point: `status: failed`, verdict unknown). Raised after the
 * output, so that scripts see exit status 4 and the message on stderr. Exit status 4.
 */
export class UndeterminedError extends EphmapError {
  readonly code = 'undetermined';
  readonly exitStatus: ExitStatus = EXIT.partial;
  constructor(message: string) {
    super(message);
    this.name = 'UndeterminedError';
  }
}

/**
 * A row-by-row run finished and wrote every row, but some rows could not be answered (each row's
 * own error column says why). Exit status 4.
 */
export class PartialError extends EphmapError {
  readonly code = 'partial';
  readonly exitStatus: ExitStatus = EXIT.partial;
  constructor(message: string) {
    super(message);
    this.name = 'PartialError';
  }
}

/** The exit status for any thrown value: the class's own status, else internal (1). */
export function exitStatusOf(e: unknown): ExitStatus {
  return e instanceof EphmapError ? e.exitStatus : EXIT.internal;
}

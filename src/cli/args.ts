/** Command-line argument checks that raise InputError (exit 2) with the option named. */
import { InputError } from '../system/errors.js';
import { NUMBER_TEXT } from '../system/fields.js';

/**
 * A number typed on the command line: strict decimal syntax (so "", " ", "0x7", "Infinity" and
 * "1e999", which Number() would read as 0, 7 or an infinity, are refused), within [min, max] when
 * given. `what` is the expectation printed in the message (state the range there).
 */
export function numberArg(v: string, option: string, what: string, range: { min?: number; max?: number } = {}): number {
  const x = Number(v);
  const ok = NUMBER_TEXT.test(v) && Number.isFinite(x) && (range.min === undefined || x >= range.min) && (range.max === undefined || x <= range.max);
  if (!ok) throw new InputError('command line', option, what, JSON.stringify(v));
  return x;
}

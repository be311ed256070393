/** Command-line argument checks that raise InputError (exit 2) with the option named. */
import { InputError } from '../system/errors.js';

export function numberArg(v: string, option: string, what: string): number {
  const x = Number(v);
  if (v.trim() === '' || !Number.isFinite(x)) throw new InputError('command line', option, what, JSON.stringify(v));
  return x;
}

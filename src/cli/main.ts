#!/usr/bin/env node
/** The `ephmap` executable. */
import { run } from './program.js';

run(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});

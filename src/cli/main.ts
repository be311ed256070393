#!/usr/bin/env node
/** The `ephmap` executable. */
import { run } from './program.js';

// A closed pipe (e.g. `ephmap catalog | head`) ends output quietly.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(process.exitCode ?? 0);
    throw e;
  });
}

run(process.argv.slice(2)).then((code) => {
  process.exitCode = code;
});

// Writes src/version.ts from package.json's "version": the one source of the version string (the
// CLI's --version, the model's `ephmap` key and the package). Run by build/prepare before tsc.
import { readFileSync, writeFileSync } from 'node:fs';

const { version } = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8'));
const text = `/** ephmap's version, generated from package.json by scripts/version.mjs (do not edit). */\nexport const VERSION = '${version}';\n`;
const path = new URL('../src/version.ts', import.meta.url);
let old = '';
try {
  old = readFileSync(path, 'utf8');
} catch {
  // first run
}
if (old !== text) writeFileSync(path, text);

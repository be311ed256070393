/**
 * Temporary folders for tests, under the OS temp folder, removed when the test file finishes: the
 * afterAll hook is registered when a test file imports this module (modules are isolated per file).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll } from 'vitest';

const created: string[] = [];

afterAll(() => {
  for (const d of created.splice(0)) rmSync(d, { recursive: true, force: true });
});

/** A new empty folder `<tmp>/<prefix>XXXXXX`, removed after the current test file. */
export function cleanTmpDir(prefix = 'ephmap-test-'): string {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  created.push(dir);
  return dir;
}

/** A new empty folder `<tmp>/ephmap-test-XXXXXX`, removed after the current test file. */
export function tmpDir(): string {
  return cleanTmpDir('ephmap-test-');
}

export function writeTmp(dir: string, name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export function tmpDir(): string {
  return mkdtempSync(join(tmpdir(), 'ephmap-test-'));
}

export function writeTmp(dir: string, name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

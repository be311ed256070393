/**
 * The installed command (the bundled dist/cli/ephmap.mjs that `npm ci` builds) runs end to end.
 * Skipped with a message where the package has not been built (a source-only checkout).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const bin = join(__dirname, '..', '..', 'dist', 'cli', 'ephmap.mjs');
const built = existsSync(bin);
if (!built) console.warn(`skipping bundle tests: ${bin} not built (run npm run build)`);

describe.skipIf(!built)('bundled command', () => {
  it('draws an SVG and refuses bad input with exit 2', () => {
    const dir = mkdtempSync(join(tmpdir(), 'ephmap-bin-'));
    const f = join(dir, 'fe.yaml');
    writeFileSync(f, 'element: Fe\n');
    execFileSync(process.execPath, [bin, 'draw', f, '-o', join(dir, 'fe.svg')]);
    expect(readFileSync(join(dir, 'fe.svg'), 'utf8')).toMatch(/^<svg|<\?xml/);
    writeFileSync(f, 'element: Fe\ncolour: red\n');
    const r = spawnSync(process.execPath, [bin, 'draw', f, '-o', join(dir, 'bad.svg')], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/colour/);
    expect(existsSync(join(dir, 'bad.svg'))).toBe(false);
  });
});

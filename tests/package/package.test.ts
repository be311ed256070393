/**
 * The package as a user gets it, built by this test (never a stale dist/): `npm pack` (which builds
 * dist/ through `prepare`: version, tsc, bundle), then (1) the bundled command dist/cli/ephmap.mjs
 * runs end to end, and (2) the tarball
 * unpacked into a fresh project's node_modules/ephmap, and `import … from 'ephmap'` computing the
 * iron–water diagram. Offline: the project's dependencies are links to this checkout's installed
 * node_modules (what `npm ci` put there), so no registry is asked.
 *
 * Iron–water at 25 °C, dissolved iron 10⁻⁶: fields of Fe(s), Fe²⁺, Fe₂O₃ (hematite) and Fe₃O₄
 * (magnetite) at least — common practice (the classic corrosion diagram of iron).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { VERSION } from '../../src/version.js';
import { cleanTmpDir } from '../helpers/tmp.js';

const root = resolve(__dirname, '..', '..');
const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';

interface Packed {
  filename: string;
  files: { path: string }[];
}

describe('the packed package', () => {
  let dir = '';
  let packed: Packed;

  // Step 1: pack (runs `prepare`), so both tests check what was just built. Tests in one file run in order.
  beforeAll(() => {
    dir = cleanTmpDir('ephmap-pack-');
    packed = (JSON.parse(execFileSync(npm, ['pack', '--json', '--pack-destination', dir], { cwd: root, encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] })) as Packed[])[0];
  }, 180_000);

  it('the bundled command draws an SVG and refuses bad input with exit 2', () => {
    const bin = join(root, 'dist', 'cli', 'ephmap.mjs');
    const f = join(dir, 'fe.yaml');
    writeFileSync(f, 'element: Fe\n');
    execFileSync(process.execPath, [bin, 'draw', f, '-o', join(dir, 'fe.svg')]);
    expect(readFileSync(join(dir, 'fe.svg'), 'utf8')).toMatch(/^<svg|<\?xml/);
    writeFileSync(f, 'element: Fe\ncolour: red\n');
    const r = spawnSync(process.execPath, [bin, 'draw', f, '-o', join(dir, 'bad.svg')], { encoding: 'utf8' });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/colour/);
    expect(existsSync(join(dir, 'bad.svg'))).toBe(false);
    expect(spawnSync(process.execPath, [bin, '--version'], { encoding: 'utf8' }).stdout.trim()).toBe(VERSION);
  });

  it('installs from its tarball and computes an iron diagram through the public API', () => {
    const files = packed.files.map((f) => f.path);
    expect(files).toContain('dist/index.js');
    expect(files).toContain('dist/index.d.ts');
    expect(files).toContain('dist/cli/ephmap.mjs');
    expect(files.some((f) => f.startsWith('species/'))).toBe(true);
    // Step 2: a fresh project; dependencies linked from this checkout; the tarball unpacked as ephmap.
    const proj = join(dir, 'project');
    const modules = join(proj, 'node_modules');
    mkdirSync(modules, { recursive: true });
    for (const name of readdirSync(join(root, 'node_modules'))) {
      if (name === 'ephmap' || name.startsWith('.')) continue;
      symlinkSync(join(root, 'node_modules', name), join(modules, name), 'junction');
    }
    mkdirSync(join(modules, 'ephmap'));
    execFileSync('tar', ['-xzf', join(dir, packed.filename), '-C', join(modules, 'ephmap'), '--strip-components=1']);
    writeFileSync(join(proj, 'package.json'), JSON.stringify({ name: 'uses-ephmap', version: '1.0.0', private: true, type: 'module' }));
    // Step 3: import the package by name (its `exports`), compute, probe and render.
    writeFileSync(
      join(proj, 'use.mjs'),
      [
        "import { readSpec, compute, probe, renderDiagram, lineRows, VERSION } from 'ephmap';",
        "const c = compute(readSpec({ element: 'Fe', activity: 1e-6 }, 'iron'));",
        'const p = probe(c, 7, -0.8);',
        "const svg = await renderDiagram(c, 'svg');",
        'console.log(JSON.stringify({ version: VERSION, species: c.model.regions.map((r) => r.species), verdict: p.verdict, lines: lineRows(c.model).length, svg: svg.slice(0, 5) }));',
      ].join('\n'),
    );
    const out = JSON.parse(execFileSync(process.execPath, ['use.mjs'], { cwd: proj, encoding: 'utf8' })) as { version: string; species: string[]; verdict: string; lines: number; svg: string };
    expect(out.version).toBe(VERSION);
    expect(out.species).toEqual(expect.arrayContaining(['Fe', 'Fe^2+', 'Fe2O3', 'Fe3O4']));
    // pH 7, −0.8 V vs SHE lies below the Fe²⁺/Fe line (about −0.62 V at 10⁻⁶): immunity.
    expect(out.verdict).toBe('immunity');
    expect(out.lines).toBeGreaterThan(3);
    expect(out.svg).toBe('<svg ');
  }, 180_000);
});

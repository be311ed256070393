/**
 * The import direction of src/ (DEVELOPERS.md, "Architecture"): a module imports only from its own
 * layer or the layers below it, never upward.
 *
 *   4  cli, gallery, bench, index.ts (the public API)
 *   3  report, figure, render           (presentation: text, documents, figures)
 *   2  analysis, pipeline.ts            (answers from a computed diagram)
 *   1  diagram, solve, system           (the model, the solver, system files)
 *   0  thermo, chem, data, io, errors.ts, model.ts, version.ts
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const SRC = resolve(__dirname, '..', '..', 'src');

const LAYER: Record<string, number> = {
  cli: 4, gallery: 4, bench: 4, 'index.ts': 4,
  report: 3, figure: 3, render: 3,
  analysis: 2, 'pipeline.ts': 2,
  diagram: 1, solve: 1, system: 1,
  thermo: 0, chem: 0, data: 0, io: 0, 'errors.ts': 0, 'model.ts': 0, 'version.ts': 0,
};

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

/** Layer of a file under src/: by its top folder (or its own name at the top). */
function layerOf(file: string): number | undefined {
  return LAYER[relative(SRC, file).split(/[\\/]/)[0]];
}

/** Relative imports of a module: static imports, re-exports and dynamic import() calls. */
function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  const out: string[] = [];
  for (const m of text.matchAll(/(?:\bfrom\s*|\bimport\s*\(\s*|^import\s+)['"](\.{1,2}\/[^'"]+)['"]/gm)) out.push(m[1]);
  return out.map((spec) => resolve(dirname(file), spec.replace(/\.js$/, '.ts')));
}

/** Upward edges among [importer, imported] pairs of absolute paths under src/. */
function upward(edges: [string, string][]): string[] {
  return edges.filter(([f, t]) => (layerOf(t) ?? -1) > layerOf(f)!).map(([f, t]) => `${relative(SRC, f)} → ${relative(SRC, t)}`);
}

describe('import direction', () => {
  const all = files(SRC);

  it('every module of src/ belongs to a layer', () => {
    expect(all.filter((f) => layerOf(f) === undefined).map((f) => relative(SRC, f))).toEqual([]);
  });

  it('finds the imports it checks (the scan itself works)', () => {
    const cli = importsOf(join(SRC, 'cli', 'probe.ts')).map((f) => relative(SRC, f));
    expect(cli).toContain(join('analysis', 'probe.ts'));
    const lazy = importsOf(join(SRC, 'figure', 'output.ts')).map((f) => relative(SRC, f));
    expect(lazy).toContain(join('render', 'html.ts')); // a dynamic import()
  });

  it('no module imports from a higher layer', () => {
    expect(upward(all.flatMap((f) => importsOf(f).map((t): [string, string] => [f, t])))).toEqual([]);
  });

  it('catches an upward import (the rule can fail)', () => {
    const edge: [string, string] = [join(SRC, 'solve', 'x.ts'), join(SRC, 'report', 'y.ts')];
    expect(upward([edge])).toEqual([`${join('solve', 'x.ts')} → ${join('report', 'y.ts')}`]);
    expect(upward([[join(SRC, 'cli', 'x.ts'), join(SRC, 'thermo', 'y.ts')]])).toEqual([]);
  });
});

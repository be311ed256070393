/**
 * Property-based checks of the system loader: whatever the parsed data, text or mutation of a
 * valid document, `parseSystemText` → `readSpec` → `buildSystem` either succeeds or throws an
 * InputError naming the file and saying what is expected — never another exception. When the build
 * succeeds, the solver must run on the result without throwing.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { stringify } from 'yaml';
import { solve } from '../../src/solve/solve.js';
import { buildSystem } from '../../src/system/build.js';
import { InputError } from '../../src/system/errors.js';
import { parseSystemText } from '../../src/system/read.js';
import { readSpec, TOP_KEYS } from '../../src/system/spec.js';

const RUNS = { numRuns: 300, seed: 909 } as const;

/**
 * Iron with sulfur at 25 °C, inline data. Values: Wagman et al. (1982) NBS tables, J. Phys. Chem.
 * Ref. Data 11 Suppl. 2 — recalled from memory; only their validity as input matters here.
 */
const IRON_SULFUR = {
  element: 'Fe',
  temperature: 25,
  activity: 1e-6,
  ligands: { S: 1e-3 },
  pH: [0, 14],
  E: [-1.5, 1.5],
  gases: { H2: 1, O2: 1 },
  extrapolation: 'cp',
  title: 'Fe–S–H2O',
  grid: 100,
  species: [
    { formula: 'Fe', phase: 's', dfG: 0, dfH: 0, S: 27.28, Cp: 25.1 },
    { formula: 'Fe+2', phase: 'aq', dfG: -78.9, dfH: -89.1, S: -137.7 },
    { formula: 'Fe+3', phase: 'aq', dfG: -4.7, dfH: -48.5, S: -315.9, activity: 1e-5 },
    { formula: 'Fe3O4', phase: 's', dfG: -1015.4, dfH: -1118.4, S: 146.4, name: 'magnetite' },
    { formula: 'Fe2O3', phase: 's', dfG: -742.2, dfH: -824.2, S: 87.4, source: 'NBS 1982' },
    { formula: 'FeS', phase: 's', dfG: -100.4, dfH: -100.0, S: 60.29 },
    { formula: 'FeS2', phase: 's', dfG: -166.9, dfH: -178.2, S: 52.93 },
    { formula: 'H2S', phase: 'aq', dfG: -27.83, dfH: -39.7, S: 121.0 },
    { formula: 'HS-', phase: 'aq', dfG: 12.08, dfH: -17.6, S: 62.8 },
    { formula: 'SO4-2', phase: 'aq', dfG: -744.53, dfH: -909.27, S: 20.1 },
    { formula: 'S', phase: 's', dfG: 0, dfH: 0, S: 31.8 },
    { formula: 'H2', phase: 'g', dfG: 0, dfH: 0, S: 130.684, pressure: 1 },
  ],
};

/** Copper at 150 °C from the built-in library, with chlorine as ligand and a few options set. */
const COPPER_LIBRARY = {
  element: 'Cu',
  temperature: 150,
  activity: 1e-6,
  ligands: { Cl: 1e-2 },
  pH: [2, 12],
  E: [-1, 1.2],
  metastable: false,
  exclude: [],
  figure: { width: 120, style: 'gray' },
};

const BASES = [IRON_SULFUR, COPPER_LIBRARY];

const STATS = { built: 0, refused: 0 };

/** The only acceptable failure: InputError naming the file and what is expected. */
function loadAndBuild(data: unknown, file = 'x.yaml'): void {
  let built: ReturnType<typeof buildSystem> | undefined;
  try {
    built = buildSystem(readSpec(data, file));
  } catch (e) {
    if (!(e instanceof InputError)) throw new Error(`not an InputError: ${(e as Error)?.stack ?? String(e)}`);
    expect(e.message.startsWith(file)).toBe(true);
    expect(e.message).toContain('expected');
    STATS.refused++;
    return;
  }
  STATS.built++;
  // A system that builds must solve.
  const sol = solve(built.input);
  expect(sol.regions.length).toBeGreaterThan(0);
}

function loadText(text: string, file: string): void {
  let data: unknown;
  try {
    data = parseSystemText(text, file);
  } catch (e) {
    if (!(e instanceof InputError)) throw new Error(`not an InputError: ${(e as Error)?.stack ?? String(e)}`);
    expect(e.message.startsWith(file)).toBe(true);
    return;
  }
  loadAndBuild(data, file);
}

/** Every path (list of keys/indices) to a value inside `v`, the root excluded. */
function paths(v: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const out: (string | number)[][] = [];
  if (Array.isArray(v)) v.forEach((x, k) => out.push([...prefix, k], ...paths(x, [...prefix, k])));
  else if (v && typeof v === 'object') for (const [k, x] of Object.entries(v)) out.push([...prefix, k], ...paths(x, [...prefix, k]));
  return out;
}

/** Own-property assignment, as JSON.parse and the YAML parser do (so `__proto__` stays a plain key). */
function setOwn(o: object, k: string | number, v: unknown): void {
  Object.defineProperty(o, k, { value: v, enumerable: true, writable: true, configurable: true });
}

type Mutation = { kind: 'delete' | 'replace' | 'insert'; pick: number; key: string; value: unknown };

function mutate(doc: unknown, m: Mutation): unknown {
  const copy = structuredClone(doc) as Record<string, unknown>;
  const all = paths(copy);
  const containers = [[], ...all].filter((p) => {
    const v = p.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], copy);
    return v !== null && typeof v === 'object';
  });
  if (m.kind === 'insert') {
    const p = containers[m.pick % containers.length]!;
    const target = p.reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], copy) as Record<string, unknown>;
    if (Array.isArray(target)) target.push(m.value);
    else setOwn(target, m.key, m.value);
    return copy;
  }
  const p = all[m.pick % all.length]!;
  const parent = p.slice(0, -1).reduce<unknown>((o, k) => (o as Record<string | number, unknown>)[k], copy) as Record<string | number, unknown>;
  const last = p[p.length - 1]!;
  if (m.kind === 'delete') {
    if (Array.isArray(parent)) parent.splice(last as number, 1);
    else delete parent[last];
  } else setOwn(parent, last, m.value);
  return copy;
}

const hostile = fc.oneof(
  { weight: 3, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  {
    weight: 3,
    arbitrary: fc.constantFrom<unknown>(
      NaN,
      Infinity,
      -Infinity,
      -0,
      0,
      1e308,
      -1e308,
      5e-324,
      1e-300,
      '',
      ' ',
      'NaN',
      '1e400',
      '0-14',
      'Fe',
      'Fe+2',
      'Fe2+',
      'S',
      'Xe',
      '__proto__',
      'constructor',
      '<script>alert(1)</script>',
      '\u0000',
      '\ud800',
      [],
      {},
      [1],
      [14, 0],
      [0, 0],
      [0, 14, 2],
      null,
      true,
      false,
      { __proto__: null },
      ['Fe', 'Fe'],
      [{ formula: 'Fe', phase: 's', dfG: 0 }],
    ),
  },
  { weight: 1, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.integer() },
);

const keyArb = fc.oneof(
  fc.constantFrom('__proto__', 'constructor', 'toString', 'hasOwnProperty', 'valueOf', 'prototype', '', ' ', 'S', 'Cl', 'Xe', 'dfG', 'phase', 'formula', 'activity'),
  fc.constantFrom(...TOP_KEYS),
  fc.string({ maxLength: 8 }),
);

const mutationArb: fc.Arbitrary<Mutation> = fc.record({
  kind: fc.constantFrom('delete', 'replace', 'insert'),
  pick: fc.nat(),
  key: keyArb,
  value: hostile,
});

describe('the unmodified documents are valid (so the mutations below start from valid input)', () => {
  it.each(BASES.map((b, k) => [k, b] as const))('base %i builds and solves', (_k, base) => {
    const built = buildSystem(readSpec(structuredClone(base), 'x.yaml'));
    expect(solve(built.input).regions.length).toBeGreaterThan(1);
  });
});

describe('loader: only InputError, whatever the data', () => {
  it('random JSON values as the whole document', () => {
    fc.assert(fc.property(fc.jsonValue({ maxDepth: 4 }), (v) => loadAndBuild(v)), RUNS);
  });

  it('random objects with known and unknown top-level keys', () => {
    const doc = fc.dictionary(keyArb, hostile, { maxKeys: 6 }).map((d) => {
      const o: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(d)) setOwn(o, k, v);
      if (!('element' in o)) setOwn(o, 'element', 'Fe');
      return o;
    });
    fc.assert(fc.property(doc, (v) => loadAndBuild(v)), RUNS);
  });

  it('valid documents with 1–3 random deletions, type swaps and insertions', () => {
    const before = STATS.built;
    fc.assert(
      fc.property(fc.constantFrom(...BASES), fc.array(mutationArb, { minLength: 1, maxLength: 3 }), (base, ms) => {
        let doc: unknown = base;
        for (const m of ms) doc = mutate(doc, m);
        loadAndBuild(doc);
      }),
      RUNS,
    );
    // Some mutants must stay valid and reach the solver, or the property would test only refusals.
    expect(STATS.built - before).toBeGreaterThan(20);
  });
});

describe('known bugs found by the properties above', () => {
  // BUG: src/system/spec.ts readSpecies accepts an empty string as a library species name and
  // src/data/library.ts findSpecies('') throws FormulaError (not InputError). Reproduction:
  // buildSystem(readSpec({ element: 'Fe', species: ['Fe', ''] }, 'x.yaml')).
  it('an empty string in the species list gives InputError', () => {
    loadAndBuild({ element: 'Fe', species: ['Fe', ''] });
  });

  it('a nearly empty pH range is refused (found by the mutation property: pH [0, 5e-324] gave no regions)', () => {
    expect(() => readSpec({ element: 'Fe', pH: [0, 5e-324] }, 'x.yaml')).toThrow(/pH: expected .*at least/);
    expect(() => readSpec({ element: 'Fe', E: [0, 1e-9] }, 'x.yaml')).toThrow(/E: expected .*at least/);
  });
});

describe('reader: only InputError, whatever the text', () => {
  it('random text as YAML and as JSON', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 200 }), (t) => {
        loadText(t, 'x.yaml');
        loadText(t, 'x.json');
      }),
      RUNS,
    );
  });

  it('valid YAML and JSON texts with random character edits', () => {
    const texts = BASES.flatMap((b) => [
      { file: 'x.yaml', text: stringify(b) },
      { file: 'x.json', text: JSON.stringify(b, null, 1) },
    ]);
    const edit = fc.record({
      at: fc.nat(),
      len: fc.integer({ min: 0, max: 6 }),
      insert: fc.oneof(fc.constantFrom('', ':', '-', '[', ']', '{', '}', ',', '"', "'", '&a', '*a', '!!str', '\n', '\t', ' ', '#', '<<: *a', '.nan', '1e400', '\ufeff'), fc.string({ maxLength: 4 })),
    });
    fc.assert(
      fc.property(fc.constantFrom(...texts), fc.array(edit, { minLength: 1, maxLength: 3 }), ({ file, text }, edits) => {
        let t = text;
        for (const e of edits) {
          const k = e.at % (t.length + 1);
          t = t.slice(0, k) + e.insert + t.slice(k + e.len);
        }
        loadText(t, file);
      }),
      RUNS,
    );
  });

  it('YAML anchors and aliases placed at random are either resolved or refused', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 12 }), (width, depth) => {
        const levels = [`  l0: &l0 "x"`];
        for (let k = 1; k <= depth; k++) levels.push(`  l${k}: &l${k} [${Array(width).fill(`*l${k - 1}`).join(', ')}]`);
        loadText(`element: Fe\ndescription:\n${levels.join('\n')}\n`, 'x.yaml');
      }),
      { numRuns: 60, seed: 4 },
    );
  });
});

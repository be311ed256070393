/**
 * The bad-input catalogue (tests/bad-inputs/README.md): every file there has one thing wrong and
 * must give exit code 2, exactly one line on stderr beginning `ephmap: ` that names the file, the
 * field from the table and says what is expected, no stack trace, and no output file. The files in
 * ok/ look suspicious but are valid: exit 0 and an output file. Atomic output: a failed run never
 * touches an existing output and leaves no temporary files.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir } from '../helpers/tmp.js';

const here = dirname(fileURLToPath(import.meta.url));
const BAD = join(here, '..', 'bad-inputs');
const OK = join(BAD, 'ok');

/** Rows `| `file` | what is wrong | `field` |` of the catalogue table (first table only). */
function catalogue(): { file: string; wrong: string; field: string }[] {
  const text = readFileSync(join(BAD, 'README.md'), 'utf8');
  const head = text.indexOf('| file | what is wrong | message names |');
  const end = text.indexOf('\n## ', head);
  const rows: { file: string; wrong: string; field: string }[] = [];
  for (const line of text.slice(head, end).split('\n').slice(2)) {
    const m = /^\| `([^`]+)` \| (.+) \| `([^`]+)` \|$/.exec(line.trim());
    if (m) rows.push({ file: m[1]!, wrong: m[2]!, field: m[3]! });
  }
  return rows;
}

function okFiles(): string[] {
  const text = readFileSync(join(BAD, 'README.md'), 'utf8');
  const part = text.slice(text.indexOf('## ok/'));
  return [...part.matchAll(/^\| `([^`]+)` \|/gm)].map((m) => m[1]!);
}

const rows = catalogue();
const out = tmpDir();

/** Catalogue files that expose a bug outside this issue's modules (kept failing until fixed). */
/** Files whose refusal is a known, open bug (none at present). */
const KNOWN_BUGS: Record<string, string> = {};

async function expectRefused(input: string, field: string, target: string): Promise<void> {
  const r = await runCli(['draw', input, '-o', target]);
  expect(r.code, r.stderr).toBe(2);
  const lines = r.stderr.split('\n').filter((l) => l !== '');
  expect(lines, r.stderr).toHaveLength(1);
  const msg = lines[0]!;
  expect(msg.startsWith('ephmap: ')).toBe(true);
  expect(msg).toContain(input);
  expect(msg).toContain(field);
  expect(msg).toContain('expected');
  expect(msg).not.toMatch(/^\s*at /m);
  expect(msg).not.toMatch(/internal error/);
  expect(r.stdout).toBe('');
  expect(existsSync(target)).toBe(false);
}

describe('the catalogue', () => {
  it('has at least 40 bad files, each listed once, and lists nothing that is not there', () => {
    expect(rows.length).toBeGreaterThanOrEqual(40);
    const listed = rows.map((r) => r.file);
    expect(new Set(listed).size).toBe(listed.length);
    const present = readdirSync(BAD).filter((f) => f !== 'README.md' && f !== 'ok');
    expect(present.sort()).toEqual(listed.filter((f) => f !== 'missing.yaml').sort());
    expect(existsSync(join(BAD, 'missing.yaml'))).toBe(false);
    expect(statSync(join(BAD, 'directory.yaml')).isDirectory()).toBe(true);
    const ok = okFiles();
    expect(ok.length).toBeGreaterThan(3);
    expect(readdirSync(OK).sort()).toEqual([...ok].sort());
  });
});

describe('each bad input: exit 2, one message naming file and field, nothing written', () => {
  const target = (file: string) => join(out, `${file.replace(/\W/g, '_')}.svg`);
  it.each(rows.filter((r) => !(r.file in KNOWN_BUGS)))('$file ($wrong)', async ({ file, field }) => {
    await expectRefused(join(BAD, file), field, target(file));
  });
});

describe('hostile inputs too big for the catalogue (generated)', () => {
  it('a file over 4 MiB is refused before parsing', async () => {
    const f = join(out, 'huge.yaml');
    writeFileSync(f, `element: Fe\ndescription: "${'x'.repeat(5 * 1024 * 1024)}"\n`);
    await expectRefused(f, 'MiB', join(out, 'huge.svg'));
  });

  it('flow lists nested 100000 deep (YAML) are refused without a stack overflow', async () => {
    const f = join(out, 'deep100k.yaml');
    writeFileSync(f, `element: Fe\ndescription: ${'['.repeat(100000)}${']'.repeat(100000)}\n`);
    await expectRefused(f, 'description', join(out, 'deep100k.svg'));
  });

  it('block lists nested 20000 deep (YAML) are refused without a stack overflow', async () => {
    const f = join(out, 'deepblock.yaml');
    writeFileSync(f, `element: Fe\ndescription:\n  ${'- '.repeat(20000)}x\n`);
    await expectRefused(f, 'nesting', join(out, 'deepblock.svg'));
  });

  it('arrays nested 1000000 deep (JSON) are refused', async () => {
    const f = join(out, 'deep1m.json');
    writeFileSync(f, `{"element": "Fe", "description": ${'['.repeat(1000000)}${']'.repeat(1000000)}}`);
    await expectRefused(f, 'description[0]', join(out, 'deep1m.svg'));
  });

  it('/dev/zero as input: named as a character device, never read (not "a directory")', async () => {
    const r = await runCli(['draw', '/dev/zero', '-o', join(out, 'zero.svg')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe('ephmap: /dev/zero: expected a readable system file (.json, .yaml or .yml), got a character device (such as /dev/zero)\n');
  });

  it('a FIFO as input: named as a named pipe, never opened (opening would block)', async () => {
    const f = join(out, 'pipe.yaml');
    execFileSync('mkfifo', [f]);
    await expectRefused(f, 'got a named pipe (FIFO)', join(out, 'pipe.svg'));
  });

  it('a 200 000-character unknown key gives a one-line message of bounded length', async () => {
    const f = join(out, 'longkey.json');
    writeFileSync(f, `{"element": "Fe", "${'k'.repeat(200_000)}": 1}`);
    const r = await runCli(['draw', f, '-o', join(out, 'longkey.svg')]);
    expect(r.code).toBe(2);
    expect(r.stderr.length).toBeLessThan(f.length + 1000);
    expect(r.stderr).toContain(`${'k'.repeat(100)}…`);
  });

  it('a YAML flow list of 60 000 items (quadratic in the parser) is refused before parsing', async () => {
    const f = join(out, 'flow.yaml');
    writeFileSync(f, `element: Fe\ndescription: [${'1,'.repeat(60_000)}1]\n`);
    await expectRefused(f, 'at most 50000 lines and list items', join(out, 'flow.svg'));
  });

  it('the work-budget refusal names the largest grid that fits', async () => {
    const r = await runCli(['draw', join(BAD, 'work-budget.json'), '-o', join(out, 'budget.svg')]);
    expect(r.code).toBe(2);
    // 1e9 / (2000 × 9) = 55 555.6 → grid ≤ 235
    expect(r.stderr).toContain('use grid ≤ 235, got 4000² × 2000 × 9 = 2.9e+11');
  });

  it('an alias bomb in JSON-compatible YAML flow style is refused', async () => {
    const f = join(out, 'bomb2.yml');
    const lv = Array.from({ length: 12 }, (_, k) => `l${k + 1}: &l${k + 1} [${Array(10).fill(`*l${k}`).join(',')}]`);
    writeFileSync(f, `element: Fe\ndescription:\n  l0: &l0 "x"\n${lv.map((l) => `  ${l}`).join('\n')}\n`);
    await expectRefused(f, 'aliases', join(out, 'bomb2.svg'));
  });
});

describe('ok/: valid input that looks suspicious', () => {
  it.each(okFiles())('%s draws', async (file) => {
    const target = join(out, `ok-${file}.svg`);
    const r = await runCli(['draw', join(OK, file), '-o', target]);
    expect(r.code, r.stderr).toBe(0);
    expect(existsSync(target)).toBe(true);
    const svg = readFileSync(target, 'utf8');
    expect(svg.startsWith('<?xml') || svg.startsWith('<svg')).toBe(true);
    // Well-formed XML text: no characters XML 1.0 forbids, every & starts an entity reference.
    expect(svg).not.toMatch(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/);
    expect(svg).not.toMatch(/&(?!(amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);)/);
  });

  it('a title with markup is escaped in the SVG: no <script> element, no raw <b>', async () => {
    const target = join(out, 'script-title.svg');
    expect((await runCli(['draw', join(OK, 'title-script.yaml'), '-o', target])).code).toBe(0);
    const svg = readFileSync(target, 'utf8');
    expect(svg).not.toMatch(/<script/i);
    expect(svg).not.toMatch(/<b>/);
    expect(svg).toContain('&lt;script&gt;');
  });

  it('markup in species names never reaches the SVG as elements or attributes', async () => {
    const target = join(out, 'names.svg');
    expect((await runCli(['draw', join(OK, 'species-name-markup.json'), '-o', target])).code).toBe(0);
    const svg = readFileSync(target, 'utf8');
    expect(svg).not.toMatch(/<img/i);
    expect(svg).not.toMatch(/<tag/i);
    expect(svg).not.toMatch(/\sonerror=/i);
  });

  it('a misspelt key is named and the nearest known key suggested', async () => {
    const r = await runCli(['draw', join(BAD, 'key-typo.yaml'), '-o', join(out, 'typo.svg')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/temprature.*did you mean "temperature"\?/);
  });

  it('a unicode title reaches the SVG intact', async () => {
    const target = join(out, 'unicode.svg');
    expect((await runCli(['draw', join(OK, 'title-unicode.yaml'), '-o', target])).code).toBe(0);
    expect(readFileSync(target, 'utf8')).toContain('鉄');
  });

  it('CR-only line ends read like LF: same diagram as the LF file', async () => {
    const a = join(out, 'cr.json');
    const b = join(out, 'lf.json');
    expect((await runCli(['draw', join(OK, 'cr-line-ends.yaml'), '-o', a])).code).toBe(0);
    const lf = join(out, 'lf.yaml');
    writeFileSync(lf, readFileSync(join(OK, 'cr-line-ends.yaml'), 'utf8').replace(/\r/g, '\n'));
    expect((await runCli(['draw', lf, '-o', b])).code).toBe(0);
    expect(readFileSync(a, 'utf8')).toBe(readFileSync(b, 'utf8'));
  });

  it('Fe2+ warns (suggesting Fe+2) but is not an error', async () => {
    const target = join(out, 'fe2plus.svg');
    const r = await runCli(['draw', join(OK, 'charge-typo-warning.json'), '-o', target]);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^warning: .*"Fe\^2\+"/m);
  });

  it('a BOM alone is no error, and a BOM file gives the same diagram as without it', async () => {
    const a = join(out, 'bom.json');
    const b = join(out, 'nobom.json');
    expect((await runCli(['draw', join(OK, 'bom.yaml'), '-o', a])).code).toBe(0);
    const plain = join(out, 'nobom.yaml');
    writeFileSync(plain, readFileSync(join(OK, 'bom.yaml'), 'utf8').replace(/^\ufeff/, ''));
    expect((await runCli(['draw', plain, '-o', b])).code).toBe(0);
    const strip = (s: string) => JSON.parse(s).regions.map((x: { species: string; area: number }) => [x.species, x.area]);
    expect(strip(readFileSync(a, 'utf8'))).toEqual(strip(readFileSync(b, 'utf8')));
  });
});

describe('atomic output', () => {
  it('a bad input aimed at an existing output leaves it untouched and no *.tmp files', async () => {
    const dir = tmpDir();
    const target = join(dir, 'fig.svg');
    const r0 = await runCli(['draw', join(OK, 'bom.yaml'), '-o', target]);
    expect(r0.code).toBe(0);
    const before = readFileSync(target);
    for (const file of ['activity-nan.yaml', 'species-duplicate.json', 'alias-bomb.yaml', 'binary.yaml']) {
      const r = await runCli(['draw', join(BAD, file), '-o', target]);
      expect(r.code).toBe(2);
      expect(readFileSync(target).equals(before)).toBe(true);
    }
    expect(readdirSync(dir)).toEqual(['fig.svg']);
  });

  it('a bad output extension writes nothing', async () => {
    const dir = tmpDir();
    const r = await runCli(['draw', join(OK, 'bom.yaml'), '-o', join(dir, 'fig.gif')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--output/);
    expect(readdirSync(dir)).toEqual([]);
  });
});

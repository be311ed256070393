/**
 * `report` (md, html, pdf) on a composition file: the composition figure, boundaries as curves,
 * the speciation at the file's operating points, the plating window of the bath as made up (when the
 * file sets platingWindow: true).
 * Outside check: at pH 12, −0.5 V the silver bath keeps most silver as metal, and the metal plus
 * the dissolved silver in the speciation table make up the 0.2 mol/kg total (mass balance).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, test } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const bath = writeTmp(dir, 'bath.yaml', [
  'element: Ag',
  'composition: {Ag: 0.2, CN: 0.6}',
  'grid: 60',
  'points:',
  '  - {label: tank A, pH: 12, E: -0.5}',
  '  - {label: tank B, pH: 12, E: 0}',
  'platingWindow: true',
  '',
].join('\n'));

const num = (s: string) => Number(s.trim().split(' ')[0]);

describe('report on a composition file', () => {
  test('Markdown: figure beside it, curves, speciation at each operating point, window stated as the bath as made up', async () => {
    const out = join(dir, 'r.md');
    const r = await runCli(['report', bath, '-o', out]);
    expect(r.code, r.stderr).toBe(0);
    expect(existsSync(join(dir, 'r.svg'))).toBe(true);
    const md = readFileSync(out, 'utf8');
    expect(md).toContain('the bath as made up');
    expect(md).toMatch(/\| `Ag\(CN\)₃²⁻ \/ Ag` \| `Ag\(CN\)₃²⁻ \+ e⁻ ⇌ Ag\(s\) \+ 3CN⁻` \| E° = -?\d\.\d{4} \| curve \(reaction at its midpoint/);
    expect(md).toMatch(/\| tank A \| 12 \| -0\.5 V vs SHE \| -0\.5000 \| Ag \| immunity \| 0\.035\d* \| above 1\.000e-6 \|/);
    expect(md).toMatch(/\| tank B \| 12 \| 0 V vs SHE \| 0\.0000 \| Ag\(CN\)₂⁻ \| corrosion \| 0\.2000 \| above 1\.000e-6 \|/);
    // Mass balance in tank A's table: solid Ag + dissolved silver = 0.2 mol/kg.
    const a = md.split('**tank A')[1].split('**tank B')[0];
    const row = (sp: string) => a.split('\n').find((l) => l.startsWith(`| ${sp} |`))!.split('|').map((c) => c.trim());
    const silver = num(row('Ag')[3]) + num(row('Ag(CN)₂⁻')[3]) + num(row('Ag(CN)₃²⁻')[3]);
    expect(Math.abs(silver - 0.2)).toBeLessThan(2e-4); // 4 significant digits printed
    expect(md).toContain('## Plating window');
    expect(md).toContain('`Ag(CN)₂⁻`, `Ag(CN)₃²⁻`');
    expect(md).not.toContain('The system file names no operating points');
  });
  test('the window section only when the file sets platingWindow: true (issue 15: a corrosion case has none)', async () => {
    const plain = writeTmp(dir, 'plain.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\ngrid: 60\n');
    for (const ext of ['md', 'html']) {
      const out = join(dir, `plain.${ext}`);
      expect((await runCli(['report', plain, '-o', out])).code).toBe(0);
      expect(readFileSync(out, 'utf8'), ext).not.toMatch(/Plating window/);
    }
  });
  test('boxes and paths are answered at their samples and drawn (issue 15: report includes boxes and paths)', async () => {
    const f = writeTmp(dir, 'env.yaml', [
      'element: Ag', 'composition: {Ag: 0.2, CN: 0.6}', 'grid: 60',
      'boxes:', '  - {label: "tank window", pH: [11, 13], E: [-0.6, -0.4]}',
      'paths:', '  - {label: "rinse-down", points: [[12, -0.5], [12, 0]]}', '',
    ].join('\n'));
    const out = join(dir, 'env.md');
    expect((await runCli(['report', f, '-o', out])).code).toBe(0);
    const md = readFileSync(out, 'utf8');
    expect(md).toContain('## Envelopes and paths');
    expect(md).toMatch(/tank window \(envelope, E vs SHE\): .*centre \(pH 12, E -0\.5\): Ag \(immunity\)/);
    // The same two points as tank A and tank B above: metal at −0.5 V, Ag(CN)₂⁻ at 0 V.
    expect(md).toMatch(/rinse-down \(path, E vs SHE\): mixed: immunity, corrosion\. Points: point 1 \(pH 12, E -0\.5\): Ag \(immunity\); point 2 \(pH 12, E 0\): Ag\(CN\)₂⁻ \(corrosion\)/);
    expect(readFileSync(join(dir, 'env.svg'), 'utf8')).toContain('tank window');
  });
  test('the caption is printed once, under the figure, not also inside it (issue 15: report does not repeat the caption)', async () => {
    const out = join(dir, 'cap.html');
    expect((await runCli(['report', bath, '-o', out])).code).toBe(0);
    const html = readFileSync(out, 'utf8');
    const svg = html.slice(html.indexOf('<svg'), html.indexOf('</svg>'));
    expect(svg).not.toContain('class="caption"');
    expect(html.split('the bath as made up: totals Ag').length - 1).toBe(1);
    const md = join(dir, 'cap.md');
    expect((await runCli(['report', bath, '-o', md])).code).toBe(0);
    expect(readFileSync(join(dir, 'cap.svg'), 'utf8')).not.toContain('class="caption"');
  });
  test("--ref, else the file's reference:, gives the figure its second axis, as draw does (issue 15: the figure options)", async () => {
    const out = join(dir, 'ref.html');
    expect((await runCli(['report', bath, '-o', out, '--ref', 'sce'])).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toMatch(/data-axis="E2">.*\/ V vs SCE</);
    const own = writeTmp(dir, 'own-ref.yaml', 'element: Ag\ncomposition: {Ag: 0.2, CN: 0.6}\ngrid: 60\nreference: cse\n');
    const out2 = join(dir, 'own-ref.html');
    expect((await runCli(['report', own, '-o', out2])).code).toBe(0);
    expect(readFileSync(out2, 'utf8')).toMatch(/data-axis="E2">.*\/ V vs Cu\/CuSO<\/tspan>/); // CuSO₄, the 4 set as a subscript
  });
  test('HTML: self-contained with the figure and the speciation tables', async () => {
    const out = join(dir, 'r.html');
    expect((await runCli(['report', bath, '-o', out])).code).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('<svg');
    expect(html).toContain('<td>tank A</td>');
    expect(html).toContain('<th>share of Ag</th>');
    expect(html).not.toContain('&amp;gt;');
  });
  test('PDF: written, with the figure as vectors', async () => {
    const out = join(dir, 'w.pdf');
    const r = await runCli(['report', bath, '-o', out]);
    expect(r.code, r.stderr).toBe(0);
    const bytes = readFileSync(out);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.includes(Buffer.from('/Subtype /Image'))).toBe(false);
  });
  const hasPdftotext = spawnSync('pdftotext', ['-v']).error === undefined;
  // Reason for skipping: pdftotext (poppler-utils) is not installed; .ci/run installs it.
  test.skipIf(!hasPdftotext)('PDF: the speciation table reads back', async () => {
    const out = join(dir, 'r.pdf');
    expect((await runCli(['report', bath, '-o', out])).code).toBe(0);
    const text = execFileSync('pdftotext', ['-enc', 'UTF-8', out, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('the bath as made up');
    expect(text).toMatch(/tank A/);
    expect(text).toMatch(/immunity/);
  });
});

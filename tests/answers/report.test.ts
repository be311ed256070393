/**
 * Issue 15, report: envelopes (boxes) and paths are answered in the document, the plating-window
 * section appears only when the file asks for it (`platingWindow: true`), the figure options apply,
 * and the caption is printed once (under the figure, not also inside it).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { REPORT_CAUTIONS, REPORT_CLOSING } from '../../src/report/report-data.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
const hasPdftotext = spawnSync('pdftotext', ['-v']).error === undefined;
const body = `element: Fe
reference: sce
boxes:
  - {label: "normal operation", pH: [8.8, 9.6], E: [-0.75, -0.55]}
paths:
  - {label: "start-up", points: [[7, -0.4], [8.5, -0.6], [9.2, -0.7]]}
`;
const fe = writeTmp(dir, 'fe.yaml', body);
const bath = writeTmp(dir, 'bath.yaml', 'element: Cu\nactivity: 0.5\npH: [0, 6]\nplatingWindow: true\n');

describe('report', () => {
  it('answers envelopes and paths, and leaves out the window section unless asked', async () => {
    const out = join(dir, 'fe.md');
    const r = await runCli(['report', fe, '-o', out]);
    expect(r.code).toBe(0);
    const md = readFileSync(out, 'utf8');
    expect(md).toContain('## Envelopes and paths');
    expect(md).toMatch(/normal operation \(envelope, E vs SCE\): passivation at every sample/);
    expect(md).toMatch(/start-up \(path, E vs SCE\)/);
    expect(md).not.toContain('## Plating window');
  });

  it('includes the window section when the file sets platingWindow: true', async () => {
    const out = join(dir, 'bath.md');
    expect((await runCli(['report', bath, '-o', out])).code).toBe(0);
    expect(readFileSync(out, 'utf8')).toContain('## Plating window');
  });

  it('takes the figure options and prints the caption once', async () => {
    const out = join(dir, 'g.html');
    const r = await runCli(['report', fe, '-o', out, '--width', '120mm', '--style', 'gray', '--ref', 'agcl-sat']);
    expect(r.code).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('width="120mm"');
    expect(html).toContain('Ag/AgCl');
    // The caption's conditions appear once: in the document's caption, not also inside the figure.
    expect(html.split('dissolved Fe activity').length - 1).toBe(1);
    expect(html.split('<figcaption>')[0]).not.toContain('dissolved Fe activity');
  });

  it('names the runner-up of each operating point and why a shift column is empty (defect 2: CuO from Cu2+ at pH 6.674, NBS 1982)', async () => {
    const cu = writeTmp(dir, 'cu-point.yaml', 'element: Cu\npoints:\n  - {label: "rinse tank", pH: 6, E: 0.5}\n');
    for (const ext of ['md', 'html']) {
      const out = join(dir, `cu-point.${ext}`);
      expect((await runCli(['report', cu, '-o', out])).code).toBe(0);
      const text = readFileSync(out, 'utf8');
      expect(text).toMatch(/Runner-up: CuO \(margin 7\.69\d kJ per mol of element; \+0\.67\d pH at this potential; the runner-up is reached without electron transfer/);
    }
  });

  it('an alloy report carries the cautions of every report: equilibrium only, codes and standards, a qualified professional (md, html, pdf)', async () => {
    const alloy = writeTmp(dir, 'alloy.yaml', 'elements: {Fe: 0.7, Cr: 0.18, Ni: 0.12}\n');
    for (const ext of ['md', 'html', 'pdf']) {
      const out = join(dir, `alloy-report.${ext}`);
      expect((await runCli(['report', alloy, '-o', out])).code).toBe(0);
      if (ext === 'pdf' && !hasPdftotext) continue;
      const raw = ext === 'pdf' ? execFileSync('pdftotext', ['-enc', 'UTF-8', out, '-'], { encoding: 'utf8' }) : readFileSync(out, 'utf8');
      const text = raw.replace(/\s+/g, ' ');
      expect(text, ext).toContain(REPORT_CAUTIONS[0]);
      expect(text, ext).toContain(REPORT_CLOSING);
    }
  });

  it('an alloy report answers its operating points, boxes and paths with the point solver (as probe does)', async () => {
    const f = writeTmp(dir, 'brass.yaml', [
      'elements: {Cu: 0.7, Zn: 0.3}', 'reference: sce',
      'points:', '  - {label: "valve seat", pH: 8, E: -0.3}',
      'boxes:', '  - {label: "hot loop", pH: [7.5, 9], E: [-0.4, -0.1]}',
      'paths:', '  - {label: "flush", points: [[7, 0], [9, -0.4]]}', '',
    ].join('\n'));
    const probe = await runCli(['probe', f, '--ph', '8', '--potential', '-0.3']);
    const assemblage = /^assemblage: (.*)$/m.exec(probe.stdout)![1];
    for (const ext of ['md', 'html']) {
      const out = join(dir, `brass.${ext}`);
      expect((await runCli(['report', f, '-o', out])).code).toBe(0);
      const text = readFileSync(out, 'utf8');
      expect(text, ext).toContain('valve seat');
      expect(text, ext).toContain(assemblage);
      expect(text, ext).toMatch(/hot loop \(envelope, E vs SCE\)/);
      expect(text, ext).toMatch(/flush \(path, E vs SCE\)/);
    }
  });
});

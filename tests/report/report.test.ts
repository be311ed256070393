/**
 * `ephmap report`: Markdown (+ SVG beside it), self-contained HTML and PDF documents with every
 * boundary reaction, every operating point with its verdict, the data sources and the cautions;
 * deterministic output; bad input writes nothing (exit 2).
 */
import { reactionForPeople } from '../../src/chem/present.js';
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { computeFile } from '../../src/pipeline.js';
import { runCli } from '../helpers/cli.js';
import { tmpDir, writeTmp } from '../helpers/tmp.js';

const dir = tmpDir();
// Points well inside the iron fields of the 25 °C diagram at dissolved-iron activity 1e-6 (iron
// regions of the NBS 1982 data, Wagman et al. 1982, as drawn in every iron–water diagram; common
// practice): metal below the Fe/Fe2+ line near −0.59 V, Fe2+ at pH 4 well below the Fe2O3 line,
// hematite at pH 10 above the magnetite line.
const EXPECTED: [string, 'immunity' | 'corrosion' | 'passivation'][] = [
  ['acid reducing', 'immunity'], // pH 2, −0.9 V vs SHE
  ['mild acid', 'corrosion'], // pH 4, 0.0 V vs SHE
  ['alkaline aerated', 'passivation'], // pH 10, +0.4 V vs SHE
];
const TITLE = '<script>alert(1)</script>';
const fe = writeTmp(
  dir,
  'fe.yaml',
  [
    'element: Fe',
    'activity: 1.0e-6',
    'E: [-1.2, 1.4]',
    `title: "${TITLE}"`,
    'points:',
    '  - {label: "acid reducing", pH: 2, E: -0.9}',
    '  - {label: "mild acid", pH: 4, E: 0.0}',
    '  - {label: "alkaline aerated", pH: 10, E: 0.4}',
    '',
  ].join('\n'),
);
const model = computeFile(fe).model;
// The report is for people: each reaction as the Unicode text (Fe₃O₄(s) + 8H⁺ + 8e⁻ ⇌ 3Fe(s) + 4H₂O(l)).
const reactions = [...new Set(model.boundaries.map((b) => reactionForPeople(b.reaction)))];

// The caution every report carries, word for word (the same text as REPORT_CAUTIONS).
const CAUTION_6 =
  'An E–pH diagram is equilibrium thermodynamics only: it says nothing about rates, passive-film quality, localized attack (pitting, crevice, stress-corrosion, microbially influenced), galvanic coupling, or mixed potentials. It is a screening aid; design decisions follow the applicable codes and standards and the judgement of a qualified corrosion or plating professional.';
const NBS = 'Wagman D.D., Evans W.H., Parker V.B., Schumm R.H., Halow I., Bailey S.M., Churney K.L., Nuttall R.L. (1982) The NBS tables of chemical thermodynamic properties. J. Phys. Chem. Ref. Data 11, Suppl. 2';

const squash = (s: string) => s.replace(/\s+/g, ' ');

async function report(name: string): Promise<string> {
  const out = join(dir, name);
  // -o never creates directories (src/cli/outputs.ts): the test makes the folder first.
  mkdirSync(dirname(out), { recursive: true });
  const r = await runCli(['report', fe, '-o', out]);
  expect(r.stderr).toBe('');
  expect(r.code).toBe(0);
  return out;
}

describe('report (Markdown)', () => {
  it('writes the document and its figure beside it, with reactions, verdicts, sources and cautions', async () => {
    const out = await report('a/report.md');
    const md = readFileSync(out, 'utf8');
    const svg = join(dir, 'a', 'report.svg');
    expect(existsSync(svg)).toBe(true);
    expect(readFileSync(svg, 'utf8')).toMatch(/^<svg /);
    expect(md).toContain('](report.svg)');
    expect(reactions.length).toBeGreaterThan(5);
    for (const r of reactions) expect(md).toContain(`\`${r}\``);
    for (const [label, verdict] of EXPECTED) {
      const row = md.split('\n').find((l) => l.startsWith(`| ${label} |`));
      expect(row, label).toBeDefined();
      expect(row).toContain(`**${verdict}**`);
    }
    expect(md).toContain(NBS); // full citation
    expect(md).toContain('| `Fe²⁺` | aq | iron(II) ion | main | library | yes |'); // the library marks NBS82 Fe²⁺ as recalled
    expect(md).toContain(CAUTION_6);
    expect(md).toMatch(/screening aid\. Decisions follow the applicable codes and standards/);
    // Conditions: neutral pH of water at 25 °C is 7.00 (pKw 13.99, IAPWS R11-07, recalled from memory).
    expect(md).toContain('| Neutral pH | 7.00 at 25 °C |');
    // The title is escaped, never raw markup.
    expect(md).not.toContain('<script');
    expect(md).toContain('# &lt;script&gt;alert(1)&lt;/script&gt;');
  });

  it('is deterministic: the same input gives the same bytes (document and figure)', async () => {
    const a = await report('d1/r.md');
    const b = await report('d2/r.md');
    expect(readFileSync(a, 'utf8')).toBe(readFileSync(b, 'utf8'));
    expect(readFileSync(join(dir, 'd1', 'r.svg'), 'utf8')).toBe(readFileSync(join(dir, 'd2', 'r.svg'), 'utf8'));
  });
});

describe('report (HTML)', () => {
  it('is self-contained, escapes user text and holds reactions, verdicts, sources and cautions', async () => {
    const html = readFileSync(await report('h/report.html'), 'utf8');
    expect(html).toMatch(/^<!DOCTYPE html>/);
    expect(html).toContain('<svg ');
    expect(html.toLowerCase()).not.toContain('<script');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).not.toMatch(/https?:\/\//);
    expect(html).not.toMatch(/\b(src|href)=/);
    for (const r of reactions) expect(html).toContain(`<code>${r}</code>`);
    for (const [label, verdict] of EXPECTED) {
      expect(html).toMatch(new RegExp(`<td>${label}</td>.*<span class="${verdict}">${verdict}</span>`));
    }
    expect(html).toContain(NBS);
    expect(html).toContain(CAUTION_6);
  });

  it('is deterministic', async () => {
    const a = readFileSync(await report('h1/r.html'), 'utf8');
    const b = readFileSync(await report('h2/r.html'), 'utf8');
    expect(a).toBe(b);
  });
});

const hasPdftotext = spawnSync('pdftotext', ['-v']).error === undefined;
if (!hasPdftotext) console.warn('skipping the PDF text checks: pdftotext (poppler-utils) not found');

describe('report (PDF)', () => {
  it('writes a PDF with the figure drawn as vectors', async () => {
    const out = await report('p/report.pdf');
    const bytes = readFileSync(out);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // The figure is drawn as vectors, not embedded as an image.
    expect(bytes.includes(Buffer.from('/Subtype /Image'))).toBe(false);
    // Text in the bundled font, embedded (issue 17): no standard (unembedded) Helvetica.
    expect(bytes.includes(Buffer.from('DejaVuSans'))).toBe(true);
    expect(bytes.includes(Buffer.from('/FontFile2'))).toBe(true);
    expect(bytes.includes(Buffer.from('Helvetica'))).toBe(false);
  });

  // Reason for skipping: pdftotext (poppler-utils) is not installed; .ci/run installs it.
  it.skipIf(!hasPdftotext)('carries the same content as text (read back with pdftotext)', async () => {
    const out = await report('p/report.pdf');
    const text = squash(execFileSync('pdftotext', ['-enc', 'UTF-8', out, '-'], { encoding: 'utf8' }));
    expect(text).toContain('V vs SHE'); // the figure's axis title is text in the PDF
    for (const r of reactions) expect(text).toContain(squash(r)); // Unicode as written: the font is embedded
    // Table row: label, pH, E as given, E vs SHE, predominant species, verdict.
    for (const [label, verdict] of EXPECTED) expect(text).toMatch(new RegExp(`${label} \\S+ \\S+ V vs SHE \\S+ \\S+ ${verdict.toUpperCase()} `));
    expect(text).toContain(squash(NBS));
    expect(text).toContain(CAUTION_6);
  });

  it('is deterministic (fixed creation date)', async () => {
    const a = readFileSync(await report('p1/r.pdf'));
    const b = readFileSync(await report('p2/r.pdf'));
    expect(a.equals(b)).toBe(true);
  });
});

describe('report: bad input', () => {
  it('an unknown key in the system file: exit 2, names the field, writes nothing', async () => {
    const bad = writeTmp(dir, 'bad.yaml', 'element: Fe\ntemprature: 90\n');
    const out = join(dir, 'bad', 'report.md');
    const r = await runCli(['report', bad, '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('temprature');
    expect(existsSync(out)).toBe(false);
    expect(existsSync(join(dir, 'bad', 'report.svg'))).toBe(false);
  });

  it('an unsupported output extension: exit 2, writes nothing', async () => {
    const out = join(dir, 'bad2', 'report.docx');
    const r = await runCli(['report', fe, '-o', out]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--output');
    expect(existsSync(out)).toBe(false);
  });
});


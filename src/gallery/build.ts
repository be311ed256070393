/**
 * `npm run gallery`: rebuild every scenario in gallery/ (system file → SVG and PDF) and the gallery's
 * README.md with thumbnails and one sentence each (the first comment line of the system file).
 * Deterministic: the same files give byte-identical outputs. Progress goes to standard error.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { writeOutput } from '../io/safe-write.js';
import { figureInput } from '../figure/compose.js';
import { figureSettings } from '../figure/options.js';
import { renderFigure } from '../figure/output.js';
import { computeAny, loadSpec } from '../pipeline.js';
import { exitStatusOf } from '../errors.js';
import { computeAlloy } from '../diagram/alloy.js';
import { alloyFigureInput } from '../figure/alloy.js';
import type { FigureInput } from '../render/scene.js';
import { isAlloyData, readAlloySpec } from '../system/alloy-spec.js';
import { readSystemFile } from '../system/read.js';

function bar(done: number, total: number, name: string): void {
  const width = 24;
  const k = Math.round((done / total) * width);
  const line = `[${'#'.repeat(k)}${'.'.repeat(width - k)}] ${done}/${total} ${name}`;
  if (process.stderr.isTTY) process.stderr.write(`\r${line.padEnd(70)}`);
  else process.stderr.write(`${line}\n`);
}

/** First comment line after "# Invented scenario:" / "# Invented bath:" etc., as one sentence. */
export function describe(text: string): string {
  const lines = text.split('\n').filter((l) => l.startsWith('#')).map((l) => l.replace(/^#\s?/, ''));
  const para = lines.join(' ').replace(/\s+/g, ' ').trim();
  const first = para.split(/(?<=\.)\s/)[0] ?? para;
  return first;
}

export async function buildGallery(dir: string): Promise<string[]> {
  const files = readdirSync(dir).filter((f) => /\.ya?ml$/.test(f)).sort();
  const entries: { name: string; title: string; text: string }[] = [];
  let n = 0;
  for (const f of files) {
    const path = join(dir, f);
    const name = basename(f).replace(/\.ya?ml$/, '');
    bar(n, files.length, name);
    // Alloy files (elements) through the alloy kind; every other file through the pipeline.
    const data = readSystemFile(path);
    let input: FigureInput;
    let title: string | undefined;
    if (isAlloyData(data)) {
      const spec = readAlloySpec(data, path);
      input = alloyFigureInput(computeAlloy(spec).model, spec, figureSettings(spec.base));
      title = spec.base.title;
    } else {
      const spec = loadSpec(path);
      input = figureInput(computeAny(spec), figureSettings(spec));
      title = spec.title;
    }
    await writeOutput(join(dir, `${name}.svg`), await renderFigure(input, 'svg'), { makeDirs: false });
    await writeOutput(join(dir, `${name}.pdf`), await renderFigure(input, 'pdf'), { makeDirs: false });
    entries.push({ name, title: title ?? name, text: describe(readFileSync(path, 'utf8')) });
    n++;
  }
  bar(n, files.length, 'done');
  if (process.stderr.isTTY) process.stderr.write('\n');
  const md = [
    '# Gallery',
    '',
    'Scenarios of our own invention — plants, streams and baths made up to show what ephmap does; their numbers are not',
    'measurements. Each has its system file (`.yaml`), the figure as SVG and PDF. Rebuild all with `npm run gallery`.',
    '',
    '> Equilibrium thermodynamics only — not kinetics. These figures are screening aids; decisions follow the applicable codes and',
    '> standards and the judgement of a qualified corrosion or plating professional.',
    '',
    ...entries.flatMap((e) => [
      `## ${e.title}`,
      '',
      `${e.text} — [system file](${e.name}.yaml) · [SVG](${e.name}.svg) · [PDF](${e.name}.pdf)`,
      '',
      `<img src="${e.name}.svg" alt="${e.title}" width="420">`,
      '',
    ]),
  ].join('\n');
  await writeOutput(join(dir, 'README.md'), md, { makeDirs: false });
  return entries.map((e) => e.name);
}

const dir = process.argv[2] ?? 'gallery';
buildGallery(dir).then(
  (names) => process.stdout.write(`gallery: ${names.length} scenarios rebuilt in ${dir}/\n`),
  (e) => {
    process.stderr.write(`\ngallery: ${(e as Error)?.message ?? String(e)}\n`);
    process.exitCode = exitStatusOf(e);
  },
);

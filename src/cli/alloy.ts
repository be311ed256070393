/**
 * The alloy kind in the verbs that read a system file (issue 18): draw, probe, lines and report
 * detect a file with `elements` here and answer it; every other file goes on as before. Also the
 * composition sweep of `draw --vary Cr=0.05,0.12,0.18` (the other elements keep their proportions).
 */
import { basename, dirname, extname, join } from 'node:path';
import { alloyProbe } from '../analysis/alloy-probe.js';
import { alloyName, computeAlloy } from '../diagram/alloy.js';
import { buildAlloySystem } from '../system/alloy-build.js';
import { alloyCaption, alloyFigureInput, compositionText } from '../figure/alloy.js';
import { type FigureOverrides, figureSettings, figureSettingsWidth } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { writeOne, writeSet } from './outputs.js';
import { alloyProbeText, alloyReportHtml, alloyReportMarkdown } from '../report/alloy-text.js';
import { stableJson } from '../report/json.js';
import { activityRows, linesText, lineRows } from '../report/lines.js';
import { type AlloySpec, isAlloyData, readAlloySpec } from '../system/alloy-spec.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readSystemFile } from '../system/read.js';
import { T_RANGE } from '../system/spec.js';
import { numberArg } from './args.js';
import type { SpecOverrides } from './spec-options.js';

function warn(ws: readonly string[]): void {
  for (const w of ws) process.stderr.write(`warning: ${w}\n`);
}

/** The file's alloy spec with the what-if options applied, or null when the file has no `elements`. */
export function loadAlloyWith(path: string, o: SpecOverrides): AlloySpec | null {
  const data = readSystemFile(path);
  if (!isAlloyData(data)) return null;
  const f = new Fields('command line');
  const d = { ...(data as Record<string, unknown>) };
  if (o.temperature !== undefined) d.temperature = f.number(Number(o.temperature), '--temperature', { min: T_RANGE.min, max: T_RANGE.max });
  if (o.activity !== undefined) d.activity = f.number(Number(o.activity), '--activity', { positive: true, max: 100 });
  if (o.metastable) d.metastable = true;
  return readAlloySpec(d, path);
}

/** `--vary El=x1,x2,…`: compositions with El at each fraction, the others scaled to fill the rest. */
export function sweepCompositions(spec: AlloySpec, text: string): { label: string; composition: Record<string, number> }[] {
  const m = /^([A-Z][a-z]?)=(.+)$/.exec(text.trim());
  const expect = 'El=x1,x2,… with El one of the alloy\'s elements and each x a mole fraction between 0 and 1, e.g. Cr=0.05,0.12,0.18';
  if (!m || spec.composition[m[1]] === undefined) throw new InputError('command line', '--vary', expect, JSON.stringify(text));
  const el = m[1];
  const others = Object.keys(spec.composition).filter((e) => e !== el);
  const rest = others.reduce((s, e) => s + spec.composition[e], 0);
  return m[2].split(',').map((s) => {
    const x = numberArg(s.trim(), '--vary', expect);
    if (!(x > 0 && (x < 1 || (x === 1 && others.length === 0)))) throw new InputError('command line', '--vary', expect, JSON.stringify(s));
    const composition: Record<string, number> = {};
    for (const e of Object.keys(spec.composition)) composition[e] = e === el ? x : (spec.composition[e] / rest) * (1 - x);
    return { label: `${el} ${(100 * x).toFixed(x < 0.1 ? 1 : 0)} %: ${compositionText(composition)}`, composition };
  });
}

export async function drawAlloy(spec: AlloySpec, opts: FigureOverrides & { output: string; vary?: string; ref?: string }, ext: string): Promise<void> {
  if (opts.ref !== undefined) throw new InputError('command line', '--ref', 'no --ref with an alloy file yet (set operating.reference in the file for the marks)');
  const fig = figureSettings(spec.base, opts);
  const c = computeAlloy(spec);
  const sweep = opts.vary === undefined ? [] : sweepCompositions(spec, opts.vary).map((s) => ({ label: s.label, model: computeAlloy({ ...spec, composition: s.composition }).model }));
  warn([...c.model.warnings, ...sweep.flatMap((s) => s.model.warnings)]);
  const json = () => stableJson(sweep.length ? { ...c.model, sweep: sweep.map((s) => ({ label: s.label, composition: s.model.alloy!.composition, regions: s.model.regions, boundaries: s.model.boundaries })) } : c.model);
  const data = ext === 'json' ? json() : await renderFigure(alloyFigureInput(c.model, spec, fig, sweep), ext as FigureFormat);
  await writeOne(opts.output, data);
  process.stdout.write(`wrote ${opts.output}\n`);
}

export function linesAlloy(spec: AlloySpec, json: boolean): void {
  const c = computeAlloy(spec);
  warn(c.model.warnings);
  const m = c.model;
  if (json) process.stdout.write(stableJson({ element: m.element, alloy: m.alloy, temperature: m.temperature, units: m.units, lines: lineRows(m), waterLines: m.waterLines, activities: activityRows(m) }));
  else process.stdout.write(linesText(m));
}

export function probeAlloy(spec: AlloySpec, pH: number, E: number, json: boolean): void {
  const built = buildAlloySystem(spec);
  warn(built.warnings);
  const r = alloyProbe(built.input, pH, E);
  process.stdout.write(json ? stableJson({ alloy: alloyName(spec.composition), ...r }) : alloyProbeText(r));
}

export async function reportAlloy(spec: AlloySpec, output: string, fmt: string): Promise<void> {
  if (fmt === 'pdf') throw new InputError('command line', '--output', 'a .md or .html report for an alloy file (no .pdf report for alloys yet; draw a .pdf figure instead)', JSON.stringify(output));
  const fig = figureSettingsWidth(spec.base, {}, '160mm');
  const c = computeAlloy(spec);
  warn(c.model.warnings);
  const caption = alloyCaption(c.model);
  const input = alloyFigureInput(c.model, spec, fig);
  input.options = { ...input.options, show: { ...input.options.show, caption: false } };
  const svg = (await renderFigure(input, 'svg')) as string;
  if (fmt === 'md') {
    const svgName = `${basename(output, extname(output))}.svg`;
    const svgPath = join(dirname(output), svgName);
    await writeSet([{ path: svgPath, data: svg }, { path: output, data: alloyReportMarkdown(c.model, svgName, caption) }]);
    process.stdout.write(`wrote ${output} and ${svgPath}\n`);
    return;
  }
  await writeOne(output, alloyReportHtml(c.model, svg, caption));
  process.stdout.write(`wrote ${output}\n`);
}

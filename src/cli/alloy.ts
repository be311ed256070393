/**
 * The alloy kind in the verbs that read a system file (issue 18): draw, probe, lines and report
 * detect a file with `elements` here and answer it; every other file goes on as before. Also the
 * composition sweep of `draw --vary Cr=0.05,0.12,0.18` (the other elements keep their proportions).
 */
import { basename, dirname, extname, join } from 'node:path';
import { alloyProbe } from '../analysis/alloy-probe.js';
import { textForPeople } from '../chem/present.js';
import { type DisplayedReference, displayReference, toShe } from '../analysis/points.js';
import type { DiagramModel } from '../model.js';
import { alloyName, computeAlloy } from '../diagram/alloy.js';
import { buildAlloySystem } from '../system/alloy-build.js';
import { alloyCaption, alloyFigureInput, compositionText } from '../figure/alloy.js';
import { type FigureOverrides, type FigureSettings, figureSettings, figureSettingsWidth } from '../figure/options.js';
import { type FigureFormat, renderFigure } from '../figure/output.js';
import { buildScene } from '../render/scene.js';
import { writeOne, writeSet } from './outputs.js';
import { alloyProbeText, alloyReportHtml, alloyReportMarkdown } from '../report/alloy-text.js';
import { alloyOperating } from '../report/alloy-operating.js';
import { stableJson } from '../report/json.js';
import { activityRows, linesText, lineRows } from '../report/lines.js';
import { type AlloySpec, isAlloyData, readAlloySpec } from '../system/alloy-spec.js';
import { InputError } from '../system/errors.js';
import { Fields } from '../system/fields.js';
import { readReference } from '../system/operating.js';
import { readSystemFile } from '../system/read.js';
import { T_RANGE } from '../system/spec.js';
import { numberArg } from './args.js';
import type { SpecOverrides } from './spec-options.js';

/** Warnings on standard error, as text for people (Cu²⁺, Zn(OH)₂(aq)). */
function warn(ws: readonly string[]): void {
  for (const w of ws) process.stderr.write(`warning: ${textForPeople(w)}\n`);
}

/**
 * The reference electrode potentials are also shown against: `--ref` when given, else the file's
 * `reference:` (none for SHE; the RHE, which moves with pH, only where the file gives it, then
 * left out as for one element), at the diagram temperature. A bad name: InputError naming --ref.
 */
export function alloyReference(spec: AlloySpec, ref: string | undefined): DisplayedReference | undefined {
  if (ref !== undefined) return displayReference(readReference(new Fields('command line'), ref, '--ref'), spec.base.temperature, 'command line', '--ref');
  const own = spec.base.operating.reference;
  if (own === undefined || own === 'she' || own === 'rhe') return undefined;
  return displayReference(own, spec.base.temperature, spec.base.file, 'reference');
}

/** The reference on the model (its `reference` key, its warnings) and as the figure's second axis. */
function withReference(model: DiagramModel, fig: FigureSettings | null, r: DisplayedReference | undefined): void {
  if (!r) return;
  model.reference = { id: r.id, label: r.label, offset: r.offset };
  model.warnings.push(...r.warnings.filter((w) => !model.warnings.includes(w)));
  if (fig) fig.options.secondAxis = { label: `E / V vs ${r.label}`, offset: r.offset };
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
  const ref = alloyReference(spec, opts.ref);
  const fig = figureSettings(spec.base, opts);
  const c = computeAlloy(spec);
  withReference(c.model, fig, ref);
  const sweep = opts.vary === undefined ? [] : sweepCompositions(spec, opts.vary).map((s) => ({ label: s.label, model: computeAlloy({ ...spec, composition: s.composition }).model }));
  warn([...c.model.warnings, ...sweep.flatMap((s) => s.model.warnings)]);
  const json = () => stableJson(sweep.length ? { ...c.model, sweep: sweep.map((s) => ({ label: s.label, composition: s.model.alloy!.composition, regions: s.model.regions, boundaries: s.model.boundaries })) } : c.model);
  const data = ext === 'json' ? json() : await renderFigure(alloyFigureInput(c.model, spec, fig, sweep), ext as FigureFormat);
  await writeOne(opts.output, data);
  process.stdout.write(`wrote ${opts.output}\n`);
}

export function linesAlloy(spec: AlloySpec, json: boolean, refName?: string): void {
  const ref = alloyReference(spec, refName);
  const c = computeAlloy(spec);
  withReference(c.model, null, ref);
  warn(c.model.warnings);
  const m = c.model;
  const reference = ref ? { reference: { id: ref.id, label: ref.label, offset: ref.offset } } : {};
  if (json) process.stdout.write(stableJson({ element: m.element, alloy: m.alloy, temperature: m.temperature, units: m.units, ...reference, lines: lineRows(m, ref), waterLines: m.waterLines, activities: activityRows(m), warnings: m.warnings }));
  else process.stdout.write(linesText(m, ref));
}

/**
 * One point: the potential is given vs `--ref`, else vs the file's `reference:`, else vs SHE, and
 * converted to SHE at the file's temperature (and the point's pH, for the RHE). `output`: the
 * JSON answer written there instead of printed.
 */
export async function probeAlloy(spec: AlloySpec, pH: number, E: number, o: { json: boolean; ref?: string; output?: string }): Promise<void> {
  const ref = o.ref !== undefined ? readReference(new Fields('command line'), o.ref, '--ref') : spec.base.operating.reference;
  const s = toShe(ref, E, spec.base.temperature, pH, o.ref !== undefined ? 'command line' : spec.base.file, o.ref !== undefined ? '--ref' : 'reference');
  const built = buildAlloySystem(spec);
  warn([...built.warnings, ...s.warnings]);
  const r = alloyProbe(built.input, pH, s.E, s.ref);
  if (o.output !== undefined) {
    await writeOne(o.output, stableJson({ alloy: alloyName(spec.composition), ...r }));
    process.stdout.write(`wrote ${o.output}\n`);
  } else process.stdout.write(o.json ? stableJson({ alloy: alloyName(spec.composition), ...r }) : alloyProbeText(r));
}

export async function reportAlloy(spec: AlloySpec, output: string, fmt: string, figOpts: FigureOverrides = {}, refName?: string): Promise<void> {
  const ref = alloyReference(spec, refName);
  const fig = figureSettingsWidth(spec.base, figOpts, '160mm');
  const c = computeAlloy(spec);
  withReference(c.model, fig, ref);
  warn(c.model.warnings);
  const caption = alloyCaption(c.model);
  const input = alloyFigureInput(c.model, spec, fig);
  input.options = { ...input.options, show: { ...input.options.show, caption: false } };
  // The file's operating points, boxes and paths, answered by the point solver as probe does.
  const refWarnings: string[] = [];
  const operating = alloyOperating(spec.base.operating, spec.base.temperature, c.built.input, refWarnings);
  warn(refWarnings.filter((w) => !c.model.warnings.includes(w)));
  if (fmt === 'pdf') {
    // Vector figure; its caption is printed under it by the report.
    const { alloyReportPdf } = await import('../report/alloy-pdf.js');
    await writeOne(output, await alloyReportPdf(c.model, buildScene(input), { width: fig.options.width, height: fig.options.height }, caption, operating));
    process.stdout.write(`wrote ${output}\n`);
    return;
  }
  const svg = (await renderFigure(input, 'svg')) as string;
  if (fmt === 'md') {
    const svgName = `${basename(output, extname(output))}.svg`;
    const svgPath = join(dirname(output), svgName);
    await writeSet([{ path: svgPath, data: svg }, { path: output, data: alloyReportMarkdown(c.model, svgName, caption, operating) }]);
    process.stdout.write(`wrote ${output} and ${svgPath}\n`);
    return;
  }
  await writeOne(output, alloyReportHtml(c.model, svg, caption, operating));
  process.stdout.write(`wrote ${output}\n`);
}

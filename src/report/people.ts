/**
 * The report content re-spelled for people: every formula in Unicode (Fe²⁺, Fe₃O₄), every reaction
 * with ⇌, warnings and notes with their formulas re-spelled (chem/present.ts). The computed data
 * (and so JSON) keep the canonical ASCII form; the Markdown, HTML and PDF writers call
 * reportForPeople first. Computes nothing.
 */
import type { Crossing, ProbeResult } from '../analysis/probe.js';
import type { WindowResult } from '../analysis/window.js';
import { labelForPeople as fp, reactionForPeople as rp, textForPeople as tp } from '../chem/present.js';
import type { ReportData } from './report-data.js';

const pair = (b: [string, string]): [string, string] => [fp(b[0]), fp(b[1])];
const crossing = (c: Crossing | null): Crossing | null => (c ? { ...c, to: fp(c.to), between: pair(c.between), reaction: rp(c.reaction) } : null);

/**
 * The probe's advice for people: the species it names ("… reaches Fe3O4 (passivation)", a crossing's
 * `to`) re-spelled exactly ("Fe₃O₄"), then any charged formula in the rest (textForPeople).
 */
export function adviceForPeople(r: ProbeResult): string {
  let a = r.advice;
  for (const x of Object.values(r.crossings)) if (x) a = a.replace(`reaches ${x.to} (`, `reaches ${fp(x.to)} (`);
  return tp(a);
}

/** A probe answer with its formulas, reactions, advice and warnings for people. */
export function probeForPeople(r: ProbeResult): ProbeResult {
  const c = r.crossings;
  return {
    ...r,
    predominant: fp(r.predominant),
    runnerUp: r.runnerUp === null ? null : fp(r.runnerUp),
    crossings: { raiseE: crossing(c.raiseE), lowerE: crossing(c.lowerE), lowerPH: crossing(c.lowerPH), raisePH: crossing(c.raisePH) },
    nearestBoundary: r.nearestBoundary ? { ...r.nearestBoundary, between: pair(r.nearestBoundary.between), reaction: rp(r.nearestBoundary.reaction) } : null,
    advice: adviceForPeople(r),
    warnings: r.warnings.map(tp),
  };
}

/** A plating-window answer for people. */
export function windowForPeople(w: WindowResult): WindowResult {
  return {
    ...w,
    windows: w.windows.map((x) => ({
      ...x,
      dissolved: x.dissolved.map(fp),
      boundedBy: { low: x.boundedBy.low === null ? null : fp(x.boundedBy.low), high: x.boundedBy.high === null ? null : fp(x.boundedBy.high) },
    })),
    firstSolid: w.firstSolid ? { ...w.firstSolid, species: fp(w.firstSolid.species) } : null,
    notes: w.notes.map(tp),
    warnings: w.warnings.map(tp),
  };
}

/** The whole report content for people (see the module comment). */
export function reportForPeople(d: ReportData): ReportData {
  return {
    ...d,
    activities: d.activities.map((a) => ({ ...a, formula: fp(a.formula) })),
    lines: d.lines.map((l) => ({ ...l, between: pair(l.between), ligandSpecies: l.ligandSpecies.map(fp), reaction: rp(l.reaction) })),
    waterLines: d.waterLines.map((w) => ({ ...w, reaction: rp(w.reaction) })),
    points: d.points.map((p) => ({ ...p, result: probeForPeople(p.result) })),
    ...(d.speciation
      ? {
          speciation: {
            ...d.speciation,
            intro: tp(d.speciation.intro),
            rows: d.speciation.rows.map((r) => r.map(fp)),
            details: d.speciation.details.map((x) => ({ ...x, label: tp(x.label), rows: x.rows.map((r) => r.map(fp)) })),
          },
        }
      : {}),
    envelopes: d.envelopes.map((e) => ({ ...e, samples: e.samples.map((s) => ({ ...s, predominant: fp(s.predominant) })) })),
    window: d.window ? windowForPeople(d.window) : null,
    species: d.species.map((s) => ({ ...s, formula: fp(s.formula) })),
    warnings: d.warnings.map(tp),
  };
}

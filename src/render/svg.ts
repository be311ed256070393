/**
 * Scene → SVG 1.1 text. Deterministic: numbers are written with fixed decimals and attributes in
 * a fixed order, so the same scene always gives a byte-identical string. Units are pt (viewBox)
 * with the physical size in mm on the root element.
 */
import { runRise, runSize } from './metrics.js';
import type { Scene, SceneItem, ScenePath, SceneText } from './scene-types.js';

/** Number with at most `d` decimals, trailing zeros dropped, never "-0". */
export function num(v: number, d = 2): string {
  if (!Number.isFinite(v)) throw new Error(`svg: non-finite number ${v}`);
  let s = v.toFixed(d);
  if (s.includes('.')) s = s.replace(/0+$/, '').replace(/\.$/, '');
  if (s === '-0') s = '0';
  return s;
}

/** Escapes text for XML content and attribute values. */
export function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

function dataAttrs(data?: Record<string, string>): string {
  if (!data) return '';
  return Object.keys(data)
    .sort()
    .map((k) => ` data-${k}="${esc(data[k]!)}"`)
    .join('');
}

function pathD(p: ScenePath): string {
  const parts: string[] = [];
  for (const sp of p.subpaths) {
    if (sp.points.length === 0) continue;
    const [first, ...rest] = sp.points;
    let d = `M${num(first![0])} ${num(first![1])}`;
    for (const q of rest) d += `L${num(q[0])} ${num(q[1])}`;
    if (sp.closed) d += 'Z';
    parts.push(d);
  }
  return parts.join('');
}

function pathEl(p: ScenePath): string {
  const d = pathD(p);
  if (!d) return '';
  let a = `<path class="${esc(p.role)}" d="${d}"`;
  a += ` fill="${p.fill ? esc(p.fill) : 'none'}"`;
  if (p.fill && p.fillRule === 'evenodd') a += ' fill-rule="evenodd"';
  if (p.stroke) {
    a += ` stroke="${esc(p.stroke)}" stroke-width="${num(p.strokeWidth, 3)}"`;
    if (p.dash) a += ` stroke-dasharray="${p.dash.map((x) => num(x, 3)).join(' ')}"`;
    if (p.lineCap && p.lineCap !== 'butt') a += ` stroke-linecap="${p.lineCap}"`;
    if (p.lineJoin && p.lineJoin !== 'miter') a += ` stroke-linejoin="${p.lineJoin}"`;
  }
  return `${a}${dataAttrs(p.data)}/>`;
}

function textEl(t: SceneText): string {
  let a = `<text class="${esc(t.role)}" x="${num(t.x)}" y="${num(t.y)}" font-size="${num(t.size, 3)}"`;
  if (t.anchor !== 'start') a += ` text-anchor="${t.anchor}"`;
  if (t.bold) a += ' font-weight="bold"';
  if (t.fill !== '#000000') a += ` fill="${esc(t.fill)}"`;
  if (t.rotate !== 0) a += ` transform="rotate(${num(t.rotate, 3)} ${num(t.x)} ${num(t.y)})"`;
  a += `${dataAttrs(t.data)}>`;
  const simple = t.runs.length === 1 && t.runs[0]!.shift === 'normal';
  if (simple) {
    const r = t.runs[0]!;
    return r.italic ? `${a}<tspan font-style="italic">${esc(r.text)}</tspan></text>` : `${a}${esc(r.text)}</text>`;
  }
  let rise = 0;
  let body = '';
  for (const r of t.runs) {
    const target = runRise(r, t.size);
    const dy = rise - target; // SVG y grows downwards
    rise = target;
    let s = '<tspan';
    if (Math.abs(dy) > 1e-9) s += ` dy="${num(dy, 3)}"`;
    if (r.shift !== 'normal') s += ` font-size="${num(runSize(r, t.size), 3)}"`;
    if (r.italic) s += ' font-style="italic"';
    body += `${s}>${esc(r.text)}</tspan>`;
  }
  return `${a}${body}</text>`;
}

/** Serialises a scene to an SVG document string (UTF-8, no XML declaration needed). */
export function sceneToSvg(scene: Scene): string {
  const out: string[] = [];
  let clipN = 0;
  const defs: string[] = [];
  const walk = (items: readonly SceneItem[], indent: string): void => {
    for (const it of items) {
      if (it.type === 'path') {
        const s = pathEl(it);
        if (s) out.push(indent + s);
      } else if (it.type === 'text') {
        out.push(indent + textEl(it));
      } else if (it.type === 'circle') {
        let a = `<circle class="${esc(it.role)}" cx="${num(it.cx)}" cy="${num(it.cy)}" r="${num(it.r, 3)}" fill="${it.fill ? esc(it.fill) : 'none'}"`;
        if (it.stroke) a += ` stroke="${esc(it.stroke)}" stroke-width="${num(it.strokeWidth, 3)}"`;
        out.push(`${indent}${a}${dataAttrs(it.data)}/>`);
      } else {
        let open = `<g class="${esc(it.role)}"`;
        if (it.clip) {
          const id = `ephmap-clip-${++clipN}`;
          defs.push(
            `<clipPath id="${id}"><rect x="${num(it.clip.x)}" y="${num(it.clip.y)}" width="${num(it.clip.w)}" height="${num(it.clip.h)}"/></clipPath>`,
          );
          open += ` clip-path="url(#${id})"`;
        }
        out.push(`${indent}${open}>`);
        walk(it.children, indent + '  ');
        out.push(`${indent}</g>`);
      }
    }
  };
  walk(scene.items, '  ');
  const head = [
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${num(scene.widthMm)}mm" height="${num(scene.heightMm)}mm" viewBox="0 0 ${num(scene.widthPt)} ${num(scene.heightPt)}" font-family="${esc(scene.fontFamily)}">`,
    `  <title>${esc(scene.title)}</title>`,
  ];
  if (scene.caption !== undefined) head.push(`  <desc>${esc(scene.caption)}</desc>`);
  if (defs.length) head.push(`  <defs>${defs.join('')}</defs>`);
  head.push(`  <rect class="background" x="0" y="0" width="${num(scene.widthPt)}" height="${num(scene.heightPt)}" fill="${esc(scene.background)}"/>`);
  return [...head, ...out, '</svg>', ''].join('\n');
}

/**
 * Read a system file as plain data: JSON or YAML by extension, with limits so that hostile input
 * (alias bombs, deep nesting, huge files, binary data, duplicate keys) is refused with an InputError
 * naming the file and, where one can be told, the field.
 */
import { readFileSync, type Stats, statSync } from 'node:fs';
import { extname } from 'node:path';
import { parseDocument } from 'yaml';
import { InputError } from './errors.js';
import { FORBIDDEN_KEYS } from './fields.js';

const MAX_BYTES = 4 * 1024 * 1024;
/**
 * YAML only: at most this many lines plus commas before parsing. The YAML parser's time and
 * memory grow faster than linearly with the number of nodes (a 3.8 MB flow list took 46 s and
 * 1.9 GB); a system file within every documented limit needs a few tens of thousands.
 */
export const MAX_YAML_ITEMS = 50_000;
const MAX_DEPTH = 32;
const NESTING = `nesting at most ${MAX_DEPTH} levels deep`;

export function readSystemFile(path: string): unknown {
  let text: string;
  try {
    const st = statSync(path);
    if (!st.isFile()) throw new InputError(path, '', 'a readable system file (.json, .yaml or .yml)', kindOf(st));
    if (st.size > MAX_BYTES) throw new InputError(path, '', `a system file under ${MAX_BYTES / 1048576} MiB`, `${st.size} bytes`);
    text = readFileSync(path, 'utf8');
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException)?.code;
    const got = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'a file without read permission' : 'a file that cannot be read';
    throw new InputError(path, '', 'a readable system file (.json, .yaml or .yml)', got);
  }
  return parseSystemText(text, path);
}

/** What a path that is not a regular file is, in plain words (never opened: a FIFO would block). */
function kindOf(st: Stats): string {
  if (st.isDirectory()) return 'a directory';
  if (st.isFIFO()) return 'a named pipe (FIFO)';
  if (st.isCharacterDevice()) return 'a character device (such as /dev/zero)';
  if (st.isBlockDevice()) return 'a block device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

/** Parses the text of a system file; `path` gives the format (by extension) and names the file in messages. */
export function parseSystemText(text: string, path: string): unknown {
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.includes('\u0000') || text.includes('\ufffd')) {
    throw new InputError(path, '', 'UTF-8 text (JSON or YAML)', 'binary data');
  }
  if (text.trim() === '') throw new InputError(path, '', 'a system description with at least `element`', 'an empty file');
  if (text.length > MAX_BYTES) throw new InputError(path, '', `a system file under ${MAX_BYTES / 1048576} MiB`, `${text.length} characters`);
  const ext = extname(path).toLowerCase();
  let data: unknown;
  if (ext === '.json') {
    try {
      data = JSON.parse(text);
    } catch (e) {
      throw new InputError(path, '', 'valid JSON', (e as Error).message);
    }
    const dup = duplicateJsonKey(text);
    if (dup) throw new InputError(path, dup, 'each key once in an object', 'the key a second time');
  } else if (ext === '.yaml' || ext === '.yml') {
    // Line ends: CR LF and a lone CR (old Mac files) both end a line.
    text = text.replace(/\r\n?/g, '\n');
    const items = countItems(text);
    if (items > MAX_YAML_ITEMS) throw new InputError(path, '', `a YAML file of at most ${MAX_YAML_ITEMS} lines and list items (lines plus commas)`, `${items}`);
    const deep = deepFlow(text);
    if (deep !== null) throw new InputError(path, deep, NESTING, 'deeper nesting');
    let doc: ReturnType<typeof parseDocument>;
    try {
      doc = parseDocument(text, { uniqueKeys: true, prettyErrors: false });
    } catch (e) {
      if (e instanceof RangeError) throw new InputError(path, '', NESTING, 'deeper nesting');
      throw new InputError(path, '', 'valid YAML', String((e as Error)?.message ?? e).split('\n')[0]);
    }
    if (doc.errors.length > 0) {
      const err = doc.errors[0]!;
      if (/call stack/i.test(err.message)) throw new InputError(path, topKeyAt(text, err.pos?.[0] ?? 0), NESTING, 'deeper nesting');
      const line = err.linePos?.[0]?.line ?? (err.pos ? text.slice(0, err.pos[0]).split('\n').length : 0);
      throw new InputError(path, line ? `line ${line}` : '', 'valid YAML', err.message.split('\n')[0]);
    }
    const tag = doc.warnings.find((w) => w.code === 'TAG_RESOLVE_FAILED');
    if (tag) {
      const at = tag.pos?.[0] ?? 0;
      const name = /^!\S*/.exec(text.slice(at))?.[0] ?? 'a custom tag';
      throw new InputError(path, topKeyAt(text, at) || `line ${text.slice(0, at).split('\n').length}`, 'plain YAML values (no custom tags such as !!js/function or !Ref)', `the tag ${JSON.stringify(name)}`);
    }
    try {
      data = doc.toJS({ maxAliasCount: 50 });
    } catch (e) {
      if (e instanceof RangeError) throw new InputError(path, '', NESTING, 'deeper nesting');
      throw new InputError(path, '', 'YAML without excessive aliases', (e as Error).message.split('\n')[0]);
    }
  } else {
    throw new InputError(path, '', 'a file name ending in .json, .yaml or .yml', JSON.stringify(ext || '(none)'));
  }
  checkDepth(data, path, 0, '');
  return data;
}

/**
 * Walks the parsed data: the field path (e.g. `figure.a.a`) of the first value nested deeper than
 * MAX_DEPTH, or of the first key that is one of FORBIDDEN_KEYS, is refused.
 */
function checkDepth(v: unknown, path: string, depth: number, field: string): void {
  if (depth > MAX_DEPTH) throw new InputError(path, shorten(field), NESTING, 'deeper nesting');
  if (v && typeof v === 'object') {
    if (Array.isArray(v)) v.forEach((x, k) => checkDepth(x, path, depth + 1, `${field}[${k}]`));
    else {
      for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
        const at = field ? `${field}.${k}` : k;
        if (FORBIDDEN_KEYS.includes(k)) throw new InputError(path, shorten(at), `keys other than ${FORBIDDEN_KEYS.join(', ')}`, `the key ${JSON.stringify(k)}`);
        checkDepth(x, path, depth + 1, at);
      }
    }
  }
}

/** Long paths keep their first and last parts. */
function shorten(field: string): string {
  return field.length > 80 ? `${field.slice(0, 40)}…${field.slice(-20)}` : field;
}

/**
 * The path of the first key that appears twice in one object of a JSON text (which JSON.parse would
 * silently resolve to the last), or null. `text` must already be valid JSON.
 */
function duplicateJsonKey(text: string): string | null {
  type Frame = { obj: true; keys: Set<string>; key: string } | { obj: false; index: number };
  const stack: Frame[] = [];
  const path = (): string => {
    let s = '';
    for (const f of stack) {
      if (f.obj) s += s ? `.${f.key}` : f.key;
      else s += `[${f.index}]`;
    }
    return s;
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '"') {
      let j = i + 1;
      while (text[j] !== '"') j += text[j] === '\\' ? 2 : 1;
      const top = stack[stack.length - 1];
      let k = j + 1;
      while (k < text.length && /\s/.test(text[k]!)) k++;
      if (top?.obj && text[k] === ':') {
        const key = JSON.parse(text.slice(i, j + 1)) as string;
        top.key = key;
        if (top.keys.has(key)) return path();
        top.keys.add(key);
      }
      i = j;
    } else if (c === '{') stack.push({ obj: true, keys: new Set(), key: '' });
    else if (c === '[') stack.push({ obj: false, index: 0 });
    else if (c === '}' || c === ']') stack.pop();
    else if (c === ',') {
      const top = stack[stack.length - 1];
      if (top && !top.obj) top.index++;
    }
  }
  return null;
}

/** Lines plus commas of a text: an upper bound on the nodes a YAML parser builds from it. */
function countItems(text: string): number {
  let n = 1;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 10 || c === 44) n++;
  }
  return n;
}

/** The top-level YAML key (a line starting in column 0 with `key:`) at or before `offset`. */
function topKeyAt(text: string, offset: number): string {
  const before = text.slice(0, Math.max(0, Math.min(offset, text.length)) + 1);
  const keys = [...before.matchAll(/^([^\s#\-[{][^:\n]*):/gm)];
  return keys.length ? keys[keys.length - 1]![1]!.trim() : '';
}

/**
 * Before parsing YAML: the top-level key whose flow collections ([…], {…}) nest deeper than
 * MAX_DEPTH, or null. The YAML parser recurses on nesting, so very deep input is refused here.
 * Quoted scalars and comments are skipped; this is a bound, not a parser.
 */
function deepFlow(text: string): string | null {
  let depth = 0;
  let key = '';
  let lineStart = true;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (lineStart) {
      lineStart = false;
      const m = /^([^\s#\-[{][^:\n]*):/.exec(text.slice(i, i + 200));
      if (m && depth === 0) key = m[1]!.trim();
    }
    if (c === '\n') lineStart = true;
    else if (c === '#' && (i === 0 || /\s/.test(text[i - 1]!))) {
      while (i + 1 < text.length && text[i + 1] !== '\n') i++;
    } else if (c === '"' || (c === "'" && (i === 0 || /[\s[{,:]/.test(text[i - 1]!)))) {
      let j = i + 1;
      while (j < text.length && text[j] !== c) j += c === '"' && text[j] === '\\' ? 2 : 1;
      i = j;
    } else if (c === '[' || c === '{') {
      if (++depth > MAX_DEPTH) return key;
    } else if ((c === ']' || c === '}') && depth > 0) depth--;
  }
  return null;
}

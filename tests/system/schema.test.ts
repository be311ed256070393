/**
 * schema/system.schema.json (for editor completion of system files) stays in step with the loader:
 * the same top-level keys, every gallery file validates, and files the loader refuses for a wrong
 * type or an unknown key are refused by the schema too.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { FIGURE_KEYS } from '../../src/figure/options.js';
import { TOP_KEYS } from '../../src/system/spec.js';
import { type Schema, validate } from '../helpers/json-schema.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const schema = JSON.parse(readFileSync(join(root, 'schema/system.schema.json'), 'utf8')) as Schema;
const props = schema.properties as Record<string, Schema>;

describe('system file schema', () => {
  it('has exactly the loader keys', () => {
    expect(Object.keys(props).sort()).toEqual([...TOP_KEYS].sort());
    expect(Object.keys((props.figure as Schema).properties as object).sort()).toEqual([...FIGURE_KEYS].sort());
  });

  const gallery = join(root, 'gallery');
  it.each(readdirSync(gallery).filter((f) => f.endsWith('.yaml')))('gallery/%s validates', (f) => {
    expect(validate(parse(readFileSync(join(gallery, f), 'utf8')), schema, '$', schema)).toEqual([]);
  });

  it('refuses what the loader refuses (unknown key, wrong types, bad verdict)', () => {
    for (const bad of [{ element: 'Fe', colour: 'red' }, { element: 26 }, { element: 'Fe', pH: '0-14' }, { element: 'Fe', classes: { FeO: 'rusty' } }, {}]) {
      expect(validate(bad, schema, '$', schema)).not.toEqual([]);
    }
  });
});

/**
 * species/README.md lists every estimated temperature parameter; the table must be the one the code
 * generates. To regenerate after a data change: UPDATE_README=1 npx vitest run tests/data/estimated-table.test.ts
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadLibrary } from '../../src/data/library.js';
import { estimatedParameterTable, TABLE_BEGIN, TABLE_END } from '../../src/system/estimated-table.js';

const readme = new URL('../../species/README.md', import.meta.url);

describe('estimated-parameter table in species/README.md', () => {
  it('is in step with the code', () => {
    const text = readFileSync(readme, 'utf8');
    const table = estimatedParameterTable(loadLibrary());
    const i = text.indexOf(TABLE_BEGIN);
    const j = text.indexOf(TABLE_END);
    expect(i, 'README lacks the table markers').toBeGreaterThanOrEqual(0);
    const current = text.slice(i + TABLE_BEGIN.length, j).trim();
    if (process.env.UPDATE_README === '1' && current !== table) {
      writeFileSync(readme, `${text.slice(0, i + TABLE_BEGIN.length)}\n${table}\n${text.slice(j)}`);
      return;
    }
    expect(current).toBe(table);
  });
  it('lists every library species without S° or ΔfH° and every aqueous species without published HKF parameters', () => {
    const table = estimatedParameterTable(loadLibrary());
    for (const s of loadLibrary()) {
      const needs = (s.S === undefined && s.dfH === undefined) || (s.phase === 'aq' && !s.hkf);
      if (needs) expect(table, `${s.formula}(${s.phase})`).toContain(`| ${s.formula}(${s.phase}) |`);
    }
  });
});

/** The bounded cache of per-condition builds (analysis/row-conditions.ts conditionCache). */
import { describe, expect, it } from 'vitest';
import { conditionCache } from '../../src/analysis/row-conditions.js';

describe('conditionCache', () => {
  it('builds once per key and drops the least recently used beyond its size', () => {
    const built: number[] = [];
    const get = conditionCache((T: number) => (built.push(T), { T }), 3);
    const a = get(25);
    get(60);
    get(90);
    expect(get(25)).toBe(a); // a hit: the same value, not rebuilt, and now the most recent
    expect(built).toEqual([25, 60, 90]);
    get(120); // beyond 3: drops 60, the least recently used (25 was used after it)
    expect(built).toEqual([25, 60, 90, 120]);
    get(25);
    get(90);
    expect(built).toEqual([25, 60, 90, 120]);
    get(60); // dropped before: built again, dropping 120 (least recent of 25, 90, 120)
    expect(built).toEqual([25, 60, 90, 120, 60]);
    get(120);
    expect(built).toEqual([25, 60, 90, 120, 60, 120]);
  });

  it('keeps -0 and 0 as one temperature, as the text key did', () => {
    let n = 0;
    const get = conditionCache((T: number) => ++n + T);
    get(0);
    get(-0);
    expect(n).toBe(1);
  });
});

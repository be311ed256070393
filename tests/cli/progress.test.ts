/** The progress line of long row-by-row runs: only on a terminal, throttled, erased at the end. */
import { describe, expect, it } from 'vitest';
import { progressBar } from '../../src/cli/progress.js';

function fakeErr(isTTY: boolean): NodeJS.WriteStream & { text: string } {
  const s = { isTTY, text: '', write(t: string) { s.text += t; return true; } };
  return s as unknown as NodeJS.WriteStream & { text: string };
}

describe('progressBar', () => {
  it('writes nothing when standard error is not a terminal (a pipe or a log file)', () => {
    const err = fakeErr(false);
    let t = 0;
    const bar = progressBar(err, 1000, () => (t += 1000));
    bar.update(500, 10);
    bar.done();
    expect(err.text).toBe('');
  });

  it('on a terminal shows percent and rows at most five times a second, then erases itself', () => {
    const err = fakeErr(true);
    let t = 0;
    const bar = progressBar(err, 1000, () => t);
    t = 100;
    bar.update(100, 5); // too soon: nothing
    expect(err.text).toBe('');
    t = 300;
    bar.update(500, 20);
    expect(err.text).toMatch(/^\rpoints: \[#{15}\.{15}\] 50% 20 rows$/);
    bar.done();
    expect(err.text.endsWith('\r\x1b[K')).toBe(true);
  });
});

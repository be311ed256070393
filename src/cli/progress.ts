/**
 * A progress line on standard error for long row-by-row runs, only when standard error is a
 * terminal (never in a pipe or a log file): percent of the input read when its size is known,
 * else rows done; redrawn at most five times a second, erased at the end.
 */
export interface Progress {
  update(bytes: number, rows: number): void;
  done(): void;
}

export function progressBar(err: NodeJS.WriteStream, totalBytes: number, now: () => number = Date.now): Progress {
  if (!err.isTTY) return { update: () => undefined, done: () => undefined };
  let last = now();
  let shown = false;
  return {
    update(bytes, rows) {
      const t = now();
      if (t - last < 200) return;
      last = t;
      shown = true;
      const pct = totalBytes > 0 ? ` ${Math.min(100, Math.floor((100 * bytes) / totalBytes))}%` : '';
      const width = 30;
      const bar = totalBytes > 0 ? ` [${'#'.repeat(Math.floor((width * Math.min(bytes, totalBytes)) / totalBytes)).padEnd(width, '.')}]` : '';
      err.write(`\rpoints:${bar}${pct} ${rows} rows`);
    },
    done() {
      if (shown) err.write('\r\x1b[K');
      shown = false;
    },
  };
}

/**
 * A writer in a child process for the file-safety suite (bundled by esbuild at test time).
 * argv[2] is JSON: { files: [{ path, text, repeat? }], pause?: boolean, stagger?: ms } — the data is `text`
 * repeated `repeat` times (default once), and a path starting `$D/` is taken in the directory of
 * the environment variable D. With `pause` it prints "ready"
 * once every temporary file is written and waits before the first rename until killed. Exit
 * status: 0, or the error's own status (3 for OutputError) with its message on stderr.
 */
import { exitStatusOf } from '../../src/errors.js';
import { commitOutputs } from '../../src/io/safe-write.js';

interface Job {
  files: { path: string; text: string; repeat?: number }[];
  pause?: boolean;
  /** With pause: continue on SIGUSR1 instead of waiting to be killed. */
  release?: boolean;
  /** Sleep up to this many ms between renames (random), to widen the window for a race. */
  stagger?: number;
}

const job = JSON.parse(process.argv[2]!) as Job;
const pause = (): Promise<void> =>
  new Promise((resolve) => {
    const keep = setInterval(() => undefined, 1000);
    if (job.release) {
      process.once('SIGUSR1', () => {
        clearInterval(keep);
        resolve();
      });
    }
    process.stdout.write('ready\n');
  });

commitOutputs(
  job.files.map((f) => ({ path: f.path.replace(/^\$D\//, `${process.env.D}/`), data: f.text.repeat(f.repeat ?? 1) })),
  {
    ...(job.pause ? { beforeRename: pause } : {}),
    ...(job.stagger ? { betweenRenames: () => new Promise<void>((r) => setTimeout(r, Math.random() * job.stagger!)) } : {}),
  },
).then(
  () => process.exit(0),
  (e: unknown) => {
    process.stderr.write(`ephmap: ${(e as Error).message}\n`);
    process.exit(exitStatusOf(e));
  },
);

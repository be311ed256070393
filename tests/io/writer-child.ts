/**
 * A writer in a child process for the file-safety suite (bundled by esbuild at test time).
 * argv[2] is JSON: { files: [{ path, text, repeat? }], pause?: boolean } — the data is `text`
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
}

const job = JSON.parse(process.argv[2]!) as Job;
const pause = (): Promise<void> =>
  new Promise(() => {
    process.stdout.write('ready\n');
    setInterval(() => undefined, 1000);
  });

commitOutputs(
  job.files.map((f) => ({ path: f.path.replace(/^\$D\//, `${process.env.D}/`), data: f.text.repeat(f.repeat ?? 1) })),
  job.pause ? { beforeRename: pause } : {},
).then(
  () => process.exit(0),
  (e: unknown) => {
    process.stderr.write(`ephmap: ${(e as Error).message}\n`);
    process.exit(exitStatusOf(e));
  },
);

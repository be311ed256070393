/** Run the CLI in-process and capture what it prints. */
import { run } from '../../src/cli/program.js';

export async function runCli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const ow = process.stdout.write.bind(process.stdout);
  const ew = process.stderr.write.bind(process.stderr);
  process.stdout.write = ((s: string | Uint8Array) => {
    stdout += String(s);
    return true;
  }) as typeof process.stdout.write;
  process.stderr.write = ((s: string | Uint8Array) => {
    stderr += String(s);
    return true;
  }) as typeof process.stderr.write;
  try {
    const code = await run(args);
    return { code, stdout, stderr };
  } finally {
    process.stdout.write = ow;
    process.stderr.write = ew;
  }
}

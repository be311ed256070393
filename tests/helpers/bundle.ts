/**
 * Bundles a CLI entry (src/cli/ENTRY) into one ES module for tests that run the command in a child
 * process, with the same externals and `require` banner as scripts/bundle.mjs. The bundle must sit
 * two folders below a checkout (like dist/cli/ephmap.mjs) to find species/. Written to a temporary
 * name and renamed, so a parallel reader never sees half a file.
 */
import { renameSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildSync } from 'esbuild';

export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));

const BANNER = "import { createRequire as __ephmapRequire } from 'node:module';\nconst require = __ephmapRequire(import.meta.url);";

export function bundleCli(outfile: string, entry = 'main.ts', extraBanner = ''): string {
  const tmp = `${outfile}.${process.pid}.tmp`;
  buildSync({
    entryPoints: [join(repoRoot, 'src', 'cli', entry)],
    outfile: tmp,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    external: ['pdfkit', '@resvg/resvg-js', 'svgdom', 'playwright-core'],
    banner: { js: BANNER + extraBanner },
    logLevel: 'silent',
  });
  renameSync(tmp, outfile);
  return outfile;
}

/** A bundle of main.ts in node_modules/.ephmap-test (two levels below the checkout), named by `tag`. */
export function testCli(tag: string): string {
  return bundleCli(join(repoRoot, 'node_modules', '.ephmap-test', `${tag}-${process.pid}.mjs`));
}

// Bundle the command line into one ES module (dist/cli/ephmap.mjs) so that start-up reads one file
// instead of resolving dozens of modules. PDF and PNG libraries stay external and load lazily.
// A second bundle, dist/cli/points-worker.mjs, is the worker-thread entry of long `probe --points`
// runs (cli/points-pool.ts finds it next to ephmap.mjs).
import { build } from 'esbuild';

for (const [entry, outfile] of [['dist/cli/main.js', 'dist/cli/ephmap.mjs'], ['dist/cli/points-worker.js', 'dist/cli/points-worker.mjs']]) await build({
  entryPoints: [entry],
  outfile,
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  external: ['pdfkit', '@resvg/resvg-js', 'svgdom', 'playwright-core'],
  banner: { js: "import { createRequire as __ephmapRequire } from 'node:module';\nconst require = __ephmapRequire(import.meta.url);" },
  minifyWhitespace: true,
  minifySyntax: true,
  logLevel: 'warning',
});

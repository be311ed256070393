// Bundle the command line into one ES module (dist/cli/ephmap.mjs) so that start-up reads one file
// instead of resolving dozens of modules. PDF and PNG libraries stay external and load lazily.
import { build } from 'esbuild';

await build({
  entryPoints: ['dist/cli/main.js'],
  outfile: 'dist/cli/ephmap.mjs',
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

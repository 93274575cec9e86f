/**
 * Build step (after tsc, in `npm run build` and `prepare`): the command line as a few bundled files in
 * dist/cli-bundle, one per command loaded on demand (code splitting keeps each command's imports to itself), so
 * that `lockstep` starts by reading a handful of files instead of every module of core/ and zod one by one.
 * The packages with native parts or data files of their own (pdfkit, svg-to-pdfkit, better-sqlite3) stay outside
 * and load from node_modules. bin/lockstep.mjs runs this bundle when present. Run as JavaScript:
 * `node dist/scripts/bundle-cli.js`.
 */
import { build } from 'esbuild';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
await build({
  entryPoints: [join(root, 'cli', 'main.ts')],
  outdir: join(root, 'dist', 'cli-bundle'),
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  external: ['pdfkit', 'svg-to-pdfkit', 'better-sqlite3'],
  logLevel: 'warning',
});
console.log('command line bundled into dist/cli-bundle');

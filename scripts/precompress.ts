/**
 * Build step (after tsc, in `npm run build` and `prepare`): writes the page's static files with their brotli and
 * gzip siblings to dist/public, where server/app.ts serves them with @fastify/static's `preCompressed` option, so
 * no static file is compressed per request. Run as JavaScript: `node dist/scripts/precompress.js`.
 */
import { PUBLIC_DIR, sourceMounts, writePublic } from '../server/static-assets.ts';

await writePublic(sourceMounts(), PUBLIC_DIR);
console.log('static files precompressed into dist/public');

/**
 * The page's static files, served by @fastify/static (server/app.ts) and precompressed by the build step
 * (scripts/precompress.ts, run by `npm run build` and by `npm ci` through `prepare`).
 *
 * Three mounts: the app's own files (static/) under `/static/<content hash>/`, htmx and plotly from node_modules
 * under `/vendor/htmx-<version>/` and `/vendor/plotly-<version>/`. The build folder (dist/public) mirrors the
 * URLs: `dist/public/static/<hash>/css/workbench.css` with its `.br` and `.gz` siblings. Because the hash and the
 * versions are part of the folder names, a build made before an edit of static/ or an update of htmx/plotly
 * simply has no folder for the current URLs: that mount is then served from its sources, uncompressed
 * (correct, only heavier), until the next `npm run build`.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { basename, dirname, extname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';

const HERE = dirname(fileURLToPath(import.meta.url));
/** The project folder, from the sources (server/) or from the build (dist/server/). */
export const PROJECT_ROOT = basename(dirname(HERE)) === 'dist' ? join(HERE, '..', '..') : join(HERE, '..');
/** Where the build step writes the files and their precompressed siblings. */
export const PUBLIC_DIR = join(PROJECT_ROOT, 'dist', 'public');
const STATIC_DIR = join(PROJECT_ROOT, 'static');
const require = createRequire(import.meta.url);

export interface StaticMount {
  /** URL prefix ending in "/"; also the mount's folder under the build folder. */
  prefix: string;
  /** Folder the files are read from. */
  root: string;
  /** Paths relative to root, "/"-separated. */
  files: readonly string[];
}

/** Every file under dir (recursively), as URL paths relative to it ("css/workbench.css"). */
export function filesUnder(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else out.push(relative(dir, p).split(sep).join('/'));
    }
  };
  walk(dir);
  return out;
}

/** A hash of every file under dir, so app assets can be cached for a year under a changing URL. */
function contentHash(dir: string, files: readonly string[]): string {
  const h = createHash('sha256');
  for (const f of files) h.update(f.slice(f.lastIndexOf('/') + 1)).update(readFileSync(join(dir, f)));
  return h.digest('hex').slice(0, 10);
}

function packageDir(name: string): { dir: string; version: string } {
  const pkgJson = require.resolve(`${name}/package.json`);
  return { dir: dirname(pkgJson), version: (JSON.parse(readFileSync(pkgJson, 'utf8')) as { version: string }).version };
}

/** The three mounts, read from their sources. */
export function sourceMounts(): StaticMount[] {
  const files = filesUnder(STATIC_DIR);
  const htmx = packageDir('htmx.org');
  const plotly = packageDir('plotly.js-dist-min');
  return [
    { prefix: `/static/${contentHash(STATIC_DIR, files)}/`, root: STATIC_DIR, files },
    { prefix: `/vendor/htmx-${htmx.version}/`, root: join(htmx.dir, 'dist'), files: ['htmx.min.js'] },
    { prefix: `/vendor/plotly-${plotly.version}/`, root: plotly.dir, files: ['plotly.min.js'] },
  ];
}

/** The mount as the build folder holds it, or null when the build has no complete, current copy of it. */
export function builtMount(m: StaticMount, publicDir: string): StaticMount | null {
  const root = join(publicDir, ...m.prefix.split('/').filter(Boolean));
  return m.files.every((f) => existsSync(join(root, f))) ? { ...m, root } : null;
}

const brotli = promisify(brotliCompress);
const gz = promisify(gzip);
const COMPRESSIBLE = new Set(['.js', '.mjs', '.css', '.svg', '.json', '.txt', '.html']);
/** Smaller files are left as they are (a compressed body would hardly be smaller than its headers). */
const COMPRESS_THRESHOLD = 1024;

/**
 * Writes every file of the mounts into publicDir (mirroring the URLs) with a `.br` and a `.gz` sibling when that
 * is smaller. The folder is replaced whole: written beside it, then renamed, so a server never sees half of it.
 * brotliQuality: 11 for the build (plotly: about 10 % smaller than at 9, about 15 s once at build time).
 */
export async function writePublic(mounts: readonly StaticMount[], publicDir: string, brotliQuality = 11): Promise<void> {
  const tmp = `${publicDir}.tmp`;
  rmSync(tmp, { recursive: true, force: true });
  const jobs: Promise<void>[] = [];
  for (const m of mounts) {
    for (const f of m.files) {
      const raw = readFileSync(join(m.root, f));
      const out = join(tmp, ...m.prefix.split('/').filter(Boolean), f);
      mkdirSync(dirname(out), { recursive: true });
      writeFileSync(out, raw);
      if (!COMPRESSIBLE.has(extname(f).toLowerCase()) || raw.length < COMPRESS_THRESHOLD) continue;
      const params = { [constants.BROTLI_PARAM_QUALITY]: brotliQuality, [constants.BROTLI_PARAM_SIZE_HINT]: raw.length };
      const write = (ext: string) => (body: Buffer) => {
        if (body.length < raw.length) writeFileSync(`${out}${ext}`, body);
      };
      jobs.push(brotli(raw, { params }).then(write('.br')), gz(raw, { level: 9 }).then(write('.gz')));
    }
  }
  await Promise.all(jobs);
  rmSync(publicDir, { recursive: true, force: true });
  mkdirSync(dirname(publicDir), { recursive: true });
  renameSync(tmp, publicDir);
}

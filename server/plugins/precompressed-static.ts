/**
 * Static files served from memory, compressed once per process (not per request): each file is read at
 * registration, and its brotli and gzip bodies are made on the first request that accepts them (in zlib's thread
 * pool, so the event loop stays free) and kept. `warmStaticAssets()` (server/main.ts) makes them all at start-up.
 * plotly (4.8 MB, 1.2 MB as brotli) is thus compressed once, never per request.
 *
 * Only the files listed at registration exist (a fixed map of URL to file): no path from the request ever
 * reaches the file system. Every answer is immutable for a year (the URLs carry a content hash or a version)
 * and carries an ETag; If-None-Match answers 304.
 *
 * Sizes: the kept bodies are the files themselves plus their compressed forms (about 4.9 MB raw and 1.3 MB
 * brotli + 1.5 MB gzip for plotly, htmx and the app's own assets); nothing else is kept.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { extname, join, relative, sep } from 'node:path';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { chooseEncoding } from '../response-cache.ts';

const brotli = promisify(brotliCompress);
const gz = promisify(gzip);

const TYPES: Record<string, string> = {
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.json': 'application/json; charset=utf-8',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.txt': 'text/plain; charset=utf-8',
};
const COMPRESSIBLE = new Set(['.js', '.mjs', '.css', '.svg', '.json', '.txt']);
/** Files smaller than this are sent as they are (as @fastify/compress does with its threshold). */
const COMPRESS_THRESHOLD = 1024;
/** Brotli quality 9: 1.24 MB for plotly in about 1.2 s once (quality 11 takes 16 s for 10 % less). */
const BROTLI_QUALITY = 9;

interface Asset {
  raw: Buffer;
  type: string;
  etag: string;
  compressible: boolean;
  br?: Promise<Buffer>;
  gzip?: Promise<Buffer>;
}

/** Kept per process by file path and modification time, so every buildApp() of a process shares them. */
const assets = new Map<string, Asset>();

function load(file: string): Asset {
  const st = statSync(file);
  const key = `${file}\n${st.mtimeMs}\n${st.size}`;
  let a = assets.get(key);
  if (!a) {
    const raw = readFileSync(file);
    const ext = extname(file).toLowerCase();
    a = {
      raw,
      type: TYPES[ext] ?? 'application/octet-stream',
      etag: `"${createHash('sha256').update(raw).digest('base64url').slice(0, 22)}"`,
      compressible: COMPRESSIBLE.has(ext) && raw.length >= COMPRESS_THRESHOLD,
    };
    assets.set(key, a);
  }
  return a;
}

function encoded(a: Asset, encoding: 'br' | 'gzip'): Promise<Buffer> {
  if (encoding === 'br') {
    a.br ??= brotli(a.raw, {
      params: { [constants.BROTLI_PARAM_QUALITY]: BROTLI_QUALITY, [constants.BROTLI_PARAM_SIZE_HINT]: a.raw.length },
    });
    return a.br;
  }
  a.gzip ??= gz(a.raw, { level: 9 });
  return a.gzip;
}

/** Makes the compressed bodies of every registered file now (server/main.ts, at start-up). */
export async function warmStaticAssets(): Promise<void> {
  await Promise.all([...assets.values()].filter((a) => a.compressible).flatMap((a) => [encoded(a, 'br'), encoded(a, 'gzip')]));
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

export interface StaticMount {
  /** URL prefix ending in "/". */
  prefix: string;
  root: string;
  /** Paths relative to root, "/"-separated. */
  files: readonly string[];
}

const YEAR = 'public, max-age=31536000, immutable';

async function send(req: FastifyRequest, reply: FastifyReply, a: Asset): Promise<FastifyReply> {
  reply.header('cache-control', YEAR).header('etag', a.etag).header('vary', 'accept-encoding').type(a.type);
  if (req.headers['if-none-match'] === a.etag) return reply.code(304).send();
  const encoding = a.compressible ? chooseEncoding(req.headers['accept-encoding'], 'br') : null;
  if (!encoding) return reply.header('content-length', a.raw.length).send(a.raw);
  const body = await encoded(a, encoding);
  return reply.header('content-encoding', encoding).header('content-length', body.length).send(body);
}

/** Registers GET (and HEAD) routes for exactly the listed files of each mount. */
export function precompressedStatic(app: FastifyInstance, mounts: readonly StaticMount[]): void {
  for (const m of mounts) {
    for (const f of m.files) {
      const a = load(join(m.root, f));
      // compress: false keeps @fastify/compress away from an already compressed body
      app.get(`${m.prefix}${f}`, { compress: false }, (req, reply) => send(req, reply, a));
    }
  }
}

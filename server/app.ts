/**
 * buildApp(): the Lockstep web app as a Fastify instance. It never listens (server/main.ts does); tests use
 * inject() or listen on a random loopback port themselves.
 *
 * Features register their routes below, one line each (see DEVELOPERS.md, "Workbench panels" and "Routes").
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { constants as zlibConstants } from 'node:zlib';
import compress from '@fastify/compress';
import formbody from '@fastify/formbody';
import helmet from '@fastify/helmet';
import Fastify, { type FastifyError, type FastifyInstance, type FastifyReply, type FastifyRequest } from 'fastify';
import type { AssetUrls } from '../views/layout.ts';
import { messagePage, statusBlock } from '../views/pages/workbench.ts';
import { AppError, appErrors, BODY_LIMIT, fromFrameworkError } from './errors.ts';
import { sendHtml } from './html-reply.ts';
import { workbenchRoutes } from './routes/workbench.ts';
import { cgLiftRoutes } from './routes/cg-lift.ts';
import { packetRoutes } from './routes/packet.ts';
import { storeRoutes } from './routes/store.ts';
import { requestGuard, SERVER_LIMITS } from './plugins/request-guard.ts';
import { filesUnder, precompressedStatic } from './plugins/precompressed-static.ts';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const STATIC_DIR = join(ROOT, 'static');
const require = createRequire(import.meta.url);

export interface AppOptions {
  logger?: boolean;
  /** Host names answered besides the loopback names and the bound address (server/plugins/request-guard.ts). */
  allowedHosts?: readonly string[];
}

function packageDir(name: string): { dir: string; version: string } {
  const pkgJson = require.resolve(`${name}/package.json`);
  return { dir: dirname(pkgJson), version: (JSON.parse(readFileSync(pkgJson, 'utf8')) as { version: string }).version };
}

/** A hash of every file under static/, so app assets can be cached for a year under a changing URL. */
function staticHash(dir: string): string {
  const h = createHash('sha256');
  for (const f of filesUnder(dir)) h.update(f.slice(f.lastIndexOf('/') + 1)).update(readFileSync(join(dir, f)));
  return h.digest('hex').slice(0, 10);
}

export const CSP_DIRECTIVES = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  // plotly.js writes style elements and style attributes while drawing; no script is allowed inline
  styleSrc: ["'self'", "'unsafe-inline'"],
  imgSrc: ["'self'", 'data:', 'blob:'],
  fontSrc: ["'self'"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
  upgradeInsecureRequests: null,
};

const wantsFragment = (req: FastifyRequest) => req.headers['hx-request'] === 'true';
const wantsHtml = (req: FastifyRequest) => String(req.headers.accept ?? '').includes('text/html');

function sendError(req: FastifyRequest, reply: FastifyReply, e: AppError, assets: AssetUrls): FastifyReply {
  if (wantsFragment(req)) return sendHtml(reply, statusBlock('error', { message: e.message, code: e.code }), e.statusCode);
  if (wantsHtml(req)) {
    const title = e.statusCode === 404 ? 'Page not found' : 'Request not handled';
    return sendHtml(reply, messagePage(assets, title, e.message, e.code), e.statusCode);
  }
  return reply.code(e.statusCode).send({ statusCode: e.statusCode, code: e.code, message: e.message });
}

export function buildApp(opts: AppOptions = {}): FastifyInstance {
  const app = Fastify({ logger: opts.logger ?? false, bodyLimit: BODY_LIMIT, ...SERVER_LIMITS });
  requestGuard(app, { allowedHosts: opts.allowedHosts }); // Host, cross-site changes, media types, connection cap
  const htmx = packageDir('htmx.org');
  const plotly = packageDir('plotly.js-dist-min');
  const assets: AssetUrls = {
    app: `/static/${staticHash(STATIC_DIR)}`,
    htmx: `/vendor/htmx-${htmx.version}/htmx.min.js`,
    plotly: `/vendor/plotly-${plotly.version}/plotly.min.js`,
  };
  app.decorate('assets', assets);

  app.register(helmet, {
    contentSecurityPolicy: { useDefaults: false, directives: CSP_DIRECTIVES },
    strictTransportSecurity: false,
    crossOriginEmbedderPolicy: false,
  });
  // dynamic answers: the fastest levels (CPU matters more than a few per cent of bytes; kept answers and static
  // files are compressed once elsewhere, server/response-cache.ts and server/plugins/precompressed-static.ts)
  app.register(compress, { threshold: 1024, brotliOptions: { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 1 } }, zlibOptions: { level: 1 } });
  app.register(formbody, { bodyLimit: BODY_LIMIT });

  // every asset from memory, compressed once per process (server/plugins/precompressed-static.ts)
  app.register(async (scope) =>
    precompressedStatic(scope, [
      { prefix: `${assets.app}/`, root: STATIC_DIR, files: filesUnder(STATIC_DIR) },
      { prefix: `/vendor/htmx-${htmx.version}/`, root: join(htmx.dir, 'dist'), files: ['htmx.min.js'] },
      { prefix: `/vendor/plotly-${plotly.version}/`, root: plotly.dir, files: ['plotly.min.js'] },
    ]),
  );

  app.register(async (scope) => workbenchRoutes(scope, assets));
  app.register(async (scope) => cgLiftRoutes(scope));
  app.register(storeRoutes); // design store: LOCKSTEP_DATA_DIR (default ./data), opened on first use
  app.register(packetRoutes);

  app.setNotFoundHandler((req, reply) => sendError(req, reply, appErrors.notFound(req.url.split('?')[0]!.slice(0, 200)), assets));
  app.setErrorHandler((err: FastifyError | AppError, req, reply) => {
    let e: AppError;
    const framework = err instanceof AppError ? null : fromFrameworkError(err, req.headers['content-type']);
    if (err instanceof AppError) e = err;
    else if (framework) e = framework;
    else if (typeof err.statusCode === 'number' && err.statusCode >= 400 && err.statusCode < 500) e = appErrors.badRequest(err.message);
    else {
      req.log.error(err);
      e = appErrors.internal();
    }
    return sendError(req, reply, e, assets);
  });
  return app;
}

declare module 'fastify' {
  interface FastifyInstance {
    /** Versioned URLs of the page's assets. */
    assets: AssetUrls;
  }
}

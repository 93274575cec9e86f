/**
 * buildApp(): the Lockstep web app as a Fastify instance. It never listens (server/main.ts does); tests use
 * inject() or listen on a random loopback port themselves.
 *
 * Features register their routes below, one line each (see DEVELOPERS.md, "Workbench panels" and "Routes").
 */
import { constants as zlibConstants } from 'node:zlib';
import compress from '@fastify/compress';
import formbody from '@fastify/formbody';
import helmet from '@fastify/helmet';
import fastifyStatic from '@fastify/static';
import Fastify, { type FastifyInstance } from 'fastify';
import type { AssetUrls } from '../views/layout.ts';
import { BODY_LIMIT } from './errors.ts';
import { errorReplies } from './error-reply.ts';
import { workbenchRoutes } from './routes/workbench.ts';
import { cgLiftRoutes } from './routes/cg-lift.ts';
import { packetRoutes } from './routes/packet.ts';
import { storeRoutes } from './routes/store.ts';
import { requestGuard, SERVER_LIMITS } from './plugins/request-guard.ts';
import { builtMount, PUBLIC_DIR, sourceMounts, type StaticMount } from './static-assets.ts';

export interface AppOptions {
  logger?: boolean;
  /** Host names answered besides the loopback names and the bound address (server/plugins/request-guard.ts). */
  allowedHosts?: readonly string[];
  /** The build folder with the precompressed static files (default dist/public, server/static-assets.ts). */
  publicDir?: string;
}

/**
 * GET (and HEAD) routes for exactly the listed files of each mount, sent by @fastify/static: a fixed list, so no
 * path from the request reaches the file system, and `compress: false` on each route keeps @fastify/compress
 * away. preCompressed: the `.br`/`.gz` sibling the build step wrote is sent when the request accepts it.
 * Every answer is immutable for a year (the URLs carry a content hash or a version), with an ETag.
 */
function staticFiles(app: FastifyInstance, mounts: readonly StaticMount[], preCompressed: boolean): void {
  if (mounts.length === 0) return;
  app.register(async (scope) => {
    await scope.register(fastifyStatic, {
      serve: false,
      preCompressed,
      maxAge: '365d',
      immutable: true,
      // the body depends on accept-encoding only when a compressed sibling can be chosen
      setHeaders: preCompressed ? (res) => res.setHeader('vary', 'accept-encoding') : undefined,
    });
    for (const m of mounts) {
      for (const f of m.files) scope.get(`${m.prefix}${f}`, { compress: false }, (_req, reply) => reply.sendFile(f, m.root));
    }
  });
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

export function buildApp(opts: AppOptions = {}): FastifyInstance {
  const app = Fastify({ logger: opts.logger ?? false, bodyLimit: BODY_LIMIT, ...SERVER_LIMITS });
  requestGuard(app, { allowedHosts: opts.allowedHosts }); // Host, cross-site changes, media types, connection cap
  const sources = sourceMounts();
  const [appFiles, htmx, plotly] = sources;
  const assets: AssetUrls = {
    app: appFiles!.prefix.slice(0, -1),
    htmx: `${htmx!.prefix}htmx.min.js`,
    plotly: `${plotly!.prefix}plotly.min.js`,
  };
  app.decorate('assets', assets);
  errorReplies(app, assets); // the one error answer of every route below (server/error-reply.ts)

  app.register(helmet, {
    contentSecurityPolicy: { useDefaults: false, directives: CSP_DIRECTIVES },
    strictTransportSecurity: false,
    crossOriginEmbedderPolicy: false,
  });
  // dynamic answers: the fastest levels (CPU matters more than a few per cent of bytes; kept answers are
  // compressed once in server/response-cache.ts, static files at build time, server/static-assets.ts)
  app.register(compress, { threshold: 1024, brotliOptions: { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 1 } }, zlibOptions: { level: 1 } });
  app.register(formbody, { bodyLimit: BODY_LIMIT });

  // each mount from the build folder with its precompressed siblings, or from its sources (uncompressed) when
  // the build has no current copy of it (no build yet, or static/ edited since)
  const mounts = sources.map((m) => ({ source: m, built: builtMount(m, opts.publicDir ?? PUBLIC_DIR) }));
  staticFiles(app, mounts.flatMap((m) => (m.built ? [m.built] : [])), true);
  staticFiles(app, mounts.flatMap((m) => (m.built ? [] : [m.source])), false);

  app.register(async (scope) => workbenchRoutes(scope, assets));
  app.register(async (scope) => cgLiftRoutes(scope));
  app.register(storeRoutes); // design store: LOCKSTEP_DATA_DIR (default ./data), opened on first use
  app.register(packetRoutes);

  return app;
}

declare module 'fastify' {
  interface FastifyInstance {
    /** Versioned URLs of the page's assets. */
    assets: AssetUrls;
  }
}

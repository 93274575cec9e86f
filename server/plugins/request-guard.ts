/**
 * What every request passes before a route sees it (threat model: docs/threat-model.md).
 *
 * - Host: the app answers only at its own address. Allowed are the loopback names 127.0.0.1, localhost and
 *   [::1], and the address the server is bound to, each with the port it listens on (any port before it
 *   listens, i.e. in tests through inject), plus the names in the `allowedHosts` option (`name` or
 *   `name:port`, from ALLOWED_HOSTS in server/main.ts). Anything else (a DNS-rebinding page, a proxy for
 *   another name) gets APP_ERR_HOST_NOT_ALLOWED (421).
 * - Cross-site changes: a request that may change something (any method but GET, HEAD, OPTIONS) is refused with
 *   APP_ERR_CROSS_SITE (403) when the browser says it comes from elsewhere: `Sec-Fetch-Site` other than
 *   same-origin or none, or an `Origin` that is not this server's own. Clients without these headers (curl,
 *   scripts) are not web pages and pass.
 * - Media types: plain text is not read as a body (fastify reads text/plain by default); it gets
 *   APP_ERR_UNSUPPORTED_MEDIA_TYPE (415) like any other unread type.
 * - Connections: SERVER_LIMITS (fastify options) and MAX_CONNECTIONS / HEADERS_TIMEOUT_MS (the Node server):
 *   a workshop tool has one or a few users, so a few dozen connections and timeouts of seconds are plenty, and
 *   a client that holds connections open cannot lock the others out for long. Connections beyond the cap are
 *   closed at once, before a request is read.
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { serverErrors } from '../errors.ts';

/** Fastify options of the app (spread into Fastify({...}) in server/app.ts). */
export const SERVER_LIMITS = {
  /** A socket with no traffic for this long is closed (a packet PDF takes well under 10 s). */
  connectionTimeout: 30_000,
  /** An idle kept-alive connection is closed after this. */
  keepAliveTimeout: 5_000,
  /** The whole request (headers and body) must arrive within this. */
  requestTimeout: 30_000,
  /** Requests on one kept-alive connection before it is closed. */
  maxRequestsPerSocket: 1_000,
  http: {
    /** The headers must arrive within this (slow-header clients). */
    headersTimeout: 10_000,
    /** How often the timeouts above are checked, ms (Node's default is 30 s). */
    connectionsCheckingInterval: 2_000,
  },
} as const;
/** Open connections at most; more are dropped on arrival. */
export const MAX_CONNECTIONS = 64;

export interface RequestGuardOptions {
  /** Extra host names the app answers to, `name` or `name:port` (ALLOWED_HOSTS). */
  allowedHosts?: readonly string[];
}

const LOOPBACK_NAMES = ['127.0.0.1', 'localhost', '[::1]'];
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** ALLOWED_HOSTS ("a.example, b.example:3000") as a list of lower-case names. */
export function parseAllowedHosts(text: string | undefined): string[] {
  return (text ?? '').split(',').map((h) => h.trim().toLowerCase()).filter((h) => h !== '');
}

/** The Host header split into name and port ("[::1]:3000" -> ["[::1]", "3000"]); null when it is malformed. */
function splitHost(host: string): { name: string; port: string } | null {
  const m = /^(\[[0-9a-f:.]+\]|[a-z0-9.-]+)(?::(\d{1,5}))?$/.exec(host.toLowerCase());
  return m ? { name: m[1]!, port: m[2] ?? '80' } : null;
}

export function requestGuard(app: FastifyInstance, opts: RequestGuardOptions = {}): void {
  const extra = new Set((opts.allowedHosts ?? []).map((h) => h.toLowerCase()));
  app.server.maxConnections = MAX_CONNECTIONS;
  app.removeContentTypeParser('text/plain');

  /** Name and port the server is listening at, or null before it listens. */
  const bound = (): { name: string; port: string } | null => {
    const a = app.server.address();
    if (a === null || typeof a === 'string') return null;
    return { name: a.family === 'IPv6' ? `[${a.address}]` : a.address, port: String(a.port) };
  };

  const hostAllowed = (host: string): boolean => {
    const h = splitHost(host);
    if (h === null) return false;
    if (extra.has(h.name) || extra.has(`${h.name}:${h.port}`)) return true;
    const b = bound();
    if (b !== null && b.port !== h.port) return false;
    return LOOPBACK_NAMES.includes(h.name) || (b !== null && h.name === b.name);
  };

  const crossSite = (req: FastifyRequest): boolean => {
    const site = req.headers['sec-fetch-site'];
    if (site !== undefined && site !== 'same-origin' && site !== 'none') return true;
    const origin = req.headers.origin;
    if (origin === undefined) return false;
    // the page's own origin is http://<the Host it was loaded from>
    return origin.toLowerCase() !== `http://${String(req.headers.host ?? '').toLowerCase()}`;
  };

  app.addHook('onRequest', async (req) => {
    const host = req.headers.host ?? '';
    if (!hostAllowed(host)) throw serverErrors.hostNotAllowed(host);
    if (!SAFE_METHODS.has(req.method) && crossSite(req)) throw serverErrors.crossSite();
  });
}

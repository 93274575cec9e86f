/**
 * The one error answer of the app. Every error a route, a hook or the framework throws, and every unknown
 * address, is answered here from its declared code (core/errors.ts `LockstepError`), one shape three ways:
 * - JSON `{code, message, details}` for /api and for clients that do not ask for HTML;
 * - for htmx, a fragment for the element it replaces: the workbench's status block (`#status`, also when htmx
 *   names no element), a coded alert for any other element (htmx swaps 4xx and 5xx, views/layout.ts);
 * - a page for a browser that asks for HTML.
 */
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { LockstepError } from '../core/errors.ts';
import type { AssetUrls } from '../views/layout.ts';
import { messagePage, statusBlock } from '../views/pages/workbench.ts';
import { errorView } from '../views/store-views.ts';
import { fromFrameworkError, serverErrors } from './errors.ts';
import { sendHtml } from './html-reply.ts';

const wantsFragment = (req: FastifyRequest) => req.headers['hx-request'] === 'true';
const wantsHtml = (req: FastifyRequest) => String(req.headers.accept ?? '').includes('text/html');

/** Any thrown value as a declared error: ours as it is, the framework's 4xx as their APP_ERR_*, the rest internal. */
export function asDeclaredError(err: unknown, req: FastifyRequest): LockstepError {
  if (err instanceof LockstepError) return err;
  const e = (err ?? {}) as Partial<FastifyError>;
  return fromFrameworkError({ code: e.code, statusCode: e.statusCode, message: String(e.message) }, req.headers['content-type']) ?? serverErrors.internal();
}

export function sendError(req: FastifyRequest, reply: FastifyReply, e: LockstepError, assets: AssetUrls): FastifyReply {
  const { code, message, details, status } = e;
  if (req.url.startsWith('/api/') || !(wantsFragment(req) || wantsHtml(req))) return reply.code(status).send({ code, message, details });
  if (wantsFragment(req)) {
    const target = req.headers['hx-target'];
    const fragment =
      target === undefined || target === 'status'
        ? statusBlock('error', { message, code, errors: details.map((d) => ({ path: '', message: d })) })
        : errorView(code, message, [...details]);
    return sendHtml(reply, fragment, status);
  }
  return sendHtml(reply, messagePage(assets, status === 404 ? 'Page not found' : 'Request not handled', message, code), status);
}

/** Installs the one error handler and the not-found answer on `app`, before its routes are registered. */
export function errorReplies(app: FastifyInstance, assets: AssetUrls): void {
  app.setNotFoundHandler((req, reply) => sendError(req, reply, serverErrors.notFound(req.url.split('?')[0]!.slice(0, 200)), assets));
  app.setErrorHandler((err, req, reply) => {
    const e = asDeclaredError(err, req);
    if (e.status >= 500) req.log.error(err);
    return sendError(req, reply, e, assets);
  });
}

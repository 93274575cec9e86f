/**
 * What the store and packet routes share: a lazily opened design store (the data folder is created on the
 * first request that needs it, not when the app is built), reading a design from a request body, and
 * turning store errors into responses.
 */
import type { FastifyReply, FastifyRequest } from 'fastify';
import { type DesignFile, readDesign, type UnitSystem, type Warning } from '../../core/index.ts';
import { type FormValues, readForm } from '../../form/design-form.ts';
import { type DesignStore, openStore } from '../../store/design-store.ts';
import { StoreError } from '../../store/errors.ts';
import { errorView } from '../../views/store-views.ts';
import { fromFrameworkError } from '../../form/errors.ts';
import { checkFieldNames } from '../../form/field-names.ts';

export interface StoreRouteOptions {
  /** An open store (tests); otherwise one is opened in `dataDir` (default LOCKSTEP_DATA_DIR or ./data). */
  store?: DesignStore;
  dataDir?: string;
  /** Clock for saves and packet dates (tests). */
  now?: () => Date;
}

export function lazyStore(opts: StoreRouteOptions): { get: () => DesignStore; close: () => void } {
  let s: DesignStore | undefined = opts.store;
  let opened = false;
  return {
    get: () => {
      if (!s) {
        s = openStore({ ...(opts.dataDir ? { dir: opts.dataDir } : {}), ...(opts.now ? { now: opts.now } : {}) });
        opened = true;
      }
      return s;
    },
    close: () => {
      if (opened) s?.close();
    },
  };
}

/** Bad input from a request, answered as 400/422 with a code like the store's errors. */
export class RequestError extends StoreError {}

export type DesignFromBody = { design: DesignFile; warnings: Warning[] };

/**
 * A design from a request body: `{ design: {...} }` (JSON), `design_json` (a JSON text, e.g. a hidden form
 * field) or the workbench form itself (field names are design paths, `_units` the unit system).
 */
export function designFromBody(body: unknown): DesignFromBody {
  if (body === null || typeof body !== 'object') {
    throw new RequestError('STORE_ERR_BODY_MISSING', 'send the design as JSON {"design": {...}} or as the workbench form', 400);
  }
  const b = body as Record<string, unknown>;
  let input: unknown;
  if (b.design !== undefined) input = b.design;
  else if (typeof b.design_json === 'string') {
    try {
      input = JSON.parse(b.design_json);
    } catch (e) {
      throw new RequestError('STORE_ERR_NOT_JSON', `design_json is not valid JSON (${(e as Error).message})`, 400);
    }
  } else {
    checkFieldNames(Object.keys(b));
    const values: FormValues = {};
    for (const [k, v] of Object.entries(b)) if (typeof v === 'string') values[k] = v;
    const units: UnitSystem = b._units === 'us' ? 'us' : 'metric';
    const r = readForm(values, units);
    if (!r.ok) throw new RequestError('STORE_ERR_DESIGN_INVALID', `the design is not valid (${r.errors.length} problem${r.errors.length === 1 ? '' : 's'})`, 422, r.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
    return { design: r.design, warnings: r.warnings };
  }
  const r = readDesign(input);
  if (!r.ok) throw new RequestError('STORE_ERR_DESIGN_INVALID', `the design is not valid (${r.errors.length} problem${r.errors.length === 1 ? '' : 's'})`, 422, r.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
  return { design: r.design, warnings: r.warnings };
}

/** A string field of a body or query, or undefined. */
export function field(obj: unknown, key: string): string | undefined {
  if (obj === null || typeof obj !== 'object') return undefined;
  const v = (obj as Record<string, unknown>)[key];
  return typeof v === 'string' ? v : undefined;
}

/** Error handler of the store and packet plugins: coded JSON for /api, an HTML fragment otherwise. */
export function storeErrorHandler(thrown: Error & { statusCode?: number; code?: string }, req: FastifyRequest, reply: FastifyReply): FastifyReply {
  const err = fromFrameworkError(thrown, req.headers['content-type']) ?? thrown; // framework codes become the documented APP_ERR_*
  const isStore = err instanceof StoreError;
  const status = isStore ? err.status : (err.statusCode ?? 500);
  const code = isStore ? err.code : status < 500 ? (err.code ?? 'APP_ERR_BAD_REQUEST') : 'APP_ERR_INTERNAL';
  const message = isStore || status < 500 ? err.message : 'the server could not answer this request; see the server log';
  const details = isStore ? err.details : [];
  if (status >= 500) req.log.error(err);
  // Same JSON shape as the app's other errors; an HTML fragment for htmx and for browsers that ask for HTML.
  const wantsHtml = req.headers['hx-request'] === 'true' || String(req.headers.accept ?? '').includes('text/html');
  if (req.url.startsWith('/api/') || !wantsHtml) return reply.status(status).send({ statusCode: status, code, message, details });
  // htmx does not swap 4xx/5xx by default; the page may opt in (see DEVELOPERS.md). The status stays honest.
  return reply.status(status).type('text/html; charset=utf-8').send(errorView(code, message, details).html);
}

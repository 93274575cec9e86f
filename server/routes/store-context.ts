/**
 * What the store and packet routes share: a lazily opened design store (the data folder is created on the
 * first request that needs it, not when the app is built) and reading a design from a request body. Their
 * errors are answered by the app's one error handler (server/app.ts).
 */
import { type DesignFile, type FieldIssue, readDesign, type UnitSystem, type Warning } from '../../core/index.ts';
import { type FormValues, readForm } from '../../form/design-form.ts';
import { type DesignStore, openStore } from '../../store/design-store.ts';
import { storeErrors } from '../../store/errors.ts';
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

export type DesignFromBody = { design: DesignFile; warnings: Warning[] };

/**
 * A design from a request body: `{ design: {...} }` (JSON), `design_json` (a JSON text, e.g. a hidden form
 * field) or the workbench form itself (field names are design paths, `_units` the unit system).
 */
export function designFromBody(body: unknown): DesignFromBody {
  if (body === null || typeof body !== 'object') {
    throw storeErrors.bodyMissing();
  }
  const b = body as Record<string, unknown>;
  let input: unknown;
  if (b.design !== undefined) input = b.design;
  else if (typeof b.design_json === 'string') {
    try {
      input = JSON.parse(b.design_json);
    } catch (e) {
      throw storeErrors.notJson((e as Error).message);
    }
  } else {
    checkFieldNames(Object.keys(b));
    const values: FormValues = {};
    for (const [k, v] of Object.entries(b)) if (typeof v === 'string') values[k] = v;
    const units: UnitSystem = b._units === 'us' ? 'us' : 'metric';
    const r = readForm(values, units);
    if (!r.ok) throw storeErrors.designInvalid(issueLines(r.errors), false);
    return { design: r.design, warnings: r.warnings };
  }
  const r = readDesign(input);
  if (!r.ok) throw storeErrors.designInvalid(issueLines(r.errors), false);
  return { design: r.design, warnings: r.warnings };
}

const issueLines = (errors: readonly FieldIssue[]): string[] => errors.map((e) => `${e.path || '(file)'}: ${e.message}`);

/** A string field of a body or query, or undefined. */
export function field(obj: unknown, key: string): string | undefined {
  if (obj === null || typeof obj !== 'object') return undefined;
  const v = (obj as Record<string, unknown>)[key];
  return typeof v === 'string' ? v : undefined;
}

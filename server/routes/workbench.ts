/**
 * The workbench: the page (GET /), the recompute endpoint htmx calls on every change
 * (POST /workbench/update), and the downloads of the current design and its table.
 *
 * Status behaviour: a valid design answers 200; invalid input answers 422 with the same kind of fragment
 * (status block + field messages + "not current" note); htmx is configured to swap 422 (views/layout.ts).
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { type DesignFile, type FieldIssue, type UnitSystem, type Warning, demoDesign, evaluate, readDesign } from '../../core/index.ts';
import { html, type SafeHtml } from '../../views/html.ts';
import type { AssetUrls } from '../../views/layout.ts';
import {
  fieldMessagesOob,
  fieldsWithMessages,
  inputsSection,
  noResultsSection,
  resultsSection,
  staleNote,
  statusBlock,
  type ValidView,
  workbenchPage,
} from '../../views/pages/workbench.ts';
import { panels } from '../../views/panels/index.ts';
import { resultCsv } from '../../views/panels/table.ts';
import { verdictBar } from '../../views/panels/verdict.ts';
import type { LockstepError } from '../../core/errors.ts';
import { formErrors } from '../../form/errors.ts';
import { serverErrors, UPLOAD_LIMIT } from '../errors.ts';
import {
  applyListOp,
  convertValues,
  designToValues,
  type FormValues,
  parseListOp,
  readForm,
} from '../../form/design-form.ts';
import { sendHtml } from '../html-reply.ts';
import { checkFieldNames } from '../../form/field-names.ts';
import { applySizingOp, SIZING_OP } from '../../form/sizing-apply.ts';
import { applyCgLiftOp, CG_LIFT_OP } from '../../form/axle-lift-form.ts';
import { ResponseCache, sendCached } from '../response-cache.ts';
import { keepSwitchedOut, withoutDraftRows } from '../../form/keep-typed.ts';

/** Form body (formbody gives repeated names as arrays): the last value of each name wins. */
export function formValues(body: unknown): FormValues {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) throw formErrors.badRequest('Expected the design form as the request body.');
  checkFieldNames(Object.keys(body)); // prototype keys, odd names, positions beyond a list's limit (form/field-names.ts)
  const out: FormValues = {};
  for (const [k, v] of Object.entries(body as Record<string, unknown>)) {
    const last = Array.isArray(v) ? v[v.length - 1] : v;
    if (typeof last === 'string') out[k] = last;
  }
  return out;
}

export const unitsOf = (v: string | null | undefined): UnitSystem => (v === 'us' ? 'us' : 'metric');

export function view(design: DesignFile, warnings: Warning[]): ValidView {
  // the limits, pedal travel and failure modes feed deferred panels only: computed when one reads them
  return { design, warnings, result: evaluate(design, { curves: true, warnings, deferLimits: true }) };
}

/** Control fields of the page; never part of the values that are rendered back. */
const CONTROL = new Set(['_op', '_shape', '_units', '_upload', '_restore']);
const withoutControls = (v: FormValues): FormValues => Object.fromEntries(Object.entries(v).filter(([k]) => !CONTROL.has(k)));

export interface UpdateOutcome {
  status: number;
  body: SafeHtml;
}

/** One change of the form: work out what changed, re-render what must be, recompute when valid. */
export function update(posted: FormValues): UpdateOutcome {
  const units = unitsOf(posted._units);
  const shape = new URLSearchParams(posted._shape ?? '');
  const prevUnits = shape.has('_units') ? unitsOf(shape.get('_units')) : units;
  let values = withoutControls(posted);
  let structural = posted._restore === '1';
  /** The design was replaced as a whole (upload, demo): what an earlier variant held no longer applies. */
  let fresh = false;

  if (posted._upload !== undefined) {
    const text = posted._upload;
    let parsed: unknown;
    const fail = (e: LockstepError, errors: FieldIssue[] = []): UpdateOutcome => ({
      status: e.status,
      body: statusBlock('upload-error', { message: e.message, code: e.code, errors }),
    });
    if (Buffer.byteLength(text) > UPLOAD_LIMIT) return fail(serverErrors.uploadTooLarge());
    try {
      parsed = JSON.parse(text);
    } catch (e) {
      return fail(serverErrors.uploadNotJson(e instanceof Error ? e.message : 'unreadable'));
    }
    const r = readDesign(parsed);
    if (!r.ok) return fail(serverErrors.uploadInvalid(r.errors.length), r.errors);
    // the file is in design-file units; show it in the units the page uses now
    values = designToValues(r.design, units);
    // opened from a design's history, or loaded as a new revision of a saved design: saving adds to that design
    if (posted._design_id) values._design_id = posted._design_id;
    structural = true;
    fresh = true;
  } else if (posted._op === 'demo') {
    values = designToValues(demoDesign(), units);
    fresh = true;
    structural = true;
  } else if (posted._op?.startsWith(CG_LIFT_OP)) {
    values = applyCgLiftOp(values, posted._op, units); // the axle-lift tool's "Apply to load state" (form/axle-lift-form.ts)
    structural = true;
  } else if (posted._op?.startsWith(SIZING_OP)) {
    values = applySizingOp(values, posted._op, units); // the sizing panel's apply / undo (form/sizing-apply.ts)
    structural = true;
  } else if (posted._op) {
    const op = parseListOp(posted._op);
    if (!op) throw formErrors.unknownOperation(posted._op);
    values = applyListOp(values, op);
    structural = true;
  }
  if (prevUnits !== units) {
    values = convertValues(values, prevUnits, units);
    structural = true;
  }
  for (const [k, v] of shape) if (k !== '_units' && (values[k] ?? '') !== v) structural = true;
  if (fresh) delete values._stash;
  if (structural) {
    // fields a type switch removes are kept in `_stash` and come back when the type is switched back
    const op = posted._op && !fresh ? parseListOp(posted._op) : null;
    values = keepSwitchedOut(values, (v) => panels.reduce((acc, p) => (p.normalise ? p.normalise(acc, units) : acc), v), {
      convert: prevUnits !== units ? (v) => convertValues(v, prevUnits, units) : undefined,
      dropUnder: op ? op.list : undefined,
    });
  }

  const reading = readForm(withoutDraftRows(values), units);
  const errors = reading.ok ? [] : reading.errors;
  const parts: SafeHtml[] = [];
  parts.push(statusBlock(reading.ok ? 'current' : 'invalid', { errors, labels: errors.length ? fieldsWithMessages(values, units).labels : undefined }));
  parts.push(structural ? inputsSection(values, units, errors, true) : fieldMessagesOob(values, units, errors));
  // a restored draft or a loaded file that cannot be read: the results on the page are another design's
  const replaced = posted._restore === '1' || posted._upload !== undefined;
  parts.push(reading.ok ? cachedResults(reading.design, reading.warnings, units) : replaced ? noResultsSection(errors.length, true) : html`${staleNote(errors.length, true)}${verdictBar(null, true)}`);
  return { status: reading.ok ? 200 : 422, body: html`${parts}` };
}

/**
 * Rendered results of the last few designs. A form often comes back unchanged (focus moves, a value is typed and
 * typed back, a unit switch and back), and the engine is pure, so the same design gives the same fragment.
 */
const CACHE_SIZE = 32;
function lru<V>(cache: Map<string, V>, key: string, make: () => V, size = CACHE_SIZE): V {
  let v = cache.get(key);
  if (v !== undefined) cache.delete(key); // most recently used goes last
  else {
    v = make();
    if (cache.size >= size) cache.delete(cache.keys().next().value!);
  }
  cache.set(key, v);
  return v;
}
const viewCache = new Map<string, ValidView>();
const resultsCache = new Map<string, SafeHtml>();
/** The evaluation of a design, shared by the recompute and the deferred panels of the same design. */
export function cachedView(design: DesignFile, warnings: Warning[]): ValidView {
  // few: an evaluation with its curves is a large object graph (garbage-collection work); the deferred panels
  // ask for the design of the latest recompute
  return lru(viewCache, JSON.stringify(design), () => view(design, warnings), 8);
}
export function cachedResults(design: DesignFile, warnings: Warning[], units: UnitSystem): SafeHtml {
  return lru(resultsCache, `${units}|${JSON.stringify(design)}`, () => resultsSection(cachedView(design, warnings), units, true));
}

/**
 * Rendered answers of the recompute and of the deferred panels, by the whole posted form (server/response-cache.ts).
 * An upload (up to UPLOAD_LIMIT of text) is answered but not kept.
 */
export const answers = new ResponseCache(200);
/** The default page (GET /), one entry per unit system (two), apart from `answers` so that no recompute evicts it. */
const pages = new ResponseCache(4);
const CACHE_SOURCE_LIMIT = 64 * 1024;
function cacheSource(route: string, posted: FormValues): string {
  if (posted._upload !== undefined) return '';
  const s = `${route}\n${JSON.stringify(Object.entries(posted))}`;
  return s.length > CACHE_SOURCE_LIMIT ? '' : s;
}

function slug(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 60) || 'design';
}

function validFromRequest(req: FastifyRequest): { ok: true; design: DesignFile; units: UnitSystem; warnings: Warning[] } | { ok: false; errors: FieldIssue[] } {
  const posted = formValues(req.body);
  const units = unitsOf(posted._units);
  const r = readForm(withoutDraftRows(withoutControls(posted)), units);
  return r.ok ? { ok: true, design: r.design, units, warnings: r.warnings } : { ok: false, errors: r.errors };
}

export function workbenchRoutes(app: FastifyInstance, assets: AssetUrls): void {
  app.get<{ Querystring: { units?: string } }>('/', async (req, reply) => {
    const units = unitsOf(req.query.units);
    reply.header('cache-control', 'no-cache');
    // the same for everyone until they change it: rendered once per process and unit system, compressed once
    const out = pages.answer(`page\n${assets.app}\n${assets.htmx}\n${assets.plotly}\n${units}`, () => {
      const design = demoDesign();
      const r = readDesign(design);
      const valid = r.ok ? view(r.design, r.warnings) : null;
      return { status: 200, body: workbenchPage(assets, designToValues(design, units), units, valid, r.ok ? [] : r.errors) };
    });
    return sendCached(req, reply, out);
  });

  app.post('/workbench/update', async (req, reply) => {
    const posted = formValues(req.body);
    const out = answers.answer(cacheSource('update', posted), () => update(posted));
    reply.header('cache-control', 'no-store');
    return sendCached(req, reply, out);
  });

  // a deferred result panel (views/panels/panel.ts `deferred`) for the current form
  app.post<{ Params: { id: string } }>('/workbench/panel/:id', async (req, reply) => {
    const panel = panels.find((p) => p.id === req.params.id && p.results && p.deferred);
    if (!panel) throw serverErrors.notFound(`/workbench/panel/${req.params.id.slice(0, 60)}`);
    const posted = formValues(req.body);
    reply.header('cache-control', 'no-store');
    const out = answers.answer(cacheSource(`panel:${panel.id}`, posted), () => {
      const r = validFromRequest(req);
      if (!r.ok) return { status: 422, body: html`<div class="deferred" id="deferred-${panel.id}"><p class="hint">Not current: fix the marked inputs to see this section.</p></div>` };
      const v = cachedView(r.design, r.warnings);
      const controls = Object.fromEntries(Object.entries(posted).filter(([k]) => k.startsWith('_') && !CONTROL.has(k)));
      return { status: 200, body: html`<div class="deferred loaded" id="deferred-${panel.id}"><div class="deferred-body">${panel.results!({ design: v.design, result: v.result, units: r.units, warnings: v.warnings, controls })}</div></div>` };
    });
    return sendCached(req, reply, out);
  });

  app.post('/workbench/design.json', async (req, reply) => {
    const r = validFromRequest(req);
    if (!r.ok) throw serverErrors.formInvalid(r.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
    reply.header('content-disposition', `attachment; filename="${slug(r.design.name)}.lockstep.json"`);
    return reply.type('application/json; charset=utf-8').send(`${JSON.stringify(r.design, null, 2)}\n`);
  });

  app.post('/workbench/table.csv', async (req, reply) => {
    const r = validFromRequest(req);
    if (!r.ok) throw serverErrors.formInvalid(r.errors.map((e) => `${e.path || '(file)'}: ${e.message}`));
    const result = evaluate(r.design);
    reply.header('content-disposition', `attachment; filename="${slug(r.design.name)}-table.csv"`);
    return reply.type('text/csv; charset=utf-8').send(resultCsv(result, r.units));
  });
}

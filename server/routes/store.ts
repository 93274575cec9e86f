/**
 * Routes of the design store: JSON under /api (list, save, open, rename, duplicate, delete with confirmation,
 * history, diff, compare) and HTML fragments for the page (/designs, /designs/:id/history, /diff, /compare,
 * /designs/save, /designs/:id/rename|duplicate|delete). Register with `app.register(storeRoutes, { store? , dataDir? })`.
 */
import type { FastifyPluginAsync } from 'fastify';
import type { EvaluationResult } from '../../core/index.ts';
import { compareView, designChoicesView, designsListView, diffView, historyView, saveResultView } from '../../views/store-views.ts';
import { type CompareSide, compare } from '../../packet/compare.ts';
import { evaluateForPacket, warningsOf } from '../../packet/build-packet.ts';
import type { DesignStore } from '../../store/design-store.ts';
import { designFromBody, field, lazyStore, type StoreRouteOptions } from './store-context.ts';
import { storeErrors } from '../../store/errors.ts';
import { sendHtml } from '../html-reply.ts';

/** A side of a comparison from a revision id (or prefix) or a design id (its latest revision). */
export function compareSide(store: DesignStore, ref: string, label: string): CompareSide {
  let isDesign = false;
  try {
    store.get(ref);
    isDesign = true;
  } catch {
    isDesign = false;
  }
  const rev = isDesign ? store.open(ref).revision : store.revision(ref);
  const result: EvaluationResult = evaluateForPacket(rev.design, warningsOf(rev.design));
  return { label, revision: rev.id, design: rev.design, result };
}

export const storeRoutes: FastifyPluginAsync<StoreRouteOptions> = async (app, opts) => {
  const holder = lazyStore(opts);
  const store = holder.get;
  app.addHook('onClose', async () => holder.close());

  // ---- JSON API
  app.get('/api/designs', async () => ({ designs: store().list() }));

  app.post('/api/designs', async (req, reply) => {
    const { design } = designFromBody(req.body);
    const r = store().save(design, { message: field(req.body, 'message'), name: field(req.body, 'name') });
    return reply.status(201).send(r);
  });

  app.get<{ Params: { id: string } }>('/api/designs/:id', async (req) => {
    const { design, revision } = store().open(req.params.id);
    return { ...design, design_file: revision.design };
  });

  app.post<{ Params: { id: string } }>('/api/designs/:id/revisions', async (req, reply) => {
    const { design } = designFromBody(req.body);
    const r = store().save(design, { designId: req.params.id, message: field(req.body, 'message') });
    return reply.status(r.changed ? 201 : 200).send(r);
  });

  app.get<{ Params: { id: string } }>('/api/designs/:id/history', async (req) => ({ history: store().history(req.params.id) }));

  app.get<{ Params: { id: string; rev: string } }>('/api/designs/:id/revisions/:rev', async (req) => {
    const { revision } = store().open(req.params.id, req.params.rev);
    return revision;
  });

  app.post<{ Params: { id: string } }>('/api/designs/:id/rename', async (req) => store().rename(req.params.id, field(req.body, 'name') ?? ''));

  app.post<{ Params: { id: string } }>('/api/designs/:id/duplicate', async (req, reply) =>
    reply.status(201).send(store().duplicate(req.params.id, field(req.body, 'name'))),
  );

  app.delete<{ Params: { id: string }; Querystring: { confirm?: string } }>('/api/designs/:id', async (req, reply) => {
    store().delete(req.params.id, field(req.query, 'confirm') ?? field(req.body, 'confirm'));
    return reply.status(200).send({ deleted: req.params.id });
  });

  app.get<{ Params: { rev: string } }>('/api/revisions/:rev', async (req) => store().revision(req.params.rev));

  app.get<{ Querystring: { a?: string; b?: string } }>('/api/diff', async (req) => {
    const { a, b } = needPair(req.query);
    return store().diff(a, b);
  });

  app.get<{ Querystring: { a?: string; b?: string } }>('/api/compare', async (req) => {
    const { a, b } = needPair(req.query);
    return compare(compareSide(store(), a, 'A'), compareSide(store(), b, 'B'));
  });

  // ---- HTML fragments
  app.get('/designs', async (_req, reply) => sendHtml(reply, designsListView(store().list())));

  // the options of the page's upload question: a new revision of which saved design? (latest changed first)
  app.get('/designs/choices', async (_req, reply) => {
    const list = [...store().list()].sort((a, b) => b.updated_at.localeCompare(a.updated_at));
    reply.header('cache-control', 'no-store');
    return sendHtml(reply, designChoicesView(list));
  });

  app.get<{ Params: { id: string } }>('/designs/:id/history', async (req, reply) => {
    const s = store();
    const history = s.history(req.params.id);
    const designs = new Map(history.map((h) => [h.revision_id, s.revision(h.revision_id).design] as const));
    return sendHtml(reply, historyView(s.get(req.params.id), history, designs));
  });

  app.get<{ Querystring: { a?: string; b?: string } }>('/diff', async (req, reply) => {
    const { a, b } = needPair(req.query);
    const d = store().diff(a, b);
    return sendHtml(reply, diffView(d.from, d.to, d.entries));
  });

  app.get<{ Querystring: { a?: string; b?: string } }>('/compare', async (req, reply) => {
    const { a, b } = needPair(req.query);
    return sendHtml(reply, compareView(compare(compareSide(store(), a, 'before'), compareSide(store(), b, 'after'))));
  });

  /** The page's save button: the workbench form (or design_json), `_design_id` to add a revision, `_message`. */
  app.post('/designs/save', async (req, reply) => {
    const { design } = designFromBody(req.body);
    const designId = field(req.body, '_design_id') || undefined;
    const r = store().save(design, { designId, message: field(req.body, '_message') ?? null });
    return sendHtml(reply, saveResultView(r));
  });

  app.post<{ Params: { id: string } }>('/designs/:id/rename', async (req, reply) => {
    store().rename(req.params.id, field(req.body, 'name') ?? '');
    return sendHtml(reply, designsListView(store().list()));
  });

  app.post<{ Params: { id: string } }>('/designs/:id/duplicate', async (req, reply) => {
    store().duplicate(req.params.id, field(req.body, 'name'));
    return sendHtml(reply, designsListView(store().list()));
  });

  app.post<{ Params: { id: string } }>('/designs/:id/delete', async (req, reply) => {
    store().delete(req.params.id, field(req.body, 'confirm'));
    return sendHtml(reply, designsListView(store().list()));
  });
};

function needPair(q: unknown): { a: string; b: string } {
  const a = field(q, 'a');
  const b = field(q, 'b');
  if (!a || !b) throw storeErrors.pairMissing();
  return { a, b };
}

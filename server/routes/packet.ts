/**
 * Routes of the evidence packet and the exports, for a saved revision (GET) or the design on the page (POST,
 * the workbench form or {design}). `?date=YYYY-MM-DD` fixes the printed date (reproducible packets).
 * Register with `app.register(packetRoutes, { store?, dataDir? })`.
 */
import type { FastifyPluginAsync, FastifyReply } from 'fastify';
import type { DesignFile, UnitSystem, Warning } from '../../core/index.ts';
import { packetHtml } from '../../views/store-views.ts';
import { checksCsv, curvesCsv, designJson } from '../../packet/exports.ts';
import { evaluateForPacket, warningsOf } from '../../packet/build-packet.ts';
import { packetContent } from '../../packet/packet-content.ts';
import { renderPacketPdf } from '../../packet/packet-pdf.ts';
import { revisionId } from '../../store/revision-id.ts';
import { designFromBody, field, lazyStore, type StoreRouteOptions } from './store-context.ts';
import { storeErrors } from '../../store/errors.ts';
import { sendHtml } from '../html-reply.ts';

const EXPORTS = ['design.json', 'curves.csv', 'checks.csv', 'packet.pdf', 'packet.html'] as const;
type ExportName = (typeof EXPORTS)[number];

/** File name for a download: the design name reduced to safe characters, plus the short revision. */
export function downloadName(design: DesignFile, rev: string, ext: string): string {
  const base = design.name.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'design';
  return `${base}-${rev.slice(0, 8)}.${ext}`;
}

function parseDate(q: unknown, now: () => Date): Date {
  const t = field(q, 'date');
  if (t === undefined || t === '') return now();
  const d = new Date(/^\d{4}-\d{2}-\d{2}$/.test(t) ? `${t}T00:00:00Z` : t);
  if (Number.isNaN(d.getTime())) throw storeErrors.dateInvalid(t);
  return d;
}

async function send(
  reply: FastifyReply,
  what: ExportName,
  design: DesignFile,
  warnings: Warning[],
  date: Date,
  saved: boolean,
  units: UnitSystem = 'metric',
): Promise<FastifyReply> {
  const rev = revisionId(design);
  const disposition = (ext: string) => `attachment; filename="${downloadName(design, rev, ext)}"`;
  reply.header('x-lockstep-revision', rev);
  switch (what) {
    case 'design.json':
      return reply.type('application/json; charset=utf-8').header('content-disposition', disposition('json')).send(designJson(design));
    case 'curves.csv':
      return reply.type('text/csv; charset=utf-8').header('content-disposition', disposition('curves.csv')).send(curvesCsv(evaluateForPacket(design, warnings)));
    case 'checks.csv':
      return reply.type('text/csv; charset=utf-8').header('content-disposition', disposition('checks.csv')).send(checksCsv(evaluateForPacket(design, warnings)));
    case 'packet.html': {
      const content = packetContent({ design, result: evaluateForPacket(design, warnings), revisionId: saved ? rev : null, date, units });
      return sendHtml(reply, packetHtml(content));
    }
    case 'packet.pdf': {
      const content = packetContent({ design, result: evaluateForPacket(design, warnings), revisionId: saved ? rev : null, date, units });
      const pdf = await renderPacketPdf(content, date);
      return reply.type('application/pdf').header('content-disposition', disposition('pdf')).send(pdf);
    }
  }
}

export const packetRoutes: FastifyPluginAsync<StoreRouteOptions> = async (app, opts) => {
  const holder = lazyStore(opts);
  const now = opts.now ?? (() => new Date());
  app.addHook('onClose', async () => holder.close());

  for (const what of EXPORTS) {
    const path = what.startsWith('packet') ? what : `export/${what}`;
    // A saved revision (full id or unique prefix).
    app.get<{ Params: { rev: string } }>(`/revisions/:rev/${path}`, async (req, reply) => {
      const r = holder.get().revision(req.params.rev);
      return send(reply, what, r.design, warningsOf(r.design), parseDate(req.query, now), true, field(req.query, 'units') === 'us' ? 'us' : 'metric');
    });
    // The design on the page, unsaved: the workbench form, design_json or {design}.
    app.post(`/${path}`, async (req, reply) => {
      const { design, warnings } = designFromBody(req.body);
      // unsaved: a draft, in the unit system of the page (or `?units=us`)
      const units: UnitSystem = field(req.body, '_units') === 'us' || field(req.query, 'units') === 'us' ? 'us' : 'metric';
      return send(reply, what, design, warnings, parseDate(req.query, now), false, units);
    });
  }
};

/**
 * The only way the app sends HTML: a SafeHtml body (views/html.ts), so a plain string cannot reach the wire, or
 * the kept bytes of one (test/architecture/html-out.test.ts holds every route to it).
 */
import type { FastifyReply } from 'fastify';
import type { SafeHtml } from '../views/html.ts';

const HTML_TYPE = 'text/html; charset=utf-8';

export function sendHtml(reply: FastifyReply, body: SafeHtml, status = 200): FastifyReply {
  return reply.code(status).type(HTML_TYPE).send(body.html);
}

/** The bytes of a kept SafeHtml answer (server/response-cache.ts), as they are or compressed (Content-Encoding set by the caller). */
export function sendKeptHtml(reply: FastifyReply, bytes: Buffer, status: number): FastifyReply {
  return reply.code(status).type(HTML_TYPE).send(bytes);
}

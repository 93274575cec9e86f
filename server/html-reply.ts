/** The only way the app sends HTML: a SafeHtml body (views/html.ts), so a plain string cannot reach the wire. */
import type { FastifyReply } from 'fastify';
import type { SafeHtml } from '../views/html.ts';

export function sendHtml(reply: FastifyReply, body: SafeHtml, status = 200): FastifyReply {
  return reply.code(status).type('text/html; charset=utf-8').send(body.html);
}

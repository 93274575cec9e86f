/**
 * What the route tests of the workbench share: reading the page's `_shape` control, building a posted form the
 * way htmx sends it, and posting it through inject (no network).
 */
import type { FastifyInstance, LightMyRequestResponse } from 'fastify';
import type { FormValues } from '../../form/design-form.ts';

/** An attribute value as the browser reads it (the escaping of views/html.ts undone). */
export const unescapeAttr = (s: string) => s.replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');

/** The page (GET /) and the value of its `_shape` control. */
export async function openPage(app: FastifyInstance): Promise<{ body: string; shape: string }> {
  const page = await app.inject({ method: 'GET', url: '/' });
  return { body: page.body, shape: unescapeAttr(/name="_shape" value="([^"]*)"/.exec(page.body)![1]!) };
}

/** A form body: metric units and the page's shape unless `values` or `extra` say otherwise. */
export function formBody(shape: string, values: FormValues, extra: FormValues = {}): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries({ _units: 'metric', _shape: shape, ...values, ...extra })) p.append(k, v);
  return p.toString();
}

/** POST a form body as htmx does. */
export function postForm(app: FastifyInstance, url: string, body: string): Promise<LightMyRequestResponse> {
  return app.inject({ method: 'POST', url, headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: body });
}

/**
 * POST /workbench/cg-lift: the axle-lift tool of the conversion panel. Body: the form field `axle_lift`
 * holding a `lockstep-axle-lift/1` JSON text (docs/axle-lift.md). Answers an HTML fragment: 200 with the
 * CG height, its uncertainty and budget; 422 with the problems (htmx swaps 422, views/layout.ts).
 */
import type { FastifyInstance } from 'fastify';
import { axleLiftResultFile, readAxleLift } from '../../core/index.ts';
import { axleLiftErrors, axleLiftFragment } from '../../views/axle-lift-view.ts';
import { sendHtml } from '../html-reply.ts';

export async function cgLiftRoutes(app: FastifyInstance): Promise<void> {
  app.post('/workbench/cg-lift', async (req, reply) => {
    const body = req.body as Record<string, unknown> | null;
    const raw = body && typeof body === 'object' ? body.axle_lift : undefined;
    const text = typeof raw === 'string' ? raw : Array.isArray(raw) ? String(raw[raw.length - 1] ?? '') : '';
    if (text.trim() === '') {
      return sendHtml(reply, axleLiftErrors('Paste the axle-lift readings first (a JSON file, see docs/axle-lift.md).', 'APP_ERR_AXLE_LIFT_EMPTY'), 422);
    }
    let input: unknown;
    try {
      input = JSON.parse(text);
    } catch (e) {
      return sendHtml(reply, axleLiftErrors(`The readings are not valid JSON (${(e as Error).message}).`, 'APP_ERR_AXLE_LIFT_NOT_JSON'), 422);
    }
    const r = readAxleLift(input);
    if (!r.ok) {
      const n = r.errors.length;
      return sendHtml(reply, axleLiftErrors(`${n} problem${n === 1 ? '' : 's'} in the readings:`, 'APP_ERR_AXLE_LIFT_INVALID', r.errors), 422);
    }
    return sendHtml(reply, axleLiftFragment(axleLiftResultFile(r.input)));
  });
}

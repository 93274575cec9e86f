/**
 * POST /workbench/cg-lift: the axle-lift tool of the conversion panel (views/axle-lift-view.ts). The body is the
 * tool's form (`lift.*` fields, form/axle-lift-form.ts) together with the design form (for the page's
 * unit system `_units` and the load states the result can be applied to). `_lift_op` says what to do:
 * `compute` (default when lift fields are present), `add`, `remove:<i>` (lift rows), `restore` (the readings kept
 * in the browser after a reload: computed when complete, no problems marked otherwise), or `paste` (read the
 * `lockstep-axle-lift/1` text in `axle_lift`, fill the form from it and compute; the default when only
 * `axle_lift` is posted). Answers the whole #cg-lift block: 200 with the result, 422 with the problems marked
 * at their fields (htmx swaps 422, views/layout.ts). Its codes are the APP_ERR_AXLE_LIFT_* of form/errors.ts.
 */
import type { FastifyInstance } from 'fastify';
import type { LockstepError } from '../../core/errors.ts';
import { axleLiftResultFile, readAxleLift } from '../../core/index.ts';
import { axleLiftBlock, type AxleLiftBlock } from '../../views/axle-lift-view.ts';
import {
  applyLiftRowOp,
  convertLiftValues,
  LIFT_UNITS_FIELD,
  liftFileToValues,
  liftValues,
  loadStatesOf,
  readLiftForm,
  startingLiftValues,
} from '../../form/axle-lift-form.ts';
import { formErrors } from '../../form/errors.ts';
import { sendHtml } from '../html-reply.ts';
import { formValues, unitsOf } from './workbench.ts';

export async function cgLiftRoutes(app: FastifyInstance): Promise<void> {
  app.post('/workbench/cg-lift', async (req, reply) => {
    const posted = formValues(req.body);
    const units = unitsOf(posted._units);
    const typedIn = posted[LIFT_UNITS_FIELD] === undefined ? units : unitsOf(posted[LIFT_UNITS_FIELD]);
    // the block may have been kept across a unit switch: show the typed values in the page's units from now on
    let values = convertLiftValues(liftValues(posted), typedIn, units);
    const hasFields = Object.keys(values).length > 0;
    const op = posted._lift_op ?? (hasFields ? 'compute' : 'paste');
    const loadStates = loadStatesOf(posted, units).filter((s) => s.id !== '');
    const block = (b: Omit<AxleLiftBlock, 'units' | 'values' | 'loadStates'>, status = 200) =>
      sendHtml(reply, axleLiftBlock({ units, values, loadStates, pasted: posted.axle_lift, ...b }), status);
    const problem = (e: LockstepError, errors?: AxleLiftBlock['errors']) => block({ problem: { message: e.message, code: e.code, ...(errors ? { errors } : {}) } }, e.status);

    if (op === 'add' || op.startsWith('remove:')) {
      values = applyLiftRowOp(values, op);
      return block({});
    }
    if (op === 'paste') {
      const text = posted.axle_lift ?? '';
      if (!hasFields) values = startingLiftValues(units);
      if (text.trim() === '') {
        return problem(formErrors.axleLiftEmpty());
      }
      let input: unknown;
      try {
        input = JSON.parse(text);
      } catch (e) {
        return problem(formErrors.axleLiftNotJson((e as Error).message));
      }
      const r = readAxleLift(input);
      if (!r.ok) return problem(formErrors.axleLiftInvalid(r.errors.length, 'pasted'), r.errors);
      values = liftFileToValues(r.input, units);
      return block({ result: axleLiftResultFile(r.input), pasted: '' });
    }
    if (op === 'restore') {
      // readings kept in the browser after a reload (static/js/workbench.js): computed again when complete,
      // otherwise shown as typed, without marking what is still to be filled in
      const r = readLiftForm(values, units);
      return block(r.ok ? { result: axleLiftResultFile(r.input) } : {});
    }
    if (op !== 'compute') throw formErrors.unknownOperation(op);
    const r = readLiftForm(values, units);
    if (!r.ok) return block({ errors: r.errors }, 422);
    return block({ result: axleLiftResultFile(r.input) });
  });
}

/**
 * Errors of the form model (form/): the APP_ERR_* codes form code throws while it reads a posted form. Each has
 * a stable code (docs/errors.md), an HTTP status and a message a person can act on (core/errors.ts
 * `declareErrors`). The server's own codes and the framework's errors are in server/errors.ts.
 */
import { declareErrors } from '../core/errors.ts';

export const formErrors = declareErrors({
  badRequest: { code: 'APP_ERR_BAD_REQUEST', status: 400, message: (why: string) => why },
  unknownOperation: { code: 'APP_ERR_UNKNOWN_OPERATION', status: 400, message: (op: string) => `Unknown operation "${op.slice(0, 60)}".` },
  fieldName: {
    code: 'APP_ERR_FIELD_NAME',
    status: 400,
    message: (name: string, why: string) => `The form field "${name.slice(0, 80)}" cannot be read: ${why}. The page never sends such a field; reload the page.`,
  },
  tooManyFields: {
    code: 'APP_ERR_TOO_MANY_FIELDS',
    status: 400,
    message: (n: number, max: number) => `The form has ${n} fields; at most ${max} are read. Reload the page.`,
  },
  sizingNotApplicable: {
    code: 'APP_ERR_SIZING_NOT_APPLICABLE',
    status: 422,
    message: (why: string) => `This proposal no longer fits the design (${why}). The design is unchanged; choose one of the proposals shown now.`,
  },
  // the axle-lift tool (form/axle-lift-form.ts), answered inside its block with the problems marked
  axleLiftEmpty: {
    code: 'APP_ERR_AXLE_LIFT_EMPTY',
    status: 422,
    message: () => 'Paste the axle-lift readings first (a lockstep-axle-lift/1 file, see docs/axle-lift.md), or fill in the form.',
  },
  axleLiftNotJson: {
    code: 'APP_ERR_AXLE_LIFT_NOT_JSON',
    status: 422,
    message: (why: string) => `The pasted readings are not valid JSON (${why}). The form is unchanged.`,
  },
  /** `from` the pasted file (the form is left as it was) or the form's own fields (each marked at its field). */
  axleLiftInvalid: {
    code: 'APP_ERR_AXLE_LIFT_INVALID',
    status: 422,
    message: (n: number, from: 'pasted' | 'form') =>
      from === 'pasted'
        ? `${n} problem${n === 1 ? '' : 's'} in the pasted readings (the form is unchanged):`
        : `${n} input${n === 1 ? ' needs' : 's need'} attention (marked above).`,
  },
});

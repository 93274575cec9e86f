/**
 * Errors of the design store (STORE_ERR_*), and of the requests the store and packet routes read. Each has a
 * stable code (docs/errors.md), the HTTP status the routes answer with and a message that says what to do
 * (core/errors.ts `declareErrors`). The command line passes them through unchanged with exit code 2.
 */
import { declareErrors } from '../core/errors.ts';

const problems = (n: number) => `${n} problem${n === 1 ? '' : 's'}`;

export const storeErrors = declareErrors({
  openFailed: {
    code: 'STORE_ERR_OPEN_FAILED',
    status: 500,
    message: (dir: string, why: string) => `cannot open the design store in "${dir}": ${why} (set LOCKSTEP_DATA_DIR to a writable folder)`,
  },
  schemaTooNew: {
    code: 'STORE_ERR_SCHEMA_TOO_NEW',
    status: 500,
    message: (have: number, know: number) =>
      `the design store has schema version ${have} but this Lockstep knows versions up to ${know}; update Lockstep or use another LOCKSTEP_DATA_DIR`,
  },
  designNotFound: { code: 'STORE_ERR_DESIGN_NOT_FOUND', status: 404, message: (id: string) => `no saved design has id "${id}" (list them with: lockstep store list)` },
  revisionNotFound: {
    code: 'STORE_ERR_REVISION_NOT_FOUND',
    status: 404,
    message: (id: string) => `no saved revision has id "${id}" (give the full 64-character hash or a unique prefix of at least 8)`,
  },
  revisionAmbiguous: {
    code: 'STORE_ERR_REVISION_AMBIGUOUS',
    status: 400,
    message: (prefix: string, n: number) => `revision prefix "${prefix}" matches ${n} revisions; give more characters`,
  },
  badRevisionId: { code: 'STORE_ERR_REVISION_ID_INVALID', status: 400, message: (id: string) => `"${id.slice(0, 80)}" is not a revision id (8 to 64 hexadecimal characters)` },
  notInDesign: {
    code: 'STORE_ERR_REVISION_NOT_IN_DESIGN',
    status: 404,
    message: (rev: string, id: string) => `revision ${rev.slice(0, 12)} is not in the history of design "${id}"`,
  },
  revisionCorrupt: {
    code: 'STORE_ERR_REVISION_CORRUPT',
    status: 500,
    message: (id: string) => `revision ${id} does not match its content; restore the data folder from a backup`,
  },
  /** `saving` false: a design read for a packet or an export, not for the store. */
  designInvalid: {
    code: 'STORE_ERR_DESIGN_INVALID',
    status: 422,
    message: (issues: readonly string[], saving = true) => `the design is not valid${saving ? ' and was not saved' : ''} (${problems(issues.length)})`,
    details: (issues: readonly string[]) => issues,
  },
  nameInvalid: { code: 'STORE_ERR_NAME_INVALID', status: 422, message: (why: string) => `design name ${why} (1 to 200 characters)` },
  messageTooLong: { code: 'STORE_ERR_MESSAGE_TOO_LONG', status: 422, message: (n: number) => `the revision message is ${n} characters; at most 2000 allowed` },
  deleteNotConfirmed: {
    code: 'STORE_ERR_DELETE_NOT_CONFIRMED',
    status: 409,
    message: (id: string) => `deleting design "${id}" removes it and its history; repeat the request with confirm set to the design id to go ahead`,
  },
  // the requests of the store and packet routes (server/routes/store-context.ts)
  bodyMissing: { code: 'STORE_ERR_BODY_MISSING', status: 400, message: () => 'send the design as JSON {"design": {...}} or as the workbench form' },
  notJson: { code: 'STORE_ERR_NOT_JSON', status: 400, message: (why: string) => `design_json is not valid JSON (${why})` },
  pairMissing: { code: 'STORE_ERR_PAIR_MISSING', status: 400, message: () => 'give two revisions (or design ids) to compare as ?a=…&b=…' },
  dateInvalid: { code: 'STORE_ERR_DATE_INVALID', status: 400, message: (text: string) => `date "${text.slice(0, 40)}" is not a date; use YYYY-MM-DD` },
});

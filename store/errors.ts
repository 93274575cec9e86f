/**
 * Errors of the design store. Each carries a stable code (docs/errors.md) and a message that says what
 * to do; `status` is the HTTP status the routes answer with.
 */
export class StoreError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status: number,
    readonly details: string[] = [],
  ) {
    super(message);
    this.name = 'StoreError';
  }
}

export const storeErrors = {
  openFailed: (dir: string, why: string) =>
    new StoreError('STORE_ERR_OPEN_FAILED', `cannot open the design store in "${dir}": ${why} (set LOCKSTEP_DATA_DIR to a writable folder)`, 500),
  schemaTooNew: (have: number, know: number) =>
    new StoreError(
      'STORE_ERR_SCHEMA_TOO_NEW',
      `the design store has schema version ${have} but this Lockstep knows versions up to ${know}; update Lockstep or use another LOCKSTEP_DATA_DIR`,
      500,
    ),
  designNotFound: (id: string) => new StoreError('STORE_ERR_DESIGN_NOT_FOUND', `no saved design has id "${id}" (list them with: lockstep store list)`, 404),
  revisionNotFound: (id: string) =>
    new StoreError('STORE_ERR_REVISION_NOT_FOUND', `no saved revision has id "${id}" (give the full 64-character hash or a unique prefix of at least 8)`, 404),
  revisionAmbiguous: (prefix: string, n: number) =>
    new StoreError('STORE_ERR_REVISION_AMBIGUOUS', `revision prefix "${prefix}" matches ${n} revisions; give more characters`, 400),
  badRevisionId: (id: string) =>
    new StoreError('STORE_ERR_REVISION_ID_INVALID', `"${id.slice(0, 80)}" is not a revision id (8 to 64 hexadecimal characters)`, 400),
  designInvalid: (issues: string[]) =>
    new StoreError('STORE_ERR_DESIGN_INVALID', `the design is not valid and was not saved (${issues.length} problem${issues.length === 1 ? '' : 's'})`, 422, issues),
  nameInvalid: (why: string) => new StoreError('STORE_ERR_NAME_INVALID', `design name ${why} (1 to 200 characters)`, 422),
  messageTooLong: (n: number) => new StoreError('STORE_ERR_MESSAGE_TOO_LONG', `the revision message is ${n} characters; at most 2000 allowed`, 422),
  deleteNotConfirmed: (id: string) =>
    new StoreError(
      'STORE_ERR_DELETE_NOT_CONFIRMED',
      `deleting design "${id}" removes it and its history; repeat the request with confirm set to the design id to go ahead`,
      409,
    ),
  notInDesign: (rev: string, id: string) =>
    new StoreError('STORE_ERR_REVISION_NOT_IN_DESIGN', `revision ${rev.slice(0, 12)} is not in the history of design "${id}"`, 404),
} as const;

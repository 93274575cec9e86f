/**
 * Errors of the web app. Each has a stable code (docs/errors.md), an HTTP status and a message a person can
 * act on. Fastify's own errors are mapped onto these codes in server/app.ts.
 */
export const APP_ERROR_STATUS = {
  APP_ERR_NOT_FOUND: 404,
  APP_ERR_BODY_TOO_LARGE: 413,
  APP_ERR_UNSUPPORTED_MEDIA_TYPE: 415,
  APP_ERR_BAD_REQUEST: 400,
  APP_ERR_FORM_INVALID: 422,
  APP_ERR_UPLOAD_NOT_JSON: 422,
  APP_ERR_UPLOAD_INVALID: 422,
  APP_ERR_UPLOAD_TOO_LARGE: 413,
  APP_ERR_UNKNOWN_OPERATION: 400,
  APP_ERR_INTERNAL: 500,
} as const;

export type AppErrorCode = keyof typeof APP_ERROR_STATUS;

export class AppError extends Error {
  readonly statusCode: number;
  constructor(
    readonly code: AppErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'AppError';
    this.statusCode = APP_ERROR_STATUS[code];
  }
}

/** Largest request body accepted, bytes (a design file is a few kilobytes). */
export const BODY_LIMIT = 1024 * 1024;
/** Largest design file accepted through the upload, characters. */
export const UPLOAD_LIMIT = 512 * 1024;

export const appErrors = {
  notFound: (url: string) => new AppError('APP_ERR_NOT_FOUND', `There is no page at ${url}. The workbench is at /.`),
  bodyTooLarge: () =>
    new AppError('APP_ERR_BODY_TOO_LARGE', `The request is larger than ${BODY_LIMIT / 1024} KiB; a design is normally a few kilobytes.`),
  unsupportedMediaType: (type: string) =>
    new AppError('APP_ERR_UNSUPPORTED_MEDIA_TYPE', `Content type "${type}" is not accepted here; send the form (application/x-www-form-urlencoded).`),
  badRequest: (why: string) => new AppError('APP_ERR_BAD_REQUEST', why),
  uploadNotJson: (why: string) =>
    new AppError('APP_ERR_UPLOAD_NOT_JSON', `The file is not valid JSON (${why}). A design file is JSON with "format": "lockstep-design/1". Your current design is unchanged.`),
  uploadInvalid: (n: number) =>
    new AppError('APP_ERR_UPLOAD_INVALID', `The file is not a valid design (${n} problem${n === 1 ? '' : 's'}, listed below). Your current design is unchanged.`),
  uploadTooLarge: () =>
    new AppError('APP_ERR_UPLOAD_TOO_LARGE', `The file is larger than ${UPLOAD_LIMIT / 1024} KiB; a design file is normally a few kilobytes. Your current design is unchanged.`),
  unknownOperation: (op: string) => new AppError('APP_ERR_UNKNOWN_OPERATION', `Unknown operation "${op.slice(0, 60)}".`),
  internal: () => new AppError('APP_ERR_INTERNAL', 'Something went wrong on the server. Your input is kept in this browser; try again or reload.'),
} as const;

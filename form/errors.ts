/**
 * Errors of the web app. Each has a stable code (docs/errors.md), an HTTP status and a message a person can
 * act on. Fastify's own errors are mapped onto these codes in server/app.ts.
 */
import { DESIGN_FILE_MAX_TEXT, DESIGN_FILE_MAX_BYTES } from '../core/file-limits.ts';

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
  APP_ERR_FIELD_NAME: 400,
  APP_ERR_TOO_MANY_FIELDS: 400,
  APP_ERR_SIZING_NOT_APPLICABLE: 422,
  APP_ERR_HOST_NOT_ALLOWED: 421,
  APP_ERR_CROSS_SITE: 403,
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

/** Largest design file accepted through the upload, bytes: the one design-file limit (core/file-limits.ts). */
export const UPLOAD_LIMIT = DESIGN_FILE_MAX_BYTES;
/**
 * Largest request body accepted, bytes: an upload at the limit sent as a form field (percent-encoding takes at
 * most 3 bytes per byte) plus the rest of the form.
 */
export const BODY_LIMIT = 3 * UPLOAD_LIMIT + 64 * 1024;

export const appErrors = {
  notFound: (url: string) => new AppError('APP_ERR_NOT_FOUND', `There is no page at ${url}. The workbench is at /.`),
  bodyTooLarge: () =>
    new AppError('APP_ERR_BODY_TOO_LARGE', `The request is larger than ${(BODY_LIMIT / 1048576).toFixed(1)} MiB; a design is normally a few kilobytes.`),
  unsupportedMediaType: (type: string) =>
    new AppError('APP_ERR_UNSUPPORTED_MEDIA_TYPE', `Content type "${type.slice(0, 80)}" is not accepted here; send the form (application/x-www-form-urlencoded) or, to the store and packet routes, JSON (application/json).`),
  badRequest: (why: string) => new AppError('APP_ERR_BAD_REQUEST', why),
  uploadNotJson: (why: string) =>
    new AppError('APP_ERR_UPLOAD_NOT_JSON', `The file is not valid JSON (${why}). A design file is JSON with "format": "lockstep-design/1". Your current design is unchanged.`),
  uploadInvalid: (n: number) =>
    new AppError('APP_ERR_UPLOAD_INVALID', `The file is not a valid design (${n} problem${n === 1 ? '' : 's'}, listed below). Your current design is unchanged.`),
  uploadTooLarge: () =>
    new AppError('APP_ERR_UPLOAD_TOO_LARGE', `The file is larger than ${DESIGN_FILE_MAX_TEXT}; a design file is normally a few kilobytes. Your current design is unchanged.`),
  unknownOperation: (op: string) => new AppError('APP_ERR_UNKNOWN_OPERATION', `Unknown operation "${op.slice(0, 60)}".`),
  sizingNotApplicable: (why: string) =>
    new AppError('APP_ERR_SIZING_NOT_APPLICABLE', `This proposal no longer fits the design (${why}). The design is unchanged; choose one of the proposals shown now.`),
  hostNotAllowed: (host: string) =>
    new AppError('APP_ERR_HOST_NOT_ALLOWED', `This server answers only at its own address, not at "${host.slice(0, 80)}". Open it at the address it printed when it started, or add the name to ALLOWED_HOSTS.`),
  crossSite: () =>
    new AppError('APP_ERR_CROSS_SITE', 'A change sent from another web site was refused. Make the change on the workbench page itself.'),
  internal: () => new AppError('APP_ERR_INTERNAL', 'Something went wrong on the server. Your input is kept in this browser; try again or reload.'),
} as const;

/** Fastify's own 4xx errors (body parsing, media type) as the app's codes; null for anything else. */
export function fromFrameworkError(err: { code?: string; statusCode?: number; message: string }, contentType: unknown): AppError | null {
  if (err.code === 'FST_ERR_CTP_BODY_TOO_LARGE') return appErrors.bodyTooLarge();
  if (err.code === 'FST_ERR_CTP_INVALID_MEDIA_TYPE') return appErrors.unsupportedMediaType(String(contentType ?? 'none'));
  if (typeof err.statusCode === 'number' && err.statusCode >= 400 && err.statusCode < 500 && err.code?.startsWith('FST_')) return appErrors.badRequest(err.message);
  return null;
}

/**
 * The server's own errors (APP_ERR_*): addresses, request size and type, the workbench's uploads and downloads,
 * the start-up of `npm start`, and the framework's errors mapped onto these codes. Declared once each with
 * core/errors.ts `declareErrors`; the form model's codes are in form/errors.ts. server/app.ts answers every one.
 */
import type { LockstepError } from '../core/errors.ts';
import { declareErrors } from '../core/errors.ts';
import { DESIGN_FILE_MAX_BYTES, DESIGN_FILE_MAX_TEXT } from '../core/file-limits.ts';
import { formErrors } from '../form/errors.ts';

/** Largest design file accepted through the upload, bytes: the one design-file limit (core/file-limits.ts). */
export const UPLOAD_LIMIT = DESIGN_FILE_MAX_BYTES;
/**
 * Largest request body accepted, bytes: an upload at the limit sent as a form field (percent-encoding takes at
 * most 3 bytes per byte) plus the rest of the form.
 */
export const BODY_LIMIT = 3 * UPLOAD_LIMIT + 64 * 1024;

export const serverErrors = declareErrors({
  notFound: { code: 'APP_ERR_NOT_FOUND', status: 404, message: (url: string) => `There is no page at ${url}. The workbench is at /.` },
  bodyTooLarge: {
    code: 'APP_ERR_BODY_TOO_LARGE',
    status: 413,
    message: () => `The request is larger than ${(BODY_LIMIT / 1048576).toFixed(1)} MiB; a design is normally a few kilobytes.`,
  },
  unsupportedMediaType: {
    code: 'APP_ERR_UNSUPPORTED_MEDIA_TYPE',
    status: 415,
    message: (type: string) =>
      `Content type "${type.slice(0, 80)}" is not accepted here; send the form (application/x-www-form-urlencoded) or, to the store and packet routes, JSON (application/json).`,
  },
  formInvalid: {
    code: 'APP_ERR_FORM_INVALID',
    status: 422,
    message: (_issues: readonly string[]) => 'Fix the marked inputs before downloading.',
    details: (issues: readonly string[]) => issues,
  },
  uploadNotJson: {
    code: 'APP_ERR_UPLOAD_NOT_JSON',
    status: 422,
    message: (why: string) => `The file is not valid JSON (${why}). A design file is JSON with "format": "lockstep-design/1". Your current design is unchanged.`,
  },
  uploadInvalid: {
    code: 'APP_ERR_UPLOAD_INVALID',
    status: 422,
    message: (n: number) => `The file is not a valid design (${n} problem${n === 1 ? '' : 's'}, listed below). Your current design is unchanged.`,
  },
  uploadTooLarge: {
    code: 'APP_ERR_UPLOAD_TOO_LARGE',
    status: 413,
    message: () => `The file is larger than ${DESIGN_FILE_MAX_TEXT}; a design file is normally a few kilobytes. Your current design is unchanged.`,
  },
  hostNotAllowed: {
    code: 'APP_ERR_HOST_NOT_ALLOWED',
    status: 421,
    message: (host: string) =>
      `This server answers only at its own address, not at "${host.slice(0, 80)}". Open it at the address it printed when it started, or add the name to ALLOWED_HOSTS.`,
  },
  crossSite: {
    code: 'APP_ERR_CROSS_SITE',
    status: 403,
    message: () => 'A change sent from another web site was refused. Make the change on the workbench page itself.',
  },
  internal: {
    code: 'APP_ERR_INTERNAL',
    status: 500,
    message: () => 'Something went wrong on the server. Your input is kept in this browser; try again or reload.',
  },
  // `npm start` (server/main.ts): printed before the process ends; the status is not sent anywhere
  badPort: { code: 'APP_ERR_BAD_PORT', status: 500, message: (text: string | undefined) => `PORT="${text}" is not a port number (0 to 65535).` },
  portInUse: {
    code: 'APP_ERR_PORT_IN_USE',
    status: 500,
    message: (port: number, host: string) => `port ${port} on ${host} is in use; start with another, e.g. PORT=3001 npm start`,
  },
  listen: { code: 'APP_ERR_LISTEN', status: 500, message: (port: number, host: string, why: string) => `cannot listen on ${host}:${port}: ${why}` },
});

/** Fastify's own 4xx errors (body parsing, media type) as the app's codes; null for anything else. */
export function fromFrameworkError(err: { code?: string; statusCode?: number; message: string }, contentType: unknown): LockstepError | null {
  if (err.code === 'FST_ERR_CTP_BODY_TOO_LARGE') return serverErrors.bodyTooLarge();
  if (err.code === 'FST_ERR_CTP_INVALID_MEDIA_TYPE') return serverErrors.unsupportedMediaType(String(contentType ?? 'none'));
  if (typeof err.statusCode === 'number' && err.statusCode >= 400 && err.statusCode < 500) return formErrors.badRequest(err.message);
  return null;
}

// Every APP_ERR_* code of the workbench: stable code, HTTP status (source: RFC 9110 meanings: 400, 404, 413, 415, 422,
// 500), a message a person can act on, and a row in docs/errors.md (project convention, style anchors §1:
// errors declared once and tested as data).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { APP_ERROR_STATUS, AppError, appErrors } from '../../form/errors.ts';

const docs = readFileSync(new URL('../../docs/errors.md', import.meta.url), 'utf8');

describe('APP_ERR_* codes', () => {
  const made: AppError[] = [
    appErrors.notFound('/x'),
    appErrors.bodyTooLarge(),
    appErrors.unsupportedMediaType('text/csv'),
    appErrors.badRequest('Expected the design form as the request body.'),
    appErrors.uploadNotJson('Unexpected end'),
    appErrors.uploadInvalid(2),
    appErrors.uploadTooLarge(),
    appErrors.unknownOperation('x'),
    appErrors.internal(),
  ];
  it('every factory makes an AppError whose status matches the table', () => {
    for (const e of made) {
      expect(e).toBeInstanceOf(AppError);
      expect(e.statusCode).toBe(APP_ERROR_STATUS[e.code]);
      expect(e.message.length).toBeGreaterThan(10);
    }
  });
  it('every code in the table is documented in docs/errors.md', () => {
    for (const code of Object.keys(APP_ERROR_STATUS)) expect(docs, code).toContain(`\`${code}\``);
  });
  it('statuses are the RFC 9110 ones for each meaning', () => {
    expect(APP_ERROR_STATUS.APP_ERR_NOT_FOUND).toBe(404);
    expect(APP_ERROR_STATUS.APP_ERR_BODY_TOO_LARGE).toBe(413);
    expect(APP_ERROR_STATUS.APP_ERR_UNSUPPORTED_MEDIA_TYPE).toBe(415);
    expect(APP_ERROR_STATUS.APP_ERR_UPLOAD_INVALID).toBe(422);
    expect(APP_ERROR_STATUS.APP_ERR_INTERNAL).toBe(500);
  });
  it('upload errors say the current design is unchanged', () => {
    for (const e of [appErrors.uploadNotJson('x'), appErrors.uploadInvalid(1), appErrors.uploadTooLarge()]) expect(e.message).toContain('unchanged');
  });
});

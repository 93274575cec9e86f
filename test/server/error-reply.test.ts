// The one error answer of the app (server/error-reply.ts), through inject (Fastify testing guide): JSON
// {code, message, details} for /api and non-HTML clients, a fragment for htmx chosen by the element it replaces
// (HX-Target, htmx request headers reference), a page for a browser. Statuses: RFC 9110 §15 (400, 404, 415, 500).
// The rest is the project's own rule (DEVELOPERS.md, "Errors"), no published source.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app.ts';

const FORM = { 'content-type': 'application/x-www-form-urlencoded' };
let app: FastifyInstance;
let dir: string;
let saved: string | undefined;

beforeAll(async () => {
  dir = mkdtempSync(path.join(tmpdir(), 'lockstep-error-reply-'));
  saved = process.env.LOCKSTEP_DATA_DIR;
  process.env.LOCKSTEP_DATA_DIR = dir;
  app = buildApp();
  app.get('/api/test-throws', async () => {
    throw new Error('a programming error with internal words');
  });
  await app.ready();
});
afterAll(async () => {
  await app.close();
  if (saved === undefined) delete process.env.LOCKSTEP_DATA_DIR;
  else process.env.LOCKSTEP_DATA_DIR = saved;
  rmSync(dir, { recursive: true, force: true });
});

describe('one error answer', () => {
  it('JSON has exactly code, message and details, for the app, the store routes and the framework alike', async () => {
    const answers = [
      [await app.inject({ url: '/nowhere' }), 404, 'APP_ERR_NOT_FOUND'],
      [await app.inject({ url: '/api/diff?a=1' }), 400, 'STORE_ERR_PAIR_MISSING'],
      [await app.inject({ method: 'POST', url: '/api/designs', headers: { 'content-type': 'text/plain' }, payload: 'x' }), 415, 'APP_ERR_UNSUPPORTED_MEDIA_TYPE'],
      [await app.inject({ method: 'POST', url: '/workbench/update', headers: FORM, payload: '_op=explode' }), 400, 'APP_ERR_UNKNOWN_OPERATION'],
    ] as const;
    for (const [r, status, code] of answers) {
      expect(r.statusCode, code).toBe(status);
      expect(Object.keys(r.json()).sort(), code).toEqual(['code', 'details', 'message']);
      expect(r.json().code).toBe(code);
      expect(r.json().details).toEqual([]);
    }
  });

  it('an unexpected error is APP_ERR_INTERNAL with a message for people, not the thrown text', async () => {
    const r = await app.inject({ url: '/api/test-throws' });
    expect(r.statusCode).toBe(500);
    expect(r.json()).toEqual({ code: 'APP_ERR_INTERNAL', message: expect.stringContaining('try again'), details: [] });
    expect(r.body).not.toContain('internal words');
  });

  it('the lines per problem travel in details', async () => {
    const r = await app.inject({ method: 'POST', url: '/api/designs', payload: { design: { format: 'lockstep-design/1' } } });
    expect(r.statusCode).toBe(422);
    expect(r.json().code).toBe('STORE_ERR_DESIGN_INVALID');
    expect(r.json().details.length).toBeGreaterThan(1);
    expect(r.json().details).toContain('name: is required (a string)');
  });

  it('htmx gets the status block where it replaces #status (or names no element), a coded alert elsewhere', async () => {
    const post = (target?: string) =>
      app.inject({ method: 'POST', url: '/workbench/update', headers: { ...FORM, 'hx-request': 'true', ...(target ? { 'hx-target': target } : {}) }, payload: '_op=explode' });
    for (const r of [await post('status'), await post()]) {
      expect(r.statusCode).toBe(400);
      expect(r.headers['content-type']).toBe('text/html; charset=utf-8');
      expect(r.body).toMatch(/^<div id="status" class="status error"[^>]* data-code="APP_ERR_UNKNOWN_OPERATION"/);
    }
    const other = await post('cg-lift');
    expect(other.body).toMatch(/^<div class="error" role="alert">/);
    expect(other.body).toContain('[APP_ERR_UNKNOWN_OPERATION]');
    expect(other.body).not.toContain('id="status"');
  });

  it('a browser gets a page with the message and the code, for the store routes too', async () => {
    const r = await app.inject({ url: '/diff?a=1', headers: { accept: 'text/html' } });
    expect(r.statusCode).toBe(400);
    expect(r.body).toContain('<h1>Request not handled</h1>');
    expect(r.body).toContain('<code>STORE_ERR_PAIR_MISSING</code>');
  });
});

// POST /workbench/cg-lift through inject (no network).
// Sources: a vehicle with known CG height (hand-derived statics: with the rear raised by H on wheelbase L
// the front axle gains W (h − r) tan θ / L, θ = asin(H/L)); RFC 9110 (422 Unprocessable Content);
// OWASP XSS Prevention Cheat Sheet rule #1 (user text escaped in content).
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION } from '../../core/index.ts';
import { buildApp } from '../../server/app.ts';

let app: FastifyInstance;
beforeAll(async () => {
  app = buildApp();
  await app.ready();
});
afterAll(async () => {
  await app.close();
});

// Known vehicle: L = 3.4 m, r = 0.34 m, h = 0.95 m, W = 2600 kg split evenly.
const L = 3.4;
const gain = (H: number) => (2600 * (0.95 - 0.34) * (H / Math.sqrt(L * L - H * H))) / L;
const good = {
  format: 'lockstep-axle-lift/1',
  wheelbase_m: L,
  wheel_centre_height_m: 0.34,
  level: { front_axle_kg: 1300, rear_axle_kg: 1300 },
  lifts: [
    { raised_axle: 'rear', lift_height_m: 0.6, front_axle_kg: 1300 + gain(0.6) },
    { raised_axle: 'front', lift_height_m: 0.6, rear_axle_kg: 1300 + gain(0.6) },
  ],
  scale_resolution_kg: 1,
  lift_height_uncertainty_m: 0.002,
  wheelbase_uncertainty_m: 0.003,
};
const post = (text: string) =>
  app.inject({ method: 'POST', url: '/workbench/cg-lift', headers: { 'content-type': 'application/x-www-form-urlencoded', 'hx-request': 'true' }, payload: new URLSearchParams({ axle_lift: text }).toString() });

describe('POST /workbench/cg-lift', () => {
  it('answers the known CG height with its uncertainty, budget, the snippet to apply and the caution', async () => {
    const res = await post(JSON.stringify(good));
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.body).toMatch(/CG height above ground<\/th><td>0\.950 m/);
    expect(res.body).toMatch(/Uncertainty budget/);
    expect(res.body).toContain('cg_height_derived_from');
    expect(res.body).toContain(CAUTION);
  });

  it('422 with the field named for invalid readings, user text escaped', async () => {
    const res = await post(JSON.stringify({ ...good, wheelbase_m: 0.2, lifts: [{ raised_axle: '<b>x</b>', lift_height_m: 0.5, front_axle_kg: 1400 }] }));
    expect(res.statusCode).toBe(422);
    expect(res.body).toContain('APP_ERR_AXLE_LIFT_INVALID');
    expect(res.body).toMatch(/wheelbase_m<\/code>: 0\.2 is below the allowed range, from 0\.5 to 10 m/);
    expect(res.body).toContain('&lt;b&gt;x&lt;/b&gt;');
    expect(res.body).not.toContain('<b>x</b>');
  });

  it('422 for text that is not JSON and for an empty field', async () => {
    expect((await post('{oops')).body).toContain('APP_ERR_AXLE_LIFT_NOT_JSON');
    const empty = await post('  ');
    expect(empty.statusCode).toBe(422);
    expect(empty.body).toContain('APP_ERR_AXLE_LIFT_EMPTY');
  });

  it('the workbench page carries the axle-lift form in the conversion panel', async () => {
    const page = await app.inject({ method: 'GET', url: '/' });
    expect(page.body).toContain('id="panel-conversion"');
    expect(page.body).toContain('hx-post="/workbench/cg-lift"');
  });
});

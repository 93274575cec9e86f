/**
 * Hostile requests to the form routes, shared by the property test (test/server/hostile-input.test.ts, through
 * inject) and the fuzz harness (scripts/fuzz.ts, against a live loopback server): field names built from
 * prototype members, real design keys, huge, negative and odd list positions; odd values and operations; foreign
 * Host, Origin and Sec-Fetch-Site headers; other content types.
 */
import fc from 'fast-check';
import { demoDesign } from '../core/index.ts';
import { designToValues, type FormValues } from '../form/design-form.ts';
import { panels } from '../views/panels/index.ts';

/** Every route that reads a form body (the deferred panels included); the packet PDF is left out (slow to draw). */
export const FORM_ROUTES: readonly string[] = [
  '/workbench/update',
  '/workbench/cg-lift',
  '/workbench/design.json',
  '/workbench/table.csv',
  ...panels.filter((p) => p.results && p.deferred).map((p) => `/workbench/panel/${p.id}`),
  '/designs/save',
  '/api/designs',
  '/packet.html',
  '/export/design.json',
  '/export/checks.csv',
];

/** Names a plain object inherits, and the three special ones. */
export const PROTOTYPE_NAMES: readonly string[] = [...Object.getOwnPropertyNames(Object.prototype), 'constructor', 'prototype'];

const KEYS = ['vehicle', 'load_states', 'mass_kg', 'wheelbase_m', 'label', 'id', 'axles', 'front', 'rear', 'brake', 'piston_diameters_mm', 'hydraulics', 'balance_bar', 'rear_valve', 'knee_bar_at_rear_axle_kg', 'build_up', 'baseline', 'wheels_kg', 'lift', 'lifts', 'lift_height_m', 'reading_kg', 'overrides', 'length', 'name', 'x_kg', 'x'];
const POSITIONS = ['0', '1', '7', '8', '19', '63', '64', '100000000', '4294967296', '-1', '01', '1e3', ''];
const CONTROL_NAMES = ['_op', '_units', '_shape', '_exact', '_provenance', '_upload', '_restore', '_lift_op', '_lift_units', '_design_id', '__proto__', '_constructor'];

const segment = fc.oneof(fc.constantFrom(...KEYS, ...PROTOTYPE_NAMES), fc.string({ maxLength: 8 }));
const step = fc.oneof(
  segment.map((k) => `.${k}`),
  fc.constantFrom(...POSITIONS).map((i) => `[${i}]`),
);
/** A field name: a first key and up to four steps, or a page control. */
export const fieldName = fc.oneof(
  { weight: 6, arbitrary: fc.tuple(segment, fc.array(step, { maxLength: 4 })).map(([k, s]) => k + s.join('')) },
  { weight: 1, arbitrary: fc.constantFrom(...CONTROL_NAMES) },
  { weight: 1, arbitrary: fc.constantFrom('vehicle.__proto__.x_kg', 'lift.__proto__.x', 'constructor.prototype.x', '__proto__.x', 'load_states.length', 'load_states[100000000].mass_kg', 'lift.lifts[100000000].lift_height_m', 'load_states[0].constructor', 'vehicle.toString', 'vehicle.mass_constructor') },
);

const OPS = ['demo', 'add:load_states', 'dup:load_states[0]', 'remove:load_states[100000000]', 'add:lift.lifts', 'size:apply:hydraulics.balance_bar.setting_front_share=0.6', 'size:apply:__proto__=1', 'cglift:apply:laden=0.9,0.01', 'cglift:apply:__proto__=1,1', 'add:__proto__', 'remove:7', 'add'];
/** A field value: numbers, odd numbers, JSON with prototype keys, operations, any text. */
export const fieldValue = fc.oneof(
  fc.constantFrom('', '1', '0', '-1', '1e400', 'NaN', '58 in', 'true', '__proto__', '{"__proto__":{"x":1}}', '{"constructor":{"prototype":{"x":1}}}', '[1,2]', 'null', ...OPS),
  fc.string({ maxLength: 20 }),
);

export interface HostileRequest {
  url: string;
  headers: Record<string, string>;
  payload: string;
}

const PAGE_HEADERS = { 'hx-request': fc.constant('true'), accept: fc.constantFrom('text/html', 'application/json') };
/** Mostly what the page sends; one request in six with a foreign Host, Origin or Sec-Fetch-Site. */
const HEADERS = fc.oneof(
  { weight: 5, arbitrary: fc.record(PAGE_HEADERS, { requiredKeys: [] }) },
  {
    weight: 1,
    arbitrary: fc.record(
      {
        ...PAGE_HEADERS,
        host: fc.constantFrom('evil.example', 'localhost.evil.example', '127.0.0.1.nip.example', '[::1'),
        origin: fc.constantFrom('http://evil.example', 'null', 'http://localhost:1'),
        'sec-fetch-site': fc.constantFrom('cross-site', 'same-site', 'same-origin', 'none'),
      },
      { requiredKeys: [] },
    ),
  },
);

/** A request: a form route, the demo's form (or nothing) plus random fields, maybe odd headers or type. */
export const hostileRequest: fc.Arbitrary<HostileRequest> = fc
  .record({
    url: fc.constantFrom(...FORM_ROUTES),
    withDemo: fc.boolean(),
    fields: fc.array(fc.tuple(fieldName, fieldValue), { minLength: 1, maxLength: 6 }),
    headers: HEADERS,
    type: fc.constantFrom('application/x-www-form-urlencoded', 'application/x-www-form-urlencoded', 'application/x-www-form-urlencoded', 'application/json', 'text/plain'),
  })
  .map(({ url, withDemo, fields, headers, type }) => {
    const p = new URLSearchParams(withDemo ? { _units: 'metric', ...demoValues() } : {});
    for (const [k, v] of fields) p.append(k, v);
    const payload = type === 'application/json' ? JSON.stringify({ design: Object.fromEntries(fields) }).replace('"design":{', '"design":{"__proto__":{"x":1},') : p.toString();
    return { url, headers: { ...headers, 'content-type': type }, payload };
  });

export const demoValues = (): FormValues => designToValues(demoDesign(), 'metric');

/** The demo's form with a fresh name (so no cached answer is reused): it must evaluate, 200 "Results are current". */
export function freshDemoBody(tag: string): string {
  return new URLSearchParams({ _units: 'metric', ...demoValues(), name: `Demo after hostile requests ${tag}` }).toString();
}

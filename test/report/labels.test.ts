/**
 * Every code the core can emit has a label for people, and no label is itself a code.
 * The codes are enumerated from the core's own tables and unions and from its source (warning and pitfall codes
 * are string literals at their call sites); the results of the demo and of every example design are walked too.
 * Source: the project's own rule "no internal code in what a user reads" (common practice, no source).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { demoDesign, evaluate, RearValve, readDesign, RULE_SELECTORS, verdictItems } from '../../core/index.ts';
import * as L from '../../report/labels.ts';

const CODE = /[a-z0-9]_[a-z0-9]|\b[A-Z]{2,}_[A-Z_]+\b|\[\d+\]|\.json\b|\.ts\b/;
const has = (table: Readonly<Record<string, string>>, code: string) => Object.hasOwn(table, code);

function coreSources(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? coreSources(join(dir, e.name)) : e.name.endsWith('.ts') ? [readFileSync(join(dir, e.name), 'utf8')] : [],
  );
}

const examples = readdirSync('docs/examples')
  .filter((f) => f.endsWith('.json'))
  .map((f) => readDesign(JSON.parse(readFileSync(join('docs/examples', f), 'utf8'))))
  .flatMap((r) => (r.ok ? [r.design] : []));
const designs = [demoDesign(), ...examples];
const results = designs.map((d) => evaluate(d));

describe('report/labels', () => {
  it('labels every warning and pitfall code written in the core', () => {
    const src = coreSources('core').join('\n');
    const warn = [...new Set(src.match(/'WARN_[A-Z_]+'/g) ?? [])].map((s) => s.slice(1, -1));
    const pit = [...new Set(src.match(/'PITFALL_[A-Z_]+'/g) ?? [])].map((s) => s.slice(1, -1));
    expect(warn.length).toBeGreaterThan(20);
    expect(pit.length).toBeGreaterThan(10);
    expect(warn.filter((c) => !has(L.WARNING_LABELS, c))).toEqual([]);
    expect(pit.filter((c) => !has(L.PITFALL_LABELS, c))).toEqual([]);
  });

  it('labels every rule and rule-set id a design may select', () => {
    expect(RULE_SELECTORS.filter((id) => !has(L.RULE_LABELS, id) && !has(L.RULE_SET_LABELS, id))).toEqual([]);
  });

  it('labels every valve type of the design schema', () => {
    const types = RearValve.options.map((o) => String(o.shape.type.value));
    expect(types.length).toBeGreaterThan(3);
    expect(types.filter((t) => !has(L.VALVE_TYPE_LABELS, t))).toEqual([]);
  });

  it('labels every code in the results of the demo and the examples', () => {
    const missing: string[] = [];
    const need = (ok: boolean, what: string) => { if (!ok) missing.push(what); };
    for (const r of results) {
      for (const c of r.checks) {
        need(has(L.RULE_LABELS, c.rule), `rule ${c.rule}`);
        need(has(L.SCENARIO_WORDS, c.scenario), `scenario ${c.scenario}`);
        if (c.branch) need(has(L.BRANCH_LABELS, c.branch), `branch ${c.branch}`);
        need(has(L.RULE_STATUS_LABELS, c.status), `status ${c.status}`);
      }
      for (const it of verdictItems(r)) {
        need(has(L.RULE_LABELS, it.ref.rule), `verdict rule ${it.ref.rule}`);
        need(has(L.ITEM_SCENARIO_LABELS, it.ref.scenario), `verdict scenario ${it.ref.scenario}`);
      }
      for (const f of r.failure_modes) {
        need(has(L.FAILURE_MODE_LABELS, f.mode), `mode ${f.mode}`);
        need(has(L.LIMITED_BY_LABELS, f.limited_by), `limited by ${f.limited_by}`);
      }
      for (const w of [...r.warnings, ...r.load_states.flatMap((s) => s.warnings), ...r.pedal_travel.warnings]) need(has(L.WARNING_LABELS, w.code), `warning ${w.code}`);
      for (const p of r.pitfalls) need(has(L.PITFALL_LABELS, p.code), `pitfall ${p.code}`);
      for (const k of r.pedal_travel.defaults_used) need(has(L.FIELD_LABELS, k.split('.').pop()!), `default ${k}`);
      for (const s of r.load_states) {
        need(has(L.LOAD_KIND_LABELS, s.kind), `kind ${s.kind}`);
        for (const a of s.tester.axles) need(has(L.LIMITED_BY_LABELS, a.limited_by), `tester ${a.limited_by}`);
        if (s.derived_from !== undefined) need(has(L.DERIVED_FROM_LABELS, s.derived_from), `derived ${s.derived_from}`);
      }
    }
    expect(missing).toEqual([]);
  });

  it('writes no label as a code', () => {
    const tables = Object.entries(L).filter(([, v]) => typeof v === 'object' && v !== null) as [string, Record<string, string>][];
    expect(tables.length).toBeGreaterThan(20);
    const bad = tables.flatMap(([name, t]) => Object.entries(t).filter(([, w]) => CODE.test(w)).map(([k, w]) => `${name}.${k}: ${w}`));
    expect(bad).toEqual([]);
  });

  it('names the examples of the issue in words', () => {
    expect(L.FAILURE_MODE_LABELS.linkage_broken_lowest_knee).toBe('linkage broken, valve at its lowest knee');
    expect(L.limitedByLabel('wheel_lock')).toBe('wheel lock');
    expect(L.defaultLabel('hardware.rear.running_clearance_mm')).toBe('rear pad running clearance');
    expect(L.pathLabel('load_states[1].cg_height_m', ['empty', 'full'])).toBe('load state "full", CG height');
    expect(L.pathLabel('hardware.front.fluid_volume_mm3')).not.toMatch(CODE);
    expect(L.ruleLabel('eu-appendix/lock-order')).toBe('front axle locks first (71/320/EEC Appendix)');
  });
});

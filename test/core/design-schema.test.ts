/**
 * The generated design-file reference cannot drift from the zod schema, and every CLI error code is
 * documented.
 * Source: the project's rule that core/design.ts is the single source of truth for the design file
 * (docs/design-file.schema.json and the key table in docs/design-file.md are generated from it by
 * scripts/schema-doc.ts, `npm run docs:schema`), and that every error code is documented (docs/errors.md).
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { designShape } from '../../core/design.ts';
import { BEGIN, DOC_PATH, END, keyReferenceMarkdown, keyRows, ROOT, SCHEMA_PATH, schemaText } from '../../scripts/schema-doc.ts';

describe('generated design-file docs', () => {
  it('docs/design-file.schema.json equals the schema generated now (run npm run docs:schema after a schema change)', () => {
    expect(readFileSync(SCHEMA_PATH, 'utf8')).toBe(schemaText());
  });

  it('the key reference in docs/design-file.md equals the one generated now', () => {
    const doc = readFileSync(DOC_PATH, 'utf8');
    const section = doc.slice(doc.indexOf(BEGIN), doc.indexOf(END) + END.length);
    expect(section).toBe(keyReferenceMarkdown());
  });

  it('the reference lists every top-level key and the units of the core keys', () => {
    const rows = keyRows();
    const keys = new Set(rows.map((r) => r.key));
    for (const k of Object.keys(designShape)) expect(keys).toContain(k);
    const unit = (k: string) => rows.find((r) => r.key === k)?.unit;
    expect(unit('vehicle.wheelbase_m')).toBe('m');
    expect(unit('load_states[].mass_kg')).toBe('kg');
    expect(unit('hydraulics.booster_runout_bar')).toBe('bar');
    expect(unit('hydraulics.rear_valve (type = "load_sensing").knee_bar_at_rear_axle_kg[][0]')).toBe('kg');
    expect(unit('hydraulics.rear_valve (type = "load_sensing").knee_bar_at_rear_axle_kg[][1]')).toBe('bar');
    expect(rows.find((r) => r.key === 'load_states[].mass_kg')!.allowed).toBe('≥ 50, ≤ 60000');
  });
});

describe('docs/errors.md', () => {
  function tsFiles(dir: string): string[] {
    return readdirSync(dir).flatMap((n) => {
      const p = join(dir, n);
      return statSync(p).isDirectory() ? tsFiles(p) : n.endsWith('.ts') ? [p] : [];
    });
  }
  it('documents every CLI_ERR_* code the command line can raise', () => {
    const codes = new Set<string>();
    for (const f of tsFiles(join(ROOT, 'cli'))) for (const m of readFileSync(f, 'utf8').matchAll(/CLI_ERR_[A-Z_]+/g)) codes.add(m[0]);
    expect(codes.size).toBeGreaterThanOrEqual(7);
    const doc = readFileSync(join(ROOT, 'docs', 'errors.md'), 'utf8');
    const missing = [...codes].filter((c) => !doc.includes(`| \`${c}\` |`));
    expect(missing).toEqual([]);
  });
});

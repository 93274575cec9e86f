/**
 * Generates the design-file reference from the zod schema (core/design.ts), the single source of truth:
 *   docs/design-file.schema.json  JSON Schema (draft 2020-12) from z.toJSONSchema;
 *   docs/design-file.md           the key table between the GENERATED markers (the prose around it is ours).
 * `npm run docs:schema` writes both; `npm run docs:schema -- --check` only compares and exits 1 on drift.
 * test/core/design-schema.test.ts fails when the committed files differ from what this script generates.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { z } from 'zod';
import { DesignFile } from '../core/design.ts';
import { fieldMeta } from '../core/field-meta.ts';
import { unitLabel } from '../core/units.ts';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
export const SCHEMA_PATH = join(ROOT, 'docs', 'design-file.schema.json');
export const DOC_PATH = join(ROOT, 'docs', 'design-file.md');
export const BEGIN = '<!-- BEGIN GENERATED KEY REFERENCE (npm run docs:schema; do not edit by hand) -->';
export const END = '<!-- END GENERATED KEY REFERENCE -->';

type Json = Record<string, unknown>;

export function designJsonSchema(): Json {
  const schema = z.toJSONSchema(DesignFile, { target: 'draft-2020-12' }) as Json;
  return {
    $schema: schema.$schema,
    $id: 'https://lockstep.invalid/schema/lockstep-design-1.json',
    title: 'Lockstep design file, format "lockstep-design/1"',
    description:
      'Generated from core/design.ts by scripts/schema-doc.ts. Cross-field rules (front axle load below the mass, ' +
      'CG height below the wheelbase, unique load-state ids, a sorted load-sensing table) are checked by the ' +
      'program and listed in docs/design-file.md; JSON Schema cannot state them.',
    ...Object.fromEntries(Object.entries(schema).filter(([k]) => k !== '$schema')),
  };
}

export function schemaText(): string {
  return `${JSON.stringify(designJsonSchema(), null, 2)}\n`;
}

interface Row {
  key: string;
  type: string;
  unit: string;
  /** What a numeric field is, in words (its label in the quantity table). */
  meaning: string;
  allowed: string;
  required: boolean;
}

const fmtNum = (n: unknown) => String(n);

/** Unit and label of a numeric value at a path, from the quantity table of the schema (core/field-meta.ts). */
function docMeta(path: (string | number)[]): { unit: string; meaning: string } {
  const m = fieldMeta(path);
  return m ? { unit: unitLabel(m.unit), meaning: m.label } : { unit: '', meaning: '' };
}

function typeAndRange(s: Json): { type: string; allowed: string } {
  if ('const' in s) return { type: 'text', allowed: `exactly ${JSON.stringify(s.const)}` };
  if (Array.isArray(s.enum)) return { type: 'text', allowed: `one of ${s.enum.map((v) => JSON.stringify(v)).join(', ')}` };
  const t = s.type;
  if (t === 'number' || t === 'integer') {
    const parts: string[] = [];
    if (s.exclusiveMinimum !== undefined) parts.push(`> ${fmtNum(s.exclusiveMinimum)}`);
    if (s.minimum !== undefined) parts.push(`≥ ${fmtNum(s.minimum)}`);
    if (s.exclusiveMaximum !== undefined) parts.push(`< ${fmtNum(s.exclusiveMaximum)}`);
    if (s.maximum !== undefined) parts.push(`≤ ${fmtNum(s.maximum)}`);
    return { type: t === 'integer' ? 'integer' : 'number', allowed: parts.join(', ') || 'any finite number' };
  }
  if (t === 'string') {
    const parts: string[] = [];
    if (s.minLength !== undefined || s.maxLength !== undefined) parts.push(`${s.minLength ?? 0} to ${s.maxLength ?? '∞'} characters`);
    if (s.pattern) parts.push(`pattern \`${String(s.pattern)}\``);
    return { type: 'text', allowed: parts.join('; ') };
  }
  if (t === 'boolean') return { type: 'true/false', allowed: '' };
  if (t === 'array') {
    const n = s.minItems !== undefined || s.maxItems !== undefined ? `${s.minItems ?? 0} to ${s.maxItems ?? '∞'} entries` : '';
    if (Array.isArray(s.prefixItems)) return { type: `list of exactly ${s.prefixItems.length} values`, allowed: '' };
    return { type: 'list', allowed: n };
  }
  if (t === 'object') return { type: 'object', allowed: '' };
  if (Array.isArray(s.oneOf) || Array.isArray(s.anyOf)) return { type: 'one of the forms below', allowed: '' };
  return { type: String(t ?? 'any'), allowed: '' };
}

function variantName(v: Json): string {
  const props = (v.properties ?? {}) as Record<string, Json>;
  for (const k of ['type', 'kind', 'source']) if (props[k] && 'const' in props[k]!) return `${k} = ${JSON.stringify(props[k]!.const)}`;
  return '';
}

/** Every key of the schema as a table row, depth first, in the schema's own order. */
export function keyRows(schema: Json = designJsonSchema()): Row[] {
  const rows: Row[] = [];
  const walk = (s: Json, key: string, rawPath: (string | number)[], required: boolean) => {
    if (key !== '') {
      const { type, allowed } = typeAndRange(s);
      const numeric = s.type === 'number' || s.type === 'integer';
      const m = numeric ? docMeta(rawPath) : { unit: '', meaning: '' };
      rows.push({ key, type, unit: m.unit, meaning: m.meaning, allowed, required });
    }
    if (s.type === 'object' && s.properties) {
      const req = new Set((s.required as string[] | undefined) ?? []);
      for (const [k, sub] of Object.entries(s.properties as Record<string, Json>)) {
        walk(sub, key === '' ? k : `${key}.${k}`, [...rawPath, k], req.has(k));
      }
    } else if (s.type === 'object' && s.additionalProperties && typeof s.additionalProperties === 'object') {
      walk(s.additionalProperties as Json, `${key}.<key>`, [...rawPath, '<key>'], true);
    }
    if (s.type === 'array') {
      if (Array.isArray(s.prefixItems)) (s.prefixItems as Json[]).forEach((it, i) => walk(it, `${key}[${i}]`, [...rawPath, i], true));
      else if (s.items && typeof s.items === 'object') {
        const it = s.items as Json;
        if (it.type === 'object' || it.oneOf || it.anyOf || it.type === 'array') walk(it, `${key}[]`, [...rawPath, 0], true);
        else {
          // a list of plain values: the entries share the list's row
          const row = rows[rows.length - 1]!;
          const inner = typeAndRange(it);
          row.type = `list of ${inner.type}`;
          if (it.type === 'number' || it.type === 'integer') Object.assign(row, docMeta([...rawPath, 0]));
          row.allowed = [row.allowed, inner.allowed && `each ${inner.allowed}`].filter(Boolean).join('; ');
        }
      }
    }
    for (const alt of ((s.oneOf ?? s.anyOf) as Json[] | undefined) ?? []) {
      const name = variantName(alt);
      const label = name ? `${key} (${name})` : key;
      if (alt.type === 'object' && alt.properties) {
        const req = new Set((alt.required as string[] | undefined) ?? []);
        for (const [k, sub] of Object.entries(alt.properties as Record<string, Json>)) walk(sub, `${label}.${k}`, [...rawPath, k], req.has(k));
      } else walk(alt, `${label}`, rawPath, required);
    }
  };
  walk(schema, '', [], true);
  return rows;
}

const cell = (s: string) => s.replace(/\|/g, '\\|');

export function keyReferenceMarkdown(schema: Json = designJsonSchema()): string {
  const lines = [
    BEGIN,
    '',
    '| Key | Required | Type | Unit | Meaning | Allowed |',
    '| --- | --- | --- | --- | --- | --- |',
    ...keyRows(schema).map(
      (r) => `| \`${cell(r.key)}\` | ${r.required ? 'yes' : 'no'} | ${cell(r.type)} | ${cell(r.unit || '—')} | ${cell(r.meaning || '—')} | ${cell(r.allowed || '—')} |`,
    ),
    '',
    END,
  ];
  return lines.join('\n');
}

/** The doc with its generated section replaced (the text outside the markers is kept as it is). */
export function withGeneratedSection(doc: string, section = keyReferenceMarkdown()): string {
  const a = doc.indexOf(BEGIN);
  const b = doc.indexOf(END);
  if (a < 0 || b < a) throw new Error(`${DOC_PATH} lacks the markers ${BEGIN} … ${END}`);
  return doc.slice(0, a) + section + doc.slice(b + END.length);
}

function main(argv: string[]): number {
  const check = argv.includes('--check');
  const schema = schemaText();
  const doc = readFileSync(DOC_PATH, 'utf8');
  const newDoc = withGeneratedSection(doc);
  let oldSchema = '';
  try {
    oldSchema = readFileSync(SCHEMA_PATH, 'utf8');
  } catch {
    /* not written yet */
  }
  if (check) {
    const stale = [oldSchema !== schema && SCHEMA_PATH, doc !== newDoc && DOC_PATH].filter(Boolean);
    if (stale.length) {
      console.error(`out of date: ${stale.join(', ')}; run npm run docs:schema`);
      return 1;
    }
    console.log('design-file docs are up to date');
    return 0;
  }
  writeFileSync(SCHEMA_PATH, schema);
  writeFileSync(DOC_PATH, newDoc);
  console.log(`wrote ${SCHEMA_PATH} and the key reference in ${DOC_PATH}`);
  return 0;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) process.exitCode = main(process.argv.slice(2));

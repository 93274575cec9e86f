/**
 * Errors are declared once per layer (core/errors.ts `declareErrors`), each code with its status and message, and
 * docs/errors.md lists exactly the declared codes. Statuses follow the meanings of RFC 9110 §15 (400, 403, 404,
 * 409, 413, 415, 421, 422, 500); the rest is the project's own rule (DEVELOPERS.md, "Errors"), no published source.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { coreErrors, declareErrors, declaredCodes, LockstepError } from '../../core/errors.ts';
import { formErrors } from '../../form/errors.ts';
import { serverErrors } from '../../server/errors.ts';
import { storeErrors } from '../../store/errors.ts';
import { cliErrors } from '../../cli/errors.ts';

const ROOT = new URL('../../', import.meta.url).pathname;
const docs = readFileSync(join(ROOT, 'docs', 'errors.md'), 'utf8');

/** Each layer's table and the prefix its codes carry. */
const TABLES = [
  { layer: 'core', prefix: 'CORE_ERR_', table: coreErrors },
  { layer: 'form', prefix: 'APP_ERR_', table: formErrors },
  { layer: 'server', prefix: 'APP_ERR_', table: serverErrors },
  { layer: 'store', prefix: 'STORE_ERR_', table: storeErrors },
  { layer: 'cli', prefix: 'CLI_ERR_', table: cliErrors },
] as const;

const declared = TABLES.flatMap((t) => declaredCodes(t.table));
const documented = new Set([...docs.matchAll(/`((?:CORE|APP|STORE|CLI)_ERR_[A-Z_]*[A-Z])`/g)].map((m) => m[1]!));

/** "| `CODE` | [404] …" rows of docs/errors.md: the status written beside each code. */
function documentedStatuses(): Map<string, number> {
  const out = new Map<string, number>();
  for (const line of docs.split('\n')) {
    const cells = line.split('|');
    if (cells.length < 4) continue;
    const status = /^\s*\[(\d{3})\]/.exec(cells[2]!)?.[1];
    if (!status) continue;
    for (const m of cells[1]!.matchAll(/`([A-Z_]+_ERR_[A-Z_]+)`/g)) out.set(m[1]!, Number(status));
  }
  return out;
}

function tsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? tsFiles(p) : n.endsWith('.ts') ? [p] : [];
  });
}

describe('error tables', () => {
  it('every layer declares its codes with its own prefix, each code once across all tables', () => {
    for (const t of TABLES) {
      const codes = declaredCodes(t.table);
      expect(codes.length, t.layer).toBeGreaterThan(0);
      for (const c of codes) expect(c.startsWith(t.prefix), `${t.layer}: ${c}`).toBe(true);
    }
    expect(declared.length).toBe(new Set(declared).size);
    expect(declared.length).toBeGreaterThanOrEqual(50);
  });

  it('each declared code is documented in docs/errors.md', () => {
    expect(declared.filter((c) => !documented.has(c))).toEqual([]);
  });

  it('each documented code is declared', () => {
    expect([...documented].filter((c) => !declared.includes(c))).toEqual([]);
  });

  it('the status written beside a code in docs/errors.md is the declared one', () => {
    const written = documentedStatuses();
    expect(written.size).toBeGreaterThan(30);
    const statusOf = new Map(TABLES.flatMap((t) => Object.values(t.table).map((b) => [b.code, b.status] as const)));
    const wrong = [...written].filter(([code, status]) => statusOf.get(code) !== status).map(([c, s]) => `${c}: docs ${s}, declared ${statusOf.get(c)}`);
    expect(wrong).toEqual([]);
  });

  it('statuses are the RFC 9110 ones for each meaning', () => {
    expect(serverErrors.notFound.status).toBe(404);
    expect(serverErrors.bodyTooLarge.status).toBe(413);
    expect(serverErrors.unsupportedMediaType.status).toBe(415);
    expect(serverErrors.hostNotAllowed.status).toBe(421);
    expect(serverErrors.crossSite.status).toBe(403);
    expect(serverErrors.uploadInvalid.status).toBe(422);
    expect(serverErrors.internal.status).toBe(500);
    expect(storeErrors.deleteNotConfirmed.status).toBe(409);
    expect(formErrors.fieldName.status).toBe(400);
  });

  it('a builder makes a LockstepError with its code, status, message and the lines per problem', () => {
    const e = storeErrors.designInvalid(['vehicle.wheelbase_m: must be at least 0.5']);
    expect(e).toBeInstanceOf(LockstepError);
    expect(e).toBeInstanceOf(Error);
    expect([e.code, e.status]).toEqual(['STORE_ERR_DESIGN_INVALID', 422]);
    expect(e.message).toBe('the design is not valid and was not saved (1 problem)');
    expect(e.details).toEqual(['vehicle.wheelbase_m: must be at least 0.5']);
    const u = serverErrors.uploadTooLarge();
    expect(u.details).toEqual([]);
    for (const made of [serverErrors.uploadNotJson('x'), serverErrors.uploadInvalid(1), u]) expect(made.message).toContain('unchanged');
    expect(coreErrors.unknownRule(['x'], ['a', 'b']).message).toBe('unknown rule id x; known: a, b');
  });

  it('a code declared twice in one table is refused', () => {
    const twice = () =>
      declareErrors({
        a: { code: 'X_ERR_ONE', status: 400, message: () => 'a' },
        b: { code: 'X_ERR_ONE', status: 400, message: () => 'b' },
      });
    expect(twice).toThrow(/declared twice/);
  });

  it('no code is written outside the error tables: call sites call the builders', () => {
    const found: string[] = [];
    for (const layer of ['core', 'report', 'form', 'store', 'views', 'packet', 'cli', 'server']) {
      let files: string[];
      try {
        files = tsFiles(join(ROOT, layer));
      } catch {
        continue; // a layer not yet in the tree
      }
      for (const f of files) {
        if (f.endsWith('/errors.ts')) continue;
        readFileSync(f, 'utf8')
          .split('\n')
          .forEach((line, i) => {
            const t = line.trim();
            if (t.startsWith('*') || t.startsWith('/*') || t.startsWith('//')) return; // comments may name codes
            const code = t.replace(/\s\/\/\s.*$/, '');
            if (/\b(?:CORE|APP|STORE|CLI)_ERR_[A-Z_]+/.test(code) || /new LockstepError\(/.test(code)) found.push(`${f.slice(ROOT.length)}:${i + 1}`);
          });
      }
    }
    expect(found).toEqual([]);
  });
});

/**
 * The core stays pure and the version stays in step.
 * Source: the project's house rules (core/ imports only core/ files and zod; no node:*, no server or
 * views, no console, no Date, no Math.random) and core/version.ts's own promise to equal package.json.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { LOCKSTEP_VERSION } from '../../core/version.ts';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const coreDir = join(root, 'core');

function tsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? tsFiles(p) : name.endsWith('.ts') ? [p] : [];
  });
}

/** Every module specifier of static imports, re-exports and dynamic imports in a source text. */
function specifiers(src: string): string[] {
  const out: string[] = [];
  const re = /(?:^|[\s;])(?:import|export)\s[^'"]*?from\s*['"]([^'"]+)['"]|(?:^|[\s;])import\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;
  for (const m of src.matchAll(re)) out.push((m[1] ?? m[2] ?? m[3])!);
  return out;
}

/** The source without comments and string/template contents (a rough lexer, enough for these checks). */
function codeOnly(src: string): string {
  return src
    .replace(/\/\*[\s\S]*?\*\//g, '')
    .replace(/(^|[^:])\/\/.*$/gm, '$1')
    .replace(/'(?:\\.|[^'\\\n])*'|"(?:\\.|[^"\\\n])*"|`(?:\\.|[^`\\])*`/g, '""');
}

describe('core purity', () => {
  const files = tsFiles(coreDir);

  it('finds the core modules', () => {
    expect(files.length).toBeGreaterThan(15);
  });

  it('core/ files import nothing but core/ files and zod', () => {
    const bad: string[] = [];
    for (const f of files) {
      for (const spec of specifiers(readFileSync(f, 'utf8'))) {
        if (spec === 'zod') continue;
        if (spec.startsWith('.')) {
          const target = resolve(dirname(f), spec);
          if (relative(coreDir, target).startsWith('..')) bad.push(`${relative(root, f)} imports ${spec}`);
          continue;
        }
        bad.push(`${relative(root, f)} imports ${spec}`);
      }
    }
    expect(bad).toEqual([]);
  });

  it('core/ code uses no console, no Date and no Math.random', () => {
    const bad: string[] = [];
    for (const f of files) {
      const code = codeOnly(readFileSync(f, 'utf8'));
      for (const [what, re] of [['console', /\bconsole\./], ['Date', /\bDate\s*[.(]|new\s+Date\b/], ['Math.random', /Math\.random\s*\(/]] as const) {
        if (re.test(code)) bad.push(`${relative(root, f)} uses ${what}`);
      }
    }
    expect(bad).toEqual([]);
  });

  it('the specifier scan itself sees node:, fastify and relative imports (guards the check above)', () => {
    const sample = "import { x } from 'node:fs';\nexport * from './a.ts';\nimport type { Y } from '../server/app.ts';\nimport 'fastify';\nconst m = await import('../views/v.ts');";
    expect(specifiers(sample)).toEqual(['node:fs', './a.ts', '../server/app.ts', 'fastify', '../views/v.ts']);
  });

  it('core/version.ts equals the version in package.json', () => {
    const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string };
    expect(LOCKSTEP_VERSION).toBe(pkg.version);
  });
});

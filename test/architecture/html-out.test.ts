/**
 * HTML is escaped by construction and leaves one way: `raw()` is used only inside views/html.ts, and a reply
 * carries HTML only through server/html-reply.ts (`sendHtml`, or `sendKeptHtml` for the bytes of a kept SafeHtml).
 * A text scan of the sources, as test/architecture/layers.test.ts reads the imports. Source: the project's own
 * rule (DEVELOPERS.md, "HTML"); the escaping itself follows the OWASP XSS Prevention Cheat Sheet, rule #1.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = new URL('../../', import.meta.url).pathname;
const LAYERS = ['core', 'report', 'form', 'store', 'views', 'packet', 'cli', 'server'];

function tsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? tsFiles(p) : n.endsWith('.ts') ? [p] : [];
  });
}

/** The lines of code of a source text (comment lines and trailing `// …` comments left out), with their numbers. */
function codeLines(text: string): [number, string][] {
  const out: [number, string][] = [];
  text.split('\n').forEach((line, i) => {
    const t = line.trim();
    if (t.startsWith('*') || t.startsWith('/*') || t.startsWith('//')) return;
    out.push([i + 1, t.replace(/\s\/\/\s.*$/, '')]);
  });
  return out;
}

const RAW = /(?<![\w.$])raw\(/;
/** A reply given HTML by hand: a text/html type or header (reading the Accept header is allowed), or a SafeHtml's `.html` sent. */
const HTML_SENT = [/text\/html(?<!\.includes\(['"`]text\/html)/, /\.send\([^;]*\.html\s*\)/];

function findings(files: readonly string[], allowed: string, patterns: readonly RegExp[]): string[] {
  const found: string[] = [];
  for (const f of files) {
    const rel = f.slice(ROOT.length);
    if (rel === allowed) continue;
    for (const [n, line] of codeLines(readFileSync(f, 'utf8'))) if (patterns.some((p) => p.test(line))) found.push(`${rel}:${n}: ${line.slice(0, 100)}`);
  }
  return found;
}

const sources = LAYERS.filter((l) => existsSync(join(ROOT, l))).flatMap((l) => tsFiles(join(ROOT, l)));

describe('HTML out', () => {
  it('reads the sources', () => {
    expect(sources.length).toBeGreaterThan(150);
    expect(sources.some((f) => f.endsWith('views/html.ts'))).toBe(true);
  });

  it('raw() is used only inside views/html.ts', () => {
    expect(findings(sources, 'views/html.ts', [RAW])).toEqual([]);
  });

  it('a reply carries HTML only through server/html-reply.ts', () => {
    expect(findings(sources, 'server/html-reply.ts', HTML_SENT)).toEqual([]);
  });

  it('the scan finds the constructs it forbids, and passes what is allowed', () => {
    const hits = (line: string, patterns: readonly RegExp[]) => codeLines(line).some(([, l]) => patterns.some((p) => p.test(l)));
    expect(hits("html`<option${sel ? raw(' selected') : ''}>`", [RAW])).toBe(true);
    expect(hits('const p = draw(lim.mu1); x.raw2(1);', [RAW])).toBe(false);
    expect(hits(' * `raw()` is the only way', [RAW])).toBe(false);
    expect(hits("return reply.type('text/html; charset=utf-8').send(packetHtml(content).html);", HTML_SENT)).toBe(true);
    expect(hits("app.get('/d', async (_req, reply) => reply.type(HTML).send(designsListView(list).html));", HTML_SENT)).toBe(true);
    expect(hits("reply.header('content-type', 'text/html').send(body)", HTML_SENT)).toBe(true);
    expect(hits("const wantsHtml = String(req.headers.accept ?? '').includes('text/html');", HTML_SENT)).toBe(false);
    expect(hits('return sendHtml(reply, packetHtml(content));', HTML_SENT)).toBe(false);
  });
});

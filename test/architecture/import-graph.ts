/**
 * The import graph of the project's own sources, read from the text of each file (static imports, re-exports and
 * dynamic imports of relative paths). Used by the layer test; no dependency, no build needed.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

export function tsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? tsFiles(p) : name.endsWith('.ts') && !name.endsWith('.d.ts') ? [p] : [];
  });
}

/** Every module specifier of static imports, re-exports and dynamic imports in a source text. */
export function specifiers(src: string): { spec: string; typeOnly: boolean }[] {
  const out: { spec: string; typeOnly: boolean }[] = [];
  const re = /(?:^|[\s;])(import|export)(\s+type)?\s[^'"]*?from\s*['"]([^'"]+)['"]|(?:^|[\s;])import\s*['"]([^'"]+)['"]|import\(\s*['"]([^'"]+)['"]\s*\)/g;
  for (const m of src.matchAll(re)) out.push({ spec: (m[3] ?? m[4] ?? m[5])!, typeOnly: Boolean(m[2]) });
  return out;
}

/** Edges between project files, as paths relative to the root ('core/design.ts' → 'core/rules/index.ts'). */
export function importGraph(dirs: string[]): Map<string, string[]> {
  const graph = new Map<string, string[]>();
  for (const d of dirs) {
    for (const f of tsFiles(join(ROOT, d))) {
      const from = relative(ROOT, f);
      const to = specifiers(readFileSync(f, 'utf8'))
        .filter((s) => s.spec.startsWith('.'))
        .map((s) => relative(ROOT, resolve(dirname(f), s.spec)));
      graph.set(from, [...new Set(to)]);
    }
  }
  return graph;
}

/** The strongly connected components with more than one file (import loops), each sorted; Tarjan's algorithm. */
export function importLoops(graph: Map<string, string[]>): string[][] {
  let index = 0;
  const idx = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const on = new Set<string>();
  const loops: string[][] = [];
  const visit = (v: string): void => {
    idx.set(v, index);
    low.set(v, index);
    index++;
    stack.push(v);
    on.add(v);
    for (const w of graph.get(v) ?? []) {
      if (!graph.has(w)) continue;
      if (!idx.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (on.has(w)) low.set(v, Math.min(low.get(v)!, idx.get(w)!));
    }
    if (low.get(v) === idx.get(v)) {
      const comp: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        on.delete(w);
        comp.push(w);
      } while (w !== v);
      if (comp.length > 1) loops.push(comp.sort());
    }
  };
  for (const v of graph.keys()) if (!idx.has(v)) visit(v);
  return loops;
}

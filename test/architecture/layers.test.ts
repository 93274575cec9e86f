/**
 * The house plan holds: every import points down the layers and no module imports itself back through others.
 * Source: the project's own layer rule (core ← report / form / store ← views / packet ← cli / server), written
 * out in DEVELOPERS.md; no published source.
 */
import { describe, expect, it } from 'vitest';
import { importGraph, importLoops } from './import-graph.ts';

/** What each top-level folder may import from, besides itself. */
const MAY_IMPORT: Record<string, readonly string[]> = {
  core: [],
  report: ['core'],
  form: ['core'],
  store: ['core'],
  views: ['core', 'report', 'form', 'store'],
  packet: ['core', 'report', 'store'],
  cli: ['core', 'report', 'form', 'store', 'packet'],
  server: ['core', 'report', 'form', 'store', 'views', 'packet'],
};

const LAYERS = Object.keys(MAY_IMPORT);
const graph = importGraph(LAYERS);
const top = (p: string): string => p.split('/')[0]!;

describe('the house plan', () => {
  it('reads the whole tree', () => {
    expect(graph.size).toBeGreaterThan(150);
    for (const layer of ['core', 'form', 'packet', 'store', 'views', 'cli', 'server']) {
      expect([...graph.keys()].some((f) => top(f) === layer)).toBe(true);
    }
  });

  it('no import points up or sideways', () => {
    const bad: string[] = [];
    for (const [from, targets] of graph) {
      const allowed = MAY_IMPORT[top(from)]!;
      for (const to of targets) {
        const layer = top(to);
        if (layer !== top(from) && !allowed.includes(layer)) bad.push(`${from} → ${to}`);
      }
    }
    expect(bad).toEqual([]);
  });

  it('has no import loop', () => {
    expect(importLoops(graph)).toEqual([]);
  });

  it('finds a loop and an upward import when there is one', () => {
    // the checker itself, on a drawn graph: a → b → a is a loop; c alone is not
    const g = new Map([
      ['core/a.ts', ['core/b.ts']],
      ['core/b.ts', ['core/a.ts']],
      ['core/c.ts', ['views/x.ts']],
    ]);
    expect(importLoops(g)).toEqual([['core/a.ts', 'core/b.ts']]);
  });
});

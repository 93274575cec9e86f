/**
 * The before/after comparison of two designs (the base vehicle and the converted one, or two options) as
 * the views render it: per-load-state figures and check verdicts side by side, the field-level differences
 * of the inputs and the overlaid chart. Built by packet/compare.ts.
 */
import type { DiffEntry } from '../core/index.ts';

export interface CompareRow {
  load_state: string;
  quantity: string;
  a: string;
  b: string;
  changed: boolean;
}

export interface CompareCheckRow {
  rule: string;
  load_state: string;
  a_verdict: string;
  a_margin: string;
  b_verdict: string;
  b_margin: string;
  changed: boolean;
}

export interface Comparison {
  a: { label: string; revision: string; design_name: string };
  b: { label: string; revision: string; design_name: string };
  states: CompareRow[];
  checks: CompareCheckRow[];
  diff: DiffEntry[];
  chart: { data: unknown[]; layout: Record<string, unknown> };
}

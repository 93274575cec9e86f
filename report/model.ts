/** The parts of the document model (report/document.ts): sections of tables, text and items. */
import type { UnitSystem } from '../core/index.ts';

/** How a cell, row or line reads: passes, fails, not checked, not applicable, for information, attention. */
export type Tone = 'ok' | 'fail' | 'nc' | 'na' | 'info' | 'warn' | 'neutral';

export interface Cell {
  text: string;
  tone?: Tone;
  /** The internal code behind the words (a rule id, a warning code): shown only in a tooltip. */
  code?: string;
  /** Smaller lines under the text (scenario, source note). */
  sub?: string[];
  /** Longer notes behind the figure (how it was found): folded on the page, printed by the command line. */
  more?: string[];
  /** Lines to flag in the cell ("verify against the current official text"). */
  verify?: string;
}
export type CellLike = string | Cell;

export interface Column {
  head: string;
  /** The unit of the column in the chosen system ('' for dimensionless or words). */
  unit: string;
}

export interface Row {
  cells: CellLike[];
  /** A stable id (the verdict links to the checks' rows). */
  id?: string;
  tone?: Tone;
}

export interface Table {
  kind: 'table';
  id: string;
  title: string;
  columns: Column[];
  rows: Row[];
}

export interface Text {
  kind: 'text';
  text: string;
  tone?: Tone;
  /** A hint (method, source notes) rather than a finding. */
  hint?: boolean;
}

export interface Item {
  /** A leading word: "FAIL", "NOT CHECKED", "Warning". */
  word?: string;
  text: string;
  detail?: string;
  code?: string;
  /** Where the item's row is (the checks table). */
  anchor?: string;
  tone?: Tone;
}

export interface Items {
  kind: 'items';
  id: string;
  title?: string;
  items: Item[];
}

export type Block = Table | Text | Items;

export interface Section {
  id: string;
  title: string;
  blocks: Block[];
}

export interface ReportDocument {
  title: string;
  units: UnitSystem;
  /** The verdict first: the overall word, the summary and one line per failing or not-checked item. */
  verdict: Section;
  sections: Section[];
  caution: string;
}

/** Helpers for builders. */
export const col = (head: string, unit = ''): Column => ({ head, unit });
export const text = (t: string, extra: Omit<Text, 'kind' | 'text'> = {}): Text => ({ kind: 'text', text: t, ...extra });
export const cellText = (c: CellLike): string => (typeof c === 'string' ? c : c.text);


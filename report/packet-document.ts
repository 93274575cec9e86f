/**
 * The document model of the evidence packet: a list of blocks (headings, paragraphs, key/value rows, tables
 * with titled columns, charts as SVG, fill-in fields, page breaks). packet/packet-content.ts builds it; the PDF
 * (packet/packet-pdf.ts) and the HTML print view (views/store-views.ts) render the same blocks, so they carry
 * the same words and numbers. User text is kept literally; each renderer handles it for its medium.
 */

export type Block =
  | { kind: 'title'; text: string }
  | { kind: 'h1'; text: string }
  | { kind: 'h2'; text: string }
  | { kind: 'p'; text: string; style?: 'caution' | 'small' | 'mono' | 'bold' | 'draft' }
  | { kind: 'kv'; rows: [string, string][] }
  | { kind: 'table'; columns: string[]; rows: string[][]; widths?: number[] }
  | { kind: 'chart'; svg: string; width: number; height: number }
  | { kind: 'fields'; labels: string[] }
  | { kind: 'page_break' };

export interface PacketContent {
  title: string;
  /** The revision id (SHA-256 of the canonical design JSON) when the packet is of a saved revision; null for a draft. */
  revisionId: string | null;
  /** Printed on every page of a draft (unsaved work). */
  draft: boolean;
  blocks: Block[];
  /** The full evaluation result as JSON, attached to the PDF as a file (not printed). */
  attachment?: { name: string; json: string };
}

/** The words on every page of a packet made of unsaved work. */
export const DRAFT_MARK = 'DRAFT — not a saved revision';

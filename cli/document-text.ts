/**
 * The document model (report/document.ts) as plain text: a section title, then its blocks; tables as aligned
 * columns with the unit in the head, item lists one per line. Numbers and words come formatted from report/.
 */
import { type Block, type Cell, type CellLike, cellText, type Items, type ReportDocument, type Section, type Table } from '../report/document.ts';
import { textTable } from './table.ts';

const IND = '  ';

const head = (c: { head: string; unit: string }) => (c.unit ? `${c.head} (${c.unit})` : c.head);
const asCell = (c: CellLike): Cell => (typeof c === 'string' ? { text: c } : c);

function tableText(t: Table, indent: string): string[] {
  const out = [`${indent}${t.title}:`];
  out.push(textTable(t.columns.map(head), t.rows.map((r) => r.cells.map(cellText)), `${indent}${IND}`));
  // the smaller lines of a cell (scenario, note, "verify ...") below the table, named by the row's first cell
  for (const r of t.rows) {
    const extra = r.cells.flatMap((c) => {
      const x = asCell(c);
      return [...(x.sub ?? []), ...(x.more ?? []), ...(x.verify ? [x.verify] : [])];
    });
    if (extra.length) out.push(`${indent}${IND}${cellText(r.cells[0]!)}: ${extra.join('; ')}`);
  }
  return out;
}

/**
 * The checks tables read better as one entry per row: verdict and check, the figures, then the source with how sure
 * its text is, then the notes.
 */
function listText(t: Table, indent: string): string[] {
  const out = [`${indent}${t.title}:`];
  for (const r of t.rows) {
    const cells = r.cells.map(asCell);
    const [name, word] = cells;
    const source = cells[cells.length - 2];
    const status = cells[cells.length - 1];
    const parts = [`${(word?.text ?? '').padEnd(12)} ${name?.text ?? ''}${name?.sub?.length ? ` (${name.sub.join('; ')})` : ''}`];
    cells.slice(2, -2).forEach((c, i) => {
      if (c.text !== '–' && c.text !== '') parts.push(`${t.columns[i + 2]!.head.toLowerCase()} ${c.text}`);
    });
    out.push(`${indent}${IND}${parts.join('; ')}`);
    const pad = `${indent}${IND}${' '.repeat(13)}`;
    if (source) out.push(`${pad}${source.text} [${status?.text ?? ''}${status?.verify ? `: ${status.verify}` : ''}]`);
    for (const x of [...(source?.sub ?? []), ...(source?.more ?? [])]) out.push(`${pad}${x}`);
  }
  return out;
}

function itemsText(b: Items, indent: string): string[] {
  const out = b.title ? [`${indent}${b.title}`] : [];
  for (const it of b.items) {
    // the verdict's words stand in a column ("FAIL         ...", "NOT CHECKED  ..."), others lead with "word: "
    const word = !it.word ? '' : b.id === 'verdict-items' ? `${it.word.padEnd(12)} ` : `${it.word}: `;
    out.push(`${indent}${word}${it.text}${it.detail ? ` (${it.detail})` : ''}`);
  }
  return out;
}

function blockText(b: Block, indent: string): string[] {
  if (b.kind === 'text') return [`${indent}${b.text}`];
  if (b.kind === 'items') return itemsText(b, indent);
  return b.id.startsWith('checks-') ? listText(b, indent) : tableText(b, indent);
}

export function sectionText(s: Section): string[] {
  return [`${s.title}:`, ...s.blocks.flatMap((b) => blockText(b, b.kind === 'items' ? IND + IND : IND))];
}

/** The whole document: title, verdict, sections, caution. */
export function documentText(doc: ReportDocument): string {
  const [summary, ...rest] = doc.verdict.blocks;
  const out = [doc.title, '', `VERDICT ${summary?.kind === 'text' ? summary.text : doc.verdict.title}`, ...rest.flatMap((b) => blockText(b, IND)), ''];
  for (const s of doc.sections) out.push(...sectionText(s), '');
  out.push(`CAUTION: ${doc.caution}`);
  return out.join('\n');
}

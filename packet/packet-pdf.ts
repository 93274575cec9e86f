/**
 * Renders the evidence packet (packet-content.ts) as a PDF with pdfkit; charts are SVG placed as vector
 * graphics with svg-to-pdfkit. User text is written as text, literally (no markup is interpreted).
 * Font: DejaVu Sans when found (full Unicode: →, ≤, ², μ, non-Latin names), else Liberation Sans; otherwise the built-in
 * Helvetica, which covers Latin-1 only — characters outside it are then printed as "?".
 * The path can be set with LOCKSTEP_PDF_FONT (regular) and LOCKSTEP_PDF_FONT_BOLD.
 */
import { existsSync } from 'node:fs';
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import { DRAFT_MARK } from '../report/packet-document.ts';
import { type Block, type PacketContent, type PacketInput, packetContent } from './packet-content.ts';

const FONT_DIRS = ['/usr/share/fonts/truetype/dejavu', '/usr/share/fonts/dejavu', '/usr/share/fonts/TTF', '/usr/local/share/fonts'];

export interface PacketFonts {
  regular: string;
  bold: string;
  /** True when the fonts are embedded TrueType (full Unicode). */
  unicode: boolean;
}

export function findFonts(env: NodeJS.ProcessEnv = process.env): PacketFonts {
  const reg = env.LOCKSTEP_PDF_FONT;
  if (reg && existsSync(reg)) {
    const bold = env.LOCKSTEP_PDF_FONT_BOLD && existsSync(env.LOCKSTEP_PDF_FONT_BOLD) ? env.LOCKSTEP_PDF_FONT_BOLD : reg;
    return { regular: reg, bold, unicode: true };
  }
  for (const d of FONT_DIRS) {
    const r = `${d}/DejaVuSans.ttf`;
    const b = `${d}/DejaVuSans-Bold.ttf`;
    if (existsSync(r)) return { regular: r, bold: existsSync(b) ? b : r, unicode: true };
  }
  // Liberation Sans (installed with Chromium on Debian) as the second choice
  for (const d of ['/usr/share/fonts/truetype/liberation', '/usr/share/fonts/truetype/liberation2']) {
    const r = `${d}/LiberationSans-Regular.ttf`;
    const b = `${d}/LiberationSans-Bold.ttf`;
    if (existsSync(r)) return { regular: r, bold: existsSync(b) ? b : r, unicode: true };
  }
  return { regular: 'Helvetica', bold: 'Helvetica-Bold', unicode: false };
}

/** Text for a Latin-1-only font: common symbols spelled out, anything else outside Latin-1 as "?". */
export function latin1(s: string): string {
  const map: Record<string, string> = { '→': '->', '≤': '<=', '≥': '>=', '−': '-', '–': '-', '—': '-', '•': '-', '…': '...', '·': '·', 'μ': 'mu', '²': '²', '‘': "'", '’': "'", '“': '"', '”': '"' };
  return [...s].map((c) => map[c] ?? (c.codePointAt(0)! <= 0xff ? c : '?')).join('');
}

const PAGE = { size: 'A4' as const, margin: 50 };
const FS = { title: 20, h1: 14, h2: 11.5, body: 9.5, small: 8, table: 7.5 };

interface Ctx {
  doc: PDFKit.PDFDocument;
  fonts: PacketFonts;
  t: (s: string) => string;
}

function bottom(doc: PDFKit.PDFDocument): number {
  return doc.page.height - PAGE.margin - 18; // room for the footer
}

function ensure(ctx: Ctx, h: number): void {
  if (ctx.doc.y + h > bottom(ctx.doc)) ctx.doc.addPage();
}

function width(doc: PDFKit.PDFDocument): number {
  return doc.page.width - 2 * PAGE.margin;
}

function para(ctx: Ctx, text: string, size: number, font: 'R' | 'B', opts: PDFKit.Mixins.TextOptions = {}): void {
  const { doc } = ctx;
  doc.font(font === 'B' ? 'B' : 'R').fontSize(size);
  const s = ctx.t(text);
  const h = doc.heightOfString(s, { width: width(doc), ...opts });
  ensure(ctx, Math.min(h, 60));
  doc.text(s, PAGE.margin, doc.y, { width: width(doc), ...opts });
}

const CELL_PAD = 2.5;

/**
 * Column widths in points. Each column gets at least the measured width of its longest word (header in bold,
 * cells in regular; capped at a third of the page so one long token cannot starve the rest), so text wraps at
 * spaces and no word is broken; the remaining width is shared in proportion to how much more each column's
 * content wants. Given weights are used as they are, widened where a word would not fit.
 */
function columnWidths(ctx: Ctx, columns: string[], rows: string[][], weights?: number[]): number[] {
  const { doc } = ctx;
  const W = width(doc);
  const measure = (s: string, font: 'R' | 'B') => doc.font(font).fontSize(FS.table).widthOfString(ctx.t(s));
  // pdfkit measures a word with its following space when it decides to break it: leave room for that space
  const extra = 2 * CELL_PAD + 1 + measure(' ', 'B');
  const longestWord = (s: string, font: 'R' | 'B') => Math.max(0, ...s.split(/\s+/).map((w) => measure(w, font)));
  const wordCap = W / 3;
  const mins = columns.map((c, i) => {
    let m = Math.min(longestWord(c, 'B'), wordCap);
    for (const r of rows) m = Math.max(m, Math.min(longestWord(r[i] ?? '', 'R'), wordCap));
    return Math.max(m, 12) + extra;
  });
  const minSum = mins.reduce((a, b) => a + b, 0);
  if (weights && weights.length === columns.length) {
    const sum = weights.reduce((a, b) => a + b, 0);
    const given = weights.map((w) => (w / sum) * W);
    if (minSum > W || given.every((g, i) => g >= mins[i]!)) return given;
    // widen the columns a word does not fit, taking the room from the others in proportion to their slack
    const short = given.reduce((a, g, i) => a + Math.max(0, mins[i]! - g), 0);
    const slack = given.reduce((a, g, i) => a + Math.max(0, g - mins[i]!), 0);
    return given.map((g, i) => (g < mins[i]! ? mins[i]! : g - ((g - mins[i]!) / slack) * short));
  }
  const wants = columns.map((c, i) => {
    // a header may wrap at spaces: it asks for little more than its longest word
    let m = Math.min(measure(c, 'B'), Math.max(mins[i]! - extra, 60));
    for (const r of rows) m = Math.max(m, Math.min(measure(r[i] ?? '', 'R'), W * 0.5));
    return Math.max(m + extra, mins[i]!);
  });
  const wantSum = wants.reduce((a, b) => a + b, 0);
  if (minSum >= W) {
    // too many long words: squeeze only the columns with the longest ones (ids, paths), down to a common cap
    let lo = 0;
    let hi = Math.max(...mins);
    for (let n = 0; n < 40; n++) {
      const c = (lo + hi) / 2;
      if (mins.reduce((a, m) => a + Math.min(m, c), 0) > W) hi = c;
      else lo = c;
    }
    const capped = mins.map((m) => Math.min(m, lo));
    const sum = capped.reduce((a, b) => a + b, 0);
    return capped.map((m) => (m / sum) * W);
  }
  if (wantSum <= W) return wants.map((w) => (w / wantSum) * W);
  const t = (W - minSum) / (wantSum - minSum);
  return mins.map((m, i) => m + t * (wants[i]! - m));
}

function table(ctx: Ctx, columns: string[], rows: string[][], weights?: number[]): void {
  const { doc } = ctx;
  const widths = columnWidths(ctx, columns, rows, weights);
  const pad = CELL_PAD;
  const rowHeight = (cells: string[], font: 'R' | 'B') => {
    doc.font(font).fontSize(FS.table);
    let h = 0;
    cells.forEach((c, i) => {
      h = Math.max(h, doc.heightOfString(ctx.t(c) || ' ', { width: widths[i]! - 2 * pad }));
    });
    return h + 2 * pad;
  };
  const drawRow = (cells: string[], font: 'R' | 'B', shade: boolean, knownHeight?: number) => {
    const h = knownHeight ?? Math.max(rowHeight(cells, font), font === 'R' && cells.every((c) => c === '') ? 16 : 0);
    const y = doc.y;
    let x = PAGE.margin;
    if (shade) doc.save().rect(x, y, width(doc), h).fill('#eeeeee').restore();
    doc.font(font).fontSize(FS.table).fillColor('#000');
    cells.forEach((c, i) => {
      doc.lineWidth(0.4).strokeColor('#999').rect(x, y, widths[i]!, h).stroke();
      doc.text(ctx.t(c), x + pad, y + pad, { width: widths[i]! - 2 * pad, lineBreak: true });
      x += widths[i]!;
    });
    doc.x = PAGE.margin;
    doc.y = y + h;
  };
  // A title that has to wrap puts its unit on a line of its own, so "[m/s²]" is never split at the slash.
  doc.font('B').fontSize(FS.table);
  const heads = columns.map((c, i) => (doc.widthOfString(ctx.t(c)) > widths[i]! - 2 * pad ? c.replace(/ (\[[^\]]*\])$/, '\n$1') : c));
  const header = () => drawRow(heads, 'B', true);
  ensure(ctx, rowHeight(heads, 'B') + (rows[0] ? rowHeight(rows[0], 'R') : 0));
  header();
  for (const r of rows) {
    const cells = columns.map((_, i) => r[i] ?? '');
    const h = Math.max(rowHeight(cells, 'R'), cells.every((c) => c === '') ? 16 : 0);
    if (doc.y + h > bottom(doc)) {
      doc.addPage();
      header();
    }
    drawRow(cells, 'R', false, h);
  }
  doc.moveDown(0.6);
}

function kv(ctx: Ctx, rows: [string, string][]): void {
  const { doc } = ctx;
  const W = width(doc);
  const kw = W * 0.36;
  for (const [k, v] of rows) {
    // A long word (a revision hash) is printed smaller rather than broken across lines.
    let size = FS.body;
    if (!/\s/.test(v)) {
      doc.font('R').fontSize(FS.body);
      const w = doc.widthOfString(ctx.t(v));
      if (w > W - kw) size = Math.max(5.5, (FS.body * (W - kw - 1)) / w);
    }
    doc.fontSize(FS.body);
    const hk = doc.font('B').heightOfString(ctx.t(k), { width: kw - 6 });
    doc.fontSize(size);
    const h = Math.max(hk, doc.font('R').heightOfString(ctx.t(v) || ' ', { width: W - kw })) + 4;
    ensure(ctx, h);
    const y = doc.y;
    doc.font('B').fontSize(FS.body).fillColor('#000').text(ctx.t(k), PAGE.margin, y, { width: kw - 6 });
    doc.font('R').fontSize(size).text(ctx.t(v) || ' ', PAGE.margin + kw, y, { width: W - kw });
    if (v === '') doc.lineWidth(0.4).strokeColor('#999').moveTo(PAGE.margin + kw, y + h - 2).lineTo(PAGE.margin + W, y + h - 2).stroke();
    doc.x = PAGE.margin;
    doc.y = y + h;
  }
  doc.moveDown(0.5);
}

function fields(ctx: Ctx, labels: string[]): void {
  const { doc } = ctx;
  for (const l of labels) {
    ensure(ctx, 40);
    doc.font('R').fontSize(FS.small).fillColor('#000').text(ctx.t(l), PAGE.margin, doc.y);
    const y = doc.y + 22;
    doc.lineWidth(0.5).strokeColor('#000').moveTo(PAGE.margin, y).lineTo(PAGE.margin + width(doc), y).stroke();
    doc.y = y + 8;
  }
  doc.moveDown(0.5);
}

function chart(ctx: Ctx, svg: string, w: number, h: number): void {
  const { doc } = ctx;
  const W = width(doc);
  const scale = Math.min(1, W / w);
  ensure(ctx, h * scale + 6);
  const y = doc.y;
  SVGtoPDF(doc, svg, PAGE.margin, y, {
    width: w * scale,
    height: h * scale,
    assumePt: true,
    fontCallback: (_family, bold) => (bold ? 'B' : 'R'),
  });
  doc.x = PAGE.margin;
  doc.y = y + h * scale + 6;
}

function block(ctx: Ctx, b: Block, first: boolean): void {
  const { doc } = ctx;
  switch (b.kind) {
    case 'title':
      doc.font('B').fontSize(FS.title).fillColor('#000').text(ctx.t(b.text), PAGE.margin, doc.y, { width: width(doc) });
      doc.moveDown(0.5);
      return;
    case 'h1':
      ensure(ctx, 60);
      if (!first) doc.moveDown(0.6);
      doc.font('B').fontSize(FS.h1).fillColor('#000').text(ctx.t(b.text), PAGE.margin, doc.y, { width: width(doc) });
      doc.moveDown(0.3);
      return;
    case 'h2':
      ensure(ctx, 50);
      doc.moveDown(0.3);
      doc.font('B').fontSize(FS.h2).fillColor('#000').text(ctx.t(b.text), PAGE.margin, doc.y, { width: width(doc) });
      doc.moveDown(0.2);
      return;
    case 'p':
      if (b.style === 'draft') {
        doc.fillColor('#b3261e');
        para(ctx, b.text, FS.h2, 'B');
        doc.fillColor('#000');
      } else if (b.style === 'caution') {
        doc.fillColor('#8a1c1c');
        para(ctx, b.text, FS.body, 'B');
        doc.fillColor('#000');
      } else if (b.style === 'small') para(ctx, b.text, FS.small, 'R');
      else if (b.style === 'bold') para(ctx, b.text, FS.body, 'B');
      else para(ctx, b.text, FS.body, 'R');
      doc.moveDown(0.25);
      return;
    case 'kv':
      kv(ctx, b.rows);
      return;
    case 'table':
      table(ctx, b.columns, b.rows, b.widths);
      return;
    case 'chart':
      chart(ctx, b.svg, b.width, b.height);
      return;
    case 'fields':
      fields(ctx, b.labels);
      return;
    case 'page_break':
      doc.addPage();
      return;
  }
}

export interface PdfOptions {
  fonts?: PacketFonts;
}

/** The PDF of a packet's content. */
export function renderPacketPdf(content: PacketContent, date: Date, opts: PdfOptions = {}): Promise<Buffer> {
  const fonts = opts.fonts ?? findFonts();
  const doc = new PDFDocument({
    size: PAGE.size,
    margin: PAGE.margin,
    bufferPages: true,
    autoFirstPage: true,
    info: { Title: content.title, Creator: 'Lockstep', Producer: 'Lockstep (pdfkit)', CreationDate: date, ModDate: date },
  });
  doc.registerFont('R', fonts.regular);
  doc.registerFont('B', fonts.bold);
  const ctx: Ctx = { doc, fonts, t: fonts.unicode ? (s) => s : latin1 };
  const chunks: Buffer[] = [];
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  doc.font('R');
  if (content.attachment) {
    // the full result as a file inside the PDF (not printed); fixed dates keep the PDF reproducible
    doc.file(Buffer.from(content.attachment.json, 'utf8'), {
      name: content.attachment.name,
      type: 'application/json',
      description: 'The design and its full evaluation result (JSON)',
      creationDate: date,
      modifiedDate: date,
    });
  }
  content.blocks.forEach((b, i) => block(ctx, b, i === 0 || content.blocks[i - 1]?.kind === 'page_break'));
  const range = doc.bufferedPageRange();
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i);
    const y = doc.page.height - PAGE.margin + 4;
    const id = content.revisionId ? `Revision ${content.revisionId.slice(0, 16)}` : DRAFT_MARK;
    const footer = `${id} · page ${i + 1} of ${range.count} · Estimate only: verify by physical brake testing; the local regulations and a licensed inspector decide.`;
    doc.font('R').fontSize(6.5).fillColor('#555').text(ctx.t(footer), PAGE.margin, y, { width: width(doc), lineBreak: false, height: 10 });
    if (content.draft) {
      // the draft mark at the head of every page, above the top margin
      doc.font('B').fontSize(9).fillColor('#b3261e').text(ctx.t(DRAFT_MARK), PAGE.margin, PAGE.margin - 30, { width: width(doc), align: 'right', lineBreak: false, height: 12 });
    }
  }
  doc.end();
  return done;
}

/** Content and PDF in one step. */
export async function packetPdf(input: PacketInput, opts: PdfOptions = {}): Promise<Buffer> {
  return renderPacketPdf(packetContent(input), input.date, opts);
}


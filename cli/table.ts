/** Plain-text tables for the command line: right-aligned columns, a header and a rule. */
export function textTable(header: string[], rows: string[][], indent = '  '): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) =>
    indent + cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');
  return [line(header), indent + widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

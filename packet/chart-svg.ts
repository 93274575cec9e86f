/**
 * Line charts as SVG text, drawn from the same series the page plots (evaluate(design, {curves: true})).
 * The packet places them in the PDF as vector graphics; the HTML print view can inline them.
 * Every label is XML-escaped, so user text (load-state labels) cannot break the markup.
 */

export interface ChartSeries {
  name: string;
  x: readonly number[];
  /** null leaves a gap (e.g. utilisation beyond rear-axle lift-off). */
  y: readonly (number | null)[];
  color: string;
  dash?: boolean;
  width?: number;
}

export interface ChartSpec {
  title: string;
  xLabel: string;
  yLabel: string;
  x: [number, number];
  y: [number, number];
  series: ChartSeries[];
  /** Vertical marker lines, e.g. the critical braking rate. */
  markers?: { x: number; label: string; color: string }[];
  /** Shaded x ranges behind the curves, e.g. the z range a rule requires the front curve above the rear. */
  bands?: { x0: number; x1: number; label: string; color: string }[];
  width?: number;
  height?: number;
}

export function xmlEscape(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function niceStep(range: number, target: number): number {
  const raw = range / target;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

const r2 = (v: number): string => (Math.round(v * 100) / 100).toString();

export function tickLabel(v: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return v.toFixed(decimals);
}

/**
 * Width of a text in em of a sans-serif font, estimated from the characters (narrow, wide, average);
 * generous so a title estimated to fit does fit (common practice, no source).
 */
export function textWidthEm(t: string): number {
  let w = 0;
  for (const c of t) w += /[il.,:;'|!() ]/.test(c) ? 0.3 : /[mwMW%—]/.test(c) ? 0.88 : /[A-Z]/.test(c) ? 0.68 : 0.56;
  return w;
}

export function chartSvg(spec: ChartSpec): string {
  const W = spec.width ?? 480;
  const H = spec.height ?? 300;
  const left = 52;
  const right = 12;
  const top = 26;
  const legend = [...(spec.bands ?? []).map((b) => ({ name: b.label, color: b.color, band: true, dash: false })), ...spec.series.map((x) => ({ name: x.name, color: x.color, band: false, dash: x.dash === true }))];
  const cols = 2;
  const legendRows = Math.ceil(legend.length / cols);
  const bottom = 40 + legendRows * 11;
  const pw = W - left - right;
  const ph = H - top - bottom;
  const [x0, x1] = spec.x;
  const [y0, y1] = spec.y;
  const sx = (x: number) => left + ((x - x0) / (x1 - x0)) * pw;
  const sy = (y: number) => top + ph - ((y - y0) / (y1 - y0)) * ph;
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="sans-serif">`);
  // the title fits the chart width: its size shrinks (down to 7) for a long title
  const titleSize = Math.max(7, Math.min(10, (W - left - right) / (textWidthEm(spec.title) * 1.05)));
  out.push(`<text x="${left}" y="15" font-size="${r2(titleSize)}" font-weight="bold" fill="#000">${xmlEscape(spec.title)}</text>`);
  for (const b of spec.bands ?? []) {
    const a = Math.max(x0, b.x0);
    const e = Math.min(x1, b.x1);
    if (e > a) out.push(`<rect x="${r2(sx(a))}" y="${top}" width="${r2(sx(e) - sx(a))}" height="${r2(ph)}" fill="${b.color}" fill-opacity="0.12" stroke="none"/>`);
  }
  const xs = niceStep(x1 - x0, 10);
  const ys = niceStep(y1 - y0, 8);
  for (let v = Math.ceil(x0 / xs) * xs; v <= x1 + 1e-9; v += xs) {
    out.push(`<line x1="${r2(sx(v))}" y1="${top}" x2="${r2(sx(v))}" y2="${r2(top + ph)}" stroke="#ddd" stroke-width="0.5"/>`);
    out.push(`<text x="${r2(sx(v))}" y="${r2(top + ph + 11)}" font-size="7" text-anchor="middle" fill="#333">${tickLabel(v, xs)}</text>`);
  }
  for (let v = Math.ceil(y0 / ys) * ys; v <= y1 + 1e-9; v += ys) {
    out.push(`<line x1="${left}" y1="${r2(sy(v))}" x2="${r2(left + pw)}" y2="${r2(sy(v))}" stroke="#ddd" stroke-width="0.5"/>`);
    out.push(`<text x="${left - 4}" y="${r2(sy(v) + 2.5)}" font-size="7" text-anchor="end" fill="#333">${tickLabel(v, ys)}</text>`);
  }
  out.push(`<rect x="${left}" y="${top}" width="${r2(pw)}" height="${r2(ph)}" fill="none" stroke="#000" stroke-width="0.7"/>`);
  out.push(`<text x="${r2(left + pw / 2)}" y="${r2(top + ph + 24)}" font-size="8" text-anchor="middle">${xmlEscape(spec.xLabel)}</text>`);
  out.push(
    `<text x="12" y="${r2(top + ph / 2)}" font-size="8" text-anchor="middle" transform="rotate(-90 12 ${r2(top + ph / 2)})">${xmlEscape(spec.yLabel)}</text>`,
  );
  const inside = (x: number, y: number) => x >= x0 - 1e-9 && x <= x1 + 1e-9 && y >= y0 - 1e-9 && y <= y1 + 1e-9;
  for (const s of spec.series) {
    const parts: string[] = [];
    let pen = false;
    for (let i = 0; i < s.x.length; i++) {
      const x = s.x[i]!;
      const y = s.y[i];
      if (y === null || y === undefined || !Number.isFinite(y) || !inside(x, y)) {
        pen = false;
        continue;
      }
      parts.push(`${pen ? 'L' : 'M'}${r2(sx(x))} ${r2(sy(y))}`);
      pen = true;
    }
    if (parts.length === 0) continue;
    out.push(
      `<path d="${parts.join(' ')}" fill="none" stroke="${s.color}" stroke-width="${s.width ?? 1.2}"${s.dash ? ' stroke-dasharray="4 3"' : ''}/>`,
    );
  }
  for (const m of spec.markers ?? []) {
    if (m.x < x0 || m.x > x1) continue;
    out.push(`<line x1="${r2(sx(m.x))}" y1="${top}" x2="${r2(sx(m.x))}" y2="${r2(top + ph)}" stroke="${m.color}" stroke-width="0.8" stroke-dasharray="2 2"/>`);
    out.push(`<text x="${r2(sx(m.x) + 2)}" y="${top + 8}" font-size="7" fill="${m.color}">${xmlEscape(m.label)}</text>`);
  }
  legend.forEach((s, i) => {
    const col = i % cols;
    const row = Math.floor(i / cols);
    const colW = pw / cols;
    const lx = left + col * colW;
    const ly = top + ph + 36 + row * 11;
    if (s.band) out.push(`<rect x="${r2(lx)}" y="${ly - 7}" width="16" height="7" fill="${s.color}" fill-opacity="0.25"/>`);
    else out.push(`<line x1="${r2(lx)}" y1="${ly - 3}" x2="${r2(lx + 16)}" y2="${ly - 3}" stroke="${s.color}" stroke-width="1.5"${s.dash ? ' stroke-dasharray="4 3"' : ''}/>`);
    // a legend entry fits its column: the size shrinks for a long one
    const size = Math.max(5, Math.min(7, (colW - 24) / textWidthEm(s.name)));
    out.push(`<text x="${r2(lx + 20)}" y="${ly}" font-size="${r2(size)}">${xmlEscape(s.name)}</text>`);
  });
  out.push('</svg>');
  return out.join('\n');
}

/**
 * Charts: the server builds a plotly spec {data, layout}; the page carries it as a JSON data block and a
 * <div class="chart" data-chart="ID">, and static/js/charts.js draws every such chart after each swap.
 * No user text is ever placed in executable script.
 */
import { html, jsonScript, type SafeHtml } from './html.ts';

export interface ChartSpec {
  data: unknown[];
  layout: Record<string, unknown>;
}

/**
 * Colours of the Okabe–Ito palette (distinguishable with the common colour-vision deficiencies), each
 * paired with a marker symbol so that load states stay apart in black-and-white print.
 */
export const SERIES_STYLE = [
  { colour: '#0072B2', symbol: 'circle' },
  { colour: '#D55E00', symbol: 'square' },
  { colour: '#009E73', symbol: 'diamond' },
  { colour: '#CC79A7', symbol: 'triangle-up' },
  { colour: '#E69F00', symbol: 'x' },
  { colour: '#56B4E9', symbol: 'cross' },
  { colour: '#000000', symbol: 'star' },
  { colour: '#999999', symbol: 'triangle-down' },
] as const;
export const seriesStyle = (i: number) => SERIES_STYLE[i % SERIES_STYLE.length]!;

/** Text for plotly labels: plotly reads a few HTML-like tags in labels, so < > & are written as entities. */
export function plotText(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/**
 * Layout defaults shared by every chart: a plot area of 330 px (height minus the top and bottom margins; the
 * page keeps it at least 320 px on a desktop, static/js/charts.js), the title in the top margin, axis titles
 * pushed clear of the tick labels (automargin, standoff), ticks chosen by plotly at round steps of the
 * plotted unit (every axis is plotted in the page's unit system).
 */
export function baseLayout(title: string, xTitle: string, yTitle: string): Record<string, unknown> {
  return {
    title: { text: plotText(title), font: { size: 14 }, x: 0, xanchor: 'left', y: 1, yanchor: 'top', yref: 'container', pad: { t: 8, l: 4 } },
    margin: { l: 60, r: 20, t: 40, b: 50 },
    height: 420,
    font: { family: 'system-ui, sans-serif', size: 12 },
    xaxis: { title: { text: plotText(xTitle), standoff: 8 }, automargin: true, zeroline: false, gridcolor: '#e4e4e4' },
    yaxis: { title: { text: plotText(yTitle), standoff: 8 }, automargin: true, zeroline: false, gridcolor: '#e4e4e4' },
    legend: { orientation: 'h', y: -0.22, font: { size: 11 } },
    hovermode: 'closest',
    plot_bgcolor: '#fff',
    paper_bgcolor: '#fff',
  };
}

/** A chart block: caption, JSON data and the element charts.js draws into. */
export function chartBlock(id: string, spec: ChartSpec, caption: SafeHtml | string, description: string): SafeHtml {
  const dataId = `${id}-data`;
  return html`<figure class="chart-fig" id="${id}">
${jsonScript(dataId, spec)}
<div class="chart" data-chart="${dataId}" role="img" aria-label="${description}"></div>
<figcaption>${caption}</figcaption>
</figure>`;
}

/**
 * Drops the points of a polyline that lie on the straight line between their kept neighbours (within `tol` of
 * the curve's own span on each axis, far below a pixel), so piecewise-linear curves (installed forces, line
 * pressures, pedal force) travel as their breakpoints instead of a sample per braking rate. Curved parts keep
 * their points. A null in x or y is a gap and is kept. Pure; returns new arrays.
 */
export function simplifyLine(x: ReadonlyArray<number | null>, y: ReadonlyArray<number | null>, tol = 1e-5): { x: (number | null)[]; y: (number | null)[] } {
  const n = Math.min(x.length, y.length);
  let xs = 0;
  let ys = 0;
  let x0 = Infinity;
  let y0 = Infinity;
  for (let i = 0; i < n; i++) {
    const a = x[i];
    const b = y[i];
    if (a === null || b === null || a === undefined || b === undefined) continue;
    x0 = Math.min(x0, a);
    y0 = Math.min(y0, b);
    xs = Math.max(xs, a);
    ys = Math.max(ys, b);
  }
  const sx = Math.max(xs - x0, 1e-12);
  const sy = Math.max(ys - y0, 1e-12);
  const ox: (number | null)[] = [];
  const oy: (number | null)[] = [];
  const ok = (i: number) => x[i] !== null && y[i] !== null && x[i] !== undefined && y[i] !== undefined;
  /**
   * the chord a–j passes within tol (normalised by the spans) of the newest interior point j − 1 and of the
   * middle one: O(1) per step; every interior point was the newest once, against a shorter chord of the same run
   */
  const off = (a: number, j: number, k: number) => {
    const ax = x[a]! / sx;
    const ay = y[a]! / sy;
    const dx = x[j]! / sx - ax;
    const dy = y[j]! / sy - ay;
    const px = x[k]! / sx - ax;
    const py = y[k]! / sy - ay;
    const len = Math.hypot(dx, dy);
    return len < 1e-15 ? Math.hypot(px, py) : Math.abs(px * dy - py * dx) / len;
  };
  const straight = (a: number, j: number) => off(a, j, j - 1) <= tol && off(a, j, (a + j) >> 1) <= tol;
  let i = 0;
  while (i < n) {
    if (!ok(i)) {
      ox.push(x[i] ?? null);
      oy.push(y[i] ?? null);
      i++;
      continue;
    }
    ox.push(x[i]!);
    oy.push(y[i]!);
    // the farthest j of this run such that the chord i–j covers every point between
    let j = i + 1;
    if (j < n && ok(j)) while (j + 1 < n && ok(j + 1) && straight(i, j + 1)) j++;
    if (j < n && ok(j) && j > i + 1) {
      i = j;
      continue;
    }
    i++;
  }
  return { x: ox, y: oy };
}

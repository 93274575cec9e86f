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

/** Layout defaults shared by every chart. */
export function baseLayout(title: string, xTitle: string, yTitle: string): Record<string, unknown> {
  return {
    title: { text: plotText(title), font: { size: 14 }, x: 0, xanchor: 'left' },
    margin: { l: 56, r: 16, t: 36, b: 44 },
    height: 340,
    font: { family: 'system-ui, sans-serif', size: 12 },
    xaxis: { title: { text: plotText(xTitle) }, zeroline: false, gridcolor: '#e4e4e4' },
    yaxis: { title: { text: plotText(yTitle) }, zeroline: false, gridcolor: '#e4e4e4' },
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

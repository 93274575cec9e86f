/**
 * HTML built by construction: every interpolated value is escaped unless it is already SafeHtml.
 * `raw()` marks a string as safe and is used in this module only (test/architecture/html-out.test.ts); elsewhere
 * fixed markup is written as html`…` and a drawing of our own chart code goes through `ownSvg()`.
 * `jsonScript()` is the only way to put data in a <script>.
 */

const SAFE: unique symbol = Symbol('lockstep.safe-html');

/** HTML that is safe to send. Only `html`, `raw` and `jsonScript` make one (the brand is a private symbol). */
export interface SafeHtml {
  readonly [SAFE]: true;
  readonly html: string;
  toString(): string;
}

/** Values allowed inside html``: null, undefined and false render nothing; arrays are joined. */
export type HtmlValue = SafeHtml | string | number | boolean | null | undefined | readonly HtmlValue[];

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for element content and quoted attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESCAPES[c]!);
}

class Safe {
  readonly [SAFE] = true as const;
  constructor(readonly html: string) {}
  toString(): string {
    return this.html;
  }
}

function make(markup: string): SafeHtml {
  return new Safe(markup);
}

export function isSafeHtml(v: unknown): v is SafeHtml {
  return v instanceof Safe;
}

/** Marks trusted, program-generated markup as safe. Never pass user text; used in this module only. */
export function raw(markup: string): SafeHtml {
  return make(markup);
}

/** The elements our chart code draws with; anything else (script, a, foreignObject, image, use, …) is refused. */
const CHART_ELEMENTS = new Set(['svg', 'g', 'line', 'polyline', 'path', 'rect', 'circle', 'text', 'tspan', 'title']);
/** Attributes a drawing never carries: event handlers, links, styles, script URLs. */
const NOT_A_CHART_ATTRIBUTE = /\s(?:on[a-z]+|[\w:]*href|style)\s*=|javascript:/i;

function isChart(m: string): boolean {
  if (!/^<svg[\s>]/.test(m) || !m.endsWith('</svg>') || /<(?![A-Za-z/])/.test(m)) return false; // no comment, CDATA or declaration
  for (const t of m.matchAll(/<\/?([A-Za-z][\w:-]*)([^>]*)>/g)) {
    if (!CHART_ELEMENTS.has(t[1]!) || NOT_A_CHART_ATTRIBUTE.test(t[2]!)) return false;
  }
  return true;
}

/**
 * An SVG drawing made by our own chart code (packet/chart-svg.ts, which escapes every label it writes), checked to
 * be one <svg> of shapes and text without script, event attribute, link or foreign content before it is sent as it is.
 */
export function ownSvg(markup: string): SafeHtml {
  const m = markup.trim();
  if (!isChart(m)) throw new Error('ownSvg: not a drawing of the chart code (an <svg> element with shapes and text only)');
  return raw(m);
}

function render(v: HtmlValue, out: string[]): void {
  if (v === null || v === undefined || v === false || v === true) return;
  if (isSafeHtml(v)) out.push(v.html);
  else if (Array.isArray(v)) for (const x of v as readonly HtmlValue[]) render(x, out);
  else if (typeof v === 'number') out.push(Number.isFinite(v) ? String(v) : '');
  else out.push(escapeHtml(String(v)));
}

/** Tagged template: `html\`<p>${userText}</p>\`` escapes userText. */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): SafeHtml {
  const out: string[] = [strings[0]!];
  for (let i = 0; i < values.length; i++) {
    render(values[i], out);
    out.push(strings[i + 1]!);
  }
  return make(out.join(''));
}

/** Joins fragments with an optional separator (itself escaped unless SafeHtml). */
export function join(parts: readonly HtmlValue[], sep: HtmlValue = ''): SafeHtml {
  const out: string[] = [];
  parts.forEach((p, i) => {
    if (i > 0) render(sep, out);
    render(p, out);
  });
  return make(out.join(''));
}

const JSON_ESCAPES: Record<string, string> = { '<': '\\u003c', '>': '\\u003e', '&': '\\u0026', '\u2028': '\\u2028', '\u2029': '\\u2029' };

/**
 * Data for the browser as `<script type="application/json">`: never executed, and `<`, `>`, `&`, U+2028/9
 * are written as \u escapes so that no value can close the element or open a comment.
 */
export function jsonScript(id: string, value: unknown): SafeHtml {
  const json = JSON.stringify(value).replace(/[<>&\u2028\u2029]/g, (c) => JSON_ESCAPES[c]!);
  return make(`<script type="application/json" id="${escapeHtml(id)}">${json}</script>`);
}

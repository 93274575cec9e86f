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

const NEEDS_ESCAPE = /[&<>"']/;

/** Escapes text for element content and quoted attribute values. */
export function escapeHtml(text: string): string {
  // most texts (numbers, labels, units) need nothing: tested once, returned as they are
  if (!NEEDS_ESCAPE.test(text)) return text;
  let out = '';
  let from = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    // & 38, < 60, > 62, " 34, ' 39
    if (c === 38 || c === 60 || c === 62 || c === 34 || c === 39) {
      out += text.slice(from, i) + ESCAPES[text[i]!]!;
      from = i + 1;
    }
  }
  return out + text.slice(from);
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

/** The markup of one value (strings built by concatenation: cheaper than collecting parts and joining them). */
function render(v: HtmlValue): string {
  if (v === null || v === undefined || v === false || v === true) return '';
  if (v instanceof Safe) return v.html;
  if (typeof v === 'string') return escapeHtml(v);
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  if (Array.isArray(v)) {
    let out = '';
    for (const x of v as readonly HtmlValue[]) out += render(x);
    return out;
  }
  return escapeHtml(String(v));
}

/** Tagged template: `html\`<p>${userText}</p>\`` escapes userText. */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): SafeHtml {
  let out = strings[0]!;
  for (let i = 0; i < values.length; i++) out += render(values[i]) + strings[i + 1]!;
  return make(out);
}

/** Joins fragments with an optional separator (itself escaped unless SafeHtml). */
export function join(parts: readonly HtmlValue[], sep: HtmlValue = ''): SafeHtml {
  const between = render(sep);
  let out = '';
  for (let i = 0; i < parts.length; i++) out += (i > 0 ? between : '') + render(parts[i]);
  return make(out);
}

const JSON_NEEDS_ESCAPE = /[<>&\u2028\u2029]/;
const jsonEscape = (c: string): string => JSON_ESCAPES[c]!;
const JSON_ESCAPES: Record<string, string> = { '<': '\\u003c', '>': '\\u003e', '&': '\\u0026', '\u2028': '\\u2028', '\u2029': '\\u2029' };

/**
 * Data for the browser as `<script type="application/json">`: never executed, and `<`, `>`, `&`, U+2028/9
 * are written as \u escapes so that no value can close the element or open a comment.
 */
export function jsonScript(id: string, value: unknown): SafeHtml {
  const text = JSON.stringify(value);
  const json = JSON_NEEDS_ESCAPE.test(text) ? text.replace(/[<>&\u2028\u2029]/g, jsonEscape) : text;
  return make(`<script type="application/json" id="${escapeHtml(id)}">${json}</script>`);
}

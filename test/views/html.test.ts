// Sources: OWASP XSS Prevention Cheat Sheet, rule #1 (escape & < > " ' in HTML content and quoted
// attributes) and rule #3.1 (JSON in a <script> data block: encode < so "</script>" cannot appear).
import { describe, expect, it } from 'vitest';
import { html, jsonScript, join, raw, isSafeHtml } from '../../views/html.ts';

describe('html``', () => {
  it('escapes the five special characters in interpolated text', () => {
    expect(html`<p>${`<script>alert("x")</script> & 'q'`}</p>`.html).toBe(
      '<p>&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;q&#39;</p>',
    );
  });
  it('escapes inside quoted attributes', () => {
    expect(html`<input value="${'a" onfocus="x'}">`.html).toBe('<input value="a&quot; onfocus=&quot;x">');
  });
  it.each([null, undefined, false, true])('renders %s as nothing', (v) => {
    expect(html`<b>${v}</b>`.html).toBe('<b></b>');
  });
  it('renders 0 and other numbers, non-finite numbers as nothing', () => {
    expect(html`${0}|${1.5}|${Number.NaN}`.html).toBe('0|1.5|');
  });
  it('joins arrays, escaping each plain string and keeping SafeHtml', () => {
    expect(html`<ul>${['<a>', html`<li>ok</li>`, ['&']]}</ul>`.html).toBe('<ul>&lt;a&gt;<li>ok</li>&amp;</ul>');
  });
  it('does not escape nested html`` twice', () => {
    const inner = html`<i>${'<'}</i>`;
    expect(html`<b>${inner}</b>`.html).toBe('<b><i>&lt;</i></b>');
  });
  it('raw() is the only way to pass markup through', () => {
    expect(html`${raw('<br>')}`.html).toBe('<br>');
    expect(isSafeHtml('<br>')).toBe(false);
    expect(isSafeHtml(raw('<br>'))).toBe(true);
    // a plain string that looks like a SafeHtml object is still escaped
    expect(html`${{ html: '<x>' } as unknown as string}`.html).toBe('[object Object]');
  });
  it('join() puts a separator between parts', () => {
    expect(join(['a', '<b>'], html`<br>`).html).toBe('a<br>&lt;b&gt;');
  });
  it('toString() gives the markup', () => {
    expect(String(html`<p>${'x'}</p>`)).toBe('<p>x</p>');
  });
});

describe('jsonScript()', () => {
  it('writes a non-executable data block that cannot be closed by a value', () => {
    const s = jsonScript('c1', { name: '</script><script>alert(1)</script>', amp: 'a&b' }).html;
    expect(s.startsWith('<script type="application/json" id="c1">')).toBe(true);
    expect(s.slice(0, -'</script>'.length)).not.toContain('</script');
    expect(s).not.toContain('<script>');
    // the data survives a round trip through JSON.parse
    const body = s.slice(s.indexOf('>') + 1, -'</script>'.length);
    expect(JSON.parse(body)).toEqual({ name: '</script><script>alert(1)</script>', amp: 'a&b' });
  });
});

// ownSvg (views/html.ts): a drawing of our chart code (packet/chart-svg.ts) is sent as it is, anything with a
// script, an event attribute, a link or foreign content is refused. Escaping per the OWASP XSS Prevention Cheat
// Sheet, rule #1; what is refused follows SVG 1.1 Second Edition, chapters 17 (Linking: 'a', href), 18 (Scripting:
// 'script', event attributes) and 23 (Extensibility: 'foreignObject'), chapter numbers from memory.
import { describe, expect, it } from 'vitest';
import { chartSvg } from '../../packet/chart-svg.ts';
import { html, ownSvg } from '../../views/html.ts';

const EVIL = '<script>alert(1)</script>" onload="alert(2)';

describe('ownSvg', () => {
  it('passes a chart whose labels carry markup, escaped by the chart code', () => {
    const svg = chartSvg({ title: EVIL, xLabel: 'z', yLabel: 'f', x: [0, 1], y: [0, 1], series: [{ name: EVIL, x: [0, 1], y: [0, 0.5], color: '#0072B2' }] });
    const out = html`<figure>${ownSvg(svg)}</figure>`.html;
    expect(out.startsWith('<figure><svg ')).toBe(true);
    expect(out).toContain('&lt;script&gt;');
    expect(out).not.toContain('<script');
  });

  it('refuses what a chart never holds', () => {
    for (const bad of [
      '<svg><script>alert(1)</script></svg>',
      '<svg onload="alert(1)"><rect/></svg>',
      '<svg><a href="javascript:alert(1)"><text>x</text></a></svg>',
      '<svg><foreignObject><p>x</p></foreignObject></svg>',
      '<div><svg></svg></div>',
      '<svg></svg><img src=x onerror=alert(1)>',
    ]) {
      expect(() => ownSvg(bad), bad).toThrow(/not a drawing/);
    }
  });
});

// User text in the store's HTML views and the packet print view is escaped (source: OWASP XSS Prevention Cheat Sheet,
// rule #1: & < > " ' escaped in element content and quoted attribute values).
import { describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { evaluateForPacket } from '../../packet/build-packet.ts';
import { packetContent } from '../../packet/packet-content.ts';
import type { DesignSummary } from '../../store/design-store.ts';
import { storeInputsPanel } from '../../views/panels/store.ts';
import { designsListView, diffView, historyView, packetHtml } from '../../views/store-views.ts';

const EVIL = '"><script>alert(1)</script>&\'';
const ESCAPED = '&quot;&gt;&lt;script&gt;alert(1)&lt;/script&gt;&amp;&#39;';

const summary: DesignSummary = {
  id: 'abcdef0123',
  name: EVIL,
  created_at: '2026-12-01T00:00:00.000Z',
  updated_at: '2026-12-01T00:00:00.000Z',
  head_revision: 'a'.repeat(64),
  revision_count: 1,
};

describe('store views', () => {
  it('escape design names and revision messages in the list and the history', () => {
    const list = designsListView([summary]).html;
    expect(list).toContain(ESCAPED);
    expect(list).not.toContain('<script>');
    const d = demoDesign();
    d.notes = EVIL;
    const hist = historyView(summary, [{ seq: 1, revision_id: 'a'.repeat(64), saved_at: 'x', message: EVIL }], new Map([['a'.repeat(64), d]])).html;
    expect(hist).not.toContain('<script>');
    // the design JSON for "open in the page" sits in a quoted attribute, escaped
    expect(hist).toContain('name="_upload" value="{&quot;format&quot;:&quot;lockstep-design/1&quot;');
  });
  it('escape diff lines', () => {
    const html = diffView('a'.repeat(64), 'b'.repeat(64), [{ path: 'name', kind: 'changed', before: 'x', after: EVIL, unit: '', text: `name: "x" → ${EVIL}` }]).html;
    expect(html).toContain(ESCAPED);
    expect(html).not.toContain('<script>');
  });
  it('escape identification fields in the panel inputs and in the packet print view', () => {
    const ctx = { values: { 'identification.owner': EVIL, _design_id: EVIL }, units: 'metric' as const, errors: new Map(), structural: new Set<string>(), rendered: new Set<string>() };
    const inputs = storeInputsPanel.inputs!(ctx).html;
    expect(inputs).toContain(`value="${ESCAPED}"`);
    expect(inputs).not.toContain('<script>');
    const d = demoDesign();
    d.identification = { owner: EVIL, approval_code: EVIL };
    const page = packetHtml(packetContent({ design: d, result: evaluateForPacket(d), revisionId: 'c'.repeat(64), date: new Date(0) })).html;
    expect(page).toContain(ESCAPED);
    expect(page).not.toContain('<script>');
    expect(page).toContain('c'.repeat(64));
    expect(page).toContain('<svg'); // charts inline as vector graphics
  });
});

// Real-browser test of the sizing panel (views/panels/sizing.ts): Debian's chromium driven by playwright-core
// (never a browser download) against buildApp() on a random loopback port. A 70 mm rear piston over-brakes the
// demo's rear axle (rear gain (70/48)² = 2.13 times, hand-derived as in test/browser/workbench.test.ts), so the
// lock-order rule fails; "Apply" on the first (passing) option must make the design pass, "Undo" restore 70 mm.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserHarness, openBrowser, scrollIntoView } from './harness.ts';

let h: BrowserHarness;
let page: Page;
let problems: string[] = [];

beforeAll(async () => {
  h = await openBrowser({ name: 'sizing', viewport: { width: 1366, height: 768 } });
  page = h.page;
  problems = h.problems;
  await page.goto(`${h.base}/?fresh`);
  // the sizing panel is deferred: it is computed when it is in view (views/pages/workbench.ts deferredSlot)
  await scrollIntoView(page, '#panel-sizing');
  await page.waitForSelector('#chart-sizing-band .chart[data-drawn]', { timeout: 30000 });
}, 90000);

afterAll(async () => {
  await h?.close();
});

const REAR = '#f-axles-rear-brake-piston_diameters_mm-0-';

describe('sizing panel in chromium', { timeout: 60000 }, () => {
  it('draws the band chart and the robustness histogram', async () => {
    // the Monte Carlo runs on request only
    expect(await page.$('#chart-sizing-histogram')).toBeNull();
    await page.click('#panel-sizing button.run-robust');
    await page.waitForSelector('#chart-sizing-histogram .chart[data-drawn]', { timeout: 30000 });
    expect(await page.getAttribute('#chart-sizing-histogram .chart', 'data-drawn')).not.toBeNull();
    expect(await page.textContent('#panel-sizing')).toContain('physical brake testing');
  });

  it('Apply fixes a failing design, Undo restores it', async () => {
    let answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.fill(REAR, '70');
    await answer;
    await scrollIntoView(page, '#panel-sizing');
    await page.waitForFunction(() => document.querySelector('#panel-sizing .deferred-body .sum')?.textContent?.includes('(fails'));
    answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('#panel-sizing table.sizing-options tbody tr:first-child button.apply');
    await answer;
    await scrollIntoView(page, '#panel-sizing');
    await page.waitForFunction(() => document.querySelector('#panel-sizing .deferred-body .sum')?.textContent?.includes('(passes'));
    expect(await page.isVisible('button[value^="size:apply:"]:has-text("Undo")')).toBe(true);
    answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('button[value^="size:apply:"]:has-text("Undo")');
    await answer;
    await page.waitForFunction((sel) => (document.querySelector(sel) as HTMLInputElement | null)?.value === '70', REAR);
    expect(problems).toEqual([]);
  });
});

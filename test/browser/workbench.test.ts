// Real-browser test of the workbench: Debian's chromium driven by playwright-core (never a browser download),
// against buildApp() listening on a random loopback port.
// Sources: NIST SP 811 appendix B.8 (1 in = 0.0254 m exactly: 3.665 m = 144.2913 in, shown to 0.01 in as 144.29; 58 in = 1.4732 m, shown exactly
// in metric, the design file's own unit);
// the lock-order expectation for a 70 mm rear piston is hand-checked with core evaluate() before writing
// this test (rear brake gain (70/48)² = 2.13 times the demo's, so the rear axle is over-braked and locks first).
import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { type BrowserHarness, openBrowser, scrollIntoView, settled } from './harness.ts';

let h: BrowserHarness;
let page: Page;
let base = '';
let problems: string[] = [];

beforeAll(async () => {
  h = await openBrowser({ name: 'workbench', viewport: { width: 1366, height: 768 }, acceptDownloads: true });
  page = h.page;
  problems = h.problems;
  base = h.base;
  await page.goto(`${base}/?fresh`);
  await page.waitForSelector('#chart-a .chart[data-drawn]', { timeout: 30000 });
}, 90000);

afterAll(async () => {
  await h?.close();
});

const drawn = (id: string) => page.getAttribute(`#${id} .chart`, 'data-drawn');
const verdictText = () => page.textContent('#verdict-1');

/** Replaces the text of a field (one input event) and waits for the server's answer to the debounced request. */
async function typeInto(selector: string, text: string): Promise<void> {
  const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
  await page.fill(selector, text);
  await answer;
  await settled(page);
}

/** Uploads a file; when designs are saved the page asks "new design or new revision?": a new design. */
async function uploadFile(file: { name: string; mimeType: string; buffer: Buffer }): Promise<void> {
  const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
  const asked = page.waitForSelector('#upload-ask[open]', { timeout: 20000 }).then(() => page.click('#upload-ask button[value="load"]')).catch(() => undefined);
  await page.setInputFiles('#upload', file);
  await answer; // (the question, when asked, is answered above; when not, its wait ends on its own)
  void asked;
}

/** Charts whose legend starts above the bottom of their x-axis title (static/js/charts.js moves it clear). */
async function legendOverlaps(): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('div.chart[data-drawn]')].flatMap((el) => {
      const legend = el.querySelector('g.legend');
      const title = el.querySelector('g.g-xtitle');
      if (!legend || !title) return [];
      const over = title.getBoundingClientRect().bottom - legend.getBoundingClientRect().top;
      return over > 0 ? [`${el.closest('figure')?.id ?? '?'}: ${over.toFixed(0)} px`] : [];
    }),
  );
}

// the machine running the suite may be busy: a generous timeout per step, never a timed assertion
describe('workbench in chromium', { timeout: 60000 }, () => {
  it('opens with the overall verdict above every result: FAIL for the demo (its regeneration), each line leading to its row', async () => {
    // the demo fails on purpose: regeneration unladen at 20 and 50 km/h (core/demo.ts)
    expect(await page.textContent('#overall-verdict .ov-badge')).toBe('FAIL');
    const first = await page.evaluate(() => {
      // the first result in the page's order (the stale note and the demo's introduction are not results)
      return document.querySelector('#results :is(.overall-verdict, section.panel)')?.id;
    });
    expect(first).toBe('overall-verdict');
    await page.click('#overall-verdict li a');
    const target = await page.evaluate(() => {
      const t = document.querySelector(':target');
      if (!t) return null;
      const r = t.getBoundingClientRect();
      return { tag: t.tagName, text: t.textContent ?? '', visible: r.top >= 0 && r.top < innerHeight };
    });
    expect(target).toMatchObject({ tag: 'TR', visible: true });
    expect(target!.text).toContain('FAIL');
    expect(target!.text).toContain('20 km/h');
    await page.evaluate(() => window.scrollTo(0, 0));
  });

  it('opens on the demo with the verdict, three charts and the caution', async () => {
    expect(await page.textContent('#verdict-0')).toContain('front axle locks first');
    for (const id of ['chart-a', 'chart-b', 'chart-c']) expect(await drawn(id)).not.toBeNull();
    expect(await page.isVisible('.caution')).toBe(true);
    expect(await page.textContent('.caution')).toContain('physical brake testing');
  });

  it('a bigger rear piston updates the verdict and the charts', async () => {
    const before = { verdict: await verdictText(), a: await drawn('chart-a'), b: await drawn('chart-b') };
    await typeInto('#f-axles-rear-brake-piston_diameters_mm-0-', '70');
    await page.waitForFunction((prev) => document.querySelector('#chart-a .chart')?.getAttribute('data-drawn') !== prev, before.a);
    const after = await verdictText();
    expect(after).not.toBe(before.verdict);
    expect(after).toContain('rear axle locks first');
    expect(await drawn('chart-b')).not.toBe(before.b);
    // the redrawn charts hold plotted traces again (not an emptied container with a new counter)
    for (const id of ['chart-a', 'chart-b', 'chart-c']) {
      expect(await drawn(id)).not.toBeNull();
      expect(await page.locator(`#${id} .chart .scatterlayer .trace`).count()).toBeGreaterThan(1);
    }
    await typeInto('#f-axles-rear-brake-piston_diameters_mm-0-', '48');
    await page.waitForFunction(() => document.querySelector('#verdict-1')?.textContent?.includes('front axle locks first on every surface'));
  });

  it('a field error is marked, results say "not current", and clearing it brings the results back', async () => {
    await typeInto('#f-hydraulics-pedal_ratio', '3.8x');
    expect(await page.textContent('#m-hydraulics-pedal_ratio')).toMatch(/not accepted|not a number/);
    expect(await page.isVisible('#m-hydraulics-pedal_ratio')).toBe(true);
    expect(await page.textContent('#results-note')).toContain('Not current');
    expect(await page.textContent('#status')).toContain('need');
    expect(await page.inputValue('#f-hydraulics-pedal_ratio')).toBe('3.8x'); // typed text kept
    await typeInto('#f-hydraulics-pedal_ratio', '3.8');
    expect((await page.textContent('#m-hydraulics-pedal_ratio'))?.trim()).toBe('');
    expect((await page.textContent('#results-note'))?.trim()).toBe('');
    expect(await page.textContent('#status')).toContain('Results are current');
  });

  it('switching to US units converts the shown values (3.665 m = 144.29 in)', async () => {
    const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.selectOption('#units', 'us');
    await answer;
    await page.waitForFunction(() => (document.querySelector('#f-vehicle-wheelbase_m') as HTMLInputElement | null)?.value === '144.29');
    expect(await page.textContent('label[for="f-vehicle-wheelbase_m"]')).toContain('in');
    expect(await page.textContent('#panel-table')).toContain('psi');
  });

  it('"58 in" typed into the wheelbase is taken as 58 inches (1.4732 m back in metric)', async () => {
    await typeInto('#f-vehicle-wheelbase_m', '58 in');
    expect(await page.textContent('#status')).toContain('Results are current');
    expect(await page.inputValue('#f-vehicle-wheelbase_m')).toBe('58 in');
    const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.selectOption('#units', 'metric');
    await answer;
    await page.waitForFunction(() => (document.querySelector('#f-vehicle-wheelbase_m') as HTMLInputElement | null)?.value === '1.4732');
  });

  it('the draft survives a reload', async () => {
    await page.goto(`${base}/`); // without ?fresh, the draft kept in localStorage is restored
    await page.waitForFunction(() => (document.querySelector('#f-vehicle-wheelbase_m') as HTMLInputElement | null)?.value === '1.4732', undefined, { timeout: 30000 });
  }, 40000);

  it('a malformed file is refused and the design stays; a valid file replaces it', async () => {
    const nameBefore = await page.inputValue('#f-name');
    await uploadFile({ name: 'broken.json', mimeType: 'application/json', buffer: Buffer.from('{"format": "lockstep-design/1",') });
    await page.waitForSelector('#status.upload-error');
    expect(await page.textContent('#status')).toContain('APP_ERR_UPLOAD_NOT_JSON');
    expect(await page.inputValue('#f-name')).toBe(nameBefore);

    const d = demoDesign();
    d.name = 'Uploaded in the browser test';
    d.vehicle.wheelbase_m = 3.2;
    await uploadFile({ name: 'good.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(d)) });
    await page.waitForFunction(() => (document.querySelector('#f-name') as HTMLInputElement | null)?.value === 'Uploaded in the browser test');
    expect(await page.inputValue('#f-vehicle-wheelbase_m')).toBe('3.2');
    expect(await page.textContent('#results')).toContain('Uploaded in the browser test');
  });

  it('downloads the design as JSON', async () => {
    const dl = page.waitForEvent('download');
    await page.click('button[data-download="/workbench/design.json"]');
    const file = await dl;
    expect(file.suggestedFilename()).toMatch(/\.lockstep\.json$/);
  });

  it('adds a load state and switches the rear brake to drum', async () => {
    let answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('button[value="add:load_states"]');
    await answer;
    await page.waitForSelector('#verdict-2');
    answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.selectOption('#f-axles-rear-brake-type', 'drum');
    await answer;
    await page.waitForSelector('#f-axles-rear-brake-brake_factor');
  }, 40000);

  it('fits a 1366×768 screen without sideways scrolling, and produced no script or CSP errors', async () => {
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    // the pedal-travel chart (deferred panel): seven legend entries on a plot of the default height
    await scrollIntoView(page, '#panel-hardware');
    await page.waitForSelector('#panel-hardware .chart[data-drawn]', { timeout: 30000 });
    expect(await legendOverlaps()).toEqual([]);
    mkdirSync('test-results', { recursive: true });
    await page.screenshot({ path: 'test-results/workbench-1366x768.png', fullPage: true });
    await page.setViewportSize({ width: 820, height: 1180 }); // tablet, portrait
    await page.waitForTimeout(400);
    const tabletOverflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(tabletOverflow).toBeLessThanOrEqual(0);
    await page.waitForFunction(() => !document.querySelector('.chart[data-drawn]') || [...document.querySelectorAll('.chart[data-drawn] g.legend')].length > 0);
    expect(await legendOverlaps()).toEqual([]);
    await page.screenshot({ path: 'test-results/workbench-tablet.png' });
    expect([...new Set(problems)]).toEqual([]);
  }, 60000);
});

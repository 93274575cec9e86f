// Real-browser test of the workbench layout and of "nothing lost" (issue 15), at a desktop (1440×900) and a
// phone (390×844) viewport: Debian's chromium driven by playwright-core against buildApp() on a loopback port.
// Thresholds: 40 px tap targets (common practice for touch screens, no source; WCAG 2.2 2.5.8 asks for at
// least 24 px); 320 px plot areas and the page-weight budgets (1.6 MB first load, 50 KB repeat) are the issue's.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDesign } from '../../core/index.ts';
import { type BrowserHarness, openBrowser, settled } from './harness.ts';

let desk: BrowserHarness;
let phone: BrowserHarness;
// the design store of these servers: an empty folder of its own (read when the store is first opened)
const dataDir = mkdtempSync(join(tmpdir(), 'lockstep-ux-store-'));
const dataDirBefore = process.env.LOCKSTEP_DATA_DIR;

beforeAll(async () => {
  process.env.LOCKSTEP_DATA_DIR = dataDir;
  desk = await openBrowser({ name: 'ux-desk', viewport: { width: 1440, height: 900 } });
  phone = await openBrowser({ name: 'ux-phone', viewport: { width: 390, height: 844 } });
  mkdirSync('test-results', { recursive: true });
}, 90000);

afterAll(async () => {
  await desk?.close();
  await phone?.close();
  if (dataDirBefore === undefined) delete process.env.LOCKSTEP_DATA_DIR;
  else process.env.LOCKSTEP_DATA_DIR = dataDirBefore;
  rmSync(dataDir, { recursive: true, force: true });
});

const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

/** Sets a field's text (one input event) and waits for the answer to the debounced request. */
async function typeInto(page: Page, selector: string, text: string): Promise<void> {
  const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
  await page.fill(selector, text);
  await answer;
  await settled(page);
}
async function choose(page: Page, selector: string, value: string): Promise<void> {
  const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
  await page.selectOption(selector, value);
  await answer;
  await settled(page);
}

/** Bytes transferred for the document and every resource it loaded so far (Resource Timing transferSize). */
const transferred = (page: Page) =>
  page.evaluate(() =>
    (performance.getEntriesByType('navigation') as PerformanceResourceTiming[])
      .concat(performance.getEntriesByType('resource') as PerformanceResourceTiming[])
      .reduce((sum, e) => sum + (e.transferSize || 0), 0),
  );

describe('workbench on a phone (390×844)', { timeout: 60000 }, () => {
  it('does not scroll sideways, reaches the results in one tap, and its controls are at least 40 px', async () => {
    const page = phone.page;
    await page.goto(`${phone.base}/?fresh`);
    await page.waitForSelector('#chart-a .chart[data-drawn]', { timeout: 30000 });
    await page.waitForSelector('#panel-hardware .deferred, #panel-hardware .chart', { state: 'attached' });
    expect(await overflow(page)).toBeLessThanOrEqual(0);
    // the results start far below the inputs on a phone; the jump bar stays on screen and takes you there
    const before = await page.evaluate(() => document.getElementById('results-top')!.getBoundingClientRect().top);
    expect(before).toBeGreaterThan(844);
    await page.click('.jumpbar a.jb-results');
    await page.waitForFunction(() => {
      const top = document.getElementById('results-top')!.getBoundingClientRect().top;
      return top >= 0 && top < 200;
    });
    expect(await page.isVisible('.jumpbar')).toBe(true);
    // the section index: one tap opens it, one tap on an entry goes to that section
    await page.click('#section-index > summary');
    await page.click('#section-index a[href="#panel-checks"]');
    await page.waitForFunction(() => {
      const top = document.getElementById('panel-checks')!.getBoundingClientRect().top;
      return top >= 0 && top < 200;
    });
    expect(await page.evaluate(() => (document.getElementById('section-index') as HTMLDetailsElement).open)).toBe(false);
    const small = await page.evaluate(() =>
      [...document.querySelectorAll('.jumpbar a, .jumpbar summary, .top button, .top .button, #design-inputs button, #design-inputs select, #design-inputs input:not([type=hidden]):not([type=checkbox]), details.fold > summary')]
        .filter((e) => {
          const r = e.getBoundingClientRect();
          return r.width > 0 && r.height > 0 && r.height < 40;
        })
        .map((e) => `${e.tagName} ${(e.textContent ?? '').trim().slice(0, 30)}`),
    );
    expect(small).toEqual([]);
    // tables reflow: each cell carries its column's heading, none is cut off at the right edge
    expect(await page.locator('#panel-table table.reflow td[data-label]').count()).toBeGreaterThan(10);
    const cut = await page.evaluate(() => [...document.querySelectorAll('table')].filter((t) => t.getBoundingClientRect().right > document.documentElement.clientWidth + 1).length);
    expect(cut).toBe(0);
    await page.screenshot({ path: 'test-results/ux-phone-results.png' });
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: 'test-results/ux-phone-top.png' });
    expect(phone.problems).toEqual([]);
  });
});

describe('workbench on a desktop (1440×900)', { timeout: 60000 }, () => {
  it('fits without sideways scrolling, puts related sections side by side, plots at least 320 px tall', async () => {
    const page = desk.page;
    await page.goto(`${desk.base}/?fresh`);
    await page.waitForSelector('#chart-c .chart[data-drawn]', { timeout: 30000 });
    expect(await overflow(page)).toBeLessThanOrEqual(0);
    const box = async (sel: string) => (await page.locator(sel).boundingBox())!;
    const ci = await box('#panel-conversion-inputs');
    const cr = await box('#panel-conversion');
    expect(cr.x).toBeGreaterThan(ci.x + ci.width - 1); // results to the right of their inputs
    expect(Math.abs(cr.y - ci.y)).toBeLessThan(30); // on the same row
    await page.waitForFunction(() => [...document.querySelectorAll('#panel-charts div.chart[data-drawn]')].length === 3);
    const plots = await page.evaluate(() => [...document.querySelectorAll('#panel-charts div.chart[data-drawn]')].map((e) => (e as unknown as { _fullLayout: { _size: { h: number } } })._fullLayout._size.h));
    for (const h of plots) expect(h).toBeGreaterThanOrEqual(320);
    await page.screenshot({ path: 'test-results/ux-desktop.png' });
  });

  it('says "computing…" from the first keystroke until the answer arrives', async () => {
    const page = desk.page;
    const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.fill('#f-hydraulics-pedal_ratio', '3.9');
    // the form waits 400 ms before it posts: the status says so at once
    expect(await page.textContent('#status')).toContain('computing…');
    expect(await page.textContent('#jb-live')).toContain('computing…');
    await answer;
    await settled(page);
    expect(await page.textContent('#status')).not.toContain('computing…');
    expect(await page.textContent('#jb-live')).toContain('current');
  });

  it('a brake type switched and back keeps what was typed for the first type', async () => {
    const page = desk.page;
    await typeInto(page, '#f-axles-front-brake-effective_radius_m', '0.131');
    await choose(page, '#f-axles-front-brake-type', 'drum');
    await page.waitForSelector('#f-axles-front-brake-drum_radius_m');
    expect(await page.locator('#f-axles-front-brake-effective_radius_m').count()).toBe(0);
    await typeInto(page, '#f-axles-front-brake-drum_radius_m', '0.141');
    await choose(page, '#f-axles-front-brake-type', 'disc');
    await page.waitForSelector('#f-axles-front-brake-effective_radius_m');
    expect(await page.inputValue('#f-axles-front-brake-effective_radius_m')).toBe('0.131');
    await choose(page, '#f-axles-front-brake-type', 'drum');
    await page.waitForSelector('#f-axles-front-brake-drum_radius_m');
    expect(await page.inputValue('#f-axles-front-brake-drum_radius_m')).toBe('0.141');
    await choose(page, '#f-axles-front-brake-type', 'disc');
    await page.waitForSelector('#f-axles-front-brake-effective_radius_m');
  });

  it('"Start again from the demo" asks first; declined, nothing changes', async () => {
    const page = desk.page;
    let sent = 0;
    const count = (r: { url(): string }) => { if (r.url().endsWith('/workbench/update')) sent++; };
    page.on('request', count);
    const dialog = page.waitForEvent('dialog');
    const click = page.click('button[value="demo"]');
    const d = await dialog;
    expect(d.message()).toContain('Start again from the demo?');
    await d.dismiss();
    await click;
    await settled(page);
    page.off('request', count);
    expect(sent).toBe(0); // declined: nothing was sent
    expect(await page.inputValue('#f-hydraulics-pedal_ratio')).toBe('3.9');
    page.once('dialog', (d) => void d.accept());
    const answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('button[value="demo"]');
    await answer;
    await settled(page);
    expect(await page.inputValue('#f-hydraulics-pedal_ratio')).not.toBe('3.9');
  });

  it('a reload with an invalid field shows that field and its message, never the demo results', async () => {
    const page = desk.page;
    await typeInto(page, '#f-vehicle-wheelbase_m', '3.6x');
    expect(await page.textContent('#m-vehicle-wheelbase_m')).not.toBe('');
    await page.goto(`${desk.base}/`);
    await page.waitForFunction(() => (document.querySelector('#f-vehicle-wheelbase_m') as HTMLInputElement | null)?.value === '3.6x', undefined, { timeout: 30000 });
    await page.waitForSelector('#m-vehicle-wheelbase_m:not(:empty)');
    expect(await page.locator('#results .result-body').count()).toBe(0);
    expect(await page.textContent('#results')).toContain('No results yet for this design');
    await typeInto(page, '#f-vehicle-wheelbase_m', '3.665');
    await page.waitForSelector('#results .result-body');
  }, 60000);

  it('the axle-lift readings come back after a reload', async () => {
    const page = desk.page;
    await page.waitForSelector('#cg-lift form');
    // an untouched wheelbase follows the design's; one typed over stays as typed
    expect(await page.inputValue('#f-lift-wheelbase_m')).toBe('3.665');
    await typeInto(page, '#f-vehicle-wheelbase_m', '3.7');
    await page.waitForFunction(() => (document.querySelector('#f-lift-wheelbase_m') as HTMLInputElement | null)?.value === '3.7');
    await page.fill('#f-lift-wheelbase_m', '3.69');
    await typeInto(page, '#f-vehicle-wheelbase_m', '3.665');
    expect(await page.inputValue('#f-lift-wheelbase_m')).toBe('3.69');
    await page.fill('#f-lift-lifts-0-lift_height_m', '0.6');
    await page.fill('#f-lift-lifts-0-reading_kg', '1803');
    await page.goto(`${desk.base}/`);
    await page.waitForFunction(() => (document.querySelector('#f-lift-lifts-0-reading_kg') as HTMLInputElement | null)?.value === '1803', undefined, { timeout: 30000 });
    expect(await page.inputValue('#f-lift-lifts-0-lift_height_m')).toBe('0.6');
    expect(await page.inputValue('#f-lift-wheelbase_m')).toBe('3.69');
  }, 60000);

  it('the store keeps a history: a revision opened and saved, a file loaded as a revision or as a new design', async () => {
    const page = desk.page;
    const saved = () => page.textContent('#store-status');
    const save = async () => {
      const answer = page.waitForResponse((r) => r.url().endsWith('/designs/save'));
      await page.click('#panel-packet button:has-text("Save revision")');
      await answer;
      await settled(page);
    };
    await page.goto(`${desk.base}/?fresh`);
    await page.waitForSelector('#panel-packet button:has-text("Save revision")');
    await save();
    expect(await saved()).toContain('Saved as a new design');
    // open revision 1 from the history, change it, save: a second revision of the same design
    await page.click('#store-status a:has-text("history")');
    await page.waitForSelector('#designs button[form="open-1"]');
    let answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('#designs button[form="open-1"]');
    await answer;
    await settled(page);
    await typeInto(page, '#f-hydraulics-pedal_ratio', '4.1');
    await save();
    expect(await saved()).toMatch(/Saved as a new revision[\s\S]*2 revisions/);
    // a file uploaded now: the page asks; as a revision of the saved design, the next save is its third
    const d = demoDesign(); // the same name as the saved design
    d.hydraulics.pedal_ratio = 4.3;
    const upload = async (as: 'new' | 'revision') => {
      const done = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
      await page.setInputFiles('#upload', { name: 'van.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(d)) });
      await page.waitForSelector('#upload-ask[open]');
      expect(await page.locator('#upload-ask-design option').count()).toBe(1);
      await page.check(`#upload-ask input[value="${as}"]`);
      await page.click('#upload-ask button[value="load"]');
      await done;
      await settled(page);
    };
    await upload('revision');
    expect(await page.inputValue('#f-hydraulics-pedal_ratio')).toBe('4.3');
    await save();
    expect(await saved()).toMatch(/3 revisions/);
    // the same file as a new design: two designs of the same name, told apart in the list
    d.hydraulics.pedal_ratio = 4.4;
    await upload('new');
    await save();
    expect(await saved()).toContain('Saved as a new design');
    answer = page.waitForResponse((r) => r.url().endsWith('/designs'));
    await page.click('#panel-packet button:has-text("Saved designs")');
    await answer;
    await settled(page);
    const names = await page.locator('#designs tbody tr td:first-child').allTextContents();
    expect(names).toHaveLength(2);
    expect(new Set(names.map((n) => n.replace(/\s+/g, ' ').trim())).size).toBe(2);
    await page.locator('#panel-packet').screenshot({ path: 'test-results/ux-store.png' });
    // the packet download says what it is doing beside its button, then replaces that with the outcome
    const packet = page.locator('#panel-packet button[data-download="/packet.pdf"]');
    await packet.click();
    const msg = page.locator('#panel-packet .dl-msg');
    expect(await msg.count()).toBe(1);
    expect(await msg.textContent()).toMatch(/Preparing lockstep-packet\.pdf|Downloading|Downloaded/);
    await page.waitForFunction(() => /Downloaded|failed|refused/i.test(document.querySelector('#panel-packet .dl-msg')?.textContent ?? ''), undefined, { timeout: 40000 });
    expect(await msg.textContent()).toMatch(/^Downloaded .*\.pdf \(\d+ KB\)\.$/);
    await packet.click();
    await page.waitForFunction(() => /^Downloaded/.test(document.querySelector('#panel-packet .dl-msg')?.textContent ?? ''), undefined, { timeout: 40000 });
    expect(await page.locator('#panel-packet .dl-msg').count()).toBe(1); // replaced, not added
  }, 90000);

  it('first load under 1.6 MB transferred, a repeat load under 50 KB', async () => {
    // a fresh page of the same profile, its HTTP cache emptied first
    const page = await desk.ctx.newPage();
    const cdp = await desk.ctx.newCDPSession(page);
    await cdp.send('Network.clearBrowserCache');
    await page.goto(`${desk.base}/?fresh`);
    await page.waitForSelector('#chart-a .chart[data-drawn]', { timeout: 30000 });
    await settled(page);
    const first = await transferred(page);
    await page.goto(`${desk.base}/?fresh`);
    await page.waitForSelector('#chart-a .chart[data-drawn]', { timeout: 30000 });
    await settled(page);
    const repeat = await transferred(page);
    console.log(`page weight: first load ${(first / 1024).toFixed(0)} KiB, repeat load ${(repeat / 1024).toFixed(1)} KiB transferred`);
    expect(first).toBeLessThan(1.6e6);
    expect(repeat).toBeLessThan(50e3);
    await page.close();
    expect([...new Set(desk.problems)]).toEqual([]);
  }, 60000);
});

/** What an internal code looks like in text: snake_case, UPPER_CASE codes, JSON paths, file names (issue 15 point 9). */
const CODE_PATTERNS = [/\b[a-z][a-z0-9]*_[a-z0-9_]+\b/.source, /\b[A-Z][A-Z0-9]*_[A-Z0-9_]+\b/.source, /\b[a-z_]+\[\d+\]/.source, /\b[\w-]+\.(json|ts|js|mjs|md)\b/.source];
/** Metric units after a number or as a column's unit, which must not show in US units (issue 15 point 6). */
const METRIC_UNIT = /(\d\s?|\(|^)(bar|kg|N|km\/h|mm|m\/s²)(?=$|[\s),;.:·/])/;

/** Scrolls through the page so every deferred panel asks for its results, then waits for them. */
async function loadEverything(page: Page): Promise<void> {
  const h = await page.evaluate(() => document.documentElement.scrollHeight);
  for (let y = 0; y < h + 1500; y += 700) {
    await page.evaluate((top) => window.scrollTo(0, top), y);
    await page.waitForTimeout(60);
  }
  await page.waitForFunction(() => document.querySelectorAll('.deferred').length === 0, undefined, { timeout: 30000 }).catch(() => undefined);
  await settled(page);
}

/** Visible text nodes matching a code pattern: not in script, closed <details> (its summary aside) or hidden parts. */
function visibleCodes(page: Page): Promise<string[]> {
  return page.evaluate((sources) => {
    const pats = sources.map((s) => new RegExp(s));
    const out: string[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const t = (n.textContent ?? '').trim();
      const el = n.parentElement;
      if (!t || !el || !pats.some((p) => p.test(t)) || el.closest('script,style,template,option')) continue;
      const closed = el.closest('details:not([open])');
      if (closed && !el.closest('summary')) continue;
      const r = el.getBoundingClientRect();
      const cs = getComputedStyle(el);
      if (r.width === 0 || r.height === 0 || cs.visibility === 'hidden') continue;
      out.push(`${el.closest('[id]')?.id ?? ''}: ${t.slice(0, 120)}`);
    }
    return out;
  }, CODE_PATTERNS);
}

/** The axis titles of every chart on the page (the plotly specs the page carries as JSON). */
function axisTitles(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('.chart[data-chart]')].flatMap((c) => {
      // a drawn chart keeps its layout on the element (plotly); one not drawn yet has it in its JSON block
      const drawn = (c as unknown as { layout?: Record<string, { title?: { text?: string } }> }).layout;
      const data = document.getElementById(c.getAttribute('data-chart')!);
      const layout = drawn ?? (data ? (JSON.parse(data.textContent!) as { layout: Record<string, { title?: { text?: string } }> }).layout : {});
      return Object.entries(layout)
        .filter(([k]) => /^[xy]axis\d*$/.test(k))
        .map(([, a]) => a.title?.text ?? '')
        .filter((t) => t !== '');
    }),
  );
}

describe('people’s words and the chosen units (issue 15 points 6, 7, 9)', { timeout: 120000 }, () => {
  for (const [name, which] of [['desktop 1440×900', () => desk], ['phone 390×844', () => phone]] as const) {
    it(`${name}: no internal code visible, in metric and in US units; US units show no metric unit; every axis names its unit`, async () => {
      // a page of its own: the page-weight test before leaves its page on a cached, revisited state
      const page = await which().ctx.newPage();
      const seen = which().problems.length; // problems of this test only
      await page.goto(`${which().base}/?fresh`);
      await page.waitForSelector('#chart-a .chart[data-drawn]', { timeout: 30000 });
      await loadEverything(page);
      expect(await visibleCodes(page)).toEqual([]);
      const metricTitles = await axisTitles(page);
      expect(metricTitles.length).toBeGreaterThanOrEqual(7); // charts A, B and C (two y axes) at least
      for (const t of metricTitles) expect(t).toMatch(/\(.+\)$/);
      // US units: the switch recomputes every panel
      await choose(page, '#units', 'us');
      await loadEverything(page);
      expect(await visibleCodes(page)).toEqual([]);
      const text = (sel: string) => page.locator(sel).innerText();
      // load-state names are the user's words (e.g. "Laden to 3500 kg"), not units of the page
      const labels = await page.evaluate(() => [...document.querySelectorAll('#design-inputs input[name$=".label"]')].map((e) => (e as HTMLInputElement).value).filter((v) => v !== ''));
      const unlabelled = (t: string) => labels.reduce((a, l) => a.split(l).join('…'), t);
      const checks = unlabelled(await text('#panel-checks'));
      expect(checks).toMatch(/ft\/s²/);
      expect(checks.split('\n').filter((l) => METRIC_UNIT.test(l))).toEqual([]);
      // the sizing panel's sentences (part designations of metric series, e.g. a 28 mm bore, keep their names)
      const sizing = unlabelled((await page.locator('#panel-sizing p').allInnerTexts()).join('\n'));
      expect(sizing).toMatch(/psi|lbf|in\b/);
      expect(sizing.split('\n').filter((l) => METRIC_UNIT.test(l))).toEqual([]);
      const regen = unlabelled(await page.locator('#panel-limits').innerText());
      const regenPart = regen.slice(regen.indexOf('Regenerative braking'), regen.indexOf('Stopping distance'));
      expect(regenPart).toMatch(/lbf/);
      expect(regenPart.split('\n').filter((l) => METRIC_UNIT.test(l))).toEqual([]);
      const pedal = unlabelled(await text('#panel-hardware'));
      expect(pedal).toMatch(/lbf/);
      expect(pedal.split('\n').filter((l) => /pedal/i.test(l) && METRIC_UNIT.test(l))).toEqual([]);
      const usTitles = await axisTitles(page);
      for (const t of usTitles) {
        expect(t).toMatch(/\(.+\)$/);
        expect(t).not.toMatch(METRIC_UNIT);
      }
      expect(usTitles.some((t) => /psi/.test(t)) && usTitles.some((t) => /lbf/.test(t))).toBe(true);
      await page.evaluate(() => window.scrollTo(0, 0));
      await page.screenshot({ path: `test-results/ux-us-${name.startsWith('desktop') ? 'desktop' : 'phone'}.png` });
      await choose(page, '#units', 'metric');
      await page.close();
      expect(which().problems.slice(seen)).toEqual([]);
    });
  }
});

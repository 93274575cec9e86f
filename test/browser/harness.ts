/**
 * Shared set-up of the real-browser tests: buildApp() on a random loopback port and Debian's chromium
 * (/usr/bin/chromium, never a downloaded browser) driven by playwright-core in a fresh profile, with every
 * page error and console error collected (CSP violations show up there; 422 answers and requests replaced by a
 * newer one are expected).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { FastifyInstance } from 'fastify';
import { type BrowserContext, chromium, type Page } from 'playwright-core';
import { buildApp } from '../../server/app.ts';

export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_FLAGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--no-first-run',
];

export interface BrowserHarness {
  app: FastifyInstance;
  ctx: BrowserContext;
  page: Page;
  /** http://127.0.0.1:PORT of the app under test. */
  base: string;
  /** Page and console errors seen so far. */
  problems: string[];
  close(): Promise<void>;
}

export async function openBrowser(opts: {
  name: string;
  viewport: { width: number; height: number };
  acceptDownloads?: boolean;
}): Promise<BrowserHarness> {
  const app = buildApp();
  await app.listen({ host: '127.0.0.1', port: 0 });
  const base = `http://127.0.0.1:${(app.server.address() as { port: number }).port}`;
  const profile = mkdtempSync(join(tmpdir(), `lockstep-${opts.name}-browser-`));
  const ctx = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    args: CHROMIUM_FLAGS,
    viewport: opts.viewport,
    acceptDownloads: opts.acceptDownloads ?? false,
  });
  const page = await ctx.newPage();
  const problems: string[] = [];
  page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    // htmx logs an aborted request as an error: a request replaced by a newer one (hx-sync "replace": a list
    // button clicked while a recompute is on its way) is by design. Real failures still show (htmx:sendError,
    // htmx:responseError are logged beside htmx:afterRequest).
    if (m.type() === 'error' && !/status of 422/.test(m.text()) && !/^htmx:(sendAbort|afterRequest), /.test(m.text())) problems.push(`console: ${m.text()}`);
  });
  return {
    app,
    ctx,
    page,
    base,
    problems,
    async close() {
      await ctx.close();
      await app.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Scrolls the element into view inside the page, in one step: a locator action can fail with "not attached to
 * the DOM" when an htmx swap replaces the element between finding and scrolling it (a recompute re-sends every
 * panel). Waits until the element exists first.
 */
export async function scrollIntoView(page: Page, selector: string): Promise<void> {
  await page.waitForSelector(selector, { state: 'attached' });
  await page.evaluate((sel) => document.querySelector(sel)?.scrollIntoView({ block: 'start' }), selector);
}

/**
 * Waits until htmx has finished with every answer: no element is still waiting for a request, swapping or
 * settling (htmx's own classes). Call it after the awaited response of a request, whose swap runs a moment later.
 */
export async function settled(page: Page): Promise<void> {
  await page.waitForFunction(() => !document.querySelector('.htmx-request, .htmx-swapping, .htmx-settling'));
}

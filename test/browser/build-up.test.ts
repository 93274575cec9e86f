// Real-browser test of the conversion inputs (views/panels/conversion-inputs.ts): Debian's chromium driven by
// playwright-core (never a browser download) against buildApp() on a random loopback port.
// Hand-derived (docs/build-up.md "What is computed"): base vehicle 1400 + 1200 kg = 2600 kg; an item added over
// the rear axle (x = L) adds its whole mass to the rear axle, so the unladen state (no driver seat listed) is
// 2600 + 200 = 2800 kg, and 2600 + 300 = 2900 kg after the item's mass is changed to 300 kg.
import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserHarness, openBrowser } from './harness.ts';

let h: BrowserHarness;
let page: Page;
let base = '';
let problems: string[] = [];

beforeAll(async () => {
  h = await openBrowser({ name: 'build-up', viewport: { width: 1366, height: 900 } });
  page = h.page;
  problems = h.problems;
  base = h.base;
  await page.goto(`${base}/?fresh`);
  await page.waitForSelector('#panel-conversion-inputs', { timeout: 30000 });
}, 90000);

afterAll(async () => {
  await h?.close();
});

const unladenMass = async () =>
  (await page.locator('#panel-conversion tr', { hasText: 'Unladen (from build-up)' }).locator('td').first().textContent()) ?? '';

describe('mass build-up inputs in chromium', { timeout: 60000 }, () => {
  it('enter a base vehicle, add an item, take load state 1 from the build-up; the unladen mass follows the item', async () => {
    await page.fill('#f-build_up-baseline-front_axle_kg', '1400');
    await page.fill('#f-build_up-baseline-rear_axle_kg', '1200');
    await page.fill('#f-build_up-baseline-cg_height_m', '0.75');
    await page.selectOption('#f-build_up-baseline-cg_height_source', 'measured');
    await page.click('button[value="add:build_up.added"]');
    await page.waitForSelector('#f-build_up-added-0-mass_kg');
    expect(await page.inputValue('#f-build_up-baseline-front_axle_kg')).toBe('1400'); // typed values kept
    await page.fill('#f-build_up-added-0-name', 'battery pack');
    await page.fill('#f-build_up-added-0-mass_kg', '200');
    await page.fill('#f-build_up-added-0-x_m', '3.665'); // demo wheelbase: over the rear axle
    await page.fill('#f-build_up-added-0-cg_height_m', '0.5');
    await page.selectOption('#f-load_states-0-from_build_up', 'unladen');
    await expect.poll(unladenMass, { timeout: 15000 }).toMatch(/^2800(?![\d.])/);
    expect(await page.locator('#f-load_states-0-mass_kg').count()).toBe(0); // figures now come from the build-up
    await page.fill('#f-build_up-added-0-mass_kg', '300');
    await expect.poll(unladenMass, { timeout: 15000 }).toMatch(/^2900(?![\d.])/);
    mkdirSync('test-results', { recursive: true });
    await page.locator('#panel-conversion-inputs').screenshot({ path: 'test-results/build-up-inputs.png' });
    expect(problems).toEqual([]);
  });
});

// Real-browser test of the axle-lift tool in the conversion panel (views/axle-lift-view.ts): Debian's chromium
// driven by playwright-core (never a browser download) against buildApp() on a random loopback port.
// Readings (hand-derived statics, docs/axle-lift.md "Method"): demo wheelbase L = 3.665 m, wheel-centre height
// r = 0.35 m, level 1700 + 1800 kg (W = 3500 kg), a vehicle with h = 1.00 m. Raising one axle by H = 0.6 m tilts
// the body by θ = asin(0.6 / 3.665): sin θ = 0.16371, tan θ = 0.16594; the axle that stays down gains
// ΔW = W (h − r) tan θ / L = 3500 · 0.65 · 0.16594 / 3.665 = 103.0 kg, so the readings are 1803 kg (front, rear
// raised) and 1903 kg (rear, front raised), and the tool must give h = 1.00 m to within the 1 kg rounding
// (1 kg of ΔW is 3.665 / (3500 · 0.16594) = 6.3 mm of h).
import { mkdirSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type BrowserHarness, openBrowser } from './harness.ts';

let h: BrowserHarness;
let page: Page;
let problems: string[] = [];

beforeAll(async () => {
  h = await openBrowser({ name: 'cg-lift', viewport: { width: 1366, height: 900 } });
  page = h.page;
  problems = h.problems;
  await page.goto(`${h.base}/?fresh`);
  await page.waitForSelector('#cg-lift form', { timeout: 30000 });
}, 90000);

afterAll(async () => {
  await h?.close();
});

const LADEN_CG = '#f-load_states-1-cg_height_m';

describe('axle-lift tool in chromium', { timeout: 60000 }, () => {
  it('fill the lifts, compute, apply to the laden state: its CG height and the results follow', async () => {
    expect(await page.inputValue('#f-lift-wheelbase_m')).toBe('3.665'); // prefilled from the design
    expect(await page.inputValue(LADEN_CG)).toBe('0.9'); // the demo's laden CG height
    await page.fill('#f-lift-wheel_centre_height_m', '0.35');
    await page.fill('#f-lift-level-front_axle_kg', '1700');
    await page.fill('#f-lift-level-rear_axle_kg', '1800');
    // first a mistake: the field is marked with what is allowed, and nothing is computed
    await page.fill('#f-lift-lifts-0-lift_height_m', '0.6');
    await page.fill('#f-lift-lifts-0-reading_kg', '1803');
    await page.fill('#f-lift-lifts-1-lift_height_m', '0.6');
    await page.fill('#f-lift-lifts-1-reading_kg', '1903');
    await page.fill('#f-lift-scale_resolution_kg', '500');
    await page.fill('#f-lift-lift_height_uncertainty_m', '0.002');
    await page.fill('#f-lift-wheelbase_uncertainty_m', '0.003');
    let answer = page.waitForResponse((r) => r.url().endsWith('/workbench/cg-lift'));
    await page.click('#cg-lift button[value="compute"]');
    expect((await answer).status()).toBe(422);
    await page.waitForSelector('#m-lift-scale_resolution_kg:not(:empty)');
    // docs/axle-lift.md: scale_resolution_kg above 0 to 100
    expect(await page.textContent('#m-lift-scale_resolution_kg')).toContain('100');
    expect(await page.inputValue('#f-lift-lifts-1-reading_kg')).toBe('1903'); // typed values kept
    // corrected: the result renders below the form
    await page.fill('#f-lift-scale_resolution_kg', '1');
    answer = page.waitForResponse((r) => r.url().endsWith('/workbench/cg-lift'));
    await page.click('#cg-lift button[value="compute"]');
    expect((await answer).status()).toBe(200);
    await page.waitForSelector('#cg-lift .cg-lift-result');
    const shown = await page.textContent('#cg-lift .cg-lift-result');
    const h = Number(/CG height above ground\s*([\d.]+) m/.exec(shown ?? '')?.[1]);
    expect(Math.abs(h - 1.0)).toBeLessThan(0.007);
    expect(await page.textContent('#cg-lift')).toContain('Largest contribution');
    mkdirSync('test-results', { recursive: true });
    await page.locator('#panel-conversion').screenshot({ path: 'test-results/cg-lift-result.png' });

    // apply: the laden state's CG height is written in the design form and the recompute follows
    answer = page.waitForResponse((r) => r.url().endsWith('/workbench/update'));
    await page.click('#cg-lift button.apply:has-text("Laden to 3500 kg")');
    expect((await answer).status()).toBe(200);
    await page.waitForFunction((sel) => (document.querySelector(sel) as HTMLInputElement | null)?.value !== '0.9', LADEN_CG);
    expect(Math.abs(Number(await page.inputValue(LADEN_CG)) - h)).toBeLessThan(0.0006);
    // the results now say the laden CG height is measured, and the lift tool kept its readings and result
    await page.waitForFunction(() => /Laden to 3500 kg\s*entered by hand\s*[\d.]+\s*[\d.]+\s*measured/.test(document.querySelector('#panel-conversion')?.textContent ?? ''));
    expect(await page.inputValue('#f-lift-lifts-1-reading_kg')).toBe('1903');
    expect(await page.$('#cg-lift .cg-lift-result')).not.toBeNull();
    expect(problems).toEqual([]);
  });
});

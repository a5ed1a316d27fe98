import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seriousViolations } from './a11y.ts';
import { BASE_URL, launch, phoneContext, screenshot } from './browser.ts';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

// Every screen, in both themes: axe-core must find no serious or critical WCAG 2.1 A/AA violation.
const SCREENS = ['/plan', '/passes', '/align', '/logbook'];

describe('accessibility (axe-core)', () => {
  for (const theme of ['outdoor', 'dark'] as const) {
    for (const path of SCREENS) {
      it(`${path} in the ${theme} theme has no serious or critical violations`, async () => {
        const ctx = await phoneContext(browser);
        await ctx.addInitScript((t) => {
          const k = 'glintmark.settings.v1';
          localStorage.setItem(k, JSON.stringify({ ...JSON.parse(localStorage.getItem(k) ?? '{}'), theme: t }));
        }, theme);
        const page = await ctx.newPage();
        await page.goto(BASE_URL + path);
        await page.locator('ion-router-outlet .ion-page:not(.ion-page-hidden) main').first().waitFor();
        await page.waitForTimeout(300);
        const v = await seriousViolations(page);
        if (v.length) await screenshot(page, `a11y-${theme}${path.replace(/\//g, '-')}`);
        expect(v, JSON.stringify(v, null, 1)).toEqual([]);
        await ctx.close();
      });
    }
  }
});

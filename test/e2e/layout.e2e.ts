/**
 * Layout at 360 px: on every screen (with the invented demo loaded, so lists and cards are full) no element's content
 * is wider than its box (scrollWidth > clientWidth), except boxes made to scroll sideways (overflow-x auto or scroll).
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BASE_URL, launch, phoneContext, screenshot, text } from './browser.ts';

const POLL = { timeout: 20_000, interval: 200 };

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Elements of the visible page whose content overflows their box sideways. */
async function overflowing(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const root = document.querySelector('ion-router-outlet > .ion-page:not(.ion-page-hidden)') ?? document.body;
    const out: string[] = [];
    for (const el of Array.from(root.querySelectorAll<HTMLElement>('*'))) {
      if (el instanceof SVGElement) continue;
      const cs = getComputedStyle(el);
      if (cs.display === 'none' || cs.overflowX === 'auto' || cs.overflowX === 'scroll') continue;
      if (el.clientWidth <= 1) continue; // visually hidden (read by screen readers only)
      if (el.scrollWidth > el.clientWidth + 1) {
        const id = el.getAttribute('data-testid');
        out.push(`${el.tagName.toLowerCase()}${id ? `[${id}]` : ''}.${el.className}: ${el.scrollWidth} > ${el.clientWidth} "${(el.innerText || '').slice(0, 40)}"`);
      }
    }
    return out;
  });
}

describe('layout at 360 px', () => {
  it('no element overflows its container on any screen', async () => {
    const ctx = await phoneContext(browser, { acknowledgeSafety: false });
    const page = await ctx.newPage();
    await page.setViewportSize({ width: 360, height: 640 });
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('Emulation.setGeolocationOverride', { latitude: 52.5538, longitude: 0.3714, accuracy: 3 });
    await page.goto(BASE_URL + '/');
    await page.locator('[data-testid="ack-safety"]').click();
    await page.locator('[data-testid="load-demo-scenario"]').click();
    await expect.poll(() => text(page, 'plan-site').catch(() => ''), POLL).toContain('MF-01');
    await expect.poll(() => text(page, 'plan-reflector-note').catch(() => ''), POLL).toMatch(/reflector MF-01-D from the logbook/);
    const found: Record<string, string[]> = {};
    const check = async (name: string) => {
      await page.waitForTimeout(300);
      found[name] = await overflowing(page);
      await screenshot(page, `layout-360-${name}`);
    };
    await check('plan');

    await page.locator('[data-testid="tab-passes"]').click();
    await page.locator('[data-testid="track-0"]').waitFor({ timeout: 30_000 });
    await page.locator('[data-testid="site-fold-summary"]').click();
    await page.locator('[data-testid="elements-fold-summary"]').click();
    await check('passes');

    await page.locator('[data-testid="tab-align"]').click();
    await page.locator('[data-testid="align-more-summary"]').click();
    await check('align');

    await page.locator('[data-testid="tab-logbook"]').click();
    await page.locator('[data-testid="site-row-MF-01"]').waitFor();
    await check('logbook');
    await page.locator('[data-testid="site-row-MF-01"]').click();
    await expect.poll(() => text(page, 'next-pass'), POLL).toMatch(/reflector MF-01-/);
    await check('site');

    await page.goto(BASE_URL + '/settings');
    await page.locator('ion-title', { hasText: 'Settings' }).first().waitFor();
    await check('settings');
    expect(found).toEqual({ plan: [], passes: [], align: [], logbook: [], site: [], settings: [] });
    await ctx.close();
  });
});

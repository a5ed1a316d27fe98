/**
 * No blank screen: a screen whose script file cannot be loaded (a deploy removed it, no network) and a screen that
 * throws while rendering each show the error boundary with Reload and Back up now; the tab bar keeps working and a
 * half-filled form's draft is still there. Route interception stands in for the missing file and the broken screen
 * (service workers blocked so that every request reaches it).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { BASE_URL, launch, phoneContext } from './browser.ts';

const POLL = { timeout: 20_000 };
let browser: Browser;
let ctx: BrowserContext;
let page: Page;
const el = (id: string) => page.locator(`[data-testid="${id}"]:visible`).first();

beforeAll(async () => {
  browser = await launch();
  ctx = await phoneContext(browser, { blockServiceWorkers: true });
  page = await ctx.newPage();
});
afterAll(async () => {
  await ctx?.close();
  await browser?.close();
});

describe('Error boundaries', () => {
  it('a screen that cannot load shows Reload and Back up now, the tabs still work', async () => {
    await page.route('**/assets/AlignPage-*.js', (r) => r.abort('failed'));
    await page.goto(BASE_URL + '/plan');
    await el('plan-empty').waitFor(); // a new phone's Plan: what to do first, no aim
    await el('tab-align').click();
    await expect.poll(() => el('boundary-screen').innerText(), POLL).toMatch(/could not be loaded[\s\S]*records and drafts are kept/);
    expect(await el('boundary-reload').isVisible()).toBe(true);
    expect(await el('boundary-backup').isVisible()).toBe(true);
    await el('tab-plan').click();
    await expect.poll(() => el('plan-empty').isVisible(), POLL).toBe(true);
  });

  it('a screen that throws while rendering shows the boundary; the workflow draft survives', async () => {
    await page.route('**/assets/SettingsPage-*.js', (r) =>
      r.fulfill({ contentType: 'text/javascript', body: 'export function SettingsPage() { throw new Error("screen failed in this test"); }' }),
    );
    await page.goto(BASE_URL + '/plan');
    await page.locator('[data-testid="incidence-0"]').fill('41.5');
    await page.waitForTimeout(800); // past the 300 ms draft debounce
    await page.goto(BASE_URL + '/settings');
    await expect.poll(() => el('boundary-screen').innerText(), POLL).toMatch(/Something went wrong[\s\S]*screen failed in this test/);
    await el('tab-plan').click();
    await expect.poll(() => page.locator('[data-testid="incidence-0"]').inputValue(), POLL).toBe('41.5');
  });
});

describe('Installable build', () => {
  it('the built manifest has PNG icons 192 and 512 (one maskable), the theme colours, start URL and scope', async () => {
    const { readFileSync, existsSync } = await import('node:fs');
    const m = JSON.parse(readFileSync('dist/manifest.webmanifest', 'utf8'));
    const png = (m.icons as { src: string; sizes: string; type: string; purpose: string }[]).filter((i) => i.type === 'image/png');
    expect(png.map((i) => i.sizes).sort()).toEqual(['192x192', '512x512', '512x512']);
    expect(png.filter((i) => i.purpose === 'maskable')).toHaveLength(1);
    for (const i of png) expect(existsSync('dist/' + i.src)).toBe(true);
    // The outdoor theme (src/ui/theme/theme.css): accent #003d99 on a white background.
    expect(m).toMatchObject({ theme_color: '#003d99', background_color: '#ffffff', start_url: './plan', scope: './', display: 'standalone' });
    expect(m.short_name.length).toBeLessThanOrEqual(12); // fits under a home-screen icon (common practice, no source)
    expect(readFileSync('dist/index.html', 'utf8')).toContain('rel="apple-touch-icon"');
    // Every built script is precached by the service worker, so no screen is missing offline.
    const sw = readFileSync('dist/sw.js', 'utf8');
    const { readdirSync } = await import('node:fs');
    for (const f of readdirSync('dist/assets').filter((n) => n.endsWith('.js'))) expect(sw).toContain(`assets/${f}`);
  });
});

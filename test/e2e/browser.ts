/** Launch Debian's chromium through playwright-core (never a downloaded browser) and save screenshots as artifacts. */
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync } from 'node:fs';

/** The preview server (test/e2e/global-setup.ts); GLINTMARK_E2E_PORT moves it when 4173 is taken. */
export const E2E_PORT = Number(process.env.GLINTMARK_E2E_PORT ?? 4173);
export const BASE_URL = `http://127.0.0.1:${E2E_PORT}`;
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
  '--disable-quic',
];

export async function launch(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
}

/** A phone-sized context with geolocation granted for the preview origin. */
export async function phoneContext(browser: Browser, opts: { geolocation?: boolean; motionSensors?: boolean; acknowledgeSafety?: boolean; blockServiceWorkers?: boolean } = {}): Promise<BrowserContext> {
  const ctx = await browser.newContext({ viewport: { width: 412, height: 915 }, deviceScaleFactor: 1, hasTouch: true, isMobile: false, serviceWorkers: opts.blockServiceWorkers ? 'block' : 'allow' });
  // Playwright refuses every permission not listed here, and Chromium then sends no orientation events at all.
  const permissions = [
    ...(opts.geolocation !== false ? ['geolocation'] : []),
    ...(opts.motionSensors !== false ? ['accelerometer', 'gyroscope', 'magnetometer'] : []),
  ];
  await ctx.grantPermissions(permissions, { origin: BASE_URL });
  if (opts.acknowledgeSafety !== false) {
    // The first-run panels (safety, demo offer) have their own tests; other tests start as a crew past them.
    await ctx.addInitScript(() => {
      const k = 'glintmark.settings.v1';
      const cur = JSON.parse(localStorage.getItem(k) ?? '{}');
      if (!cur.safetyAcknowledgedAtMs) localStorage.setItem(k, JSON.stringify({ ...cur, safetyAcknowledgedAtMs: 1, demoOfferedAtMs: cur.demoOfferedAtMs ?? 1 }));
    });
  }
  return ctx;
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync('test/e2e/artifacts', { recursive: true });
  await page.screenshot({ path: `test/e2e/artifacts/${name}.png`, fullPage: true });
}

/** Type into a field found by data-testid, replacing what was there. */
export async function fill(page: Page, testId: string, value: string): Promise<void> {
  await page.locator(`[data-testid="${testId}"]`).fill(value);
}

export const text = (page: Page, testId: string) => page.locator(`[data-testid="${testId}"]`).innerText();

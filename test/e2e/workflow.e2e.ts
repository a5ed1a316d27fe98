/**
 * The whole field workflow on the invented demo data, as a crew walks it on one phone:
 * first run (cautions, demo) → Logbook site MF-02 → its passes from GLINT-A's elements → aim for a track on Plan →
 * live alignment with the emulated phone on the plate → capture → installation record with a photo → network off,
 * reload (the service worker serves the app) → the record is there and the GeoJSON export works. Position and
 * orientation are emulated over the DevTools protocol; a screenshot of every screen goes to test/e2e/artifacts/.
 */
import type { Browser } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { declination } from '../../src/core/magnetic/declination.ts';
import { DEMO_SITES } from '../../src/demo/scenario.ts';
import { BASE_URL, launch, phoneContext, screenshot, text } from './browser.ts';
import { emulateOrientation, plateQuaternion, quaternionFromW3c, setOrientation } from './sensors.ts';

const POLL = { timeout: 30_000, interval: 250 };
const SITE = DEMO_SITES[1]; // MF-02, invented
/** A 1×1 PNG (W3C PNG specification, 2nd ed.), enough for the photo slot. */
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAIAAACQd1PeAAAADElEQVR4nGP4z8AAAAMBAQDJ/pLvAAAAAElFTkSuQmCC', 'base64');

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const num = (s: string) => Number(/-?\d+(\.\d+)?/.exec(s)?.[0]);

describe('one workflow from plan to record, offline', () => {
  it('walks site → passes → aim → alignment → capture → record, then works with the network off', async () => {
    const ctx = await phoneContext(browser, { acknowledgeSafety: false });
    const page = await ctx.newPage();
    const errors: string[] = [];
    const foreign: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    page.on('request', (r) => {
      if (!r.url().startsWith(BASE_URL) && !r.url().startsWith('data:') && !r.url().startsWith('blob:')) foreign.push(r.url());
    });
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('Emulation.setGeolocationOverride', { latitude: SITE.latDeg, longitude: SITE.lonDeg, accuracy: 3 });
    await emulateOrientation(cdp, 'absolute-orientation', quaternionFromW3c(0, 0, 0));

    // First run: cautions, then the invented demo.
    await page.goto(BASE_URL + '/');
    await page.locator('[data-testid="ack-safety"]').click();
    await page.locator('[data-testid="load-demo-scenario"]').click();
    await expect.poll(() => text(page, 'plan-site').catch(() => ''), POLL).toContain('MF-01');
    await screenshot(page, 'workflow-01-plan-demo');

    // Logbook → MF-02 → use it for Passes.
    await page.locator('[data-testid="tab-logbook"]').click();
    await page.locator(`[data-testid="site-row-${SITE.code}"]`).click();
    await expect.poll(() => text(page, 'site-title').catch(() => ''), POLL).toContain(SITE.code);
    // The site page computes the next pass from the element sets stored on the phone.
    await expect.poll(() => text(page, 'next-pass'), POLL).toMatch(/GLINT-A (ascending|descending), incidence \d/);
    await screenshot(page, 'workflow-02-site');
    await page.locator('[data-testid="use-site-passes"]').click();
    await page.waitForURL(/\/passes$/);
    await expect.poll(() => page.locator('[data-testid="track-0"]').count(), POLL).toBeGreaterThan(0);
    await screenshot(page, 'workflow-03-passes');
    const trackAzimuthDeg = num(await text(page, 'track-azimuth-0'));

    // Aim for the first track on Plan.
    await page.locator('[data-testid="aim-track-0"]').click();
    await page.waitForURL(/\/plan$/);
    await expect.poll(async () => num(await text(page, 'result-azimuth')), POLL).toBeCloseTo(trackAzimuthDeg, 1);
    const target = { azimuthDeg: num(await text(page, 'result-azimuth')), tiltDeg: num(await text(page, 'result-tilt')), rollDeg: 0 };
    expect(num(await text(page, 'result-scr'))).toBeGreaterThan(0);
    await screenshot(page, 'workflow-04-plan-aimed');

    // Align: the phone on the plate at the planned aim (its compass reads true − declination).
    await page.locator('[data-testid="go-align"]').click();
    await page.waitForURL(/\/align$/);
    const decl = declination({ latDeg: SITE.latDeg, lonDeg: SITE.lonDeg, heightM: SITE.heightEllM, timeMs: Date.now() });
    if (!decl.ok) throw new Error(decl.error.message);
    await setOrientation(cdp, 'absolute-orientation', plateQuaternion(target, decl.value.declinationDeg));
    await expect.poll(() => text(page, 'align-status'), POLL).toMatch(/within tolerance/i);
    await screenshot(page, 'workflow-05-align-within');
    await expect.poll(() => text(page, 'capture-steady'), POLL).toMatch(/● Steady/);
    await page.locator('[data-testid="capture"]').click();
    await expect.poll(() => text(page, 'capture-result').catch(() => ''), POLL).toMatch(/azimuth/);
    await page.locator('[data-testid="go-logbook"]').click();

    // The installation form, pre-filled from the capture; the site is the logbook's MF-02.
    await page.waitForURL(/\/logbook\/new-installation$/);
    await page.locator('[data-testid="from-capture"]').waitFor();
    const siteSelect = page.locator('[data-testid="pick-site"]');
    await expect.poll(async () => (await siteSelect.locator('option:checked').innerText()).trim(), POLL).toContain(SITE.code);
    const reflectorSelect = page.locator('[data-testid="pick-reflector"]');
    if (!(await reflectorSelect.inputValue())) {
      const first = await reflectorSelect.locator('option:not([value=""])').first().getAttribute('value');
      await reflectorSelect.selectOption(first!);
    }
    await page.locator('[data-testid="photo-input-boresight"]').setInputFiles({ name: 'boresight.png', mimeType: 'image/png', buffer: PNG });
    await screenshot(page, 'workflow-06-installation-form');
    await page.locator('[data-testid="save-installation"]').click();
    await expect.poll(() => text(page, 'installation-saved').catch(() => ''), POLL).toMatch(/Saved on this device/i);
    await screenshot(page, 'workflow-07-installation-saved');

    // Network off: the service worker serves the app, the record is there, the export works.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await page.reload(); // now controlled by the service worker
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await ctx.setOffline(true);
    await page.goto(BASE_URL + '/logbook');
    await page.locator(`[data-testid="site-row-${SITE.code}"]`).click();
    await expect.poll(() => page.locator('[data-testid="installation-row"]').count(), POLL).toBeGreaterThan(0);
    await screenshot(page, 'workflow-08-offline-site');
    await page.goto(BASE_URL + '/settings');
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="export-sites-geojson"]').click()]);
    const geo = JSON.parse(readFileSync((await download.path())!, 'utf8')) as {
      type: string;
      features: { geometry: { coordinates: number[] }; properties: Record<string, unknown> }[];
    };
    expect(geo.type).toBe('FeatureCollection');
    const mf02 = geo.features.find((f) => f.properties.code === SITE.code);
    expect(mf02?.geometry.coordinates[0]).toBeCloseTo(SITE.lonDeg, 6); // RFC 7946: longitude first
    expect(mf02?.geometry.coordinates[1]).toBeCloseTo(SITE.latDeg, 6);
    expect(mf02?.properties.installation_installed_at_utc).toMatch(/^\d{4}-\d\d-\d\dT/);
    await screenshot(page, 'workflow-09-offline-settings');

    expect(foreign).toEqual([]); // nothing left the device
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

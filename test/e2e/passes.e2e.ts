import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_TLE, DEMO_TLE_B } from '../../src/demo/elements.ts';
import { BASE_URL, fill, launch, phoneContext, screenshot, text } from './browser.ts';

/** An invented mid-latitude site (no real place intended). */
const SITE = { latitude: 52.31, longitude: 5.12, accuracy: 4 };
/** A fixed window near the demo elements' epoch (2026-11-28), so the test never depends on today's date. */
const WINDOW_START = '2026-12-01T00:00Z';
const INC_MIN_DEG = 20;
const INC_MAX_DEG = 46;
/** Plan shows one decimal (±0.05°) and the heading handed over has two (±0.005° on the aim). */
const TOL_AZIMUTH_DEG = 0.1;
const TOL_TILT_DEG = 0.1;

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const wrapDeg = (d: number) => ((((d + 180) % 360) + 360) % 360) - 180;
const numberIn = (s: string) => Number(/-?\d+(\.\d+)?/.exec(s.replace('−', '-'))?.[0]);
const attr = async (page: Page, testId: string, name: string) => Number(await page.locator(`[data-testid="${testId}"]`).getAttribute(name));

describe('Passes screen', () => {
  it('finds the demo satellite’s tracks over a GPS site, aims the Plan at one, and rejects a broken element set', async () => {
    const ctx = await phoneContext(browser);
    const page = await ctx.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('Emulation.setGeolocationOverride', SITE);
    // The phone's own zone differs from the site's (the Netherlands, Europe/Amsterdam): times must follow the site.
    await cdp.send('Emulation.setTimezoneOverride', { timezoneId: 'America/Los_Angeles' });
    await page.goto(BASE_URL + '/passes');
    expect(await page.evaluate(() => Intl.DateTimeFormat().resolvedOptions().timeZone)).toBe('America/Los_Angeles');

    // Site from the (emulated) phone GNSS.
    await page.locator('[data-testid="use-gps"]').click();
    await expect.poll(() => text(page, 'passes-site')).toContain('52.31000°, 5.12000°');
    expect(await text(page, 'passes-site')).toContain('phone GNSS');
    expect(await text(page, 'gps-quality')).toMatch(/Position good \(±4\.0 m\)/);
    await screenshot(page, 'passes-site-gps');

    // Invented satellite's elements, then a fixed window.
    await page.locator('[data-testid="load-demo"]').click();
    await expect.poll(() => text(page, 'set-99001')).toContain('GLINT-A');
    expect(await text(page, 'set-99001')).toContain('DEMO');
    await fill(page, 'window-start', WINDOW_START);
    await page.locator('[data-testid="compute-passes"]').click();
    await page.locator('[data-testid="track-0"]').waitFor();
    await expect.poll(() => text(page, 'passes-status')).toMatch(/\d+ passes in \d+ tracks/);
    // The next pass in the site's zone, named (Central European Time in winter: UTC+1), beside UTC; days by the site's calendar.
    expect(await text(page, 'next-pass-site-time')).toMatch(/^\w{3} \d{4}-\d\d-\d\d \d\d:\d\d:\d\d Europe\/Amsterdam \(GMT\+1\) site time$/);
    expect(await text(page, 'timeline-caption')).toContain('Europe/Amsterdam');
    expect(await page.locator('[data-testid="track-list"]').innerText()).not.toMatch(/America\/Los_Angeles|GMT-8/);

    const n = await page.locator('[data-testid^="track-"][data-incidence-deg]').count();
    expect(n).toBeGreaterThan(0);
    for (let i = 0; i < n; i++) {
      const inc = await attr(page, `track-${i}`, 'data-incidence-deg');
      expect(inc).toBeGreaterThanOrEqual(INC_MIN_DEG);
      expect(inc).toBeLessThanOrEqual(INC_MAX_DEG);
      expect(await text(page, `track-${i}`)).toMatch(/GLINT-A (ascending|descending) \d+\.\d°, every 12 days/);
    }
    expect(await text(page, 'next-pass-countdown')).toMatch(/^(\d+ d )?\d{2}:\d{2}:\d{2}$|^now$|^No pass after now/);
    expect(await page.locator('[data-testid="pass-timeline"] [data-direction]').count()).toBeGreaterThan(0);
    await page.locator('[data-testid="tracks-h"]').evaluate((e) => e.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'passes-tracks');

    // Add a second track to the plan, then aim for the first one (which replaces the plan).
    await page.locator('[data-testid="add-track-1"]').click();
    expect(await text(page, 'plan-notice')).toMatch(/it now serves 1 geometry/);
    const incDeg = await attr(page, 'track-0', 'data-incidence-deg');
    const azDeg = await attr(page, 'track-0', 'data-reflector-azimuth-deg');
    const tiltDeg = numberIn(await text(page, 'track-tilt-0'));
    await page.locator('[data-testid="aim-track-0"]').click();
    await page.waitForURL(/\/plan$/);
    await expect.poll(() => page.locator('[data-testid="incidence-0"]').inputValue()).toBe(incDeg.toFixed(2));
    expect(await text(page, 'geometry-0')).toMatch(/GLINT-A (ascending|descending)/);
    expect(await page.locator('[data-testid="geometry-1"]').count()).toBe(0);
    const planAz = numberIn(await text(page, 'result-azimuth'));
    expect(Math.abs(wrapDeg(planAz - azDeg))).toBeLessThanOrEqual(TOL_AZIMUTH_DEG);
    expect(Math.abs(numberIn(await text(page, 'result-tilt')) - tiltDeg)).toBeLessThanOrEqual(TOL_TILT_DEG);
    await screenshot(page, 'passes-plan-aimed');

    // Hand the aim on (Plan → Align), come back: the sky plot shows the beam and the track sits at its centre.
    await page.locator('[data-testid="go-align"]').click();
    await page.waitForURL(/\/align$/);
    // Let the Align page finish showing before switching tab (a tab tap during Ionic's page swap can leave the old page up).
    await page.locator('ion-title', { hasText: 'Align' }).waitFor();
    await page.locator('[data-testid="tab-passes"]').click();
    await page.waitForURL(/\/passes$/);
    await page.locator('[data-testid="sky-beam"]').waitFor();
    expect(numberIn(await text(page, 'track-loss-0'))).toBeLessThan(0.05);
    await page.locator('[data-testid="sky-plot"]').evaluate((e) => e.scrollIntoView({ block: 'start' }));
    await screenshot(page, 'passes-sky');

    // A broken element set: the checksum digit of line 2 changed.
    const lines = DEMO_TLE.split('\n');
    const l2 = lines[2];
    lines[2] = l2.slice(0, 68) + String((Number(l2[68]) + 1) % 10);
    await fill(page, 'tle-text', lines.join('\n'));
    await page.locator('[data-testid="tle-add"]').click();
    await expect.poll(() => text(page, 'tle-error-0')).toMatch(/^line 3, column 69: checksum of line 2 of the element set is \d but its digits add up to \d/);
    expect(await text(page, 'tle-message')).toMatch(/No element set was kept/);
    await page.locator('[data-testid="tle-errors"]').scrollIntoViewIfNeeded();
    await screenshot(page, 'passes-bad-tle');

    expect(errors).toEqual([]);
    await ctx.close();
  });

  it('shows the plain message when location is refused, and takes typed coordinates instead', async () => {
    const ctx = await phoneContext(browser, { geolocation: false });
    const page = await ctx.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(BASE_URL + '/passes');
    await page.locator('[data-testid="use-gps"]').click();
    await expect.poll(() => text(page, 'gps-error')).toMatch(/not allowed to use this phone’s location/);
    await fill(page, 'site-lat', '95');
    expect(await text(page, 'site-lat-error')).toMatch(/Latitude must be in \[-90, 90\]°, got 95/);
    expect(await page.locator('[data-testid="set-site"]').isDisabled()).toBe(true);
    await fill(page, 'site-lat', '-38.62');
    await fill(page, 'site-lon', '146.07');
    await page.locator('[data-testid="set-site"]').click();
    expect(await text(page, 'passes-site')).toContain('-38.62000°, 146.07000°');
    expect(await page.locator('[data-testid="gps-error"]').count()).toBe(0);
    await screenshot(page, 'passes-typed-site');

    // Elements from a file (the invented second satellite), kept as ordinary elements, not demo.
    await page.locator('[data-testid="tle-file"]').setInputFiles({ name: 'glint-b.tle', mimeType: 'text/plain', buffer: Buffer.from(DEMO_TLE_B) });
    await expect.poll(() => text(page, 'set-99002')).toContain('GLINT-B');
    expect(await text(page, 'set-99002')).not.toContain('DEMO');
    expect(await text(page, 'tle-message')).toBe('Kept 1 element set: GLINT-B.');

    // No elements at hand: the circular-orbit approximation, marked APPROXIMATE all the way to the Plan screen.
    await page.locator('[data-testid="circular-panel"] summary').click();
    expect(await page.locator('[data-testid="circ-lat"]').inputValue()).toBe('-38.6200');
    await expect.poll(() => text(page, 'circ-heading-descending')).toMatch(/≈ \d+\.\d°/);
    await page.locator('[data-testid="circ-result"]').scrollIntoViewIfNeeded();
    await screenshot(page, 'passes-circular');
    await page.locator('[data-testid="circ-use-descending"]').click();
    await page.waitForURL(/\/plan$/);
    await expect.poll(() => text(page, 'geometry-0')).toMatch(/APPROXIMATE circular orbit 693 km, 98\.18° inclination, descending 37\.0°/);
    expect(await page.locator('[data-testid="incidence-0"]').inputValue()).toBe('37.00');
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

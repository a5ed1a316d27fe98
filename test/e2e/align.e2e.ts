/**
 * Align screen in Chromium with the phone's sensors emulated over CDP:
 * - position: Emulation.setGeolocationOverride (permission granted by phoneContext);
 * - orientation: Emulation.setSensorOverrideEnabled + setSensorOverrideReadings with a quaternion, sent before
 *   page.goto. Checked on this Chromium: an 'absolute-orientation' override drives deviceorientationabsolute and
 *   deviceorientation (absolute = true) with exactly the W3C angles of q = qz(α)·qx(β)·qy(γ); a 'relative-orientation'
 *   override alone drives deviceorientation (absolute = false) while deviceorientationabsolute fires once with null
 *   angles, i.e. "no compass" — so no explicit disabling of the absolute sensor is needed. Readings sent after
 *   goto arrive too; Chromium fires an event only when the angles change.
 * The page clock is fixed to an instant inside the magnetic model (WMM2025) so the expected declination is known.
 */
import type { Browser, BrowserContext, CDPSession, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deviceAnglesFromPlateOrientation } from '../../src/core/alignment/deviceOrientation.ts';
import { aimForPass } from '../../src/core/geometry/pointing.ts';
import { declination } from '../../src/core/magnetic/declination.ts';
import { BASE_URL, fill, launch, phoneContext, screenshot, text } from './browser.ts';
import { emulateOrientation, plateQuaternion as plateQuaternionAt, quaternionFromW3c, setOrientation, type Quaternion, type SensorType } from './sensors.ts';

/** An invented site, "Marrowby Fen", and an instant inside WMM2025. */
const SITE = { latitude: 52.61, longitude: 0.31, accuracy: 3 };
const T0 = new Date('2026-06-15T10:00:00Z');
const PLAN = { incidenceDeg: 40, headingDeg: 190, look: 'right' as const };
const AIM = aimForPass(PLAN);
const TARGET = { azimuthDeg: AIM.reflectorAzimuthDeg, tiltDeg: AIM.baseTiltDeg, rollDeg: 0 };
const DECL = (() => {
  const d = declination({ latDeg: SITE.latitude, lonDeg: SITE.longitude, heightM: 0, timeMs: T0.getTime() });
  if (!d.ok) throw new Error(d.error.message);
  return d.value.declinationDeg;
})();
const POLL = { timeout: 15_000, interval: 200 };

/** The quaternion a phone on a plate at this TRUE orientation reports at the test's site and date. */
const plateQuaternion = (o: { azimuthDeg: number; tiltDeg: number; rollDeg: number }) => plateQuaternionAt(o, DECL);

async function openPhone(browser: Browser, type: SensorType, q: Quaternion): Promise<{ ctx: BrowserContext; page: Page; cdp: CDPSession; errors: string[] }> {
  const ctx = await phoneContext(browser);
  const page = await ctx.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.clock.install({ time: T0 });
  const cdp = await ctx.newCDPSession(page);
  await cdp.send('Emulation.setGeolocationOverride', SITE);
  await emulateOrientation(cdp, type, q);
  return { ctx, page, cdp, errors };
}

/** Plan the aim on the Plan screen and press "Align to this aim", as the crew does. */
async function planAndAlign(page: Page): Promise<void> {
  await page.goto(BASE_URL + '/plan');
  await fill(page, 'incidence-0', String(PLAN.incidenceDeg));
  await fill(page, 'heading-0', String(PLAN.headingDeg));
  await page.locator('[data-testid="look-0"] button[data-value="right"]').click();
  await expect.poll(() => text(page, 'result-azimuth'), POLL).toContain(TARGET.azimuthDeg.toFixed(1));
  await page.locator('[data-testid="go-align"]').click();
  await page.waitForURL(/\/align$/);
}

/** Open the disclosure under the Capture bar (target, method, declination, tolerance, passes). */
async function openMore(page: Page): Promise<void> {
  const d = page.locator('[data-testid="align-more"]');
  if ((await d.getAttribute('open')) === null) await page.locator('[data-testid="align-more-summary"]').click();
}

/** The element's box lies inside the visible content area (below the toolbar, above the tab bar), page unscrolled. */
async function inFirstScreen(page: Page, testId: string): Promise<{ inside: boolean; bottom: number; limit: number; scrollTop: number }> {
  return page.evaluate(async (id) => {
    const el = document.querySelector(`[data-testid="${id}"]`)!;
    const r = el.getBoundingClientRect();
    const bar = document.querySelector('ion-tab-bar')!.getBoundingClientRect();
    const content = document.querySelector('ion-router-outlet .ion-page:not(.ion-page-hidden) ion-content') as (Element & { getScrollElement(): Promise<HTMLElement> }) | null;
    const scrollTop = content ? (await content.getScrollElement()).scrollTop : -1;
    return { inside: r.top >= 0 && r.bottom <= bar.top && r.height > 0, bottom: r.bottom, limit: bar.top, scrollTop };
  }, testId);
}

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe('Align screen with an emulated compass', () => {
  it('reaches "within tolerance" on the planned aim, gives signed errors off it, and captures', async () => {
    const { ctx, page, cdp, errors } = await openPhone(browser, 'absolute-orientation', plateQuaternion(TARGET));
    await planAndAlign(page);
    const status = () => text(page, 'align-status');
    await expect.poll(status, POLL).toMatch(/within tolerance/i);
    expect(await text(page, 'compass-status')).toMatch(/Compass working/);
    await screenshot(page, 'align-within');
    await openMore(page);
    expect(await text(page, 'declination')).toMatch(/WMM2025/);
    expect(await text(page, 'live-azimuth')).toContain(TARGET.azimuthDeg.toFixed(1));
    expect(await text(page, 'live-tilt')).toContain(TARGET.tiltDeg.toFixed(1));
    expect(await text(page, 'tolerance-cost')).toMatch(/costs up to \d+\.\d\d dB/);
    // The preset's limits in degrees beside its cost (monitoring: ±2° azimuth, ±1° tilt, ±2° roll).
    expect(await text(page, 'tolerance-limits')).toContain('±2° azimuth, ±1° tilt, ±2° roll');
    await screenshot(page, 'align-within-more');
    await page.locator('[data-testid="align-more-summary"]').click();

    // Capture once steady (3 s of readings), then hand over to the logbook.
    await expect.poll(() => text(page, 'capture-steady'), POLL).toMatch(/● Steady/);
    await page.locator('[data-testid="capture"]').click();
    await expect.poll(() => text(page, 'capture-result'), POLL).toMatch(/Compass/);
    expect(await text(page, 'capture-result')).toContain(`azimuth ${TARGET.azimuthDeg.toFixed(1)}° true`);
    await page.locator('[data-testid="capture-result"]').scrollIntoViewIfNeeded();
    await screenshot(page, 'align-captured');
    await page.locator('[data-testid="align-status"]').scrollIntoViewIfNeeded();

    // 3° clockwise of the target: the plate must turn back anticlockwise, and the error is +3.0°.
    await setOrientation(cdp, 'absolute-orientation', plateQuaternion({ ...TARGET, azimuthDeg: TARGET.azimuthDeg + 3 }));
    await expect.poll(() => text(page, 'instruction-azimuth'), POLL).toBe('turn 3.0° anticlockwise');
    expect(await text(page, 'error-azimuth')).toBe('error +3.0°');
    expect(await status()).toMatch(/^\S*\s*Adjust: azimuth out of tolerance/);
    expect(await status()).not.toMatch(/within tolerance/i);
    await screenshot(page, 'align-azimuth-off');

    await setOrientation(cdp, 'absolute-orientation', plateQuaternion({ ...TARGET, azimuthDeg: TARGET.azimuthDeg - 3 }));
    await expect.poll(() => text(page, 'instruction-azimuth'), POLL).toBe('turn 3.0° clockwise');
    expect(await text(page, 'error-azimuth')).toBe('error −3.0°');

    // Open side 2° too high, right-hand side 3° too low.
    await setOrientation(cdp, 'absolute-orientation', plateQuaternion({ ...TARGET, tiltDeg: TARGET.tiltDeg + 2, rollDeg: -3 }));
    await expect.poll(() => text(page, 'instruction-tilt'), POLL).toBe('lower the open side 2.0°');
    await expect.poll(() => text(page, 'instruction-roll'), POLL).toBe('raise the right-hand side 3.0°');
    await screenshot(page, 'align-tilt-roll-off');

    await page.locator('[data-testid="go-logbook"]').click();
    await page.waitForURL(/\/logbook\/new-installation$/);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

describe('Align on a small phone', () => {
  for (const size of [
    { width: 360, height: 640 },
    { width: 390, height: 844 },
  ]) {
    it(`at ${size.width} × ${size.height}, within tolerance shows the verdict, the three readings and Capture without scrolling`, async () => {
      const { ctx, page, errors } = await openPhone(browser, 'absolute-orientation', plateQuaternion(TARGET));
      await page.setViewportSize(size);
      await planAndAlign(page);
      await expect.poll(() => text(page, 'align-status'), POLL).toMatch(/within tolerance/i);
      for (const id of ['align-status', 'live-azimuth', 'live-tilt', 'live-roll', 'error-azimuth', 'error-tilt', 'error-roll', 'capture']) {
        const r = await inFirstScreen(page, id);
        expect(r, id).toMatchObject({ inside: true, scrollTop: 0 });
      }
      // Large type for the readings: at least 30 px.
      const px = await page.locator('[data-testid="live-tilt"]').evaluate((e) => parseFloat(getComputedStyle(e).fontSize));
      expect(px).toBeGreaterThanOrEqual(30);
      await screenshot(page, `align-within-${size.width}x${size.height}`);
      expect(errors).toEqual([]);
      await ctx.close();
    });
  }

  it('captures by itself after a steady hold within tolerance when Auto is on', async () => {
    const { ctx, page, errors } = await openPhone(browser, 'absolute-orientation', plateQuaternion(TARGET));
    await page.setViewportSize({ width: 360, height: 640 });
    await planAndAlign(page);
    await page.locator('[data-testid="auto-capture"]').click();
    expect(await page.locator('[data-testid="auto-capture"]').getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => text(page, 'capture-result').catch(() => ''), { timeout: 20_000, interval: 200 }).toContain(`azimuth ${TARGET.azimuthDeg.toFixed(1)}° true`);
    expect(await text(page, 'capture-message')).toMatch(/Captured by the steady hold/);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

describe('Align screen without a compass', () => {
  it('says "compass unavailable" with relative orientation only, still guides tilt, and "cannot measure" upright', async () => {
    // Relative readings have an arbitrary alpha zero: only tilt and roll mean anything.
    const rel = (o: { tiltDeg: number; rollDeg: number }) => {
      const a = deviceAnglesFromPlateOrientation({ azimuthDeg: 123, ...o });
      return quaternionFromW3c(a.alphaDeg, a.betaDeg, a.gammaDeg);
    };
    const { ctx, page, cdp, errors } = await openPhone(browser, 'relative-orientation', rel(TARGET));
    await planAndAlign(page);
    await expect.poll(() => text(page, 'compass-status'), POLL).toMatch(/compass unavailable/i);
    expect(await text(page, 'compass-status')).toMatch(/tilt works, set azimuth by the sun, a reference bearing or another instrument/);
    await expect.poll(() => text(page, 'align-status'), POLL).toMatch(/Tilt and roll within tolerance/);
    expect(await text(page, 'live-azimuth')).toContain('—');
    expect(await text(page, 'live-tilt')).toContain(TARGET.tiltDeg.toFixed(1));
    await screenshot(page, 'align-compass-unavailable');

    // The sun layout for the fixed instant is offered instead (behind the disclosure).
    await openMore(page);
    await page.locator('[data-testid="sun-compute"]').click();
    await expect.poll(() => text(page, 'sun-layout'), POLL).toMatch(/Computed at 10:0\d:\d\d UTC/);
    expect(await text(page, 'sun-layout')).toMatch(/about ¼° a minute/);
    await page.locator('[data-testid="sun-layout"]').scrollIntoViewIfNeeded();
    await screenshot(page, 'align-sun-layout');
    await page.locator('[data-testid="align-status"]').scrollIntoViewIfNeeded();

    await setOrientation(cdp, 'relative-orientation', quaternionFromW3c(0, 85, 0));
    await expect.poll(() => text(page, 'align-status'), POLL).toMatch(/Cannot measure/);
    await screenshot(page, 'align-cannot-measure');
    expect(errors).toEqual([]);
    await ctx.close();
  });

  it('asks for a plan when there is no aim, and takes a typed one', async () => {
    const { ctx, page, errors } = await openPhone(browser, 'relative-orientation', quaternionFromW3c(0, 0, 0));
    await page.goto(BASE_URL + '/align');
    await expect.poll(() => text(page, 'compass-status'), POLL).toMatch(/compass unavailable/i);
    await expect.poll(() => text(page, 'plan-first'), POLL).toMatch(/Plan an aim first/);
    await screenshot(page, 'align-no-target');
    await fill(page, 'target-azimuth-input', '250');
    await fill(page, 'target-tilt-input', '12');
    await page.locator('[data-testid="use-target"]').click();
    await openMore(page);
    await expect.poll(() => text(page, 'target-azimuth'), POLL).toContain('250.0');
    expect(errors).toEqual([]);
    await ctx.close();
  });

  it('with motion sensors refused by the browser, asks for a tap and then says they were refused', async () => {
    const ctx = await phoneContext(browser, { motionSensors: false }); // Chromium's motion-sensor permission is denied
    const page = await ctx.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(BASE_URL + '/align');
    await expect.poll(() => text(page, 'compass-status'), POLL).toMatch(/tap “Allow motion sensors”/);
    await page.locator('[data-testid="allow-motion"]').click();
    await expect.poll(() => text(page, 'compass-status'), POLL).toMatch(/Motion sensors were refused/);
    await screenshot(page, 'align-motion-refused');
    expect(errors).toEqual([]);
    await ctx.close();
  });

  it('outside the magnetic model dates says so and shows no true azimuth', async () => {
    const ctx = await phoneContext(browser);
      const page = await ctx.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.clock.install({ time: new Date('2031-03-01T10:00:00Z') });
    const cdp = await ctx.newCDPSession(page);
    await cdp.send('Emulation.setGeolocationOverride', SITE);
    await emulateOrientation(cdp, 'absolute-orientation', quaternionFromW3c(0, 10, 0));
    await planAndAlign(page);
    await openMore(page);
    await expect.poll(() => text(page, 'declination'), POLL).toMatch(/WMM2025 is valid from 2025-01-01 to 2030-01-01/);
    expect(await text(page, 'compass-status')).toMatch(/Compass working/);
    expect(await text(page, 'live-azimuth')).toContain('—');
    expect(await text(page, 'azimuth-note')).toMatch(/No true azimuth/);
    await screenshot(page, 'align-outside-model-dates');
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

/**
 * Logbook screens in Chromium with a persistent profile, so the records must survive a page reload AND a browser
 * restart (a new browser on the same user-data folder). The crew's path: type a site, add a reflector, plan an aim,
 * type the readings on Align (manual entry), record the installation with a photo (a small PNG made here), restore a
 * draft after a reload mid-typing, edit (a revision in the history), soft delete and Undo, inspect with a photo that
 * is too large (the record is still saved). Sites are invented ("Marrowby Fen", "Hollin Ridge").
 */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { deflateSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seriousViolations } from './a11y.ts';
import { BASE_URL, CHROMIUM_ARGS, screenshot } from './browser.ts';

const POLL = { timeout: 15_000, interval: 200 };
/** "Here" for the distance sort: beside the Marrowby Fen site. */
const HERE = { latitude: 52.6, longitude: 0.3, accuracy: 4 };

/** CRC-32 (ISO 3309 / ITU-T V.42 polynomial 0xEDB88320), as the PNG chunks need. */
function crc32(buf: Buffer): number {
  let c = ~0;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}
function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}
/** A valid w×h RGB PNG (W3C PNG specification, 2nd ed.): an orange square. */
function makePng(w: number, h: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(w, 0);
  ihdr.writeUInt32BE(h, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(w * 3, Buffer.from([230, 120, 20]))]);
  const raw = Buffer.concat(Array.from({ length: h }, () => row));
  return Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]);
}
const PNG = makePng(32, 24);
/** Over the 8 MB photo limit: a PNG header followed by padding (the size check comes first). */
const HUGE = Buffer.concat([PNG, Buffer.alloc(8_100_000)]);

let profile: string;
let ctx: BrowserContext;
let page: Page;
const errors: string[] = [];

async function open(): Promise<void> {
  ctx = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 412, height: 915 },
    deviceScaleFactor: 1,
    hasTouch: true,
  });
  await ctx.grantPermissions(['geolocation', 'accelerometer', 'gyroscope', 'magnetometer'], { origin: BASE_URL });
  await ctx.addInitScript(() => {
    const k = 'glintmark.settings.v1';
    const cur = JSON.parse(localStorage.getItem(k) ?? '{}');
    if (!cur.safetyAcknowledgedAtMs) localStorage.setItem(k, JSON.stringify({ ...cur, safetyAcknowledgedAtMs: 1, demoOfferedAtMs: 1, crewName: 'Ann Tester' }));
  });
  page = ctx.pages()[0] ?? (await ctx.newPage());
  page.setDefaultTimeout(10_000);
  page.on('pageerror', (e) => errors.push(e.message));
  const cdp = await ctx.newCDPSession(page);
  await cdp.send('Emulation.setGeolocationOverride', HERE);
}

/** The visible element with this test id (Ionic keeps earlier pages in the DOM, hidden). */
const el = (id: string) => page.locator(`[data-testid="${id}"]:visible`).first();
const txt = (id: string) => el(id).innerText();
const fillIn = (id: string, v: string) => el(id).fill(v);
const click = (id: string) => el(id).click();
/** Screenshot with the element of this test id scrolled into view (Ionic scrolls inside its content, not the page). */
async function shot(name: string, scrollTo?: string): Promise<void> {
  if (scrollTo) await el(scrollTo).scrollIntoViewIfNeeded();
  await screenshot(page, name);
}
/** axe-core: no serious or critical WCAG 2.1 A/AA violation on the screen as it stands. */
async function expectAccessible(): Promise<void> {
  const v = await seriousViolations(page);
  expect(v, JSON.stringify(v, null, 1)).toEqual([]);
}
const choose = (id: string, value: string) => page.locator(`[data-testid="${id}"]:visible button[data-value="${value}"]`).first().click();

beforeAll(async () => {
  profile = mkdtempSync(join(tmpdir(), 'glintmark-profile-'));
  await open();
});
afterAll(async () => {
  await ctx?.close();
  rmSync(profile, { recursive: true, force: true });
});

describe('Logbook: durable records', () => {
  it('creates a site with typed coordinates, checked in place, and refuses a duplicate code', async () => {
    await page.goto(BASE_URL + '/logbook');
    await expect.poll(() => txt('no-sites'), POLL).toMatch(/No sites yet/);
    await screenshot(page, 'logbook-empty');
    await click('new-site');
    // Position from the (emulated) phone GNSS, with its accuracy and source; typing over it makes it typed.
    await click('site-gps');
    await expect.poll(() => el('site-lat').inputValue(), POLL).toBe('52.6000000');
    expect(await el('site-accuracy').inputValue()).toBe('4.0');
    expect(await el('site-source').locator('button[aria-pressed="true"]').innerText()).toBe('Phone GNSS');
    expect(await txt('site-gps-quality')).toMatch(/Position good \(±4\.0 m\)/);
    await shot('logbook-new-site-gps', 'site-gps');
    await fillIn('site-accuracy', '');
    await fillIn('site-code', 'MF-01');
    await fillIn('site-name', 'Marrowby Fen north bank');
    await fillIn('site-lat', '95');
    await fillIn('site-lon', '0.31');
    // The emulated fix has no altitude: the height became "unknown, to be surveyed" instead of blocking the save.
    expect(await txt('site-height-note')).toMatch(/This fix has no altitude: the height is marked unknown, to be surveyed/);
    expect(await el('site-height-ref').locator('button[aria-pressed="true"]').innerText()).toBe('Unknown');
    await el('site-height-ref').locator('button', { hasText: 'Ellipsoidal' }).click();
    await fillIn('site-height', '45.2');
    await fillIn('site-notes', '<b>gate key</b> at the farm');
    expect(await txt('site-lat-error')).toBe('Latitude must be in [-90, 90]°, got 95');
    await shot('logbook-new-site-invalid', 'site-lat');
    await expectAccessible();
    await fillIn('site-lat', '52.61');
    expect(await el('site-source').locator('button[aria-pressed="true"]').innerText()).toBe('Typed');
    // At 390 × 844: saving goes to the new site, with the confirmation and the offer to add its reflector in view.
    await page.setViewportSize({ width: 390, height: 844 });
    await click('save-site');
    await page.waitForURL(/\/logbook\/site\/[^?]+\?saved=new/);
    await expect.poll(() => txt('saved'), POLL).toMatch(/Site MF-01 saved on this device/);
    for (const id of ['site-title', 'site-created', 'add-its-reflector']) {
      const box = await el(id).boundingBox();
      expect(box, id).not.toBeNull();
      expect(box!.y, id).toBeGreaterThanOrEqual(0);
      expect(box!.y + box!.height, id).toBeLessThanOrEqual(844);
    }
    expect(await txt('site-title')).toMatch(/MF-01/);
    await screenshot(page, 'logbook-site-saved');
    await page.setViewportSize({ width: 412, height: 915 });
    await page.goto(BASE_URL + '/logbook');
    await expect.poll(() => txt('site-row-MF-01'), POLL).toMatch(/0 reflectors/);
    expect(await txt('site-row-MF-01')).toMatch(/never visited/);
    await click('new-site');

    await fillIn('site-code', 'mf-01');
    await fillIn('site-lat', '51.0');
    await fillIn('site-lon', '0.0');
    await fillIn('site-height', '80');
    await click('save-site');
    await expect.poll(() => txt('save-error'), POLL).toMatch(/already used by another site/);
    expect(await page.locator('[data-testid="saved"]:visible').count()).toBe(0);
    await fillIn('site-code', 'HR-1');
    await fillIn('site-name', 'Hollin Ridge');
    await click('save-site');
    await page.waitForURL(/\/logbook\/site\//);
    await page.goto(BASE_URL + '/logbook');
    await expect.poll(() => page.locator('[data-testid^="site-row-"]:visible').count(), POLL).toBe(2);
  });

  it('shows record text as text, and adds a reflector on the site screen', async () => {
    await click('site-row-MF-01');
    await page.waitForURL(/\/logbook\/site\//);
    await expect.poll(() => txt('site-notes-value'), POLL).toBe('<b>gate key</b> at the farm');
    expect(await el('site-notes-value').locator('b').count()).toBe(0);
    await click('add-reflector');
    expect(await el('refl-label').inputValue()).toBe('A');
    await fillIn('refl-edge', '1.2');
    await fillIn('refl-apex-above-mark', '0.9');
    await fillIn('refl-drainage', 'three 20 mm holes at the apex');
    await click('save-reflector');
    await expect.poll(() => txt('reflector-A'), POLL).toMatch(/inner edge 1.20 m/);
    await shot('logbook-site', 'reflector-A');
    await expectAccessible();
  });

  it('takes the plan and typed Align readings into the installation form, with a photo', async () => {
    await click('use-site-plan');
    await page.waitForURL(/\/plan$/);
    await fillIn('incidence-0', '40');
    await fillIn('heading-0', '190');
    await choose('look-0', 'right');
    await expect.poll(() => txt('result-azimuth'), POLL).toContain('100.0');
    await click('go-align');
    await page.waitForURL(/\/align$/);
    await click('align-more-summary'); // typed readings sit behind the disclosure under Capture
    await fillIn('manual-azimuth', '100.3');
    await fillIn('manual-tilt', '14.6');
    await fillIn('manual-roll', '0.2');
    await click('manual-save');
    await click('go-logbook');
    await page.waitForURL(/\/logbook\/new-installation$/);
    await expect.poll(() => el('pick-reflector').inputValue().catch(() => ''), POLL).not.toBe('');
    expect(await el('inst-az').inputValue()).toBe('100.30');
    expect(await el('inst-tilt').inputValue()).toBe('14.60');
    expect(await el('inst-planned-az').inputValue()).toBe('100.00');
    expect(await el('inst-crew').inputValue()).toBe('Ann Tester');
    expect(await txt('planned-geometries')).toMatch(/incidence 40°, heading 190° true, right-looking/);
    await el('photo-input-boresight').setInputFiles({ name: 'boresight.png', mimeType: 'image/png', buffer: PNG });
    await expect.poll(() => el('photo-slot-boresight').locator('img').count(), POLL).toBe(1);
    await shot('logbook-installation-form', 'pick-site');
    await expectAccessible();
    await shot('logbook-installation-photos', 'photo-slot-boresight');
  });

  it('restores the draft after a reload mid-typing, then saves and shows "Saved on this device" only after the write', async () => {
    await fillIn('inst-notes', 'fence on the north side');
    await page.waitForTimeout(800);
    await page.reload();
    await expect.poll(() => txt('draft-restored'), POLL).toMatch(/Draft restored from \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
    expect(await el('inst-notes').inputValue()).toContain('fence on the north side');
    expect(await el('inst-az').inputValue()).toBe('100.30');
    await shot('logbook-draft-restored', 'draft-restored');
    expect(await page.locator('[data-testid="saved"]:visible').count()).toBe(0);
    await el('photo-input-boresight').setInputFiles({ name: 'boresight.png', mimeType: 'image/png', buffer: PNG });
    await click('save-installation');
    await expect.poll(() => txt('installation-saved'), POLL).toMatch(/Saved on this device[\s\S]*1 photo, 1 planned geometry/);
    await screenshot(page, 'logbook-installation-saved');
    await click('view-site');
    await page.waitForURL(/\/logbook\/site\//);
    await expect.poll(() => txt('installation-row'), POLL).toMatch(/Azimuth 100.30° true \(planned 100.00°\)[\s\S]*1 photo/);
    expect(await txt('geometry-list')).toMatch(/incidence 40.0°, heading 190.0° true, right-looking, C band/);
    expect(await txt('timeline')).toMatch(/Recorded installation of reflector A/);
  });

  it('keeps the records through a page reload and a browser restart on the same profile', async () => {
    await page.reload();
    await expect.poll(() => txt('installation-row'), POLL).toMatch(/Azimuth 100.30°/);
    await ctx.close();
    await open();
    await page.goto(BASE_URL + '/logbook');
    await expect.poll(() => txt('site-row-MF-01'), POLL).toMatch(/1 reflector · 1 installation/);
    expect(await txt('site-row-MF-01')).toMatch(/Last visit: today/);
    await screenshot(page, 'logbook-after-restart');
    await choose('site-sort', 'distance');
    await expect.poll(() => txt('distance-from'), POLL).toMatch(/Distances from your GPS position/);
    const codes = await page.locator('[data-testid^="site-row-"]:visible .gm-lb-code').allInnerTexts();
    expect(codes).toEqual(['MF-01', 'HR-1']);
    await fillIn('site-search', 'hollin');
    await expect.poll(() => page.locator('[data-testid^="site-row-"]:visible').count(), POLL).toBe(1);
    await screenshot(page, 'logbook-list-search');
    await fillIn('site-search', '');
  });

  it('edits the installation into a new revision shown in its history; delete and Undo', async () => {
    await click('site-row-MF-01');
    await click('installation-row');
    await page.waitForURL(/\/logbook\/installation\//);
    await expect.poll(() => el('inst-az').inputValue(), POLL).toBe('100.3');
    await expect.poll(() => page.locator('[data-testid="stored-photo"]:visible').count(), POLL).toBe(1);
    await fillIn('inst-az', '100.8');
    await click('save-installation');
    await expect.poll(() => txt('saved'), POLL).toMatch(/Saved on this device/);
    await expect.poll(() => txt('record-history'), POLL).toMatch(/Edited this installation[\s\S]*measured azimuth \(° true\): 100.3 → 100.8/);
    expect(await txt('record-history')).toMatch(/by Ann Tester/);
    await shot('logbook-installation-history', 'record-history');
    await expectAccessible();
    await click('delete-installation');
    await expect.poll(() => txt('installation-deleted'), POLL).toMatch(/deleted/);
    await click('undo-delete');
    await expect.poll(() => page.locator('[data-testid="installation-deleted"]:visible').count(), POLL).toBe(0);
    await expect.poll(() => txt('record-history'), POLL).toMatch(/Restored this installation[\s\S]*Deleted this installation/);
  });

  it('soft-deletes the site with its children and restores them all with Undo', async () => {
    await click('back');
    await page.waitForURL(/\/logbook\/site\//);
    await click('delete-site');
    // A site with children is not deleted at once: the phone says what goes with it and asks.
    await expect.poll(() => txt('confirm-delete-site'), POLL).toMatch(/Delete site MF-01 with 1 reflector, 1 installation/);
    await click('confirm-delete-site-yes');
    await expect.poll(() => txt('site-deleted'), POLL).toMatch(/This site is deleted/);
    await expect.poll(() => page.locator('[data-testid="installation-row"]:visible').count(), POLL).toBe(0);
    await shot('logbook-site-deleted', 'site-deleted');
    await click('undo-delete');
    await expect.poll(() => page.locator('[data-testid="installation-row"]:visible').count(), POLL).toBe(1);
    await expect.poll(() => txt('timeline'), POLL).toMatch(/Restored site MF-01[\s\S]*Deleted site MF-01[\s\S]*With it: reflector A/);
    await shot('logbook-site-timeline', 'timeline');
  });

  it('finds a deleted installation in the deleted list after leaving its page, and restores it (390 × 844)', async () => {
    await page.setViewportSize({ width: 390, height: 844 });
    await click('installation-row');
    await page.waitForURL(/\/logbook\/installation\//);
    await click('delete-installation');
    await expect.poll(() => txt('installation-deleted'), POLL).toMatch(/deleted/);
    await page.goto(BASE_URL + '/settings');
    const item = page.locator('[data-testid="deleted-records"] [data-testid^="deleted-installations-"]:visible').first();
    await expect.poll(() => item.innerText(), POLL).toMatch(/installation of reflector A at MF-01/);
    await item.scrollIntoViewIfNeeded();
    await item.locator('[data-testid="restore-deleted"]').click();
    await expect.poll(() => txt('restored'), POLL).toMatch(/Restored installation of reflector A at MF-01/);
    await screenshot(page, 'settings-deleted-restored');
    await page.goto(BASE_URL + '/logbook');
    await click('site-row-MF-01');
    await expect.poll(() => page.locator('[data-testid="installation-row"]:visible').count(), POLL).toBe(1);
    await page.setViewportSize({ width: 412, height: 915 });
  });

  it('records an inspection; a photo over the limit is refused in words and the record is kept', async () => {
    await click('inspect-A');
    await page.waitForURL(/\/logbook\/inspection\/new\//);
    await choose('check-debris', 'issue');
    await choose('check-damage', 'ok');
    await fillIn('insp-notes', 'leaves in the corner, cleared');
    await el('photo-input-boresight').setInputFiles({ name: 'big.png', mimeType: 'image/png', buffer: HUGE });
    await shot('logbook-inspection-form', 'checklist');
    await expectAccessible();
    await click('save-inspection');
    await expect.poll(() => txt('inspection-saved'), POLL).toMatch(/Saved on this device[\s\S]*1 issue: debris in the corner/);
    expect(await txt('photo-error-boresight')).toMatch(/^Along the boresight: The photo is 8\.1 MB, more than the 8\.0 MB limit; it was not saved \(the record itself is kept\)/);
    await shot('logbook-inspection-photo-too-large', 'inspection-saved');
    await click('view-site');
    await expect.poll(() => txt('inspection-row'), POLL).toMatch(/1 issue: debris in the corner/);
  });

  it('records a typed installation from the reflector card, marks missing figures in place, then "Next site" goes to Plan', async () => {
    await click('install-A');
    await page.waitForURL(/\/logbook\/new-installation\?reflector=/);
    await expect.poll(() => el('pick-reflector').inputValue(), POLL).not.toBe('');
    await fillIn('inst-az', '');
    await click('save-installation');
    await expect.poll(() => txt('inst-az-error'), POLL).toBe('Measured azimuth is empty');
    expect(await txt('save-error')).toMatch(/Nothing saved yet: check the marked fields/);
    await fillIn('inst-az', '101.5');
    await fillIn('inst-tilt', '14.2');
    await fillIn('inst-planned-az', '100');
    await fillIn('inst-planned-tilt', '14.7');
    await choose('inst-method', 'compass');
    await click('save-installation');
    await expect.poll(() => txt('inst-decl-error'), POLL).toMatch(/compass azimuth needs the declination/);
    await fillIn('inst-decl', '1.2');
    await fillIn('inst-decl-model', 'WMM2025');
    await click('save-installation');
    await expect.poll(() => txt('installation-saved'), POLL).toMatch(/Saved on this device[\s\S]*azimuth 101.50° true/);
    await click('next-site');
    await page.waitForURL(/\/plan$/);
  });

  it('refuses an edit of a record changed in another tab, keeping the form and saying why', async () => {
    await page.goto(BASE_URL + '/logbook');
    await click('site-row-MF-01');
    await el('installation-row').click();
    await page.waitForURL(/\/logbook\/installation\//);
    const url = page.url();
    await expect.poll(() => el('inst-notes').inputValue(), POLL).not.toBe('');
    const other = await ctx.newPage();
    await other.goto(url);
    await other.locator('[data-testid="inst-notes"]:visible').fill('edited in the other tab');
    await other.locator('[data-testid="save-installation"]:visible').click();
    await expect.poll(() => other.locator('[data-testid="saved"]:visible').innerText(), POLL).toMatch(/Saved on this device/);
    await other.close();
    await fillIn('inst-crew', 'Ann Tester, Bo Second');
    await click('save-installation');
    await expect.poll(() => txt('save-error'), POLL).toMatch(/changed elsewhere .*Your entries are still in the form/);
    expect(await el('inst-crew').inputValue()).toBe('Ann Tester, Bo Second');
    await shot('logbook-stale-edit', 'save-error');
    // Apply the crew's change to the current version: the other tab's notes stay.
    await click('apply-to-current');
    await expect.poll(() => txt('saved'), POLL).toMatch(/Saved on this device/);
    expect(await el('inst-crew').inputValue()).toBe('Ann Tester, Bo Second');
    expect(await el('inst-notes').inputValue()).toBe('edited in the other tab');
    await expect.poll(() => txt('record-history'), POLL).toMatch(/crew: Ann Tester → Ann Tester, Bo Second/);
  });

  it('passes axe on the site and installation screens in the dark theme too', async () => {
    await page.evaluate(() => {
      const k = 'glintmark.settings.v1';
      localStorage.setItem(k, JSON.stringify({ ...JSON.parse(localStorage.getItem(k) ?? '{}'), theme: 'dark' }));
    });
    await page.goto(BASE_URL + '/logbook');
    await click('site-row-MF-01');
    await expect.poll(() => page.locator('[data-testid="installation-row"]:visible').count(), POLL).toBe(2);
    await expectAccessible();
    await shot('logbook-site-dark');
    await el('installation-row').click();
    await expect.poll(() => page.locator('[data-testid="record-history"]:visible').count(), POLL).toBe(1);
    await expectAccessible();
    expect(errors).toEqual([]);
  });
});

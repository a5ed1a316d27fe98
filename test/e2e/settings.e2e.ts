import { readFile } from 'node:fs/promises';
import { strFromU8, unzipSync } from 'fflate';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seriousViolations } from './a11y.ts';
import { BASE_URL, launch, phoneContext, screenshot, text } from './browser.ts';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const el = (page: Page, testId: string) => page.locator(`[data-testid="${testId}"]`);

/** Every store of the app's IndexedDB database, read directly (not through the app), as comparable JSON. */
async function dumpIdb(page: Page): Promise<string> {
  return page.evaluate(
    () =>
      new Promise<string>((resolve, reject) => {
        const req = indexedDB.open('glintmark');
        req.onerror = () => reject(req.error);
        req.onsuccess = () => {
          const db = req.result;
          const names = [...db.objectStoreNames].filter((n) => n !== 'meta');
          const tx = db.transaction(names, 'readonly');
          const out: Record<string, unknown> = {};
          for (const n of names) {
            const r = tx.objectStore(n).getAll();
            r.onsuccess = () => (out[n] = r.result);
          }
          tx.oncomplete = () => {
            db.close();
            resolve(JSON.stringify(out));
          };
          tx.onerror = () => reject(tx.error);
        };
      }),
  );
}

const siteCodes = async (page: Page) => (JSON.parse(await dumpIdb(page)) as { sites: { code: string; deletedAtMs: number | null }[] }).sites.filter((s) => s.deletedAtMs === null).map((s) => s.code).sort();

/** Click and capture the browser download it starts: its suggested name, its bytes and its text. */
async function download(page: Page, testId: string): Promise<{ name: string; text: string; bytes: Buffer }> {
  const [d] = await Promise.all([page.waitForEvent('download'), el(page, testId).click()]);
  const path = await d.path();
  const bytes = await readFile(path);
  return { name: d.suggestedFilename(), text: bytes.toString('utf8'), bytes };
}

/** Screenshot with the element in the middle of the screen (the page scrolls inside Ionic's content). */
async function shot(page: Page, testId: string, name: string): Promise<void> {
  await el(page, testId).evaluate((e) => e.scrollIntoView({ block: 'center' }));
  await screenshot(page, name);
}

const file = (name: string, mimeType: string, content: string) => ({ name, mimeType, buffer: Buffer.from(content, 'utf8') });

// One bad latitude (line 3) and one code repeated in the file (line 4, same code as line 2).
const SITES_CSV = [
  'code,name,latitude,longitude,height_m',
  'MF-01,Marrowby Fen <b>north</b> bank,52.4123,-1.2345,61.2',
  'MF-02,Marrowby Fen typo,95,-1.2201,60.85',
  'MF-01,Marrowby Fen again,52.4188,-1.2201,60.85',
  'HR-07,Hollin Ridge,53.0011,-2.5007,312.4',
].join('\r\n');

describe('Settings screen', () => {
  it('imports sites with a preview, backs up, refuses damaged backups, restores, merges, exports GeoJSON, and themes', async () => {
    const ctx = await phoneContext(browser, { geolocation: false });
    // This test follows the plain-download path (no File System Access save dialog, as on phones' browsers).
    await ctx.addInitScript(() => {
      delete (window as { showSaveFilePicker?: unknown }).showSaveFilePicker;
    });
    const page = await ctx.newPage();
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(e.message));
    await page.goto(BASE_URL + '/settings');
    await el(page, 'privacy').waitFor();
    expect(await text(page, 'privacy')).toMatch(/^Nothing leaves this phone unless you export or share it/);
    await expect.poll(() => text(page, 'last-backup')).toMatch(/No backup has been saved/);
    expect(await text(page, 'schema-version')).toMatch(/schema version 6/);
    expect(await el(page, 'backup-reminder').count()).toBe(0); // nothing to back up yet
    await screenshot(page, 'settings-start');
    await shot(page, 'persistence', 'settings-storage');

    // Site import: preview first, nothing written until confirmed.
    await el(page, 'import-file').setInputFiles(file('sites.csv', 'text/csv', SITES_CSV));
    await el(page, 'import-preview').waitFor();
    const statuses = await page.locator('[data-testid^="import-row-"]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-status')));
    expect(statuses).toEqual(['accepted', 'rejected', 'rejected', 'accepted']);
    expect(await text(page, 'import-row-1')).toMatch(/line 3[\s\S]*latitude must be in \[-90, 90\] degrees, got 95/);
    expect(await text(page, 'import-row-2')).toMatch(/line 4[\s\S]*code MF-01 repeats the code of line 2/);
    expect(await text(page, 'import-row-0')).toContain('Marrowby Fen <b>north</b> bank'); // shown as text, not markup
    expect(await el(page, 'import-preview').locator('b').count()).toBe(0);
    expect(await text(page, 'import-commit')).toBe('Import 2 sites');
    expect(await siteCodes(page)).toEqual([]);
    await shot(page, 'import-preview', 'settings-import-preview');
    await el(page, 'import-commit').click();
    await expect.poll(() => text(page, 'import-message')).toBe('✓ Imported 2 sites: MF-01, HR-07.');
    expect(await siteCodes(page)).toEqual(['HR-07', 'MF-01']);
    await shot(page, 'import-message', 'settings-imported');

    // Web: no automatic download, a banner instead.
    await page.reload();
    await el(page, 'backup-reminder').waitFor();
    expect(await text(page, 'backup-reminder')).toContain("Today's work is not backed up: download a backup");
    await shot(page, 'backup-reminder', 'settings-backup-reminder');

    // Full backup as a browser download: a ZIP archive (manifest, records.json, photos).
    const archive = await download(page, 'download-backup');
    expect(archive.name).toMatch(/^glintmark-backup-\d{8}-\d{4}Z\.glintmark\.zip$/);
    const entries = unzipSync(new Uint8Array(archive.bytes));
    expect(Object.keys(entries).sort()).toEqual(['manifest.json', 'records.json']);
    const doc = JSON.parse(strFromU8(entries['records.json'])) as { format: string; formatVersion: number; app: { schemaVersion: number }; tables: Record<string, unknown[]> };
    expect(doc).toMatchObject({ format: 'glintmark-backup', formatVersion: 2, app: { schemaVersion: 6 } });
    expect(Object.keys(doc.tables).sort()).toEqual(['conflicts', 'elements', 'geometries', 'inspections', 'installations', 'photos', 'reflectors', 'revisions', 'sites']);
    expect(doc.tables.sites).toHaveLength(2);
    // The page cannot see the download end: "last backup" waits for the crew's word.
    await el(page, 'backup-confirm').waitFor();
    expect(await text(page, 'last-backup')).toMatch(/No backup has been saved/);
    await el(page, 'backup-confirm-done').click();
    await expect.poll(() => text(page, 'backup-message')).toMatch(/^✓ Backup saved to your browser's downloads/);
    await expect.poll(() => text(page, 'last-backup')).toMatch(/^✓ Last backup saved .* \(less than a day ago\)\.$/);
    await expect.poll(() => el(page, 'backup-reminder').count()).toBe(0); // backed up today: the banner goes
    await shot(page, 'download-backup', 'settings-backup-saved');

    // Damaged backups: the data layer's plain message, and the database exactly as it was.
    const before = await dumpIdb(page);
    await el(page, 'restore-file').setInputFiles({ name: 'cut.glintmark.zip', mimeType: 'application/zip', buffer: archive.bytes.subarray(0, Math.floor(archive.bytes.length / 2)) });
    await expect.poll(() => text(page, 'restore-error')).toMatch(/^The backup archive is incomplete \(its table of contents at the end of the file is missing\)/);
    expect(await el(page, 'restore-confirm').count()).toBe(0);
    expect(await dumpIdb(page)).toBe(before);
    // An old JSON backup (format 1) of the same records: cut short, it is refused as before.
    const backup = { name: 'glintmark-backup-old.json', text: JSON.stringify({ ...doc, formatVersion: 1 }) };
    await el(page, 'restore-file').setInputFiles(file('cut.json', 'application/json', backup.text.slice(0, Math.floor(backup.text.length / 2))));
    await expect.poll(() => text(page, 'restore-error')).toMatch(/^The backup file is incomplete \(it ends in the middle of the data\)/);
    expect(await el(page, 'restore-confirm').count()).toBe(0);
    expect(await dumpIdb(page)).toBe(before);
    await shot(page, 'restore-error', 'settings-restore-truncated');
    await el(page, 'restore-file').setInputFiles(file('sites.csv', 'text/csv', SITES_CSV));
    await expect.poll(() => text(page, 'restore-error')).toMatch(/^This file is not a Glintmark backup: it is not JSON \(it starts with "code,name,la"\)/);
    expect(await dumpIdb(page)).toBe(before);
    await shot(page, 'restore-error', 'settings-restore-not-json');

    // The good backup: described first, then replacing needs a second, explicit confirmation with the count.
    await el(page, 'restore-file').setInputFiles({ name: archive.name, mimeType: 'application/zip', buffer: archive.bytes });
    await expect.poll(() => text(page, 'restore-confirm')).toMatch(/It holds 2 sites, 2 history entries\./);
    await el(page, 'restore-go').click();
    await expect.poll(() => text(page, 'restore-replace-warning')).toMatch(/already holds \d+ records/);
    expect(await dumpIdb(page)).toBe(before);
    await shot(page, 'restore-confirm', 'settings-restore-confirm-replace');
    await el(page, 'restore-replace').click();
    await expect.poll(() => text(page, 'restore-message')).toBe('Restored 2 sites, 2 history entries.');
    expect(await siteCodes(page)).toEqual(['HR-07', 'MF-01']);

    // Merging the same backup (the archive, then the old JSON form) changes nothing and says so.
    await el(page, 'merge-file').setInputFiles({ name: archive.name, mimeType: 'application/zip', buffer: archive.bytes });
    await el(page, 'merge-go').click();
    await expect.poll(() => text(page, 'merge-summary')).toBe('✓ Merged: 0 added, 0 updated, 4 unchanged, 0 newer on this phone, no conflicts.');
    await el(page, 'merge-file').setInputFiles(file(backup.name, 'application/json', backup.text));
    await el(page, 'merge-go').click();
    await expect.poll(() => text(page, 'merge-summary')).toBe('✓ Merged: 0 added, 0 updated, 4 unchanged, 0 newer on this phone, no conflicts.');
    expect(await text(page, 'merge-row-sites')).toBe('Sites: 0 added · 0 updated · 2 unchanged · 0 newer here · 0 conflicts');
    await shot(page, 'merge-report', 'settings-merged');

    // The same revision edited on another phone: reported as a conflict, listed for review, then marked resolved.
    const edited = JSON.parse(backup.text) as { tables: { sites: { code: string; notes: string }[] } };
    edited.tables.sites.find((x) => x.code === 'MF-01')!.notes = 'gate moved 20 m east';
    await el(page, 'merge-file').setInputFiles(file('other-phone.json', 'application/json', JSON.stringify(edited)));
    await el(page, 'merge-go').click();
    await expect.poll(() => text(page, 'merge-conflicts')).toMatch(/^site [0-9a-f-]{36}: revision 1 differs between the phones; the local version is kept$/);
    await el(page, 'conflict-0').waitFor();
    expect(await text(page, 'conflict-0')).toMatch(/site MF-01/);
    await shot(page, 'conflict-0', 'settings-conflict');
    await el(page, 'resolve-conflict-0').click();
    await expect.poll(() => el(page, 'conflicts').count()).toBe(0);

    // GeoJSON export: a FeatureCollection with [longitude, latitude, height].
    const geo = await download(page, 'export-sites-geojson');
    expect(geo.name).toMatch(/^glintmark-sites-\d{8}-\d{4}Z\.geojson$/);
    const fc = JSON.parse(geo.text) as { type: string; features: { geometry: { type: string; coordinates: number[] }; properties: { code: string } }[] };
    expect(fc.type).toBe('FeatureCollection');
    const mf01 = fc.features.find((f) => f.properties.code === 'MF-01');
    expect(mf01?.geometry).toEqual({ type: 'Point', coordinates: [-1.2345, 52.4123, 61.2] });
    const csv = await download(page, 'export-installations-csv');
    expect(csv.name).toMatch(/^glintmark-installations-\d{8}-\d{4}Z\.csv$/);
    await shot(page, 'export-message', 'settings-exported');

    await el(page, 'remove-demo').click();
    await expect.poll(() => text(page, 'demo-report')).toBe('✓ There was no demo data to remove.');
    expect(await seriousViolations(page), 'axe, outdoor theme').toEqual([]);

    // Dark theme for dawn work.
    await el(page, 'theme').locator('button[data-value="dark"]').click();
    await expect.poll(() => page.evaluate(() => document.body.classList.contains('gm-dark'))).toBe(true);
    await shot(page, 'theme', 'settings-dark');
    await shot(page, 'export-message', 'settings-dark-exchange');
    expect(await seriousViolations(page), 'axe, dark theme').toEqual([]);
    expect(errors).toEqual([]);
    await ctx.close();
  });
});

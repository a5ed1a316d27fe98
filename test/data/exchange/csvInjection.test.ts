/**
 * CSV exports are safe to open in a spreadsheet: a text cell that begins with =, +, -, @, TAB or CR is prefixed
 * with a single quote so the spreadsheet shows it as text (OWASP, "CSV Injection", owasp.org/www-community/attacks/
 * CSV_Injection, which lists these leading characters and the quote prefix). Numbers stay numbers (−1.2345 is
 * written as -1.2345); the site import strips the prefix again, so an export read back gives the same text.
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { csvField, parseCsv, unprotectCsvCell } from '../../../src/core/text/csv.ts';
import { exportInstallationsCsv, exportSitesCsv } from '../../../src/data/exchange/tablesCsv.ts';
import { previewSiteImport } from '../../../src/data/exchange/siteImport.ts';
import { reflectorRepo, installationRepo } from '../../../src/data/repo/entities.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import { BY, T0_MS, installationFields, reflectorFields, siteFields, useTestDb } from '../helpers.ts';

describe('CSV formula-cell protection', () => {
  const db = useTestDb();

  it('prefixes text cells that a spreadsheet would run, and nothing else', () => {
    expect(['=SUM(A1)', '+1+1', '-2+3', '@cmd', '\tx', '\rx'].map((s) => csvField(s))).toEqual(["'=SUM(A1)", "'+1+1", "'-2+3", "'@cmd", "'\tx", `"'\rx"`]);
    // Plain text, numbers, and numerals written as text are left as they are.
    expect([csvField('plain'), csvField(-1.2345), csvField('-1.2345'), csvField('+3'), csvField(0), csvField("it's")]).toEqual(['plain', '-1.2345', '-1.2345', '+3', '0', "it's"]);
    // A cell that already begins with quotes before such a character gets one more, so reading back is exact.
    expect(csvField("'=x")).toBe("''=x");
    expect(["'=SUM(A1)", "''=x", "'plain", '-1.5'].map(unprotectCsvCell)).toEqual(['=SUM(A1)', "'=x", "'plain", '-1.5']);
  });

  it('installation export: a note starting with = is text; a negative longitude stays a number', async () => {
    const s = await siteRepo.create(db(), siteFields({ lonDeg: -1.2345 }), BY);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id, { label: '=HYPERLINK("http://x")' }), BY);
    await installationRepo.create(db(), installationFields(s.id, r.id, { notes: '=1+2', plannedTiltDeg: -3.2, installedAtMs: T0_MS }), BY);
    const [header, row] = parseCsv(await exportInstallationsCsv(db()));
    const cell = (name: string) => row.fields[header.fields.indexOf(name)];
    expect(cell('notes')).toBe("'=1+2");
    expect(cell('reflector_label')).toBe("'=HYPERLINK(\"http://x\")");
    expect(cell('planned_tilt_deg')).toBe('-3.2');
    expect(cell('fix_lon_deg')).toBe('-1.23452');
  });

  it('site export read back by the site import gives the same text and numbers', async () => {
    const names = ['=SUM(A1)', '+44 field', '-north', '@home', "'=quoted"];
    for (const [i, name] of names.entries()) await siteRepo.create(db(), siteFields({ code: `MF-${i + 10}`, name, notes: `-${name}`, lonDeg: -1.2345 - i }), BY);
    const text = await exportSitesCsv(db());
    expect(text).toContain("'=SUM(A1)");
    await db().sites.clear();
    const preview = await previewSiteImport(db(), text, 'csv');
    expect(preview.rejected).toEqual([]);
    expect(preview.accepted.map((a) => [a.fields.name, a.fields.notes, a.fields.lonDeg])).toEqual(names.map((n, i) => [n, `-${n}`, -1.2345 - i]));
  });
});

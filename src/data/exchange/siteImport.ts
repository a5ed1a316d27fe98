/**
 * Import sites from CSV or GeoJSON in two steps: previewSiteImport reads and checks everything and writes
 * nothing; commitSiteImport writes every accepted site in one transaction, or none.
 *
 * The file is read by readSiteFile (siteFile.ts), the reader the planner uses too: its doc comment lists the site
 * CSV header set, the older spellings still accepted, and the locale rules (separator, decimal comma, BOM, CRLF).
 * Imported sites get positionSource 'imported' and new ids; an empty height is stored as unknown (to be surveyed).
 * Text is kept as plain strings: the UI must show it as text, never as HTML.
 */
import type { GlintmarkDb } from '../db.ts';
import { siteRepo } from '../repo/sites.ts';
import { WRITE_SCOPE } from '../repo/entity.ts';
import type { WriteContext } from '../repo/context.ts';
import type { SiteFields, SiteRecord } from '../types.ts';
import { readSiteFile, type SiteFileKind } from './siteFile.ts';

export type SiteImportKind = SiteFileKind;

/** A site ready to be written, with where it came from (CSV line number, or GeoJSON feature index from 0). */
export interface SiteDraft {
  row: number;
  fields: SiteFields;
}

/** `row` is the CSV line number (1 = header) or the GeoJSON feature index; 0 means the whole file. */
export interface ImportRejection {
  row: number;
  reason: string;
}

export interface SiteImportPreview {
  kind: SiteImportKind;
  accepted: SiteDraft[];
  /** Rows refused, and rows that repeat an earlier site exactly (read once; the reason says so). */
  rejected: ImportRejection[];
}

/** Read and check an import; writes nothing. Duplicate codes (in the file or among live sites) are rejected. */
export async function previewSiteImport(db: GlintmarkDb, text: string, kind: SiteImportKind): Promise<SiteImportPreview> {
  const read = readSiteFile(text, kind);
  const rejected: ImportRejection[] = [...read.rejected, ...read.repeats];
  const accepted: SiteDraft[] = [];
  const liveCodes = new Set((await db.sites.filter((s) => s.deletedAtMs === null).toArray()).map((s) => s.code.toLowerCase()));
  for (const { row, fields } of read.sites) {
    if (liveCodes.has(fields.code.toLowerCase())) rejected.push({ row, reason: `code ${fields.code} is already used by a site on this device` });
    else accepted.push({ row, fields });
  }
  rejected.sort((a, b) => a.row - b.row);
  return { kind, accepted, rejected };
}

/** Write every accepted site (re-checked) in one transaction; any failure writes nothing. */
export async function commitSiteImport(db: GlintmarkDb, preview: SiteImportPreview, ctx: WriteContext): Promise<SiteRecord[]> {
  return db.transaction('rw', WRITE_SCOPE, async () => {
    const out: SiteRecord[] = [];
    for (const d of preview.accepted) out.push(await siteRepo.create(db, d.fields, ctx));
    return out;
  });
}

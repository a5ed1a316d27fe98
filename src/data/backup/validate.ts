/**
 * Whole-document validation of a backup, before anything is written. Each failure class has its own
 * BackupError kind and a plain message; every issue names its row (e.g. "sites[3] (MF-05).latDeg").
 */
import * as v from 'valibot';
import { base64DecodedLength } from '../base64.ts';
import { BackupError, formatSize, type Issue } from '../errors.ts';
import { DEFAULT_MAX_PHOTO_BYTES } from '../repo/photos.ts';
import { toIssues } from '../schema/fields.ts';
import { elementRowIssues } from '../schema/elements.ts';
import { copyPlain, forbiddenKey, forbiddenKeyMessage } from '../schema/plain.ts';
import { rowIssues } from '../schema/validate.ts';
import { ENTITY_TABLES } from '../types.ts';
import { ARCHIVE_RECORDS_FORMAT_VERSION, BACKUP_FORMAT, BACKUP_FORMAT_VERSION, BACKUP_TABLES, archivePhotoRowSchema, conflictRowSchema, envelopeSchema, photoRowSchema, revisionRowSchema, type BackupDocument, type BackupTable, type BackupTables } from './format.ts';

export interface BackupCheckOptions {
  /** Largest photo accepted, bytes (default DEFAULT_MAX_PHOTO_BYTES). */
  maxPhotoBytes?: number;
  /** Check that every reference points into the document (default true; merge checks against document + device). */
  checkReferences?: boolean;
}

/**
 * True when `text` starts like JSON but ends inside a string or an open object/array: the usual result
 * of a copy cut short. Independent of the engine's JSON.parse wording.
 */
function looksTruncated(text: string): boolean {
  const t = text.trim();
  if (!t.startsWith('{') && !t.startsWith('[')) return false;
  let depth = 0;
  let inString = false;
  for (let i = 0; i < t.length; i++) {
    const c = t[i];
    if (inString) {
      if (c === '\\') i++;
      else if (c === '"') inString = false;
    } else if (c === '"') inString = true;
    else if (c === '{' || c === '[') depth++;
    else if (c === '}' || c === ']') depth--;
  }
  return inString || depth > 0;
}

function parseText(text: string): unknown {
  if (text.trim() === '') throw new BackupError('not-json', 'The file is empty; it is not a Glintmark backup.');
  try {
    return JSON.parse(text) as unknown;
  } catch {
    if (looksTruncated(text)) {
      throw new BackupError('truncated', 'The backup file is incomplete (it ends in the middle of the data), probably cut off while copying. Nothing was restored; copy the file again.');
    }
    const start = JSON.stringify(text.trim().slice(0, 12));
    throw new BackupError('not-json', `This file is not a Glintmark backup: it is not JSON (it starts with ${start}). Nothing was restored.`);
  }
}

/** Where a document's photo bytes are: inline base64 (a JSON backup file) or entries of the archive (records.json). */
export type BackupLayout = 'json' | 'archive';

function checkEnvelope(data: unknown, layout: BackupLayout): BackupDocument {
  const o = (typeof data === 'object' && data !== null && !Array.isArray(data) ? data : {}) as Record<string, unknown>;
  if (o.format !== BACKUP_FORMAT) {
    throw new BackupError('wrong-format', `This file is not a Glintmark backup (its format is ${JSON.stringify(o.format ?? null)}, expected "${BACKUP_FORMAT}"). Nothing was restored.`);
  }
  if (layout === 'json' && o.formatVersion === ARCHIVE_RECORDS_FORMAT_VERSION) {
    throw new BackupError('wrong-format', 'This is the records file from inside a backup archive, without its photos. Restore the whole archive (the .glintmark.zip file) instead. Nothing was restored.');
  }
  if (layout === 'archive' && o.formatVersion !== ARCHIVE_RECORDS_FORMAT_VERSION) {
    throw new BackupError('wrong-version', `The records inside this backup archive have format version ${JSON.stringify(o.formatVersion ?? null)}, not ${ARCHIVE_RECORDS_FORMAT_VERSION}. Nothing was restored.`);
  }
  if (layout === 'json' && o.formatVersion !== BACKUP_FORMAT_VERSION) {
    const newer = typeof o.formatVersion === 'number' && o.formatVersion > BACKUP_FORMAT_VERSION;
    throw new BackupError(
      'wrong-version',
      newer
        ? `This backup was made by a newer Glintmark (backup format ${String(o.formatVersion)}; this app reads format ${BACKUP_FORMAT_VERSION}). Update the app, then restore. Nothing was restored.`
        : `This backup has an unknown format version (${JSON.stringify(o.formatVersion ?? null)}); this app reads format ${BACKUP_FORMAT_VERSION}. Nothing was restored.`,
    );
  }
  const r = v.safeParse(envelopeSchema, data);
  if (!r.success) throw fail('invalid-record', 'its header or table lists are damaged', toIssues(r.issues));
  return data as BackupDocument;
}

/**
 * The parsed document as plain data (schema/plain.ts): no prototype keys, bounded nesting and text, every row
 * copied into fresh objects. Rows are named as in every other message ("sites[3] (MF-05).notes").
 */
function plainDocument(data: unknown): unknown {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) return data;
  // Photo bytes in base64 are bounded by the photo size check instead (bytes must match the data, ≤ maxPhotoBytes).
  const limits = { longText: (k: string) => (k === 'dataBase64' ? Infinity : undefined) };
  const issue = (i: Issue) => fail('invalid-record', 'its data is damaged or was altered', [i]);
  const { tables, ...envelope } = data as Record<string, unknown>;
  const top = copyPlain(envelope, '');
  if (!top.ok) throw issue(top.issue);
  const out = top.value as Record<string, unknown>;
  if (typeof tables !== 'object' || tables === null || Array.isArray(tables)) {
    if (tables !== undefined) out.tables = tables;
    return out;
  }
  const bad = forbiddenKey(tables);
  if (bad !== null) throw issue({ path: 'tables', message: forbiddenKeyMessage(bad) });
  const copied: Record<string, unknown> = {};
  for (const [name, list] of Object.entries(tables)) {
    if (!Array.isArray(list)) {
      const r = copyPlain(list, `tables.${name}`);
      if (!r.ok) throw issue(r.issue);
      copied[name] = r.value;
      continue;
    }
    copied[name] = list.map((row: unknown, i) => {
      const r = copyPlain(row, rowName(name, i, row), limits);
      if (!r.ok) throw issue(r.issue);
      return r.value;
    });
  }
  out.tables = copied;
  return out;
}

function fail(kind: BackupError['kind'], what: string, issues: Issue[]): BackupError {
  const shown = issues.slice(0, 5).map((i) => `${i.path}: ${i.message}`).join('; ');
  const more = issues.length > 5 ? ` (and ${issues.length - 5} more)` : '';
  return new BackupError(kind, `The backup was not restored: ${what}. ${shown}${more}`, issues);
}

function rowName(table: string, i: number, row: unknown): string {
  const r = (typeof row === 'object' && row !== null ? row : {}) as Record<string, unknown>;
  const hint = typeof r.code === 'string' ? r.code : typeof r.label === 'string' ? r.label : typeof r.catalogNumber === 'string' ? r.catalogNumber : '';
  return `${table}[${i}]${hint ? ` (${hint})` : ''}`;
}

function recordIssues(tables: BackupTables, layout: BackupLayout): Issue[] {
  const issues: Issue[] = [];
  for (const t of ENTITY_TABLES) tables[t].forEach((row, i) => issues.push(...rowIssues(t, row, rowName(t, i, row))));
  const simple: [BackupTable, v.GenericSchema][] = [['photos', layout === 'json' ? photoRowSchema : archivePhotoRowSchema], ['revisions', revisionRowSchema], ['conflicts', conflictRowSchema]];
  for (const [t, schema] of simple) {
    (tables[t] as unknown[]).forEach((row, i) => {
      const r = v.safeParse(schema, row);
      if (!r.success) issues.push(...toIssues(r.issues, rowName(t, i, row)));
    });
  }
  tables.elements.forEach((row, i) => issues.push(...elementRowIssues(row, rowName('elements', i, row))));
  if (layout === 'json') tables.photos.forEach((p, i) => {
    if (!v.is(photoRowSchema, p)) return; // already reported
    const n = base64DecodedLength(p.dataBase64);
    if (n < 0) issues.push({ path: `photos[${i}].dataBase64`, message: 'is not valid base64' });
    else if (n !== p.bytes) issues.push({ path: `photos[${i}].bytes`, message: `says ${p.bytes} bytes but the data holds ${n}` });
  });
  return issues;
}

function duplicateIssues(tables: BackupTables): Issue[] {
  const issues: Issue[] = [];
  for (const t of BACKUP_TABLES) {
    const seen = new Map<string, number>();
    (tables[t] as { id: string }[]).forEach((row, i) => {
      const first = seen.get(row.id);
      if (first !== undefined) issues.push({ path: `${t}[${i}]`, message: `repeats the id ${row.id} of ${t}[${first}]` });
      else seen.set(row.id, i);
    });
  }
  const codes = new Map<string, number>();
  tables.sites.forEach((s, i) => {
    if (s.deletedAtMs !== null) return;
    const key = s.code.toLowerCase();
    const first = codes.get(key);
    if (first !== undefined) issues.push({ path: `sites[${i}] (${s.code})`, message: `uses the same code as the live site sites[${first}]` });
    else codes.set(key, i);
  });
  const numbers = new Map<string, number>();
  tables.elements.forEach((e, i) => {
    if (e.deletedAtMs !== null) return;
    const first = numbers.get(e.catalogNumber);
    if (first !== undefined) issues.push({ path: `elements[${i}] (${e.catalogNumber})`, message: `is a second live element set for this catalogue number (see elements[${first}])` });
    else numbers.set(e.catalogNumber, i);
  });
  return issues;
}

function photoSizeIssues(tables: BackupTables, maxBytes: number): Issue[] {
  return tables.photos.flatMap((p, i) =>
    p.bytes > maxBytes ? [{ path: `photos[${i}]`, message: `is ${formatSize(p.bytes)}, more than the ${formatSize(maxBytes)} photo limit` }] : [],
  );
}

/** Issues for every reference that `has` cannot resolve. */
export function referenceIssues(tables: BackupTables, has: (table: BackupTable, id: string) => boolean): Issue[] {
  const issues: Issue[] = [];
  const need = (path: string, table: BackupTable, id: string) => {
    if (!has(table, id)) issues.push({ path, message: `points to ${table} ${id}, which is not in the backup or on this device` });
  };
  tables.reflectors.forEach((r, i) => need(`reflectors[${i}].siteId`, 'sites', r.siteId));
  tables.geometries.forEach((g, i) => {
    need(`geometries[${i}].siteId`, 'sites', g.siteId);
    if (g.reflectorId !== null) need(`geometries[${i}].reflectorId`, 'reflectors', g.reflectorId);
  });
  for (const t of ['installations', 'inspections'] as const) {
    tables[t].forEach((x, i) => {
      need(`${t}[${i}].siteId`, 'sites', x.siteId);
      need(`${t}[${i}].reflectorId`, 'reflectors', x.reflectorId);
      x.photoIds.forEach((p, k) => need(`${t}[${i}].photoIds[${k}]`, 'photos', p));
    });
  }
  tables.installations.forEach((x, i) => x.geometryIds.forEach((g, k) => need(`installations[${i}].geometryIds[${k}]`, 'geometries', g)));
  tables.photos.forEach((p, i) => need(`photos[${i}].ownerId`, p.ownerTable, p.ownerId));
  tables.revisions.forEach((r, i) => need(`revisions[${i}].recordId`, r.table, r.recordId));
  return issues;
}

/** Looks a row up by table and id: in the document first, then (for merge) on this device. */
export type RowLookup = (table: BackupTable, id: string) => Record<string, unknown> | undefined;

/** The document's own rows, by table and id. */
export function documentLookup(tables: BackupTables): RowLookup {
  const byId = new Map(BACKUP_TABLES.map((n) => [n, new Map((tables[n] as unknown as { id: string }[]).map((r) => [r.id, r as unknown as Record<string, unknown>]))]));
  return (table, id) => byId.get(table)?.get(id);
}

/**
 * The repositories' link rules (repo/refs.ts), applied to every live row of a document: its site and reflector are
 * live, a child sits on its reflector's site, the geometries an installation lists are on its site, every listed
 * photo is a live photo of that record, and every live photo is listed by its owner. A reference that resolves to
 * nothing is left to referenceIssues. `find` resolves the document first, then (merge) the device.
 */
export function linkIssues(tables: BackupTables, find: RowLookup): Issue[] {
  const issues: Issue[] = [];
  const live = (r: { deletedAtMs: number | null }) => r.deletedAtMs === null;
  const site = (path: string, id: string, what: string) => {
    const s = find('sites', id);
    if (s && s.deletedAtMs !== null) issues.push({ path, message: `its site ${String(s.code)} is deleted, but this ${what} is not (restore the site or delete the ${what} first)` });
  };
  const reflectorOn = (path: string, id: string, siteId: string, what: string) => {
    const r = find('reflectors', id);
    if (!r) return;
    if (r.deletedAtMs !== null) issues.push({ path, message: `its reflector ${String(r.label)} is deleted, but this ${what} is not` });
    else if (r.siteId !== siteId) issues.push({ path, message: `its reflector ${String(r.label)} belongs to another site than this ${what}` });
  };
  tables.reflectors.forEach((r, i) => {
    if (live(r)) site(`${rowName('reflectors', i, r)}.siteId`, r.siteId, 'reflector');
  });
  tables.geometries.forEach((g, i) => {
    if (!live(g)) return;
    site(`geometries[${i}].siteId`, g.siteId, 'planned geometry');
    if (g.reflectorId !== null) reflectorOn(`geometries[${i}].reflectorId`, g.reflectorId, g.siteId, 'planned geometry');
  });
  const noun = { installations: 'installation', inspections: 'inspection' } as const;
  for (const t of ['installations', 'inspections'] as const) {
    tables[t].forEach((x, i) => {
      if (!live(x)) return;
      site(`${t}[${i}].siteId`, x.siteId, noun[t]);
      reflectorOn(`${t}[${i}].reflectorId`, x.reflectorId, x.siteId, noun[t]);
      x.photoIds.forEach((id, k) => {
        const p = find('photos', id);
        if (p && (p.deletedAtMs !== null || p.ownerTable !== t || p.ownerId !== x.id)) {
          issues.push({ path: `${t}[${i}].photoIds[${k}]`, message: `photo ${id} is not a live photo of this record` });
        }
      });
    });
  }
  tables.installations.forEach((x, i) => {
    if (!live(x)) return;
    x.geometryIds.forEach((id, k) => {
      const g = find('geometries', id);
      if (g && g.siteId !== x.siteId) issues.push({ path: `installations[${i}].geometryIds[${k}]`, message: `planned geometry ${id} belongs to another site than this installation` });
    });
  });
  tables.photos.forEach((p, i) => {
    if (!live(p)) return;
    const owner = find(p.ownerTable, p.ownerId);
    const ids = owner?.photoIds;
    if (owner && !(Array.isArray(ids) && ids.includes(p.id))) {
      issues.push({ path: `photos[${i}].ownerId`, message: `its ${noun[p.ownerTable]} ${p.ownerId} does not list this photo` });
    }
  });
  return issues;
}

/** A checked document, and whether the file carried the `elements` list (backups before schema 4 do not). */
export interface CheckedBackup {
  doc: BackupDocument;
  hasElements: boolean;
}

/**
 * Parse (when given text) and check a whole backup document. Throws BackupError with kind:
 * not-json, truncated, wrong-format, wrong-version, invalid-record, duplicate-id, photo-too-large, dangling-reference.
 * The returned document always has every table list (a missing `elements` list reads as []); the input is not changed.
 */
export function checkBackup(input: unknown, opts: BackupCheckOptions = {}, layout: BackupLayout = 'json'): CheckedBackup {
  const maxPhotoBytes = opts.maxPhotoBytes ?? DEFAULT_MAX_PHOTO_BYTES;
  const raw = checkEnvelope(plainDocument(typeof input === 'string' ? parseText(input) : input), layout);
  const hasElements = Array.isArray(raw.tables.elements);
  const doc: BackupDocument = hasElements ? raw : { ...raw, tables: { ...raw.tables, elements: [] } };
  const t = doc.tables;
  const rec = recordIssues(t, layout);
  if (rec.length) throw fail('invalid-record', `${rec.length} problem(s) in its records`, rec);
  const dup = duplicateIssues(t);
  if (dup.length) throw fail('duplicate-id', 'some records appear twice', dup);
  const big = photoSizeIssues(t, maxPhotoBytes);
  if (big.length) throw fail('photo-too-large', 'some photos are too large', big);
  if (opts.checkReferences !== false) {
    const ids = new Map(BACKUP_TABLES.map((n) => [n, new Set((t[n] as { id: string }[]).map((r) => r.id))]));
    const refs = referenceIssues(t, (table, id) => ids.get(table)?.has(id) ?? false);
    if (refs.length) throw fail('dangling-reference', 'some records point to records that are missing', refs);
    const links = linkIssues(t, documentLookup(t));
    if (links.length) throw fail('dangling-reference', 'some records are linked in a way this app never writes', links);
  }
  return { doc, hasElements };
}

/** checkBackup's document (see there). */
export const validateBackup = (input: unknown, opts: BackupCheckOptions = {}): BackupDocument => checkBackup(input, opts).doc;

/**
 * A photo the size a phone camera makes (6 MB, under the 8 MB limit) inside an old JSON backup (format 1,
 * photos inline as base64) restores and merges. The base64 check used to be a regular expression with a
 * repeated group, which threw "Maximum call stack size exceeded" on strings of a few MB.
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { base64DecodedLength } from '../../src/data/base64.ts';
import { backupToJson, exportBackup, restoreBackup } from '../../src/data/backup.ts';
import { openGlintmarkDb } from '../../src/data/db.ts';
import { mergeBackup } from '../../src/data/merge.ts';
import { addPhoto } from '../../src/data/repo/photos.ts';
import { BY, seedSample, useTestDb } from './helpers.ts';
import { randomBytes } from '../helpers/random.ts';

const SIX_MB = 6_000_000;

describe('old JSON backup with a 6 MB photo', () => {
  const db = useTestDb();

  it('checks base64 of a multi-MB string without overflowing the stack, and still refuses bad text', () => {
    const big = 'QUJD'.repeat(2_000_000); // 8 M characters, "ABC" repeated
    expect(base64DecodedLength(big)).toBe(6_000_000);
    expect(base64DecodedLength(`${big.slice(0, -4)}QQ==`)).toBe(5_999_998);
    expect(base64DecodedLength(`${big.slice(0, -4)}QUI=`)).toBe(5_999_999);
    expect(base64DecodedLength(`${big.slice(0, -4)}Q===`)).toBe(-1);
    expect(base64DecodedLength(`Q=QQ${big}`)).toBe(-1);
    expect(base64DecodedLength(`${big}QU-I`)).toBe(-1);
    expect(base64DecodedLength(`${big}QUI`)).toBe(-1);
    expect(base64DecodedLength('')).toBe(0);
  });

  it('restores into an empty database and merges into another, photo bytes intact', async () => {
    const ids = await seedSample(db());
    const bytes = randomBytes(SIX_MB, 61);
    const photo = await addPhoto(db(), { table: 'installations', id: ids.inst.id }, 'north', new Blob([bytes], { type: 'image/jpeg' }), BY);
    const text = backupToJson(await exportBackup(db(), { appVersion: '0.1.0' }));
    expect(text.length).toBeGreaterThan(SIX_MB * 1.33);

    for (const mode of ['restore', 'merge'] as const) {
      const other = openGlintmarkDb(`large-${mode}-${crypto.randomUUID()}`);
      try {
        if (mode === 'restore') await restoreBackup(other, text);
        else await mergeBackup(other, text, BY);
        const back = await other.photos.get(photo.id);
        expect(back?.bytes).toBe(SIX_MB);
        const got = new Uint8Array(await back!.blob.arrayBuffer());
        expect(got.length).toBe(bytes.length);
        expect(Buffer.compare(Buffer.from(got), Buffer.from(bytes))).toBe(0);
      } finally {
        await other.delete();
      }
    }
  });
});

import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { MissingReferenceError, PhotoTooLargeError, ValidationError } from '../../../src/data/errors.ts';
import { installationRepo, reflectorRepo } from '../../../src/data/repo/entities.ts';
import { addPhoto, listPhotos, softDeletePhoto, SUGGESTED_PHOTO_ROLES, undeletePhoto } from '../../../src/data/repo/photos.ts';
import { history } from '../../../src/data/repo/revisions.ts';
import { siteRepo } from '../../../src/data/repo/sites.ts';
import { BY, T0_MS, dumpDb, installationFields, reflectorFields, siteFields, useTestDb } from '../helpers.ts';

const jpeg = (n: number) => new Blob([new Uint8Array(n).fill(0xab)], { type: 'image/jpeg' });

describe('photos', () => {
  const db = useTestDb();
  async function installation() {
    const s = await siteRepo.create(db(), siteFields(), BY);
    const r = await reflectorRepo.create(db(), reflectorFields(s.id), BY);
    return installationRepo.create(db(), installationFields(s.id, r.id, { notes: 'typed by hand' }), BY);
  }

  it('suggests the boresight, the four cardinal views, the base and the foundation', () => {
    expect(SUGGESTED_PHOTO_ROLES).toEqual(['boresight', 'north', 'east', 'south', 'west', 'base', 'foundation']);
  });

  it('adds a photo, links it to its owner and records both in the history', async () => {
    const inst = await installation();
    const p = await addPhoto(db(), { table: 'installations', id: inst.id }, 'boresight', jpeg(1234), { ...BY, nowMs: T0_MS, takenAtMs: T0_MS - 5 });
    expect(p).toMatchObject({ ownerTable: 'installations', ownerId: inst.id, role: 'boresight', mime: 'image/jpeg', bytes: 1234, takenAtMs: T0_MS - 5, rev: 1 });
    const stored = (await listPhotos(db(), { table: 'installations', id: inst.id }))[0];
    expect(new Uint8Array(await stored.blob.arrayBuffer())).toEqual(new Uint8Array(1234).fill(0xab));
    const owner = await installationRepo.get(db(), inst.id);
    expect(owner).toMatchObject({ photoIds: [p.id], rev: 2 });
    expect((await history(db(), 'installations', inst.id)).at(-1)?.changes).toEqual([{ field: 'photoIds', before: [], after: [p.id] }]);
    expect((await history(db(), 'photos', p.id))[0].snapshot).not.toHaveProperty('blob');
  });

  it('stores the SHA-256 of the bytes with the photo (64 lowercase hex digits)', async () => {
    const inst = await installation();
    const p = await addPhoto(db(), { table: 'installations', id: inst.id }, 'north', new Blob(['abc'], { type: 'image/jpeg' }), BY);
    // NIST FIPS 180-2 (2002), Appendix B.1: SHA-256("abc").
    expect(p.sha256).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect((await db().photos.get(p.id))?.sha256).toBe(p.sha256);
  });

  it('refuses a photo that is too large with a clear message and keeps the text record unchanged', async () => {
    const inst = await installation();
    const before = await dumpDb(db());
    const err = await addPhoto(db(), { table: 'installations', id: inst.id }, 'north', jpeg(2_500_000), { ...BY, maxBytes: 2_000_000 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(PhotoTooLargeError);
    expect((err as Error).message).toBe(
      'The photo is 2.5 MB, more than the 2.0 MB limit; it was not saved (the record itself is kept). Retake it at a lower resolution.',
    );
    expect(await dumpDb(db())).toEqual(before);
    expect((await installationRepo.get(db(), inst.id))?.notes).toBe('typed by hand');
  });

  it('refuses non-images, empty files and missing owners', async () => {
    const inst = await installation();
    const owner = { table: 'installations' as const, id: inst.id };
    await expect(addPhoto(db(), owner, 'base', new Blob(['x'], { type: 'text/html' }), BY)).rejects.toThrow('must be an image type');
    await expect(addPhoto(db(), owner, 'base', jpeg(0), BY)).rejects.toBeInstanceOf(ValidationError);
    await expect(addPhoto(db(), { table: 'inspections', id: inst.id }, 'base', jpeg(10), BY)).rejects.toBeInstanceOf(MissingReferenceError);
  });

  it('soft delete takes a photo out of its owner and undelete puts it back', async () => {
    const inst = await installation();
    const owner = { table: 'installations' as const, id: inst.id };
    const p1 = await addPhoto(db(), owner, 'north', jpeg(10), BY);
    const p2 = await addPhoto(db(), owner, 'south', jpeg(10), BY);
    await softDeletePhoto(db(), p1.id, BY);
    expect((await listPhotos(db(), owner)).map((p) => p.id)).toEqual([p2.id]);
    expect((await installationRepo.get(db(), inst.id))?.photoIds).toEqual([p2.id]);
    await undeletePhoto(db(), p1.id, BY);
    expect((await installationRepo.get(db(), inst.id))?.photoIds).toEqual([p2.id, p1.id]);
    expect((await listPhotos(db(), owner, { includeDeleted: true })).length).toBe(2);
  });
});

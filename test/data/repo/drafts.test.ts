import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { clearDraft, loadDraft, saveDraft } from '../../../src/data/repo/drafts.ts';
import { T0_MS, useTestDb } from '../helpers.ts';

describe('drafts', () => {
  const db = useTestDb();

  it('saves, replaces, loads and clears a form draft', async () => {
    expect(await loadDraft(db(), 'installation-form')).toBeUndefined();
    await saveDraft(db(), 'installation-form', { notes: 'a', tiltDeg: -3 }, T0_MS);
    await saveDraft(db(), 'installation-form', { notes: 'ab', tiltDeg: -3, skipped: undefined }, T0_MS + 1);
    expect(await loadDraft(db(), 'installation-form')).toEqual({ value: { notes: 'ab', tiltDeg: -3 }, savedAtMs: T0_MS + 1 });
    await clearDraft(db(), 'installation-form');
    expect(await loadDraft(db(), 'installation-form')).toBeUndefined();
  });

  it('refuses an empty key and a value that is not JSON data', async () => {
    await expect(saveDraft(db(), '', {})).rejects.toThrow('key: must be a name of 1 to 100 characters');
    await expect(saveDraft(db(), 'k', undefined)).rejects.toThrow('value: must be JSON data');
  });
});

import { describe, expect, it } from 'vitest';
import type { ConflictRecord } from '../../../src/data/index.ts';
import { conflictView } from '../../../src/ui/pages/settings/conflictView.ts';

const ID = '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0001';
const base: ConflictRecord = {
  id: '0b0c6c36-54f5-4a39-9a43-3c2f4c2e0009',
  table: 'sites',
  recordId: ID,
  reason: 'revision 2 differs between the phones; the local version is kept',
  kept: 'local',
  other: { id: ID, rev: 2, createdAtMs: 1, updatedAtMs: 2, deletedAtMs: null, code: 'MF-01', notes: '<i>gate</i> open', latDeg: 52.4 },
  otherRevisions: [],
  detectedAtMs: Date.UTC(2027, 6, 2, 12),
  resolvedAtMs: null,
};

describe('conflict view', () => {
  it('names the record, says which version is kept, and lists the other version’s fields as text', () => {
    expect(conflictView(base)).toEqual({
      title: `site MF-01 (${ID})`,
      reason: base.reason,
      detected: 'Found 2027-07-02 12:00 UTC.',
      kept: "This phone's version is in the logbook; the other phone's version is below.",
      otherFields: ['deletedAtMs: null', 'code: MF-01', 'notes: <i>gate</i> open', 'latDeg: 52.4'],
    });
  });

  it('photo bytes are left out; a kept incoming version says so', () => {
    const v = conflictView({ ...base, table: 'photos', kept: 'incoming', other: { id: ID, role: 'north', dataBase64: 'AAAA', blob: {} } });
    expect(v.title).toBe(`photo (${ID})`);
    expect(v.kept).toMatch(/^The other phone's version is in the logbook/);
    expect(v.otherFields).toEqual(['role: north']);
  });
});

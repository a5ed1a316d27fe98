import { describe, expect, it } from 'vitest';
import { BackupError } from '../../../src/data/errors.ts';
import { messageOf } from '../../../src/ui/pages/settings/uiErrors.ts';

describe('messageOf', () => {
  it('passes the data layer’s plain messages through and words storage failures for the crew', () => {
    expect(messageOf(new BackupError('truncated', 'The backup file is incomplete.'))).toBe('The backup file is incomplete.');
    expect(messageOf(Object.assign(new Error('x'), { name: 'QuotaExceededError' }))).toMatch(/^The phone's storage for Glintmark is full, so nothing was written\./);
    expect(messageOf(Object.assign(new Error('x'), { name: 'DatabaseClosedError' }))).toMatch(/nothing was written\. Reload Glintmark/);
    expect(messageOf(Object.assign(new Error('x'), { name: 'VersionError' }))).toMatch(/newer Glintmark/);
    expect(messageOf('plain')).toBe('plain');
  });
});

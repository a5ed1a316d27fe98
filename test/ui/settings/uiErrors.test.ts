import { describe, expect, it } from 'vitest';
import { BackupError } from '../../../src/data/errors.ts';
import { messageOf } from '../../../src/ui/pages/settings/uiErrors.ts';
import { saveErrorMessage } from '../../../src/ui/pages/logbook/errorWords.ts';

describe('messageOf', () => {
  it('passes the data layer’s plain messages through and words storage failures for the crew', () => {
    expect(messageOf(new BackupError('truncated', 'The backup file is incomplete.'))).toBe('The backup file is incomplete.');
    expect(messageOf(Object.assign(new Error('x'), { name: 'QuotaExceededError' }))).toMatch(/^The phone's storage for Glintmark is full, so nothing was written\./);
    expect(messageOf(Object.assign(new Error('x'), { name: 'DatabaseClosedError' }))).toMatch(/nothing was written\. Reload Glintmark/);
    expect(messageOf(Object.assign(new Error('x'), { name: 'VersionError' }))).toMatch(/newer Glintmark/);
    expect(messageOf('plain')).toBe('plain');
  });

  it('never shows an engine error as it is', () => {
    for (const e of [new TypeError("Cannot read properties of null (reading 'dataBase64')"), new RangeError('Maximum call stack size exceeded'), Object.assign(new Error('Failed to execute put'), { name: 'DataCloneError' })]) {
      const m = messageOf(e);
      expect(m).toBe('Something went wrong inside Glintmark, so this was not done and nothing was changed. Try again; if it keeps failing, restart the app.');
      expect(saveErrorMessage(e)).toMatch(/^Not saved: something went wrong inside Glintmark\. Nothing was changed; your entries are still in the form\./);
      expect(saveErrorMessage(e)).not.toContain(e.message);
    }
  });
});

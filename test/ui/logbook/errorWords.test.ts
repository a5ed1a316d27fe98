import { describe, expect, it } from 'vitest';
import { DuplicateCodeError, PhotoTooLargeError, StaleRecordError, ValidationError } from '../../../src/data/index.ts';
import { saveErrorMessage } from '../../../src/ui/pages/logbook/errorWords.ts';

const named = (name: string, message = 'x') => Object.assign(new Error(message), { name });

describe('save errors in plain words', () => {
  it('shows the data layer’s own sentences and says the form is kept', () => {
    expect(saveErrorMessage(new DuplicateCodeError('MF-01', 'id'))).toBe(
      'Site code "MF-01" is already used by another site on this device; choose a different code. Nothing was changed; your entries are still in the form.',
    );
    expect(saveErrorMessage(new ValidationError('The site', [{ path: 'latDeg', message: 'bad' }]), false)).toBe('The site was not saved: latDeg: bad');
    expect(saveErrorMessage(new StaleRecordError('installations', 'id', 1, 2))).toBe(
      'This installation record was changed elsewhere (now revision 2, you edited revision 1). Your entries are still in the form: apply them to the current version (the other change stays in every field you did not edit), or discard them.',
    );
    expect(saveErrorMessage(new PhotoTooLargeError(9_100_000, 8_000_000))).toMatch(/^The photo is 9\.1 MB/);
  });
  it('explains storage-level failures without technical names', () => {
    expect(saveErrorMessage(named('QuotaExceededError'))).toMatch(/storage is full, so nothing was saved/);
    expect(saveErrorMessage(named('DatabaseClosedError'))).toMatch(/tap Save again/);
    expect(saveErrorMessage(named('VersionError'))).toMatch(/newer version of Glintmark/);
    expect(saveErrorMessage('boom', false)).toBe('Not saved: boom.');
  });
});

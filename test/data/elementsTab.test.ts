/**
 * A TAB (or any control character) inside an element line: the parser refuses that set with its line and column
 * and keeps the others, so storing the paste keeps every good set instead of refusing the whole batch.
 * Lines: the invented demo satellites GLINT-A and GLINT-B (src/demo/elements.ts).
 */
import 'fake-indexeddb/auto';
import { describe, expect, it } from 'vitest';
import { parseTle } from '../../src/core/orbit/tle.ts';
import { elementRepo } from '../../src/data/repo/elements.ts';
import { useTestDb } from './helpers.ts';

const L1 = '1 99001U 26990A   26332.50000000  .00000050  00000-0  10000-4 0  9996';
const L2 = '2 99001  98.1838 333.0000 0001150  90.0000   0.0000 14.59198740    12';
const B1 = '1 99002U 26990B   26332.50000000  .00000050  00000-0  10000-4 0  9997';
const B2 = '2 99002  98.1838 333.0000 0001150  90.0000 180.0000 14.59198740    12';

describe('control characters inside element lines', () => {
  const db = useTestDb();

  it('a TAB in line 1 is reported at its line and column; the other set is stored', async () => {
    const tabbed = `${L1.slice(0, 17)}\t${L1.slice(18)}`; // column 18 is a space in the original
    expect(tabbed.length).toBe(69);
    const r = parseTle(`GLINT-A\n${tabbed}\n${L2}\nGLINT-B\n${B1}\n${B2}\n`);
    expect(r.errors).toEqual([{ lineNumber: 2, column: 18, message: expect.stringMatching(/tab/i) }]);
    expect(r.sets.map((s) => s.catalogNumber)).toEqual(['99002']);
    const stored = await elementRepo.put(db(), r.sets);
    expect(stored.map((s) => s.catalogNumber)).toEqual(['99002']);
  });

  it('other control characters, in line 2 or the name line, likewise', () => {
    const r = parseTle(`GLINT\u0007A\n${L1}\n${L2.slice(0, 30)}\u0000${L2.slice(31)}\n${B1}\n${B2}\n`);
    expect(r.errors.map((e) => [e.lineNumber, e.column])).toEqual([[1, 6], [3, 31]]);
    expect(r.sets.map((s) => s.catalogNumber)).toEqual(['99002']);
  });
});

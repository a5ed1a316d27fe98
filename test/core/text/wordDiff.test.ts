import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { wordDiff, type DiffSegment } from '../../../src/core/text/wordDiff.ts';

const side = (segs: DiffSegment[], keep: 'removed' | 'added') => segs.filter((s) => s.kind === 'same' || s.kind === keep).map((s) => s.text).join('');
const changedWords = (segs: DiffSegment[]) => segs.filter((s) => s.kind !== 'same').map((s) => [s.kind, s.text]);

describe('word diff', () => {
  it('marks only the words that changed in an edited note (worked by hand)', () => {
    const before = 'Drain hole at the apex was blocked with leaves; cleared it.';
    const after = 'Drain hole at the apex was blocked with silt; cleared it and checked the bolts.';
    const d = wordDiff(before, after);
    // By hand: "leaves;" became "silt;", "it." became "it and checked the bolts."
    // (the space after a changed word goes with it)
    expect(changedWords(d)).toEqual([
      ['removed', 'leaves; '],
      ['added', 'silt; '],
      ['removed', 'it.'],
      ['added', 'it and checked the bolts.'],
    ]);
  });
  it('keeps equal texts as one unchanged segment, and handles empty sides', () => {
    expect(wordDiff('same words here', 'same words here')).toEqual([{ kind: 'same', text: 'same words here' }]);
    expect(wordDiff('', 'new note')).toEqual([{ kind: 'added', text: 'new note' }]);
    expect(wordDiff('old note', '')).toEqual([{ kind: 'removed', text: 'old note' }]);
  });
  it('an insertion in the middle of a long note shows just the inserted words', () => {
    const words = Array.from({ length: 300 }, (_, i) => `w${i}`);
    const after = [...words.slice(0, 150), 'INSERTED', ...words.slice(150)];
    expect(changedWords(wordDiff(words.join(' '), after.join(' ')))).toEqual([['added', 'INSERTED ']]);
  });
  it('property: each side is rebuilt exactly, and the common words are a longest common subsequence', () => {
    // Independent oracle: LCS length by plain recursion with memo, over the word lists.
    const lcs = (a: string[], b: string[]): number => {
      const memo = new Map<string, number>();
      const go = (i: number, j: number): number => {
        if (i === a.length || j === b.length) return 0;
        const k = `${i},${j}`;
        if (!memo.has(k)) memo.set(k, a[i] === b[j] ? 1 + go(i + 1, j + 1) : Math.max(go(i + 1, j), go(i, j + 1)));
        return memo.get(k)!;
      };
      return go(0, 0);
    };
    const word = fc.constantFrom('a', 'b', 'c', 'fen', 'gate');
    fc.assert(
      fc.property(fc.array(word, { maxLength: 12 }), fc.array(word, { maxLength: 12 }), (wa, wb) => {
        const a = wa.join(' ');
        const b = wb.join(' ');
        const d = wordDiff(a, b);
        expect(side(d, 'removed')).toBe(a);
        expect(side(d, 'added')).toBe(b);
        const sameWords = d.filter((s) => s.kind === 'same').flatMap((s) => s.text.split(/\s+/).filter(Boolean));
        expect(sameWords.length).toBe(lcs(wa, wb));
      }),
    );
  });
});

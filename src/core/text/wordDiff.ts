/**
 * Word-level difference of two texts: the longest common subsequence of their words (whitespace runs kept as
 * tokens so the text reads as typed), by the classic dynamic programme (Wagner & Fischer, "The String-to-String
 * Correction Problem", J. ACM 21(1), 1974; Hunt & McIlroy, "An Algorithm for Differential File Comparison", Bell Labs
 * CSTR 41, 1976, use the same LCS idea on lines). A common prefix and suffix are taken off first; when the middle is
 * still too large for the table (over MAX_CELLS), the middle is reported as one removal and one addition.
 */
export type DiffKind = 'same' | 'removed' | 'added';
export interface DiffSegment {
  kind: DiffKind;
  text: string;
}

/** Largest LCS table filled, cells (about 16 MB of Uint32): beyond it the middle is shown whole. */
export const MAX_CELLS = 4_000_000;

const tokens = (s: string): string[] => s.split(/(\s+)/).filter((t) => t !== '');
const weight = (t: string): number => (/^\s/.test(t) ? 0 : 1);

/** Adjacent segments of one kind merged. */
function push(out: DiffSegment[], kind: DiffKind, text: string): void {
  if (text === '') return;
  const last = out.at(-1);
  if (last && last.kind === kind) last.text += text;
  else out.push({ kind, text });
}

export function wordDiff(before: string, after: string): DiffSegment[] {
  const a = tokens(before);
  const b = tokens(after);
  let start = 0;
  while (start < a.length && start < b.length && a[start] === b[start]) start++;
  let endA = a.length;
  let endB = b.length;
  while (endA > start && endB > start && a[endA - 1] === b[endB - 1]) {
    endA--;
    endB--;
  }
  const out: DiffSegment[] = [];
  push(out, 'same', a.slice(0, start).join(''));
  const ma = a.slice(start, endA);
  const mb = b.slice(start, endB);
  const n = ma.length;
  const m = mb.length;
  if ((n + 1) * (m + 1) > MAX_CELLS) {
    push(out, 'removed', ma.join(''));
    push(out, 'added', mb.join(''));
  } else {
    // len[i][j] = words in common of ma[i..] and mb[j..] (whitespace weighs 0, so words are matched, not gaps), filled
    // from the end. Taking a match whenever two tokens are equal stays optimal with these weights: dropping one token
    // from a side lowers the common weight by at most that token's weight.
    const w = m + 1;
    const len = new Uint32Array((n + 1) * w);
    for (let i = n - 1; i >= 0; i--) {
      for (let j = m - 1; j >= 0; j--) {
        len[i * w + j] = ma[i] === mb[j] ? len[(i + 1) * w + j + 1] + weight(ma[i]) : Math.max(len[(i + 1) * w + j], len[i * w + j + 1]);
      }
    }
    let i = 0;
    let j = 0;
    while (i < n && j < m) {
      if (ma[i] === mb[j]) {
        push(out, 'same', ma[i]);
        i++;
        j++;
      } else if (len[(i + 1) * w + j] >= len[i * w + j + 1]) push(out, 'removed', ma[i++]);
      else push(out, 'added', mb[j++]);
    }
    while (i < n) push(out, 'removed', ma[i++]);
    while (j < m) push(out, 'added', mb[j++]);
  }
  push(out, 'same', a.slice(endA).join(''));
  return out;
}

/**
 * Base64 (RFC 4648 §4, standard alphabet, padded) for photo bytes in JSON backups (format 1). Uses btoa/atob,
 * present in browsers and Node ≥ 16, in chunks so a large photo does not overflow the argument list.
 *
 * The check is one pass over the character codes (linear time, constant stack): a regular expression with a
 * repeated group overflows the engine's backtracking stack on strings of a few MB (a 4 MB photo is 5.3 M characters).
 */
const CHUNK = 0x8000;

function bytesToBase64(bytes: Uint8Array): string {
  let bin = '';
  for (let i = 0; i < bytes.length; i += CHUNK) bin += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  return btoa(bin);
}

/** True for a character code of the RFC 4648 §4 alphabet (A–Z, a–z, 0–9, '+', '/'). */
function isAlphabet(c: number): boolean {
  return (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || (c >= 48 && c <= 57) || c === 43 || c === 47;
}

/** Decoded length of a valid base64 string, without decoding it; -1 when the text is not base64. */
export function base64DecodedLength(text: string): number {
  const n = text.length;
  if (n % 4 !== 0) return -1;
  // Padding: at most two '=' and only at the very end.
  const pad = n >= 1 && text.charCodeAt(n - 1) === 61 ? (n >= 2 && text.charCodeAt(n - 2) === 61 ? 2 : 1) : 0;
  for (let i = 0; i < n - pad; i++) if (!isAlphabet(text.charCodeAt(i))) return -1;
  return (n / 4) * 3 - pad;
}

/** Bytes of a base64 string; the caller has checked it with base64DecodedLength. */
export function base64ToBytes(text: string): Uint8Array<ArrayBuffer> {
  const bin = atob(text);
  const out = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) out[i] = bin.charCodeAt(i);
  return out;
}

export async function blobToBase64(blob: Blob): Promise<string> {
  return bytesToBase64(new Uint8Array(await blob.arrayBuffer()));
}

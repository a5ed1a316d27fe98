/**
 * Base64 (RFC 4648 §4, standard alphabet, padded) for photo bytes in backups. Uses btoa/atob, present in
 * browsers and Node ≥ 16, in chunks so a large photo does not overflow the argument list.
 */
const CHUNK = 0x8000;
const BASE64 = /^(?:[A-Za-z0-9+/]{4})*(?:[A-Za-z0-9+/]{2}==|[A-Za-z0-9+/]{3}=)?$/;

function bytesToBase64(bytes: Uint8Array): string {
  let bin = '';
  for (let i = 0; i < bytes.length; i += CHUNK) bin += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  return btoa(bin);
}

/** Decoded length of a valid base64 string, without decoding it; -1 when the text is not base64. */
export function base64DecodedLength(text: string): number {
  if (text.length % 4 !== 0 || !BASE64.test(text)) return -1;
  const pad = text.endsWith('==') ? 2 : text.endsWith('=') ? 1 : 0;
  return (text.length / 4) * 3 - pad;
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

/**
 * SHA-256 (FIPS 180-4) as 64 lowercase hexadecimal digits, through Web Crypto (`crypto.subtle.digest`, present in
 * browsers on secure origins, in Capacitor WebViews and in Node ≥ 17). Photo bytes are hashed whole: one photo is at
 * most the photo limit (8 MB), so memory stays bounded per photo.
 */
const HEX = Array.from({ length: 256 }, (_, i) => i.toString(16).padStart(2, '0'));

export function toHex(bytes: Uint8Array): string {
  let s = '';
  for (let i = 0; i < bytes.length; i++) s += HEX[bytes[i]];
  return s;
}

/** SHA-256 of bytes, a Blob or UTF-8 text. */
export async function sha256Hex(data: Blob | Uint8Array<ArrayBuffer> | ArrayBuffer | string): Promise<string> {
  const buf = typeof data === 'string' ? new TextEncoder().encode(data) : data instanceof Blob ? await data.arrayBuffer() : data;
  return toHex(new Uint8Array(await crypto.subtle.digest('SHA-256', buf)));
}

/** 64 lowercase hex digits. */
export const SHA256_HEX = /^[0-9a-f]{64}$/;

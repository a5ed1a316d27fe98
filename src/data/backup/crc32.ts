/**
 * CRC-32 of ZIP archives: the reflected polynomial 0xEDB88320 (x³² + x²⁶ + … + 1), initial value and final XOR
 * 0xFFFFFFFF (PKWARE APPNOTE.TXT 6.3.10 §4.4.7; "CRC-32/ISO-HDLC" in Greg Cook's Catalogue of parametrised CRC
 * algorithms, check value 0xCBF43926 for "123456789"). Table-driven, eight bytes per step ("slicing-by-8").
 */
const TABLES: Uint32Array[] = (() => {
  const t0 = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t0[n] = c >>> 0;
  }
  const out = [t0];
  for (let s = 1; s < 8; s++) {
    const prev = out[s - 1];
    const t = new Uint32Array(256);
    for (let n = 0; n < 256; n++) t[n] = (prev[n] >>> 8) ^ t0[prev[n] & 0xff];
    out.push(t);
  }
  return out;
})();

/** Continue a CRC-32 over more bytes: crc32(b, crc32(a)) === crc32(a ‖ b). Start from 0. */
export function crc32(bytes: Uint8Array, previous = 0): number {
  const [t0, t1, t2, t3, t4, t5, t6, t7] = TABLES;
  let c = ~previous >>> 0;
  let i = 0;
  const n8 = bytes.length - (bytes.length % 8);
  for (; i < n8; i += 8) {
    const a = (c ^ (bytes[i] | (bytes[i + 1] << 8) | (bytes[i + 2] << 16) | (bytes[i + 3] << 24))) >>> 0;
    c =
      t7[a & 0xff] ^ t6[(a >>> 8) & 0xff] ^ t5[(a >>> 16) & 0xff] ^ t4[a >>> 24] ^
      t3[bytes[i + 4]] ^ t2[bytes[i + 5]] ^ t1[bytes[i + 6]] ^ t0[bytes[i + 7]];
  }
  for (; i < bytes.length; i++) c = t0[(c ^ bytes[i]) & 0xff] ^ (c >>> 8);
  return ~c >>> 0;
}

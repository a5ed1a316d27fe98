/**
 * The content-addressed photo store: one file per distinct photo, named by the SHA-256 of its bytes
 * (`<dir>/ab/abcdef…`). A file is written to a temporary name, fsynced, renamed into place and its folder fsynced,
 * so a crash leaves either no file or the whole file; only then may a row name it. Reads check the hash again.
 */
import { createHash, randomBytes } from 'node:crypto';
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { RegisterError } from './errors.ts';

export const SHA256_RE = /^[0-9a-f]{64}$/;
export const MAX_PHOTO_UPLOAD_BYTES = 25 * 1024 * 1024;

export const sha256Hex = (bytes: Uint8Array): string => createHash('sha256').update(bytes).digest('hex');

/**
 * The image type the bytes start like, or null. Magic numbers: JPEG FF D8 FF (ITU-T T.81 / JFIF), PNG's 8-byte
 * signature (ISO/IEC 15948 section 5.2), WebP "RIFF....WEBP" (RFC 9649 section 2), GIF "GIF8", and the ISO base
 * media file format's "ftyp" box with an image brand (HEIC/HEIF/AVIF, ISO/IEC 23008-12).
 */
export function imageKind(b: Uint8Array): string | null {
  const ascii = (from: number, to: number) => String.fromCharCode(...b.subarray(from, to));
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return 'image/jpeg';
  if (b.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((x, i) => b[i] === x)) return 'image/png';
  if (b.length >= 12 && ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return 'image/webp';
  if (b.length >= 6 && (ascii(0, 6) === 'GIF87a' || ascii(0, 6) === 'GIF89a')) return 'image/gif';
  if (b.length >= 12 && ascii(4, 8) === 'ftyp' && /^(heic|heix|hevc|hevx|heim|heis|mif1|msf1|avif|avis)$/.test(ascii(8, 12))) return ascii(8, 12).startsWith('av') ? 'image/avif' : 'image/heic';
  return null;
}

export class PhotoStore {
  constructor(readonly dir: string) {}

  pathOf(sha: string): string {
    return path.join(this.dir, sha.slice(0, 2), sha);
  }

  async has(sha: string): Promise<boolean> {
    try {
      await fs.access(this.pathOf(sha));
      return true;
    } catch {
      return false;
    }
  }

  /** Check and store; true when newly written, false when already held. Refuses non-images and wrong hashes. */
  async put(sha: string, bytes: Uint8Array): Promise<boolean> {
    if (!SHA256_RE.test(sha)) throw new RegisterError(400, 'bad-hash', 'A photo is named by the SHA-256 of its bytes: 64 lowercase hexadecimal characters.');
    if (sha256Hex(bytes) !== sha) throw new RegisterError(422, 'hash-mismatch', 'The photo arrived damaged: its bytes do not match its fingerprint (SHA-256). Nothing was stored; send it again.');
    if (!imageKind(bytes)) throw new RegisterError(415, 'not-an-image', 'This file is not a photo (JPEG, PNG, WebP, GIF or HEIC); nothing was stored.');
    if (await this.has(sha)) return false;
    const folder = path.dirname(this.pathOf(sha));
    await fs.mkdir(folder, { recursive: true });
    const tmp = path.join(folder, `.${sha}.${randomBytes(6).toString('hex')}.tmp`);
    const fh = await fs.open(tmp, 'wx');
    try {
      await fh.writeFile(bytes);
      await fh.sync();
    } finally {
      await fh.close();
    }
    await fs.rename(tmp, this.pathOf(sha));
    const dh = await fs.open(folder, 'r');
    try {
      await dh.sync();
    } finally {
      await dh.close();
    }
    return true;
  }

  /** The bytes, checked against their name; a damaged or missing file is an error, never silent. */
  async get(sha: string): Promise<Uint8Array> {
    let bytes: Uint8Array;
    try {
      bytes = await fs.readFile(this.pathOf(sha));
    } catch {
      throw new RegisterError(404, 'no-photo', 'The register does not hold this photo.');
    }
    if (sha256Hex(bytes) !== sha) throw new RegisterError(500, 'photo-damaged', 'The stored copy of this photo is damaged (its bytes no longer match its fingerprint). Restore the photo folder from its backup.');
    return bytes;
  }
}

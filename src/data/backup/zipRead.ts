/**
 * Reading a ZIP archive held in a Blob by its central directory, without loading it: only the directory and the
 * entries asked for are read, each by slicing the Blob. Follows PKWARE, ".ZIP File Format Specification" (APPNOTE.TXT
 * version 6.3.10, 2022): end of central directory record §4.3.16, central directory file header §4.3.12, local file
 * header §4.3.7, CRC-32 §4.4.7. ZIP64 and encryption are not read (backups stay below 4 GB and are never encrypted).
 * Failures throw ZipDamage with a plain sentence; callers wrap it in their own error.
 */
import { crc32 } from './crc32.ts';

export class ZipDamage extends Error {
  override readonly name = 'ZipDamage';
  constructor(
    message: string,
    readonly truncated = false,
  ) {
    super(message);
  }
}

export interface ZipEntry {
  name: string;
  /** 0 = stored, 8 = deflated. */
  method: number;
  crc32: number;
  compressedSize: number;
  size: number;
  /** Offset of the entry's data (after its local header) in the archive. */
  dataStart: number;
}

const EOCD_SIG = 0x06054b50;
const CEN_SIG = 0x02014b50;
const LOC_SIG = 0x04034b50;
const EOCD_LEN = 22;
const CEN_LEN = 46;
const LOC_LEN = 30;
const MAX_COMMENT = 0xffff;

const bytesOf = async (blob: Blob, start: number, end: number) => new Uint8Array(await blob.slice(start, end).arrayBuffer());

/** True when the blob starts with a local file header ("PK\3\4"), i.e. it is meant to be a ZIP archive. */
export async function looksLikeZip(blob: Blob): Promise<boolean> {
  if (blob.size < 4) return false;
  const b = await bytesOf(blob, 0, 4);
  return new DataView(b.buffer).getUint32(0, true) === LOC_SIG;
}

/** Every entry of the archive, in directory order, with the offset of its data checked against its local header. */
export async function readZipDirectory(blob: Blob): Promise<ZipEntry[]> {
  const tailStart = Math.max(0, blob.size - EOCD_LEN - MAX_COMMENT);
  const tail = await bytesOf(blob, tailStart, blob.size);
  const tv = new DataView(tail.buffer);
  let eocd = -1;
  for (let i = tail.length - EOCD_LEN; i >= 0; i--) {
    if (tv.getUint32(i, true) === EOCD_SIG && i + EOCD_LEN + tv.getUint16(i + 20, true) === tail.length) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) throw new ZipDamage('its table of contents at the end of the file is missing', true);
  const disk = tv.getUint16(eocd + 4, true);
  const cdDisk = tv.getUint16(eocd + 6, true);
  const count = tv.getUint16(eocd + 10, true);
  const cdSize = tv.getUint32(eocd + 12, true);
  const cdOffset = tv.getUint32(eocd + 16, true);
  if (disk !== 0 || cdDisk !== 0 || count !== tv.getUint16(eocd + 8, true)) throw new ZipDamage('it is split over several files, which this app does not read');
  if (count === 0xffff || cdSize === 0xffffffff || cdOffset === 0xffffffff) throw new ZipDamage('it is larger than 4 GB (ZIP64), which this app does not read');
  const eocdAt = tailStart + eocd;
  if (cdOffset + cdSize > eocdAt) throw new ZipDamage('its table of contents points past the end of the file', true);
  const cd = await bytesOf(blob, cdOffset, cdOffset + cdSize);
  const cv = new DataView(cd.buffer);
  const names = new TextDecoder('utf-8', { fatal: false });
  const entries: ZipEntry[] = [];
  let p = 0;
  for (let k = 0; k < count; k++) {
    if (p + CEN_LEN > cd.length || cv.getUint32(p, true) !== CEN_SIG) throw new ZipDamage('its table of contents is damaged');
    const flags = cv.getUint16(p + 8, true);
    const method = cv.getUint16(p + 10, true);
    const crc = cv.getUint32(p + 16, true);
    const compressedSize = cv.getUint32(p + 20, true);
    const size = cv.getUint32(p + 24, true);
    const nameLen = cv.getUint16(p + 28, true);
    const extraLen = cv.getUint16(p + 30, true);
    const commentLen = cv.getUint16(p + 32, true);
    const local = cv.getUint32(p + 42, true);
    if (p + CEN_LEN + nameLen > cd.length) throw new ZipDamage('its table of contents is damaged');
    const name = names.decode(cd.subarray(p + CEN_LEN, p + CEN_LEN + nameLen));
    if (flags & 1) throw new ZipDamage(`${name} is encrypted`);
    p += CEN_LEN + nameLen + extraLen + commentLen;
    if (local + LOC_LEN > cdOffset) throw new ZipDamage(`${name} starts past the end of the data`, true);
    const lh = await bytesOf(blob, local, local + LOC_LEN);
    const lv = new DataView(lh.buffer);
    if (lv.getUint32(0, true) !== LOC_SIG || lv.getUint16(8, true) !== method) throw new ZipDamage(`the header of ${name} is damaged`);
    const dataStart = local + LOC_LEN + lv.getUint16(26, true) + lv.getUint16(28, true);
    if (dataStart + compressedSize > cdOffset) throw new ZipDamage(`${name} runs past the end of the data`, true);
    entries.push({ name, method, crc32: crc, compressedSize, size, dataStart });
  }
  return entries;
}

/** The entry's stored bytes (compressed as they lie in the archive). */
export const rawEntryBytes = (blob: Blob, e: ZipEntry): Promise<Uint8Array<ArrayBuffer>> => bytesOf(blob, e.dataStart, e.dataStart + e.compressedSize);

/** The entry's data as a Blob slice of the archive (stored entries only; nothing is read). */
export function storedEntryBlob(blob: Blob, e: ZipEntry, type: string): Blob {
  if (e.method !== 0) throw new ZipDamage(`${e.name} is compressed, but photos are stored uncompressed`);
  return blob.slice(e.dataStart, e.dataStart + e.size, type);
}

/** Throws unless `bytes` (the entry's uncompressed data) has the size and CRC-32 its directory entry states. */
export function checkEntryData(e: ZipEntry, bytes: Uint8Array): void {
  if (bytes.length !== e.size) throw new ZipDamage(`${e.name} holds ${bytes.length} bytes where its table of contents says ${e.size}`);
  if (crc32(bytes) !== e.crc32) throw new ZipDamage(`${e.name} does not match its checksum (CRC-32)`);
}

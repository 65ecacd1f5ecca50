/**
 * Reads a zip file's central directory (names and declared sizes) without inflating anything,
 * so that type detection and the zip-bomb limits run before any decompression.
 * Format: PKWARE APPNOTE.TXT 6.3.x, sections 4.3.12 (central directory header),
 * 4.3.14–4.3.16 (ZIP64 end of central directory record and locator, end of central directory).
 */

export interface ZipEntryInfo {
  name: string;
  /** 0 stored, 8 deflate, anything else unsupported by the reader */
  method: number;
  /** general purpose bit 0: the entry is encrypted */
  encrypted: boolean;
  compressedSize: number;
  uncompressedSize: number;
}

export type ZipDirectory =
  | { ok: true; entries: ZipEntryInfo[]; totalUncompressed: number }
  | { ok: false; reason: string };

const EOCD_SIGNATURE = 0x06054b50;
const ZIP64_LOCATOR_SIGNATURE = 0x07064b50;
const ZIP64_EOCD_SIGNATURE = 0x06064b50;
const CENTRAL_SIGNATURE = 0x02014b50;
/** more entries than any workbook has; a guard against directories made to exhaust memory */
export const MAX_ZIP_ENTRIES = 10_000;

export function isZipSignature(bytes: Uint8Array): boolean {
  return (
    bytes.length >= 4 &&
    bytes[0] === 0x50 &&
    bytes[1] === 0x4b &&
    ((bytes[2] === 0x03 && bytes[3] === 0x04) || (bytes[2] === 0x05 && bytes[3] === 0x06))
  );
}

function u64(view: DataView, offset: number): number {
  return view.getUint32(offset, true) + view.getUint32(offset + 4, true) * 2 ** 32;
}

const nameDecoder = new TextDecoder('utf-8');

export function readZipDirectory(bytes: Uint8Array): ZipDirectory {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const length = bytes.length;
  if (length < 22) return { ok: false, reason: 'too short for a zip file' };
  // the end-of-central-directory record sits in the last 22 + 65535 bytes (comment at most 64 kB)
  let eocd = -1;
  const stop = Math.max(0, length - 22 - 0xffff);
  for (let i = length - 22; i >= stop; i--) {
    if (bytes[i] === 0x50 && view.getUint32(i, true) === EOCD_SIGNATURE) {
      eocd = i;
      break;
    }
  }
  if (eocd < 0) return { ok: false, reason: 'no end-of-central-directory record' };
  let entryCount = view.getUint16(eocd + 10, true);
  let directorySize = view.getUint32(eocd + 12, true);
  let directoryOffset = view.getUint32(eocd + 16, true);
  if (entryCount === 0xffff || directorySize === 0xffffffff || directoryOffset === 0xffffffff) {
    const locator = eocd - 20;
    if (locator < 0 || view.getUint32(locator, true) !== ZIP64_LOCATOR_SIGNATURE) {
      return { ok: false, reason: 'ZIP64 locator missing' };
    }
    const record = u64(view, locator + 8);
    if (record + 56 > length || view.getUint32(record, true) !== ZIP64_EOCD_SIGNATURE) {
      return { ok: false, reason: 'ZIP64 end record missing' };
    }
    entryCount = u64(view, record + 32);
    directorySize = u64(view, record + 40);
    directoryOffset = u64(view, record + 48);
  }
  if (entryCount > MAX_ZIP_ENTRIES) return { ok: false, reason: `${entryCount} entries (limit ${MAX_ZIP_ENTRIES})` };
  if (directoryOffset + directorySize > length) return { ok: false, reason: 'central directory outside the file' };

  const entries: ZipEntryInfo[] = [];
  let totalUncompressed = 0;
  let p = directoryOffset;
  for (let n = 0; n < entryCount; n++) {
    if (p + 46 > length || view.getUint32(p, true) !== CENTRAL_SIGNATURE) {
      return { ok: false, reason: `central directory entry ${n + 1} is damaged` };
    }
    const flags = view.getUint16(p + 8, true);
    const method = view.getUint16(p + 10, true);
    let compressedSize = view.getUint32(p + 20, true);
    let uncompressedSize = view.getUint32(p + 24, true);
    const nameLength = view.getUint16(p + 28, true);
    const extraLength = view.getUint16(p + 30, true);
    const commentLength = view.getUint16(p + 32, true);
    const nameStart = p + 46;
    const extraStart = nameStart + nameLength;
    const next = extraStart + extraLength + commentLength;
    if (next > length) return { ok: false, reason: `central directory entry ${n + 1} runs past the end` };
    const name = nameDecoder.decode(bytes.subarray(nameStart, extraStart));
    if (uncompressedSize === 0xffffffff || compressedSize === 0xffffffff) {
      // ZIP64 extended information extra field (header id 0x0001): the 8-byte sizes, in order
      let q = extraStart;
      const extraEnd = extraStart + extraLength;
      while (q + 4 <= extraEnd) {
        const id = view.getUint16(q, true);
        const size = view.getUint16(q + 2, true);
        if (id === 0x0001) {
          let r = q + 4;
          if (uncompressedSize === 0xffffffff && r + 8 <= q + 4 + size) {
            uncompressedSize = u64(view, r);
            r += 8;
          }
          if (compressedSize === 0xffffffff && r + 8 <= q + 4 + size) compressedSize = u64(view, r);
          break;
        }
        q += 4 + size;
      }
    }
    entries.push({ name, method, encrypted: (flags & 1) === 1, compressedSize, uncompressedSize });
    totalUncompressed += uncompressedSize;
    p = next;
  }
  return { ok: true, entries, totalUncompressed };
}

/**
 * Lists the stream names of an OLE2 compound file (CFB) — the container of legacy .xls workbooks
 * and of password-protected OOXML workbooks — without reading any stream.
 * Format: [MS-CFB] Compound File Binary File Format, sections 2.2 (header), 2.3 (FAT),
 * 2.5 (DIFAT), 2.6 (directory entries).
 */

export const CFB_SIGNATURE = [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1];

export function isCompoundFile(bytes: Uint8Array): boolean {
  if (bytes.length < 8) return false;
  for (let i = 0; i < 8; i++) if (bytes[i] !== CFB_SIGNATURE[i]) return false;
  return true;
}

const END_OF_CHAIN = 0xfffffffe;
const KNOWN_NAMES = ['EncryptionInfo', 'EncryptedPackage', 'Workbook', 'Book', 'WordDocument', 'PowerPoint Document'];

/**
 * Stream and storage names in the directory. Falls back to searching the bytes for the
 * UTF-16LE names that matter when the directory cannot be followed (truncated files).
 */
export function compoundFileNames(bytes: Uint8Array): string[] {
  try {
    const names = readDirectoryNames(bytes);
    if (names.length > 0) return names;
  } catch {
    // fall through to the byte search
  }
  return KNOWN_NAMES.filter((name) => containsUtf16(bytes, name));
}

function readDirectoryNames(bytes: Uint8Array): string[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.length < 512) return [];
  const sectorShift = view.getUint16(0x1e, true);
  if (sectorShift !== 9 && sectorShift !== 12) return [];
  const sectorSize = 1 << sectorShift;
  const sectorCount = Math.floor(bytes.length / sectorSize) - 1;
  const sectorOffset = (sector: number) => (sector + 1) * sectorSize;
  const perSector = sectorSize / 4;

  // FAT sector locations: the first 109 in the header, the rest in the DIFAT chain
  const fatSectors: number[] = [];
  for (let i = 0; i < 109; i++) {
    const s = view.getUint32(0x4c + i * 4, true);
    if (s < sectorCount) fatSectors.push(s);
  }
  let difat = view.getUint32(0x44, true);
  for (let guard = 0; difat < sectorCount && guard < sectorCount; guard++) {
    const base = sectorOffset(difat);
    for (let i = 0; i < perSector - 1; i++) {
      const s = view.getUint32(base + i * 4, true);
      if (s < sectorCount) fatSectors.push(s);
    }
    difat = view.getUint32(base + (perSector - 1) * 4, true);
  }
  const nextSector = (sector: number): number => {
    const fatIndex = Math.floor(sector / perSector);
    if (fatIndex >= fatSectors.length) return END_OF_CHAIN;
    const at = sectorOffset(fatSectors[fatIndex]) + (sector % perSector) * 4;
    return at + 4 <= bytes.length ? view.getUint32(at, true) : END_OF_CHAIN;
  };

  const names: string[] = [];
  let sector = view.getUint32(0x30, true);
  for (let guard = 0; sector < sectorCount && guard <= sectorCount; guard++) {
    const base = sectorOffset(sector);
    for (let e = 0; e < sectorSize / 128; e++) {
      const entry = base + e * 128;
      if (entry + 128 > bytes.length) break;
      const type = bytes[entry + 0x42];
      const nameBytes = view.getUint16(entry + 0x40, true);
      if (type === 0 || nameBytes < 2 || nameBytes > 64) continue;
      let name = '';
      for (let i = 0; i + 2 < nameBytes; i += 2) name += String.fromCharCode(view.getUint16(entry + i, true));
      names.push(name);
    }
    sector = nextSector(sector);
  }
  return names;
}

function containsUtf16(bytes: Uint8Array, text: string): boolean {
  const first = text.charCodeAt(0);
  outer: for (let i = 0; i + text.length * 2 <= bytes.length; i++) {
    if (bytes[i] !== first || bytes[i + 1] !== 0) continue;
    for (let k = 1; k < text.length; k++) {
      if (bytes[i + 2 * k] !== text.charCodeAt(k) || bytes[i + 2 * k + 1] !== 0) continue outer;
    }
    return true;
  }
  return false;
}

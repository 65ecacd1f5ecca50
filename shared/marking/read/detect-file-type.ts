/**
 * Decides what an uploaded file is from its bytes (never from its name): OOXML workbook,
 * macro workbook, encrypted or legacy OLE2 workbook, PDF, or text (with its encoding).
 */
import { compoundFileNames, isCompoundFile } from './compound-file';
import type { TextEncodingName } from './types';
import { isZipSignature, readZipDirectory, type ZipEntryInfo } from './zip-directory';

export type FileKind =
  | 'empty'
  | 'xlsx'
  | 'xlsm'
  | 'encrypted'
  | 'xls'
  | 'pdf'
  | 'text'
  | 'broken-zip'
  | 'unknown';

export interface DetectedFileType {
  kind: FileKind;
  /** for people: "Excel workbook (.xlsx)", "text (UTF-8, with BOM)", "OpenDocument spreadsheet" … */
  description: string;
  /** text only */
  encoding?: TextEncodingName;
  bom?: boolean;
  /** when the file name's extension claims another kind than the content ("xlsx", "csv" …) */
  nameSuggests?: string;
}

/** What detection learned, for the reader to reuse (zip directory, decoded text). */
export interface Sniffed extends DetectedFileType {
  zipEntries?: ZipEntryInfo[];
  zipTotalUncompressed?: number;
  text?: string;
}

export function detectFileType(bytes: Uint8Array, fileName?: string): DetectedFileType {
  const { zipEntries: _entries, zipTotalUncompressed: _total, text: _text, ...detected } = sniffFile(bytes, fileName);
  return detected;
}

const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"

export function sniffFile(bytes: Uint8Array, fileName?: string): Sniffed {
  const result = sniffContent(bytes);
  const claimed = extensionKind(fileName);
  if (claimed && !extensionAgrees(claimed, result.kind)) result.nameSuggests = claimed;
  return result;
}

function sniffContent(bytes: Uint8Array): Sniffed {
  if (bytes.length === 0) return { kind: 'empty', description: 'an empty file' };
  if (isZipSignature(bytes)) return sniffZip(bytes);
  if (isCompoundFile(bytes)) {
    const names = new Set(compoundFileNames(bytes));
    if (names.has('EncryptionInfo') || names.has('EncryptedPackage')) {
      return { kind: 'encrypted', description: 'a password-protected (encrypted) workbook' };
    }
    if (names.has('Workbook') || names.has('Book')) {
      return { kind: 'xls', description: 'a legacy Excel 97–2003 workbook (.xls)' };
    }
    if (names.has('WordDocument')) return { kind: 'unknown', description: 'a legacy Word document (.doc)' };
    return { kind: 'xls', description: 'a legacy Office file (OLE2 container, probably .xls)' };
  }
  const head = Math.min(bytes.length, 1024);
  for (let i = 0; i + PDF_MAGIC.length <= head; i++) {
    if (PDF_MAGIC.every((b, k) => bytes[i + k] === b)) return { kind: 'pdf', description: 'a PDF document' };
  }
  return sniffText(bytes);
}

function sniffZip(bytes: Uint8Array): Sniffed {
  const directory = readZipDirectory(bytes);
  if (!directory.ok) return { kind: 'broken-zip', description: `a damaged zip file (${directory.reason})` };
  const names = new Set(directory.entries.map((e) => e.name.replace(/^\/+/, '').toLowerCase()));
  const base = { zipEntries: directory.entries, zipTotalUncompressed: directory.totalUncompressed };
  if (directory.entries.some((e) => e.encrypted)) {
    return { kind: 'encrypted', description: 'a password-protected zip file', ...base };
  }
  if ([...names].some((n) => n.endsWith('vbaproject.bin'))) {
    return { kind: 'xlsm', description: 'a macro-enabled workbook (.xlsm)', ...base };
  }
  if (names.has('[content_types].xml') && names.has('xl/workbook.xml')) {
    return { kind: 'xlsx', description: 'an Excel workbook (.xlsx)', ...base };
  }
  if (names.has('xl/workbook.bin')) return { kind: 'unknown', description: 'a binary Excel workbook (.xlsb)', ...base };
  if (names.has('mimetype') && names.has('content.xml')) {
    return { kind: 'unknown', description: 'an OpenDocument file (.ods/.odt)', ...base };
  }
  if (names.has('word/document.xml')) return { kind: 'unknown', description: 'a Word document (.docx)', ...base };
  if ([...names].some((n) => n.startsWith('ppt/'))) return { kind: 'unknown', description: 'a PowerPoint file', ...base };
  return { kind: 'unknown', description: 'a zip archive that holds no workbook', ...base };
}

const utf8Strict = new TextDecoder('utf-8', { fatal: true });

function sniffText(bytes: Uint8Array): Sniffed {
  let text: string;
  let encoding: TextEncodingName;
  let bom = false;
  try {
    if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) {
      bom = true;
      encoding = 'utf-8';
      text = utf8Strict.decode(bytes.subarray(3));
    } else if (bytes[0] === 0xff && bytes[1] === 0xfe) {
      bom = true;
      encoding = 'utf-16le';
      text = new TextDecoder('utf-16le', { fatal: true }).decode(bytes.subarray(2));
    } else if (bytes[0] === 0xfe && bytes[1] === 0xff) {
      bom = true;
      encoding = 'utf-16be';
      text = new TextDecoder('utf-16be', { fatal: true }).decode(bytes.subarray(2));
    } else {
      const guessed = guessUnmarkedEncoding(bytes);
      if (!guessed) return { kind: 'unknown', description: 'binary data (not text, not a workbook)' };
      encoding = guessed;
      text = new TextDecoder(guessed, guessed === 'utf-8' ? { fatal: true } : {}).decode(bytes);
    }
  } catch {
    return { kind: 'unknown', description: 'text that is not valid UTF-8 or UTF-16' };
  }
  if (!mostlyPrintable(text)) return { kind: 'unknown', description: 'binary data (not text, not a workbook)' };
  if (text.trim() === '') return { kind: 'empty', description: 'a file with only blank lines' };
  const label = encoding === 'windows-1252' ? 'Windows-1252' : encoding.toUpperCase();
  return { kind: 'text', description: `text (${label}${bom ? ', with BOM' : ''})`, encoding, bom, text };
}

/** UTF-8 if valid; UTF-16 without BOM if every other byte is NUL; Windows-1252 for 8-bit text. */
function guessUnmarkedEncoding(bytes: Uint8Array): TextEncodingName | null {
  try {
    utf8Strict.decode(bytes);
    return 'utf-8';
  } catch {
    // not UTF-8
  }
  const sample = Math.min(bytes.length, 4096) & ~1;
  let evenNul = 0;
  let oddNul = 0;
  let high = 0;
  let control = 0;
  for (let i = 0; i < sample; i++) {
    const b = bytes[i];
    if (b === 0) {
      if (i % 2 === 0) evenNul++;
      else oddNul++;
    } else if (b >= 0x80) high++;
    else if (b < 0x20 && b !== 9 && b !== 10 && b !== 13) control++;
  }
  const half = sample / 2;
  if (half > 0 && oddNul > 0.9 * half && evenNul === 0) return 'utf-16le';
  if (half > 0 && evenNul > 0.9 * half && oddNul === 0) return 'utf-16be';
  // 8-bit text from a Western spreadsheet export: few high bytes, no NUL or control bytes
  if (evenNul + oddNul === 0 && control === 0 && high <= 0.1 * sample) return 'windows-1252';
  return null;
}

function mostlyPrintable(text: string): boolean {
  const limit = Math.min(text.length, 1 << 20);
  let bad = 0;
  for (let i = 0; i < limit; i++) {
    const c = text.charCodeAt(i);
    if (c === 0) return false;
    if ((c < 0x20 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 0x7f || c === 0xfffd || (c >= 0x80 && c < 0xa0)) {
      bad++;
    }
  }
  return bad <= 0.01 * limit;
}

function extensionKind(fileName: string | undefined): string | null {
  const match = fileName ? /\.([a-z0-9]{1,5})$/i.exec(fileName.trim()) : null;
  return match ? match[1].toLowerCase() : null;
}

function extensionAgrees(extension: string, kind: FileKind): boolean {
  switch (kind) {
    case 'xlsx':
      return extension === 'xlsx';
    case 'xlsm':
      return extension === 'xlsm';
    case 'xls':
    case 'encrypted':
      return extension === 'xls' || extension === 'xlsx';
    case 'pdf':
      return extension === 'pdf';
    case 'text':
      return ['csv', 'tsv', 'txt', 'dat', 'tab', 'text'].includes(extension);
    default:
      return true;
  }
}

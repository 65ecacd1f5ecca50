/**
 * .xlsx workbook → cell grids, one sheet at a time. The zip is opened with JSZip; each part is
 * inflated as a stream and stopped as soon as it passes its declared size (the declared sizes
 * were checked against the limits before any inflating). Cells come from SpreadsheetML
 * (ECMA-376 Part 1, §18.3.1.4 c, §18.3.1.96 v, §18.4 shared strings, §18.8.30 numFmt):
 * formula cells give their cached value (<v>), never an evaluation.
 */
import JSZip from 'jszip';
import { columnIndex, refuse } from './read-errors';
import { looksLikeCommaDecimal, parseNumberText } from './parse-number';
import { MAX_COLUMNS, type Grid, type GridCell, type GridRow } from './types';
import { attribute, decodeOoxmlEscapes, decodeXmlText, scanXml, XmlError } from './xml-scan';
import type { ZipEntryInfo } from './zip-directory';

export interface XlsxSheetInfo {
  name: string;
  state: 'visible' | 'hidden' | 'veryHidden';
  /** zip path of the worksheet part, null for chart sheets and missing parts */
  path: string | null;
}

export interface XlsxBook {
  sheets: XlsxSheetInfo[];
  date1904: boolean;
  readSheet(name: string): Promise<Grid>;
}

export interface XlsxLimits {
  maxRows: number;
  maxCells: number;
  maxUncompressedBytes: number;
}

interface InternalStream {
  on(event: 'data', cb: (chunk: Uint8Array) => void): InternalStream;
  on(event: 'end', cb: () => void): InternalStream;
  on(event: 'error', cb: (e: Error) => void): InternalStream;
  resume(): InternalStream;
  pause(): InternalStream;
}

export async function openXlsx(bytes: Uint8Array, entries: ZipEntryInfo[], limits: XlsxLimits): Promise<XlsxBook> {
  const declared = new Map<string, ZipEntryInfo>();
  for (const e of entries) declared.set(e.name.replace(/^\/+/, '').toLowerCase(), e);
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(bytes, { checkCRC32: false });
  } catch (error) {
    refuse('unreadable', `The workbook's zip container cannot be opened (${errorText(error)}).`, {
      expected: 'an .xlsx file as a spreadsheet program saves it',
    });
  }
  const files = new Map<string, JSZip.JSZipObject>();
  zip.forEach((path, file) => {
    if (!file.dir) files.set(path.replace(/^\/+/, '').toLowerCase(), file);
  });
  let inflatedTotal = 0;

  const inflate = async (path: string, required: boolean): Promise<string | null> => {
    const key = path.toLowerCase();
    const file = files.get(key);
    if (!file) {
      if (required) refuse('unreadable', `The workbook lacks its part "${path}".`, { expected: 'a complete .xlsx package' });
      return null;
    }
    const info = declared.get(key);
    const cap = info ? info.uncompressedSize : limits.maxUncompressedBytes;
    const chunks: Uint8Array[] = [];
    let size = 0;
    try {
      await new Promise<void>((resolve, reject) => {
        const stream = (file as unknown as { internalStream(type: 'uint8array'): InternalStream }).internalStream('uint8array');
        stream
          .on('data', (chunk) => {
            size += chunk.length;
            if (size > cap || inflatedTotal + size > limits.maxUncompressedBytes) {
              stream.pause();
              reject(new Error('too_large'));
              return;
            }
            chunks.push(chunk);
          })
          .on('error', (e) => reject(e))
          .on('end', () => resolve())
          .resume();
      });
    } catch (error) {
      if (error instanceof Error && error.message === 'too_large') {
        refuse('too_large', `The workbook part "${path}" inflates beyond its declared size or the ${mb(limits.maxUncompressedBytes)} limit.`, {
          expected: `at most ${mb(limits.maxUncompressedBytes)} of uncompressed content`,
        });
      }
      refuse('unreadable', `The workbook part "${path}" cannot be inflated (${errorText(error)}).`, {
        expected: 'an .xlsx file as a spreadsheet program saves it',
      });
    }
    inflatedTotal += size;
    const joined = new Uint8Array(size);
    let offset = 0;
    for (const c of chunks) {
      joined.set(c, offset);
      offset += c.length;
    }
    return utf8.decode(joined);
  };

  const parse = (path: string, xml: string, handler: Parameters<typeof scanXml>[1]) => {
    try {
      scanXml(xml, handler);
    } catch (error) {
      if (error instanceof XmlError) {
        refuse('unreadable', `The workbook part "${path}" is not well-formed XML (${error.message}).`, {
          expected: 'an .xlsx file as a spreadsheet program saves it',
        });
      }
      throw error;
    }
  };

  const contentTypes = await inflate('[Content_Types].xml', true);
  if (contentTypes && /macroEnabled/i.test(contentTypes)) {
    refuse('macro_workbook', 'This is a macro-enabled workbook; save it as a plain .xlsx workbook (no macros) or as CSV.', {
      expected: 'an .xlsx workbook without macros',
    });
  }

  // workbook: sheet names, visibility, relationship ids, date system
  const workbookXml = (await inflate('xl/workbook.xml', true)) as string;
  const sheetRefs: { name: string; state: XlsxSheetInfo['state']; rid: string }[] = [];
  let date1904 = false;
  parse('xl/workbook.xml', workbookXml, {
    open(name, attrs) {
      if (name === 'sheet') {
        const state = attribute(attrs, 'state');
        sheetRefs.push({
          name: attribute(attrs, 'name') ?? `Sheet${sheetRefs.length + 1}`,
          state: state === 'hidden' || state === 'veryHidden' ? state : 'visible',
          rid: attribute(attrs, 'id') ?? '',
        });
      } else if (name === 'workbookPr') {
        const v = attribute(attrs, 'date1904');
        date1904 = v === '1' || v === 'true';
      }
    },
    close() {},
    text() {},
  });

  const relsXml = await inflate('xl/_rels/workbook.xml.rels', false);
  const targets = new Map<string, { target: string; type: string }>();
  if (relsXml) {
    parse('xl/_rels/workbook.xml.rels', relsXml, {
      open(name, attrs) {
        if (name !== 'Relationship') return;
        const id = attribute(attrs, 'Id');
        const target = attribute(attrs, 'Target');
        if (id && target) targets.set(id, { target: resolvePart('xl/', target), type: attribute(attrs, 'Type') ?? '' });
      },
      close() {},
      text() {},
    });
  }
  const partOfType = (suffix: string, fallback: string) => {
    for (const { target, type } of targets.values()) if (type.endsWith(suffix)) return target;
    return fallback;
  };
  const sheets: XlsxSheetInfo[] = sheetRefs.map((s, i) => {
    const rel = targets.get(s.rid);
    let path: string | null = rel ? rel.target : `xl/worksheets/sheet${i + 1}.xml`;
    if (rel && !rel.type.endsWith('/worksheet')) path = null;
    if (path && !files.has(path.toLowerCase())) path = null;
    return { name: s.name, state: s.state, path };
  });

  let sharedStrings: string[] | null = null;
  let dateStyles: boolean[] | null = null;
  const loadSharedStrings = async (): Promise<string[]> => {
    if (sharedStrings) return sharedStrings;
    const path = partOfType('/sharedStrings', 'xl/sharedStrings.xml');
    const xml = await inflate(path, false);
    sharedStrings = xml ? readSharedStrings(path, xml, parse) : [];
    return sharedStrings;
  };
  const loadDateStyles = async (): Promise<boolean[]> => {
    if (dateStyles) return dateStyles;
    const path = partOfType('/styles', 'xl/styles.xml');
    const xml = await inflate(path, false);
    dateStyles = xml ? readDateStyles(path, xml, parse) : [];
    return dateStyles;
  };

  return {
    sheets,
    date1904,
    async readSheet(name: string): Promise<Grid> {
      const sheet = sheets.find((s) => s.name === name);
      if (!sheet || !sheet.path) return { sheet: name, rows: [] };
      const xml = (await inflate(sheet.path, true)) as string;
      const strings = await loadSharedStrings();
      const styles = await loadDateStyles();
      return readWorksheet(sheet.name, sheet.path, xml, strings, styles, date1904, limits, parse);
    },
  };
}

const utf8 = new TextDecoder('utf-8');

function mb(bytes: number): string {
  return `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;
}

function errorText(error: unknown): string {
  const text = (error instanceof Error ? error.message : String(error))
    .replace(/^Bug : uncompressed data size mismatch$/, 'its size does not match the zip directory')
    .replace(/^(Bug|Corrupted zip) ?: ?/i, '');
  return text.length > 120 ? text.slice(0, 117) + '…' : text;
}

/** resolves a relationship target against the folder of its source part */
function resolvePart(folder: string, target: string): string {
  const raw = target.startsWith('/') ? target.slice(1) : folder + target;
  const parts: string[] = [];
  for (const p of raw.split('/')) {
    if (p === '..') parts.pop();
    else if (p !== '.' && p !== '') parts.push(p);
  }
  return parts.join('/');
}

type Parse = (path: string, xml: string, handler: Parameters<typeof scanXml>[1]) => void;

function readSharedStrings(path: string, xml: string, parse: Parse): string[] {
  const strings: string[] = [];
  let current: string[] | null = null;
  let inT = false;
  let phonetic = 0;
  parse(path, xml, {
    open(name, _attrs, selfClosing) {
      if (name === 'si') current = [];
      else if (name === 't' && !selfClosing) inT = true;
      else if (name === 'rPh') phonetic++;
    },
    close(name) {
      if (name === 'si') {
        strings.push(current ? current.join('') : '');
        current = null;
      } else if (name === 't') inT = false;
      else if (name === 'rPh') phonetic--;
    },
    text(raw, cdata) {
      if (inT && current && phonetic === 0) current.push(decodeOoxmlEscapes(cdata ? raw : decodeXmlText(raw)));
    },
  });
  return strings;
}

/** built-in date/time number formats (ECMA-376 Part 1, §18.8.30, ids 14–22, 45–47 and the East Asian 27–36, 50–58) */
function isBuiltInDateFormat(id: number): boolean {
  return (id >= 14 && id <= 22) || (id >= 27 && id <= 36) || (id >= 45 && id <= 47) || (id >= 50 && id <= 58);
}

/** a custom format is a date/time format when y, m, d, h or s remain outside quotes, brackets and escapes */
export function isDateFormatCode(code: string): boolean {
  const stripped = code
    .replace(/"[^"]*"/g, '')
    .replace(/\[(?!h\]|hh\]|m\]|mm\]|s\]|ss\])[^\]]*\]/gi, '')
    .replace(/\\./g, '')
    .replace(/[_*]./g, '');
  if (/general/i.test(stripped)) return false;
  return /[ymdhs]/i.test(stripped);
}

function readDateStyles(path: string, xml: string, parse: Parse): boolean[] {
  const customFormats = new Map<number, string>();
  const styles: boolean[] = [];
  let inCellXfs = false;
  parse(path, xml, {
    open(name, attrs) {
      if (name === 'numFmt') {
        const id = Number(attribute(attrs, 'numFmtId'));
        customFormats.set(id, attribute(attrs, 'formatCode') ?? '');
      } else if (name === 'cellXfs') inCellXfs = true;
      else if (name === 'xf' && inCellXfs) {
        const id = Number(attribute(attrs, 'numFmtId') ?? '0');
        const custom = customFormats.get(id);
        styles.push(custom !== undefined ? isDateFormatCode(custom) : isBuiltInDateFormat(id));
      }
    },
    close(name) {
      if (name === 'cellXfs') inCellXfs = false;
    },
    text() {},
  });
  return styles;
}

/** spreadsheet serial day number → ISO date (and time when it has one) */
export function serialToIsoDate(serial: number, date1904: boolean): string {
  // 1900 system: day 1 = 1900-01-01 with the historic 29 Feb 1900 (serial 60), so from serial 61
  // on the epoch is 1899-12-30; the 1904 system counts from 1904-01-01.
  const epoch = date1904 ? Date.UTC(1904, 0, 1) : serial < 61 ? Date.UTC(1899, 11, 31) : Date.UTC(1899, 11, 30);
  const ms = epoch + Math.round(serial * 86400000);
  if (!Number.isFinite(ms) || Math.abs(ms) > 8.64e15) return String(serial);
  const iso = new Date(ms).toISOString();
  return serial % 1 === 0 ? iso.slice(0, 10) : iso.slice(0, 16).replace('T', ' ');
}

function readWorksheet(
  sheetName: string,
  path: string,
  xml: string,
  strings: string[],
  dateStyles: boolean[],
  date1904: boolean,
  limits: XlsxLimits,
  parse: Parse,
): Grid {
  const rows: GridRow[] = [];
  let row: GridRow | null = null;
  let nextRow = 1;
  let nextColumn = 0;
  let cellCount = 0;
  // the cell being read
  let inCell = false;
  let cellColumn = 0;
  let cellType = 'n';
  let cellStyle = 0;
  let value: string[] | null = null;
  let formula: string[] | null = null;
  let inlineText: string[] | null = null;
  let target: string[] | null = null;
  let phonetic = 0;

  const finishCell = () => {
    if (!row || cellColumn >= MAX_COLUMNS) return;
    const v = value ? value.join('') : null;
    let cell: GridCell | undefined;
    switch (cellType) {
      case 's': {
        const index = v === null ? -1 : Number(v);
        cell = textCell(index >= 0 && index < strings.length ? strings[index] : '');
        break;
      }
      case 'str':
        cell = v === null ? (formula ? { kind: 'formula', formula: formula.join('') } : undefined) : textCell(v);
        break;
      case 'inlineStr':
        cell = textCell(inlineText ? inlineText.join('') : (v ?? ''));
        break;
      case 'b':
        cell = v === null ? undefined : { kind: 'bool', value: v.trim() === '1' || v.trim() === 'true' };
        break;
      case 'e':
        cell = { kind: 'error', text: v ?? '#N/A' };
        break;
      case 'd':
        cell = v === null ? undefined : { kind: 'date', display: v.trim().slice(0, 16).replace('T', ' ') };
        break;
      default: {
        if (v === null || v.trim() === '') {
          cell = formula ? { kind: 'formula', formula: formula.join('') } : undefined;
        } else {
          const number = Number(v);
          if (!Number.isFinite(number)) cell = { kind: 'error', text: v };
          else if (dateStyles[cellStyle]) cell = { kind: 'date', display: serialToIsoDate(number, date1904) };
          else cell = { kind: 'number', value: number };
        }
      }
    }
    if (!cell) return;
    row.cells[cellColumn] = cell;
    cellCount++;
    if (cellCount > limits.maxCells) {
      refuse('too_large', `Sheet "${sheetName}" has more than ${limits.maxCells} filled cells.`, {
        sheet: sheetName,
        row: row.rowNumber,
        expected: `at most ${limits.maxCells} cells`,
      });
    }
  };

  parse(path, xml, {
    open(name, attrs, selfClosing) {
      switch (name) {
        case 'row': {
          const r = Number(attribute(attrs, 'r'));
          const rowNumber = Number.isInteger(r) && r > 0 ? r : nextRow;
          nextRow = rowNumber + 1;
          nextColumn = 0;
          row = { rowNumber, cells: [] };
          rows.push(row);
          if (rows.length > limits.maxRows) {
            refuse('too_large', `Sheet "${sheetName}" has more than ${limits.maxRows} rows.`, {
              sheet: sheetName,
              row: rowNumber,
              expected: `at most ${limits.maxRows} rows`,
            });
          }
          break;
        }
        case 'c': {
          if (!row) break;
          const ref = attribute(attrs, 'r');
          const letters = ref ? /^\$?([A-Za-z]{1,3})/.exec(ref) : null;
          const index = letters ? columnIndex(letters[1]) : -1;
          cellColumn = index >= 0 ? index : nextColumn;
          nextColumn = cellColumn + 1;
          cellType = attribute(attrs, 't') ?? 'n';
          cellStyle = Number(attribute(attrs, 's') ?? '0') || 0;
          value = null;
          formula = null;
          inlineText = null;
          inCell = true;
          if (selfClosing) {
            finishCell();
            inCell = false;
          }
          break;
        }
        case 'v':
          if (inCell && !selfClosing) target = value = [];
          break;
        case 'f':
          if (inCell) {
            formula = [];
            target = selfClosing ? null : formula;
          }
          break;
        case 'is':
          if (inCell) inlineText = [];
          break;
        case 't':
          if (inCell && inlineText && !selfClosing) target = inlineText;
          break;
        case 'rPh':
          phonetic++;
          break;
      }
    },
    close(name) {
      switch (name) {
        case 'c':
          if (inCell) finishCell();
          inCell = false;
          target = null;
          break;
        case 'v':
        case 'f':
        case 't':
          target = null;
          break;
        case 'rPh':
          phonetic--;
          break;
        case 'row':
          row = null;
          break;
      }
    },
    text(raw, cdata) {
      if (target && phonetic === 0) target.push(cdata ? raw : decodeXmlText(raw));
    },
  });
  return { sheet: sheetName, rows };
}

/** a text cell; text that spells a number ("0.5", "1,25") becomes a number that remembers its text */
function textCell(raw: string): GridCell | undefined {
  const text = decodeOoxmlEscapes(raw);
  if (text.trim() === '') return undefined;
  if (/\d/.test(text)) {
    const value = parseNumberText(text, looksLikeCommaDecimal(text));
    if (value !== null) return { kind: 'number', value, text: text.trim() };
  }
  return { kind: 'text', text };
}

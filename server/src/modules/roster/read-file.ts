/**
 * Reads a registrar's roster file into rows of cells, whatever it is: CSV
 * (comma, semicolon, tab or bar; UTF-8 with or without BOM, UTF-16 with BOM,
 * or Windows-1252) or an XLSX workbook (the first sheet that has data).
 * The type is decided by the bytes, never by the file name or the browser's
 * content type. Row numbers are the ones the spreadsheet shows (1-based).
 */
import ExcelJS from 'exceljs';
import Papa from 'papaparse';
import { HttpError, badRequest } from '../../platform/errors';

export type CellKind = 'empty' | 'text' | 'number' | 'date' | 'boolean' | 'error';

export interface Cell {
  kind: CellKind;
  /** what a person sees in the cell; dates as YYYY-MM-DD (with THH:MM when not midnight) */
  text: string;
}

export interface SheetRow {
  /** 1-based, as the spreadsheet shows it */
  rowNumber: number;
  cells: Cell[];
}

export interface SheetTable {
  format: 'csv' | 'xlsx';
  sheetName: string | null;
  delimiter: string | null;
  /** non-blank rows only, in file order */
  rows: SheetRow[];
}

/** More data rows than any course has: a file this long is a mistake. */
export const MAX_ROSTER_ROWS = 5000;
const MAX_COLUMNS = 200;

const EMPTY: Cell = { kind: 'empty', text: '' };

/** A, B, … Z, AA, AB, … for a 0-based column index. */
export function columnLetter(index: number): string {
  let n = index + 1;
  let s = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

const startsWith = (buf: Buffer, bytes: number[]) => bytes.every((b, i) => buf[i] === b);

function unsupported(message: string) {
  return new HttpError(415, 'unsupported_media_type', message);
}

/** Text out of bytes: BOMs honoured, UTF-8 tried strictly, Windows-1252 as the fallback of old exports. */
function decodeText(buf: Buffer, fileName: string): string {
  if (startsWith(buf, [0xff, 0xfe])) return new TextDecoder('utf-16le').decode(buf.subarray(2));
  if (startsWith(buf, [0xfe, 0xff])) return new TextDecoder('utf-16be').decode(buf.subarray(2));
  const body = startsWith(buf, [0xef, 0xbb, 0xbf]) ? buf.subarray(3) : buf;
  if (body.subarray(0, 8192).includes(0)) {
    throw unsupported(`${fileName} is neither a CSV text file nor an XLSX workbook (it contains binary data). Save the roster as CSV or XLSX.`);
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(body);
  } catch {
    text = new TextDecoder('windows-1252').decode(body);
  }
  return text.replace(/^\uFEFF/, '');
}

function readCsv(buf: Buffer, fileName: string): SheetTable {
  const text = decodeText(buf, fileName);
  const parsed = Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t', '|'],
  });
  const quoteError = parsed.errors.find((e) => e.type === 'Quotes');
  if (quoteError) {
    const row = (quoteError.row ?? 0) + 1;
    throw badRequest(`${fileName}, row ${row}: ${quoteError.message.replace(/\.$/, '')} — a quotation mark opens a field that is never closed.`);
  }
  const rows: SheetRow[] = [];
  parsed.data.forEach((record, i) => {
    const cells = record.map((v): Cell => (v.trim() === '' ? EMPTY : { kind: 'text', text: v }));
    if (cells.every((c) => c.kind === 'empty')) return;
    rows.push({ rowNumber: i + 1, cells });
  });
  const delimiter = parsed.meta.delimiter || ',';
  return { format: 'csv', sheetName: null, delimiter, rows };
}

const pad = (n: number) => String(n).padStart(2, '0');

/** A date cell as the person typed it (exceljs gives the wall time as UTC). */
function dateText(d: Date): string {
  if (Number.isNaN(d.getTime())) return '';
  const day = `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}`;
  return d.getUTCHours() || d.getUTCMinutes() ? `${day}T${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}` : day;
}

function numberText(n: number): string {
  if (Number.isInteger(n) && Math.abs(n) < 1e21) return n.toFixed(0);
  return String(n);
}

/** Any exceljs cell value → Cell. Formulas give their cached result; links their text. */
export function cellFromExcel(value: unknown): Cell {
  if (value === null || value === undefined) return EMPTY;
  if (typeof value === 'string') return value.trim() === '' ? EMPTY : { kind: 'text', text: value };
  if (typeof value === 'number') return { kind: 'number', text: numberText(value) };
  if (typeof value === 'boolean') return { kind: 'boolean', text: value ? 'TRUE' : 'FALSE' };
  if (value instanceof Date) return { kind: 'date', text: dateText(value) };
  if (typeof value === 'object') {
    const v = value as Record<string, unknown>;
    if (Array.isArray(v.richText)) {
      const text = (v.richText as { text?: string }[]).map((r) => r.text ?? '').join('');
      return text.trim() === '' ? EMPTY : { kind: 'text', text };
    }
    if ('hyperlink' in v || 'text' in v) return cellFromExcel(v.text);
    if ('formula' in v || 'sharedFormula' in v) return cellFromExcel(v.result);
    if (typeof v.error === 'string') return { kind: 'error', text: v.error };
  }
  return { kind: 'text', text: String(value) };
}

async function readXlsx(buf: Buffer, fileName: string): Promise<SheetTable> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(buf as unknown as ArrayBuffer);
  } catch {
    throw unsupported(`${fileName} is a ZIP file but not a readable XLSX workbook. Save the roster from the spreadsheet program as .xlsx or CSV.`);
  }
  const sheet = workbook.worksheets.find((ws) => ws.state !== 'hidden' && ws.actualRowCount > 0) ?? workbook.worksheets[0];
  if (!sheet) throw badRequest(`${fileName} has no worksheet.`);
  const rows: SheetRow[] = [];
  let tooMany = false;
  sheet.eachRow({ includeEmpty: false }, (row) => {
    if (rows.length > MAX_ROSTER_ROWS + 1) {
      tooMany = true;
      return;
    }
    const values = row.values as unknown[]; // 1-based, sparse
    const cells: Cell[] = [];
    for (let c = 1; c < Math.min(values.length, MAX_COLUMNS + 1); c++) cells.push(cellFromExcel(values[c]));
    if (cells.every((cell) => cell.kind === 'empty')) return;
    rows.push({ rowNumber: row.number, cells });
  });
  if (tooMany) throw badRequest(`${fileName}, sheet "${sheet.name}": more than ${MAX_ROSTER_ROWS} rows; a roster is one course's students.`);
  return { format: 'xlsx', sheetName: sheet.name, delimiter: null, rows };
}

/** Reads an uploaded roster; 415 for anything that is not CSV or XLSX by content. */
export async function readRosterFile(buf: Buffer, fileName: string): Promise<SheetTable> {
  if (buf.length === 0) throw badRequest(`${fileName} is empty.`);
  if (startsWith(buf, [0x50, 0x4b, 0x03, 0x04])) return readXlsx(buf, fileName);
  if (startsWith(buf, [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1])) {
    throw unsupported(`${fileName} is an old binary Excel workbook (.xls). Save it as .xlsx or CSV and choose it again.`);
  }
  if (startsWith(buf, [0x25, 0x50, 0x44, 0x46])) throw unsupported(`${fileName} is a PDF. The roster must be a CSV or XLSX file.`);
  const table = readCsv(buf, fileName);
  if (table.rows.length > MAX_ROSTER_ROWS + 1) throw badRequest(`${fileName}: more than ${MAX_ROSTER_ROWS} rows; a roster is one course's students.`);
  if (table.rows.some((r) => r.cells.length > MAX_COLUMNS)) throw badRequest(`${fileName}: more than ${MAX_COLUMNS} columns; is this the roster?`);
  return table;
}

/**
 * Refusals of the report reader: stable codes (the upload page, the API and the CLI switch on them)
 * and the place in the file each one names.
 */

/** Every refusal code with its meaning. The codes are stable; the messages are for people. */
export const READ_ERROR_CODES = {
  empty_file: 'The file has no bytes, or only blank lines and comments.',
  unknown_type: 'The content is not CSV/TSV text or an .xlsx workbook (e.g. an image, .ods, .xlsb, .docx).',
  pdf_file: 'The file is a PDF: it belongs in the write-up slot, not the data slot.',
  legacy_xls: 'A legacy Excel 97–2003 (.xls) workbook; it must be saved as .xlsx or CSV.',
  encrypted_workbook: 'The workbook is password-protected (an encrypted OOXML package).',
  macro_workbook: 'A macro-enabled workbook (.xlsm, VBA project or macroEnabled content type).',
  unreadable: 'The container is damaged: a broken zip, missing workbook parts, malformed XML or text that is not UTF-8/UTF-16.',
  too_large: 'Over the row, cell, zip-entry or uncompressed-size limits (checked before inflating).',
  no_numeric_data: 'No row holds two or more numbers: there is no table of points.',
  too_few_columns: 'A distance column was found but no energy column (or only one numeric column exists).',
  too_few_points: 'Fewer than five points with both a distance and an energy.',
  not_a_number: 'Text, NaN, a spreadsheet error value or a formula without a saved result where a number belongs.',
  missing_value: 'An empty cell inside the table where a distance or energy belongs.',
  date_in_numeric_cell: 'A cell formatted as a date where a number belongs (often a locale mix-up: 1.5 became 1 May).',
  nonpositive_distance: 'A distance of zero or below.',
  duplicate_distance: 'The same distance appears on two rows.',
  bad_template: 'A Bondmark template whose hidden sheet is damaged (e.g. its data sheet is missing).',
  bad_choice: 'readReportWithChoice was given a sheet or column that does not exist or holds no numbers.',
} as const;

export type ReadErrorCode = keyof typeof READ_ERROR_CODES;
export const READ_ERROR_CODE_LIST = Object.keys(READ_ERROR_CODES) as ReadErrorCode[];

export interface ReadError {
  code: ReadErrorCode;
  /** one or two sentences for the student, naming the place and what was expected */
  message: string;
  /** sheet name (XLSX) — absent for CSV/TSV */
  sheet?: string;
  /** 1-based row as a spreadsheet shows it (for CSV/TSV: the line number) */
  row?: number;
  /** column letter as a spreadsheet shows it ("B") */
  column?: string;
  /** what belonged there, e.g. "a distance in bohr" */
  expected?: string;
}

/** 0 → "A", 25 → "Z", 26 → "AA" (spreadsheet column letters) */
export function columnLetter(index: number): string {
  let n = Math.floor(index) + 1;
  let out = '';
  while (n > 0) {
    const rem = (n - 1) % 26;
    out = String.fromCharCode(65 + rem) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}

/** "B" → 1, "aa" → 26; −1 when the text is not a column letter */
export function columnIndex(letters: string): number {
  const text = letters.trim().toUpperCase();
  if (!/^[A-Z]{1,3}$/.test(text)) return -1;
  let n = 0;
  for (const ch of text) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}

/** "row 14, column B" or "sheet "Data", row 14, column B" */
export function describePlace(place: { sheet?: string | null; row?: number; column?: string }): string {
  const parts: string[] = [];
  if (place.sheet) parts.push(`sheet "${place.sheet}"`);
  if (place.row !== undefined) parts.push(`row ${place.row}`);
  if (place.column !== undefined) parts.push(`column ${place.column}`);
  return parts.join(', ');
}

export function makeReadError(
  code: ReadErrorCode,
  message: string,
  place: { sheet?: string | null; row?: number; column?: string; expected?: string } = {},
): ReadError {
  const error: ReadError = { code, message };
  if (place.sheet) error.sheet = place.sheet;
  if (place.row !== undefined) error.row = place.row;
  if (place.column !== undefined) error.column = place.column;
  if (place.expected !== undefined) error.expected = place.expected;
  return error;
}

/** Thrown only inside the reader and always caught by readReport; never escapes the module. */
export class ReadRefusal extends Error {
  constructor(readonly readError: ReadError) {
    super(readError.message);
    this.name = 'ReadRefusal';
  }
}

export function refuse(
  code: ReadErrorCode,
  message: string,
  place: { sheet?: string | null; row?: number; column?: string; expected?: string } = {},
): never {
  throw new ReadRefusal(makeReadError(code, message, place));
}

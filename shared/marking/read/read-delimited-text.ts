/**
 * CSV/TSV/whitespace text → cell grid. Detects the field separator (tab, semicolon, pipe, comma,
 * runs of spaces) and the decimal mark (1.25 or 1,25), keeps # comment lines aside, and numbers
 * every row by its line in the file so that messages can say "row 14, column B".
 * Quoted fields are split by papaparse (RFC 4180 quoting).
 */
import Papa from 'papaparse';
import { refuse } from './read-errors';
import { looksLikeCommaDecimal, looksLikePointDecimal, parseNumberText } from './parse-number';
import type { Grid, GridCell, GridRow } from './types';

export type Delimiter = ',' | ';' | '\t' | '|' | 'whitespace';

export interface DelimitedText {
  grid: Grid;
  delimiter: Delimiter;
  decimalComma: boolean;
}

const DIGIT = /\d/;
/** a data line starts with a number (titles and headers start with words) */
const STARTS_WITH_NUMBER = /^\s*"?[+\-\u2212]?[.,]?\d/;

export function readDelimitedText(
  input: string,
  limits: { maxRows: number; maxCells: number },
  preferTab = false,
): DelimitedText {
  const unmarked = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
  const text = unmarked.indexOf('\r') >= 0 ? unmarked.replace(/\r\n?/g, '\n') : unmarked;
  const lines = text.split('\n');
  while (lines.length > 0 && lines[lines.length - 1].trim() === '') lines.pop();
  if (lines.length > limits.maxRows) {
    refuse('too_large', `The file has ${lines.length} lines; the limit is ${limits.maxRows}.`, {
      row: limits.maxRows + 1,
      expected: `at most ${limits.maxRows} rows`,
    });
  }
  const delimiter = detectDelimiter(lines, preferTab);
  const fieldRows = delimiter === 'whitespace' ? splitWhitespace(lines) : splitDelimited(lines, delimiter);

  // decimal mark: the majority spelling among the fields that can only be read one way
  let commaFields = 0;
  let pointFields = 0;
  for (const row of fieldRows) {
    if (row.comment !== undefined) continue;
    for (const field of row.fields) {
      if (looksLikeCommaDecimal(field)) commaFields++;
      else if (looksLikePointDecimal(field)) pointFields++;
    }
  }
  const decimalComma = commaFields > pointFields;

  const rows: GridRow[] = [];
  let cellCount = 0;
  for (const { rowNumber, fields, comment } of fieldRows) {
    if (comment !== undefined) {
      rows.push({ rowNumber, cells: [], comment });
      continue;
    }
    const cells: (GridCell | undefined)[] = new Array(fields.length);
    for (let i = 0; i < fields.length; i++) {
      const field = fields[i].trim();
      if (field === '') continue;
      cellCount++;
      const value = DIGIT.test(field) ? parseNumberText(field, decimalComma) : null;
      cells[i] = value === null ? { kind: 'text', text: field } : { kind: 'number', value, text: field };
    }
    if (cellCount > limits.maxCells) {
      refuse('too_large', `The file has more than ${limits.maxCells} filled cells.`, {
        row: rowNumber,
        expected: `at most ${limits.maxCells} cells`,
      });
    }
    rows.push({ rowNumber, cells });
  }
  return { grid: { sheet: null, rows }, delimiter, decimalComma };
}

interface FieldRow {
  rowNumber: number;
  fields: string[];
  comment?: string;
}

function commentText(line: string): string | undefined {
  const t = line.trimStart();
  return t.startsWith('#') ? t.slice(1).trim() : undefined;
}

/** which candidate separators occur outside "quoted" parts of a line: bits tab 1, ; 2, | 4, , 8 */
function separatorsIn(line: string): number {
  let bits = 0;
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 0x22) quoted = !quoted;
    else if (!quoted) {
      if (c === 0x09) bits |= 1;
      else if (c === 0x3b) bits |= 2;
      else if (c === 0x7c) bits |= 4;
      else if (c === 0x2c) bits |= 8;
    }
  }
  return bits;
}

/**
 * Separator rule: among lines that start with a number (titles and headers do not decide), the first of
 * tab, semicolon, pipe found on at least 80 % of them wins; then comma, unless comma-split fields
 * still hold two space-separated numbers (a decimal-comma file separated by spaces); then runs of
 * whitespace when the lines hold two or more tokens; else comma (a single column).
 */
export function detectDelimiter(lines: string[], preferTab = false): Delimiter {
  const sample: string[] = [];
  for (const line of lines) {
    if (line.trim() === '' || commentText(line) !== undefined || !STARTS_WITH_NUMBER.test(line)) continue;
    sample.push(line);
    if (sample.length >= 50) break;
  }
  if (sample.length === 0) {
    for (const line of lines) {
      if (line.trim() !== '' && commentText(line) === undefined) sample.push(line);
      if (sample.length >= 50) break;
    }
  }
  if (sample.length === 0) return preferTab ? '\t' : ',';
  const counts = [0, 0, 0, 0];
  for (const line of sample) {
    const bits = separatorsIn(line);
    for (let k = 0; k < 4; k++) if (bits & (1 << k)) counts[k]++;
  }
  const share = (k: number) => counts[k] / sample.length;
  const tabShare = share(0);
  if (tabShare >= 0.8 || (preferTab && tabShare > 0)) return '\t';
  if (share(1) >= 0.8) return ';';
  if (share(2) >= 0.8) return '|';
  if (share(3) >= 0.8) {
    const twoNumbersInField = /\d\s+[-+\u2212.,]?\d/;
    const bad = sample.filter((l) => l.split(',').some((f) => twoNumbersInField.test(f.trim()))).length;
    if (bad < 0.5 * sample.length) return ',';
    return 'whitespace';
  }
  const multiToken = sample.filter((l) => l.trim().split(/\s+/).length >= 2).length;
  if (multiToken >= 0.8 * sample.length) return 'whitespace';
  return ',';
}

function splitWhitespace(lines: string[]): FieldRow[] {
  const rows: FieldRow[] = [];
  // the usual token count of lines with numbers, so a header "R / bohr   E / Eh" can be split
  // on runs of two or more spaces instead
  const counts = new Map<number, number>();
  for (const line of lines) {
    if (commentText(line) !== undefined || !DIGIT.test(line)) continue;
    const n = line.trim().split(/\s+/).length;
    counts.set(n, (counts.get(n) ?? 0) + 1);
  }
  let usual = 0;
  let best = -1;
  for (const [n, c] of counts) if (c > best) [usual, best] = [n, c];
  lines.forEach((line, i) => {
    const rowNumber = i + 1;
    const comment = commentText(line);
    if (comment !== undefined) {
      rows.push({ rowNumber, fields: [], comment });
      return;
    }
    const trimmed = line.trim();
    if (trimmed === '') {
      rows.push({ rowNumber, fields: [] });
      return;
    }
    let fields = trimmed.split(/\s+/);
    if (fields.length !== usual) {
      const wide = trimmed.split(/\s{2,}|\t/);
      if (wide.length === usual) fields = wide;
    }
    rows.push({ rowNumber, fields });
  });
  return rows;
}

function splitDelimited(lines: string[], delimiter: ',' | ';' | '\t' | '|'): FieldRow[] {
  if (!lines.some((line) => line.indexOf('"') >= 0)) {
    // no quoting anywhere: every line is one row
    return lines.map((line, i) => {
      const comment = commentText(line);
      return comment !== undefined ? { rowNumber: i + 1, fields: [], comment } : { rowNumber: i + 1, fields: line.split(delimiter) };
    });
  }
  const parsed = Papa.parse<string[]>(lines.join('\n'), {
    delimiter,
    newline: '\n',
    quoteChar: '"',
    skipEmptyLines: false,
    comments: false,
    dynamicTyping: false,
  });
  const rows: FieldRow[] = [];
  let lineNumber = 1;
  const lineOfRow: number[] = [];
  for (const fields of parsed.data) {
    lineOfRow.push(lineNumber);
    const first = fields.length > 0 ? fields[0].trimStart() : '';
    const comment = first.startsWith('#') ? commentText(lines[lineNumber - 1] ?? first) ?? first.slice(1).trim() : undefined;
    rows.push(comment !== undefined ? { rowNumber: lineNumber, fields: [], comment } : { rowNumber: lineNumber, fields });
    let extra = 0;
    for (const f of fields) for (let k = f.indexOf('\n'); k >= 0; k = f.indexOf('\n', k + 1)) extra++;
    lineNumber += 1 + extra;
  }
  const unterminated = parsed.errors.find((e) => e.code === 'MissingQuotes');
  if (unterminated) {
    const row = unterminated.row !== undefined ? lineOfRow[unterminated.row] : undefined;
    refuse('unreadable', `A quoted field opened${row ? ` on row ${row}` : ''} is never closed (a lone " character).`, {
      row,
      expected: 'a closing " for every opening "',
    });
  }
  return rows;
}

/**
 * Finds the table of points in a cell grid: where it starts, its header (with an optional units
 * row under the names), and where it ends. Rules (CONTEXT.md, "Finding the table"):
 * - the table starts at the first row with numbers in two or more cells, and takes in rows with
 *   any number directly above it (so a first row "0.5, NaN" is read, and refused in place);
 * - the header is the non-empty row just above that holds no number; when every cell of it is
 *   a bare unit ("bohr", "eV") and a text row sits right above, that row holds the names;
 * - the table runs down over blank lines; a row without any number ends it if it follows an
 *   empty row or if no number comes after it; rows after the end are reported in a warning.
 * A template fixes the header row, and the table starts on the row below it.
 */
import { refuse } from './read-errors';
import { unitFromText } from './header-words';
import { MAX_COLUMNS, type Grid, type GridCell, type GridRow } from './types';

export interface LocatedTable {
  headerRow: number | null;
  /** header text per column index (names row, then the unit row in brackets) */
  headers: (string | null)[];
  /** table rows with at least one filled cell, in file order */
  rows: GridRow[];
  columnCount: number;
  warnings: string[];
}

/** text that stands where a number was meant: NaN, inf, n/a, a dash */
const NUMBER_PLACEHOLDER = /^([+-]?(nan|inf|infinity)|n\/?a|#n\/a|-+|—|–|\?+|null|none)$/i;

export function isNumberLike(cell: GridCell | undefined): boolean {
  return cell !== undefined && (cell.kind === 'number' || cell.kind === 'date');
}

function numberCount(row: GridRow): number {
  let n = 0;
  for (const cell of row.cells) if (isNumberLike(cell)) n++;
  return n;
}

function filled(row: GridRow): boolean {
  if (row.comment !== undefined) return false;
  for (const cell of row.cells) if (cell !== undefined) return true;
  return false;
}

export function cellDisplay(cell: GridCell | undefined): string {
  if (!cell) return '';
  switch (cell.kind) {
    case 'number':
      return cell.text ?? String(cell.value);
    case 'text':
      return cell.text;
    case 'date':
      return cell.display;
    case 'error':
      return cell.text;
    case 'bool':
      return cell.value ? 'TRUE' : 'FALSE';
    case 'formula':
      return `=${cell.formula}`;
  }
}

function rowRange(rows: GridRow[]): string {
  const first = rows[0].rowNumber;
  const last = rows[rows.length - 1].rowNumber;
  return first === last ? `row ${first}` : `rows ${first}–${last}`;
}

export interface LocateOptions {
  /** template: the 1-based header row */
  headerRow?: number;
  /** text files: splits a # comment line into header fields (numpy-style "# R E") */
  splitComment?: (text: string) => string[];
  sheet: string | null;
}

export function locateTable(grid: Grid, options: LocateOptions): LocatedTable {
  const warnings: string[] = [];
  const content = grid.rows.filter(filled);
  const sheet = options.sheet;
  const where = sheet ? ` on sheet "${sheet}"` : '';
  let start: number;
  let headerIndex = -1;

  if (options.headerRow !== undefined) {
    start = content.findIndex((r) => r.rowNumber > options.headerRow!);
    headerIndex = content.findIndex((r) => r.rowNumber === options.headerRow);
    if (start < 0) {
      refuse('too_few_points', `No rows of points were found below the header (row ${options.headerRow})${where}.`, {
        sheet,
        row: options.headerRow + 1,
        expected: 'a distance and energies on the rows below the header',
      });
    }
  } else {
    start = content.findIndex((r) => numberCount(r) >= 2);
    if (start < 0) {
      const single = content.filter((r) => numberCount(r) === 1);
      if (single.length >= 2) {
        refuse('too_few_columns', `Only one column of numbers was found${where} (${rowRange(single)}).`, {
          sheet,
          row: single[0].rowNumber,
          expected: 'a distance column and at least one energy column',
        });
      }
      refuse('no_numeric_data', `No row${where} holds two or more numbers, so there is no table of points to read.`, {
        sheet,
        expected: 'a table with a distance column and energy columns',
      });
    }
    while (start > 0 && numberCount(content[start - 1]) >= 1) start--;
    if (start > 0) headerIndex = start - 1;
  }

  // downward: the end of the table
  const rows: GridRow[] = [];
  const numericColumns = new Set<number>();
  const accept = (row: GridRow) => {
    rows.push(row);
    row.cells.forEach((cell, c) => {
      if (isNumberLike(cell)) numericColumns.add(c);
    });
  };
  let end = content.length;
  for (let i = start; i < content.length; i++) {
    const row = content[i];
    const previous = i > start ? content[i - 1] : null;
    const afterGap = previous !== null && row.rowNumber - previous.rowNumber > 1;
    if (numberCount(row) >= 1) {
      // after an empty row, words where the table has numbers start something else ("Minimum | 0.74")
      const words = afterGap && row.cells.some((cell, c) => numericColumns.has(c) && cell?.kind === 'text' && !NUMBER_PLACEHOLDER.test(cell.text.trim()));
      if (words) {
        end = i;
        break;
      }
      accept(row);
      continue;
    }
    let numbersFollow = false;
    for (let k = i + 1; k < content.length; k++) {
      if (content[k].rowNumber - content[k - 1].rowNumber > 1) break;
      if (numberCount(content[k]) >= 1) {
        numbersFollow = true;
        break;
      }
    }
    if (afterGap || !numbersFollow) {
      end = i;
      break;
    }
    accept(row);
  }
  if (end < content.length) {
    const rest = content.slice(end);
    const withNumbers = rest.some((r) => numberCount(r) >= 1);
    warnings.push(
      withNumbers
        ? `The table ends at row ${rows.length > 0 ? rows[rows.length - 1].rowNumber : content[start].rowNumber}${where}; ${rowRange(rest)} below it (after a row without numbers) were not read.`
        : `Text below the table${where} (${rowRange(rest)}) was not read.`,
    );
  }

  let columnCount = 0;
  for (const row of rows) columnCount = Math.max(columnCount, row.cells.length);

  // header: names row, optionally with a units row under it
  const headers: (string | null)[] = [];
  let headerRow: number | null = null;
  const headerCandidate = headerIndex >= 0 ? content[headerIndex] : null;
  if (headerCandidate) {
    headerRow = headerCandidate.rowNumber;
    columnCount = Math.max(columnCount, headerCandidate.cells.length);
    const texts = headerCandidate.cells.map((c) => (c ? clipHeader(cellDisplay(c).trim()) : ''));
    const filledTexts = texts.filter((t) => t !== '');
    const namesRow = headerIndex > 0 ? content[headerIndex - 1] : null;
    const unitsOnly =
      filledTexts.length > 0 &&
      filledTexts.every((t) => {
        const u = unitFromText(t);
        return u.distance !== null || u.energy !== null;
      });
    if (unitsOnly && namesRow && namesRow.rowNumber === headerRow - 1 && numberCount(namesRow) === 0) {
      for (let c = 0; c < columnCount; c++) {
        const name = namesRow.cells[c] ? clipHeader(cellDisplay(namesRow.cells[c]).trim()) : '';
        const unit = texts[c] ?? '';
        const joined = name && unit ? `${name} [${unit}]` : name || unit;
        headers[c] = joined === '' ? null : joined;
      }
      headerRow = namesRow.rowNumber;
    } else {
      for (let c = 0; c < columnCount; c++) headers[c] = texts[c] ? texts[c] : null;
    }
  } else if (options.splitComment && options.headerRow === undefined) {
    // a "# R E" comment line right above the data (numpy.savetxt writes its header this way)
    const first = rows[0];
    const comment = [...grid.rows].reverse().find((r) => r.rowNumber < first.rowNumber && r.comment !== undefined && filledOrComment(r));
    const between = comment ? grid.rows.filter((r) => r.rowNumber > comment.rowNumber && r.rowNumber < first.rowNumber && filled(r)) : [];
    if (comment && between.length === 0) {
      const fields = options.splitComment(comment.comment as string).map((f) => clipHeader(f.trim()));
      if (fields.length === columnCount && fields.every((f) => f !== '' && !/^[+-]?\d/.test(f))) {
        fields.forEach((f, c) => (headers[c] = f));
        headerRow = comment.rowNumber;
        warnings.push(`The column names were taken from the comment line on row ${comment.rowNumber}.`);
      }
    }
  }
  for (let c = 0; c < columnCount; c++) if (headers[c] === undefined) headers[c] = null;
  if (columnCount > MAX_COLUMNS) columnCount = MAX_COLUMNS;
  return { headerRow, headers: headers.slice(0, columnCount), rows, columnCount, warnings };
}

/** headers longer than this are cut (header patterns then stay linear in practice) */
export const MAX_HEADER_LENGTH = 120;

function clipHeader(text: string): string {
  return text.length > MAX_HEADER_LENGTH ? text.slice(0, MAX_HEADER_LENGTH - 1) + '…' : text;
}

function filledOrComment(row: GridRow): boolean {
  return row.comment !== undefined && row.comment.trim() !== '';
}

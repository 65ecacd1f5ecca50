/**
 * Takes the numbers out of the chosen columns, row by row, and refuses the first cell that is not
 * a usable number — naming its row and column and what belonged there. Rows at the end of the
 * table with a distance and no energy at all (an unfilled template grid) are left out with a
 * warning; an empty cell anywhere else is refused.
 */
import type { ColumnPlan } from './choose-columns';
import { cellDisplay, type LocatedTable } from './locate-table';
import { looksLikeCommaDecimal, looksLikePointDecimal } from './parse-number';
import { makeReadError, refuse, ReadRefusal, type ReadError, type ReadErrorCode } from './read-errors';
import { MINIMUM_POINTS, type GridCell, type GridRow } from './types';

export interface ExtractedPoints {
  rowNumbers: number[];
  /** raw distances in file order */
  distance: number[];
  /** raw energies per chosen energy column (plan.energies order), file order */
  energies: number[][];
  warnings: string[];
}

export interface ExtractContext {
  sheet: string | null;
  kind: 'csv' | 'xlsx';
  decimalComma?: boolean;
  /** "a distance (a positive number in Å)" per column index */
  expected: (column: number) => string;
}

function place(sheet: string | null, row: number, letter: string): string {
  return `${sheet ? `Sheet "${sheet}", row` : 'Row'} ${row}, column ${letter}`;
}

interface Problem {
  code: ReadErrorCode;
  error: ReadError;
}

function cellProblem(cell: GridCell | undefined, row: GridRow, column: number, letter: string, ctx: ExtractContext): Problem | null {
  if (cell !== undefined && cell.kind === 'number') return null;
  const where = place(ctx.sheet, row.rowNumber, letter);
  const expected = ctx.expected(column);
  const at = { sheet: ctx.sheet, row: row.rowNumber, column: letter, expected };
  const make = (code: ReadErrorCode, message: string): Problem => ({ code, error: makeReadError(code, message, at) });
  if (cell === undefined) return make('missing_value', `${where} is empty; expected ${expected}.`);
  switch (cell.kind) {
    case 'date':
      return make(
        'date_in_numeric_cell',
        `${where} holds a date (${cell.display}); expected ${expected}. A spreadsheet may have turned a number such as 1.5 into a date: format the column as Number and type the value again.`,
      );
    case 'error':
      return make('not_a_number', `${where} holds the spreadsheet error ${cell.text}; expected ${expected}.`);
    case 'formula':
      return make(
        'not_a_number',
        `${where} holds a formula (=${cell.formula}) with no saved result; expected ${expected}. Bondmark never recalculates formulas: open the file in a spreadsheet program and save it again.`,
      );
    case 'bool':
      return make('not_a_number', `${where} holds ${cellDisplay(cell)}; expected ${expected}.`);
    case 'text': {
      const text = cell.text.length > 40 ? cell.text.slice(0, 37) + '…' : cell.text;
      let hint = '';
      if (ctx.kind === 'csv' && ctx.decimalComma && looksLikePointDecimal(cell.text)) {
        hint = ' The file writes its other numbers with a decimal comma (1,25); write this one the same way.';
      } else if (ctx.kind === 'csv' && !ctx.decimalComma && looksLikeCommaDecimal(cell.text)) {
        hint = ' The file writes its other numbers with a decimal point (1.25); write this one the same way.';
      } else if (/^[+-]?(nan|inf|infinity|-?1\.#(ind|inf))$/i.test(cell.text.trim())) {
        hint = ' NaN and infinity are not values that can be marked.';
      }
      return make('not_a_number', `${where} holds "${text}"; expected ${expected}.${hint}`);
    }
  }
}

export function extractPoints(table: LocatedTable, plan: ColumnPlan, ctx: ExtractContext): ExtractedPoints {
  const warnings: string[] = [];
  const d = plan.distance;
  const energyColumns = plan.energies;
  const letter = (c: number) => plan.columns[c].letter;
  const rows = table.rows.filter((row) => row.cells[d] !== undefined || energyColumns.some((e) => row.cells[e] !== undefined));

  // trailing rows with a distance and no energy at all: an unfilled grid, left out with a warning
  let end = rows.length;
  while (end > 0 && energyColumns.every((e) => rows[end - 1].cells[e] === undefined)) end--;
  if (end < rows.length) {
    const first = rows[end].rowNumber;
    const last = rows[rows.length - 1].rowNumber;
    warnings.push(
      `${first === last ? `Row ${first} has` : `Rows ${first}–${last} have`} a distance but no energy${ctx.sheet ? ` on sheet "${ctx.sheet}"` : ''}; ${first === last ? 'it was' : 'they were'} left out.`,
    );
  }

  const chosen = [d, ...energyColumns];
  let firstProblem: Problem | null = null;
  let sameProblems = 0;
  const rowNumbers: number[] = [];
  const distance: number[] = [];
  const energies: number[][] = energyColumns.map(() => []);
  for (let i = 0; i < end; i++) {
    const row = rows[i];
    for (const c of chosen) {
      const cell = row.cells[c];
      if (cell !== undefined && cell.kind === 'number') continue;
      const problem = cellProblem(cell, row, c, letter(c), ctx);
      if (!problem) continue;
      if (!firstProblem) firstProblem = problem;
      else if (problem.code === firstProblem.code) sameProblems++;
    }
    if (firstProblem) continue;
    rowNumbers.push(row.rowNumber);
    distance.push((row.cells[d] as { value: number }).value);
    energyColumns.forEach((c, k) => energies[k].push((row.cells[c] as { value: number }).value));
  }
  if (ctx.kind === 'xlsx' && !firstProblem) {
    const asText: string[] = [];
    for (let i = 0; i < end; i++) {
      for (const c of [d, ...energyColumns]) {
        const cell = rows[i].cells[c];
        if (cell && cell.kind === 'number' && cell.text !== undefined) asText.push(`${letter(c)}${rows[i].rowNumber}`);
      }
    }
    if (asText.length > 0) {
      warnings.push(
        `${asText.length === 1 ? 'Cell' : `${asText.length} cells, such as`} ${asText.slice(0, 3).join(', ')}${ctx.sheet ? ` on sheet "${ctx.sheet}"` : ''}, ${asText.length === 1 ? 'holds a number' : 'hold numbers'} stored as text; ${asText.length === 1 ? 'it was' : 'they were'} read as ${asText.length === 1 ? 'a number' : 'numbers'}.`,
      );
    }
  }
  if (firstProblem) {
    const error = { ...firstProblem.error };
    if (sameProblems > 0) error.message += ` (${sameProblems} more cell${sameProblems === 1 ? '' : 's'} in the table ${sameProblems === 1 ? 'has' : 'have'} the same problem.)`;
    throw new ReadRefusal(error);
  }

  const distanceLetter = letter(d);
  const nonPositive = distance.findIndex((r) => !(r > 0));
  if (nonPositive >= 0) {
    const row = rowNumbers[nonPositive];
    refuse(
      'nonpositive_distance',
      `${place(ctx.sheet, row, distanceLetter)} gives the distance ${distance[nonPositive]}; a distance between nuclei must be greater than zero.`,
      { sheet: ctx.sheet, row, column: distanceLetter, expected: ctx.expected(d) },
    );
  }
  const seen = new Map<number, number>();
  for (let i = 0; i < distance.length; i++) {
    const before = seen.get(distance[i]);
    if (before !== undefined) {
      const row = rowNumbers[i];
      refuse(
        'duplicate_distance',
        `${ctx.sheet ? `Sheet "${ctx.sheet}", rows` : 'Rows'} ${rowNumbers[before]} and ${row} (column ${distanceLetter}) both give the distance ${distance[i]}; each distance may appear once.`,
        { sheet: ctx.sheet, row, column: distanceLetter, expected: 'a different distance on every row' },
      );
    }
    seen.set(distance[i], i);
  }
  if (distance.length < MINIMUM_POINTS) {
    const rowText = rowNumbers.length === 0 ? 'none' : rowNumbers.length === 1 ? `row ${rowNumbers[0]}` : `rows ${rowNumbers[0]}–${rowNumbers[rowNumbers.length - 1]}`;
    refuse(
      'too_few_points',
      `Only ${distance.length} point${distance.length === 1 ? '' : 's'} (${rowText}${ctx.sheet ? ` on sheet "${ctx.sheet}"` : ''}) ${distance.length === 1 ? 'has' : 'have'} a distance and energies; at least ${MINIMUM_POINTS} are needed to mark a curve.`,
      {
        sheet: ctx.sheet,
        row: rowNumbers.length > 0 ? rowNumbers[rowNumbers.length - 1] : table.rows[0]?.rowNumber,
        column: distanceLetter,
        expected: `at least ${MINIMUM_POINTS} points`,
      },
    );
  }
  return { rowNumbers, distance, energies, warnings };
}

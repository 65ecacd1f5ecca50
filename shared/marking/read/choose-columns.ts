/**
 * Gives every table column a role — distance, energy, other (overlap S, J, K, an index …), text
 * or empty — and picks the distance column and the energy columns. Order of authority: the user's
 * choice, the template, header words, then the numbers (a positive, strictly monotonic column is
 * the distance; a leading 1, 2, 3 … column is an index).
 */
import { readHeader, type HeaderReading } from './header-words';
import { isNumberLike, type LocatedTable } from './locate-table';
import { columnIndex, columnLetter, refuse } from './read-errors';
import type { ColumnInfo } from './types';

export interface ColumnPlan {
  columns: ColumnInfo[];
  readings: (HeaderReading | null)[];
  distance: number;
  energies: number[];
  warnings: string[];
}

export interface ColumnRequest {
  distanceColumn?: string;
  energyColumns?: string[];
  source: 'user' | 'template';
}

function numbersOf(table: LocatedTable, column: number): number[] {
  const values: number[] = [];
  for (const row of table.rows) {
    const cell = row.cells[column];
    if (cell && cell.kind === 'number') values.push(cell.value);
  }
  return values;
}

function strictlyMonotonic(values: number[]): 'increasing' | 'decreasing' | null {
  if (values.length < 2) return null;
  let up = true;
  let down = true;
  for (let i = 1; i < values.length; i++) {
    if (!(values[i] > values[i - 1])) up = false;
    if (!(values[i] < values[i - 1])) down = false;
  }
  return up ? 'increasing' : down ? 'decreasing' : null;
}

function looksLikeIndex(values: number[]): boolean {
  if (values.length < 3 || !(values[0] === 0 || values[0] === 1)) return false;
  for (let i = 1; i < values.length; i++) if (values[i] - values[i - 1] !== 1) return false;
  return true;
}

export function chooseColumns(
  table: LocatedTable,
  sheet: string | null,
  requests: ColumnRequest[],
  onColumns?: (columns: ColumnInfo[]) => void,
): ColumnPlan {
  const warnings: string[] = [];
  const readings: (HeaderReading | null)[] = [];
  const columns: ColumnInfo[] = [];
  const usedKeys = new Map<string, number>();

  // one pass over the filled cells only (rows are sparse arrays)
  const numericCounts = new Array<number>(table.columnCount).fill(0);
  const textCounts = new Array<number>(table.columnCount).fill(0);
  for (const row of table.rows) {
    row.cells.forEach((cell, c) => {
      if (cell === undefined || c >= table.columnCount) return;
      if (isNumberLike(cell)) numericCounts[c]++;
      else textCounts[c]++;
    });
  }
  for (let c = 0; c < table.columnCount; c++) {
    const header = table.headers[c];
    const reading = header ? readHeader(header) : null;
    readings.push(reading);
    const numericCount = numericCounts[c];
    const textCount = textCounts[c];
    const emptyCount = table.rows.length - numericCount - textCount;
    const letter = columnLetter(c);
    // a column of numbers: more numbers than words, or any numbers under a distance/energy header
    const named = reading?.role === 'distance' || reading?.role === 'energy';
    const numeric = numericCount > 0 && (numericCount >= textCount || named);
    const role: ColumnInfo['role'] = numeric ? 'other' : textCount > 0 ? 'text' : 'empty';
    const baseKey = (reading && reading.name) || header || letter;
    usedKeys.set(baseKey, (usedKeys.get(baseKey) ?? 0) + 1);
    const headerUnit = reading
      ? reading.role === 'distance'
        ? reading.units.distance
        : reading.role === 'energy'
          ? reading.units.energy
          : (reading.units.distance ?? reading.units.energy)
      : null;
    columns.push({
      index: c,
      letter,
      header,
      key: baseKey,
      role,
      roleSource: 'numbers',
      curve: reading?.curve ?? null,
      headerUnit,
      unit: null,
      numericCount,
      textCount,
      emptyCount,
    });
    if (reading?.unknownUnit) {
      warnings.push(`Column ${letter} ("${header}") names the unit "${reading.unknownUnit}", which Bondmark does not read; choose the unit by hand if the guess below is wrong.`);
    }
  }
  for (const column of columns) {
    if ((usedKeys.get(column.key) ?? 0) > 1) column.key = `${column.key} (${column.letter})`;
  }
  onColumns?.(columns);
  const numericColumns = columns.filter((c) => c.role === 'other');
  const find = (name: string, what: string): number => {
    const byLetter = columnIndex(name);
    const lower = name.trim().toLowerCase();
    const match =
      columns.find((c) => c.key.toLowerCase() === lower) ??
      columns.find((c) => (c.header ?? '').toLowerCase() === lower) ??
      (byLetter >= 0 ? columns[byLetter] : undefined);
    if (!match) {
      refuse('bad_choice', `There is no column "${name}" in the table${sheet ? ` on sheet "${sheet}"` : ''} to use as the ${what}.`, {
        sheet,
        column: byLetter >= 0 ? name.toUpperCase() : undefined,
        expected: `one of the columns ${columns.map((c) => c.letter).join(', ')}`,
      });
    }
    if (match.numericCount === 0) {
      refuse('bad_choice', `Column ${match.letter} holds no numbers, so it cannot be the ${what}.`, {
        sheet,
        column: match.letter,
        expected: 'a column of numbers',
      });
    }
    return match.index;
  };

  // --- distance ---------------------------------------------------------------------------
  let distance = -1;
  let energies: number[] | null = null;
  let distanceSource: ColumnInfo['roleSource'] = 'numbers';
  let energySource: 'user' | 'template' | null = null;
  const indexColumns = new Set<number>();
  for (const request of requests) {
    if (distance < 0 && request.distanceColumn) {
      distance = find(request.distanceColumn, 'distance');
      distanceSource = request.source;
    }
    if (energies === null && request.energyColumns && request.energyColumns.length > 0) {
      energies = request.energyColumns.map((name) => find(name, 'energy'));
      energySource = request.source;
    }
  }
  if (distance < 0) {
    const named = numericColumns.find((c) => readings[c.index]?.role === 'distance' && !(energies ?? []).includes(c.index));
    if (named) {
      distance = named.index;
      distanceSource = 'header';
    }
  }
  if (distance < 0) {
    const pool = numericColumns.filter(
      (c) => !(energies ?? []).includes(c.index) && readings[c.index]?.role !== 'energy' && readings[c.index]?.role !== 'other',
    );
    const candidates = pool.length > 0 ? pool : numericColumns.filter((c) => !(energies ?? []).includes(c.index));
    const described = candidates.map((c) => {
      const values = numbersOf(table, c.index);
      return { column: c, values, order: strictlyMonotonic(values), positive: values.every((v) => v > 0) };
    });
    const usable = described.filter((d) => d.positive && d.order !== null);
    const withoutIndex = usable.filter((d) => !looksLikeIndex(d.values));
    const pick =
      withoutIndex.find((d) => d.order === 'increasing') ??
      withoutIndex[0] ??
      usable[0] ??
      described.find((d) => d.positive) ??
      described[0];
    if (!pick) {
      refuse('too_few_columns', `The table${sheet ? ` on sheet "${sheet}"` : ''} has no column of numbers that could be the distance.`, {
        sheet,
        expected: 'a distance column and at least one energy column',
      });
    }
    distance = pick.column.index;
    for (const d of usable) {
      if (d !== pick && looksLikeIndex(d.values) && !readings[d.column.index]?.role) {
        indexColumns.add(d.column.index);
        warnings.push(`Column ${d.column.letter} counts 1, 2, 3 … and was taken as a row index, not as data.`);
      }
    }
    const headerNote = table.headerRow === null ? 'the table has no header' : 'no header names a distance';
    warnings.push(
      `Column ${pick.column.letter} was taken as the distance because ${headerNote} and its numbers are ${pick.order ? `positive and ${pick.order === 'increasing' ? 'rising' : 'falling'}` : 'the best fit'}.`,
    );
  }
  const distanceColumn = columns[distance];
  distanceColumn.role = 'distance';
  distanceColumn.roleSource = distanceSource;

  // --- energies ---------------------------------------------------------------------------
  if (energies === null) {
    energies = [];
    for (const c of numericColumns) {
      if (c.index === distance) continue;
      const role = readings[c.index]?.role;
      if (role === 'other' || indexColumns.has(c.index)) continue;
      if (role === 'distance') {
        warnings.push(`Column ${c.letter} ("${c.header}") also looks like a distance and was not read as an energy.`);
        continue;
      }
      energies.push(c.index);
    }
  }
  energies = energies.filter((e, i, all) => e !== distance && all.indexOf(e) === i);
  if (energies.length === 0) {
    refuse('too_few_columns', `Column ${distanceColumn.letter} holds the distances, but no column${sheet ? ` on sheet "${sheet}"` : ''} holds energies.`, {
      sheet,
      column: distanceColumn.letter,
      expected: 'at least one energy column beside the distances',
    });
  }
  for (const e of energies) {
    columns[e].role = 'energy';
    columns[e].roleSource = energySource ?? (readings[e]?.role === 'energy' ? 'header' : 'numbers');
  }
  return { columns, readings, distance, energies, warnings };
}

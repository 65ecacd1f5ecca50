/**
 * readReport / readReportWithChoice: an uploaded data file → clean points in bohr and hartree
 * with their units, or a refusal that names the place. Never throws, for any input.
 * The XLSX path (JSZip) is loaded on demand so that a CSV-only caller never pulls it in.
 */
import {
  distanceToBohr,
  distanceUnitLabel,
  energyToHartree,
  energyUnitLabel,
  type DistanceUnit,
  type EnergyUnit,
} from '@shared/chemistry/units';
import { chooseColumns, type ColumnPlan, type ColumnRequest } from './choose-columns';
import { sniffFile } from './detect-file-type';
import { extractPoints, type ExtractedPoints } from './extract-points';
import { conventionOf, curveShape, extent, guessDistanceUnit, guessEnergyUnit, mainCurveIndex } from './guess-units';
import { cellDisplay, isNumberLike, locateTable, type LocatedTable } from './locate-table';
import { readDelimitedText } from './read-delimited-text';
import { makeReadError, ReadRefusal, refuse } from './read-errors';
import { parseCellReference, readTemplateMeta, TEMPLATE_META_SHEET, type TemplateMeta } from './template-meta';
import {
  DEFAULT_LIMITS,
  type ColumnInfo,
  type Grid,
  type ReadChoice,
  type ReadOptions,
  type ReadResult,
  type ReadSuccess,
  type TableInfo,
  type TemplateInfo,
  type UnitSource,
} from './types';
import type { ZipEntryInfo } from './zip-directory';

interface ReadState {
  warnings: string[];
  table?: TableInfo;
  template?: TemplateInfo;
}

/** Reads an uploaded data file (CSV/TSV/text or .xlsx), choosing columns and units itself. */
export async function readReport(bytes: Uint8Array, options: ReadOptions = {}): Promise<ReadResult> {
  return guarded(bytes, options, {});
}

/**
 * Reads the file with the columns, units, sheet or convention the student chose on the upload
 * page; anything left out is decided as readReport decides it. Same result shape.
 */
export async function readReportWithChoice(bytes: Uint8Array, options: ReadOptions & ReadChoice): Promise<ReadResult> {
  return guarded(bytes, options, options);
}

async function guarded(bytes: Uint8Array, options: ReadOptions, choice: ReadChoice): Promise<ReadResult> {
  const state: ReadState = { warnings: [] };
  try {
    return await readOrRefuse(bytes, options, choice, state);
  } catch (error) {
    const readError =
      error instanceof ReadRefusal
        ? error.readError
        : makeReadError('unreadable', `The file could not be read (unexpected: ${(error instanceof Error ? error.message : String(error)).slice(0, 160)}).`);
    const failure: ReadResult = { ok: false, error: readError, warnings: state.warnings };
    if (state.table) failure.table = state.table;
    if (state.template) failure.template = state.template;
    return failure;
  }
}

async function readOrRefuse(input: Uint8Array, options: ReadOptions, choice: ReadChoice, state: ReadState): Promise<ReadResult> {
  const bytes: Uint8Array =
    input instanceof Uint8Array ? input : (input as unknown) instanceof ArrayBuffer ? new Uint8Array(input as unknown as ArrayBuffer) : refuse('unreadable', 'No file content was given.');
  const limits = {
    maxRows: options.maxRows ?? DEFAULT_LIMITS.maxRows,
    maxCells: options.maxCells ?? DEFAULT_LIMITS.maxCells,
    maxUncompressedBytes: options.maxUncompressedBytes ?? DEFAULT_LIMITS.maxUncompressedBytes,
  };
  if (bytes.length > limits.maxUncompressedBytes) {
    refuse('too_large', `The file has ${bytes.length} bytes; the limit is ${limits.maxUncompressedBytes}.`, {
      expected: `at most ${limits.maxUncompressedBytes} bytes`,
    });
  }
  const sniffed = sniffFile(bytes, options.fileName);
  if (sniffed.nameSuggests) {
    state.warnings.push(`The file is named ".${sniffed.nameSuggests}" but holds ${sniffed.description}; it was read by its content.`);
  }
  const saveAs = 'Save it as .xlsx or CSV and upload it again.';
  switch (sniffed.kind) {
    case 'empty':
      refuse('empty_file', 'The file is empty.', { expected: 'a table with a distance column and energy columns' });
    case 'pdf':
      refuse('pdf_file', 'This is a PDF. Upload it as the write-up; the data belongs in a CSV or .xlsx file.', {
        expected: 'a CSV or .xlsx data file',
      });
    case 'xls':
      refuse('legacy_xls', `This is ${sniffed.description}, a format Bondmark does not read. ${saveAs}`, { expected: '.xlsx or CSV' });
    case 'encrypted':
      refuse('encrypted_workbook', `The workbook is password-protected. Remove the password (or save a copy without it) and upload it again.`, {
        expected: 'a workbook without a password',
      });
    case 'xlsm':
      refuse('macro_workbook', `This is ${sniffed.description}. ${saveAs.replace('.xlsx', 'a plain .xlsx workbook (no macros)')}`, {
        expected: 'an .xlsx workbook without macros',
      });
    case 'broken-zip':
      refuse('unreadable', `This looks like a workbook but is ${sniffed.description}. ${saveAs}`, { expected: 'a complete .xlsx file' });
    case 'unknown':
      refuse('unknown_type', `This is ${sniffed.description}, not a data table. ${saveAs}`, { expected: 'a CSV or .xlsx data file' });
    case 'text':
      return readText(sniffed.text as string, sniffed.encoding, options, choice, limits, state);
    case 'xlsx': {
      if ((sniffed.zipTotalUncompressed ?? 0) > limits.maxUncompressedBytes) {
        refuse('too_large', `The workbook would inflate to ${sniffed.zipTotalUncompressed} bytes; the limit is ${limits.maxUncompressedBytes}.`, {
          expected: `at most ${limits.maxUncompressedBytes} bytes uncompressed`,
        });
      }
      return readWorkbook(bytes, sniffed.zipEntries ?? [], choice, limits, state);
    }
  }
}

// -------------------------------------------------------------------------------------------
// text
// -------------------------------------------------------------------------------------------

function readText(
  text: string,
  encoding: TableInfo['encoding'],
  options: ReadOptions,
  choice: ReadChoice,
  limits: { maxRows: number; maxCells: number },
  state: ReadState,
): ReadSuccess {
  const preferTab = /\.(tsv|tab)$/i.test(options.fileName ?? '');
  const { grid, delimiter, decimalComma } = readDelimitedText(text, limits, preferTab);
  if (grid.rows.every((r) => r.comment !== undefined || r.cells.every((c) => c === undefined))) {
    refuse('empty_file', 'The file holds only blank lines and comments.', { expected: 'a table with a distance column and energy columns' });
  }
  if (encoding === 'windows-1252') state.warnings.push('The file is not UTF-8; it was read as Windows-1252 (Western European) text.');
  const splitComment = (line: string) => (delimiter === 'whitespace' ? line.trim().split(/\s+/) : line.split(delimiter));
  const located = locateTable(grid, { sheet: null, splitComment });
  return interpret(grid, located, { kind: 'csv', sheet: null, delimiter, decimalComma, encoding }, choice, null, state);
}

// -------------------------------------------------------------------------------------------
// workbook
// -------------------------------------------------------------------------------------------

async function readWorkbook(
  bytes: Uint8Array,
  entries: ZipEntryInfo[],
  choice: ReadChoice,
  limits: { maxRows: number; maxCells: number; maxUncompressedBytes: number },
  state: ReadState,
): Promise<ReadSuccess> {
  const { openXlsx } = await import('./read-xlsx');
  const book = await openXlsx(bytes, entries, limits);
  const grids = new Map<string, Grid>();
  const gridOf = async (name: string) => {
    let grid = grids.get(name);
    if (!grid) {
      grid = await book.readSheet(name);
      grids.set(name, grid);
    }
    return grid;
  };

  // the template's hidden sheet
  let meta: Partial<TemplateMeta> | null = null;
  const metaSheet = book.sheets.find((s) => s.name === TEMPLATE_META_SHEET);
  if (metaSheet) {
    const reading = readTemplateMeta(await gridOf(metaSheet.name));
    if (reading.isTemplate) {
      meta = reading.meta;
      state.warnings.push(...reading.problems);
      state.template = {
        exerciseId: reading.meta.exerciseId ?? '',
        variantKey: reading.meta.variantKey ?? '',
        studentNumber: reading.meta.studentNumber ?? '',
        templateToken: reading.meta.templateToken ?? '',
        version: reading.meta.version ?? 1,
        answers: {},
      };
    } else {
      state.warnings.push(`The workbook has a sheet "${TEMPLATE_META_SHEET}" that is not a Bondmark template description; it was ignored.`);
    }
  }

  // which sheet holds the table
  const worksheets = book.sheets.filter((s) => s.path !== null && s.name !== TEMPLATE_META_SHEET);
  let sheetName: string | null = null;
  if (choice.sheet) {
    if (!worksheets.some((s) => s.name === choice.sheet)) {
      refuse('bad_choice', `The workbook has no sheet "${choice.sheet}".`, {
        expected: `one of ${worksheets.map((s) => `"${s.name}"`).join(', ')}`,
      });
    }
    sheetName = choice.sheet;
  } else if (meta?.dataSheet) {
    if (!worksheets.some((s) => s.name === meta!.dataSheet)) {
      refuse('bad_template', `The template's data sheet "${meta.dataSheet}" is missing from the workbook; download a fresh template and copy your numbers into it.`, {
        sheet: meta.dataSheet,
        expected: `a sheet named "${meta.dataSheet}"`,
      });
    }
    sheetName = meta.dataSheet;
  } else {
    const skipped: string[] = [];
    for (const sheet of worksheets.filter((s) => s.state === 'visible')) {
      const grid = await gridOf(sheet.name);
      if (grid.rows.some((r) => r.cells.filter(isNumberLike).length >= 2)) {
        sheetName = sheet.name;
        break;
      }
      skipped.push(sheet.name);
    }
    if (sheetName === null) {
      const looked = worksheets.filter((s) => s.state === 'visible').map((s) => `"${s.name}"`);
      refuse('no_numeric_data', `No sheet of the workbook holds a table of numbers${looked.length > 0 ? ` (looked at ${looked.join(', ')})` : ''}.`, {
        sheet: worksheets[0]?.name,
        expected: 'a sheet with a distance column and energy columns',
      });
    }
    if (skipped.length > 0) {
      state.warnings.push(`Read sheet "${sheetName}"; ${skipped.map((s) => `"${s}"`).join(', ')} before it ${skipped.length === 1 ? 'holds' : 'hold'} no table of numbers.`);
    }
  }
  const grid = await gridOf(sheetName);

  // answer cells named by the template
  if (meta && state.template) {
    for (const [name, ref] of Object.entries(meta.answers ?? {})) {
      const parsed = parseCellReference(ref);
      if (!parsed) {
        state.warnings.push(`The template names the answer cell "${ref}" for ${name}, which is not a cell reference.`);
        continue;
      }
      const sheet = parsed.sheet ?? sheetName;
      const answerGrid = book.sheets.some((s) => s.name === sheet && s.path) ? await gridOf(sheet) : null;
      const cell = answerGrid?.rows.find((r) => r.rowNumber === parsed.row)?.cells[parsed.column];
      state.template.answers[name] = {
        cell: ref,
        value: !cell ? null : cell.kind === 'number' ? cell.value : cell.kind === 'text' ? cell.text : cellDisplay(cell),
      };
    }
  }

  const useTemplateLayout = meta !== null && sheetName === meta.dataSheet;
  const located = locateTable(grid, { sheet: sheetName, headerRow: useTemplateLayout ? meta?.headerRow : undefined });
  return interpret(grid, located, { kind: 'xlsx', sheet: sheetName }, choice, useTemplateLayout ? meta : null, state);
}

// -------------------------------------------------------------------------------------------
// table → points
// -------------------------------------------------------------------------------------------

interface SourceInfo {
  kind: 'csv' | 'xlsx';
  sheet: string | null;
  delimiter?: TableInfo['delimiter'];
  decimalComma?: boolean;
  encoding?: TableInfo['encoding'];
}

function tableInfo(grid: Grid, located: LocatedTable, columns: ColumnInfo[], source: SourceInfo): TableInfo {
  const previewRows = [
    ...(located.headerRow !== null ? grid.rows.filter((r) => r.rowNumber === located.headerRow) : []),
    ...located.rows.slice(0, 8),
  ];
  const info: TableInfo = {
    kind: source.kind,
    sheet: source.sheet,
    columns,
    rows: located.rows.length,
    headerRow: located.headerRow,
    firstDataRow: located.rows[0]?.rowNumber ?? 0,
    lastDataRow: located.rows[located.rows.length - 1]?.rowNumber ?? 0,
    preview: previewRows.map((r) => ({
      rowNumber: r.rowNumber,
      cells: Array.from({ length: located.columnCount }, (_, c) =>
        r.rowNumber === located.headerRow ? (located.headers[c] ?? '') : cellDisplay(r.cells[c]),
      ),
    })),
  };
  if (source.delimiter !== undefined) info.delimiter = source.delimiter;
  if (source.decimalComma !== undefined) info.decimalComma = source.decimalComma;
  if (source.encoding !== undefined) info.encoding = source.encoding;
  return info;
}

function interpret(
  grid: Grid,
  located: LocatedTable,
  source: SourceInfo,
  choice: ReadChoice,
  meta: Partial<TemplateMeta> | null,
  state: ReadState,
): ReadSuccess {
  state.warnings.push(...located.warnings);
  const sheet = source.sheet;
  const requests: ColumnRequest[] = [];
  if (choice.distanceColumn || choice.energyColumns) {
    requests.push({ distanceColumn: choice.distanceColumn, energyColumns: choice.energyColumns, source: 'user' });
  }
  if (meta && (meta.distanceColumn || meta.energyColumns)) {
    requests.push({ distanceColumn: meta.distanceColumn, energyColumns: meta.energyColumns, source: 'template' });
  }
  const plan: ColumnPlan = chooseColumns(located, sheet, requests, (columns) => {
    state.table = tableInfo(grid, located, columns, source);
  });
  state.warnings.push(...plan.warnings);
  const { columns, readings } = plan;
  for (const column of columns) {
    const units = readings[column.index]?.units;
    column.headerUnit = !units
      ? null
      : column.role === 'distance'
        ? units.distance
        : column.role === 'energy'
          ? units.energy
          : (units.distance ?? units.energy);
  }
  state.table = tableInfo(grid, located, columns, source);

  // units known before the numbers are read (for the messages)
  const distanceColumn = columns[plan.distance];
  const headerDistance = distanceColumn.headerUnit as DistanceUnit | null;
  const labeledEnergy = plan.energies.map((e) => columns[e].headerUnit as EnergyUnit | null);
  const knownDistance: DistanceUnit | null = choice.distanceUnit ?? headerDistance ?? meta?.distanceUnit ?? null;
  const knownEnergy = (k: number): EnergyUnit | null =>
    choice.energyUnit ?? labeledEnergy[k] ?? labeledEnergy.find((u) => u !== null) ?? meta?.energyUnit ?? null;
  const expected = (column: number) => {
    if (column === plan.distance) {
      return `a distance (a positive number${knownDistance ? ` in ${distanceUnitLabel[knownDistance]}` : ''})`;
    }
    const unit = knownEnergy(plan.energies.indexOf(column));
    return `an energy (a number${unit ? ` in ${energyUnitLabel[unit]}` : ''})`;
  };
  const extracted: ExtractedPoints = extractPoints(located, plan, { sheet, kind: source.kind, decimalComma: source.decimalComma, expected });
  state.warnings.push(...extracted.warnings);

  // order by distance
  const order = extracted.distance.map((_, i) => i).sort((a, b) => extracted.distance[a] - extracted.distance[b]);
  const ascending = order.every((v, i) => v === i);
  if (!ascending) {
    const descending = order.every((v, i) => v === order.length - 1 - i);
    state.warnings.push(`The rows ${descending ? 'run from large to small distances' : 'are not in order of distance'}; the points were sorted.`);
  }
  const rawDistance = order.map((i) => extracted.distance[i]);
  const rawEnergies = extracted.energies.map((values) => order.map((i) => values[i]));
  const rowNumbers = order.map((i) => extracted.rowNumbers[i]);
  const main = mainCurveIndex(rawEnergies);

  // energy units, per column
  const energyUnitsChosen: EnergyUnit[] = [];
  const energySources: UnitSource[] = [];
  let guessedEnergy: ReturnType<typeof guessEnergyUnit> | null = null;
  const labeledUnits = labeledEnergy.filter((u): u is EnergyUnit => u !== null);
  plan.energies.forEach((e, k) => {
    const column = columns[e];
    if (choice.energyUnit) {
      energyUnitsChosen.push(choice.energyUnit);
      energySources.push('user');
    } else if (labeledEnergy[k]) {
      const unit = labeledEnergy[k] as EnergyUnit;
      if (meta?.energyUnit && meta.energyUnit !== unit) {
        state.warnings.push(`Column ${column.letter}'s header says ${energyUnitLabel[unit]} but the template asked for ${energyUnitLabel[meta.energyUnit]}; it was read as ${energyUnitLabel[unit]}.`);
        energySources.push('header');
      } else energySources.push(meta?.energyUnit ? 'template' : 'header');
      energyUnitsChosen.push(unit);
    } else if (labeledUnits.length > 0) {
      const unit = labeledEnergy[main] ?? labeledUnits[0];
      energyUnitsChosen.push(unit);
      energySources.push('header');
      state.warnings.push(`Column ${column.letter} names no unit; it was read in ${energyUnitLabel[unit]} like the other energy columns.`);
    } else if (meta?.energyUnit) {
      energyUnitsChosen.push(meta.energyUnit);
      energySources.push('template');
    } else {
      guessedEnergy ??= guessEnergyUnit(rawEnergies[main]);
      energyUnitsChosen.push(guessedEnergy.unit);
      energySources.push('magnitude');
    }
  });
  if (guessedEnergy) {
    const guessed = plan.energies.filter((_, k) => energySources[k] === 'magnitude').map((e) => columns[e].letter);
    const unit = (guessedEnergy as { unit: EnergyUnit }).unit;
    state.warnings.push(
      (guessedEnergy as { plausible: boolean }).plausible
        ? `No unit was named for the energies in column${guessed.length > 1 ? 's' : ''} ${guessed.join(', ')}; they were read as ${energyUnitLabel[unit]} from the size of the numbers. Choose another unit if this is wrong.`
        : `The energies in column${guessed.length > 1 ? 's' : ''} ${guessed.join(', ')} name no unit and do not look like the energies of this bond in any unit; they were read as ${energyUnitLabel[unit]}. Check the file and choose the unit.`,
    );
  }
  if (new Set(energyUnitsChosen).size > 1) {
    state.warnings.push(`The energy columns are in different units (${[...new Set(energyUnitsChosen)].map((u) => energyUnitLabel[u]).join(', ')}); each was converted with its own.`);
  }

  // distance unit
  let distanceUnit: DistanceUnit;
  let distanceSource: UnitSource;
  if (choice.distanceUnit) {
    distanceUnit = choice.distanceUnit;
    distanceSource = 'user';
  } else if (headerDistance) {
    distanceUnit = headerDistance;
    distanceSource = meta?.distanceUnit === headerDistance ? 'template' : 'header';
    if (meta?.distanceUnit && meta.distanceUnit !== headerDistance) {
      state.warnings.push(`Column ${distanceColumn.letter}'s header says ${distanceUnitLabel[headerDistance]} but the template asked for ${distanceUnitLabel[meta.distanceUnit]}; it was read as ${distanceUnitLabel[headerDistance]}.`);
    }
  } else if (meta?.distanceUnit) {
    distanceUnit = meta.distanceUnit;
    distanceSource = 'template';
  } else {
    const guess = guessDistanceUnit(rawDistance, rawEnergies[main], energyUnitsChosen[main]);
    distanceUnit = guess.unit;
    distanceSource = 'magnitude';
    const [lo, hi] = extent(rawDistance);
    state.warnings.push(
      `Column ${distanceColumn.letter} names no unit; its distances (${lo}–${hi}) were read as ${distanceUnitLabel[distanceUnit]} because ${guess.reason}. Choose another unit if this is wrong.`,
    );
  }
  distanceColumn.unit = distanceUnit;
  plan.energies.forEach((e, k) => (columns[e].unit = energyUnitsChosen[k]));

  // convert
  const keys = plan.energies.map((e) => columns[e].key);
  const distanceBohr = rawDistance.map((r) => distanceToBohr(r, distanceUnit));
  const energies: Record<string, number[]> = {};
  const raw: Record<string, number[]> = {};
  keys.forEach((key, k) => {
    raw[key] = rawEnergies[k];
    energies[key] = rawEnergies[k].map((v) => energyToHartree(v, energyUnitsChosen[k]));
  });

  // convention
  const conventions = keys.map((key) => conventionOf(curveShape(energies[key]).last));
  let convention = conventions[main];
  let conventionSource: ReadSuccess['conventionSource'] = 'numbers';
  if (choice.convention) {
    convention = choice.convention;
    conventionSource = 'user';
  } else {
    if (new Set(conventions).size > 1) {
      const others = plan.energies.filter((_, k) => conventions[k] !== convention).map((e) => columns[e].letter);
      state.warnings.push(
        `Column ${columns[plan.energies[main]].letter} holds ${convention} energies but ${others.join(', ')} ${others.length === 1 ? 'looks' : 'look'} ${convention === 'total' ? 'relative' : 'total'}; all were taken as ${convention}.`,
      );
    }
    if (meta?.energyConvention && meta.energyConvention !== convention) {
      state.warnings.push(`The template asked for ${meta.energyConvention} energies, but the numbers look ${convention}; they were read as ${convention}.`);
    }
  }
  if (convention === 'relative' && conventionSource === 'numbers') {
    state.warnings.push('The energies approach zero at large distance, so they were read as relative energies (measured from the separated atoms); the marking shifts the reference to match.');
  }

  const table = state.table as TableInfo;
  const result: ReadSuccess = {
    ok: true,
    table,
    points: { distance: distanceBohr, energies, rowNumbers },
    raw: { distance: rawDistance, energies: raw },
    choice: { sheet, distanceColumn: distanceColumn.letter, energyColumns: plan.energies.map((e) => columns[e].letter) },
    units: {
      distance: distanceUnit,
      energy: energyUnitsChosen[main],
      distanceSource,
      energySource: energySources[main],
    },
    convention,
    conventionSource,
    warnings: state.warnings,
  };
  if (state.template) result.template = state.template;
  return result;
}

/**
 * Shapes of the report reader: the cell grid both file kinds are turned into, and the result.
 */
import type { DistanceUnit, EnergyUnit } from '@shared/chemistry/units';
import type { ReadError } from './read-errors';

// ---------------------------------------------------------------------------------------------
// Grid: what CSV/TSV text and XLSX sheets both become before the table is located
// ---------------------------------------------------------------------------------------------

export type GridCell =
  /** `text` is the original spelling when the number came from text ("1,25") */
  | { kind: 'number'; value: number; text?: string }
  | { kind: 'text'; text: string }
  /** a numeric cell with a date format (XLSX) — `display` is an ISO date */
  | { kind: 'date'; display: string }
  /** a spreadsheet error value such as #DIV/0! (cached result of a formula) */
  | { kind: 'error'; text: string }
  | { kind: 'bool'; value: boolean }
  /** a formula whose file holds no saved (cached) result — Bondmark never evaluates formulas */
  | { kind: 'formula'; formula: string };

export interface GridRow {
  /** 1-based row as a spreadsheet shows it (CSV: line number) */
  rowNumber: number;
  /** index = 0-based column; undefined = empty cell */
  cells: (GridCell | undefined)[];
  /** CSV/TSV line starting with # (its text without the #) */
  comment?: string;
}

export interface Grid {
  /** sheet name (XLSX) or null (text) */
  sheet: string | null;
  rows: GridRow[];
}

// ---------------------------------------------------------------------------------------------
// Result
// ---------------------------------------------------------------------------------------------

export type ColumnRole = 'distance' | 'energy' | 'other' | 'text' | 'empty';
export type UnitSource = 'header' | 'magnitude' | 'template' | 'user';
export type EnergyConvention = 'total' | 'relative';

export interface ColumnInfo {
  /** 0-based column index */
  index: number;
  /** spreadsheet letter, "A" — the identifier readReportWithChoice takes */
  letter: string;
  /** header text as in the file (a unit row below the names is joined with a space), or null */
  header: string | null;
  /** key in points.energies: the header without its unit, or the letter; unique in the table */
  key: string;
  role: ColumnRole;
  /** where the role came from: a header word, the template, the user, or the numbers themselves */
  roleSource: 'header' | 'template' | 'user' | 'numbers';
  /** header words naming a bonding (σg, E+) or antibonding (σu, E−) curve */
  curve: 'bonding' | 'antibonding' | null;
  /** unit written in the header (null when the header names none) */
  headerUnit: DistanceUnit | EnergyUnit | null;
  /** unit the column's values were read in (distance/energy columns only) */
  unit: DistanceUnit | EnergyUnit | null;
  numericCount: number;
  textCount: number;
  emptyCount: number;
}

export interface TableInfo {
  kind: 'csv' | 'xlsx';
  /** sheet read (XLSX) or null */
  sheet: string | null;
  columns: ColumnInfo[];
  /** number of table rows (data rows between header and end, blank rows excluded) */
  rows: number;
  /** 1-based header row, or null when the table has none */
  headerRow: number | null;
  firstDataRow: number;
  lastDataRow: number;
  /** text only: detected field separator and decimal mark */
  delimiter?: ',' | ';' | '\t' | '|' | 'whitespace';
  decimalComma?: boolean;
  encoding?: TextEncodingName;
  /** the first few table rows as display strings, for the upload preview */
  preview: { rowNumber: number; cells: string[] }[];
}

export type TextEncodingName = 'utf-8' | 'utf-16le' | 'utf-16be' | 'windows-1252';

export interface ReportPoints {
  /** distances in bohr, ascending */
  distance: number[];
  /** energies in hartree, one array per chosen column key, aligned with `distance` */
  energies: Record<string, number[]>;
  /** the 1-based file row each point came from */
  rowNumbers: number[];
}

export interface RawPoints {
  /** distances as written in the file (in units.distance), same order as points */
  distance: number[];
  /** energies as written, same order; each in its column's unit (ColumnInfo.unit) */
  energies: Record<string, number[]>;
}

export interface TemplateInfo {
  exerciseId: string;
  variantKey: string;
  studentNumber: string;
  templateToken: string;
  version: number;
  /** answer cells named by the template's meta sheet ("answer:<name>" rows) with what they hold */
  answers: Record<string, { cell: string; value: number | string | null }>;
}

export interface ReadSuccess {
  ok: true;
  table: TableInfo;
  points: ReportPoints;
  raw: RawPoints;
  /** column letters */
  choice: { sheet: string | null; distanceColumn: string; energyColumns: string[] };
  units: {
    distance: DistanceUnit;
    energy: EnergyUnit;
    distanceSource: UnitSource;
    energySource: UnitSource;
  };
  convention: EnergyConvention;
  conventionSource: 'numbers' | 'user';
  warnings: string[];
  template?: TemplateInfo;
}

export interface ReadFailure {
  ok: false;
  error: ReadError;
  /** present when the table was located before the refusal, so the page can offer a new choice */
  table?: TableInfo;
  warnings: string[];
  template?: TemplateInfo;
}

export type ReadResult = ReadSuccess | ReadFailure;

export interface ReadLimits {
  /** most rows in the chosen sheet / text (default 100 000) */
  maxRows?: number;
  /** most non-empty cells in the chosen sheet / text (default 1 000 000) */
  maxCells?: number;
  /** most bytes after inflating (sum over the zip entries read) or of text (default 50 MB) */
  maxUncompressedBytes?: number;
}

export interface ReadOptions extends ReadLimits {
  /** used only in messages and warnings; the type is decided from the content */
  fileName?: string;
}

export interface ReadChoice {
  /** sheet name (XLSX) */
  sheet?: string;
  /** column letter ("A") or exact header key */
  distanceColumn?: string;
  energyColumns?: string[];
  distanceUnit?: DistanceUnit;
  energyUnit?: EnergyUnit;
  convention?: EnergyConvention;
}

export const DEFAULT_LIMITS = {
  maxRows: 100_000,
  maxCells: 1_000_000,
  maxUncompressedBytes: 50 * 1024 * 1024,
} as const;

/** columns right of this are ignored (a data table this wide is no report) */
export const MAX_COLUMNS = 1024;

/** the fewest points a curve needs (a minimum and its curvature need at least five) */
export const MINIMUM_POINTS = 5;

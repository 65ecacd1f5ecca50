/**
 * The hidden sheet of a personal template: the contract between the template generator (which
 * writes it) and the reader (which trusts it for sheet, header row, columns and units).
 * See CONTEXT.md, "Template meta sheet".
 */
import { distanceUnits, energyUnits, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import { unitFromText } from './header-words';
import { columnIndex } from './read-errors';
import type { EnergyConvention, Grid, GridCell } from './types';

export const TEMPLATE_META_SHEET = 'bondmark-meta';
export const TEMPLATE_FORMAT = 'bondmark-template';
/** the contract version this reader writes and reads in full */
export const TEMPLATE_META_VERSION = 1;

export interface TemplateMeta {
  format: typeof TEMPLATE_FORMAT;
  version: number;
  exerciseId: string;
  variantKey: string;
  studentNumber: string;
  templateToken: string;
  /** visible sheet holding the R grid and the energy columns */
  dataSheet: string;
  /** 1-based row of the column headers on dataSheet; the points start on the row below */
  headerRow: number;
  distanceUnit: DistanceUnit;
  energyUnit: EnergyUnit;
  /** column letter of the pre-filled distances (optional; default: found from the headers) */
  distanceColumn?: string;
  /** column letters the student fills with energies (optional; default: found from the headers) */
  energyColumns?: string[];
  /** the energy convention the template asks for (optional; the reader still checks the numbers) */
  energyConvention?: EnergyConvention;
  /** number of pre-filled grid rows (optional; informs the "left empty" warning) */
  pointCount?: number;
  /** answer cells: name → cell reference ("F4" on dataSheet, or "Answers!B2") */
  answers?: Record<string, string>;
}

/**
 * Rows (column A key, column B value) for the meta sheet, in the order the generator should write
 * them. Values are strings or numbers; a generator may add rows with other keys (ignored here).
 */
export function templateMetaRows(meta: Omit<TemplateMeta, 'format' | 'version'> & { version?: number }): [string, string | number][] {
  const rows: [string, string | number][] = [
    ['format', TEMPLATE_FORMAT],
    ['version', meta.version ?? TEMPLATE_META_VERSION],
    ['exerciseId', meta.exerciseId],
    ['variantKey', meta.variantKey],
    ['studentNumber', meta.studentNumber],
    ['templateToken', meta.templateToken],
    ['dataSheet', meta.dataSheet],
    ['headerRow', meta.headerRow],
    ['distanceUnit', meta.distanceUnit],
    ['energyUnit', meta.energyUnit],
  ];
  if (meta.distanceColumn) rows.push(['distanceColumn', meta.distanceColumn]);
  if (meta.energyColumns && meta.energyColumns.length > 0) rows.push(['energyColumns', meta.energyColumns.join(',')]);
  if (meta.energyConvention) rows.push(['energyConvention', meta.energyConvention]);
  if (meta.pointCount !== undefined) rows.push(['pointCount', meta.pointCount]);
  for (const [name, cell] of Object.entries(meta.answers ?? {})) rows.push([`answer:${name}`, cell]);
  return rows;
}

/** What the reader takes from a meta sheet; problems are reported, not thrown. */
export interface TemplateMetaReading {
  /** false when the sheet does not say format = bondmark-template */
  isTemplate: boolean;
  meta: Partial<TemplateMeta> & { answers: Record<string, string> };
  problems: string[];
}

function cellString(cell: GridCell | undefined): string | null {
  if (!cell) return null;
  switch (cell.kind) {
    case 'number':
      return cell.text ?? String(cell.value);
    case 'text':
      return cell.text.trim();
    case 'date':
      return cell.display;
    case 'bool':
      return String(cell.value);
    default:
      return null;
  }
}

export function readTemplateMeta(grid: Grid): TemplateMetaReading {
  const values = new Map<string, string>();
  const answers: Record<string, string> = {};
  for (const row of grid.rows) {
    const key = cellString(row.cells[0]);
    const value = cellString(row.cells[1]);
    if (!key || value === null) continue;
    const trimmed = key.trim();
    if (/^answer:/i.test(trimmed)) answers[trimmed.slice(7).trim()] = value.trim();
    else values.set(trimmed.toLowerCase(), value.trim());
  }
  const problems: string[] = [];
  const meta: TemplateMetaReading['meta'] = { answers };
  if (values.get('format') !== TEMPLATE_FORMAT) return { isTemplate: false, meta, problems };
  meta.format = TEMPLATE_FORMAT;
  const version = Number(values.get('version'));
  meta.version = Number.isFinite(version) ? version : TEMPLATE_META_VERSION;
  if (meta.version > TEMPLATE_META_VERSION) {
    problems.push(`The template says version ${meta.version}; this reader knows version ${TEMPLATE_META_VERSION} and read what it understands.`);
  }
  meta.exerciseId = values.get('exerciseid') ?? '';
  meta.variantKey = values.get('variantkey') ?? '';
  meta.studentNumber = values.get('studentnumber') ?? '';
  meta.templateToken = values.get('templatetoken') ?? '';
  const dataSheet = values.get('datasheet');
  if (dataSheet) meta.dataSheet = dataSheet;
  const headerRow = Number(values.get('headerrow'));
  if (Number.isInteger(headerRow) && headerRow >= 1) meta.headerRow = headerRow;
  else if (values.has('headerrow')) problems.push(`The template's headerRow "${values.get('headerrow')}" is not a row number; the header was searched for.`);
  const distanceUnit = values.get('distanceunit');
  if (distanceUnit) {
    const unit = (distanceUnits as readonly string[]).includes(distanceUnit) ? (distanceUnit as DistanceUnit) : unitFromText(distanceUnit).distance;
    if (unit) meta.distanceUnit = unit;
    else problems.push(`The template's distance unit "${distanceUnit}" is not one Bondmark reads.`);
  }
  const energyUnit = values.get('energyunit');
  if (energyUnit) {
    const unit = (energyUnits as readonly string[]).includes(energyUnit.toLowerCase())
      ? (energyUnit.toLowerCase() as EnergyUnit)
      : unitFromText(energyUnit).energy;
    if (unit) meta.energyUnit = unit;
    else problems.push(`The template's energy unit "${energyUnit}" is not one Bondmark reads.`);
  }
  const distanceColumn = values.get('distancecolumn');
  if (distanceColumn && columnIndex(distanceColumn) >= 0) meta.distanceColumn = distanceColumn.toUpperCase();
  const energyColumns = values.get('energycolumns');
  if (energyColumns) {
    const letters = energyColumns.split(/[,;\s]+/).filter((l) => columnIndex(l) >= 0);
    if (letters.length > 0) meta.energyColumns = letters.map((l) => l.toUpperCase());
  }
  const convention = values.get('energyconvention')?.toLowerCase();
  if (convention === 'total' || convention === 'relative') meta.energyConvention = convention;
  const pointCount = Number(values.get('pointcount'));
  if (Number.isInteger(pointCount) && pointCount > 0) meta.pointCount = pointCount;
  return { isTemplate: true, meta, problems };
}

/** "F4" → { sheet: null, column: 5, row: 4 }; "Answers!B2" / "'My sheet'!B2" → with the sheet */
export function parseCellReference(ref: string): { sheet: string | null; column: number; row: number } | null {
  const match = /^(?:(?:'((?:[^']|'')+)'|([^!]+))!)?\$?([A-Za-z]{1,3})\$?(\d{1,7})$/.exec(ref.trim());
  if (!match) return null;
  const sheet = match[1] !== undefined ? match[1].replace(/''/g, "'") : (match[2] ?? null);
  return { sheet, column: columnIndex(match[3]), row: Number(match[4]) };
}

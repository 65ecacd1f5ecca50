/**
 * The report reader: an uploaded data file → points with units, or a precise refusal.
 * Browser-safe (no Node APIs); the XLSX path loads JSZip on demand.
 */
export { readReport, readReportWithChoice } from './read-report';
export { detectFileType, type DetectedFileType, type FileKind } from './detect-file-type';
export {
  READ_ERROR_CODES,
  READ_ERROR_CODE_LIST,
  columnLetter,
  columnIndex,
  type ReadError,
  type ReadErrorCode,
} from './read-errors';
export {
  TEMPLATE_META_SHEET,
  TEMPLATE_FORMAT,
  TEMPLATE_META_VERSION,
  templateMetaRows,
  readTemplateMeta,
  parseCellReference,
  type TemplateMeta,
} from './template-meta';
export { readHeader, unitFromText, type HeaderReading } from './header-words';
export { conventionOf, CONVENTION_THRESHOLD_HARTREE } from './guess-units';
export {
  DEFAULT_LIMITS,
  MINIMUM_POINTS,
  type ColumnInfo,
  type ColumnRole,
  type EnergyConvention,
  type RawPoints,
  type ReadChoice,
  type ReadFailure,
  type ReadLimits,
  type ReadOptions,
  type ReadResult,
  type ReadSuccess,
  type ReportPoints,
  type TableInfo,
  type TemplateInfo,
  type UnitSource,
} from './types';

/**
 * CSV text for plot data, written by hand (RFC 4180: comma separator, CRLF
 * line ends, fields with comma, quote or line break quoted, quotes doubled).
 * Text cells that a spreadsheet would run as a formula (starting with = + − @,
 * or a tab or carriage return) get a leading apostrophe (OWASP "CSV
 * injection" advice); numbers are written as numbers and never altered.
 */

export type CsvCell = string | number | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

/** A text cell made safe for spreadsheets: "'=SUM(A1)" instead of "=SUM(A1)". */
export function guardFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Numbers: up to 12 significant digits, no exponent for ordinary magnitudes; non-finite numbers are empty. */
export function formatCsvNumber(value: number): string {
  if (!Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(12)));
}

function quote(field: string): string {
  return /[",\r\n]/.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
}

/** One cell as CSV text. */
export function csvCell(cell: CsvCell): string {
  if (cell === null || cell === undefined) return '';
  if (typeof cell === 'number') return formatCsvNumber(cell);
  return quote(guardFormula(cell));
}

/** The whole file: a header line and one line per row. */
export function buildCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  const lines = [header.map((h) => csvCell(h)), ...rows.map((row) => row.map(csvCell))];
  return lines.map((cells) => cells.join(',')).join('\r\n') + '\r\n';
}

export interface CsvColumnSeries {
  /** column header, e.g. "E bonding σg / hartree" */
  header: string;
  x: readonly number[];
  y: readonly number[];
}

/**
 * Several y series against one x column. Series on different x grids are
 * merged on the union of their x values (sorted); a series without a value at
 * some x leaves that cell empty.
 */
export function seriesCsv(xHeader: string, series: readonly CsvColumnSeries[]): string {
  const key = (x: number) => formatCsvNumber(x);
  const xs = new Map<string, number>();
  for (const s of series) for (const x of s.x) if (Number.isFinite(x)) xs.set(key(x), x);
  const sorted = [...xs.values()].sort((a, b) => a - b);
  const lookups = series.map((s) => {
    const m = new Map<string, number>();
    s.x.forEach((x, i) => m.set(key(x), s.y[i]));
    return m;
  });
  const rows = sorted.map((x) => [x, ...lookups.map((m) => m.get(key(x)) ?? null)]);
  return buildCsv([xHeader, ...series.map((s) => s.header)], rows);
}

/** File-name part from a title: "Bonding curves (H₂⁺)" -> "bonding-curves-h2". */
export function fileSlug(title: string): string {
  const plain = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/[₀-₉]/g, (d) => String(d.charCodeAt(0) - 0x2080))
    .replace(/[⁰¹²³⁴-⁹]/g, (d) => String('⁰¹²³⁴⁵⁶⁷⁸⁹'.indexOf(d)))
    .toLowerCase()
    .replace(/σ/g, 'sigma')
    .replace(/π/g, 'pi')
    .replace(/ψ/g, 'psi')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return plain.slice(0, 80) || 'plot';
}

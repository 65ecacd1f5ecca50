/**
 * Typed answers of a report, by check kind (or check id): "term-symbol" → "3Σg-".
 *
 * Two sources:
 * 1. A personal template (.xlsx): its hidden sheet "bondmark-meta" has rows
 *    `answer:<check-kind>` | `<cell>` (e.g. `answer:term-symbol` | `Answers!B3`); a cell without a
 *    sheet name is on the meta's `dataSheet` (or the first sheet). The cell's value is taken as
 *    stored: numbers stay numbers, text stays text, a formula gives its saved result (never
 *    evaluated), rich text is joined, an error value or an empty cell gives null. A workbook without
 *    the meta sheet but with a sheet called "Answers" is read like the CSV below.
 * 2. A two-column CSV (comma, semicolon or tab; header row optional):
 *    `question,answer` where the question is a check kind ("term-symbol", or with spaces:
 *    "term symbol"). Quote an answer that holds the separator; when a row has more than two fields,
 *    the fields after the first are joined with ", " (so `huckel-energies,1.618,0.618` works).
 *    Answers stay text; the checks read numbers themselves ("2,5" and "5/2" included).
 * Names are lower-cased, spaces and underscores become dashes. Never throws: an unreadable file
 * gives no answers and a warning. Read the file with readReport first when it is an upload — the
 * reader's size and zip limits are what protect against a zip bomb; this refuses files over 25 MB.
 */
import Papa from 'papaparse';
import { parseCellReference } from '../read/template-meta';

export type TemplateAnswers = Record<string, string | number | null>;

export interface AnswerFileReading {
  answers: TemplateAnswers;
  source: 'template' | 'answers-sheet' | 'csv' | 'none';
  warnings: string[];
}

const META_SHEET = 'bondmark-meta';
const MAX_BYTES = 25 * 1024 * 1024;

/** "Term symbol" → "term-symbol" */
export function answerName(text: string): string {
  return text.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

function isZip(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
}

/** A cell value of exceljs as a number, text or null. */
function plainValue(value: unknown): string | number | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return Number.isFinite(value) ? value : null;
  if (typeof value === 'string') return value.trim() === '' ? null : value.trim();
  if (typeof value === 'boolean') return String(value);
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? null : value.toISOString();
  if (typeof value === 'object') {
    const v = value as Record<string, unknown>;
    if (Array.isArray(v.richText)) return plainValue((v.richText as { text?: string }[]).map((r) => r.text ?? '').join(''));
    if ('formula' in v || 'sharedFormula' in v) return 'result' in v ? plainValue(v.result) : null;
    if ('error' in v) return null;
    if (typeof v.text === 'string') return plainValue(v.text);
  }
  return null;
}

function tableAnswers(rows: unknown[][]): TemplateAnswers {
  const answers: TemplateAnswers = {};
  rows.forEach((row, index) => {
    const first = row[0];
    if (first === null || first === undefined || String(first).trim() === '') return;
    const name = answerName(String(first));
    if (index === 0 && (name === 'question' || name === 'check' || name === 'kind')) return;
    const rest = row.slice(1).filter((c) => c !== null && c !== undefined && String(c).trim() !== '');
    if (rest.length === 1 && typeof rest[0] === 'number') {
      answers[name] = rest[0];
      return;
    }
    const value = rest.map((c) => String(c).trim()).join(', ');
    answers[name] = value === '' ? null : value;
  });
  return answers;
}

async function readWorkbook(bytes: Uint8Array): Promise<AnswerFileReading> {
  const warnings: string[] = [];
  const ExcelJS = (await import('exceljs')).default;
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  const sheetNamed = (name: string) => workbook.worksheets.find((w) => w.name.toLowerCase() === name.toLowerCase());
  const meta = sheetNamed(META_SHEET);
  if (meta) {
    const answers: TemplateAnswers = {};
    let dataSheet: string | null = null;
    const references: [string, string][] = [];
    meta.eachRow((row) => {
      const key = plainValue(row.getCell(1).value);
      const value = plainValue(row.getCell(2).value);
      if (typeof key !== 'string' || value === null) return;
      if (/^answer:/i.test(key)) references.push([answerName(key.slice(7)), String(value)]);
      else if (key.toLowerCase() === 'datasheet') dataSheet = String(value);
    });
    for (const [name, reference] of references) {
      const cell = parseCellReference(reference);
      if (!cell || cell.column < 0) {
        warnings.push(`The template's answer cell for ${name} ("${reference}") is not a cell reference.`);
        continue;
      }
      const sheetName = cell.sheet ?? dataSheet;
      const sheet = sheetName ? sheetNamed(sheetName) : workbook.worksheets.find((w) => w.name !== meta.name);
      if (!sheet) {
        warnings.push(`The template's answer cell for ${name} is on a sheet "${sheetName}" the workbook does not have.`);
        continue;
      }
      answers[name] = plainValue(sheet.getRow(cell.row).getCell(cell.column + 1).value);
    }
    return { answers, source: 'template', warnings };
  }
  const answersSheet = sheetNamed('answers');
  if (answersSheet) {
    const rows: unknown[][] = [];
    answersSheet.eachRow({ includeEmpty: false }, (row) => {
      const values = Array.isArray(row.values) ? row.values.slice(1) : [];
      rows.push(Array.from(values, (v) => plainValue(v)));
    });
    return { answers: tableAnswers(rows), source: 'answers-sheet', warnings };
  }
  return { answers: {}, source: 'none', warnings: ['The workbook has neither a "bondmark-meta" sheet nor an "Answers" sheet, so no typed answers were read.'] };
}

function decodeText(bytes: Uint8Array): string {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes.subarray(2));
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes.subarray(2));
  const text = new TextDecoder('utf-8').decode(bytes);
  return text.startsWith('\ufeff') ? text.slice(1) : text;
}

/** Answers with where they came from and any warnings. */
export async function readAnswerFile(input: Uint8Array | ArrayBuffer): Promise<AnswerFileReading> {
  const bytes = input instanceof Uint8Array ? input : new Uint8Array(input);
  if (bytes.length === 0) return { answers: {}, source: 'none', warnings: ['The answer file is empty.'] };
  if (bytes.length > MAX_BYTES) return { answers: {}, source: 'none', warnings: ['The answer file is over 25 MB and was not read.'] };
  try {
    if (isZip(bytes)) return await readWorkbook(bytes);
    const parsed = Papa.parse<unknown[]>(decodeText(bytes).trim(), { header: false, skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t', '|'] });
    const rows = parsed.data.filter((row) => Array.isArray(row) && row.length >= 2);
    if (rows.length === 0) return { answers: {}, source: 'none', warnings: ['No row of the answer file has a question and an answer.'] };
    return { answers: tableAnswers(rows), source: 'csv', warnings: [] };
  } catch (error) {
    return { answers: {}, source: 'none', warnings: [`The answer file could not be read (${error instanceof Error ? error.message : String(error)}).`] };
  }
}

/** Typed answers of a template (.xlsx) or a two-column "question,answer" CSV; {} when there are none. */
export async function readTemplateAnswers(input: Uint8Array | ArrayBuffer): Promise<TemplateAnswers> {
  return (await readAnswerFile(input)).answers;
}

/** The answers the report reader already found in a template (ReadSuccess.template.answers). */
export function answersFromTemplateInfo(template: { answers: Record<string, { value: number | string | null }> } | undefined | null): TemplateAnswers {
  const answers: TemplateAnswers = {};
  for (const [name, cell] of Object.entries(template?.answers ?? {})) {
    const value = cell.value;
    answers[answerName(name)] = typeof value === 'string' ? (value.trim() === '' ? null : value.trim()) : value;
  }
  return answers;
}

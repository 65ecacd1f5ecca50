/**
 * The personal template workbook (exceljs): a cover sheet, the data sheet
 * with the R grid (curve exercises), the answers sheet (diatomic and Hückel
 * exercises) and the hidden meta sheet the report reader uses to recognise an
 * upload (contract: shared/marking/read, "Template meta sheet").
 *
 * The template carries the student's parameters and never a reference value:
 * nothing here calls computeReference.
 */
import ExcelJS from 'exceljs';
import type { ExerciseSpec } from '@shared/exercises/spec';
import type { Variant } from '@shared/exercises/variants';
import { gridValues } from '@shared/exercises/variants';
import {
  distanceUnitHeader,
  distanceUnitWords,
  energyUnitHeader,
  energyUnitWords,
  lateRuleSummary,
  modelText,
  piSystemCounts,
  templateEnergyUnit,
  variantSummary,
} from './variant-text';

export const TEMPLATE_META_SHEET = 'bondmark-meta';
export const TEMPLATE_FORMAT = 'bondmark-template';
export const TEMPLATE_META_VERSION = 1;
export const ABOUT_SHEET = 'About';
export const DATA_SHEET = 'Data';
export const ANSWERS_SHEET = 'Answers';

/** Fixed cells of the About sheet (the rows below 14 depend on the model). */
export const ABOUT_CELLS = {
  course: 'B4',
  exercise: 'B5',
  studentName: 'B6',
  studentNumber: 'B7',
  due: 'B8',
  extension: 'B9',
  lateRule: 'B10',
  model: 'B13',
} as const;
/** Data sheet: header row; the grid starts on the row below in column A, energies from column B. */
export const DATA_HEADER_ROW = 5;
/** Answers sheet: header row; answers are typed in column B from the row below. */
export const ANSWERS_HEADER_ROW = 4;

export interface TemplateInput {
  course: { code: string; title: string };
  exercise: { id: number; revisionId: number; spec: ExerciseSpec; dueAt: Date; extensionMinutes: number };
  student: { number: string; name: string };
  variant: { key: string; templateToken: string; value: Variant };
  generatedAt: Date;
}

export type MetaRow = [key: string, value: string | number];

export interface BuiltTemplate {
  buffer: Buffer;
  /** the rows written to the meta sheet, in order */
  meta: MetaRow[];
  sheets: string[];
}

const BOLD = { bold: true } as const;
const MUTED = { color: { argb: 'FF5B6272' } } as const;
const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFEDEBE4' } };
const INPUT_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFFFFBE6' } };
const THIN: Partial<ExcelJS.Borders> = {
  top: { style: 'thin', color: { argb: 'FFD9D6CC' } },
  bottom: { style: 'thin', color: { argb: 'FFD9D6CC' } },
  left: { style: 'thin', color: { argb: 'FFD9D6CC' } },
  right: { style: 'thin', color: { argb: 'FFD9D6CC' } },
};

const anyNumber = (what: string): ExcelJS.DataValidation => ({
  type: 'decimal',
  operator: 'between',
  formulae: [-1e12, 1e12],
  allowBlank: true,
  showErrorMessage: true,
  errorStyle: 'stop',
  errorTitle: 'A number, please',
  error: `${what} must be a number.`,
});

/** "Friday 16 October 2026, 17:00 (Europe/London)" */
export function formatDueMoment(at: Date, timeZone: string): string {
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    weekday: 'long',
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(at);
  return `${text.replace(' at ', ', ')} (${timeZone})`;
}

function extensionText(minutes: number, dueAt: Date, timeZone: string): string {
  if (minutes <= 0) return 'none';
  const days = Math.floor(minutes / 1440);
  const hours = Math.floor((minutes % 1440) / 60);
  const rest = minutes % 60;
  const parts = [days ? `${days} d` : '', hours ? `${hours} h` : '', rest ? `${rest} min` : ''].filter(Boolean).join(' ');
  return `+${parts}: your own due moment is ${formatDueMoment(new Date(dueAt.getTime() + minutes * 60_000), timeZone)}`;
}

/** Curve states of a curve exercise, in column order, with their header names. */
function curveColumns(spec: ExerciseSpec): { state: string; header: string; words: string }[] {
  const model = spec.model;
  if (model.family === 'one-electron') return model.states.map((s) => ({ state: s, header: `E ${s}`, words: `${s} state` }));
  if (model.family === 'two-electron') return [{ state: 'ground', header: 'E ground state', words: 'ground state' }];
  return [];
}

const columnLetter = (index: number) => String.fromCharCode(65 + index);

interface AnswerRow {
  /** the meta key after "answer:" */
  name: string;
  question: string;
  form: string;
  validation?: ExcelJS.DataValidation;
  /** kept as typed (text format), e.g. a list of numbers or a term symbol */
  text?: boolean;
}

const DIATOMIC_QUESTIONS: Record<'configuration' | 'bond-order' | 'unpaired-electrons' | 'term-symbol', Omit<AnswerRow, 'name'>> = {
  configuration: {
    text: true,
    question: 'Ground-state electron configuration',
    form: 'Occupied orbitals, lowest first, each in brackets with its electron count; σ, π and * or plain "sigma", "pi" and "*".',
  },
  'bond-order': {
    question: 'Bond order',
    form: 'A number; a half bond as .5',
    validation: { ...anyNumber('The bond order'), formulae: [-10, 10] },
  },
  'unpaired-electrons': {
    question: 'Number of unpaired electrons',
    form: 'A whole number',
    validation: { type: 'whole', operator: 'between', formulae: [0, 50], allowBlank: true, showErrorMessage: true, errorTitle: 'A whole number, please', error: 'The number of unpaired electrons is a whole number.' },
  },
  'term-symbol': {
    text: true,
    question: 'Ground term symbol',
    form: 'Multiplicity, Λ, then g/u and ± where they apply: the form of 4Delta_u or ⁴Δu (an example of the form only).',
  },
};

function answerRows(input: TemplateInput): AnswerRow[] {
  const { spec } = input.exercise;
  const variant = input.variant.value;
  if (spec.model.family === 'diatomic') {
    const kinds = (['configuration', 'bond-order', 'unpaired-electrons', 'term-symbol'] as const).filter((k) => spec.scheme.checks.some((c) => c.kind === k));
    const asked = kinds.length > 0 ? kinds : (['configuration', 'bond-order', 'unpaired-electrons', 'term-symbol'] as const);
    return asked.map((k) => ({ name: k, ...DIATOMIC_QUESTIONS[k] }));
  }
  if (spec.model.family === 'huckel' && variant.family === 'huckel') {
    const { atomCount } = piSystemCounts(variant.system);
    return [
      {
        name: 'huckel-energies',
        question: `Orbital energies: x for each of the ${atomCount} pi orbitals`,
        form: `${atomCount} values of x in E = α + xβ, lowest energy (largest x) first, separated by commas; repeat a degenerate level once per orbital. "α + 1.5β" forms are read too.`,
        text: true,
      },
      { name: 'pi-energy', question: 'Total π energy: y in Nα + yβ', form: 'A number (the coefficient of β)', validation: anyNumber('The π energy') },
      { name: 'delocalization-energy', question: 'Delocalization energy, in units of β', form: 'A number; against isolated double bonds', validation: anyNumber('The delocalization energy') },
    ];
  }
  return [];
}

/** Builds the workbook; returns its bytes and the meta rows it wrote. */
export async function buildTemplate(input: TemplateInput): Promise<BuiltTemplate> {
  const { spec } = input.exercise;
  const model = spec.model;
  const variant = input.variant.value;
  if (variant.family !== model.family) throw new RangeError(`a ${variant.family} variant for a ${model.family} exercise`);
  const summary = variantSummary(variant);
  const energyUnit = templateEnergyUnit(spec);
  const isCurve = model.family === 'one-electron' || model.family === 'two-electron';
  const distanceUnit = isCurve ? model.grid.unit : 'bohr';

  const wb = new ExcelJS.Workbook();
  wb.creator = 'Bondmark';
  wb.created = input.generatedAt;
  wb.modified = input.generatedAt;
  wb.title = `${input.course.code} ${spec.title}`;

  // ---------------- About ----------------
  const about = wb.addWorksheet(ABOUT_SHEET, { views: [{ showGridLines: false }] });
  about.getColumn(1).width = 30;
  about.getColumn(2).width = 90;
  about.getColumn(2).alignment = { wrapText: true, vertical: 'top' };
  about.getCell('A1').value = 'Bondmark · personal template';
  about.getCell('A1').font = { bold: true, size: 14 };
  about.getCell('A2').value = 'Made for one student and one variant. Fill it in and upload it to Bondmark; do not pass it on.';
  about.getCell('A2').font = MUTED;
  const pair = (row: number, label: string, value: string | number) => {
    about.getCell(row, 1).value = label;
    about.getCell(row, 1).font = BOLD;
    about.getCell(row, 1).alignment = { vertical: 'top' };
    about.getCell(row, 2).value = value;
  };
  pair(4, 'Course', `${input.course.code} · ${input.course.title}`);
  pair(5, 'Exercise', spec.title);
  pair(6, 'Student', input.student.name);
  pair(7, 'Student number', input.student.number); // text: keeps leading zeros
  pair(8, 'Due', formatDueMoment(input.exercise.dueAt, spec.timeZone));
  pair(9, 'Your extension', extensionText(input.exercise.extensionMinutes, input.exercise.dueAt, spec.timeZone));
  pair(10, 'Late uploads', lateRuleSummary(spec.late));
  about.getCell('A12').value = 'Your variant';
  about.getCell('A12').font = { bold: true, size: 12 };
  pair(13, 'Model', modelText(model));
  let row = 14;
  switch (variant.family) {
    case 'one-electron':
      pair(row++, 'Nuclear charge Za', variant.za);
      pair(row++, 'Nuclear charge Zb', variant.zb);
      pair(row++, 'Orbital exponent ζ', variant.zeta === 'optimized' ? 'optimized: find the best ζ at every R' : variant.zeta);
      if (model.family === 'one-electron') pair(row++, 'States', model.states.join(' and '));
      break;
    case 'two-electron':
      pair(row++, 'Orbital exponent ζ', variant.zeta === 'optimized' ? 'optimized: find the best ζ at every R' : variant.zeta);
      break;
    case 'diatomic':
      pair(row++, 'Species', variant.species);
      break;
    case 'huckel': {
      const counts = piSystemCounts(variant.system);
      pair(row++, 'Pi system', summary.text);
      pair(row++, 'Atoms in the pi system', counts.atomCount);
      pair(row++, 'Pi electrons', counts.electronCount);
      if (counts.charge !== 0) pair(row++, 'Charge', counts.charge);
      if (counts.heteroatomTypes.length > 0) pair(row++, 'Heteroatom types', counts.heteroatomTypes.join(', '));
      break;
    }
  }
  pair(row++, 'Variant key', summary.key);
  row++;
  about.getCell(row, 1).value = 'What to fill in';
  about.getCell(row, 1).font = { bold: true, size: 12 };
  row++;
  if (isCurve) {
    const cols = curveColumns(spec);
    const grid = gridValues(model.grid);
    pair(row++, `Sheet "${DATA_SHEET}"`, `${grid.length} distances R are filled in column A (${grid[0]} to ${grid[grid.length - 1]} ${distanceUnitHeader[distanceUnit]}). Leave them as they are.`);
    cols.forEach((c, i) => pair(row++, `Column ${columnLetter(i + 1)}`, `Energy of the ${c.words} at each R, in ${energyUnitWords[energyUnit]}.`));
    pair(row++, 'Energies', 'Total energy: electronic energy plus the nuclear repulsion ZaZb/R, as numbers (no units in the cells).');
  } else {
    pair(row++, `Sheet "${ANSWERS_SHEET}"`, 'Type each answer in column B beside its question; column C shows the form it takes.');
    if (model.family === 'huckel') pair(row++, 'Energies', 'In units of β, with E = α + xβ (β < 0).');
  }
  pair(row++, 'Units', isCurve ? `Distances in ${distanceUnitWords[distanceUnit]}, energies in ${energyUnitWords[energyUnit]}.` : model.family === 'huckel' ? 'x and energies in units of β.' : 'No units.');
  row++;
  about.getCell(row, 1).value = 'Keep the sheet names and the layout: Bondmark reads the upload by them and matches it to you, the exercise and your variant. Your own working may go on extra sheets.';
  about.mergeCells(row, 1, row, 2);
  about.getCell(row, 1).alignment = { wrapText: true };
  about.getCell(row, 1).font = MUTED;
  about.getRow(row).height = 30;

  // ---------------- Data ----------------
  const meta: MetaRow[] = [];
  let dataSheet = ANSWERS_SHEET;
  let headerRow = ANSWERS_HEADER_ROW;
  let energyColumns: string[] = [];
  let pointCount: number | undefined;
  if (isCurve) {
    const ws = wb.addWorksheet(DATA_SHEET, { views: [{ state: 'frozen', ySplit: DATA_HEADER_ROW }] });
    const cols = curveColumns(spec);
    const grid = gridValues(model.grid);
    ws.getColumn(1).width = 14;
    cols.forEach((_, i) => (ws.getColumn(i + 2).width = 24));
    ws.getCell('A1').value = `${input.course.code} · ${spec.title}`;
    ws.getCell('A1').font = BOLD;
    ws.getCell('A2').value = `Student ${input.student.number} · ${input.student.name} · ${summary.text}`;
    ws.getCell('A3').value = `Fill in the energy columns: total energy in ${energyUnitWords[energyUnit]} at each R. Leave column A as it is.`;
    ws.getCell('A3').font = MUTED;
    const header = ws.getRow(DATA_HEADER_ROW);
    header.getCell(1).value = `R / ${distanceUnitHeader[distanceUnit]}`;
    cols.forEach((c, i) => (header.getCell(i + 2).value = `${c.header} / ${energyUnitHeader[energyUnit]}`));
    for (let c = 1; c <= cols.length + 1; c++) {
      header.getCell(c).font = BOLD;
      header.getCell(c).fill = HEADER_FILL;
      header.getCell(c).border = THIN;
    }
    grid.forEach((r, k) => {
      const line = ws.getRow(DATA_HEADER_ROW + 1 + k);
      line.getCell(1).value = r;
      for (let c = 0; c < cols.length; c++) {
        const cell = line.getCell(c + 2);
        cell.fill = INPUT_FILL;
        cell.border = THIN;
        cell.dataValidation = anyNumber(`The energy of the ${cols[c].words}`);
      }
    });
    dataSheet = DATA_SHEET;
    headerRow = DATA_HEADER_ROW;
    energyColumns = cols.map((_, i) => columnLetter(i + 1));
    pointCount = grid.length;
  }

  // ---------------- Answers ----------------
  const answers = answerRows(input);
  const answerCells: Record<string, string> = {};
  if (answers.length > 0) {
    const ws = wb.addWorksheet(ANSWERS_SHEET, { views: [{ showGridLines: false }] });
    ws.getColumn(1).width = 44;
    ws.getColumn(2).width = 26;
    ws.getColumn(3).width = 70;
    ws.getColumn(3).alignment = { wrapText: true, vertical: 'top' };
    ws.getCell('A1').value = `Answers · ${summary.text}`;
    ws.getCell('A1').font = BOLD;
    ws.getCell('A2').value = `Student ${input.student.number} · ${input.student.name}. Type each answer in column B.`;
    ws.getCell('A2').font = MUTED;
    const header = ws.getRow(ANSWERS_HEADER_ROW);
    ['Question', 'Your answer', 'Form'].forEach((text, i) => {
      const cell = header.getCell(i + 1);
      cell.value = text;
      cell.font = BOLD;
      cell.fill = HEADER_FILL;
      cell.border = THIN;
    });
    answers.forEach((a, i) => {
      const r = ANSWERS_HEADER_ROW + 1 + i;
      ws.getCell(r, 1).value = a.question;
      ws.getCell(r, 3).value = a.form;
      ws.getCell(r, 3).font = MUTED;
      const cell = ws.getCell(r, 2);
      cell.fill = INPUT_FILL;
      cell.border = THIN;
      if (a.validation) cell.dataValidation = a.validation;
      if (a.text) cell.numFmt = '@';
      answerCells[a.name] = `${ANSWERS_SHEET}!B${r}`;
    });
  }

  // ---------------- meta (hidden) ----------------
  meta.push(
    ['format', TEMPLATE_FORMAT],
    ['version', TEMPLATE_META_VERSION],
    ['exerciseId', String(input.exercise.id)],
    ['variantKey', input.variant.key],
    ['studentNumber', input.student.number],
    ['templateToken', input.variant.templateToken],
    ['dataSheet', dataSheet],
    ['headerRow', headerRow],
    ['distanceUnit', distanceUnit],
    ['energyUnit', energyUnit],
  );
  if (isCurve) {
    meta.push(['distanceColumn', 'A'], ['energyColumns', energyColumns.join(',')], ['energyConvention', 'total'], ['pointCount', pointCount!]);
  }
  for (const [name, cell] of Object.entries(answerCells)) meta.push([`answer:${name}`, cell]);
  meta.push(['family', model.family], ['revisionId', String(input.exercise.revisionId)], ['generatedAt', input.generatedAt.toISOString()]);

  const metaSheet = wb.addWorksheet(TEMPLATE_META_SHEET, { state: 'veryHidden' });
  metaSheet.getColumn(1).width = 28;
  metaSheet.getColumn(2).width = 40;
  meta.forEach(([key, value], i) => {
    metaSheet.getCell(i + 1, 1).value = key;
    const cell = metaSheet.getCell(i + 1, 2);
    cell.value = value;
    if (typeof value === 'string') cell.numFmt = '@';
  });

  wb.views = [{ x: 0, y: 0, width: 20000, height: 12000, firstSheet: 0, activeTab: 0, visibility: 'visible' }];
  const buffer = Buffer.from(await wb.xlsx.writeBuffer());
  return { buffer, meta, sheets: wb.worksheets.map((w) => w.name) };
}

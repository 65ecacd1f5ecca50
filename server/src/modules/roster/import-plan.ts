/**
 * From a read roster file, a column mapping and the course's current roster to
 * an import plan: per row new / changed / unchanged / error (with the row
 * number and column in every message), the students on the roster that the
 * file does not list, and the writes an apply would make. Pure: no database.
 *
 * Keyed by student number. Cleaning: surrounding and repeated spaces removed,
 * e-mail lower-cased, "mailto:" dropped, blank lines ignored. Dates in
 * identity columns (Excel's conversion of typed numbers) are errors, as are
 * duplicate student numbers or e-mails within the file.
 */
import {
  REQUIRED_ROSTER_FIELDS,
  ROSTER_FIELDS,
  ROSTER_FIELD_LABEL,
  studentNumberSchema,
  type DetectedColumn,
  type ImportSummary,
  type MissingStudent,
  type PreviewRow,
  type RosterField,
  type RosterMapping,
  type RowProblem,
} from '@shared/api/roster';
import { columnLetter, type Cell, type SheetTable } from './read-file';

export interface ExistingEnrolment {
  id: number;
  userId: number;
  studentNumber: string;
  familyName: string | null;
  givenName: string | null;
  email: string | null;
  /** the account's e-mail (from sign-in or from an earlier import) */
  userEmail: string;
  sectionId: number | null;
  status: 'active' | 'withdrawn';
}

export interface SectionRef {
  id: number;
  name: string;
  archived: boolean;
  capacity: number | null;
}

export interface PlanContext {
  existing: ExistingEnrolment[];
  sections: SectionRef[];
  /** accounts with the e-mails found in the file (lower-cased key) */
  accountsByEmail: Map<string, { id: number; displayName: string }>;
  /** user ids of the course's lecturers and assistants (they cannot also be its students) */
  staffUserIds: Set<number>;
}

export interface PlannedRow {
  rowNumber: number;
  studentNumber: string;
  familyName: string;
  givenName: string;
  email: string;
  /** undefined: leave as it is (section not mapped, or the cell is empty) */
  sectionId: number | null | undefined;
  existing: ExistingEnrolment | null;
  account: { id: number; displayName: string } | null;
}

export interface ImportPlan {
  headerRowNumber: number;
  columns: DetectedColumn[];
  suggestedMapping: RosterMapping;
  mapping: RosterMapping;
  problems: string[];
  warnings: string[];
  rows: PreviewRow[];
  missing: MissingStudent[];
  summary: ImportSummary;
  canApply: boolean;
  /** rows to write (only meaningful when canApply) */
  writes: { create: PlannedRow[]; update: PlannedRow[] };
}

const EMPTY: Cell = { kind: 'empty', text: '' };

/** "  Ann   Marie " → "Ann Marie" */
export const tidy = (s: string) => s.replace(/[\s\u00a0]+/g, ' ').trim();

/** Header text for comparison: lower case, no accents, letters and digits only. */
const headerKey = (s: string) =>
  s
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]/g, '');

const SYNONYMS: Record<RosterField, string[]> = {
  studentNumber: ['studentnumber', 'studentno', 'studentnr', 'studentid', 'matriculationnumber', 'matriculationno', 'matricno', 'matrikelnummer', 'registrationnumber', 'registrationno', 'regno', 'idnumber', 'id', 'number'],
  familyName: ['familyname', 'surname', 'lastname', 'family', 'nachname'],
  givenName: ['givenname', 'givennames', 'firstname', 'firstnames', 'forename', 'forenames', 'vorname'],
  email: ['email', 'emailaddress', 'mail', 'universityemail', 'studentemail', 'institutionalemail'],
  section: ['section', 'labsection', 'lab', 'labgroup', 'group', 'practicalgroup', 'practical'],
};

/** Columns of the file from the header row and the widest row. */
export function detectColumns(table: SheetTable): { headerRowNumber: number; columns: DetectedColumn[] } {
  const [header, ...data] = table.rows;
  if (!header) return { headerRowNumber: 1, columns: [] };
  const width = Math.max(...table.rows.map((r) => r.cells.length));
  const columns: DetectedColumn[] = [];
  for (let i = 0; i < width; i++) {
    const letter = columnLetter(i);
    const samples: string[] = [];
    for (const row of data) {
      const cell = row.cells[i];
      if (cell && cell.kind !== 'empty') samples.push(tidy(cell.text));
      if (samples.length >= 3) break;
    }
    columns.push({ index: i, letter, header: tidy(header.cells[i]?.text ?? '') || `Column ${letter}`, samples });
  }
  return { headerRowNumber: header.rowNumber, columns };
}

/** The mapping a lecturer would most likely choose, from the header texts (and e-mail-looking samples). */
export function suggestMapping(columns: DetectedColumn[]): RosterMapping {
  const mapping: RosterMapping = { studentNumber: null, familyName: null, givenName: null, email: null, section: null };
  const used = new Set<number>();
  const keys = columns.map((c) => headerKey(c.header));
  // exact header matches first, in the order of each field's synonym list
  for (const field of ROSTER_FIELDS) {
    for (const synonym of SYNONYMS[field]) {
      const i = keys.findIndex((k, idx) => k === synonym && !used.has(idx));
      if (i >= 0) {
        mapping[field] = i;
        used.add(i);
        break;
      }
    }
  }
  // then headers that contain a longer synonym ("Student e-mail (university)")
  for (const field of ROSTER_FIELDS) {
    if (mapping[field] !== null) continue;
    const i = keys.findIndex((k, idx) => !used.has(idx) && SYNONYMS[field].some((s) => s.length >= 5 && k.includes(s)));
    if (i >= 0) {
      mapping[field] = i;
      used.add(i);
    }
  }
  if (mapping.email === null) {
    const i = columns.findIndex((c, idx) => !used.has(idx) && c.samples.length > 0 && c.samples.every((s) => s.includes('@')));
    if (i >= 0) mapping.email = i;
  }
  return mapping;
}

function mappingProblems(mapping: RosterMapping, columns: DetectedColumn[]): string[] {
  const problems: string[] = [];
  const list = columns.map((c) => `${c.letter} "${c.header}"`).join(', ');
  for (const field of REQUIRED_ROSTER_FIELDS) {
    if (mapping[field] === null) problems.push(`No column is mapped to "${ROSTER_FIELD_LABEL[field]}", which every roster needs. The file's columns are: ${list || 'none'}.`);
  }
  const seen = new Map<number, RosterField>();
  for (const field of ROSTER_FIELDS) {
    const index = mapping[field];
    if (index === null) continue;
    if (index >= columns.length) {
      problems.push(`"${ROSTER_FIELD_LABEL[field]}" is mapped to column ${columnLetter(index)}, but the file has ${columns.length} columns.`);
      continue;
    }
    const other = seen.get(index);
    if (other) problems.push(`Column ${columns[index].letter} "${columns[index].header}" is mapped to both "${ROSTER_FIELD_LABEL[other]}" and "${ROSTER_FIELD_LABEL[field]}".`);
    seen.set(index, field);
  }
  return problems;
}

const normalEmail = (s: string) => tidy(s).replace(/^mailto:/i, '').toLowerCase();
const EMAIL_SHAPE = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/** The plan for one file against the course's roster. */
export function planImport(table: SheetTable, requested: RosterMapping | undefined, ctx: PlanContext): ImportPlan {
  const { headerRowNumber, columns } = detectColumns(table);
  const suggestedMapping = suggestMapping(columns);
  const mapping = requested ?? suggestedMapping;
  const problems = mappingProblems(mapping, columns);
  const warnings: string[] = [];
  const dataRows = table.rows.slice(1);
  if (table.rows.length === 0) problems.push('The file is empty: no header row and no students.');
  else if (dataRows.length === 0) problems.push(`The file has a header row (row ${headerRowNumber}) but no students below it.`);

  // a mapping that points outside the file or uses a column twice reads no cells at all
  const indices = ROSTER_FIELDS.map((f) => mapping[f]).filter((i): i is number => i !== null);
  const validMapping = indices.every((i) => i < columns.length) && new Set(indices).size === indices.length;
  const byNumber = new Map(ctx.existing.map((e) => [e.studentNumber.toLowerCase(), e]));
  const sectionsByName = new Map(ctx.sections.map((s) => [tidy(s.name).toLowerCase(), s]));
  const activeSectionNames = ctx.sections.filter((s) => !s.archived).map((s) => `"${s.name}"`);
  // which enrolment owns an e-mail (the roster's copy or the account's)
  const emailOwner = new Map<string, ExistingEnrolment>();
  for (const e of ctx.existing) {
    for (const mail of [e.email, e.userEmail]) if (mail) emailOwner.set(mail.toLowerCase(), e);
  }

  const rows: PreviewRow[] = [];
  const create: PlannedRow[] = [];
  const update: PlannedRow[] = [];
  const firstRowOfNumber = new Map<string, number>();
  const firstRowOfEmail = new Map<string, { row: number; studentNumber: string }>();
  const listed = new Set<string>();

  for (const sheetRow of dataRows) {
    const n = sheetRow.rowNumber;
    const errors: RowProblem[] = [];
    const notes: string[] = [];
    const cellOf = (field: RosterField): Cell => {
      const i = mapping[field];
      return i === null || !validMapping ? EMPTY : (sheetRow.cells[i] ?? EMPTY);
    };
    const problem = (field: RosterField, message: string) => {
      const col = columns[mapping[field]!];
      errors.push({ field, column: col.header, letter: col.letter, message: `Row ${n}, column "${col.header}" (${col.letter}): ${message}` });
    };
    const mapped = (field: RosterField) => validMapping && mapping[field] !== null;

    // student number
    const numberCell = cellOf('studentNumber');
    let studentNumber = tidy(numberCell.text).replace(/\s+/g, '');
    if (mapped('studentNumber')) {
      if (numberCell.kind === 'date') {
        problem('studentNumber', `holds the date ${numberCell.text}, not a student number. The spreadsheet probably turned the typed number into a date: format the column as text and type the number again.`);
      } else if (numberCell.kind === 'empty') {
        problem('studentNumber', 'is empty; every student needs a student number.');
      } else if (numberCell.kind === 'error') {
        problem('studentNumber', `holds the spreadsheet error ${numberCell.text}.`);
      } else {
        const ok = studentNumberSchema.safeParse(studentNumber);
        if (!ok.success) problem('studentNumber', `"${studentNumber}" is not a student number: ${ok.error.issues[0].message}`);
      }
    }
    if (numberCell.kind === 'date') studentNumber = '';

    // names
    const names: Record<'familyName' | 'givenName', string> = { familyName: '', givenName: '' };
    for (const field of ['familyName', 'givenName'] as const) {
      const cell = cellOf(field);
      names[field] = tidy(cell.text);
      if (!mapped(field)) continue;
      if (cell.kind === 'empty') problem(field, `is empty; the ${ROSTER_FIELD_LABEL[field].toLowerCase()} is required.`);
      else if (cell.kind === 'date') problem(field, `holds the date ${cell.text}, not a name.`);
      else if (cell.kind === 'error') problem(field, `holds the spreadsheet error ${cell.text}.`);
      else if (names[field].length > 120) problem(field, `is ${names[field].length} characters long; at most 120 fit.`);
    }

    // e-mail
    const emailCell = cellOf('email');
    const email = normalEmail(emailCell.text);
    let emailOk = false;
    if (mapped('email')) {
      if (emailCell.kind === 'empty') problem('email', 'is empty; every student needs an e-mail address (it is how their account is found at sign-in).');
      else if (!EMAIL_SHAPE.test(email) || email.length > 320) problem('email', `"${tidy(emailCell.text)}" is not an e-mail address.`);
      else emailOk = true;
    }

    // section
    let sectionId: number | null | undefined;
    let sectionName: string | null = null;
    if (mapped('section')) {
      const cell = cellOf('section');
      const wanted = tidy(cell.text);
      if (wanted) {
        const section = sectionsByName.get(wanted.toLowerCase());
        if (!section) {
          problem('section', `there is no section "${wanted}" in this course (${activeSectionNames.length ? `sections: ${activeSectionNames.join(', ')}` : 'it has no sections yet; create them first'}).`);
        } else if (section.archived) {
          problem('section', `section "${section.name}" is archived; restore it or choose another.`);
        } else {
          sectionId = section.id;
          sectionName = section.name;
        }
      }
    }

    // duplicates within the file
    const numberKey = studentNumber.toLowerCase();
    if (numberKey) {
      listed.add(numberKey);
      const first = firstRowOfNumber.get(numberKey);
      if (first !== undefined) problem('studentNumber', `student number ${studentNumber} is already on row ${first} of this file; each student may appear once.`);
      else firstRowOfNumber.set(numberKey, n);
    }
    if (emailOk) {
      const first = firstRowOfEmail.get(email);
      if (first && first.studentNumber.toLowerCase() !== numberKey) {
        problem('email', `${email} is already on row ${first.row} of this file, for student number ${first.studentNumber}.`);
      } else if (!first) firstRowOfEmail.set(email, { row: n, studentNumber });
    }

    // against the roster
    const existing = numberKey ? (byNumber.get(numberKey) ?? null) : null;
    if (emailOk) {
      const owner = emailOwner.get(email);
      if (owner && owner.studentNumber.toLowerCase() !== numberKey) {
        problem('email', `${email} belongs to student number ${owner.studentNumber}, already on this course's roster.`);
      }
    }
    const account = emailOk && !existing ? (ctx.accountsByEmail.get(email) ?? null) : null;
    if (account && ctx.staffUserIds.has(account.id)) problem('email', `${email} is the account of ${account.displayName}, who teaches this course; staff cannot also be its students.`);
    if (account && !errors.length) notes.push(`Will be linked to the existing account of ${account.displayName}.`);

    const changes: PreviewRow['changes'] = [];
    if (existing) {
      const compare = (field: RosterField, from: string | null, to: string | null, same: boolean) => {
        if (!same) changes.push({ field, from, to });
      };
      compare('familyName', existing.familyName, names.familyName, (existing.familyName ?? '') === names.familyName);
      compare('givenName', existing.givenName, names.givenName, (existing.givenName ?? '') === names.givenName);
      compare('email', existing.email, email, (existing.email ?? '').toLowerCase() === email);
      if (sectionId !== undefined && sectionId !== existing.sectionId) {
        const from = ctx.sections.find((s) => s.id === existing.sectionId)?.name ?? null;
        changes.push({ field: 'section', from, to: sectionName });
      }
      if (existing.status === 'withdrawn') notes.push('Withdrawn from this course; the import updates the details but does not enrol the student again.');
    }

    const status: PreviewRow['status'] = errors.length ? 'error' : existing ? (changes.length ? 'changed' : 'unchanged') : 'new';
    rows.push({
      rowNumber: n,
      status,
      studentNumber,
      familyName: names.familyName,
      givenName: names.givenName,
      email,
      section: sectionName ?? (mapped('section') ? tidy(cellOf('section').text) || null : null),
      changes,
      errors,
      notes,
    });
    const planned: PlannedRow = { rowNumber: n, studentNumber, familyName: names.familyName, givenName: names.givenName, email, sectionId, existing, account };
    if (status === 'new') create.push(planned);
    else if (status === 'changed') update.push(planned);
  }

  const missing: MissingStudent[] = ctx.existing
    .filter((e) => e.status === 'active' && !listed.has(e.studentNumber.toLowerCase()))
    .map((e) => ({
      enrolmentId: e.id,
      studentNumber: e.studentNumber,
      familyName: e.familyName,
      givenName: e.givenName,
      email: e.email,
      section: ctx.sections.find((s) => s.id === e.sectionId)?.name ?? null,
      status: e.status,
    }));

  // capacity after the import (warnings only)
  const sectionOfEnrolment = new Map(ctx.existing.filter((e) => e.status === 'active').map((e) => [e.id, e.sectionId]));
  for (const u of update) if (u.existing && u.sectionId !== undefined && sectionOfEnrolment.has(u.existing.id)) sectionOfEnrolment.set(u.existing.id, u.sectionId);
  const load = new Map<number, number>();
  for (const sid of sectionOfEnrolment.values()) if (sid !== null) load.set(sid, (load.get(sid) ?? 0) + 1);
  for (const c of create) if (c.sectionId) load.set(c.sectionId, (load.get(c.sectionId) ?? 0) + 1);
  for (const s of ctx.sections) {
    const count = load.get(s.id) ?? 0;
    if (s.capacity !== null && count > s.capacity) warnings.push(`Section "${s.name}" would have ${count} active students; its capacity is ${s.capacity}.`);
  }

  const count = (status: PreviewRow['status']) => rows.filter((r) => r.status === status).length;
  const summary: ImportSummary = {
    rows: rows.length,
    new: count('new'),
    changed: count('changed'),
    unchanged: count('unchanged'),
    error: count('error'),
    missing: missing.length,
  };
  return {
    headerRowNumber,
    columns,
    suggestedMapping,
    mapping,
    problems,
    warnings,
    rows,
    missing,
    summary,
    canApply: problems.length === 0 && summary.error === 0 && rows.length > 0,
    writes: { create, update },
  };
}

/** Every e-mail-looking value in the mapped e-mail column (for the account look-up before planning). */
export function emailsInFile(table: SheetTable, mapping: RosterMapping | undefined): string[] {
  const index = (mapping ?? suggestMapping(detectColumns(table).columns)).email;
  if (index === null) return [];
  const out = new Set<string>();
  for (const row of table.rows.slice(1)) {
    const email = normalEmail(row.cells[index]?.text ?? '');
    if (EMAIL_SHAPE.test(email)) out.add(email);
  }
  return [...out];
}

/** Rows of similarity_flags (with the two reports' students). No wire shapes here. */
import type { Knex } from 'knex';

type Db = Knex | Knex.Transaction;

export interface FlagInsert {
  exerciseId: number;
  reportId: number;
  otherReportId: number;
  kind: 'identical-numbers' | 'near-identical-deviations';
  score: number;
  detail: string;
}

/** Inserts flags that are new; a pair already flagged with the same kind is left as it is. Returns how many were added. */
export async function insertNewFlags(trx: Db, flags: FlagInsert[]): Promise<number> {
  let added = 0;
  for (const f of flags) {
    // the pair is stored in one order (lower report id first) so that (a, b) and (b, a) are one flag
    const [a, b] = f.reportId < f.otherReportId ? [f.reportId, f.otherReportId] : [f.otherReportId, f.reportId];
    const [result] = (await trx.raw(
      `INSERT IGNORE INTO similarity_flags (exercise_id, report_id, other_report_id, kind, score, detail) VALUES (?, ?, ?, ?, ?, ?)`,
      [f.exerciseId, a, b, f.kind, Math.round(f.score * 1e6) / 1e6, f.detail.slice(0, 500)],
    )) as [{ affectedRows: number }];
    added += result.affectedRows;
  }
  return added;
}

export interface FlagRow {
  id: number;
  kind: 'identical-numbers' | 'near-identical-deviations';
  score: number;
  detail: string;
  created_at: Date;
  reviewed_at: Date | null;
  review_note: string | null;
  reviewer_name: string | null;
  report_id: number;
  report_version: number;
  report_enrolment: number;
  report_section: number | null;
  report_number: string;
  report_name: string;
  other_id: number;
  other_version: number;
  other_enrolment: number;
  other_section: number | null;
  other_number: string;
  other_name: string;
}

const name = (alias: string) => `COALESCE(NULLIF(TRIM(CONCAT_WS(' ', ${alias}.given_name, ${alias}.family_name)), ''), ${alias}u.display_name)`;

export function flagsOfExercise(db: Db, exerciseId: number): Promise<FlagRow[]> {
  return db('similarity_flags as f')
    .join('reports as r1', 'r1.id', 'f.report_id')
    .join('enrolments as e1', 'e1.id', 'r1.enrolment_id')
    .join('users as e1u', 'e1u.id', 'e1.user_id')
    .join('reports as r2', 'r2.id', 'f.other_report_id')
    .join('enrolments as e2', 'e2.id', 'r2.enrolment_id')
    .join('users as e2u', 'e2u.id', 'e2.user_id')
    .leftJoin('users as rv', 'rv.id', 'f.reviewed_by')
    .where('f.exercise_id', exerciseId)
    .orderBy([{ column: 'f.score', order: 'desc' }, { column: 'f.id' }])
    .select(
      'f.id',
      'f.kind',
      'f.score',
      'f.detail',
      'f.created_at',
      'f.reviewed_at',
      'f.review_note',
      'rv.display_name as reviewer_name',
      'r1.id as report_id',
      'r1.version_no as report_version',
      'e1.id as report_enrolment',
      'e1.section_id as report_section',
      'e1.student_number as report_number',
      db.raw(`${name('e1')} as report_name`),
      'r2.id as other_id',
      'r2.version_no as other_version',
      'e2.id as other_enrolment',
      'e2.section_id as other_section',
      'e2.student_number as other_number',
      db.raw(`${name('e2')} as other_name`),
    );
}

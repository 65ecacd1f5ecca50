/**
 * GET /api/v1/exercises/:exerciseId/similarity-flags → the exercise's flags,
 * highest score first. Lecturers and admins see every flag; assistants see the
 * flags that involve a student of their sections. Students: 403.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import type { SimilarityFlag } from '@shared/api/reports';
import { assertCourseRole, requireUser } from '../../platform/access';
import { notFound } from '../../platform/errors';
import { validate } from '../../platform/validate';
import { flagsOfExercise, type FlagRow } from './repo';

const paramsSchema = z.object({ exerciseId: z.coerce.number().int().positive() });

function wireFlag(r: FlagRow): SimilarityFlag {
  return {
    id: r.id,
    kind: r.kind,
    score: Number(r.score),
    detail: r.detail,
    createdAt: new Date(r.created_at).toISOString(),
    report: { id: r.report_id, versionNo: r.report_version, enrolmentId: r.report_enrolment, studentNumber: r.report_number, displayName: r.report_name },
    other: { id: r.other_id, versionNo: r.other_version, enrolmentId: r.other_enrolment, studentNumber: r.other_number, displayName: r.other_name },
    reviewed: r.reviewed_at ? { by: r.reviewer_name ?? '', at: new Date(r.reviewed_at).toISOString(), note: r.review_note } : null,
  };
}

export function similarityRoutes(db: Knex): Router {
  const r = Router();
  r.get('/exercises/:exerciseId/similarity-flags', requireUser, validate({ params: paramsSchema }), async (req, res) => {
    const { exerciseId } = req.params as unknown as { exerciseId: number };
    const exercise = await db('exercises').where({ id: exerciseId }).first('id', 'course_id');
    if (!exercise) throw notFound(`Exercise ${exerciseId} does not exist.`);
    const roles = await assertCourseRole(db, req, exercise.course_id, ['lecturer', 'assistant']);
    let rows = await flagsOfExercise(db, exerciseId);
    if (!req.user!.isAdmin && !roles.has('lecturer')) {
      const sections = new Set(
        (await db('section_assistants as sa').join('sections as s', 's.id', 'sa.section_id').where({ 's.course_id': exercise.course_id, 'sa.user_id': req.user!.id }).select('s.id')).map((s) => s.id as number),
      );
      rows = rows.filter((f) => (f.report_section !== null && sections.has(f.report_section)) || (f.other_section !== null && sections.has(f.other_section)));
    }
    res.json({ flags: rows.map(wireFlag) });
  });
  return r;
}

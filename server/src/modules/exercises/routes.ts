/**
 * /api/v1 routes of exercises. Every route names its roles; the scope is the
 * exercise's course (admins pass every course check).
 *   GET  /courses/:courseId/exercises          staff of the course, its students (published/closed only)
 *   POST /courses/:courseId/exercises          lecturers of the course, admins
 *   GET  /exercises/:id                        staff; students of the course (published/closed)
 *   PUT  /exercises/:id                        lecturers, admins
 *   POST /exercises/:id/publish | /close       lecturers, admins
 *   GET  /exercises/:id/answer-key             staff
 *   GET  /exercises/:id/preview?studentNumber= staff
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { checkedExerciseSpecSchema, previewQuerySchema, updateExerciseBodySchema } from '@shared/api/exercises';
import type { ExerciseSpec } from '@shared/exercises/spec';
import { assertCourseRole, requireUser } from '../../platform/access';
import { validate } from '../../platform/validate';
import { notFound } from '../../platform/errors';
import { courseOf } from './repo';
import { answerKeyQuerySchema, courseParamsSchema, exerciseParamsSchema } from './schema';
import {
  accessFrom,
  answerKey,
  closeExercise,
  createExercise,
  exerciseFor,
  exerciseView,
  listExercises,
  previewVariant,
  publishExercise,
  requireAuthor,
  updateExercise,
} from './service';

const STAFF = ['lecturer', 'assistant'] as const;
const ANYONE_IN_COURSE = ['lecturer', 'assistant', 'student'] as const;

/** Mounted at /api/v1/courses (next to the course routes). */
export function courseExerciseRoutes(db: Knex): Router {
  const r = Router();
  r.get('/:courseId/exercises', requireUser, validate({ params: courseParamsSchema }), async (req, res) => {
    const courseId = Number(req.params.courseId);
    const roles = await assertCourseRole(db, req, courseId, [...ANYONE_IN_COURSE]);
    res.json(await listExercises(db, courseId, accessFrom(req.user!, roles)));
  });
  r.post('/:courseId/exercises', requireUser, validate({ params: courseParamsSchema }), async (req, res, next) => {
    const courseId = Number(req.params.courseId);
    // role before body: a caller without the role learns nothing from validation
    const roles = await assertCourseRole(db, req, courseId, ['lecturer']);
    requireAuthor(accessFrom(req.user!, roles));
    if (!(await courseOf(db, courseId))) throw notFound(`No course ${courseId}.`);
    validate({ body: checkedExerciseSpecSchema })(req, res, async (err?: unknown) => {
      if (err) return next(err);
      try {
        res.status(201).json(await createExercise(db, req.user!, courseId, req.body as ExerciseSpec));
      } catch (e) {
        next(e);
      }
    });
  });
  return r;
}

/** Mounted at /api/v1/exercises. */
export function exerciseRoutes(db: Knex): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/:id', validate({ params: exerciseParamsSchema }), async (req, res) => {
    const { exercise, access } = await exerciseFor(db, req, Number(req.params.id), [...ANYONE_IN_COURSE]);
    res.json(await exerciseView(db, exercise, access));
  });
  r.put('/:id', validate({ params: exerciseParamsSchema }), async (req, res, next) => {
    const id = Number(req.params.id);
    const { access } = await exerciseFor(db, req, id, ['lecturer']);
    requireAuthor(access);
    validate({ body: updateExerciseBodySchema })(req, res, async (err?: unknown) => {
      if (err) return next(err);
      try {
        const { remark, ...spec } = req.body as ExerciseSpec & { remark?: boolean };
        res.json(await updateExercise(db, req.user!, id, spec as ExerciseSpec, remark === true));
      } catch (e) {
        next(e);
      }
    });
  });
  r.post('/:id/publish', validate({ params: exerciseParamsSchema }), async (req, res) => {
    const id = Number(req.params.id);
    requireAuthor((await exerciseFor(db, req, id, ['lecturer'])).access);
    res.json(await publishExercise(db, req.user!, id));
  });
  r.post('/:id/close', validate({ params: exerciseParamsSchema }), async (req, res) => {
    const id = Number(req.params.id);
    requireAuthor((await exerciseFor(db, req, id, ['lecturer'])).access);
    res.json(await closeExercise(db, req.user!, id));
  });
  r.get('/:id/answer-key', validate({ params: exerciseParamsSchema, query: answerKeyQuerySchema }), async (req, res) => {
    const { exercise, access } = await exerciseFor(db, req, Number(req.params.id), [...STAFF]);
    res.json(await answerKey(db, req.user!, exercise, access, (req.query as { revision?: number }).revision));
  });
  r.get('/:id/preview', validate({ params: exerciseParamsSchema, query: previewQuerySchema }), async (req, res) => {
    const { exercise, access } = await exerciseFor(db, req, Number(req.params.id), [...STAFF]);
    res.json(await previewVariant(db, req.user!, exercise, access, (req.query as { studentNumber: string }).studentNumber));
  });
  return r;
}

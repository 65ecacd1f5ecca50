/**
 * /api/v1/courses and /api/v1/terms. Sections and the roster hang under a
 * course: /courses/:courseId/sections, /courses/:courseId/roster.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { addStaffBodySchema, createCourseBodySchema, createTermBodySchema, updateCourseBodySchema, type StaffRole } from '@shared/api/courses';
import { requireAdmin, requireUser } from '../../platform/access';
import { validate } from '../../platform/validate';
import { sectionRoutes } from '../sections/routes';
import { rosterRoutes } from '../roster/routes';
import { courseParamsSchema, staffParamsSchema } from './schema';
import { assertMayCreateCourses, courseAccess, managerAccess } from './scope';
import { addStaff, courseDetail, coursesFor, createCourse, createTerm, removeStaff, setArchived, terms, updateCourse } from './service';

type CourseParams = { courseId: number };

export function courseRoutes(db: Knex): Router {
  const r = Router();
  r.get('/', requireUser, async (req, res) => {
    res.json({ courses: await coursesFor(db, req.user!) });
  });

  r.post('/', requireUser, validate({ body: createCourseBodySchema }), async (req, res) => {
    await assertMayCreateCourses(db, req);
    const id = await createCourse(db, req.user!, req.body);
    const access = await courseAccess(db, req, id, ['lecturer']);
    res.status(201).json(await courseDetail(db, req.user!.id, access));
  });

  r.get('/:courseId', validate({ params: courseParamsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as CourseParams;
    const access = await courseAccess(db, req, courseId, ['lecturer', 'assistant', 'student']);
    res.json(await courseDetail(db, req.user!.id, access));
  });

  r.patch('/:courseId', validate({ params: courseParamsSchema, body: updateCourseBodySchema }), async (req, res) => {
    const { courseId } = req.params as unknown as CourseParams;
    const access = await managerAccess(db, req, courseId);
    await updateCourse(db, req.user!.id, access.course, req.body);
    res.json(await courseDetail(db, req.user!.id, access));
  });

  for (const [path, archived] of [['archive', true], ['restore', false]] as const) {
    r.post(`/:courseId/${path}`, validate({ params: courseParamsSchema }), async (req, res) => {
      const { courseId } = req.params as unknown as CourseParams;
      const access = await managerAccess(db, req, courseId);
      await setArchived(db, req.user!.id, access.course, archived);
      res.json(await courseDetail(db, req.user!.id, access));
    });
  }

  r.post('/:courseId/staff', validate({ params: courseParamsSchema, body: addStaffBodySchema }), async (req, res) => {
    const { courseId } = req.params as unknown as CourseParams;
    const access = await managerAccess(db, req, courseId);
    await addStaff(db, req.user!.id, access.course, req.body);
    res.status(201).json(await courseDetail(db, req.user!.id, access));
  });

  r.delete('/:courseId/staff/:userId/:role', validate({ params: staffParamsSchema }), async (req, res) => {
    const { courseId, userId, role } = req.params as unknown as CourseParams & { userId: number; role: StaffRole };
    const access = await managerAccess(db, req, courseId);
    await removeStaff(db, req.user!.id, access.course, userId, role);
    res.json(await courseDetail(db, req.user!.id, access));
  });

  r.use('/:courseId/sections', sectionRoutes(db));
  r.use('/:courseId/roster', rosterRoutes(db));
  return r;
}

/** /api/v1/terms: the list for course forms (admins and lecturers); admins create terms. */
export function termRoutes(db: Knex): Router {
  const r = Router();
  r.get('/', requireUser, async (req, res) => {
    await assertMayCreateCourses(db, req);
    res.json({ terms: await terms(db) });
  });
  r.post('/', requireAdmin, validate({ body: createTermBodySchema }), async (req, res) => {
    res.status(201).json(await createTerm(db, req.user!.id, req.body));
  });
  return r;
}

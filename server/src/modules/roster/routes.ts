/**
 * /api/v1/courses/:courseId/roster: lecturers and admins manage the roster;
 * assistants read the students of their own sections; everyone else gets 403.
 * Uploads (preview, apply) are checked for role before a byte is read.
 */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import multer from 'multer';
import { addStudentBodySchema, moveStudentBodySchema, ROSTER_FILE_MAX_BYTES, type RosterMapping } from '@shared/api/roster';
import { HttpError, badRequest } from '../../platform/errors';
import { validate } from '../../platform/validate';
import { assertNotArchived, assistantSectionIds, courseAccess, managerAccess } from '../courses/scope';
import { applyFieldsSchema, enrolmentParamsSchema, previewFieldsSchema, rosterParamsSchema } from './schema';
import { addStudent, applyImport, importHistory, moveStudent, previewImport, rosterEntries, setWithdrawn } from './service';

type Params = { courseId: number; enrolmentId: number };

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: ROSTER_FILE_MAX_BYTES, files: 1, fields: 4, fieldSize: 64 * 1024, parts: 6 },
}).single('file');

/** multer's errors in our error shape. */
const receiveFile: RequestHandler = (req, res, next) => {
  upload(req, res, (err: unknown) => {
    if (!err) {
      if (!req.file) return next(badRequest('Choose a roster file: send it as multipart/form-data in the field "file".'));
      return next();
    }
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, 'payload_too_large', `The roster file is larger than ${ROSTER_FILE_MAX_BYTES / 1024 / 1024} MB.`));
      if (err.code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Send exactly one file, in the field "file" (got "${err.field}").`));
      return next(badRequest(`The upload could not be read: ${err.message}.`));
    }
    next(badRequest(`The upload could not be read: ${(err as Error).message}`));
  });
};

export function rosterRoutes(db: Knex): Router {
  const r = Router({ mergeParams: true });

  /** Lecturer or admin of a course that is not archived (before any upload is read). */
  const managesLiveCourse: RequestHandler = async (req, _res, next) => {
    const { courseId } = req.params as unknown as Params;
    const access = await managerAccess(db, req, courseId);
    assertNotArchived(access.course);
    next();
  };

  r.get('/', validate({ params: rosterParamsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    const access = await courseAccess(db, req, courseId, ['lecturer', 'assistant']);
    const only = access.manages ? undefined : await assistantSectionIds(db, req.user!.id, courseId);
    res.json({ entries: await rosterEntries(db, courseId, only), readOnly: !access.manages || Boolean(access.course.archived) });
  });

  r.get('/imports', validate({ params: rosterParamsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    await managerAccess(db, req, courseId);
    res.json({ imports: await importHistory(db, courseId) });
  });

  r.post('/preview', validate({ params: rosterParamsSchema }), managesLiveCourse, receiveFile, validate({ body: previewFieldsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    const { mapping } = req.body as { mapping?: RosterMapping };
    res.json(await previewImport(db, courseId, req.file!, mapping));
  });

  r.post('/apply', validate({ params: rosterParamsSchema }), managesLiveCourse, receiveFile, validate({ body: applyFieldsSchema }), async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    const { mapping, sha256 } = req.body as { mapping: RosterMapping; sha256?: string };
    res.status(201).json(await applyImport(db, req.user!.id, courseId, req.file!, mapping, sha256));
  });

  r.post('/students', validate({ params: rosterParamsSchema, body: addStudentBodySchema }), managesLiveCourse, async (req, res) => {
    const { courseId } = req.params as unknown as Params;
    res.status(201).json(await addStudent(db, req.user!.id, courseId, req.body));
  });

  r.patch('/:enrolmentId', validate({ params: enrolmentParamsSchema, body: moveStudentBodySchema }), managesLiveCourse, async (req, res) => {
    const { courseId, enrolmentId } = req.params as unknown as Params;
    res.json(await moveStudent(db, req.user!.id, courseId, enrolmentId, req.body.sectionId));
  });

  for (const [path, withdrawn] of [['withdraw', true], ['reinstate', false]] as const) {
    r.post(`/:enrolmentId/${path}`, validate({ params: enrolmentParamsSchema }), managesLiveCourse, async (req, res) => {
      const { courseId, enrolmentId } = req.params as unknown as Params;
      res.json(await setWithdrawn(db, req.user!.id, courseId, enrolmentId, withdrawn));
    });
  }
  return r;
}

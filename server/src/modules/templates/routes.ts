/**
 * GET /exercises/:exerciseId/template[?enrolmentId=]          one personal template (XLSX)
 * GET /exercises/:exerciseId/sections/:sectionId/templates.zip every active student's template of a section
 * GET /my/exercises                                           the student's published exercises
 * Files are personal: never cached by shared caches, nothing personal logged.
 */
import { Router, type Response } from 'express';
import type { Knex } from 'knex';
import { requireUser } from '../../platform/access';
import { validate } from '../../platform/validate';
import { sectionTemplatesParamsSchema, templateParamsSchema, templateQuerySchema } from './schema';
import { attachmentDisposition, myExercises, sectionTemplatesZip, studentTemplate, XLSX_TYPE } from './service';

function sendFile(res: Response, type: string, fileName: string, buffer: Buffer) {
  res.set({
    'content-type': type,
    'content-length': String(buffer.length),
    'content-disposition': attachmentDisposition(fileName),
    'cache-control': 'private, no-store',
    'x-content-type-options': 'nosniff',
  });
  res.end(buffer);
}

export function templateRoutes(db: Knex): Router {
  const r = Router();

  r.get('/exercises/:exerciseId/template', requireUser, validate({ params: templateParamsSchema, query: templateQuerySchema }), async (req, res) => {
    const { exerciseId } = req.params as unknown as { exerciseId: number };
    const { enrolmentId } = req.query as unknown as { enrolmentId?: number };
    const file = await studentTemplate(db, req.user!, exerciseId, enrolmentId);
    sendFile(res, XLSX_TYPE, file.fileName, file.buffer);
  });

  r.get('/exercises/:exerciseId/sections/:sectionId/templates.zip', requireUser, validate({ params: sectionTemplatesParamsSchema }), async (req, res) => {
    const { exerciseId, sectionId } = req.params as unknown as { exerciseId: number; sectionId: number };
    const file = await sectionTemplatesZip(db, req.user!, exerciseId, sectionId);
    res.set('x-template-count', String(file.count));
    sendFile(res, 'application/zip', file.fileName, file.buffer);
  });

  r.get('/my/exercises', requireUser, async (req, res) => {
    res.set('cache-control', 'private, no-store');
    res.json(await myExercises(db, req.user!));
  });

  return r;
}

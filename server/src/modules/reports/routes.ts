/**
 * HTTP routes of reports (mounted at /api/v1). See shared/api/reports.ts for
 * the wire shapes and CONTEXT.md for the flow.
 */
import { Router, type Request, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { requireUser } from '../../platform/access';
import { HttpError } from '../../platform/errors';
import { validate } from '../../platform/validate';
import { choiceFromField, exerciseParamsSchema, onBehalfQuerySchema, reportParamsSchema } from './schema';
import { checkTemplate, previewOf, readUpload, reportDetail, reportForCaller, resolveTarget, storeUpload, studentReports, type UploadTarget } from './service';
import { fileContent } from './repo';
import { filesOf, received, reportFiles, uploadLimitsFromEnv, type UploadLimits } from './uploads';

const contentTypes: Record<string, string> = {
  text: 'text/csv; charset=utf-8',
  xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  pdf: 'application/pdf',
};

interface Locals {
  target: UploadTarget;
}

export function reportRoutes(db: Knex, limits: UploadLimits = uploadLimitsFromEnv()): Router {
  const r = Router();
  const files = reportFiles(limits);

  /** role, scope and exercise state are checked before the body is read */
  const loadTarget: RequestHandler = async (req, res, next) => {
    const { exerciseId } = req.params as unknown as { exerciseId: number };
    const { enrolmentId } = req.query as { enrolmentId?: number };
    (res.locals as Locals).target = await resolveTarget(db, req.user, exerciseId, enrolmentId, true);
    next();
  };

  async function readFrom(req: Request, target: UploadTarget, choiceRequired: boolean) {
    const { data, writeup } = filesOf(req);
    if (!data) throw new HttpError(400, 'validation_failed', 'Attach the data file (CSV, TSV or XLSX) in the field "data".', [{ location: 'body', path: 'data', message: 'Required' }]);
    if (target.spec.writeUp === 'required' && !writeup) {
      throw new HttpError(422, 'bad_request', 'This exercise needs a PDF write-up with the data file: attach it in the field "writeup".', { field: 'writeup', reader: { code: 'writeup_required' } });
    }
    const choice = choiceFromField((req.body as Record<string, unknown> | undefined)?.choice, choiceRequired);
    const read = await readUpload(target.spec, received(data, 'data'), writeup ? received(writeup, 'write-up.pdf') : null, choice);
    const warnings = await checkTemplate(db, read.template, target.exercise.id, target.enrolment, target.onBehalf);
    return { read, warnings };
  }

  r.post('/exercises/:exerciseId/reports/read', requireUser, validate({ params: exerciseParamsSchema, query: onBehalfQuerySchema }), loadTarget, files, async (req, res) => {
    const { target } = res.locals as Locals;
    const { read, warnings } = await readFrom(req, target, false);
    res.json(previewOf(read, target, warnings));
  });

  r.post('/exercises/:exerciseId/reports', requireUser, validate({ params: exerciseParamsSchema, query: onBehalfQuerySchema }), loadTarget, files, async (req, res) => {
    const { target } = res.locals as Locals;
    // the confirmed column/unit choice is required where there is a curve to read
    const { read, warnings } = await readFrom(req, target, target.spec.model.family === 'one-electron' || target.spec.model.family === 'two-electron');
    res.status(201).json(await storeUpload(db, req.user!, target, read, warnings));
  });

  r.get('/exercises/:exerciseId/reports', requireUser, validate({ params: exerciseParamsSchema, query: onBehalfQuerySchema }), async (req, res) => {
    const { exerciseId } = req.params as unknown as { exerciseId: number };
    const { enrolmentId } = req.query as { enrolmentId?: number };
    res.json(await studentReports(db, req.user!, exerciseId, enrolmentId, limits));
  });

  r.get('/reports/:reportId', requireUser, validate({ params: reportParamsSchema }), async (req, res) => {
    const { reportId } = req.params as unknown as { reportId: number };
    res.json(await reportDetail(db, req.user!, reportId));
  });

  const download = (which: 'data' | 'writeup'): RequestHandler =>
    async (req, res) => {
      const { reportId } = req.params as unknown as { reportId: number };
      const { row } = await reportForCaller(db, req.user, reportId);
      const fileId = which === 'data' ? row.data_file_id : row.writeup_file_id;
      if (!fileId) throw new HttpError(404, 'not_found', `Report ${reportId} has no write-up.`);
      const file = await fileContent(db, fileId);
      if (!file) throw new HttpError(404, 'not_found', 'The file is missing.');
      res.attachment(file.file_name);
      res.setHeader('content-type', contentTypes[file.detected_type] ?? 'application/octet-stream');
      res.setHeader('content-length', String(file.content.length));
      res.setHeader('cache-control', 'private, no-store');
      res.end(file.content);
    };
  r.get('/reports/:reportId/data-file', requireUser, validate({ params: reportParamsSchema }), download('data'));
  r.get('/reports/:reportId/writeup', requireUser, validate({ params: reportParamsSchema }), download('writeup'));

  return r;
}

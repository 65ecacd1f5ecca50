/**
 * GET /api/v1/jobs/:jobId → progress of a background job (a progress bar's data).
 * Staff (lecturers, assistants) of the course named in the job's payload
 * (`courseId`, or the course of its `exerciseId`) and admins may read it; a job that names no course is for admins only.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import type { JobProgress } from '@shared/api/reports';
import { assertCourseRole, requireUser } from '../access';
import { forbidden, notFound } from '../errors';
import { validate } from '../validate';
import { getJob } from './queue';

const paramsSchema = z.object({ jobId: z.coerce.number().int().positive() });

export function jobRoutes(db: Knex): Router {
  const r = Router();
  r.get('/:jobId', requireUser, validate({ params: paramsSchema }), async (req, res) => {
    const { jobId } = req.params as unknown as { jobId: number };
    const job = await getJob(db, jobId);
    if (!job) throw notFound(`Job ${jobId} does not exist.`);
    let courseId = Number(job.payload.courseId);
    if (!(courseId > 0) && Number(job.payload.exerciseId) > 0) {
      // a job about an exercise belongs to the exercise's course
      courseId = Number((await db('exercises').where({ id: Number(job.payload.exerciseId) }).first('course_id'))?.course_id);
    }
    if (Number.isInteger(courseId) && courseId > 0) await assertCourseRole(db, req, courseId, ['lecturer', 'assistant']);
    else if (!req.user!.isAdmin) throw forbidden('Only department admins can see this job.');
    const body: JobProgress = {
      id: job.id,
      kind: job.kind,
      state: job.state,
      done: job.progressDone,
      total: job.progressTotal,
      attempts: job.attempts,
      error: job.state === 'failed' ? job.error : null,
      createdAt: job.createdAt.toISOString(),
      updatedAt: job.updatedAt.toISOString(),
    };
    res.json(body);
  });
  return r;
}

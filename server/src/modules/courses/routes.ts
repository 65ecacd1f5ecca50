import { Router } from 'express';
import type { Knex } from 'knex';
import { requireUser } from '../../platform/access';
import { coursesFor } from './service';

export function courseRoutes(db: Knex): Router {
  const r = Router();
  r.get('/', requireUser, async (req, res) => {
    res.json({ courses: await coursesFor(db, req.user!) });
  });
  return r;
}

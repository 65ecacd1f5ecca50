import { Router } from 'express';
import type { Knex } from 'knex';
import { databaseStatus } from '../../platform/db';

export function healthRoutes(db: Knex): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    const database = await databaseStatus(db);
    res.status(database.ok ? 200 : 503).json({ status: database.ok ? 'ok' : 'degraded', database });
  });
  return r;
}
